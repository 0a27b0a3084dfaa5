package org.spindrift.sim.scenario;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.scenario.TimeSpan;
import org.spindrift.sim.scenario.ConfigSection.Range;

/**
 * The typed getters of a scenario section: each one's value, range check and one-line message
 * {@code FILE:LINE: key.path: problem (allowed range)}. Interval notation [a, b] / (a, b] as in
 * ISO 80000-2 (common practice); message layout as compilers print it (common practice, no source).
 */
class ConfigSectionTest {
    private static final String YAML = String.join("\n",
            "cfg:",                       // 1
            "  mass: 1.0e6",              // 2
            "  small: 1e-9",              // 3  (YAML 1.1 reads this as text)
            "  zero: 0",                  // 4
            "  count: 12",                // 5
            "  half: 2.5",                // 6
            "  name: tiny",               // 7
            "  flag: true",               // 8
            "  yes_text: \"yes\"",        // 9
            "  kind: gausian",            // 10
            "  when: 30 min",             // 11
            "  bare: 30",                 // 12
            "  orbits: 3 orbits",         // 13
            "  odd: 3 fortnights",        // 14
            "  dist: 800 kpc",            // 15
            "  far: 40 Mpc",              // 16
            "  near: 1e5 pc",             // 17
            "  list: [1, 2, 3]",          // 18
            "  empty:",                   // 19
            "  sub:",                     // 20
            "    x: 1",                   // 21
            "  items:",                   // 22
            "    - a: 1",                 // 23
            "    - 7",                    // 24
            "  unit_in_value: 5 Msun",    // 25
            "  neg: -3 min",              // 26
            "");

    /** A unit conversion in double precision: one division, rounding only. */
    private static final double CONVERSION = 1e-15;

    @TempDir Path dir;
    private Path file;
    private ConfigSection.LineIndex lines;
    private ConfigSection cfg;

    @BeforeEach
    void load() throws Exception {
        file = Files.writeString(dir.resolve("s.yaml"), YAML);
        lines = new ConfigSection.LineIndex();
        ConfigSection root = new ConfigSection(file, "", (ConfigNode.Obj) ConfigTreeReader.read(file), lines);
        cfg = root.section("cfg", true);
    }

    /** Asserts that the call fails with exactly "FILE:line: key: problem" on one line. */
    private void fails(int line, String key, String problem, Executable call) {
        UserInputException e = assertThrows(UserInputException.class, call);
        assertEquals(file + ":" + line + ": " + key + ": " + problem, e.getMessage());
        assertFalse(e.getMessage().contains("\n"), "one line");
    }

    @Test
    void numbersInRangeAndTheirMessages() {
        assertEquals(1.0e6, cfg.number("mass", Range.positive(1e12)), 0.0);
        assertEquals(1e-9, cfg.number("small", Range.positive(1)), 0.0, "a number YAML 1.1 reads as text");
        assertEquals(0.0, cfg.number("zero", Range.nonNegative(1)), 0.0, "closed end includes 0");
        assertEquals(7.0, cfg.number("absent", 7.0, Range.closed(0, 10)), 0.0, "default when absent");
        fails(2, "cfg.mass", "value 1000000 is out of range; allowed [0, 1000]",
                () -> cfg.number("mass", Range.closed(0, 1000)));
        fails(4, "cfg.zero", "value 0 is out of range; allowed (0, 1]", () -> cfg.number("zero", Range.positive(1)));
        fails(6, "cfg.half", "value 2.5 is out of range; allowed [0, 2.5)",
                () -> cfg.number("half", new Range(0, true, 2.5, false)));
        fails(7, "cfg.name", "must be a number, got 'tiny'", () -> cfg.number("name", Range.closed(0, 1)));
        fails(25, "cfg.unit_in_value", "must be a number, got '5 Msun' (units belong in the key name, not the value)",
                () -> cfg.number("unit_in_value", Range.closed(0, 1)));
        fails(18, "cfg.list", "must be a number, got a list", () -> cfg.number("list", Range.closed(0, 1)));
        fails(19, "cfg.empty",
                "missing required key 'empty' (it is empty)", () -> cfg.number("empty", Range.closed(0, 1)));
        UserInputException e = assertThrows(UserInputException.class, () -> cfg.number("absent", Range.closed(0, 1)));
        assertTrue(e.getMessage().startsWith(file + ":") && e.getMessage().endsWith(
                ": cfg.absent: missing required key 'absent'"), e.getMessage());
    }

    @Test
    void rangesIncludeOrExcludeTheirEnds() {
        Range open = new Range(-1, false, 1, false);
        assertFalse(open.contains(-1));
        assertFalse(open.contains(1));
        assertTrue(open.contains(Math.nextUp(-1.0)));
        assertTrue(Range.closed(-1, 1).contains(-1) && Range.closed(-1, 1).contains(1));
        assertFalse(Range.closed(0, 1).contains(Double.NaN));
        assertEquals("(-1, 1)", open.toString());
        assertEquals("[0, 1.0E12]", Range.nonNegative(1e12).toString());
    }

    @Test
    void integersStringsBooleansAndChoices() {
        assertEquals(12L, cfg.integer("count", null, 0, 100));
        assertEquals(5L, cfg.integer("absent", 5L, 0, 100));
        fails(6, "cfg.half", "must be a whole number, got 2.5", () -> cfg.integer("half", null, 0, 100));
        fails(5, "cfg.count", "value 12 is out of range; allowed [0, 10]", () -> cfg.integer("count", null, 0, 10));
        assertEquals("tiny", cfg.string("name", null));
        assertEquals("12", cfg.string("count", null), "a number where text is asked is kept as written");
        fails(18, "cfg.list", "must be text, got a list", () -> cfg.string("list", null));
        assertTrue(cfg.bool("flag", false));
        assertFalse(cfg.bool("absent", false));
        fails(9, "cfg.yes_text", "must be true or false, got 'yes'", () -> cfg.bool("yes_text", false));
        assertEquals("tiny", cfg.choice("name", null, "tiny", "huge"));
        fails(10, "cfg.kind", "'gausian' is not allowed (did you mean 'gaussian'?); allowed: constant, gaussian, exponential",
                () -> cfg.choice("kind", null, "constant", "gaussian", "exponential"));
    }

    @Test
    void timesCarryTheirUnits() {
        assertEquals(new TimeSpan(30, TimeSpan.Unit.MINUTES), cfg.time("when", null, false, false, true));
        assertEquals(new TimeSpan(3, TimeSpan.Unit.ORBITS), cfg.time("orbits", null, false, true, true));
        assertEquals(new TimeSpan(-3, TimeSpan.Unit.MINUTES), cfg.time("neg", null, false, false, false));
        fails(12, "cfg.bare", "needs a unit: write for example '30 min' or '30 M' (units: min or M)",
                () -> cfg.time("bare", null, false, false, true));
        fails(13, "cfg.orbits", "unit 'orbits' is not allowed here; allowed units: min or M",
                () -> cfg.time("orbits", null, false, false, true));
        fails(14, "cfg.odd", "unit 'fortnights' is not allowed here; allowed units: min, M or orbits",
                () -> cfg.time("odd", null, false, true, true));
        fails(26, "cfg.neg", "value -3 is out of range; allowed (0, 1e9]", () -> cfg.time("neg", null, false, false,
                true));
        assertEquals(null, cfg.time("absent", null, true, false, true), "optional and absent");
    }

    @Test
    void distancesConvertToMegaparsecs() {
        // SI prefixes: 1 Mpc = 1e3 kpc = 1e6 pc
        assertEquals(0.8, cfg.distanceMpc("dist", 100), CONVERSION);
        assertEquals(0.1, cfg.distanceMpc("near", 100), CONVERSION);
        assertEquals(40.0, cfg.distanceMpc("far", 100), 0.0);
        fails(16, "cfg.far", "value '40 Mpc' is out of range; allowed (0, 10 Mpc]", () -> cfg.distanceMpc("far", 10));
        fails(5, "cfg.count", "needs a unit: write for example '12 Mpc' (units: Mpc, kpc or pc)",
                () -> cfg.distanceMpc("count", 10));
        fails(11, "cfg.when", "unit 'min' is not allowed here; allowed units: Mpc, kpc or pc",
                () -> cfg.distanceMpc("when", 10));
    }

    @Test
    void listsAndSections() {
        assertArrayEquals(new double[] {1, 2, 3}, cfg.numbers("list", 3, Range.closed(0, 10)), 0.0);
        fails(18, "cfg.list", "must be a list of 2 numbers", () -> cfg.numbers("list", 2, Range.closed(0, 10)));
        fails(18, "cfg.list", "entry 2 = 3 is out of range; allowed (0, 2.5]",
                () -> cfg.numbers("list", 3, new Range(0, false, 2.5, true)));
        ConfigSection sub = cfg.section("sub", true);
        assertEquals("cfg.sub", sub.path());
        assertEquals(1.0, sub.number("x", Range.closed(0, 1)), 0.0);
        assertEquals(null, cfg.section("absent", false));
        fails(7, "cfg.name", "must be a mapping of keys, got a string", () -> cfg.section("name", true));
        fails(24, "cfg.items[1]", "must be a mapping of keys, got a number", () -> cfg.sections("items", 1));
        fails(21, "cfg.sub.x", "unknown key 'x' (did you mean 'xs'?); allowed here: xs, y", () -> sub.allow("xs", "y"));
        fails(21, "cfg.sub.x", "unknown key 'x'; allowed here: alpha, beta", () -> sub.allow("alpha", "beta"));
        // the line index answers for a key path, or its nearest recorded parent
        assertEquals(21, lines.line("cfg.sub.x"));
        assertEquals(lines.line("cfg.sub"), lines.line("cfg.sub.missing"));
        assertEquals(sub.line(), lines.line("cfg.sub"), "a section is recorded at the line its mapping starts");
    }

    @Test
    void levenshteinDistanceOfTheTextbookExamples() {
        // Levenshtein 1966: kitten -> sitting needs 3 edits, flaw -> lawn 2 (common textbook examples)
        assertEquals(3, ConfigSection.levenshtein("kitten", "sitting"));
        assertEquals(2, ConfigSection.levenshtein("flaw", "lawn"));
        assertEquals(3, ConfigSection.levenshtein("", "abc"));
        assertEquals(0, ConfigSection.levenshtein("same", "same"));
        assertEquals(ConfigSection.levenshtein("sitting", "kitten"), ConfigSection.levenshtein("kitten", "sitting"));
    }
}
