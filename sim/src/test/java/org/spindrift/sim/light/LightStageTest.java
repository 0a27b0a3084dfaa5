package org.spindrift.sim.light;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.CircularOrbits;
import org.spindrift.sim.spacetime.Spacetime;

/** End-to-end checks of rays, slow-light emission, frames and instrument effects. */
class LightStageTest {
    /** Centroid radius of an extended spot (sigma 0.3 M) imaged on 64 pixels of 0.47 M: 2 % (our choice). */
    private static final double IMAGE_RADIUS_REL = 0.02;
    /** Centroid period from the total turned angle over more than a period at 40 frames per period (our choice). */
    private static final double PERIOD_FROM_TURNS_REL = 0.005;
    /** g at the sample nearest the equator (spacing 0.01 M) of a ray traced at relative tolerance 1e-9. */
    private static final double FACE_ON_REDSHIFT = 1.0e-4;
    /** Doppler flux ratio of a 3 M spot at r = 400 M: light-bending and the spot's extent change it by about 1 %. */
    private static final double BOOST_RATIO_REL = 0.03;
    /** Omega of the test history (root of the metric code) against the closed form: far above rounding. */
    private static final double CLOSED_FORM_REL = 1e-9;
    /** Centroid period from zero crossings interpolated between frames 3 M apart (our choice). */
    private static final double PERIOD_FROM_CROSSINGS_REL = 0.02;
    /**
     * Straight-line delays against -n.x in float samples of order 1e4 M from the start plane (float: 1e-3
     * relative of 10 M).
     */
    private static final double ROEMER_DELAY = 1e-4;

    private static LightSettings settings(double inc, double fov, int n, double cadence, double steady) {
        return new LightSettings(inc, 0.0, fov, n, cadence, true, 1.0e6, 1.0e-3, 0.0, steady, 0.0, 1.0, 7L);
    }

    @Test
    void faceOnCircularOrbitImageRadiusPeriodSteadySourceAndSense() {
        Spacetime st = LightTestSupport.kerr(0.0);
        double re = 10.0;
        double period = 2 * FastMath.PI * FastMath.pow(re, 1.5);   // coordinate period 2 pi r^1.5 (Kepler; exact in Schwarzschild)
        CircularSpotHistory h = new CircularSpotHistory(st, re, 0.0, 0.3, 300, 0.0, 1.6 * period, 200, 1.0, 3L);
        LightSettings s = settings(0.0, 30.0, 64, period / 40.0, 1.0);
        LightResult res = LightStage.run(s, st, LightTestSupport.captureRadius(0.0), h, 2);
        double expected = SchwarzschildRays.faceOnImpactParameter(re);
        Camera cam = res.camera();
        int n = cam.pixels();
        double prevAngle = Double.NaN;
        double turned = 0;
        int first = -1, last = -1;
        for (int f = 0; f < res.timesM().length; f++) {
            if (!res.covered(f)) {
                continue;
            }
            first = first < 0 ? f : first;
            last = f;
            // centroid of the primary image: pixels outside the photon-ring region (b > 8 M)
            float[] img = res.images()[f];
            double w = 0, sx = 0, sy = 0;
            for (int row = 0; row < n; row++) {
                for (int col = 0; col < n; col++) {
                    double x = cam.skyX(col), y = cam.skyY(row);
                    if (FastMath.hypot(x, y) > 8.0) {
                        w += img[row * n + col];
                        sx += img[row * n + col] * x;
                        sy += img[row * n + col] * y;
                    }
                }
            }
            double cx = sx / w, cy = sy / w;
            // Darwin 1959 / Luminet 1979 quadrature (SchwarzschildRays.faceOnImpactParameter)
            assertEquals(expected, FastMath.hypot(cx, cy), IMAGE_RADIUS_REL * expected,
                    "primary image radius, frame " + f);
            double pa = FastMath.atan2(cx, cy);              // position angle, north through east
            if (!Double.isNaN(prevAngle)) {
                turned += FastMath.IEEEremainder(pa - prevAngle, 2 * FastMath.PI);
            }
            prevAngle = pa;
        }
        assertTrue(last - first > 20, "enough covered frames");
        double span = res.timesM()[last] - res.timesM()[first];
        // prograde orbit, i < 90: the position angle increases (counter-clockwise, north up, east left)
        assertTrue(turned > 0, "prograde orbit turns north through east");
        // centroid period equals the coordinate orbital period 2 pi r^1.5
        assertEquals(period, 2 * FastMath.PI * span / turned, PERIOD_FROM_TURNS_REL * period, "centroid period");
        double r0 = FastMath.hypot(res.moments().get(first).x(), res.moments().get(first).y());
        // steady source with flux ratio f = 1: the track shrinks by 1/(1+f) (common practice, no source)
        for (int f = first; f <= last; f++) {
            FrameMoments m = res.moments().get(f);
            assertEquals(0.5 * FastMath.hypot(m.x(), m.y()), FastMath.hypot(res.steadyX()[f], res.steadyY()[f]),
                    0.01 * r0, "steady source shrinks the track");
        }
    }

    @Test
    void faceOnRedshiftIsSqrtOneMinusThreeMOverR() {
        Spacetime st = LightTestSupport.kerr(0.0);
        double re = 8.0;
        Camera cam = new Camera(0.0, 0.0, 30.0, 64, 1.0e4);
        TraceSettings ts = TraceSettings.of(30.0, LightTestSupport.captureRadius(0.0), 0.01, true);
        double b = SchwarzschildRays.faceOnImpactParameter(re);
        SampleBuffer buf = new SampleBuffer(64);
        RayTracer tr = new RayTracer(st, ts);
        double[] y0 = new double[6];
        double l = cam.initialState(st, b, 0.0, y0, new double[Spacetime.SIZE]);
        tr.trace(y0, l, 0.0, buf);
        int best = 0;
        for (int i = 0; i < buf.size; i++) {
            if (FastMath.abs(buf.z[i]) < FastMath.abs(buf.z[best])) {
                best = i;
            }
        }
        double ut = CircularOrbits.ut(st, re, true);
        double om = CircularOrbits.omega(st, re, true);
        double g = Redshift.g(buf.pr[best], buf.pth[best], l, ut, 0.0, 0.0, ut * om);
        // face-on circular orbit: transverse Doppler plus gravitational redshift,
        // g = sqrt(1 - 3M/r) (e.g. Luminet 1979, A&A 75, 228, eq. 17 with the photon's L = 0)
        assertEquals(FastMath.sqrt(1.0 - 3.0 / re), g, FACE_ON_REDSHIFT, "face-on redshift at r = " + re);
    }

    @Test
    void edgeOnApproachingSideBrighterBySpecialRelativisticBoost() {
        Spacetime st = LightTestSupport.kerr(0.0);
        double re = 400.0;
        double alpha = 1.0;
        double omega = CircularOrbits.omega(st, re, true);
        double tHalf = 1200.0;
        // the centre passes phi = -90 deg (approaching the observer at phi = 0) or +90 deg (receding) at t = 0
        double[] flux = new double[2];
        double[] east = new double[2];
        for (int side = 0; side < 2; side++) {
            double phase = (side == 0 ? -0.5 : 0.5) * FastMath.PI;
            CircularSpotHistory h = new CircularSpotHistory(st, re, phase, 3.0, 60, -tHalf, tHalf, 60, alpha, 5L);
            LightSettings s = settings(90.0, 900.0, 64, 100.0, 0.0);
            LightResult res = LightStage.run(s, st, LightTestSupport.captureRadius(0.0), h, 2);
            int mid = res.timesM().length / 2;
            flux[side] = res.moments().get(mid).flux();
            east[side] = res.moments().get(mid).x();
        }
        double v = re * omega;                                   // coordinate speed, ~ sqrt(M/r)
        // Doppler factors delta = 1 / (gamma (1 -+ v)) along the line of sight; a point source's
        // flux scales as delta^(3+alpha) (common practice, e.g. Rybicki & Lightman 1979, sect. 4.9)
        double expected = FastMath.pow((1 + v) / (1 - v), 3 + alpha);
        assertTrue(flux[0] > flux[1], "approaching side brighter");
        assertEquals(expected, flux[0] / flux[1], BOOST_RATIO_REL * expected, "approaching / receding flux ratio");
        // with PA = 0 the approaching side of a prograde orbit seen edge-on is east (left)
        assertTrue(east[0] > 0 && east[1] < 0, "approaching side east");
    }

    @Test
    void inclinedCentroidPeriodEqualsOrbitalPeriodAndThreadsDoNotMatter() {
        double a = 0.5;
        Spacetime st = LightTestSupport.kerr(a);
        double re = 8.0;
        CircularSpotHistory h = new CircularSpotHistory(st, re, 0.0, 0.4, 200, 0.0, 520.0, 160, 1.0, 9L);
        double period = 2 * FastMath.PI / h.omega();
        LightSettings s = settings(60.0, 24.0, 48, 3.0, 0.0);
        LightResult r1 = LightStage.run(s, st, LightTestSupport.captureRadius(a), h, 1);
        LightResult r2 = LightStage.run(s, st, LightTestSupport.captureRadius(a), h, 2);
        for (int f = 0; f < r1.images().length; f++) {
            assertArrayEquals(r1.images()[f], r2.images()[f], "frame " + f + " independent of threads");
        }
        // upward zero crossings of x - mean(x): their spacing is the centroid period
        double[] t = r1.timesM();
        double mean = 0;
        int covered = 0;
        for (int f = 0; f < t.length; f++) {
            if (r1.covered(f)) {
                mean += r1.moments().get(f).x();
                covered++;
            }
        }
        mean /= covered;
        double first = Double.NaN, last = Double.NaN;
        int crossings = 0;
        for (int f = 1; f < t.length; f++) {
            if (!r1.covered(f - 1) || !r1.covered(f)) {
                continue;
            }
            double x0 = r1.moments().get(f - 1).x() - mean, x1 = r1.moments().get(f).x() - mean;
            if (x0 < 0 && x1 >= 0) {
                double tc = t[f - 1] + (t[f] - t[f - 1]) * (-x0) / (x1 - x0);
                if (Double.isNaN(first)) {
                    first = tc;
                } else {
                    crossings++;
                }
                last = tc;
            }
        }
        assertTrue(crossings >= 1, "at least two upward crossings");
        // Kerr prograde Omega = 1 / (r^1.5 + a) (Bardeen, Press & Teukolsky 1972, eq. 2.16)
        double kerrPeriod = 2 * FastMath.PI * (FastMath.pow(re, 1.5) + a);
        assertEquals(kerrPeriod, period, CLOSED_FORM_REL * period);
        assertEquals(kerrPeriod, (last - first) / crossings, PERIOD_FROM_CROSSINGS_REL * kerrPeriod, "centroid period");
    }

    @Test
    void straightLinesShowTheRingUnbentWithDelaysKept() {
        Spacetime st = LightTestSupport.kerr(0.0);
        double re = 10.0;
        double period = 2 * FastMath.PI * FastMath.pow(re, 1.5);
        CircularSpotHistory h = new CircularSpotHistory(st, re, 0.0, 0.3, 200, 0.0, 1.2 * period, 150, 1.0, 4L);
        LightSettings s = new LightSettings(0.0, 0.0, 30.0, 64, period / 30.0, false, 1.0e6, 1.0e-3, 0.0, 0.0, 0.0, 1.0, 7L);
        LightResult res = LightStage.run(s, st, LightTestSupport.captureRadius(0.0), h, 2);
        int checked = 0;
        for (int f = 0; f < res.timesM().length; f++) {
            if (res.covered(f)) {
                FrameMoments m = res.moments().get(f);
                // no bending: the face-on image of a ring of radius r is a circle of radius r
                // (flat space, common practice); the lensed image is larger (Darwin 1959)
                assertEquals(re, FastMath.hypot(m.x(), m.y()), IMAGE_RADIUS_REL * re, "straight-line image radius");
                checked++;
            }
        }
        assertTrue(checked > 10, "covered frames");
        // delays kept: on straight lines the delay of a point x is the Roemer delay -n.x, n the unit
        // vector towards the observer (flat-space light travel time, common practice)
        LightSettings s2 = new LightSettings(60.0, 0.0, 30.0, 32, 5.0, false, 1.0e6, 1.0e-3, 0.0, 0.0, 0.0, 1.0, 7L);
        Camera cam = s2.camera();
        TraceSettings ts = LightStage.traceSettings(h, st, cam, LightTestSupport.captureRadius(0.0), 30.0, false);
        RayTable t = RayTable.trace(st, cam, ts, 1);
        double[] p = new double[6];
        cam.startPoint(0.0, 0.0, p);
        assertTrue(t.samples() > 100, "samples on the orbit");
        double spread = t.delayRange()[1] - t.delayRange()[0];
        for (int i = 0; i < t.samples(); i++) {
            double roemer = -(t.x[i] * p[3] + t.y[i] * p[4] + t.z[i] * p[5]);
            assertEquals(roemer, t.delay[i], ROEMER_DELAY, "Roemer delay of sample " + i);
        }
        // across the ring the delays span about 2 r sin(i)
        assertTrue(spread > 2 * (re - 1) * FastMath.sin(FastMath.toRadians(60.0)), "delay spread " + spread);
    }
}
