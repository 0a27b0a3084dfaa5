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
    /** Two quadrature branches on the same metric: each converges to about 1e-12 relative (our choice: 1e-10). */
    private static final double SAME_METRIC_REL = 1e-10;
    /**
     * Equatorial orbit over 10 radial periods at integration tolerance 1e-12: phase error about 1e-11 per
     * period.
     */
    private static final double EQUATORIAL_REL = 1e-9;
    /**
     * Inclined orbit: windowed means over 200 radial periods fluctuate with the incommensurate polar phase,
     * about 1e-7.
     */
    private static final double INCLINED_REL = 1e-6;

    @Test void generalRadialBranchAgreesWithTheKerrFactorisation() {
        // same metric, named differently, so the general branch (R divided by its turning-point factors) is used
        MassFunctionSpacetime kerr = new MassFunctionSpacetime("kerr", 0.8, MassFunctions.constant());
        MassFunctionSpacetime general = new MassFunctionSpacetime("kerr-as-mass-function", 0.8, MassFunctions.constant());
        OrbitElements.Solution s = OrbitElements.solve(kerr, 9, 0.5, Math.toRadians(35));
        MinoFrequencies.Result a = MinoFrequencies.compute(kerr, s);
        MinoFrequencies.Result b = MinoFrequencies.compute(general, s);
        assertEquals(a.periodRadial(), b.periodRadial(), SAME_METRIC_REL * a.periodRadial());
        assertEquals(a.periodAzimuthal(), b.periodAzimuthal(), SAME_METRIC_REL * a.periodAzimuthal());
        assertEquals(a.periodPolar(), b.periodPolar(), SAME_METRIC_REL * a.periodPolar());
        assertEquals(a.advance(), b.advance(), SAME_METRIC_REL);
    }

    @Test void haywardOrbitsAgreeWithTheIntegratedTrajectory() {
        MassFunctionSpacetime st = new MassFunctionSpacetime("hayward", 0.5, MassFunctions.hayward(0.4));
        BatchIntegrator.Config cfg = BatchIntegrator.Config.of(Landmarks.captureRadius(st)).withTolerance(1e-12, 1e-12);
        // equatorial: every radial period is the same, so 10 periods measure it to the integration error
        OrbitElements.Solution eq = OrbitElements.solve(st, 10, 0.3, 0.0);
        OrbitMeasurement.Result m = OrbitMeasurement.measure(st, eq.start(), 10, cfg, 8,
                OrbitMeasurement.keplerPeriod(10, 0.3));
        MinoFrequencies.Result x = MinoFrequencies.compute(st, eq);
        assertEquals(x.periodRadial(), m.periodRadial(), EQUATORIAL_REL * x.periodRadial());
        assertEquals(x.periodAzimuthal(), m.periodAzimuthal(), EQUATORIAL_REL * x.periodAzimuthal());
        assertEquals(x.advance(), m.advance(), EQUATORIAL_REL);
        // inclined: the windowed means over 200 radial periods, within their own uncertainty estimate
        OrbitElements.Solution inc = OrbitElements.solve(st, 10, 0.3, Math.toRadians(50));
        OrbitMeasurement.Result mi = OrbitMeasurement.measure(st, inc.start(), 200, cfg, 8,
                OrbitMeasurement.keplerPeriod(10, 0.3));
        MinoFrequencies.Result xi = MinoFrequencies.compute(st, inc);
        assertEquals(xi.periodRadial(), mi.periodRadial(), INCLINED_REL * xi.periodRadial());
        assertEquals(xi.periodPolar(), mi.periodPolar(), INCLINED_REL * xi.periodPolar());
        assertEquals(xi.periodAzimuthal(), mi.periodAzimuthal(), INCLINED_REL * xi.periodAzimuthal());
        assertEquals(xi.advance(), mi.advance(), INCLINED_REL);
    }
}
