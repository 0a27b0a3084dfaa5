package org.spindrift.sim.scenario;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.scenario.TimeSpan;

/**
 * One mapping of a scenario file being checked: typed, range-checked getters that throw a
 * {@link UserInputException} naming file, line and key path ({@code file:line: key: problem}).
 * Every section first declares its allowed keys ({@link #allow}), so an unknown key is reported
 * with the nearest valid key suggested.
 */
public final class ConfigSection {
    private final Path file;
    private final String path;
    private final ConfigNode.Obj node;
    private final LineIndex lines;

    /** Records key path to line for later (physics) checks. */
    public static final class LineIndex {
        private final Map<String, Integer> lines = new java.util.HashMap<>();

        public void put(String keyPath, int line) {
            lines.put(keyPath, line);
        }

        /** @return the line of the key path, or of its nearest recorded parent, or -1 */
        public int line(String keyPath) {
            String k = keyPath;
            while (true) {
                Integer l = lines.get(k);
                if (l != null) {
                    return l;
                }
                int cut = Math.max(k.lastIndexOf('.'), k.lastIndexOf('['));
                if (cut <= 0) {
                    return -1;
                }
                k = k.substring(0, cut);
            }
        }
    }

    public ConfigSection(Path file, String path, ConfigNode.Obj node, LineIndex lines) {
        this.file = file;
        this.path = path;
        this.node = node;
        this.lines = lines;
        lines.put(path, node.line());
        for (Map.Entry<String, Integer> e : node.keyLines().entrySet()) {
            lines.put(key(e.getKey()), e.getValue());
        }
    }

    /** @return the key path of a key of this section */
    public String key(String k) {
        return path.isEmpty() ? k : path + "." + k;
    }

    public String path() {
        return path;
    }

    public int line() {
        return node.line();
    }

    /** @return an error at a key of this section */
    public UserInputException error(String k, String problem) {
        Integer l = node.keyLines().get(k);
        return error(file, l == null ? node.line() : l, key(k), problem);
    }

    public static UserInputException error(Path file, int line, String keyPath, String problem) {
        String where = line > 0 ? file + ":" + line : file.toString();
        return new UserInputException(where + ": " + (keyPath.isEmpty() ? "" : keyPath + ": ") + problem);
    }

    /** @return the value of a key as written (null when absent), for values of any type */
    public ConfigNode node(String k) {
        return node.fields().get(k);
    }

    /** @return the line of a key of this section (the section's own line when absent) */
    public int line(String k) {
        Integer l = node.keyLines().get(k);
        return l == null ? node.line() : l;
    }

    /** @return the file being checked */
    public Path file() {
        return file;
    }

    public boolean has(String k) {
        ConfigNode n = node.fields().get(k);
        return n != null && !(n instanceof ConfigNode.Null);
    }

    public Set<String> keys() {
        return node.fields().keySet();
    }

    /**
     * Rejects a key that an earlier version of the scenario format used, naming its replacement
     * (call before {@link #allow}).
     *
     * @param old the former key
     * @param now the key that replaced it (in this section)
     * @param how what to write there
     */
    ConfigSection renamed(String old, String now, String how) {
        if (node.fields().containsKey(old)) {
            throw error(old, "'" + old + "' is no longer a key: use '" + key(now) + "', " + how);
        }
        return this;
    }

    /** Rejects keys not in the allowed set, suggesting the nearest allowed key. */
    public ConfigSection allow(String... allowed) {
        Set<String> ok = new LinkedHashSet<>(Arrays.asList(allowed));
        for (String k : node.fields().keySet()) {
            if (!ok.contains(k)) {
                String near = nearest(k, ok);
                throw error(k, "unknown key '" + k + "'" + (near == null ? "" : " (did you mean '" + near + "'?)")
                        + "; allowed here: " + String.join(", ", ok));
            }
        }
        return this;
    }

    /** @return the allowed key closest in Levenshtein distance, or null when none is close */
    public static String nearest(String k, Set<String> allowed) {
        String best = null;
        int bestD = Integer.MAX_VALUE;
        String lk = k.toLowerCase(Locale.ROOT);
        for (String a : allowed) {
            int d = levenshtein(lk, a.toLowerCase(Locale.ROOT));
            if (d < bestD) {
                bestD = d;
                best = a;
            }
        }
        return best != null && bestD <= Math.max(2, k.length() / 3) ? best : null;
    }

    /** Levenshtein edit distance (Levenshtein 1966), two-row dynamic programme. */
    static int levenshtein(String a, String b) {
        int[] prev = new int[b.length() + 1];
        int[] cur = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            prev[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            cur[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int sub = prev[j - 1] + (a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1);
                cur[j] = Math.min(sub, Math.min(prev[j] + 1, cur[j - 1] + 1));
            }
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length()];
    }

    private ConfigNode raw(String k, boolean required) {
        ConfigNode n = node.fields().get(k);
        if (n == null || n instanceof ConfigNode.Null) {
            if (required) {
                throw error(k, "missing required key '" + k + "'" + (n == null ? "" : " (it is empty)"));
            }
            return null;
        }
        return n;
    }

    /** @return a sub-section, or null when absent and not required */
    public ConfigSection section(String k, boolean required) {
        ConfigNode n = raw(k, required);
        if (n == null) {
            return null;
        }
        if (!(n instanceof ConfigNode.Obj o)) {
            throw error(k, "must be a mapping of keys, got " + n.typeName());
        }
        return new ConfigSection(file, key(k), o, lines);
    }

    /** @return the mappings of a list, at least min of them */
    public List<ConfigSection> sections(String k, int min) {
        ConfigNode n = raw(k, min > 0);
        List<ConfigSection> out = new ArrayList<>();
        if (n == null) {
            return out;
        }
        if (!(n instanceof ConfigNode.Arr a)) {
            throw error(k, "must be a list, got " + n.typeName());
        }
        if (a.items().size() < min) {
            throw error(k, "needs at least " + min + " entr" + (min == 1 ? "y" : "ies") + ", got " + a.items().size());
        }
        for (int i = 0; i < a.items().size(); i++) {
            ConfigNode item = a.items().get(i);
            String p = key(k) + "[" + i + "]";
            if (!(item instanceof ConfigNode.Obj o)) {
                throw error(file, item.line(), p, "must be a mapping of keys, got " + item.typeName());
            }
            out.add(new ConfigSection(file, p, o, lines));
        }
        return out;
    }

    /** A closed or open numeric interval for messages and checks. */
    public record Range(double lo, boolean loIncl, double hi, boolean hiIncl) {
        public static Range closed(double lo, double hi) {
            return new Range(lo, true, hi, true);
        }

        public static Range positive(double hi) {
            return new Range(0, false, hi, true);
        }

        public static Range nonNegative(double hi) {
            return new Range(0, true, hi, true);
        }

        public boolean contains(double v) {
            return (loIncl ? v >= lo : v > lo) && (hiIncl ? v <= hi : v < hi);
        }

        @Override public String toString() {
            return (loIncl ? "[" : "(") + fmt(lo) + ", " + fmt(hi) + (hiIncl ? "]" : ")");
        }

        private static String fmt(double v) {
            return v == Math.rint(v) && Math.abs(v) < 1e7 ? Long.toString((long) v) : Double.toString(v);
        }
    }

    private double toNumber(String k, ConfigNode n) {
        if (n instanceof ConfigNode.Num num) {
            return num.value();
        }
        if (n instanceof ConfigNode.Str s) {
            // YAML 1.1 reads forms like 1e-9 as text; accept a plain number written that way.
            try {
                String t = s.value().strip();
                if (t.matches("[-+]?(\\d+\\.?\\d*|\\.\\d+)([eE][-+]?\\d+)?")) {
                    return Double.parseDouble(t);
                }
            } catch (NumberFormatException e) {
                // fall through
            }
            throw error(k, "must be a number, got '" + s.value() + "'"
                    + (s.value().matches(".*\\d.*[a-zA-Z].*") ? " (units belong in the key name, not the value)" : ""));
        }
        throw error(k, "must be a number, got " + n.typeName());
    }

    /** @return a number in range, or the default when absent (pass NaN default for required) */
    public double number(String k, double dflt, Range range) {
        ConfigNode n = raw(k, Double.isNaN(dflt));
        if (n == null) {
            return dflt;
        }
        double v = toNumber(k, n);
        if (!Double.isFinite(v) || !range.contains(v)) {
            throw error(k, "value " + n2s(v) + " is out of range; allowed " + range);
        }
        return v;
    }

    /** @return a required number in range */
    public double number(String k, Range range) {
        return number(k, Double.NaN, range);
    }

    /** @return an integer in range, or the default when absent */
    public long integer(String k, Long dflt, long lo, long hi) {
        ConfigNode n = raw(k, dflt == null);
        if (n == null) {
            return dflt;
        }
        double v = toNumber(k, n);
        if (v != Math.rint(v) || Math.abs(v) > 9.0e15) {
            throw error(k, "must be a whole number, got " + n2s(v));
        }
        if (v < lo || v > hi) {
            throw error(k, "value " + (long) v + " is out of range; allowed [" + lo + ", " + hi + "]");
        }
        return (long) v;
    }

    /** @return a string, or the default when absent (null default: required) */
    public String string(String k, String dflt) {
        ConfigNode n = raw(k, dflt == null);
        if (n == null) {
            return dflt;
        }
        if (n instanceof ConfigNode.Str s) {
            return s.value();
        }
        if (n instanceof ConfigNode.Num num) {
            return num.text();
        }
        throw error(k, "must be text, got " + n.typeName());
    }

    /** @return a boolean, or the default when absent */
    public boolean bool(String k, boolean dflt) {
        ConfigNode n = raw(k, false);
        if (n == null) {
            return dflt;
        }
        if (n instanceof ConfigNode.Bool b) {
            return b.value();
        }
        throw error(k, "must be true or false, got " + (n instanceof ConfigNode.Str s ? "'" + s.value() + "'" : n.typeName()));
    }

    /** @return one of the choices (lower-case names), or the default when absent (null: required) */
    public String choice(String k, String dflt, String... choices) {
        String v = string(k, dflt);
        for (String c : choices) {
            if (c.equals(v)) {
                return c;
            }
        }
        String near = nearest(v, new LinkedHashSet<>(Arrays.asList(choices)));
        throw error(k, "'" + v + "' is not allowed" + (near == null ? "" : " (did you mean '" + near + "'?)")
                + "; allowed: " + String.join(", ", choices));
    }

    /**
     * A time written with its unit, for example {@code "30 min"}, {@code "500 M"} or
     * {@code "3 orbits"} (orbits only where allowed).
     *
     * @param dflt default when absent (null: required, unless {@code optional})
     */
    TimeSpan time(String k, TimeSpan dflt, boolean optional, boolean allowOrbits, boolean positive) {
        ConfigNode n = raw(k, dflt == null && !optional);
        if (n == null) {
            return dflt;
        }
        String units = allowOrbits ? "min, M or orbits" : "min or M";
        if (n instanceof ConfigNode.Num num) {
            throw error(k, "needs a unit: write for example '" + num.text() + " min' or '" + num.text() + " M' (units: "
                    + units + ")");
        }
        if (!(n instanceof ConfigNode.Str s)) {
            throw error(k, "must be a time with a unit such as '30 min', got " + n.typeName());
        }
        String[] parts = s.value().strip().split("\\s+");
        if (parts.length != 2) {
            throw error(k, "'" + s.value() + "' is not a time: write a number and a unit (" + units + "), for example '30 min'");
        }
        double v;
        try {
            v = Double.parseDouble(parts[0]);
        } catch (NumberFormatException e) {
            throw error(k, "'" + parts[0] + "' is not a number (in '" + s.value() + "')");
        }
        TimeSpan.Unit u = switch (parts[1]) {
            case "min", "minute", "minutes" -> TimeSpan.Unit.MINUTES;
            case "M" -> TimeSpan.Unit.M;
            case "orbit", "orbits" -> allowOrbits ? TimeSpan.Unit.ORBITS : null;
            default -> null;
        };
        if (u == null) {
            throw error(k, "unit '" + parts[1] + "' is not allowed here; allowed units: " + units);
        }
        if (!Double.isFinite(v) || (positive ? v <= 0 : false) || Math.abs(v) > 1e9) {
            throw error(k, "value " + parts[0] + " is out of range; allowed " + (positive ? "(0, 1e9]" : "[-1e9, 1e9]"));
        }
        return new TimeSpan(v, u);
    }

    /**
     * A distance written with its unit, {@code "40 Mpc"}, {@code "800 kpc"} or {@code "1e5 pc"}
     * (required).
     *
     * @param max largest allowed value, Mpc
     * @return the distance in Mpc
     */
    double distanceMpc(String k, double max) {
        ConfigNode n = raw(k, true);
        String units = "Mpc, kpc or pc";
        if (n instanceof ConfigNode.Num num) {
            throw error(k, "needs a unit: write for example '" + num.text() + " Mpc' (units: " + units + ")");
        }
        if (!(n instanceof ConfigNode.Str s)) {
            throw error(k, "must be a distance with a unit such as '40 Mpc', got " + n.typeName());
        }
        String[] parts = s.value().strip().split("\\s+");
        if (parts.length != 2) {
            throw error(k, "'" + s.value() + "' is not a distance: write a number and a unit (" + units
                    + "), for example '40 Mpc'");
        }
        double v;
        try {
            v = Double.parseDouble(parts[0]);
        } catch (NumberFormatException e) {
            throw error(k, "'" + parts[0] + "' is not a number (in '" + s.value() + "')");
        }
        double perMpc = switch (parts[1]) {
            case "Mpc" -> 1.0;
            case "kpc" -> 1.0e3;
            case "pc" -> 1.0e6;
            default -> Double.NaN;
        };
        if (Double.isNaN(perMpc)) {
            throw error(k, "unit '" + parts[1] + "' is not allowed here; allowed units: " + units);
        }
        double mpc = v / perMpc;
        if (!(Double.isFinite(v) && mpc > 0 && mpc <= max)) {
            throw error(k, "value '" + s.value() + "' is out of range; allowed (0, " + n2s(max) + " Mpc]");
        }
        return mpc;
    }

    /** @return a list of numbers of the given length, each in range */
    double[] numbers(String k, int length, Range range) {
        ConfigNode n = raw(k, true);
        if (!(n instanceof ConfigNode.Arr a) || a.items().size() != length) {
            throw error(k, "must be a list of " + length + " numbers");
        }
        double[] out = new double[length];
        for (int i = 0; i < length; i++) {
            double v = toNumber(k, a.items().get(i));
            if (!range.contains(v)) {
                throw error(k, "entry " + i + " = " + n2s(v) + " is out of range; allowed " + range);
            }
            out[i] = v;
        }
        return out;
    }

    /** @return every key of this section as a number (for free-form parameter maps) */
    Map<String, Double> numberMap(Range range) {
        Map<String, Double> out = new java.util.TreeMap<>();
        for (String k : node.fields().keySet()) {
            out.put(k, number(k, range));
        }
        return out;
    }

    private static String n2s(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : Double.toString(v);
    }
}
