package org.spindrift.sim.analysis;

import java.util.List;
import org.spindrift.shared.Coordinates;
import org.spindrift.sim.history.CentreTracks;
import org.spindrift.sim.history.Chunked;
import org.spindrift.sim.history.ParticleHistory;

/**
 * Shear shapes of every source at every snapshot: centre of mass, the
 * second-moment tensor of the members' positions in the orbital plane, its axes, aspect ratio
 * and orientation against the radial direction, the azimuthal extent, and the lag profile
 * ({@link LagProfile}).
 *
 * <p>The orbital plane of a source is the plane through the black hole normal to the sum of
 * c(s) x c(s+1) over the centre-of-mass track c (the direction of its mean orbital angular
 * momentum); the z axis when the track gives none (for example a radial plunge).
 */
public final class ShearAnalysis {
    private ShearAnalysis() {
    }

    /** Snapshot chunks of a source's shapes (fixed, so that nothing depends on the thread count). */
    private static final int CHUNKS = 16;

    /** Probabilities of the azimuth quantiles a shape needs: the extent's ends and the median. */
    private static final double[] PHI_QUANTILES = {0.05, 0.5, 0.95};

    /** Bins of a lag profile for m members: about 25 per bin, between 4 and 24 bins. */
    static int bins(int m) {
        return Math.max(4, Math.min(24, m / 25));
    }

    /**
     * @param first index of each source's first particle; sources contiguous, the last ends at N
     * @return shapes, source-major (all snapshots of source 0, then source 1, ...)
     */
    public static List<ShearShape> of(ParticleHistory h, int[] first) {
        return of(h, first, 1);
    }

    /** As {@link #of(ParticleHistory, int[])}, snapshots on up to threads threads (the same shapes for any count). */
    public static List<ShearShape> of(ParticleHistory h, int[] first, int threads) {
        int k = first.length;
        int n = h.particles();
        int s = h.snapshots();
        ShearShape[] out = new ShearShape[k * s];
        CentreTracks tracks = h.centres(threads);
        int chunks = Math.min(CHUNKS, s);
        for (int src = 0; src < k; src++) {
            int from = first[src];
            int to = src + 1 < k ? first[src + 1] : n;
            for (int i = from; i < to; i++) {
                if (h.sourceIndex()[i] != src) {
                    throw new IllegalArgumentException("particle " + i + " belongs to source " + h.sourceIndex()[i]
                            + ", not to source " + src + " as the first indices say");
                }
            }
            // a source without particles has no track of its own
            double[][] com = src < tracks.sources() ? tracks.centre()[src] : nanTrack(s);
            int[] alive = src < tracks.sources() ? tracks.alive()[src] : new int[s];
            double[] nrm = planeNormal(com);
            double[] e1 = new double[3];
            double[] e2 = new double[3];
            basis(nrm, e1, e2);
            int source = src;
            Chunked.forEach(chunks, threads, c -> {
                int[] idx = new int[to - from];
                double[] phis = new double[to - from];
                double[] xyz = new double[3];
                for (int q = Chunked.start(c, chunks, s); q < Chunked.start(c + 1, chunks, s); q++) {
                    out[source * s + q] = shape(h, source, q, from, to, idx, phis, com[q], alive[q], nrm, e1, e2, xyz);
                }
            });
        }
        return java.util.Arrays.asList(out);
    }

    private static double[][] nanTrack(int s) {
        double[][] t = new double[s][3];
        for (double[] c : t) {
            java.util.Arrays.fill(c, Double.NaN);
        }
        return t;
    }

    private static ShearShape shape(ParticleHistory h, int src, int q, int from, int to, int[] idx, double[] phis,
            double[] c, int alive, double[] nrm, double[] e1, double[] e2, double[] xyz) {
        double[] r = h.r(q);
        double[] th = h.theta(q);
        double[] ph = h.phi(q);
        byte[] st = h.state(q);
        if (alive < 2) {
            return new ShearShape(src, q, h.time(q), alive, c[0], c[1], c[2], Double.NaN, Double.NaN, Double.NaN,
                    Double.NaN, Double.NaN, Double.NaN, LagProfile.EMPTY);
        }
        // in-plane radial and azimuthal directions at the centre of mass
        double cx = dot(c, e1);
        double cy = dot(c, e2);
        double psi = Math.atan2(cy, cx);
        double cr = Math.cos(psi);
        double sr = Math.sin(psi);
        double sxx = 0;
        double syy = 0;
        double sxy = 0;
        int m = 0;
        for (int i = from; i < to; i++) {
            if (st[i] != 0) {
                continue;
            }
            Coordinates.cartesian(r[i], th[i], ph[i], h.spin(), xyz);
            double dx = dot(xyz, e1) - cx;
            double dy = dot(xyz, e2) - cy;
            double dR = cr * dx + sr * dy;
            double dP = -sr * dx + cr * dy;
            sxx += dR * dR;
            syy += dP * dP;
            sxy += dR * dP;
            phis[m] = ph[i];
            idx[m++] = i;
        }
        sxx /= m;
        syy /= m;
        sxy /= m;
        // eigenvalues of the symmetric 2x2 second-moment tensor
        double mean = 0.5 * (sxx + syy);
        double dif = Math.sqrt(0.25 * (sxx - syy) * (sxx - syy) + sxy * sxy);
        double major = Math.sqrt(mean + dif);
        double minor = Math.sqrt(Math.max(0.0, mean - dif));
        double orient = Math.toDegrees(0.5 * Math.atan2(2.0 * sxy, sxx - syy));
        // 5 %, 50 % (the lag profile's centre azimuth) and 95 % points of the members' azimuths
        double[] pq = new double[3];
        Stats.quantiles(phis, m, PHI_QUANTILES, pq);
        double extent = Math.toDegrees(pq[2] - pq[0]);
        double[] rtp = new double[3];
        Coordinates.boyerLindquist(c[0], c[1], c[2], h.spin(), rtp);
        LagProfile lag = LagProfile.of(r, ph, idx, m, bins(m), pq[1]);
        return new ShearShape(src, q, h.time(q), alive, c[0], c[1], c[2], rtp[0], major, minor,
                minor > 0 ? major / minor : Double.POSITIVE_INFINITY, orient, extent, lag);
    }

    public static double[] planeNormal(double[][] com) {
        double[] n = new double[3];
        for (int q = 0; q + 1 < com.length; q++) {
            double[] a = com[q];
            double[] b = com[q + 1];
            if (Double.isNaN(a[0]) || Double.isNaN(b[0])) {
                continue;
            }
            n[0] += a[1] * b[2] - a[2] * b[1];
            n[1] += a[2] * b[0] - a[0] * b[2];
            n[2] += a[0] * b[1] - a[1] * b[0];
        }
        double len = Math.sqrt(dot(n, n));
        if (!(len > 1e-12)) {
            return new double[] {0, 0, 1};
        }
        return new double[] {n[0] / len, n[1] / len, n[2] / len};
    }

    /** Orthonormal in-plane basis: e1 the projection of x (or y) on the plane, e2 = n x e1. */
    public static void basis(double[] n, double[] e1, double[] e2) {
        double[] ref = Math.abs(n[0]) < 0.9 ? new double[] {1, 0, 0} : new double[] {0, 1, 0};
        double d = dot(ref, n);
        for (int c = 0; c < 3; c++) {
            e1[c] = ref[c] - d * n[c];
        }
        double len = Math.sqrt(dot(e1, e1));
        for (int c = 0; c < 3; c++) {
            e1[c] /= len;
        }
        e2[0] = n[1] * e1[2] - n[2] * e1[1];
        e2[1] = n[2] * e1[0] - n[0] * e1[2];
        e2[2] = n[0] * e1[1] - n[1] * e1[0];
    }

    public static double dot(double[] a, double[] b) {
        return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
    }
}
