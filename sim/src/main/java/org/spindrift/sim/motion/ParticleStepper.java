package org.spindrift.sim.motion;

import java.util.function.DoubleUnaryOperator;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.numerics.BracketedRoot;

/**
 * Adaptive DOP853 stepping of one particle at a time in coordinate time (tableau:
 * {@link Dop853}; error norm and step-size control as in Hairer, Norsett &amp; Wanner 1993,
 * section II.4 and II.10) of the members of a batch whose equations are given as
 * {@link BatchEquations}; it knows nothing else about them. One instance per worker thread: it
 * owns the stage scratch (16 x 5 doubles) so the particles themselves only keep their state;
 * nothing is allocated per step. Event functions are located on the continuous extension of an
 * accepted step with the shared {@link BracketedRoot}.
 */
final class ParticleStepper implements DenseStep {
    private static final int N = GeodesicEquations.DIM_T;

    private final BatchEquations eq;
    private final double atol;
    private final double rtol;
    private final double minStep;
    private final double maxStep;

    private final double[] k = new double[Dop853.ALL_STAGES * N];
    private final double[] y0 = new double[N];
    private final double[] y1 = new double[N];
    private final double[] yt = new double[N];
    private final double[] rc = new double[7 * N];
    /** State on the continuous extension at an event probe. */
    private final double[] yq = new double[N];
    private final BracketedRoot root = new BracketedRoot();
    private final EventProbe probe = new EventProbe();

    private double pt;
    private double pphi;
    private double t0;
    private double h;
    private boolean denseReady;
    /** Right-hand-side evaluations since construction. */
    long evaluations;
    /** Accepted and rejected steps since construction. */
    long accepted;
    long rejected;
    /** Why the last {@link #attempt} failed, when it returned a failure. */
    Failure lastFailure = Failure.NONE;

    /**
     * @param eq the equations; their dimension must be 5 (the stage sums are unrolled for the
     *     coordinate-time geodesic state)
     */
    ParticleStepper(BatchEquations eq, double atol, double rtol, double minStep, double maxStep) {
        if (eq.dimension() != N) {
            throw new IllegalArgumentException("the stepper is unrolled for dimension " + N + ", got "
                    + eq.dimension());
        }
        this.eq = eq;
        this.atol = atol;
        this.rtol = rtol;
        this.minStep = minStep;
        this.maxStep = maxStep;
    }

    /**
     * Loads a particle: state y at time t, conserved p_t and p_phi; evaluates the derivative at
     * the start point.
     *
     * @return Failure.NONE, or why the start point is unusable
     */
    Failure load(double t, double r, double th, double ph, double pr, double pth, double pT, double pPhi) {
        this.t0 = t;
        this.pt = pT;
        this.pphi = pPhi;
        y0[0] = r;
        y0[1] = th;
        y0[2] = ph;
        y0[3] = pr;
        y0[4] = pth;
        double tDot = rhs(y0, 0);
        Failure f = check(tDot);
        return f == Failure.NONE && !derivativeFinite(0) ? Failure.NON_FINITE : f;
    }

    /**
     * Loads a particle with the derivative at its start point already known (the first-same-as-last
     * stage of its previous accepted step, from {@link #storeDerivative}): no evaluation, and
     * bitwise the state {@link #load} would produce, since that derivative was evaluated at this
     * very state and passed the same checks.
     */
    void loadWithDerivative(double t, double r, double th, double ph, double pr, double pth, double pT, double pPhi,
                            double[] dy, int off) {
        this.t0 = t;
        this.pt = pT;
        this.pphi = pPhi;
        y0[0] = r;
        y0[1] = th;
        y0[2] = ph;
        y0[3] = pr;
        y0[4] = pth;
        System.arraycopy(dy, off, k, 0, N);
    }

    /** Copies the derivative at the current start point (after {@link #advance}) to dy[off ..]. */
    void storeDerivative(double[] dy, int off) {
        System.arraycopy(k, 0, dy, off, N);
    }

    private double rhs(double[] y, int stage) {
        evaluations++;
        return eq.derivatives(pt, pphi, y, 0, k, stage * N);
    }

    /**
     * Checks a stage through dt/dlambda only: a non-finite state or derivative makes it NaN or
     * propagates into the error estimate (every later stage and the error sums use the earlier
     * stages), where {@link #attempt} catches it; so the five derivatives need no test here.
     */
    private static Failure check(double tDot) {
        if (tDot > 0.0 && tDot < Double.POSITIVE_INFINITY) {
            return Failure.NONE;
        }
        return Double.isNaN(tDot) || Double.isInfinite(tDot) ? Failure.NON_FINITE : Failure.TIME_NOT_INCREASING;
    }

    private boolean derivativeFinite(int stage) {
        int o = stage * N;
        return Double.isFinite(k[o] + k[o + 1] + k[o + 2] + k[o + 3] + k[o + 4]);
    }

    /** Hairer's starting step (Hairer, Norsett &amp; Wanner 1993, section II.4, algorithm on p. 169). */
    double initialStep() {
        double d0 = 0;
        double d1 = 0;
        for (int j = 0; j < N; j++) {
            double sc = atol + rtol * FastMath.abs(y0[j]);
            d0 += (y0[j] / sc) * (y0[j] / sc);
            d1 += (k[j] / sc) * (k[j] / sc);
        }
        d0 = FastMath.sqrt(d0 / N);
        d1 = FastMath.sqrt(d1 / N);
        double h0 = (d0 < 1e-5 || d1 < 1e-5) ? 1e-6 : 0.01 * d0 / d1;
        h0 = FastMath.min(h0, maxStep);
        for (int j = 0; j < N; j++) {
            yt[j] = y0[j] + h0 * k[j];
        }
        double tDot = rhs(yt, 1);
        if (check(tDot) != Failure.NONE || !derivativeFinite(1)) {
            return FastMath.max(minStep, 1e-3 * h0);
        }
        double d2 = 0;
        for (int j = 0; j < N; j++) {
            double sc = atol + rtol * FastMath.abs(y0[j]);
            double d = (k[N + j] - k[j]) / sc;
            d2 += d * d;
        }
        d2 = FastMath.sqrt(d2 / N) / h0;
        double dm = FastMath.max(d1, d2);
        double h1 = dm <= 1e-15 ? FastMath.max(1e-6, h0 * 1e-3) : Math.pow(0.01 / dm, 1.0 / 8.0);
        return FastMath.min(FastMath.min(100 * h0, h1), maxStep);
    }

    /**
     * Tries one step of size hTry from the loaded start point.
     *
     * @return the error ratio (accept when &lt;= 1), or NaN when a stage failed (then
     *     {@link #lastFailure} says why and the caller should shrink the step)
     */
    double attempt(double hTry) {
        this.h = hTry;
        this.denseReady = false;
        for (int s = 1; s < Dop853.STEP_STAGES; s++) {
            stageInput(s);
            double tDot = rhs(yt, s);
            Failure f = check(tDot);
            if (f != Failure.NONE) {
                lastFailure = f;
                return Double.NaN;
            }
        }
        // 8th-order solution and the two embedded error estimates (Hipparchus' estimateError form),
        // over the non-zero weights (stages 0 and 5..11), five independent sums per quantity
        final double[] k = this.k;
        final double b0 = Dop853Sums.B0 * k[0] + Dop853Sums.B5 * k[25] + Dop853Sums.B6 * k[30]
                + Dop853Sums.B7 * k[35] + Dop853Sums.B8 * k[40] + Dop853Sums.B9 * k[45] + Dop853Sums.B10 * k[50]
                + Dop853Sums.B11 * k[55];
        final double b1 = Dop853Sums.B0 * k[1] + Dop853Sums.B5 * k[26] + Dop853Sums.B6 * k[31]
                + Dop853Sums.B7 * k[36] + Dop853Sums.B8 * k[41] + Dop853Sums.B9 * k[46] + Dop853Sums.B10 * k[51]
                + Dop853Sums.B11 * k[56];
        final double b2 = Dop853Sums.B0 * k[2] + Dop853Sums.B5 * k[27] + Dop853Sums.B6 * k[32]
                + Dop853Sums.B7 * k[37] + Dop853Sums.B8 * k[42] + Dop853Sums.B9 * k[47] + Dop853Sums.B10 * k[52]
                + Dop853Sums.B11 * k[57];
        final double b3 = Dop853Sums.B0 * k[3] + Dop853Sums.B5 * k[28] + Dop853Sums.B6 * k[33]
                + Dop853Sums.B7 * k[38] + Dop853Sums.B8 * k[43] + Dop853Sums.B9 * k[48] + Dop853Sums.B10 * k[53]
                + Dop853Sums.B11 * k[58];
        final double b4 = Dop853Sums.B0 * k[4] + Dop853Sums.B5 * k[29] + Dop853Sums.B6 * k[34]
                + Dop853Sums.B7 * k[39] + Dop853Sums.B8 * k[44] + Dop853Sums.B9 * k[49] + Dop853Sums.B10 * k[54]
                + Dop853Sums.B11 * k[59];
        final double f0 = Dop853Sums.E5_0 * k[0] + Dop853Sums.E5_5 * k[25] + Dop853Sums.E5_6 * k[30]
                + Dop853Sums.E5_7 * k[35] + Dop853Sums.E5_8 * k[40] + Dop853Sums.E5_9 * k[45]
                + Dop853Sums.E5_10 * k[50] + Dop853Sums.E5_11 * k[55];
        final double f1 = Dop853Sums.E5_0 * k[1] + Dop853Sums.E5_5 * k[26] + Dop853Sums.E5_6 * k[31]
                + Dop853Sums.E5_7 * k[36] + Dop853Sums.E5_8 * k[41] + Dop853Sums.E5_9 * k[46]
                + Dop853Sums.E5_10 * k[51] + Dop853Sums.E5_11 * k[56];
        final double f2 = Dop853Sums.E5_0 * k[2] + Dop853Sums.E5_5 * k[27] + Dop853Sums.E5_6 * k[32]
                + Dop853Sums.E5_7 * k[37] + Dop853Sums.E5_8 * k[42] + Dop853Sums.E5_9 * k[47]
                + Dop853Sums.E5_10 * k[52] + Dop853Sums.E5_11 * k[57];
        final double f3 = Dop853Sums.E5_0 * k[3] + Dop853Sums.E5_5 * k[28] + Dop853Sums.E5_6 * k[33]
                + Dop853Sums.E5_7 * k[38] + Dop853Sums.E5_8 * k[43] + Dop853Sums.E5_9 * k[48]
                + Dop853Sums.E5_10 * k[53] + Dop853Sums.E5_11 * k[58];
        final double f4 = Dop853Sums.E5_0 * k[4] + Dop853Sums.E5_5 * k[29] + Dop853Sums.E5_6 * k[34]
                + Dop853Sums.E5_7 * k[39] + Dop853Sums.E5_8 * k[44] + Dop853Sums.E5_9 * k[49]
                + Dop853Sums.E5_10 * k[54] + Dop853Sums.E5_11 * k[59];
        final double g0 = Dop853Sums.E3_0 * k[0] + Dop853Sums.E3_5 * k[25] + Dop853Sums.E3_6 * k[30]
                + Dop853Sums.E3_7 * k[35] + Dop853Sums.E3_8 * k[40] + Dop853Sums.E3_9 * k[45]
                + Dop853Sums.E3_10 * k[50] + Dop853Sums.E3_11 * k[55];
        final double g1 = Dop853Sums.E3_0 * k[1] + Dop853Sums.E3_5 * k[26] + Dop853Sums.E3_6 * k[31]
                + Dop853Sums.E3_7 * k[36] + Dop853Sums.E3_8 * k[41] + Dop853Sums.E3_9 * k[46]
                + Dop853Sums.E3_10 * k[51] + Dop853Sums.E3_11 * k[56];
        final double g2 = Dop853Sums.E3_0 * k[2] + Dop853Sums.E3_5 * k[27] + Dop853Sums.E3_6 * k[32]
                + Dop853Sums.E3_7 * k[37] + Dop853Sums.E3_8 * k[42] + Dop853Sums.E3_9 * k[47]
                + Dop853Sums.E3_10 * k[52] + Dop853Sums.E3_11 * k[57];
        final double g3 = Dop853Sums.E3_0 * k[3] + Dop853Sums.E3_5 * k[28] + Dop853Sums.E3_6 * k[33]
                + Dop853Sums.E3_7 * k[38] + Dop853Sums.E3_8 * k[43] + Dop853Sums.E3_9 * k[48]
                + Dop853Sums.E3_10 * k[53] + Dop853Sums.E3_11 * k[58];
        final double g4 = Dop853Sums.E3_0 * k[4] + Dop853Sums.E3_5 * k[29] + Dop853Sums.E3_6 * k[34]
                + Dop853Sums.E3_7 * k[39] + Dop853Sums.E3_8 * k[44] + Dop853Sums.E3_9 * k[49]
                + Dop853Sums.E3_10 * k[54] + Dop853Sums.E3_11 * k[59];
        y1[0] = y0[0] + h * b0;
        y1[1] = y0[1] + h * b1;
        y1[2] = y0[2] + h * b2;
        y1[3] = y0[3] + h * b3;
        y1[4] = y0[4] + h * b4;
        double e1 = sq(f0 / tol(0)) + sq(f1 / tol(1)) + sq(f2 / tol(2)) + sq(f3 / tol(3)) + sq(f4 / tol(4));
        double e2 = sq(g0 / tol(0)) + sq(g1 / tol(1)) + sq(g2 / tol(2)) + sq(g3 / tol(3)) + sq(g4 / tol(4));
        double den = e1 + 0.01 * e2;
        if (den <= 0.0) {
            den = 1.0;
        }
        double err = FastMath.abs(h) * e1 / FastMath.sqrt(N * den);
        if (!Double.isFinite(err)) {
            lastFailure = Failure.NON_FINITE;
            return Double.NaN;
        }
        return err;
    }

    private static double sq(double x) {
        return x * x;
    }

    /** Error scale of component j: atol + rtol max(|y0|, |y1|) (Hairer, Norsett &amp; Wanner 1993, eq. II.4.10). */
    private double tol(int j) {
        return atol + rtol * FastMath.max(FastMath.abs(y0[j]), FastMath.abs(y1[j]));
    }

    /** yt = y0 + h sum_i a_{s,i} k_i (stage s), the unrolled sums of {@link Dop853Sums}. */
    private void stageInput(int s) {
        Dop853Sums.stageInput(s, h, y0, k, yt);
    }

    /**
     * Completes an accepted step: evaluates the derivative at the new point (stage 12).
     *
     * @return Failure.NONE, or why the new point is unusable (the caller then rejects the step)
     */
    Failure finishAccepted() {
        double tDot = eq.derivatives(pt, pphi, y1, 0, k, 12 * N);
        evaluations++;
        Failure f = check(tDot);
        return f == Failure.NONE && !derivativeFinite(12) ? Failure.NON_FINITE : f;
    }

    /** Moves the start point to the end of the last accepted step. */
    void advance() {
        t0 += h;
        System.arraycopy(y1, 0, y0, 0, N);
        System.arraycopy(k, 12 * N, k, 0, N);
        denseReady = false;
    }

    /** @return the new step size proposed after an error ratio err (Hipparchus/Hairer control) */
    static double nextStep(double hOld, double err) {
        // Math.pow: FastMath.pow allocates a scratch array per call (found by the allocation test)
        double f = Dop853.SAFETY * Math.pow(err, Dop853.EXPONENT);
        f = FastMath.min(Dop853.MAX_GROWTH, FastMath.max(Dop853.MIN_REDUCTION, f));
        return hOld * f;
    }

    double minStep() {
        return minStep;
    }

    double maxStep() {
        return maxStep;
    }

    double time() {
        return t0;
    }

    /** @return component c at the start point (after advance: the current state) */
    double y(int c) {
        return y0[c];
    }

    private void ensureDense() {
        if (denseReady) {
            return;
        }
        for (int s = 13; s < Dop853.ALL_STAGES; s++) {
            stageInput(s);
            rhs(yt, s);
        }
        Dop853Sums.dense(h, k, rc);
        denseReady = true;
    }

    // ---- DenseStep view of the last accepted (not yet advanced) step ----

    @Override public double t0() {
        return t0;
    }

    @Override public double t1() {
        return t0 + h;
    }

    @Override public double start(int c) {
        return y0[c];
    }

    @Override public double end(int c) {
        return y1[c];
    }

    @Override public double at(int c, double t) {
        ensureDense();
        double s = (t - t0) / h;
        double s1 = 1.0 - s;
        // Hairer, Norsett & Wanner 1993, contd8: y0 + s (r0 + s1 (r1 + s (r2 + s1 (r3 + s (r4 + s1 (r5 + s r6))))))
        double v = rc[6 * N + c];
        v = rc[5 * N + c] + s * v;
        v = rc[4 * N + c] + s1 * v;
        v = rc[3 * N + c] + s * v;
        v = rc[2 * N + c] + s1 * v;
        v = rc[N + c] + s * v;
        v = rc[c] + s1 * v;
        return y0[c] + s * v;
    }

    @Override public double gStart(EventFunction g) {
        return g.g(t0, y0, 0);
    }

    @Override public double gEnd(EventFunction g) {
        return g.g(t0 + h, y1, 0);
    }

    @Override public double locate(EventFunction g) {
        return locate(g, t0 + h);
    }

    /**
     * {@link #locate(EventFunction)} with the end of the bracket given: the integrator's step
     * may end exactly on a snapshot time that t0 + h misses by rounding.
     */
    double locate(EventFunction g, double tEnd) {
        probe.g = g;
        return root.locate(probe, t0, g.g(t0, y0, 0), tEnd);
    }

    @Override public double locatedBefore() {
        return root.before();
    }

    /** g(t, y(t)) on the continuous extension, for the root finder (one per stepper, no allocation). */
    private final class EventProbe implements DoubleUnaryOperator {
        private EventFunction g;

        @Override public double applyAsDouble(double t) {
            for (int c = 0; c < N; c++) {
                yq[c] = at(c, t);
            }
            return g.g(t, yq, 0);
        }
    }
}
