package org.spindrift.sim.light;

import org.hipparchus.util.FastMath;
import org.spindrift.sim.motion.GeodesicEquations;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.Spacetime;
import org.spindrift.sim.spacetime.Trig;

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
 * <p>For Kerr and the mass-function family (unless {@link TraceSettings#generalPath} is set) the
 * ray is traced with the separated equations in Mino time instead ({@link MinoTimeEquations}):
 * the same Dormand-Prince pair and step rules on a right-hand side without trigonometry and
 * without the metric's 15 components, whose r and theta parts decouple and stay regular through
 * the turning points; samples and results are converted to the same quantities (physical p_r,
 * p_theta, d(lambda) = Sigma d(sigma)). The Johannsen-Psaltis family always takes the general path.
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
    /** separated equations in Mino time, or null on the general path */
    private final MinoTimeEquations mino;
    private final double spin;
    private double uMin;
    private boolean lastSeparated;
    /** emission, end, stop and sampling radii and tolerances from the settings */
    private final double rEm, rEnd, rStop, rtol, atol, rSample;
    /**
     * Smallest sin^2(theta) = 1 - u^2 the separated path accepts (about 0.6 deg from the axis):
     * closer to the axis L / (1 - u^2) turns phi quickly and the rounding of 1 - u^2 grows, and
     * the separated path's crossing points were measured to err by up to 2e-3 M there (at
     * tolerance 1e-8, against 3e-5 M elsewhere); such rays (near-face-on views, rays passing
     * over the poles) are traced on the general path.
     */
    static final double POLE_LIMIT = 1.0e-4;
    /** Cartesian position and derivative at the start (c0) and end (c1) of the step being sampled */
    private double[] c0 = new double[6], c1 = new double[6];
    /** c0 holds the current state's Cartesian values (the last sampled step's end) */
    private boolean cartesianValid;
    private final double[] ym = new double[6], dym = new double[6], ymNew = new double[6], dymNew = new double[6];

    public RayTracer(Spacetime spacetime, TraceSettings settings) {
        this.spacetime = spacetime;
        this.equations = new GeodesicEquations(spacetime);
        this.settings = settings;
        this.spin = spacetime.spin();
        this.a2 = spin * spin;
        this.mask = settings.mask();
        this.mino = !settings.generalPath() && spacetime instanceof MassFunctionSpacetime m
                ? new MinoTimeEquations(m) : null;
        this.rEm = settings.emissionRadius();
        this.rEnd = FastMath.max(rEm, settings.endRadius());
        this.rStop = settings.captureRadius();
        this.rtol = settings.relativeTolerance();
        this.atol = settings.absoluteTolerance();
        // radius of the sphere holding every possible sample (the mask's cube, or the emission sphere)
        this.rSample = mask != null ? FastMath.min(rEm, mask.radius() * FastMath.sqrt(3.0)) : rEm;
    }

    /** @return true when the last ray was traced with the separated equations (not the general path) */
    public boolean lastSeparated() {
        return lastSeparated;
    }

    /** @return true when rays go through the separated equations in Mino time where they can */
    public boolean separated() {
        return mino != null;
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
        lastSeparated = false;
        // L = 0 exactly: the ray may cross the polar axis, where phi jumps by pi, which the
        // cos(theta) variable does not see; such rays take the general path
        if (mino != null && angularMomentum != 0.0 && poleGap(y0, angularMomentum) > 4.0 * POLE_LIMIT) {
            int before = out == null ? 0 : out.size;
            RayEnd e = traceSeparated(y0, angularMomentum, delayOffset, out);
            if (e != null) {
                lastSeparated = true;
                return e;
            }
            // the ray came within sin^2(theta) < POLE_LIMIT of the polar axis: trace it again on the general path
            if (out != null) {
                out.size = before;
            }
            int separatedSteps = steps;
            RayEnd g = traceGeneral(y0, angularMomentum, delayOffset, out);
            steps += separatedSteps;
            return g;
        }
        return traceGeneral(y0, angularMomentum, delayOffset, out);
    }

    /**
     * 1 - u_max^2 for the ray starting at y0: u_max^2 is the larger root x of U = 0, i.e. of
     * a^2 x^2 - B x - Q = 0 with B = a^2 - Q - L^2 ({@link MinoTimeEquations}), taken in the form
     * without cancellation; the ray never comes closer to the axis than sin^2(theta) = 1 - u_max^2.
     */
    private double poleGap(double[] y0, double l) {
        double s = Trig.sin(y0[2]);
        double c = Trig.cos(y0[2]);
        double q = y0[5] * y0[5] + c * c * (l * l / (s * s) - a2);
        double b = a2 - q - l * l;
        double x;
        if (a2 == 0.0) {
            x = q / (q + l * l);
        } else {
            double root = Math.sqrt(FastMath.max(0.0, b * b + 4.0 * a2 * q));
            x = b >= 0.0 ? (b + root) / (2.0 * a2) : 2.0 * q / (root - b);
        }
        return 1.0 - x;
    }

    private RayEnd traceGeneral(double[] y0, double angularMomentum, double delayOffset, SampleBuffer out) {
        System.arraycopy(y0, 0, y, 0, 6);
        qt = 1.0;
        qphi = -angularMomentum;
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
     * {@link #trace} with the separated equations in Mino time ({@link MinoTimeEquations}): the
     * state (tau, x = 1/r, u = cos theta, phi, v_x, v_u) starts from the camera's affine state with
     * v_x = -D(x) q_r and v_u = -sin(theta) q_theta (Sigma d/dlambda = d/dsigma, dx = -x^2 dr) and
     * the photon's Carter constant Q = p_theta^2 + cos^2(theta) (L^2 / sin^2(theta) - a^2)
     * (Carter 1968, E = 1). Step rules as on the general path: inside the sampling sphere at most a
     * quarter of r per step; outside, at most half the remaining distance to it in x (or the x
     * width of 1 M at its surface).
     *
     * @return how the ray ended, or null when it came so close to the polar axis
     *     (sin^2(theta) &lt; {@link #POLE_LIMIT}) that 1 - u^2 loses precision: the caller retraces it
     */
    private RayEnd traceSeparated(double[] y0, double angularMomentum, double delayOffset, SampleBuffer out) {
        final double th0 = y0[2];
        final double s0 = Trig.sin(th0);
        final double c0 = Trig.cos(th0);
        final double l = angularMomentum;
        final double carter = y0[5] * y0[5] + c0 * c0 * (l * l / (s0 * s0) - a2);
        mino.setConstants(l, carter);
        qt = 1.0;
        qphi = -l;
        final double x0 = 1.0 / y0[1];
        ym[0] = y0[0] - mino.branch() * MinoTimeEquations.singularTime(x0);
        ym[1] = x0;
        ym[2] = c0;
        ym[3] = y0[3];
        ym[4] = -mino.d(x0) * y0[4];
        ym[5] = -s0 * y0[5];
        final double xSample = 1.0 / rSample;
        final double xEnd = 1.0 / rEnd;
        mino.derivative(ym, dym);
        cartesianValid = false;
        // a tenth of the way in x to the sampling sphere (or to r = 2 M when there is none)
        double h = 0.1 * (FastMath.min(xSample, 0.5) - x0) / FastMath.max(1.0e-3, FastMath.abs(ym[4]));
        boolean periapsisPassed = false;
        boolean rejected = false;
        boolean tailChecked = false;
        final double innerLimit = mask != null ? mask.innerRadius() * mask.innerRadius() : 0.0;
        steps = 0;
        rMin = y0[1];
        uMin = ym[2];
        phMin = ym[3];
        RayEnd end;
        while (true) {
            double x = ym[1];
            double r = 1.0 / x;
            double speed = minoSpeed(x, ym[2], dym);
            double hMax = r > rSample ? FastMath.max(0.5 * (xSample - x), xSample * xSample) / FastMath.abs(dym[1])
                    : 0.25 * r / speed;
            if (dym[1] < 0.0 && xEnd < x) {
                // outwards: aim at x = xEnd / 2, so the last step lands beyond the end radius but
                // not beyond infinity (x = 0)
                hMax = FastMath.min(hMax, (x - 0.5 * xEnd) / -dym[1]);
            }
            h = FastMath.min(h, hMax);
            double err = stepper.step(mino, ym, dym, h, rtol, atol, ymNew, dymNew);
            steps++;
            if (steps > settings.maxSteps()) {
                end = RayEnd.FAILED;
                break;
            }
            if (!(err <= 1.0)) {
                if (!Double.isFinite(err)) {
                    h *= 0.2;
                    if (h * speed < 1.0e-14 * r) {
                        end = RayEnd.FAILED;
                        break;
                    }
                    continue;
                }
                h *= DormandPrince54.factor(err);
                rejected = true;
                continue;
            }
            double hTaken = h;
            // no growth right after a rejection (Hairer, Norsett & Wanner 1993, II.4): where the
            // admissible step keeps shrinking (the approach to the horizon) growth alternates with
            // rejections
            h *= rejected ? FastMath.min(1.0, DormandPrince54.factor(err)) : DormandPrince54.factor(err);
            rejected = false;
            if (!(1.0 - ymNew[2] * ymNew[2] >= POLE_LIMIT)) {
                return null;
            }
            double rn = 1.0 / ymNew[1];
            if (!(rn > 0.0) && ymNew[4] < 0.0) {
                System.arraycopy(ymNew, 0, ym, 0, 6);
                System.arraycopy(dymNew, 0, dym, 0, 6);
                end = RayEnd.ESCAPED;           // through x = 0: beyond any end radius
                break;
            }
            if (!(rn > 0.0) || rn < rStop) {
                System.arraycopy(ymNew, 0, ym, 0, 6);
                System.arraycopy(dymNew, 0, dym, 0, 6);
                end = RayEnd.CAPTURED;
                break;
            }
            boolean sampled = out != null && FastMath.min(r, rn) < rSample;
            if (sampled) {
                sampleSeparated(out, hTaken, speed, minoSpeed(ymNew[1], ymNew[2], dymNew), rEm, delayOffset);
                double[] swap = this.c0;
                this.c0 = c1;
                c1 = swap;
            }
            cartesianValid = sampled;
            double branch = ymNew[4] > 0.0 ? -1.0 : 1.0;
            if (branch != mino.branch() && ym[4] > 0.0) {
                periapsis(hTaken);
            }
            System.arraycopy(ymNew, 0, ym, 0, 6);
            System.arraycopy(dymNew, 0, dym, 0, 6);
            if (branch != mino.branch()) {
                // radial turning point passed: move the split-off part of t to the other branch
                // (t = tau + s F(x) unchanged) and re-evaluate the derivative of tau
                ym[0] += (mino.branch() - branch) * MinoTimeEquations.singularTime(ym[1]);
                mino.setBranch(branch);
                mino.derivative(ym, dym);
            }
            if (rn < rMin) {
                rMin = rn;
                uMin = ym[2];
                phMin = ym[3];
            }
            boolean outward = ym[4] < 0.0;
            if (outward) {
                periapsisPassed = true;
            }
            if (periapsisPassed && outward && rn > rEnd) {
                end = RayEnd.ESCAPED;
                break;
            }
            // inwards below the mask's inner radius with no radial turning point left: nothing
            // more can be sampled and the ray is captured (the last steps to the stop radius,
            // where phi and t diverge like ln(r - r_+), are the costliest of the ray)
            if (!outward && !tailChecked && mask != null && rn * rn + a2 < innerLimit) {
                tailChecked = true;
                if (mino.noTurningBefore(ym[1], 1.0 / rStop)) {
                    end = RayEnd.CAPTURED;
                    break;
                }
            }
        }
        thMin = FastMath.acos(FastMath.max(-1.0, FastMath.min(1.0, uMin)));
        // the last state in the affine form of the general path (t, r, theta, phi, q_r, q_theta)
        double u = FastMath.max(-1.0, FastMath.min(1.0, ym[2]));
        double st = FastMath.sqrt(1.0 - u * u);
        double x = ym[1];
        y[0] = ym[0] + mino.branch() * MinoTimeEquations.singularTime(x);
        y[1] = 1.0 / x;
        y[2] = FastMath.acos(u);
        y[3] = ym[3];
        y[4] = -ym[4] / mino.d(x);
        y[5] = st > 0.0 ? -ym[5] / st : 0.0;
        equations.affine(qt, qphi, y, 0, dy, 0);
        return end;
    }

    /**
     * Samples an accepted step in Mino time as {@link #sampleStep} does in the affine parameter:
     * cubic Hermite dense output of (tau, x, u, v_x, v_u) and of the Cartesian position at the
     * midpoints of k equal parts (only samples inside the mask's shell and slab are completed),
     * t = tau + s F(x), weight d(lambda) = Sigma h / k; physical p_r = v_x / D(x) and
     * p_theta = v_u / sin(theta).
     */
    private void sampleSeparated(SampleBuffer out, double h, double speed0, double speed1, double rEm,
                                 double delayOffset) {
        double length = 0.5 * (speed0 + speed1) * h;
        int k = (int) FastMath.max(1, FastMath.ceil(length / settings.sampleSpacing()));
        double w = h / k * weightScale;
        double branch = mino.branch();
        if (!cartesianValid) {
            cartesian(ym, dym, c0);
        }
        cartesian(ymNew, dymNew, c1);
        double in2 = mask != null ? mask.innerRadius() * mask.innerRadius() : 0.0;
        double out2 = mask != null ? mask.outerRadius() * mask.outerRadius() : rEm * rEm + a2;
        double zMax = mask != null ? mask.maxHeight() : Double.POSITIVE_INFINITY;
        for (int j = 0; j < k; j++) {
            double s = (j + 0.5) / k;
            double s2 = s * s, s3 = s2 * s;
            double h00 = 2 * s3 - 3 * s2 + 1, h10 = (s3 - 2 * s2 + s) * h, h01 = -2 * s3 + 3 * s2, h11 = (s3 - s2) * h;
            // the Cartesian position by its own cubic Hermite interpolant (no trigonometry per sample)
            double cz = h00 * c0[2] + h10 * c0[5] + h01 * c1[2] + h11 * c1[5];
            if (FastMath.abs(cz) > zMax) {
                continue;
            }
            double cx = h00 * c0[0] + h10 * c0[3] + h01 * c1[0] + h11 * c1[3];
            double cy = h00 * c0[1] + h10 * c0[4] + h01 * c1[1] + h11 * c1[4];
            double d2 = cx * cx + cy * cy + cz * cz;
            if (d2 < in2 || d2 > out2) {
                continue;
            }
            double x = h00 * ym[1] + h10 * dym[1] + h01 * ymNew[1] + h11 * dymNew[1];
            double r = 1.0 / x;
            boolean emitting = mask != null ? mask.occupied(cx, cy, cz) : r < rEm;
            if (emitting) {
                double u = h00 * ym[2] + h10 * dym[2] + h01 * ymNew[2] + h11 * dymNew[2];
                double tau = h00 * ym[0] + h10 * dym[0] + h01 * ymNew[0] + h11 * dymNew[0];
                double vx = h00 * ym[4] + h10 * dym[4] + h01 * ymNew[4] + h11 * dymNew[4];
                double vu = h00 * ym[5] + h10 * dym[5] + h01 * ymNew[5] + h11 * dymNew[5];
                double st = Math.sqrt(FastMath.max(0.0, 1.0 - u * u));
                double t = tau + branch * MinoTimeEquations.singularTime(x);
                // d(lambda) = Sigma d(sigma)
                double sigma = r * r + a2 * u * u;
                out.add(cx, cy, cz, -t - delayOffset, vx / mino.d(x), st > 0.0 ? vu / st : 0.0, -qphi, w * sigma);
            }
        }
    }

    /**
     * Cartesian position (x, y, z) = (sqrt(r^2 + a^2) sin(theta) cos(phi), ... sin(phi), r cos(theta))
     * of the separated state q and its derivative from dq (chain rule with r = 1/x, u = cos(theta)).
     *
     * @param out x, y, z, dx, dy, dz
     */
    private void cartesian(double[] q, double[] dq, double[] out) {
        double x = q[1], u = q[2];
        double r = 1.0 / x;
        double dr = -dq[1] * r * r;
        double st = Math.sqrt(FastMath.max(1.0e-300, 1.0 - u * u));
        double dst = -u * dq[2] / st;
        double big = Math.sqrt(r * r + a2);
        double rho = big * st;
        double drho = r * dr / big * st + big * dst;
        double cp = Trig.cos(q[3]), sp = Trig.sin(q[3]);
        double dph = dq[3];
        out[0] = rho * cp;
        out[1] = rho * sp;
        out[2] = r * u;
        out[3] = drho * cp - rho * sp * dph;
        out[4] = drho * sp + rho * cp * dph;
        out[5] = dr * u + r * dq[2];
    }

    /**
     * The periapsis inside the accepted step from ym to ymNew (v_x changes sign): where the cubic
     * Hermite interpolant of x has its maximum, found from its derivative (a quadratic in the step
     * fraction); records it as the closest point when it is closer than the step ends.
     */
    private void periapsis(double h) {
        // x(f) = h00 x0 + h10 x0' + h01 x1 + h11 x1'; dx/df = 6 (x0 - x1)(f^2 - f) + h x0' (3f^2 - 4f + 1) + h x1' (3f^2 - 2f)
        double p = ym[1] - ymNew[1], d0 = h * dym[1], d1 = h * dymNew[1];
        double qa = 6.0 * p + 3.0 * d0 + 3.0 * d1;
        double qb = -6.0 * p - 4.0 * d0 - 2.0 * d1;
        double qc = d0;
        double f;
        if (FastMath.abs(qa) < 1.0e-300) {
            f = -qc / qb;
        } else {
            double disc = FastMath.sqrt(FastMath.max(0.0, qb * qb - 4.0 * qa * qc));
            // the root in [0, 1] where dx/df falls through zero (d0 > 0 > d1)
            double f1 = (-qb + disc) / (2.0 * qa), f2 = (-qb - disc) / (2.0 * qa);
            f = f1 >= 0.0 && f1 <= 1.0 ? f1 : f2;
        }
        f = FastMath.max(0.0, FastMath.min(1.0, f));
        double f2 = f * f, f3 = f2 * f;
        double h00 = 2 * f3 - 3 * f2 + 1, h10 = (f3 - 2 * f2 + f) * h, h01 = -2 * f3 + 3 * f2, h11 = (f3 - f2) * h;
        double x = h00 * ym[1] + h10 * dym[1] + h01 * ymNew[1] + h11 * dymNew[1];
        if (1.0 / x < rMin) {
            rMin = 1.0 / x;
            uMin = h00 * ym[2] + h10 * dym[2] + h01 * ymNew[2] + h11 * dymNew[2];
            phMin = h00 * ym[3] + h10 * dym[3] + h01 * ymNew[3] + h11 * dymNew[3];
        }
    }

    /** Coordinate speed |dx/dsigma| (flat-space sense, M per unit Mino time) at x = 1/r, for step limits. */
    private static double minoSpeed(double x, double u, double[] d) {
        double st2 = FastMath.max(1.0e-300, 1.0 - u * u);
        double r = 1.0 / x;
        double dr = d[1] * r * r;
        double v2 = dr * dr + r * r * (d[2] * d[2] / st2 + st2 * d[3] * d[3]);
        return FastMath.max(1.0e-300, Math.sqrt(v2));
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
