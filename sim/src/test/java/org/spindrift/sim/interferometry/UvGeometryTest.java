package org.spindrift.sim.interferometry;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.Test;
import org.spindrift.shared.scenario.Interferometer;

/** (u, v, w) tracks and elevations against textbook cases. */
class UvGeometryTest {
    @Test void eastWestBaselineTracesAnEllipseWithAxisRatioSinDec() {
        // Thompson, Moran & Swenson 2017, section 4.1: an east-west baseline (L_X = L_Z = 0) gives
        // u = L cos H, v = L sin(dec) sin H, an ellipse with axes L and L sin(dec) centred on the origin
        double lat = FastMath.toRadians(35), z = TestArrays.EARTH * FastMath.sin(lat);
        double rho = TestArrays.EARTH * FastMath.cos(lat);
        double halfAngle = 0.1;   // rad of longitude either side of longitude 0
        Interferometer.Station a = new Interferometer.Station("W", rho * FastMath.cos(halfAngle),
                -rho * FastMath.sin(halfAngle), z, 1000, 10);
        Interferometer.Station b = new Interferometer.Station("E", rho * FastMath.cos(halfAngle),
                rho * FastMath.sin(halfAngle), z, 1000, 10);
        ArrayGeometry g = new ArrayGeometry(List.of(a, b));
        double lambda = 1.3e-3;
        double len = 2 * rho * FastMath.sin(halfAngle) / lambda;
        for (double decDeg : new double[] {15, 40, 75, -30}) {
            double dec = FastMath.toRadians(decDeg);
            double[] uvw = new double[3];
            for (int k = 0; k < 48; k++) {
                double h = 2 * FastMath.PI * k / 48;
                g.uvw(0, 1, h, dec, lambda, uvw);
                double e = FastMath.pow(uvw[0] / len, 2) + FastMath.pow(uvw[1] / (len * FastMath.sin(dec)), 2);
                assertEquals(1.0, e, 1e-12, "on the ellipse at dec " + decDeg + ", H " + h);
                assertEquals(len * FastMath.cos(h), uvw[0], 1e-6 * len);
                // w: the projection on the source direction, -L cos(dec) sin H
                assertEquals(-len * FastMath.cos(dec) * FastMath.sin(h), uvw[2], 1e-6 * len);
            }
        }
    }

    @Test void polarBaselineGivesAFixedPointAndLengthIsConserved() {
        // a baseline along Z (north-south through the axis) projects to v = L cos(dec), u = 0 at every H
        Interferometer.Station a = new Interferometer.Station("S", 0, 0, -6.3e6, 1000, 0);
        Interferometer.Station b = new Interferometer.Station("N", 0, 0, 6.3e6, 1000, 0);
        ArrayGeometry g = new ArrayGeometry(List.of(a, b));
        double[] uvw = new double[3];
        for (double h = -3; h < 3; h += 0.7) {
            g.uvw(0, 1, h, FastMath.toRadians(50), 1.0, uvw);
            assertEquals(0.0, uvw[0], 1e-6);
            assertEquals(12.6e6 * FastMath.cos(FastMath.toRadians(50)), uvw[1], 1e-3);
            assertEquals(12.6e6, FastMath.sqrt(uvw[0] * uvw[0] + uvw[1] * uvw[1] + uvw[2] * uvw[2]), 1e-3,
                    "|(u, v, w)| = |L| (rotation)");
        }
    }

    @Test void elevationAtTransitIsNinetyMinusZenithDistance() {
        // at the meridian (local hour angle 0) el = 90 deg - |latitude - dec| (common practice, no source);
        // at hour angle 6 h on the equator a source at dec 0 is on the horizon
        Interferometer.Station s = TestArrays.station("P", 30, 45, 1000);
        ArrayGeometry g = new ArrayGeometry(List.of(s, TestArrays.station("Q", 0, 0, 1000)));
        double hLocal0 = -FastMath.toRadians(45);   // Greenwich hour angle when the source transits at 45 deg east
        assertEquals(90 - 10, FastMath.toDegrees(g.elevation(0, hLocal0, FastMath.toRadians(20))), 1e-9);
        assertEquals(90 - 50, FastMath.toDegrees(g.elevation(0, hLocal0, FastMath.toRadians(-20))), 1e-9);
        assertEquals(0.0, FastMath.toDegrees(g.elevation(1, FastMath.PI / 2, 0.0)), 1e-9);
    }

    @Test void hourAngleAdvancesOneTurnPerSiderealDay() {
        ObservingSetup o = TestArrays.setup(TestArrays.five(1000), 0, 0, 1);
        // 86164.0905 s of solar time per sidereal day (Astronomical Almanac; recalled from memory); 10 s per M
        double h0 = o.hourAngle(0), h1 = o.hourAngle(86164.0905 / 10.0);
        assertEquals(2 * FastMath.PI, h1 - h0, 1e-6);
    }

    @Test void samplesKeepOnlyPairsAboveBothElevationLimits() {
        ObservingSetup o = TestArrays.setup(TestArrays.five(1000), 0, 0, 1);
        double[] t = new double[200];
        for (int f = 0; f < t.length; f++) {
            t[f] = f * 432.0;   // 72 min steps over 10 days of hour angle coverage
        }
        UvSampling s = UvSampling.of(o, t);
        boolean dropped = false;
        for (int f = 0; f < t.length; f++) {
            double h = o.hourAngle(t[f]);
            int up = 0;
            for (int i = 0; i < 5; i++) {
                up += o.array().elevation(i, h, o.declination()) >= o.array().elevationLimit(i) ? 1 : 0;
            }
            assertEquals(up * (up - 1) / 2, s.frameStart[f + 1] - s.frameStart[f], "pairs at frame " + f);
            dropped |= up < 5;
        }
        assertTrue(dropped, "some frames have stations below their limit");
        for (int k = 0; k < s.size(); k++) {
            assertTrue(s.elevation1[k] >= FastMath.toRadians(10) && s.elevation2[k] >= FastMath.toRadians(10));
        }
    }
}
