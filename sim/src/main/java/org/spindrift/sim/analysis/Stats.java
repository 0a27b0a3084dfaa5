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

    /**
     * Type-7 quantiles ({@link #quantile}) of the first n values of a, without sorting them all:
     * the order statistics the quantiles need are found by selection, each exactly the value a
     * full sort would put at that rank (signed zeros included), so the quantiles are bit for bit
     * those of {@code quantile(sorted, q)}. The first n values of a are reordered; none may be NaN
     * (a NaN sends the call to a full sort, where NaN sorts last).
     *
     * @param qs probabilities in [0, 1]
     * @param out the quantile for each of qs (NaN for n = 0)
     */
    public static void quantiles(double[] a, int n, double[] qs, double[] out) {
        if (n == 0) {
            Arrays.fill(out, 0, qs.length, Double.NaN);
            return;
        }
        int[] ranks = new int[2 * qs.length];
        for (int j = 0; j < qs.length; j++) {
            double h = (n - 1) * qs[j];
            int lo = (int) Math.floor(h);
            ranks[2 * j] = lo;
            ranks[2 * j + 1] = Math.min(n - 1, lo + 1);
        }
        double[] v = orderStatistics(a, n, ranks);
        for (int j = 0; j < qs.length; j++) {
            double h = (n - 1) * qs[j];
            int lo = (int) Math.floor(h);
            double slo = v[2 * j];
            double shi = v[2 * j + 1];
            out[j] = slo + (h - lo) * (shi - slo);
        }
    }

    /**
     * The values at the given ranks (0-based) of the first n values of a in ascending order, as
     * {@link Arrays#sort(double[])} orders them, without sorting them all: a bucket selection
     * (distribution counting, as in Knuth, TAOCP vol. 3, 5.2): the values are counted into about
     * n / 8 equal-width buckets between their minimum and maximum, whose index is a non-decreasing
     * function of the value, so the value of rank k lies in the bucket where the running count
     * passes k; only the buckets holding a wanted rank are gathered and sorted. Two passes over the
     * data and a few short sorts; data too small, all equal or with a non-finite value are sorted
     * whole instead. The first n values of a may be reordered.
     *
     * @return one value per rank, in the order of ranks
     */
    public static double[] orderStatistics(double[] a, int n, int[] ranks) {
        double[] out = new double[ranks.length];
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < n; k++) {
            double v = a[k];
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
        }
        double scaleBase = hi - lo;
        if (n < SELECT_MIN || !Double.isFinite(scaleBase) || !(scaleBase > 0)) {
            // Math.min/max propagate NaN: a NaN anywhere lands here
            Arrays.sort(a, 0, n);
            for (int j = 0; j < ranks.length; j++) {
                out[j] = a[ranks[j]];
            }
            return out;
        }
        int nb = n / 8;
        double scale = nb / scaleBase;
        int[] start = new int[nb + 1];
        for (int k = 0; k < n; k++) {
            start[bucket(a[k], lo, scale, nb) + 1]++;
        }
        for (int b = 0; b < nb; b++) {
            start[b + 1] += start[b];
        }
        // the buckets that hold a wanted rank, and where their values go in the gathered array
        int[] wanted = new int[ranks.length];
        int[] at = new int[nb];
        Arrays.fill(at, -1);
        int gathered = 0;
        for (int j = 0; j < ranks.length; j++) {
            int b = Arrays.binarySearch(start, ranks[j]);
            // the last bucket starting at or before the rank (empty buckets share their start)
            if (b >= 0) {
                while (b + 1 <= nb && start[b + 1] == ranks[j]) {
                    b++;
                }
            } else {
                b = -b - 2;
            }
            wanted[j] = b;
            if (at[b] < 0) {
                at[b] = gathered;
                gathered += start[b + 1] - start[b];
            }
        }
        double[] g = new double[gathered];
        int[] fill = at.clone();
        for (int k = 0; k < n; k++) {
            int b = bucket(a[k], lo, scale, nb);
            if (fill[b] >= 0) {
                g[fill[b]++] = a[k];
            }
        }
        boolean[] sorted = new boolean[nb];
        for (int j = 0; j < ranks.length; j++) {
            int b = wanted[j];
            if (!sorted[b]) {
                Arrays.sort(g, at[b], at[b] + start[b + 1] - start[b]);
                sorted[b] = true;
            }
            out[j] = g[at[b] + ranks[j] - start[b]];
        }
        return out;
    }

    /** Fewest values for the bucket selection; fewer are sorted. */
    private static final int SELECT_MIN = 64;

    /** Bucket of v: non-decreasing in v (each operation rounds monotonically), 0..nb-1. */
    private static int bucket(double v, double lo, double scale, int nb) {
        return Math.min(nb - 1, (int) ((v - lo) * scale));
    }

    /** @return median, and half of the 16-84 % range (one-sigma equivalent for a Gaussian) */
    public static double[] medianHalfRange(double[] v, int n) {
        double[] s = finiteSorted(v, n);
        return new double[] {quantile(s, 0.5), 0.5 * (quantile(s, 0.84) - quantile(s, 0.16)), s.length};
    }
}
