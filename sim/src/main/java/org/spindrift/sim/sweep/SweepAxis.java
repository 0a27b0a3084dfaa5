package org.spindrift.sim.sweep;

import java.util.List;
import org.spindrift.sim.scenario.ConfigNode;
import org.spindrift.sim.scenario.KeyPath;

/**
 * One axis of a sweep: a key path and its values (a list, evenly spaced on a linear or
 * logarithmic scale), or an interval sampled by a Latin hypercube.
 *
 * @param key key path into the base file
 * @param line line of the axis in the sweep file
 * @param spacing how the values were given
 * @param values the values of a grid axis (null for a sampled axis)
 * @param from lower end of a sampled interval
 * @param to upper end of a sampled interval
 */
public record SweepAxis(KeyPath key, int line, Spacing spacing, List<ConfigNode> values, double from, double to) {
    /** How an axis gives its values. */
    public enum Spacing {
        /** values listed one by one */
        LIST,
        /** count values from..to, evenly spaced */
        LINEAR,
        /** count values from..to, evenly spaced in the logarithm */
        LOG,
        /** Latin hypercube samples, uniform in from..to */
        SAMPLED_LINEAR,
        /** Latin hypercube samples, uniform in log from..log to */
        SAMPLED_LOG;

        /** @return the name used in sweep.json */
        public String key() {
            return name().toLowerCase(java.util.Locale.ROOT);
        }
    }

    /** @return whether the axis is sampled by the Latin hypercube */
    public boolean sampled() {
        return values == null;
    }

    /** @return whether the axis lies on a logarithmic scale (for plots) */
    public boolean logarithmic() {
        return spacing == Spacing.LOG || spacing == Spacing.SAMPLED_LOG;
    }

    /**
     * @return count values from a to b evenly spaced, the ends exact (count 1: a)
     */
    static double[] linear(double a, double b, int count) {
        double[] v = new double[count];
        for (int k = 0; k < count; k++) {
            v[k] = count == 1 ? a : k == count - 1 ? b : a + (b - a) * k / (count - 1);
        }
        return v;
    }

    /**
     * @return count values from a to b (both > 0) evenly spaced in the logarithm, the ends exact
     */
    static double[] logarithmic(double a, double b, int count) {
        double[] v = new double[count];
        double la = Math.log(a);
        double lb = Math.log(b);
        for (int k = 0; k < count; k++) {
            v[k] = count == 1 ? a : k == 0 ? a : k == count - 1 ? b : Math.exp(la + (lb - la) * k / (count - 1));
        }
        return v;
    }
}
