package org.spindrift.sim.motion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.util.function.DoubleUnaryOperator;
import org.hipparchus.special.elliptic.legendre.LegendreEllipticIntegral;
import org.junit.jupiter.api.Test;
import org.spindrift.sim.numerics.BracketedRoot;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;

/**
 * Direct checks of the turning-point detector: on analytic dense steps whose zeros are known in
 * closed form, and on an integrated Schwarzschild orbit against the exact periastron advance.
 */
class TurningPointsTest {
    /** Located "to the resolution of t" (the middle of a bracket two ulps wide): a few ulps of the root time. */
    private static final int ROOT_ULPS = 4;
    /** Values of the analytic components at the located root: a few ulps of values of order 1-10. */
    private static final double AT_ROOT = 1e-15;
    /** Root times over 40 passages: the ulps of the root plus the rounding of 1.3 + 2 pi k. */
    private static final double PASSAGE_ROUNDING = 1e-14;
    /** Periapsis radius of the integrated orbit, M: located on the dense output of a step held to 1e-12. */
    private static final double INTEGRATED_RADIUS = 1e-9;
    /** theta of an equatorial orbit: p_theta = 0 exactly, so theta stays pi/2 up to rounding. */
    private static final double EQUATORIAL = 1e-12;
    /** Advance per radial period, rad: the integration keeps the phase to about 1e-10 per orbit (our choice). */
    private static final double ADVANCE = 1e-8;
    private static final double T_P = 1.3;
    private static final double T_POLAR = 2.0;

    /** A dense step over [t0, t1] of analytic components (R, TH, PH, PR, PTH). */
    private static DenseStep step(double t0, double t1, DoubleUnaryOperator... f) {
        BracketedRoot root = new BracketedRoot();
        return new DenseStep() {
            @Override public double t0() {
                return t0;
            }

            @Override public double t1() {
                return t1;
            }

            @Override public double start(int c) {
                return f[c].applyAsDouble(t0);
            }

            @Override public double end(int c) {
                return f[c].applyAsDouble(t1);
            }

            @Override public double at(int c, double t) {
                return f[c].applyAsDouble(t);
            }

            private double g(EventFunction g, double t) {
                double[] y = new double[f.length];
                for (int c = 0; c < f.length; c++) {
                    y[c] = f[c].applyAsDouble(t);
                }
                return g.g(t, y, 0);
            }

            @Override public double gStart(EventFunction g) {
                return g(g, t0);
            }

            @Override public double gEnd(EventFunction g) {
                return g(g, t1);
            }

            // events located with the engine's shared root finder, as the integrator's steps do
            @Override public double locate(EventFunction g) {
                return root.locate(t -> g(g, t), t0, g(g, t0), t1);
            }

            @Override public double locatedBefore() {
                return root.before();
            }
        };
    }

    /** p_r = sin(t - 1.3) rises through zero at 1.3 + 2 pi k; p_theta = sin(t - 2) at 2 + 2 pi k. */
    private static final DoubleUnaryOperator[] ORBIT = {
        t -> 10 + Math.cos(t), t -> 0.5 * Math.PI + 0.1 * Math.sin(t), t -> 0.7 * t,
        t -> Math.sin(t - T_P), t -> Math.sin(t - T_POLAR)};

    private static double ulps(double t) {
        return ROOT_ULPS * Math.ulp(t);
    }

    @Test
    void risingZeroOfPrIsAPeriapsisAtItsClosedFormTime() {
        TurningPoints tp = new TurningPoints(3);
        tp.step(3, step(1.0, 1.6, ORBIT));
        assertEquals(1, tp.periapsisCount());
        assertEquals(T_P, tp.periapsisTime(0), ulps(T_P));
        assertEquals(10 + Math.cos(T_P), tp.periapsisR(0), AT_ROOT * 10);
        assertEquals(0.5 * Math.PI + 0.1 * Math.sin(T_P), tp.periapsisTheta(0), AT_ROOT);
        assertEquals(0.7 * T_P, tp.periapsisPhi(0), AT_ROOT);
        assertEquals(0, tp.polarCount(), "p_theta stays negative over the step");
    }

    @Test
    void fallingZerosAndOtherParticlesAreIgnored() {
        TurningPoints tp = new TurningPoints(0);
        tp.step(0, step(T_P + Math.PI - 0.2, T_P + Math.PI + 0.2, ORBIT));   // p_r falls: apoapsis
        tp.step(1, step(1.0, 1.6, ORBIT));                                   // another particle
        assertEquals(0, tp.periapsisCount());
        assertEquals(0, tp.polarCount());
    }

    @Test
    void passageOnAStepBoundaryIsCountedOnce() {
        // sin(1.3 - 1.3) = 0 exactly: the first step ends on the zero, the next starts on it
        TurningPoints tp = new TurningPoints(0);
        tp.step(0, step(1.0, T_P, ORBIT));
        tp.step(0, step(T_P, 1.6, ORBIT));
        assertEquals(1, tp.periapsisCount());
        assertEquals(T_P, tp.periapsisTime(0), ulps(T_P));
    }

    @Test
    void manyPassagesGrowTheRecordsAndSurviveACheckpoint() throws IOException {
        TurningPoints tp = new TurningPoints(0);
        tp.addPeriapsis(0.0, 11.0, 0.5 * Math.PI, 0.0);
        double h = 0.37;
        double end = 250.0;
        for (double t = 0; t < end; t += h) {
            tp.step(0, step(t, t + h, ORBIT));
        }
        int expected = 1 + (int) Math.floor((end - T_P) / (2 * Math.PI)) + 1;
        assertTrue(expected > 32, "beyond the initial capacity");
        assertEquals(expected, tp.periapsisCount());
        for (int k = 1; k < tp.periapsisCount(); k++) {
            double exact = T_P + 2 * Math.PI * (k - 1);
            assertEquals(exact, tp.periapsisTime(k), ulps(exact) + PASSAGE_ROUNDING, "passage " + k);
        }
        assertEquals(1 + (int) Math.floor((end - T_POLAR) / (2 * Math.PI)), tp.polarCount());
        for (int k = 0; k < tp.polarCount(); k++) {
            double exact = T_POLAR + 2 * Math.PI * k;
            assertEquals(exact, tp.polarTime(k), ulps(exact) + PASSAGE_ROUNDING, "polar turning point " + k);
        }
        // checkpoint round trip is exact
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        tp.writeState(new DataOutputStream(buf));
        TurningPoints back = new TurningPoints(0);
        back.readState(new DataInputStream(new ByteArrayInputStream(buf.toByteArray())));
        assertEquals(tp.periapsisCount(), back.periapsisCount());
        assertEquals(tp.polarCount(), back.polarCount());
        for (int k = 0; k < tp.periapsisCount(); k++) {
            assertEquals(tp.periapsisTime(k), back.periapsisTime(k), 0.0);
            assertEquals(tp.periapsisR(k), back.periapsisR(k), 0.0);
            assertEquals(tp.periapsisTheta(k), back.periapsisTheta(k), 0.0);
            assertEquals(tp.periapsisPhi(k), back.periapsisPhi(k), 0.0);
        }
        for (int k = 0; k < tp.polarCount(); k++) {
            assertEquals(tp.polarTime(k), back.polarTime(k), 0.0);
        }
    }

    @Test
    void damagedCheckpointIsRefused() {
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        try (DataOutputStream out = new DataOutputStream(buf)) {
            out.writeInt(-5);
        } catch (IOException e) {
            throw new AssertionError(e);
        }
        TurningPoints tp = new TurningPoints(0);
        assertThrows(IOException.class,
                () -> tp.readState(new DataInputStream(new ByteArrayInputStream(buf.toByteArray()))));
    }

    @Test
    void schwarzschildPeriapsesFollowTheExactAdvance() {
        double p = 10.0;
        double e = 0.3;
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.0);
        OrbitElements.Solution s = OrbitElements.solve(st, p, e, 0.0);
        ParticleBatch b = new ParticleBatch(1);
        b.set(0, 0.0, s.start());
        TurningPoints tp = new TurningPoints(0);
        tp.addPeriapsis(0.0, s.start().r(), s.start().theta(), s.start().phi());
        double tEnd = 8 * OrbitMeasurement.keplerPeriod(p, e);   // the relativistic radial period is longer
        BatchIntegrator.Config cfg = BatchIntegrator.Config.of(Landmarks.captureRadius(st)).withTolerance(1e-12, 1e-12)
                .withEscapeRadius(1e5).withThreads(1);
        new BatchIntegrator(st, cfg).integrate(b, new double[] {tEnd}, (k, t, snap) -> { }, tp);
        assertTrue(tp.periapsisCount() >= 5, "passages recorded: " + tp.periapsisCount());
        // Cutler, Kennefick & Poisson 1994, PRD 50, 3816: advance per radial period
        // 4 sqrt(p / (p - 6 + 2e)) K(4e / (p - 6 + 2e)) - 2 pi, K from Hipparchus (parameter m = k^2)
        double d = p - 6 + 2 * e;
        double advance = 4 * Math.sqrt(p / d) * LegendreEllipticIntegral.bigK(4 * e / d) - 2 * Math.PI;
        for (int k = 1; k < tp.periapsisCount(); k++) {
            // r_p = p M / (1 + e) by the definition of p and e; equatorial orbit
            assertEquals(p / (1 + e), tp.periapsisR(k), INTEGRATED_RADIUS, "periapsis radius " + k);
            assertEquals(0.5 * Math.PI, tp.periapsisTheta(k), EQUATORIAL, "equatorial " + k);
            assertEquals(2 * Math.PI + advance, tp.periapsisPhi(k) - tp.periapsisPhi(k - 1), ADVANCE, "advance " + k);
        }
    }
}
