package org.spindrift.sim.analysis;

/**
 * Azimuthal-lag profile of a source at one time: members binned in r, and per bin the lag
 * dphi(r) = phi_centre - phi_mean(r) (radians), with phi_centre the median azimuth of the alive
 * members. One sign convention throughout: the lag is how far the gas is behind the centre in
 * the +phi direction, so for prograde orbits (which move towards +phi) it is positive where the
 * gas trails. Kinematic shear then gives dphi(r, t) = (Omega(r_c) - Omega(r)) t at early times,
 * for either sense of motion.
 *
 * <p>Near a maximum of Omega(r) the gas there leads and the lag has a minimum, stationary in r:
 * the two arms (inside and outside) both trail and open into a V. {@link #stationaryRadius} is
 * that radius (vertex of a parabola through the lowest interior bin and its neighbours), NaN
 * when the lowest bin is at an end (a monotonic profile, as in Kerr) or when either end rises
 * above it by less than {@link #SIGNIFICANCE} standard errors of the bin means (noise, for
 * example at t = 0). The arm lengths are the
 * lengths of the mean curve (r, phi_mean(r)) in the plane, sum of sqrt(dr^2 + (r dphi)^2), from
 * the stationary bin to the inner and outer ends.
 *
 * @param r bin centres (mean r of the members in each bin), M
 * @param lag lag per bin, radians
 * @param count members per bin
 * @param stationaryRadius radius of the stationary (minimum-lag) point, M, or NaN
 * @param innerArm length of the inner arm, M, or NaN
 * @param outerArm length of the outer arm, M, or NaN
 */
public record LagProfile(double[] r, double[] lag, int[] count, double stationaryRadius, double innerArm,
        double outerArm) {
    /** Empty profile. */
    static final LagProfile EMPTY = new LagProfile(new double[0], new double[0], new int[0], Double.NaN, Double.NaN,
            Double.NaN);

    /** Rise of both ends above the minimum, in standard errors, for a stationary point to count. */
    static final double SIGNIFICANCE = 5.0;

    /** Smallest number of members in a bin. */
    static final int MIN_PER_BIN = 5;

    /** As {@link #of(double[], double[], int[], int, int, double)}, finding the members' median azimuth itself. */
    static LagProfile of(double[] r, double[] phi, int[] idx, int m, int bins) {
        double[] phis = new double[m];
        for (int k = 0; k < m; k++) {
            phis[k] = phi[idx[k]];
        }
        double[] med = new double[1];
        Stats.quantiles(phis, m, new double[] {0.5}, med);
        return of(r, phi, idx, m, bins, med[0]);
    }

    /**
     * Computes the profile of the members listed in idx (alive members of one source).
     *
     * @param r radius of every particle
     * @param phi continuous azimuth of every particle
     * @param idx indices of the members to use
     * @param m how many of idx
     * @param bins number of bins (equal counts: bins are r quantiles)
     * @param phiC median azimuth of the members ({@link Stats#quantile} at 0.5 of their phi)
     */
    static LagProfile of(double[] r, double[] phi, int[] idx, int m, int bins, double phiC) {
        if (m < 2 * MIN_PER_BIN || bins < 3) {
            return EMPTY;
        }
        bins = Math.max(3, Math.min(bins, m / MIN_PER_BIN));
        double[] rsort = new double[m];
        double rMin = Double.POSITIVE_INFINITY;
        double rMax = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < m; k++) {
            double v = r[idx[k]];
            rsort[k] = v;
            rMin = Math.min(rMin, v);
            rMax = Math.max(rMax, v);
        }
        // equal-count bins: edges at the r order statistics of ranks b m / bins (ties may shift a member)
        int[] ranks = new int[bins - 1];
        for (int b = 1; b < bins; b++) {
            ranks[b - 1] = (int) ((long) b * m / bins);
        }
        double[] edge = Stats.orderStatistics(rsort, m, ranks);
        double[] rb = new double[bins];
        double[] lag = new double[bins];
        int[] cnt = new int[bins];
        double[] se = new double[bins];
        double[] sp = new double[bins];
        double[] sp2 = new double[bins];
        int[] bin = new int[m];
        // a member's bin is the binary search's insertion point among the edges; with distinct edges
        // that is the number of edges <= r, counted from a grid of equal cells in r: cell(r) never
        // decreases with r, so every edge of an earlier cell is below r and of a later one above
        // (positive radii: the search orders -0.0 below 0.0, a comparison does not)
        boolean distinct = Double.isFinite(rMax - rMin) && rMax > rMin && rMin > 0;
        for (int b = 1; b < edge.length; b++) {
            distinct &= edge[b] > edge[b - 1];
        }
        int cells = GRID_PER_BIN * bins;
        double scale = cells / (rMax - rMin);
        int[] below = new int[cells + 1];
        if (distinct) {
            for (double e : edge) {
                below[cell(e, rMin, scale, cells) + 1]++;
            }
            for (int c = 0; c < cells; c++) {
                below[c + 1] += below[c];
            }
        }
        for (int k = 0; k < m; k++) {
            int i = idx[k];
            int b;
            if (distinct) {
                double v = r[i];
                b = below[cell(v, rMin, scale, cells)];
                while (b < edge.length && edge[b] <= v) {
                    b++;
                }
            } else {
                b = java.util.Arrays.binarySearch(edge, r[i]);
                b = b >= 0 ? b + 1 : -b - 1;
            }
            bin[k] = b;
            cnt[b]++;
            rb[b] += r[i];
            sp[b] += phi[i];
        }
        for (int b = 0; b < bins; b++) {
            if (cnt[b] == 0) {
                return EMPTY;
            }
            rb[b] /= cnt[b];
            sp[b] /= cnt[b];
        }
        for (int k = 0; k < m; k++) {
            double d = phi[idx[k]] - sp[bin[k]];
            sp2[bin[k]] += d * d;
        }
        for (int b = 0; b < bins; b++) {
            se[b] = Math.sqrt(sp2[b] / Math.max(1, cnt[b] - 1) / cnt[b]);
            lag[b] = phiC - sp[b];
        }
        int lo = 0;
        for (int b = 1; b < bins; b++) {
            if (lag[b] < lag[lo]) {
                lo = b;
            }
        }
        double rs = Double.NaN;
        double inner = Double.NaN;
        double outer = Double.NaN;
        double noise = Math.max(se[lo], Math.max(se[0], se[bins - 1]));
        boolean significant = lo > 0 && lo < bins - 1 && lag[0] - lag[lo] > SIGNIFICANCE * noise
                && lag[bins - 1] - lag[lo] > SIGNIFICANCE * noise;
        if (significant) {
            // vertex of the parabola through the minimum bin and its neighbours
            double x0 = rb[lo - 1];
            double x1 = rb[lo];
            double x2 = rb[lo + 1];
            double y0 = lag[lo - 1];
            double y1 = lag[lo];
            double y2 = lag[lo + 1];
            double num = (x1 - x0) * (x1 - x0) * (y1 - y2) - (x1 - x2) * (x1 - x2) * (y1 - y0);
            double den = (x1 - x0) * (y1 - y2) - (x1 - x2) * (y1 - y0);
            rs = den != 0 ? x1 - 0.5 * num / den : x1;
            rs = Math.max(x0, Math.min(x2, rs));
            inner = armLength(rb, lag, lo, 0);
            outer = armLength(rb, lag, lo, bins - 1);
        }
        return new LagProfile(rb, lag, cnt, rs, inner, outer);
    }

    /** Cells of the bin-lookup grid per bin. */
    private static final int GRID_PER_BIN = 8;

    /** Cell of the bin-lookup grid holding v: non-decreasing in v (each operation rounds monotonically). */
    private static int cell(double v, double lo, double scale, int cells) {
        return Math.max(0, Math.min(cells - 1, (int) ((v - lo) * scale)));
    }

    private static double armLength(double[] r, double[] lag, int from, int to) {
        int step = to > from ? 1 : -1;
        double len = 0;
        for (int b = from; b != to; b += step) {
            double dr = r[b + step] - r[b];
            double rm = 0.5 * (r[b + step] + r[b]);
            double dp = lag[b + step] - lag[b];
            len += Math.sqrt(dr * dr + rm * rm * dp * dp);
        }
        return len;
    }
}
