package org.spindrift.sim.light;

import org.hipparchus.util.FastMath;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Single rays through a camera's screen point (alpha, beta), for checks of the tracer against
 * published results: how a ray ends, where the capture boundary (the edge of the shadow) lies
 * along a screen direction, and where a ray first crosses the equatorial plane. One probe per
 * thread (it reuses its tracer and buffers).
 */
public final class ScreenProbe {
    /** Halvings of the bracket when bisecting the capture boundary: 2^-40 of the bracket. */
    public static final int EDGE_HALVINGS = 40;

    private final Spacetime spacetime;
    private final Camera camera;
    private final RayTracer tracer;
    private final double[] y0 = new double[6];
    private final double[] metric = new double[Spacetime.SIZE];
    private final SampleBuffer samples = new SampleBuffer(64);

    /**
     * @param spacetime the metric
     * @param camera the observer's camera (its inclination and start-plane distance matter here)
     * @param settings tracer settings; the emission radius bounds where equator crossings are seen
     */
    public ScreenProbe(Spacetime spacetime, Camera camera, TraceSettings settings) {
        this.spacetime = spacetime;
        this.camera = camera;
        this.tracer = new RayTracer(spacetime, settings);
    }

    /** @return how the backward ray through screen point (alpha, beta) ends */
    public RayEnd end(double alpha, double beta) {
        return trace(alpha, beta, null);
    }

    private RayEnd trace(double alpha, double beta, SampleBuffer out) {
        double l = camera.initialState(spacetime, alpha, beta, y0, metric);
        return tracer.trace(y0, l, RayTracer.delayOffset(camera.distance()), out);
    }

    /**
     * Distance from screen point (alpha0, beta0), inside the shadow, to the capture boundary along
     * the screen direction (cos w, sin w), by bisection of [lo, hi] (a captured ray at lo, an
     * escaping one at hi) over {@link #EDGE_HALVINGS} halvings.
     *
     * @throws IllegalStateException when a ray fails (step budget) during the bisection
     */
    public double captureEdge(double alpha0, double beta0, double w, double lo, double hi) {
        double cw = FastMath.cos(w);
        double sw = FastMath.sin(w);
        for (int it = 0; it < EDGE_HALVINGS; it++) {
            double mid = 0.5 * (lo + hi);
            RayEnd e = end(alpha0 + mid * cw, beta0 + mid * sw);
            if (e == RayEnd.FAILED) {
                throw new IllegalStateException("ray through (" + (alpha0 + mid * cw) + ", " + (beta0 + mid * sw)
                        + ") failed");
            }
            if (e == RayEnd.CAPTURED) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    /**
     * Cylindrical radius sqrt(x^2 + y^2) (M, display coordinates) where the ray through (alpha,
     * beta) first reaches z = 0 inside the emission radius, linear between the two samples around
     * the crossing; +infinity when it does not (samples are spaced by the settings' sample spacing).
     * The ray must start above the plane (inclination below 90 deg).
     */
    public double equatorCrossing(double alpha, double beta) {
        samples.size = 0;
        trace(alpha, beta, samples);
        for (int i = 1; i < samples.size; i++) {
            if (samples.z[i] <= 0 && samples.z[i - 1] > 0) {
                double f = samples.z[i - 1] / (samples.z[i - 1] - samples.z[i]);
                double x = samples.x[i - 1] + f * (samples.x[i] - samples.x[i - 1]);
                double y = samples.y[i - 1] + f * (samples.y[i] - samples.y[i - 1]);
                return FastMath.hypot(x, y);
            }
        }
        return Double.POSITIVE_INFINITY;
    }
}
