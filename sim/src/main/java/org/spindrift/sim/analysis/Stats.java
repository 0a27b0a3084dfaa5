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
     * {@link Arrays#sort(double[])} orders them, found by multiple quickselect (Hoare 1961, Comm.
     * ACM 4, 321, algorithm 65 FIND, extended to several ranks at once) with a three-way partition
     * about a median-of-three pivot; a range that recurses too deep is sorted instead, so the
     * worst case stays O(n log n). The first n values of a are reordered.
     *
     * @return one value per rank, in the order of ranks
     */
    public static double[] orderStatistics(double[] a, int n, int[] ranks) {
        double[] out = new double[ranks.length];
        for (int k = 0; k < n; k++) {
            if (Double.isNaN(a[k])) {
                Arrays.sort(a, 0, n);
                for (int j = 0; j < ranks.length; j++) {
                    out[j] = a[ranks[j]];
                }
                return out;
            }
        }
        int[] sorted = ranks.clone();
        Arrays.sort(sorted);
        select(a, 0, n - 1, sorted, 0, sorted.length - 1, 2 * (32 - Integer.numberOfLeadingZeros(Math.max(1, n))));
        boolean zero = false;
        for (int j = 0; j < ranks.length; j++) {
            out[j] = a[ranks[j]];
            zero |= out[j] == 0.0;
        }
        if (zero) {
            // the partition treats -0.0 and 0.0 as equal; a sort puts every -0.0 first
            int below = 0;
            int negativeZeros = 0;
            for (int k = 0; k < n; k++) {
                if (a[k] < 0) {
                    below++;
                } else if (a[k] == 0.0 && Double.doubleToRawLongBits(a[k]) != 0L) {
                    negativeZeros++;
                }
            }
            for (int j = 0; j < ranks.length; j++) {
                if (out[j] == 0.0) {
                    out[j] = ranks[j] < below + negativeZeros ? -0.0 : 0.0;
                }
            }
        }
        return out;
    }

    /** Smallest range that selection partitions; shorter ones are sorted. */
    private static final int SELECT_CUTOFF = 40;

    /** Puts the values of ranks[rlo..rhi] (ascending, all within lo..hi) at their sorted positions. */
    private static void select(double[] a, int lo, int hi, int[] ranks, int rlo, int rhi, int depth) {
        while (rlo <= rhi) {
            if (hi - lo < SELECT_CUTOFF || depth-- <= 0) {
                Arrays.sort(a, lo, hi + 1);
                return;
            }
            int mid = (lo + hi) >>> 1;
            double x = a[lo];
            double y = a[mid];
            double z = a[hi];
            double pivot = x < y ? (y < z ? y : Math.max(x, z)) : (x < z ? x : Math.max(y, z));
            // three-way partition (Dijkstra): a[lo..lt-1] < pivot, a[lt..gt] == pivot, a[gt+1..hi] > pivot
            int lt = lo;
            int gt = hi;
            int k = lo;
            while (k <= gt) {
                double v = a[k];
                if (v < pivot) {
                    a[k++] = a[lt];
                    a[lt++] = v;
                } else if (v > pivot) {
                    a[k] = a[gt];
                    a[gt--] = v;
                } else {
                    k++;
                }
            }
            // ranks below lt go left, above gt go right; those in between hold the pivot already
            int left = rlo;
            while (left <= rhi && ranks[left] < lt) {
                left++;
            }
            int right = rhi;
            while (right >= rlo && ranks[right] > gt) {
                right--;
            }
            if (left - rlo <= rhi - right) {
                select(a, lo, lt - 1, ranks, rlo, left - 1, depth);
                lo = gt + 1;
                rlo = right + 1;
            } else {
                select(a, gt + 1, hi, ranks, right + 1, rhi, depth);
                hi = lt - 1;
                rhi = left - 1;
            }
        }
    }

    /** @return median, and half of the 16-84 % range (one-sigma equivalent for a Gaussian) */
    public static double[] medianHalfRange(double[] v, int n) {
        double[] s = finiteSorted(v, n);
        return new double[] {quantile(s, 0.5), 0.5 * (quantile(s, 0.84) - quantile(s, 0.16)), s.length};
    }
}
