package org.spindrift.sim.motion;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.MassFunctions;

/**
 * The Mino-time quadrature for mass functions other than Kerr's against the integrated orbit
 * (Hamilton's equations in coordinate time, a different method), and its general radial branch
 * against the Kerr closed-form factorisation. Kerr itself is checked by the validation suite.
 */
class MinoFrequenciesTest {
    @Test void generalRadialBranchAgreesWithTheKerrFactorisation() {
        // same metric, named differently, so the general branch (R divided by its turning-point factors) is used
        MassFunctionSpacetime kerr = new MassFunctionSpacetime("kerr", 0.8, MassFunctions.constant());
        MassFunctionSpacetime general = new MassFunctionSpacetime("kerr-as-mass-function", 0.8, MassFunctions.constant());
        OrbitElements.Solution s = OrbitElements.solve(kerr, 9, 0.5, Math.toRadians(35));
        MinoFrequencies.Result a = MinoFrequencies.compute(kerr, s);
        MinoFrequencies.Result b = MinoFrequencies.compute(general, s);
        assertEquals(a.periodRadial(), b.periodRadial(), 1e-10 * a.periodRadial());
        assertEquals(a.periodAzimuthal(), b.periodAzimuthal(), 1e-10 * a.periodAzimuthal());
        assertEquals(a.periodPolar(), b.periodPolar(), 1e-10 * a.periodPolar());
        assertEquals(a.advance(), b.advance(), 1e-10);
    }

    @Test void haywardOrbitsAgreeWithTheIntegratedTrajectory() {
        MassFunctionSpacetime st = new MassFunctionSpacetime("hayward", 0.5, MassFunctions.hayward(0.4));
        BatchIntegrator.Config cfg = BatchIntegrator.Config.of(Landmarks.captureRadius(st)).withTolerance(1e-12, 1e-12);
        // equatorial: every radial period is the same, so 10 periods measure it to the integration error
        OrbitElements.Solution eq = OrbitElements.solve(st, 10, 0.3, 0.0);
        OrbitMeasurement.Result m = OrbitMeasurement.measure(st, eq.start(), 10, cfg, 8,
                OrbitMeasurement.keplerPeriod(10, 0.3));
        MinoFrequencies.Result x = MinoFrequencies.compute(st, eq);
        assertEquals(x.periodRadial(), m.periodRadial(), 1e-9 * x.periodRadial());
        assertEquals(x.periodAzimuthal(), m.periodAzimuthal(), 1e-9 * x.periodAzimuthal());
        assertEquals(x.advance(), m.advance(), 1e-9);
        // inclined: the windowed means over 200 radial periods, within their own uncertainty estimate
        OrbitElements.Solution inc = OrbitElements.solve(st, 10, 0.3, Math.toRadians(50));
        OrbitMeasurement.Result mi = OrbitMeasurement.measure(st, inc.start(), 200, cfg, 8,
                OrbitMeasurement.keplerPeriod(10, 0.3));
        MinoFrequencies.Result xi = MinoFrequencies.compute(st, inc);
        assertEquals(xi.periodRadial(), mi.periodRadial(), 1e-6 * xi.periodRadial());
        assertEquals(xi.periodPolar(), mi.periodPolar(), 1e-6 * xi.periodPolar());
        assertEquals(xi.periodAzimuthal(), mi.periodAzimuthal(), 1e-6 * xi.periodAzimuthal());
        assertEquals(xi.advance(), mi.advance(), 1e-6);
    }
}
