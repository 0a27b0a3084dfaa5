package org.spindrift.sim.scenario;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.spindrift.shared.UserInputException;
import org.spindrift.sim.scenario.ConfigSection.Range;

/**
 * Reads and checks a fit file (YAML or JSON; keys in configs/README.md) with the scenario files'
 * strict loader: unknown keys with suggestions, ranges, one line naming file, line and key path.
 * Free key paths are checked by setting each to its bounds in the scenario tree and checking the
 * scenario again, so a key the scenario does not know is refused with the loader's own message.
 */
public final class FitFileLoader {
    private FitFileLoader() {
    }

    /** @return whether a YAML/JSON file looks like a fit file (a top-level {@code free} key) */
    public static boolean isFitFile(Path file) {
        ConfigNode root = ConfigTreeReader.read(file);
        return root instanceof ConfigNode.Obj o && o.fields().containsKey("free");
    }

    /** Reads and checks a fit file (not its data files: see the fit engine). */
    public static FitFile load(Path file) {
        ConfigNode root = ConfigTreeReader.read(file);
        if (!(root instanceof ConfigNode.Obj obj)) {
            throw ConfigSection.error(file, root.line(), "", "a fit file must be a mapping of keys (scenario, data, free,"
                    + " method), got " + root.typeName());
        }
        ConfigSection.LineIndex lines = new ConfigSection.LineIndex();
        ConfigSection top = new ConfigSection(file, "", obj, lines);
        top.allow("name", "description", "scenario", "data", "free", "method");
        String dflt = file.getFileName().toString().replaceFirst("\\.(ya?ml|json)$", "");
        String name = top.string("name", dflt);
        if (!name.matches("[A-Za-z0-9._-]{1,80}")) {
            throw top.error("name", "'" + name + "' may use only letters, digits, '.', '_' and '-' (1 to 80 characters)");
        }
        top.string("description", "");
        ScenarioTree scenario = scenario(file, obj, top);
        LoadedScenario base = scenario.load();
        FitFile.Data data = data(file, top.section("data", true));
        List<FitFile.Free> free = free(top, scenario, data);
        FitFile.Method method = method(top.section("method", false), free.size());
        if (base.scenario().sources().stream().anyMatch(s -> s.kind() == org.spindrift.shared.scenario.Source.Kind.RING)) {
            throw top.error("scenario", "the fit's compact-source model takes hot spots and clouds; this scenario has a ring");
        }
        return new FitFile(file, name, scenario, data, free, method);
    }

    private static ScenarioTree scenario(Path file, ConfigNode.Obj obj, ConfigSection top) {
        ConfigNode n = obj.fields().get("scenario");
        if (n == null || n instanceof ConfigNode.Null) {
            throw top.error("scenario", "missing required key 'scenario' (a scenario file path, or the scenario itself)");
        }
        if (n instanceof ConfigNode.Str s) {
            Path p = resolve(file, s.value());
            return ScenarioTree.read(p);
        }
        if (n instanceof ConfigNode.Obj o) {
            return ScenarioTree.of(file, o);
        }
        throw top.error("scenario", "must be a scenario file path or a mapping, got " + n.typeName());
    }

    /** @return a path relative to the fit file's folder (absolute paths as they are) */
    static Path resolve(Path file, String name) {
        Path p = Path.of(name);
        Path dir = file.toAbsolutePath().getParent();
        return p.isAbsolute() || dir == null ? p : dir.resolve(p).normalize();
    }

    private static FitFile.Data data(Path file, ConfigSection s) {
        s.allow("astrometry", "photometry", "flux_error", "time_offset_min", "flux_scale");
        Path astro = resolve(file, s.string("astrometry", null));
        Path phot = s.has("photometry") ? resolve(file, s.string("photometry", null)) : null;
        double fe = s.number("flux_error", Double.POSITIVE_INFINITY, new Range(0, false, 10, true));
        return new FitFile.Data(astro, phot, Double.isInfinite(fe) ? Double.NaN : fe,
                s.number("time_offset_min", 0.0, Range.closed(-1e6, 1e6)),
                s.number("flux_scale", 1.0, new Range(0, false, 1e30, true)));
    }

    private static List<FitFile.Free> free(ConfigSection top, ScenarioTree scenario, FitFile.Data data) {
        List<ConfigSection> list = top.sections("free", 1);
        List<FitFile.Free> out = new ArrayList<>();
        Set<String> seen = new HashSet<>();
        for (ConfigSection f : list) {
            f.allow("key", "min", "max", "prior", "mean", "sigma", "start");
            String key = f.string("key", null);
            if (!ScenarioTree.isKeyPath(key)) {
                throw f.error("key", "'" + key + "' is not a key path (for example sources[0].orbit.circular.radius_M)");
            }
            if (!seen.add(key)) {
                throw f.error("key", "'" + key + "' is free twice");
            }
            double lo = f.number("min", Range.closed(-1e30, 1e30));
            double hi = f.number("max", Range.closed(-1e30, 1e30));
            if (!(hi > lo)) {
                throw f.error("max", "must be larger than min (" + lo + "), got " + hi);
            }
            FitFile.Prior prior = FitFile.Prior.valueOf(f.choice("prior", "uniform", "uniform", "log_uniform", "normal")
                    .toUpperCase(Locale.ROOT));
            double mean = Double.NaN, sigma = Double.NaN;
            if (prior == FitFile.Prior.NORMAL) {
                mean = f.number("mean", Range.closed(lo, hi));
                sigma = f.number("sigma", new Range(0, false, 1e30, true));
            } else {
                for (String k : new String[] {"mean", "sigma"}) {
                    if (f.has(k)) {
                        throw f.error(k, "is used only with prior: normal");
                    }
                }
            }
            if (prior == FitFile.Prior.LOG_UNIFORM && !(lo > 0)) {
                throw f.error("min", "a log_uniform prior needs min > 0, got " + lo);
            }
            double start;
            if (key.equals(FitFile.TIME_OFFSET) || key.equals(FitFile.FLUX_SCALE)) {
                start = key.equals(FitFile.TIME_OFFSET) ? data.timeOffsetMin() : data.fluxScale();
            } else if (key.startsWith("data.")) {
                throw f.error("key", "'" + key + "': the data's free parameters are " + FitFile.TIME_OFFSET + " and "
                        + FitFile.FLUX_SCALE);
            } else {
                start = checkScenarioKey(f, scenario, key, lo, hi);
            }
            if (f.has("start")) {
                start = f.number("start", Range.closed(lo, hi));
            }
            if (!(start >= lo && start <= hi)) {
                throw f.error("key", "the start value " + start + " lies outside [min, max] = [" + lo + ", " + hi
                        + "]; give 'start' or widen the bounds");
            }
            out.add(new FitFile.Free(key, lo, hi, prior, mean, sigma, start, f.line()));
        }
        return out;
    }

    /** @return the scenario's value at the key (its default when absent); the key must be a scenario number */
    private static double checkScenarioKey(ConfigSection f, ScenarioTree scenario, String key, double lo, double hi) {
        if (!scenario.listsExist(key)) {
            throw f.error("key", "'" + key + "' names a list entry the scenario does not have");
        }
        double v;
        try {
            v = scenario.value(key);
        } catch (UserInputException e) {
            throw f.error("key", "'" + key + "' is not a number in the scenario");
        }
        // the key must be one the scenario loader accepts, at a value inside the bounds
        double probe = Double.isNaN(v) ? 0.5 * (lo + hi) : v;
        try {
            scenario.with(key, probe).load();
        } catch (UserInputException e) {
            String msg = e.getMessage();
            throw f.error("key", "'" + key + "' is not usable in the scenario: " + msg.substring(msg.indexOf(": ") + 2));
        }
        if (Double.isNaN(v) && !f.has("start")) {
            throw f.error("key", "'" + key + "' is not written in the scenario (its default applies): write it there, or"
                    + " give 'start'");
        }
        return v;
    }

    private static FitFile.Method method(ConfigSection s, int k) {
        if (s == null) {
            return new FitFile.Method(FitFile.Kind.LEAST_SQUARES, 4, 2000, 1L, 0, 0, 0);
        }
        s.allow("kind", "starts", "max_evaluations", "seed", "walkers", "steps", "burn_in");
        FitFile.Kind kind = FitFile.Kind.valueOf(s.choice("kind", "least_squares", "least_squares", "sample")
                .toUpperCase(Locale.ROOT));
        int starts = (int) s.integer("starts", 4L, 1, 1000);
        int maxEval = (int) s.integer("max_evaluations", 2000L, 10, 10_000_000);
        long seed = s.integer("seed", 1L, 0, Long.MAX_VALUE / 2);
        int walkers = (int) s.integer("walkers", (long) Math.max(32, 4 * k), 4, 100_000);
        if (walkers % 2 != 0 || walkers < 2 * k) {
            throw s.error("walkers", "must be even and at least twice the number of free parameters (" + 2 * k + "), got "
                    + walkers);
        }
        int steps = (int) s.integer("steps", 2000L, 10, 10_000_000);
        int burn = (int) s.integer("burn_in", (long) (steps / 4), 0, steps - 1);
        if (burn >= steps) {
            throw s.error("burn_in", "must be smaller than steps (" + steps + ")");
        }
        return new FitFile.Method(kind, starts, maxEval, seed, walkers, steps, burn);
    }
}
