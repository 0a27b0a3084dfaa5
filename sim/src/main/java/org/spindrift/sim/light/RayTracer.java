package org.spindrift.sim.light;

import org.hipparchus.util.FastMath;
import org.spindrift.sim.motion.GeodesicEquations;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Integrates one backward null geodesic with {@link GeodesicEquations#affine} (the project's
 * Hamilton equations, MTW 1973 eq. 25.19) and the {@link DormandPrince54} pair. The backward ray
 * carries the reversed momentum q = -p (q_t = +1, q_phi = -L), so it runs along the photon's path
 * from the observer towards the source while the coordinate time decreases; the elapsed
 * coordinate time to a sample is -t.
 *
 * <p>Steps are chosen by the error control (and at most a quarter of r near the hole); samples
 * are placed inside each accepted step by dense output, at most
 * {@link TraceSettings#sampleSpacing} apart, and kept where gas may be ({@link EmissionMask},
 * or the sphere r &lt; emissionRadius without a mask). Each sample keeps the Cartesian position,
 * the delay (elapsed time minus d - 2 M ln(d/M), removing the flat travel time from the start
 * plane and the leading Shapiro logarithm, Shapiro 1964, Phys. Rev. Lett. 13, 789), the physical
 * p_r and p_theta, p_phi, and its midpoint-rule share of d(lambda).
 *
 * <p>One instance per thread; {@link #trace} allocates nothing except when the sample buffer grows.
 */
public final class RayTracer implements DormandPrince54.Rhs {
    private final Spacetime spacetime;
    private final GeodesicEquations equations;
    private final TraceSettings settings;
    private final DormandPrince54 stepper = new DormandPrince54(GeodesicEquations.DIM_AFFINE);
    private final double a2;
    private final double[] y = new double[6], dy = new double[6], yNew = new double[6], dyNew = new double[6],
            ys = new double[6];
    private double qt;
    private double weightScale = 1.0;
    private double rMin, thMin, phMin;
    private final EmissionMask mask;
    private double cx, cy, cz;
    private double qphi;
    private int steps;

    public RayTracer(Spacetime spacetime, TraceSettings settings) {
        this.spacetime = spacetime;
        this.equations = new GeodesicEquations(spacetime);
        this.settings = settings;
        this.a2 = spacetime.spin() * spacetime.spin();
        this.mask = settings.mask();
    }

    /** Cartesian position of state s (x = sqrt(r^2 + a^2) sin(theta) cos(phi), ...) into cx, cy, cz. */
    private void cartesian(double[] s) {
        double r = s[1];
        double st = FastMath.sin(s[2]);
        double rho = FastMath.sqrt(r * r + a2) * st;
        cx = rho * FastMath.cos(s[3]);
        cy = rho * FastMath.sin(s[3]);
        cz = r * FastMath.cos(s[2]);
    }

    @Override public void derivative(double[] state, double[] out) {
        equations.affine(qt, qphi, state, 0, out, 0);
    }

    /** @return the state (t, r, theta, phi, q_r, q_theta) where the last ray ended */
    public double[] lastState() {
        return y;
    }

    /** @return d/d(lambda) of {@link #lastState()} */
    public double[] lastDerivative() {
        return dy;
    }

    /** Scales the affine weights of recorded samples (1 / k^2 for k x k sub-pixel rays). */
    public void setWeightScale(double s) {
        weightScale = s;
    }

    /**
     * Cartesian position (x = sqrt(r^2 + a^2) sin(theta) cos(phi), ...) of the last ray's point of smallest radius.
     *
     * @param out length 3
     */
    public void closestPoint(double[] out) {
        double rho = FastMath.sqrt(rMin * rMin + a2) * FastMath.sin(thMin);
        out[0] = rho * FastMath.cos(phMin);
        out[1] = rho * FastMath.sin(phMin);
        out[2] = rMin * FastMath.cos(thMin);
    }

    /** @return accepted plus rejected steps of the last ray */
    public int lastSteps() {
        return steps;
    }

    /**
     * Traces the backward ray from initial state y0 (see {@link Camera#initialState}).
     *
     * @param angularMomentum the photon's physical p_phi = L
     * @param delayOffset subtracted from the elapsed time to give the stored delay
     * @param out receives the samples inside the emission region (may be null)
     */
    public RayEnd trace(double[] y0, double angularMomentum, double delayOffset, SampleBuffer out) {
        System.arraycopy(y0, 0, y, 0, 6);
        qt = 1.0;
        qphi = -angularMomentum;
        final double rEm = settings.emissionRadius();
        final double rEnd = FastMath.max(rEm, settings.endRadius());
        final double rStop = settings.captureRadius();
        final double rtol = settings.relativeTolerance();
        final double atol = settings.absoluteTolerance();
        // radius of the sphere holding every possible sample (the mask's cube, or the emission sphere)
        final double rSample = mask != null ? FastMath.min(rEm, mask.radius() * FastMath.sqrt(3.0)) : rEm;
        derivative(y, dy);
        double h = 0.01 * y[1];
        boolean periapsisPassed = false;
        steps = 0;
        rMin = y[1];
        thMin = y[2];
        phMin = y[3];
        while (true) {
            double r = y[1];
            double speed = speed(r, y[2], dy);
            // outside the sampling sphere: do not overshoot into it by more than 1 M; inside and
            // near the hole: at most a quarter of r per step (samples come from dense output)
            double hMax = r > rSample ? FastMath.max(1.0, 0.5 * (r - rSample)) / speed : 0.25 * r / speed;
            h = FastMath.min(h, hMax);
            double err = stepper.step(this, y, dy, h, rtol, atol, yNew, dyNew);
            steps++;
            if (steps > settings.maxSteps()) {
                return RayEnd.FAILED;
            }
            if (!(err <= 1.0)) {
                if (!Double.isFinite(err)) {
                    h *= 0.2;
                    if (h < 1.0e-14 * r) {
                        return RayEnd.FAILED;
                    }
                    continue;
                }
                h *= DormandPrince54.factor(err);
                continue;
            }
            double hTaken = h;
            h *= DormandPrince54.factor(err);
            double rn = yNew[1];
            if (rn < rStop) {
                System.arraycopy(yNew, 0, y, 0, 6);
                System.arraycopy(dyNew, 0, dy, 0, 6);
                return RayEnd.CAPTURED;
            }
            if (out != null && FastMath.min(r, rn) < rSample) {
                sampleStep(out, hTaken, speed, speed(rn, yNew[2], dyNew), rEm, delayOffset);
            }
            System.arraycopy(yNew, 0, y, 0, 6);
            System.arraycopy(dyNew, 0, dy, 0, 6);
            if (rn < rMin) {
                rMin = rn;
                thMin = y[2];
                phMin = y[3];
            }
            boolean outward = dy[1] > 0.0;
            if (outward) {
                periapsisPassed = true;
            }
            if (periapsisPassed && outward && rn > rEnd) {
                return RayEnd.ESCAPED;
            }
        }
    }

    /**
     * Samples the accepted step from (y, dy) to (yNew, dyNew) at the midpoints of k equal parts,
     * k = ceil(length / sampleSpacing), with cubic Hermite interpolation of the state from the end
     * values and derivatives (dense output of order 3, e.g. Hairer, Norsett &amp; Wanner 1993,
     * II.6); keeps the samples where gas may be, each with weight h / k (midpoint rule).
     */
    private void sampleStep(SampleBuffer out, double h, double speed0, double speed1, double rEm, double delayOffset) {
        double length = 0.5 * (speed0 + speed1) * h;
        int k = (int) FastMath.max(1, FastMath.ceil(length / settings.sampleSpacing()));
        double w = h / k * weightScale;
        for (int j = 0; j < k; j++) {
            double s = (j + 0.5) / k;
            double s2 = s * s, s3 = s2 * s;
            double h00 = 2 * s3 - 3 * s2 + 1, h10 = (s3 - 2 * s2 + s) * h, h01 = -2 * s3 + 3 * s2, h11 = (s3 - s2) * h;
            for (int c = 0; c < 6; c++) {
                ys[c] = h00 * y[c] + h10 * dy[c] + h01 * yNew[c] + h11 * dyNew[c];
            }
            cartesian(ys);
            boolean emitting = mask != null ? mask.occupied(cx, cy, cz) : ys[1] < rEm;
            if (emitting) {
                // physical p = -q; delay = elapsed coordinate time -t minus the offset
                out.add(cx, cy, cz, -ys[0] - delayOffset, -ys[4], -ys[5], -qphi, w);
            }
        }
    }

    /** Coordinate speed |dx/dlambda| in the flat-space sense, for step limits. */
    private static double speed(double r, double theta, double[] d) {
        double st = FastMath.sin(theta);
        double v2 = d[1] * d[1] + r * r * (d[2] * d[2] + st * st * d[3] * d[3]);
        return FastMath.max(1.0e-3, FastMath.sqrt(v2));
    }

    /** @return the delay offset d + 2 M ln(d / M) for a start plane at distance d */
    public static double delayOffset(double distance) {
        return distance + 2.0 * FastMath.log(distance);
    }
}
