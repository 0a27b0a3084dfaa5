package org.spindrift.sim.motion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.hipparchus.analysis.UnivariateFunction;
import org.hipparchus.analysis.solvers.BracketedUnivariateSolver;
import org.hipparchus.analysis.solvers.BracketingNthOrderBrentSolver;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.events.Action;
import org.hipparchus.ode.events.AdaptableInterval;
import org.hipparchus.ode.events.ODEEventDetector;
import org.hipparchus.ode.events.ODEEventHandler;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.MassFunctions;

/**
 * The sign-change events (capture, periapsis, polar turning point) located by the batch
 * integrator and {@link TurningPoints} against Hipparchus' own event detection on the same
 * equations ({@link HipparchusOde}) as the independent reference.
 */
class EventLocationTest {
    /** Integrator tolerance of both sides. */
    private static final double TOL = 1e-12;
    /**
     * Agreement of event times (M): both integrators keep the state to about 1e-10 over these
     * orbits and a turning time is determined to (error of p) / (dp/dt); measured differences
     * are below 1e-9 M, so 1e-8 M leaves a factor ten (measured, no source).
     */
    private static final double EVENT_TIME_TOL = 1e-8;

    @Test
    void captureTimeAgreesWithHipparchusEventDetection() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.5);
        // Kerr outer horizon r+ = 1 + sqrt(1 - a^2) (Boyer & Lindquist 1967), plus a margin
        double rCap = 1 + Math.sqrt(1 - 0.25) + 0.05;
        InitialState s = new ZamoFrame(st).initialState(10, 1.2, 0, -0.1, 0.05, 0.2);
        ParticleBatch b = new ParticleBatch(1);
        b.set(0, 0, s);
        new BatchIntegrator(st, BatchIntegrator.Config.of(rCap).withTolerance(TOL, TOL)).integrate(b,
                new double[] {500}, null);
        assertEquals(EndState.CAPTURED, b.endState(0));

        List<Double> ref = hipparchusEvents(st, s, 500, GeodesicEquations.R, rCap, true, false);
        assertEquals(1, ref.size(), "Hipparchus must see exactly one crossing of the capture radius");
        assertEquals(ref.get(0), b.time(0), EVENT_TIME_TOL, "capture time");
        assertEquals(rCap, b.r(0), 1e-9, "the particle ends on the capture radius");
    }

    @Test
    void turningPointsAgreeWithHipparchusEventDetection() {
        MassFunctionSpacetime st = new MassFunctionSpacetime("kerr", 0.6, MassFunctions.constant());
        OrbitElements.Solution sol = OrbitElements.solve(st, 10, 0.5, 0.6);
        InitialState s = sol.start();
        double tEnd = 3000;
        ParticleBatch b = new ParticleBatch(1);
        b.set(0, 0, s);
        TurningPoints tp = new TurningPoints(0);
        new BatchIntegrator(st, BatchIntegrator.Config.of(2.0).withTolerance(TOL, TOL)).integrate(b,
                KerrTestOrbits.grid(tEnd, 20), null, tp);

        // periapsis: p_r rising through zero; the orbit starts at periapsis, so t = 0 is left out on both sides
        List<Double> peri = hipparchusEvents(st, s, tEnd, GeodesicEquations.PR, 0.0, false, true);
        peri.removeIf(t -> t < 1.0);
        assertTrue(peri.size() >= 5, "at least five radial periods in " + tEnd + " M, got " + peri.size());
        int k0 = tp.periapsisCount() > 0 && tp.periapsisTime(0) < 1.0 ? 1 : 0;
        assertEquals(peri.size(), tp.periapsisCount() - k0, "periapsis passages");
        for (int k = 0; k < peri.size(); k++) {
            assertEquals(peri.get(k), tp.periapsisTime(k + k0), EVENT_TIME_TOL, "periapsis " + k);
        }
        // northern polar turning points: p_theta rising through zero
        List<Double> polar = hipparchusEvents(st, s, tEnd, GeodesicEquations.PTH, 0.0, false, true);
        polar.removeIf(t -> t < 1.0);
        assertTrue(polar.size() >= 5, "inclined orbit: several polar turning points, got " + polar.size());
        int j0 = tp.polarCount() > 0 && tp.polarTime(0) < 1.0 ? 1 : 0;
        assertEquals(polar.size(), tp.polarCount() - j0, "polar turning points");
        for (int k = 0; k < polar.size(); k++) {
            assertEquals(polar.get(k), tp.polarTime(k + j0), EVENT_TIME_TOL, "polar turning point " + k);
        }
    }

    /**
     * Times where y[c] - level changes sign (only rising ones when risingOnly), detected by
     * Hipparchus' DormandPrince853Integrator with its own event handling.
     */
    private static List<Double> hipparchusEvents(MassFunctionSpacetime st, InitialState s, double tEnd, int c,
                                                 double level, boolean stop, boolean risingOnly) {
        HipparchusOde ode = new HipparchusOde(new GeodesicEquations(st), s.pT(), s.pPhi());
        DormandPrince853Integrator integ = new DormandPrince853Integrator(1e-10, 10, TOL, TOL);
        List<Double> times = new ArrayList<>();
        integ.addEventDetector(new ODEEventDetector() {
            @Override public AdaptableInterval getMaxCheckInterval() {
                return AdaptableInterval.of(1.0);
            }

            @Override public int getMaxIterationCount() {
                return 200;
            }

            @Override public BracketedUnivariateSolver<UnivariateFunction> getSolver() {
                return new BracketingNthOrderBrentSolver(0.0, 1e-13, 0.0, 5);
            }

            @Override public ODEEventHandler getHandler() {
                return (state, detector, increasing) -> {
                    if (increasing || !risingOnly) {
                        times.add(state.getTime());
                    }
                    return stop ? Action.STOP : Action.CONTINUE;
                };
            }

            @Override public double g(ODEStateAndDerivative state) {
                return state.getPrimaryState()[c] - level;
            }
        });
        integ.integrate(ode, new ODEState(0, new double[] {s.r(), s.theta(), s.phi(), s.pR(), s.pTheta()}), tEnd);
        return times;
    }
}
