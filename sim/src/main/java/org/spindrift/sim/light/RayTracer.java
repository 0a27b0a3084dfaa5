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
 * <p>Inside the emission region the step is limited so that samples are at most
 * {@link TraceSettings#sampleSpacing} apart (coordinate length), and outside it so that a ray
 * does not overshoot the boundary by more than that. Each sample keeps the Cartesian position,
 * the delay (elapsed time minus d - 2 M ln(d/M), removing the flat travel time from the start
 * plane and the leading Shapiro logarithm, Shapiro 1964, Phys. Rev. Lett. 13, 789), the physical
 * p_r and p_theta, and its trapezoid-rule share of d(lambda).
 *
 * <p>One instance per thread; {@link #trace} allocates nothing except when the sample buffer grows.
 */
public final class RayTracer implements DormandPrince54.Rhs {
    private final Spacetime spacetime;
    private final GeodesicEquations equations;
    private final TraceSettings settings;
    private final DormandPrince54 stepper = new DormandPrince54(GeodesicEquations.DIM_AFFINE);
    private final double a2;
    private final double[] y = new double[6], dy = new double[6], yNew = new double[6], dyNew = new double[6];
    private double qt;
    private double weightScale = 1.0;
    private double rMin, thMin, phMin;
    private double qphi;
    private int steps;

    public RayTracer(Spacetime spacetime, TraceSettings settings) {
        this.spacetime = spacetime;
        this.equations = new GeodesicEquations(spacetime);
        this.settings = settings;
        this.a2 = spacetime.spin() * spacetime.spin();
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
     * Cartesian position (DESIGN section 3 map) of the last ray's point of smallest radius.
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
        final double rStop = settings.stopRadius();
        final double ds = settings.sampleSpacing();
        final double rtol = settings.relativeTolerance();
        final double atol = settings.absoluteTolerance();
        derivative(y, dy);
        double h = 0.01 * y[1];
        boolean inside = false;
        boolean periapsisPassed = false;
        steps = 0;
        rMin = y[1];
        thMin = y[2];
        phMin = y[3];
        while (true) {
            double r = y[1];
            double speed = speed(r, y[2], dy);
            double hMax = r < rEm ? ds / speed : FastMath.max(ds, 0.5 * (r - rEm)) / speed;
            // never step further than a fraction of r (keeps the step near the hole resolved)
            hMax = FastMath.min(hMax, 0.25 * r / speed);
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
            System.arraycopy(yNew, 0, y, 0, 6);
            System.arraycopy(dyNew, 0, dy, 0, 6);
            double rn = y[1];
            if (rn < rMin) {
                rMin = rn;
                thMin = y[2];
                phMin = y[3];
            }
            if (rn < rStop) {
                return RayEnd.CAPTURED;
            }
            boolean outward = dy[1] > 0.0;
            if (outward) {
                periapsisPassed = true;
            }
            if (periapsisPassed && outward && rn > rEnd) {
                return RayEnd.ESCAPED;
            }
            if (rn < rEm) {
                if (out != null) {
                    if (inside) {
                        out.addWeightToLast(0.5 * hTaken * weightScale);
                    }
                    record(out, 0.5 * hTaken * weightScale, delayOffset);
                }
                inside = true;
            } else {
                if (inside && out != null) {
                    out.addWeightToLast(0.5 * hTaken * weightScale);
                }
                inside = false;
            }
        }
    }

    private void record(SampleBuffer out, double weight, double delayOffset) {
        double r = y[1];
        double st = FastMath.sin(y[2]);
        double ct = FastMath.cos(y[2]);
        double sp = FastMath.sin(y[3]);
        double cp = FastMath.cos(y[3]);
        double rho = FastMath.sqrt(r * r + a2) * st;
        // DESIGN section 3 Cartesian map; physical p = -q
        out.add(rho * cp, rho * sp, r * ct, -y[0] - delayOffset, -y[4], -y[5], -qphi, weight);
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
