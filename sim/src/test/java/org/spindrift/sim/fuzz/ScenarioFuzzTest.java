package org.spindrift.sim.fuzz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.SplittableRandom;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;
import org.spindrift.shared.archive.ArchiveVerifier;

/**
 * Fuzzing (seeded generated cases) of the scenario reader and checks: the demo scenarios, mutated (wrong
 * types, out-of-range and non-finite numbers, 1e400, deleted, duplicated and unknown keys, deep
 * nesting, alias bombs, huge strings, non-UTF-8 bytes, truncation, flipped bytes), go through
 * {@code check -o DIR}; a small scenario, mutated in its values, goes through {@code run}. Every
 * answer is exit 0 (and then a sound run folder for {@code run}) or exit 2 with one line; never
 * another status, a stack trace, a hang, or a file left behind. Cases that once failed are kept in
 * {@code src/test/resources/fuzz-corpus} and replayed by {@link #corpus()}.
 */
class ScenarioFuzzTest {
    static Path work;

    static Path arrayFile() {
        Path configs = Files.isDirectory(Path.of("..", "configs")) ? Path.of("..", "configs") : Path.of("configs");
        return configs.resolve("arrays").resolve("invented-array.yaml");
    }

    static List<Path> demos;

    @BeforeAll static void setUp() throws IOException {
        work = Files.createTempDirectory("spindrift-fuzz");
        Path configs = Files.isDirectory(Path.of("..", "configs")) ? Path.of("..", "configs") : Path.of("configs");
        try (Stream<Path> s = Files.list(configs)) {
            // scenarios only: fit files (a top-level 'free' key) have their own fuzzing
            demos = s.filter(p -> p.toString().endsWith(".yaml"))
                    .filter(p -> !org.spindrift.sim.scenario.FitFileLoader.isFitFile(p)).sorted().toList();
        }
        // the array file the interferometer demo names, beside the mutated case
        Path arrays = Files.createDirectories(work.resolve("check").resolve("arrays"));
        try (Stream<Path> s = Files.list(configs.resolve("arrays"))) {
            for (Path p : s.toList()) {
                Files.copy(p, arrays.resolve(p.getFileName()));
            }
        }
    }

    @AfterAll static void tearDown() throws IOException {
        Cli.delete(work);
    }

    /** The mutations. */
    enum Mutation {
        TYPE, NUMBER, DELETE_LINE, DUPLICATE_LINE, UNKNOWN_KEY, DEEP_NESTING, ALIAS_BOMB, HUGE_STRING, NON_UTF8,
        TRUNCATE, FLIP_BYTES, AS_JSON_TRUNCATED
    }

    /** A mutated scenario file: its bytes and how it was made (for the failure message). */
    record Case(String name, byte[] bytes, String how, byte[] arrayBytes) {
        Case(String name, byte[] bytes, String how) {
            this(name, bytes, how, null);
        }

        @Override public String toString() {
            return how;
        }
    }

    static final Pattern SCALAR = Pattern.compile("^(\\s*(?:- )?[A-Za-z_0-9]+:\\s+)(\\S.*)$");
    static final Pattern NUMBER = Pattern.compile("^(\\s*(?:- )?[A-Za-z_0-9]+:\\s+)(-?[0-9][0-9.eE+-]*)\\s*(#.*)?$");

    static final String[] ODD_NUMBERS = {"NaN", ".nan", ".inf", "-.inf", "Infinity", "1e400", "-1e400", "1e-400",
        "4.9e-324", "1.7976931348623157e308", "99999999999999999999999", "-0.0", "0", "-1", "1e9", "2147483648",
        "-9223372036854775809", "0x10", "1_000", "\"12\"", "3.5 M", "1e6 M", "-3 min"};
    static final String[] ODD_TYPES = {"text", "[1, 2]", "{a: 1}", "true", "null", "~", "''", "[]", "{}",
        "\"\"", "- x", "!!binary AAAA", "!custom 3"};

    static Case mutate(Path demo, Mutation m, long seed) throws IOException {
        Random rnd = new Random(seed);
        String text = Files.readString(demo);
        List<String> lines = new ArrayList<>(text.lines().toList());
        String how = demo.getFileName() + " " + m + " seed " + seed;
        String name = "case.yaml";
        byte[] bytes;
        switch (m) {
            case TYPE, NUMBER -> {
                Pattern p = m == Mutation.NUMBER ? NUMBER : SCALAR;
                List<Integer> at = new ArrayList<>();
                for (int i = 0; i < lines.size(); i++) {
                    if (p.matcher(lines.get(i)).matches()) {
                        at.add(i);
                    }
                }
                if (at.isEmpty()) { // no plain numeric line (numbers in lists only): any scalar
                    p = SCALAR;
                    for (int i = 0; i < lines.size(); i++) {
                        if (p.matcher(lines.get(i)).matches()) {
                            at.add(i);
                        }
                    }
                }
                int i = at.get(rnd.nextInt(at.size()));
                Matcher mm = p.matcher(lines.get(i));
                mm.matches();
                String[] pool = m == Mutation.NUMBER ? ODD_NUMBERS : ODD_TYPES;
                String v = rnd.nextInt(4) == 0 && m == Mutation.NUMBER ? Double.toString(rnd.nextGaussian() * 1e3)
                        : pool[rnd.nextInt(pool.length)];
                lines.set(i, mm.group(1) + v);
                how += ": line " + (i + 1) + " -> " + lines.get(i).strip();
                bytes = join(lines);
            }
            case DELETE_LINE -> {
                int i = rnd.nextInt(lines.size());
                how += ": line " + (i + 1) + " deleted";
                lines.remove(i);
                bytes = join(lines);
            }
            case DUPLICATE_LINE -> {
                int i = rnd.nextInt(lines.size());
                lines.add(i, lines.get(i));
                how += ": line " + (i + 1) + " twice";
                bytes = join(lines);
            }
            case UNKNOWN_KEY -> {
                int i = rnd.nextInt(lines.size());
                String indent = lines.get(i).replaceAll("^(\\s*).*$", "$1");
                lines.add(i, indent + "surplus_key_" + rnd.nextInt(100) + ": 1");
                how += ": unknown key before line " + (i + 1);
                bytes = join(lines);
            }
            case DEEP_NESTING -> {
                int d = 10 + rnd.nextInt(20000);
                boolean flow = rnd.nextBoolean();
                StringBuilder b = new StringBuilder("deep: ");
                if (flow) {
                    b.append("[".repeat(d)).append("]".repeat(d));
                } else {
                    d = Math.min(d, 2000);
                    for (int k = 0; k < d; k++) {
                        b.append('\n').append(" ".repeat(k + 1)).append("k").append(k).append(':');
                    }
                    b.append(" 1");
                }
                int i = rnd.nextInt(lines.size() + 1);
                lines.add(i, b.toString());
                how += ": " + (flow ? "flow" : "block") + " nesting " + d + " deep at line " + (i + 1);
                bytes = join(lines);
            }
            case ALIAS_BOMB -> {
                int levels = 3 + rnd.nextInt(8);
                StringBuilder b = new StringBuilder("bomb0: &a0 [\"lol\", \"lol\", \"lol\", \"lol\", \"lol\"]\n");
                for (int k = 1; k <= levels; k++) {
                    b.append("bomb").append(k).append(": &a").append(k).append(" [");
                    for (int j = 0; j < 9; j++) {
                        b.append(j == 0 ? "" : ", ").append("*a").append(k - 1);
                    }
                    b.append("]\n");
                }
                how += ": alias bomb of " + levels + " levels";
                bytes = (b + text).getBytes(StandardCharsets.UTF_8);
            }
            case HUGE_STRING -> {
                int len = rnd.nextBoolean() ? 1000 + rnd.nextInt(900_000) : (1 << 20) + rnd.nextInt(1000);
                List<Integer> at = new ArrayList<>();
                for (int i = 0; i < lines.size(); i++) {
                    if (SCALAR.matcher(lines.get(i)).matches()) {
                        at.add(i);
                    }
                }
                int i = at.get(rnd.nextInt(at.size()));
                Matcher mm = SCALAR.matcher(lines.get(i));
                mm.matches();
                lines.set(i, mm.group(1) + "x".repeat(len));
                how += ": line " + (i + 1) + " value of " + len + " characters";
                bytes = join(lines);
            }
            case NON_UTF8 -> {
                byte[] b = join(lines);
                int k = 1 + rnd.nextInt(4);
                for (int j = 0; j < k; j++) {
                    int at = rnd.nextInt(b.length);
                    b[at] = (byte) (0x80 + rnd.nextInt(0x80));
                }
                how += ": " + k + " bytes set to 0x80..0xff";
                bytes = b;
            }
            case TRUNCATE -> {
                byte[] b = join(lines);
                int at = rnd.nextInt(b.length);
                how += ": cut at byte " + at + " of " + b.length;
                bytes = java.util.Arrays.copyOf(b, at);
            }
            case FLIP_BYTES -> {
                byte[] b = join(lines);
                int k = 1 + rnd.nextInt(6);
                for (int j = 0; j < k; j++) {
                    b[rnd.nextInt(b.length)] ^= (byte) (1 << rnd.nextInt(8));
                }
                how += ": " + k + " bits flipped";
                bytes = b;
            }
            case AS_JSON_TRUNCATED -> {
                com.fasterxml.jackson.databind.JsonNode tree = new com.fasterxml.jackson.databind.ObjectMapper(
                        new com.fasterxml.jackson.dataformat.yaml.YAMLFactory()).readTree(text);
                byte[] b = new com.fasterxml.jackson.databind.ObjectMapper().writerWithDefaultPrettyPrinter()
                        .writeValueAsBytes(tree);
                int at = b.length - rnd.nextInt(Math.max(1, b.length / 4));
                how += ": as JSON, cut at byte " + at + " of " + b.length;
                bytes = java.util.Arrays.copyOf(b, at);
                name = "case.json";
            }
            default -> throw new IllegalStateException();
        }
        return new Case(name, bytes, how);
    }

    private static byte[] join(List<String> lines) {
        return (String.join("\n", lines) + "\n").getBytes(StandardCharsets.UTF_8);
    }

    /** One draw: the file to mutate, the mutation and its seed. */
    record Draft(Path target, Mutation mutation, long seed) {
        @Override public String toString() {
            return target.getFileName() + " " + mutation + " seed " + seed;
        }
    }

    /** @return a demo or the station file, a mutation and a seed, each equally likely */
    static Draft drawDemo(SplittableRandom rnd) {
        List<Path> targets = new ArrayList<>(demos);
        targets.add(arrayFile());
        return new Draft(Draw.oneOf(rnd, targets), Draw.oneOf(rnd, Mutation.values()), rnd.nextLong());
    }

    /** @return the mutated case of a draw */
    static Case mutatedDemo(Draft d) throws IOException {
        if (d.target().equals(arrayFile())) {
            // the station file of the interferometer demo, read through its scenario
            Case a = mutate(d.target(), d.mutation(), d.seed());
            Path scenario = demos.stream().filter(p -> p.getFileName().toString().equals(
                    "flare-array.yaml")).findFirst().orElseThrow();
            return new Case("case.yaml", Files.readAllBytes(scenario), a.how(), a.bytes());
        }
        return mutate(d.target(), d.mutation(), d.seed());
    }

    /** Checks one case: the contract, and that nothing is left beside the scenario. */
    static Cli.Result checkCase(Case c) throws Exception {
        Path dir = Files.createDirectories(work.resolve("check"));
        Path file = dir.resolve(c.name());
        Files.write(file, c.bytes());
        Path array = dir.resolve("arrays").resolve("invented-array.yaml");
        byte[] pristineArray = Files.readAllBytes(array);
        if (c.arrayBytes() != null) {
            Files.write(array, c.arrayBytes());
        }
        try {
            List<String> before = Cli.listing(work);
            Cli.Result r = Cli.run(c.how(), "check", file.toString(), "-o", dir.resolve("out").toString());
            assertEquals(before, Cli.listing(work), c.how() + ": check must not write anything");
            if (r.code() == 0) {
                assertTrue(r.out().contains(": ok:"), c.how() + ": " + r.out());
            }
            return r;
        } finally {
            // restored even after a failure, so the next case starts from the pristine set-up
            Files.deleteIfExists(file);
            Files.write(array, pristineArray);
        }
    }

    @TestFactory Stream<DynamicTest> mutatedDemosAreCheckedOrRefusedInOneLine() {
        return Draw.cases(60, Draw.SEED, ScenarioFuzzTest::drawDemo, Draft::toString, d -> checkCase(mutatedDemo(d)));
    }

    /** The lines of the small scenario whose values are mutated ({line, key}), and the values put there. */
    static final String[][] SMALL_KEYS = {{"spin: 0.0", "spin: "}, {"inclination_deg: 30", "inclination_deg: "},
        {"particles: 3", "particles: "}, {"sigma_M: 0.3", "sigma_M: "}, {"radius_M: 8.0", "radius_M: "},
        {"duration: 40 M", "duration: "}, {"snapshot_cadence: 4 M", "snapshot_cadence: "},
        {"tolerance: 1.0e-8", "tolerance: "}, {"field_of_view_M: 24", "field_of_view_M: "},
        {"pixels: 16", "pixels: "}, {"mass_solar: 1.0e6", "mass_solar: "}};
    static final String[] SMALL_VALUES = {"0", "-1", "1", "2", "0.5", "1e-3", "1e400", "NaN", ".inf", "text", "[1]",
        "3 M", "1 min", "0.99", "1.01", "4", "64", "100000", "1e-20", "5e8"};

    /** @return one key of the small scenario and its new value, each equally likely: {old line, new line} */
    static String[] drawSmallMutation(SplittableRandom rnd) {
        String[] k = Draw.oneOf(rnd, SMALL_KEYS);
        return new String[] {k[0], k[1] + Draw.oneOf(rnd, SMALL_VALUES)};
    }

    static final String SMALL = String.join("\n",
            "name: fuzz", "black_hole:", "  mass_solar: 1.0e6", "  distance: 1 kpc", "  family: kerr", "  spin: 0.0",
            "observer:", "  inclination_deg: 30", "sources:", "  - name: spot", "    kind: hot_spot", "    particles: 3",
            "    shape:", "      sigma_M: 0.3", "    orbit:", "      circular:", "        radius_M: 8.0", "run:",
            "  duration: 40 M", "  snapshot_cadence: 4 M", "  tolerance: 1.0e-8", "imaging:", "  field_of_view_M: 24",
            "  pixels: 16", "");

    /** Mutations of values only, for a run small enough to finish in a second or two. */
    @TestFactory Stream<DynamicTest> mutatedSmallRunsFinishSoundOrAreRefusedInOneLine() {
        return Draw.cases(8, Draw.SEED, ScenarioFuzzTest::drawSmallMutation, m -> m[0] + " -> " + m[1],
                m -> runCase(SMALL.replace(m[0], m[1])));
    }

    /** Runs one scenario text: a sound run folder, or a refusal in one line leaving nothing but the lock file. */
    static void runCase(String text) throws Exception {
        Path dir = Files.createDirectories(work.resolve("run"));
        Path file = Files.writeString(dir.resolve("small.yaml"), text);
        Path out = dir.resolve("out");
        try {
            Cli.Result r = Cli.run(text, "run", file.toString(), "-o", out.toString(), "--quiet");
            if (r.code() == 0) {
                assertEquals(List.of(), ArchiveVerifier.problems(out), text);
                assertTrue(!r.err().contains("not drawn"), text + ": a plot failed: " + r.err());
            } else {
                assertTrue(List.of("", ".out.spindrift-lock", "small.yaml").containsAll(Cli.listing(dir)),
                        text + ": " + Cli.listing(dir));
                assertTrue(!Files.exists(out), text + ": no run folder after a refusal");
            }
        } finally {
            Cli.delete(dir);
        }
    }

    /** The unmutated demos (and the station file beside the interferometer demo) check clean in this set-up. */
    @Test void everyDemoChecksUnchanged() throws Exception {
        for (Path d : demos) {
            Cli.Result r = checkCase(new Case("case.yaml", Files.readAllBytes(d), d.getFileName().toString()));
            assertEquals(0, r.code(), d + ": " + r.err());
        }
    }

    /** Every case that once broke the contract, kept as a plain file. */
    @Test void corpus() throws Exception {
        Path corpus = Path.of("src", "test", "resources", "fuzz-corpus", "scenarios");
        List<Path> cases;
        try (Stream<Path> s = Files.list(corpus)) {
            cases = s.filter(Files::isRegularFile).sorted().toList();
        }
        assertTrue(!cases.isEmpty(), "the corpus is empty");
        for (Path p : cases) {
            String name = p.getFileName().toString().endsWith(".json") ? "case.json" : "case.yaml";
            checkCase(new Case(name, Files.readAllBytes(p), "corpus " + p.getFileName()));
        }
        try (Stream<Path> s = Files.list(corpus.resolveSibling("runs"))) {
            for (Path p : s.filter(Files::isRegularFile).sorted().toList()) {
                runCase(Files.readString(p));
            }
        }
    }
}
