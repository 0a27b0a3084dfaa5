package org.spindrift.sim.sweep;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.spindrift.sim.scenario.ConfigNode;
import org.spindrift.sim.scenario.KeyPath;
import org.spindrift.sim.scenario.ConfigSection;
import org.spindrift.sim.scenario.ConfigSection.Range;
import org.spindrift.sim.scenario.ConfigTreeReader;

/**
 * A sweep file (YAML or JSON, keys in configs/README.md): the base file of some task kind, and
 * the axes (key path to values) whose combinations make the tasks. Read with the same strict
 * loader as scenarios: one line {@code FILE:LINE: key: problem} for every mistake.
 *
 * <p>Grid axes (lists and evenly spaced values) are combined as a full grid, the first axis
 * varying slowest; sampled axes ({@code from}/{@code to} without {@code count}) take the points of
 * a seeded Latin hypercube, and every grid point is combined with every sample.
 */
public final class SweepFile {
    /** Tasks allowed without {@code --force}. */
    public static final long FORCE_LIMIT = 100_000;
    /** Tasks allowed at all (task numbers have six digits). */
    public static final long HARD_LIMIT = 999_999;

    private final Path file;
    private final String name;
    private final TaskKind kind;
    private final Path base;
    private final ConfigNode baseTree;
    private final List<SweepAxis> axes;
    private final int samples;
    private final long seed;

    private SweepFile(Path file, String name, TaskKind kind, Path base, ConfigNode baseTree,
            List<SweepAxis> axes, int samples, long seed) {
        this.file = file;
        this.name = name;
        this.kind = kind;
        this.base = base;
        this.baseTree = baseTree;
        this.axes = List.copyOf(axes);
        this.samples = samples;
        this.seed = seed;
    }

    /** Reads and checks a sweep file (the base file is read as a tree; the tasks are checked later). */
    public static SweepFile load(Path file) {
        ConfigNode root = ConfigTreeReader.read(file);
        if (!(root instanceof ConfigNode.Obj obj)) {
            throw ConfigSection.error(file, root.line(), "", "a sweep file must be a mapping of keys (base, axes, ...), got "
                    + root.typeName());
        }
        ConfigSection top = new ConfigSection(file, "", obj, new ConfigSection.LineIndex());
        top.allow("name", "description", "kind", "base", "axes", "latin_hypercube");
        String dflt = file.getFileName().toString().replaceFirst("\\.(ya?ml|json)$", "");
        String name = top.string("name", dflt);
        if (!name.matches("[A-Za-z0-9._-]{1,80}")) {
            throw top.error("name", "'" + name + "' may use only letters, digits, '.', '_' and '-' (1 to 80 characters)");
        }
        top.string("description", "");
        String[] kinds = TaskKinds.all().keySet().toArray(new String[0]);
        TaskKind kind = TaskKinds.get(top.choice("kind", "scenario", kinds));
        String baseText = top.string("base", null);
        Path dir = file.toAbsolutePath().getParent();
        Path base = dir.resolve(baseText).normalize();
        if (!java.nio.file.Files.isRegularFile(base)) {
            throw top.error("base", "no file " + base + " (the base file's path is relative to the sweep file)");
        }
        ConfigNode baseTree = ConfigTreeReader.read(base);

        ConfigSection lhs = top.section("latin_hypercube", false);
        int samples = 0;
        long seed = 0;
        if (lhs != null) {
            lhs.allow("samples", "seed");
            samples = (int) lhs.integer("samples", null, 1, HARD_LIMIT);
            seed = lhs.integer("seed", 1L, 0, Long.MAX_VALUE / 2);
        }
        ConfigSection ax = top.section("axes", true);
        if (ax.keys().isEmpty()) {
            throw top.error("axes", "needs at least one axis (key path: list of values, or {from, to, count})");
        }
        List<SweepAxis> axes = new ArrayList<>();
        boolean anySampled = false;
        for (String k : ax.keys()) {
            SweepAxis a = axis(ax, k, lhs != null);
            anySampled |= a.sampled();
            axes.add(a);
        }
        if (lhs != null && !anySampled) {
            throw top.error("latin_hypercube", "no axis to sample: give at least one axis as {from, to} without count");
        }
        SweepFile sf = new SweepFile(file, name, kind, base, baseTree, axes, samples, seed);
        long n = sf.taskCount();
        if (n > HARD_LIMIT) {
            throw top.error("axes", "the axes give " + n + " tasks; at most " + HARD_LIMIT + " are allowed");
        }
        return sf;
    }

    private static SweepAxis axis(ConfigSection ax, String k, boolean lhs) {
        KeyPath key = KeyPath.parse(k);
        int line = ax.line(k);
        if (key == null) {
            throw ax.error(k, "'" + k + "' is not a key path (keys joined by '.', list entries as [index], for example"
                    + " sources[0].orbit.circular.radius_M)");
        }
        ConfigNode n = ax.node(k);
        if (n instanceof ConfigNode.Arr arr) {
            if (arr.items().isEmpty()) {
                throw ax.error(k, "empty axis: give at least one value");
            }
            List<ConfigNode> values = new ArrayList<>();
            for (ConfigNode v : arr.items()) {
                if (v instanceof ConfigNode.Obj || v instanceof ConfigNode.Arr || v instanceof ConfigNode.Null) {
                    throw ConfigSection.error(ax.file(), v.line(), ax.key(k), "axis values must be numbers, text or"
                            + " true/false, got " + v.typeName());
                }
                values.add(ConfigTrees.atLine(v, line));
            }
            return new SweepAxis(key, line, SweepAxis.Spacing.LIST, values, Double.NaN, Double.NaN);
        }
        if (!(n instanceof ConfigNode.Obj)) {
            throw ax.error(k, "give a list of values, or {from, to, count[, spacing: linear|log]}, or {from, to} with a"
                    + " latin_hypercube section; got " + (n == null ? "nothing" : n.typeName()));
        }
        ConfigSection s = ax.section(k, true).allow("from", "to", "count", "spacing");
        Range any = Range.closed(-1e300, 1e300);
        double from = s.number("from", any);
        double to = s.number("to", any);
        boolean log = "log".equals(s.choice("spacing", "linear", "linear", "log"));
        if (log && !(from > 0 && to > 0)) {
            throw s.error(from > 0 ? "to" : "from", "a log spacing needs from > 0 and to > 0, got from = " + from
                    + ", to = " + to);
        }
        if (!s.has("count")) {
            if (!lhs) {
                throw s.error("from", "give count (evenly spaced values), or add a latin_hypercube section to sample"
                        + " this interval");
            }
            return new SweepAxis(key, line, log ? SweepAxis.Spacing.SAMPLED_LOG : SweepAxis.Spacing.SAMPLED_LINEAR, null,
                    from, to);
        }
        long count = s.integer("count", null, 0, HARD_LIMIT);
        if (count == 0) {
            throw s.error("count", "empty axis: count must be at least 1");
        }
        double[] v = log ? SweepAxis.logarithmic(from, to, (int) count) : SweepAxis.linear(from, to, (int) count);
        List<ConfigNode> values = new ArrayList<>();
        for (double x : v) {
            values.add(ConfigTrees.number(x, line));
        }
        return new SweepAxis(key, line, log ? SweepAxis.Spacing.LOG : SweepAxis.Spacing.LINEAR, values, from, to);
    }

    /** @return the number of tasks: product of the grid axes' lengths, times the samples */
    public long taskCount() {
        long n = 1;
        for (SweepAxis a : axes) {
            if (!a.sampled()) {
                n = Math.multiplyExact(n, a.values().size());
                if (n > HARD_LIMIT * 1000) {
                    return n;
                }
            }
        }
        return samples > 0 ? Math.multiplyExact(n, samples) : n;
    }

    /**
     * @return the value of every axis for every task, [task][axis]; grid axes nested in file order
     *     (the first slowest), the Latin hypercube samples innermost
     */
    public List<ConfigNode[]> points() {
        int d = axes.size();
        List<Integer> sampledAxes = new ArrayList<>();
        for (int j = 0; j < d; j++) {
            if (axes.get(j).sampled()) {
                sampledAxes.add(j);
            }
        }
        double[][] u = samples > 0 ? LatinHypercube.sample(samples, sampledAxes.size(), seed) : new double[1][0];
        int inner = samples > 0 ? samples : 1;
        long total = taskCount();
        List<ConfigNode[]> out = new ArrayList<>((int) total);
        int[] idx = new int[d];
        for (long t = 0; t < total; t++) {
            long rest = t / inner;
            int sample = (int) (t % inner);
            for (int j = d - 1; j >= 0; j--) {
                SweepAxis a = axes.get(j);
                if (!a.sampled()) {
                    idx[j] = (int) (rest % a.values().size());
                    rest /= a.values().size();
                }
            }
            ConfigNode[] p = new ConfigNode[d];
            for (int j = 0; j < d; j++) {
                SweepAxis a = axes.get(j);
                if (a.sampled()) {
                    double q = u[sample][sampledAxes.indexOf(j)];
                    double v = a.logarithmic() ? Math.exp(Math.log(a.from()) + q * (Math.log(a.to()) - Math.log(a.from())))
                            : a.from() + q * (a.to() - a.from());
                    p[j] = ConfigTrees.number(v, a.line());
                } else {
                    p[j] = a.values().get(idx[j]);
                }
            }
            out.add(p);
        }
        return out;
    }

    /** @return the tree of one task: the base file with the kind's paths made absolute and the axis values put in */
    public ConfigNode taskTree(ConfigNode[] point) {
        ConfigNode t = baseTree;
        Path baseDir = base.getParent();
        for (String pk : kind.pathKeys()) {
            KeyPath kp = KeyPath.parse(pk);
            ConfigNode v = kp == null ? null : kp.get(t);
            if (v instanceof ConfigNode.Str s && !Path.of(s.value()).isAbsolute()) {
                t = kp.put(t, new ConfigNode.Str(baseDir.resolve(s.value()).normalize().toString(), s.line()), s.line());
            }
        }
        for (int j = 0; j < axes.size(); j++) {
            SweepAxis a = axes.get(j);
            try {
                t = a.key().put(t, point[j], a.line());
            } catch (IllegalArgumentException e) {
                throw ConfigSection.error(file, a.line(), "axes." + a.key(), e.getMessage());
            }
        }
        return t;
    }

    public Path file() {
        return file;
    }

    public String name() {
        return name;
    }

    public TaskKind kind() {
        return kind;
    }

    public Path base() {
        return base;
    }

    public List<SweepAxis> axes() {
        return axes;
    }

    /** @return Latin hypercube samples (0 without one) */
    public int samples() {
        return samples;
    }

    public long seed() {
        return seed;
    }
}
