package org.spindrift.sim.light;

import org.hipparchus.util.FastMath;

/**
 * One step of the embedded Runge-Kutta pair of Dormand &amp; Prince 1980 (J. Comput. Appl. Math.
 * 6, 19; tableau as in Hairer, Norsett &amp; Wanner 1993, Solving ODEs I, Table II.5.2), fifth-order
 * solution with a fourth-order error estimate, first-same-as-last. Photon paths need only the
 * end points of accepted steps (samples are limited in spacing by the tracer), so no dense output.
 *
 * <p>All stages are scratch arrays allocated once; {@link #step} allocates nothing. Not
 * thread-safe: one instance per thread.
 */
final class DormandPrince54 {
    /** Right-hand side y' = f(y) of an autonomous system (the affine geodesic equations). */
    interface Rhs {
        void derivative(double[] y, double[] dy);
    }

    // Hairer, Norsett & Wanner 1993, Table II.5.2 (Dormand-Prince 5(4))
    private static final double A21 = 1.0 / 5.0;
    private static final double A31 = 3.0 / 40.0, A32 = 9.0 / 40.0;
    private static final double A41 = 44.0 / 45.0, A42 = -56.0 / 15.0, A43 = 32.0 / 9.0;
    private static final double A51 = 19372.0 / 6561.0, A52 = -25360.0 / 2187.0, A53 = 64448.0 / 6561.0,
            A54 = -212.0 / 729.0;
    private static final double A61 = 9017.0 / 3168.0, A62 = -355.0 / 33.0, A63 = 46732.0 / 5247.0,
            A64 = 49.0 / 176.0, A65 = -5103.0 / 18656.0;
    private static final double B1 = 35.0 / 384.0, B3 = 500.0 / 1113.0, B4 = 125.0 / 192.0,
            B5 = -2187.0 / 6784.0, B6 = 11.0 / 84.0;
    // error coefficients b - b*, with b* = (5179/57600, 0, 7571/16695, 393/640, -92097/339200, 187/2100, 1/40)
    private static final double E1 = 71.0 / 57600.0, E3 = -71.0 / 16695.0, E4 = 71.0 / 1920.0,
            E5 = -17253.0 / 339200.0, E6 = 22.0 / 525.0, E7 = -1.0 / 40.0;

    private final int n;
    private final double[] k2, k3, k4, k5, k6, tmp;

    DormandPrince54(int dimension) {
        n = dimension;
        k2 = new double[n];
        k3 = new double[n];
        k4 = new double[n];
        k5 = new double[n];
        k6 = new double[n];
        tmp = new double[n];
    }

    /**
     * Attempts one step of size h from y with derivative k1 = f(y).
     *
     * @param yOut the fifth-order solution
     * @param k7 f(yOut), the next step's k1 when the step is accepted (FSAL)
     * @return the RMS error norm, scaled by atol + rtol max(|y|, |yOut|); accept when &lt;= 1
     */
    double step(Rhs f, double[] y, double[] k1, double h, double rtol, double atol, double[] yOut, double[] k7) {
        for (int i = 0; i < n; i++) {
            tmp[i] = y[i] + h * A21 * k1[i];
        }
        f.derivative(tmp, k2);
        for (int i = 0; i < n; i++) {
            tmp[i] = y[i] + h * (A31 * k1[i] + A32 * k2[i]);
        }
        f.derivative(tmp, k3);
        for (int i = 0; i < n; i++) {
            tmp[i] = y[i] + h * (A41 * k1[i] + A42 * k2[i] + A43 * k3[i]);
        }
        f.derivative(tmp, k4);
        for (int i = 0; i < n; i++) {
            tmp[i] = y[i] + h * (A51 * k1[i] + A52 * k2[i] + A53 * k3[i] + A54 * k4[i]);
        }
        f.derivative(tmp, k5);
        for (int i = 0; i < n; i++) {
            tmp[i] = y[i] + h * (A61 * k1[i] + A62 * k2[i] + A63 * k3[i] + A64 * k4[i] + A65 * k5[i]);
        }
        f.derivative(tmp, k6);
        for (int i = 0; i < n; i++) {
            yOut[i] = y[i] + h * (B1 * k1[i] + B3 * k3[i] + B4 * k4[i] + B5 * k5[i] + B6 * k6[i]);
        }
        f.derivative(yOut, k7);
        double sum = 0.0;
        for (int i = 0; i < n; i++) {
            double e = h * (E1 * k1[i] + E3 * k3[i] + E4 * k4[i] + E5 * k5[i] + E6 * k6[i] + E7 * k7[i]);
            double sc = atol + rtol * FastMath.max(FastMath.abs(y[i]), FastMath.abs(yOut[i]));
            double q = e / sc;
            sum += q * q;
        }
        return FastMath.sqrt(sum / n);
    }

    /**
     * Standard step-size update factor 0.9 err^(-1/5), clamped to [0.2, 5] (Hairer et al. 1993, II.4).
     * Math.pow, a JIT intrinsic: Hipparchus' FastMath.pow took about 40 % of a ray's time.
     */
    static double factor(double err) {
        if (err == 0.0) {
            return 5.0;
        }
        return Math.min(5.0, Math.max(0.2, 0.9 * Math.pow(err, -0.2)));
    }
}
