package org.spindrift.sim.motion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;

class BatchIntegratorTest {
    /**
     * Both integrators at tolerance 1e-13 over up to 500 M near a = 0.9: each global error stays far
     * below 1e-8 relative (our choice, about 1e5 x the tolerance).
     */
    private static final double HIPPARCHUS_REL = 1e-8;
    /** Drift of H = -1/2 over 1500 M at the default tolerance 1e-12: about 100 steps of local error (our choice). */
    private static final double MASS_SHELL = 1e-10;
    /** Drift of the Carter constant relative to the largest Q0, same integration as MASS_SHELL (our choice). */
    private static final double CARTER_DRIFT_REL = 1e-8;
    /** A capture located on the dense output to the resolution of t: r within the interpolant's error, M. */
    private static final double EVENT_RADIUS = 1e-9;
    /** Escape at r = 500 M located the same way: EVENT_RADIUS scaled by the larger r and speed. */
    private static final double ESCAPE_RADIUS = 1e-7;

    /** Kerr outer horizon r+ = 1 + sqrt(1 - a^2) (Boyer & Lindquist 1967), plus a margin. */
    private static double capture(double a) {
        return 1 + Math.sqrt(1 - a * a) + 0.05;
    }

    @Test
    void resultsAreBitwiseIdenticalForOneAndTwoThreads() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.9);
        ParticleBatch b1 = KerrTestOrbits.ball(st, 8, 0.5, 150, 7);
        ParticleBatch b2 = b1.copy();
        double[] times = KerrTestOrbits.grid(300, 7);
        BatchIntegrator.Config c = BatchIntegrator.Config.of(capture(0.9)).withChunkSize(16);
        double[][] snaps1 = new double[times.length][];
        double[][] snaps2 = new double[times.length][];
        BatchIntegrator.Result r1 = new BatchIntegrator(st, c.withThreads(1)).integrate(b1, times,
                (k, t, s) -> snaps1[k] = column(s));
        BatchIntegrator.Result r2 = new BatchIntegrator(st, c.withThreads(2)).integrate(b2, times,
                (k, t, s) -> snaps2[k] = column(s));
        assertTrue(b1.bitwiseEquals(b2), "final states differ between 1 and 2 threads");
        for (int k = 0; k < times.length; k++) {
            assertTrue(java.util.Arrays.equals(snaps1[k], snaps2[k]), "snapshot " + k + " differs");
        }
        assertEquals(r1.evaluations(), r2.evaluations());
        assertTrue(r1.evaluations() > 0);
    }

    private static double[] column(Snapshot s) {
        double[] out = new double[5 * s.size()];
        for (int i = 0; i < s.size(); i++) {
            out[5 * i] = s.r(i);
            out[5 * i + 1] = s.theta(i);
            out[5 * i + 2] = s.phi(i);
            out[5 * i + 3] = s.pR(i);
            out[5 * i + 4] = s.pTheta(i);
        }
        return out;
    }

    @Test
    void tighterToleranceNeverCostsFewerEvaluations() {
        // Hipparchus test practice (common practice, no source): work grows as tolerance shrinks
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.7);
        long previous = 0;
        for (double tol = 1e-6; tol >= 1e-13; tol /= 10) {
            ParticleBatch b = KerrTestOrbits.ball(st, 9, 0.5, 10, 3);
            BatchIntegrator.Result r = new BatchIntegrator(st, BatchIntegrator.Config.of(capture(0.7))
                    .withTolerance(tol, tol)).integrate(b, new double[] {400}, null);
            assertTrue(r.evaluations() >= previous, "tol " + tol + ": " + r.evaluations() + " < " + previous);
            previous = r.evaluations();
        }
    }

    @Test
    void snapshotAgreesWithHipparchusDormandPrince853() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.9);
        ParticleBatch b = KerrTestOrbits.ball(st, 8, 0.5, 4, 11);
        double[][] start = new double[4][];
        for (int i = 0; i < 4; i++) {
            start[i] = new double[] {b.r(i), b.theta(i), b.phi(i), b.pR(i), b.pTheta(i), b.pT(i), b.pPhi(i)};
        }
        double[] times = {37.3, 211.9, 500};
        double[][] got = new double[times.length][];
        new BatchIntegrator(st, BatchIntegrator.Config.of(capture(0.9)).withTolerance(1e-13, 1e-13))
                .integrate(b, times, (k, t, s) -> got[k] = column(s));
        for (int i = 0; i < 4; i++) {
            final double[] s0 = start[i];
            double[][] ref = new HipparchusOde(new GeodesicEquations(st), s0[5], s0[6])
                    .restartAt(0, new double[] {s0[0], s0[1], s0[2], s0[3], s0[4]}, times, 1e-13, 1e3);
            for (int k = 0; k < times.length; k++) {
                for (int c = 0; c < 5; c++) {
                    // Hipparchus DormandPrince853Integrator as reference
                    assertEquals(ref[k][c], got[k][5 * i + c], HIPPARCHUS_REL * Math.max(1, Math.abs(ref[k][c])),
                            "particle " + i + " component " + c + " at t = " + times[k]);
                }
            }
        }
    }

    @Test
    void massShellIsConservedAlongABall() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.9);
        ParticleBatch b = KerrTestOrbits.ball(st, 8, 0.5, 40, 5);
        GeodesicEquations eq = new GeodesicEquations(st);
        double[] worst = {0};
        int[] checked = {0};
        new BatchIntegrator(st, BatchIntegrator.Config.of(capture(0.9))).integrate(b,
                KerrTestOrbits.grid(1500, 30), (k, t, s) -> {
                    for (int i = 0; i < s.size(); i++) {
                        if (s.endState(i) == EndState.ALIVE) {
                            checked[0]++;
                            double h = eq.hamiltonian(s.r(i), s.theta(i), s.pT(i), s.pPhi(i), s.pR(i), s.pTheta(i));
                            worst[0] = Math.max(worst[0], Math.abs(h + 0.5));
                        }
                    }
                });
        // H = -1/2 for unit-mass test particles (Misner, Thorne & Wheeler 1973, eq. 25.19)
        assertTrue(worst[0] < MASS_SHELL, "max |H + 1/2| = " + worst[0]);
        // the bound above must have been measured on every particle at every snapshot: a ball at
        // r = 8 M around a = 0.9 stays bound for 1500 M (no particle reaches the horizon)
        assertEquals(40 * 30, checked[0], "particle-snapshots checked");
    }

    @Test
    void plungingOrbitIsCapturedAndHyperbolicOrbitEscapes() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.5);
        ZamoFrame z = new ZamoFrame(st);
        ParticleBatch b = new ParticleBatch(2);
        // radial infall from rest at r = 10 (no angular momentum): must reach the horizon
        b.set(0, 0, z.initialState(10, Math.PI / 2, 0, 0, 0, 0));
        // outward at 0.9 c at r = 20: E > 1, unbound, escapes (common practice, no source)
        b.set(1, 0, z.initialState(20, Math.PI / 2, 0, 0.9, 0, 0.1));
        assertTrue(b.pT(1) < -1);
        BatchIntegrator.Result r = new BatchIntegrator(st, BatchIntegrator.Config.of(capture(0.5))
                .withEscapeRadius(500)).integrate(b, new double[] {100, 2000}, null);
        assertEquals(EndState.CAPTURED, b.endState(0));
        assertEquals(EndState.ESCAPED, b.endState(1));
        assertEquals(capture(0.5), b.r(0), EVENT_RADIUS);
        assertEquals(500, b.r(1), ESCAPE_RADIUS);
        assertTrue(b.time(0) > 0 && b.time(0) < 100, "capture time " + b.time(0));
        assertEquals(1, r.count(EndState.CAPTURED));
        assertEquals(1, r.count(EndState.ESCAPED));
    }

    @Test
    void carterConstantIsConservedAndDiagnosticsReportIt() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.9);
        ParticleBatch b = KerrTestOrbits.ball(st, 8, 0.7, 30, 9);
        MotionDiagnostics d = new MotionDiagnostics(st, b);
        double q0max = 0;
        for (int i = 0; i < b.size(); i++) {
            q0max = Math.max(q0max, st.carter(b.theta(i), b.pTheta(i), -b.pT(i), b.pPhi(i), 1.0));
        }
        new BatchIntegrator(st, BatchIntegrator.Config.of(capture(0.9))).integrate(b, KerrTestOrbits.grid(1500, 40), d);
        // Carter 1968, Phys. Rev. 174, 1559: Q is a constant of geodesic motion in Kerr
        assertTrue(q0max > 0.1, "the ball must contain inclined orbits, max Q0 = " + q0max);
        assertTrue(d.carterDriftMax() < CARTER_DRIFT_REL * q0max, "max |Q - Q0| = " + d.carterDriftMax());
        assertTrue(d.carterDriftMax() > 0, "a drift of exactly zero means nothing was measured");
        assertTrue(d.massShellMedian() <= d.massShellMax());
        assertTrue(d.massShellMax() < MASS_SHELL, "max |H + 1/2| = " + d.massShellMax());
    }

    @Test
    void unusableStartsFailWithTheirReason() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.5);
        ParticleBatch b = new ParticleBatch(3);
        InitialState ok = new ZamoFrame(st).initialState(10, Math.PI / 2, 0, 0, 0, 0.3);
        b.set(0, 0, ok);
        // p_t > 0 outside the ergoregion: dt/dlambda = g^tt p_t + g^tphi p_phi < 0 (past-directed)
        b.set(1, 0, 10, Math.PI / 2, 0, -ok.pT(), 0, 0, ok.pPhi());
        b.set(2, 0, Double.NaN, Math.PI / 2, 0, ok.pT(), 0, 0, ok.pPhi());
        new BatchIntegrator(st, BatchIntegrator.Config.of(capture(0.5))).integrate(b, new double[] {50}, null);
        assertEquals(EndState.ALIVE, b.endState(0));
        assertEquals(EndState.FAILED, b.endState(1));
        assertEquals(Failure.TIME_NOT_INCREASING, b.failure(1));
        assertEquals(0.0, b.time(1));
        assertEquals(EndState.FAILED, b.endState(2));
        assertEquals(Failure.NON_FINITE, b.failure(2));
        assertEquals(50.0, b.time(0));
    }

    @Test
    void resultsDoNotDependOnTheChunkSize() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.9);
        ParticleBatch a = KerrTestOrbits.ball(st, 8, 0.5, 40, 21);
        ParticleBatch b = a.copy();
        BatchIntegrator.Config c = BatchIntegrator.Config.of(capture(0.9));
        new BatchIntegrator(st, c.withChunkSize(7).withThreads(2)).integrate(a, new double[] {50, 200}, null);
        new BatchIntegrator(st, c.withChunkSize(64)).integrate(b, new double[] {50, 200}, null);
        assertTrue(a.bitwiseEquals(b));
    }

    @Test
    void stepLoopDoesNotAllocate() {
        // allocation per call is fixed (snapshot buffer, worker scratch); per step it must be zero
        // (common practice, no source: JOML/Hipparchus-style allocation-free inner loops)
        java.lang.management.ThreadMXBean mx = java.lang.management.ManagementFactory.getThreadMXBean();
        org.junit.jupiter.api.Assumptions.assumeTrue(mx instanceof com.sun.management.ThreadMXBean,
                "allocation counter not available on this JVM");
        com.sun.management.ThreadMXBean tmx = (com.sun.management.ThreadMXBean) mx;
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.9);
        BatchIntegrator integ = new BatchIntegrator(st, BatchIntegrator.Config.of(capture(0.9)));
        long[] bytes = new long[2];
        long[] steps = new long[2];
        double[][] horizons = {{100}, {3000}};
        for (int warm = 0; warm < 2; warm++) {
            for (int k = 0; k < 2; k++) {
                ParticleBatch b = KerrTestOrbits.ball(st, 8, 0.5, 20, 4);
                long before = tmx.getCurrentThreadAllocatedBytes();
                steps[k] = integ.integrate(b, horizons[k], null).acceptedSteps();
                bytes[k] = tmx.getCurrentThreadAllocatedBytes() - before;
            }
        }
        assertTrue(steps[1] > 10 * steps[0], "the long run must take many more steps");
        assertTrue(bytes[1] - bytes[0] < 4096, "allocated " + bytes[0] + " B for " + steps[0] + " steps, "
                + bytes[1] + " B for " + steps[1] + " steps");
    }
}
