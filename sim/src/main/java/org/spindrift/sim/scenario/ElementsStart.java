package org.spindrift.sim.scenario;

import org.spindrift.shared.scenario.CentreOrbit;
import org.spindrift.shared.scenario.Sense;
import org.spindrift.sim.motion.BatchIntegrator;
import org.spindrift.sim.motion.InitialState;
import org.spindrift.sim.motion.OrbitElements;
import org.spindrift.sim.motion.OrbitMeasurement;
import org.spindrift.sim.motion.OrbitSetup;
import org.spindrift.sim.motion.ZamoFrame;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Start of a centre given by orbit elements (p, e, inclination): (E, L, Q) from the motion
 * engine's solver ({@link OrbitElements}, Schmidt 2002), the centre placed on the equator at
 * periapsis or apoapsis (p_r = 0 there, p_theta = -sqrt(Q) on the equator, moving north as the
 * solver's start). The centre's own geodesic is integrated for two radial periods
 * ({@link OrbitMeasurement}) to give the duration unit "orbit" (its radial period) and the
 * metric's predictions of the periods and the periastron advance for this orbit.
 */
final class ElementsStart {
    /** Radial periods of the centre's orbit measured for the predictions. */
    static final int ORBITS_MEASURED = 2;

    private ElementsStart() {
    }

    static SourceSetup.Centre centre(CentreOrbit.Elements e, Spacetime st, ZamoFrame zamo, double captureRadius) {
        double inc = Math.toRadians(e.inclinationDeg());
        if (e.sense() == Sense.RETROGRADE) {
            inc = Math.PI - inc; // the solver's convention: iota > 90 deg is retrograde
        }
        OrbitElements.Solution sol = OrbitSetup.elements(st, e.semiLatusRectumM(), e.eccentricity(), inc);
        InitialState peri = sol.start();
        double phi0 = Math.toRadians(e.phiDeg());
        InitialState start = e.start() == CentreOrbit.Start.PERIAPSIS ? peri.withPhi(phi0)
                : new InitialState(sol.apoapsis(), 0.5 * Math.PI, phi0, peri.pT(), 0.0,
                        -Math.sqrt(Math.max(0.0, sol.carter())), peri.pPhi());
        double[] v = new double[3];
        zamo.localVelocity(start.r(), start.theta(), start.pT(), start.pR(), start.pTheta(), start.pPhi(), v);
        double kepler = OrbitMeasurement.keplerPeriod(e.semiLatusRectumM(), e.eccentricity());
        OrbitMeasurement.Result m = OrbitMeasurement.measure(st, peri, ORBITS_MEASURED,
                BatchIntegrator.Config.of(captureRadius).withTolerance(1e-11, 1e-11), 64, kepler);
        double period = Double.isFinite(m.periodRadial()) ? m.periodRadial() : kepler;
        return new SourceSetup.Centre(start.r(), start.theta(), start.phi(), v, period,
                new SourceSetup.Prediction(m.periodAzimuthal(), m.periodRadial(), m.periodPolar(), m.advance(),
                        "the centre's geodesic, integrated for " + ORBITS_MEASURED + " radial periods"));
    }
}
