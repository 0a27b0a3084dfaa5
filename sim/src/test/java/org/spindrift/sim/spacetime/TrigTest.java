package org.spindrift.sim.spacetime;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * {@link Trig} against the JDK's StrictMath (the fdlibm 5.3 reference, as the Java SE
 * specification of StrictMath requires): the same bits for every argument tried, with
 * emphasis on the angles the geodesic code meets and on the branch edges of the argument
 * reduction (near multiples of pi/2, where cancellation forces the extra reduction rounds).
 */
class TrigTest {
    private static void same(double x) {
        assertEquals(Double.doubleToRawLongBits(StrictMath.sin(x)), Double.doubleToRawLongBits(Trig.sin(x)),
                () -> "sin(" + x + ") = " + Trig.sin(x) + ", StrictMath " + StrictMath.sin(x));
        assertEquals(Double.doubleToRawLongBits(StrictMath.cos(x)), Double.doubleToRawLongBits(Trig.cos(x)),
                () -> "cos(" + x + ") = " + Trig.cos(x) + ", StrictMath " + StrictMath.cos(x));
    }

    @Test
    void polarAnglesMatchStrictMathBitForBit() {
        SplittableRandom rnd = new SplittableRandom(7);
        for (int i = 0; i < 2_000_000; i++) {
            same(rnd.nextDouble(-0.5, 4.0));
        }
    }

    @Test
    void wideRangeAndSmallArgumentsMatchStrictMath() {
        SplittableRandom rnd = new SplittableRandom(11);
        for (int i = 0; i < 1_000_000; i++) {
            double mag = Math.pow(10.0, rnd.nextDouble(-12.0, 7.0));
            same(rnd.nextBoolean() ? mag : -mag);
        }
        for (double x : new double[] {0.0, -0.0, Double.MIN_VALUE, 1e-300, 1e-9, Math.PI / 4, Math.PI / 2, Math.PI,
            3 * Math.PI / 4, 1e6, 1e9, 1e300, Double.MAX_VALUE, Double.NaN, Double.POSITIVE_INFINITY,
            Double.NEGATIVE_INFINITY}) {
            same(x);
            same(-x);
        }
    }

    @Test
    void argumentsNearMultiplesOfHalfPiMatchStrictMath() {
        for (int n = 1; n <= 200; n++) {
            double c = n * (Math.PI / 2);
            double x = c;
            for (int u = 0; u < 64; u++) {
                same(x);
                same(-x);
                x = Math.nextUp(x);
            }
            x = c;
            for (int u = 0; u < 64; u++) {
                x = Math.nextDown(x);
                same(x);
                same(-x);
            }
            for (double d = 1e-15; d < 1e-3; d *= 3.7) {
                same(c + d);
                same(c - d);
            }
        }
    }
}
