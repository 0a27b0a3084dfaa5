package org.spindrift.sim.analysis;

import java.util.Arrays;

/** Order statistics of samples that may contain NaN (ignored). */
public final class Stats {
    private Stats() {
    }

    /** @return the finite values, sorted */
    public static double[] finiteSorted(double[] v, int n) {
        double[] out = new double[n];
        int m = 0;
        for (int i = 0; i < n; i++) {
            if (Double.isFinite(v[i])) {
                out[m++] = v[i];
            }
        }
        out = Arrays.copyOf(out, m);
        Arrays.sort(out);
        return out;
    }

    /** Quantile of sorted data with linear interpolation between order statistics (Hyndman & Fan 1996, type 7). */
    public static double quantile(double[] sorted, double q) {
        if (sorted.length == 0) {
            return Double.NaN;
        }
        double h = (sorted.length - 1) * q;
        int lo = (int) Math.floor(h);
        int hi = Math.min(sorted.length - 1, lo + 1);
        return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
    }

    /** @return median, and half of the 16-84 % range (one-sigma equivalent for a Gaussian) */
    public static double[] medianHalfRange(double[] v, int n) {
        double[] s = finiteSorted(v, n);
        return new double[] {quantile(s, 0.5), 0.5 * (quantile(s, 0.84) - quantile(s, 0.16)), s.length};
    }
}
