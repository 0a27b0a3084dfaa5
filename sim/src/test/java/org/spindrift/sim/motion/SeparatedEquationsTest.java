package org.spindrift.sim.motion;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.MassFunction;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.MassFunctions;

/**
 * The coordinate-time equations from Carter's separated Hamiltonian (Carter 1968, Phys. Rev. 174,
 * 1559) against the general form from the 15 inverse-metric components and their derivatives
 * (Misner, Thorne &amp; Wheeler 1973, eq. 25.19 with eq. 33.2 generalised to m(r)): the same
 * equations, so they must agree to rounding, on and off the mass shell, for every mass function.
 */
class SeparatedEquationsTest {
    /** Separated and general forms of dt/dlambda: the same equations through different algebra, about 1e3 ulps. */
    private static final double SAME_EQUATIONS_TIME = 1e-12;
    /** Right-hand-side components, relative and floored at 1e-3 where they cross zero (measured worst: 2e-13). */
    private static final double SAME_EQUATIONS_COMPONENT = 1e-11;

    @Test
    void separatedFormAgreesWithTheGeneralFormForAllMassFunctions() {
        MassFunction[] masses = {MassFunctions.constant(), MassFunctions.kerrNewman(0.4), MassFunctions.hayward(0.5),
            MassFunctions.bardeen(0.3), MassFunctions.series(new int[] {1, 3}, new double[] {0.1, -0.2})};
        SplittableRandom rnd = new SplittableRandom(42);
        double[] y = new double[GeodesicEquations.DIM_T];
        double[] d1 = new double[GeodesicEquations.DIM_T];
        double[] d2 = new double[GeodesicEquations.DIM_T];
        for (MassFunction m : masses) {
            for (double spin : new double[] {0.0, 0.5, 0.9, -0.7}) {
                MassFunctionSpacetime st = new MassFunctionSpacetime("test", spin, m);
                GeodesicEquations separated = new GeodesicEquations(st);
                GeodesicEquations general = new GeodesicEquations(st, false);
                for (int n = 0; n < 2000; n++) {
                    y[0] = rnd.nextDouble(3.0, 60.0);
                    y[1] = rnd.nextDouble(0.05, Math.PI - 0.05);
                    y[2] = rnd.nextDouble(0, 6.0);
                    y[3] = rnd.nextDouble(-0.5, 0.5);
                    y[4] = rnd.nextDouble(-4.0, 4.0);
                    double pt = -rnd.nextDouble(0.85, 1.0);
                    double pphi = rnd.nextDouble(-5.0, 5.0);
                    double t1 = separated.coordinateTime(pt, pphi, y, 0, d1, 0);
                    double t2 = general.coordinateTime(pt, pphi, y, 0, d2, 0);
                    if (!(t2 > 0)) {
                        continue; // the general form's time-reversed branch: callers reject it anyway
                    }
                    assertEquals(t2, t1, SAME_EQUATIONS_TIME * Math.abs(t2), "dt/dlambda");
                    for (int j = 0; j < GeodesicEquations.DIM_T; j++) {
                        // relative, floored at 1e-3 for components that pass through zero (measured worst: 2e-13)
                        assertEquals(d2[j], d1[j], SAME_EQUATIONS_COMPONENT * (Math.abs(d2[j]) + 1e-3),
                                "component " + j + " at r = " + y[0] + ", theta = " + y[1] + ", a = " + spin);
                    }
                }
            }
        }
    }
}
