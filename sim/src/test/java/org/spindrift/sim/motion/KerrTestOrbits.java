package org.spindrift.sim.motion;

import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.MassFunctions;

/** Test fixtures: Kerr spacetimes and circular-orbit initial data from closed forms. */
final class KerrTestOrbits {
    private KerrTestOrbits() {
    }

    static MassFunctionSpacetime kerr(double a) {
        return new MassFunctionSpacetime("kerr", a, MassFunctions.constant());
    }

    /** Prograde equatorial circular orbit: Bardeen, Press &amp; Teukolsky 1972, ApJ 178, 347, eq. 2.12-2.13. */
    static double[] circularEL(double a, double r) {
        double sr = Math.sqrt(r);
        double den = Math.pow(r, 0.75) * Math.sqrt(r * sr - 3 * sr + 2 * a);
        double e = (r * sr - 2 * sr + a) / den;
        double l = (r * r - 2 * a * sr + a * a) / den;
        return new double[] {e, l};
    }

    /** @return (E, L) of a retrograde circular orbit (BPT 1972 eq. 2.12-2.13, lower signs) */
    static double[] circularELRetro(double a, double r) {
        double sr = Math.sqrt(r);
        double den = Math.pow(r, 0.75) * Math.sqrt(r * sr - 3 * sr - 2 * a);
        double e = (r * sr - 2 * sr - a) / den;
        double l = -(r * r + 2 * a * sr + a * a) / den;
        return new double[] {e, l};
    }

    /** A ball of n particles (Gaussian, sigma in M) around the prograde circular orbit at r0 ({@link ParticleBall}). */
    static ParticleBatch ball(MassFunctionSpacetime st, double r0, double sigma, int n, long seed) {
        return ParticleBall.around(st, r0, sigma, n, seed);
    }

    static double[] grid(double t1, int n) {
        double[] t = new double[n];
        for (int k = 0; k < n; k++) {
            t[k] = t1 * (k + 1) / n;
        }
        return t;
    }
}
