package org.spindrift.sim.motion;

import java.util.SplittableRandom;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * A Gaussian ball of test masses around a point of a prograde circular equatorial orbit: the
 * benchmark's and the tests' common workload. Positions are Cartesian Gaussian offsets
 * (sigma in M) from (r0, equator, phi = 0); every member gets the centre's local velocity in
 * the ZAMO frame (a rigid start), so the ball shears as it orbits.
 */
public final class ParticleBall {
    private ParticleBall() {
    }

    /**
     * @param st the spacetime (a prograde circular orbit must exist at r0)
     * @param r0 radius of the circular orbit at the centre (M)
     * @param sigma Gaussian radius of the ball (M)
     * @param n number of particles
     * @param seed random seed (the same seed gives the same ball)
     * @return the particles at t = 0
     */
    public static ParticleBatch around(Spacetime st, double r0, double sigma, int n, long seed) {
        InitialState c = OrbitSetup.circular(st, r0, true, 0.0);
        ZamoFrame z = new ZamoFrame(st);
        double[] v = new double[3];
        z.localVelocity(c.r(), c.theta(), c.pT(), c.pR(), c.pTheta(), c.pPhi(), v);
        SplittableRandom rnd = new SplittableRandom(seed);
        ParticleBatch b = new ParticleBatch(n);
        double[] p = new double[4];
        for (int i = 0; i < n; i++) {
            double x = r0 + sigma * gauss(rnd);
            double y = sigma * gauss(rnd);
            double zz = sigma * gauss(rnd);
            double r = FastMath.sqrt(x * x + y * y + zz * zz);
            double th = FastMath.acos(zz / r);
            double ph = FastMath.atan2(y, x);
            z.momentum(r, th, 0, 0, v[2], p);
            b.set(i, 0.0, r, th, ph, p[0], p[1], p[2], p[3]);
        }
        return b;
    }

    /** Box-Muller normal deviate (Box &amp; Muller 1958, Ann. Math. Stat. 29, 610). */
    private static double gauss(SplittableRandom rnd) {
        return FastMath.sqrt(-2 * FastMath.log(1 - rnd.nextDouble())) * FastMath.cos(2 * FastMath.PI * rnd.nextDouble());
    }
}
