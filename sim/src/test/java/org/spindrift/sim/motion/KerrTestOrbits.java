package org.spindrift.sim.motion;

import java.util.SplittableRandom;
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

    /**
     * A ball of n particles (Gaussian, sigma in M) around the prograde circular orbit at r0,
     * each given the circular orbit's ZAMO velocity at the centre (a rigid start).
     */
    static ParticleBatch ball(MassFunctionSpacetime st, double r0, double sigma, int n, long seed) {
        double a = st.spin();
        double[] el = circularEL(a, r0);
        ZamoFrame z = new ZamoFrame(st);
        double[] v = new double[3];
        z.localVelocity(r0, Math.PI / 2, -el[0], 0, 0, el[1], v);
        SplittableRandom rnd = new SplittableRandom(seed);
        ParticleBatch b = new ParticleBatch(n);
        double[] p = new double[4];
        for (int i = 0; i < n; i++) {
            double x = r0 + sigma * gauss(rnd);
            double y = sigma * gauss(rnd);
            double zz = sigma * gauss(rnd);
            double r = Math.sqrt(x * x + y * y + zz * zz);
            double th = Math.acos(zz / r);
            double ph = Math.atan2(y, x);
            z.momentum(r, th, 0, 0, v[2], p);
            b.set(i, 0.0, r, th, ph, p[0], p[1], p[2], p[3]);
        }
        return b;
    }

    static double gauss(SplittableRandom rnd) {
        double u = rnd.nextDouble();
        double w = rnd.nextDouble();
        return Math.sqrt(-2 * Math.log(1 - u)) * Math.cos(2 * Math.PI * w);
    }

    static double[] grid(double t1, int n) {
        double[] t = new double[n];
        for (int k = 0; k < n; k++) {
            t[k] = t1 * (k + 1) / n;
        }
        return t;
    }
}
