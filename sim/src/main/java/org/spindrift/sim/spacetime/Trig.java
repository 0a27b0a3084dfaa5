package org.spindrift.sim.spacetime;

/**
 * sin and cos in pure Java, bit for bit the results of {@link StrictMath#sin}/{@link StrictMath#cos}
 * for |x| &lt;= 2^19 pi/2 and delegating to them beyond. It is the algorithm of fdlibm 5.3
 * (Sun Microsystems 1993: s_sin.c, s_cos.c, k_sin.c, k_cos.c and the small and medium argument
 * branches of e_rem_pio2.c, with their published coefficients), which is what StrictMath
 * specifies. Why: in JDK 17 StrictMath.sin/cos are native (JNI) calls costing about a third of a
 * geodesic right-hand side; this class is inlined by the JIT, allocates nothing (unlike
 * Hipparchus' FastMath, see DEVELOPERS.md "Allocation-free hot loops"), and stays deterministic
 * and platform-independent. The equality with StrictMath is tested (TrigTest).
 */
public final class Trig {
    private Trig() {
    }

    // k_sin.c: sin(x) ~ x + S1 x^3 + ... + S6 x^13 on [-pi/4, pi/4]
    private static final double S1 = -1.66666666666666324348e-01;
    private static final double S2 = 8.33333333332248946124e-03;
    private static final double S3 = -1.98412698298579493134e-04;
    private static final double S4 = 2.75573137070700676789e-06;
    private static final double S5 = -2.50507602534068634195e-08;
    private static final double S6 = 1.58969099521155010221e-10;
    // k_cos.c: cos(x) ~ 1 - x^2/2 + C1 x^4 + ... + C6 x^14 on [-pi/4, pi/4]
    private static final double C1 = 4.16666666666666019037e-02;
    private static final double C2 = -1.38888888888741095749e-03;
    private static final double C3 = 2.48015872894767294178e-05;
    private static final double C4 = -2.75573143513906633035e-07;
    private static final double C5 = 2.08757232129817482790e-09;
    private static final double C6 = -1.13596475577881948265e-11;
    // e_rem_pio2.c: 2/pi and pi/2 split into 33 + 33 + 33 + 53 bits
    private static final double INVPIO2 = Double.longBitsToDouble(0x3FE45F306DC9C883L);
    private static final double PIO2_1 = Double.longBitsToDouble(0x3FF921FB54400000L);
    private static final double PIO2_1T = Double.longBitsToDouble(0x3DD0B4611A626331L);
    private static final double PIO2_2 = Double.longBitsToDouble(0x3DD0B4611A600000L);
    private static final double PIO2_2T = Double.longBitsToDouble(0x3BA3198A2E037073L);
    private static final double PIO2_3 = Double.longBitsToDouble(0x3BA3198A2E000000L);
    private static final double PIO2_3T = Double.longBitsToDouble(0x397B839A252049C1L);
    /** High words of n pi/2, n = 1..32 (e_rem_pio2.c, npio2_hw). */
    private static final int[] NPIO2_HW = {
        0x3FF921FB, 0x400921FB, 0x4012D97C, 0x401921FB, 0x401F6A7A, 0x4022D97C, 0x4025FDBB, 0x402921FB,
        0x402C463A, 0x402F6A7A, 0x4031475C, 0x4032D97C, 0x40346B9C, 0x4035FDBB, 0x40378FDB, 0x403921FB,
        0x403AB41B, 0x403C463A, 0x403DD85A, 0x403F6A7A, 0x40407E4C, 0x4041475C, 0x4042106C, 0x4042D97C,
        0x4043A28C, 0x40446B9C, 0x404534AC, 0x4045FDBB, 0x4046C6CB, 0x40478FDB, 0x404858EB, 0x404921FB,
    };

    private static int high(double x) {
        return (int) (Double.doubleToRawLongBits(x) >>> 32);
    }

    /**
     * @return sin(x), equal to StrictMath.sin(x). The common cases |x| &lt; 3 pi/4 (polar angles
     *     of the geodesic code) are kept short here so that the JIT inlines them (HotSpot's
     *     FreqInlineSize: 325 bytecodes); the rest is in {@link #rest}.
     */
    public static double sin(double x) {
        final int hx = high(x);
        final int ix = hx & 0x7fffffff;
        if (ix <= 0x3fe921fb) {
            return kernelSin(x, 0.0, false);
        }
        if (hx > 0 && ix < 0x4002d97c) {
            // e_rem_pio2.c, |x| < 3 pi/4 with n = 1: sin(x) = cos(x - pi/2)
            double z = x - PIO2_1;
            double t = PIO2_1T;
            if (ix == 0x3ff921fb) { // near pi/2: 33 + 33 + 53 bit pi/2
                z -= PIO2_2;
                t = PIO2_2T;
            }
            final double y0 = z - t;
            return kernelCos(y0, (z - y0) - t);
        }
        return rest(x, 0);
    }

    /**
     * sin(x) (quarter = 0) or cos(x) = sin(x + pi/2) (quarter = 1) outside the short paths: one
     * argument reduction x = n pi/2 + (y0 + y1) for both (e_rem_pio2.c), then the kernel chosen by
     * (n + quarter) mod 4.
     */
    private static double rest(double x, int quarter) {
        final int hx = high(x);
        final int ix = hx & 0x7fffffff;
        if (ix <= 0x3fe921fb) {
            return quarter == 0 ? kernelSin(x, 0.0, false) : kernelCos(x, 0.0);
        }
        if (ix > 0x413921fb) {
            // large, infinite or NaN: fdlibm's Payne-Hanek branch
            return quarter == 0 ? StrictMath.sin(x) : StrictMath.cos(x);
        }
        // reduce: x = n pi/2 + (y0 + y1), as e_rem_pio2.c
        double y0;
        double y1;
        int n;
        if (ix < 0x4002d97c) {
            double z;
            if (hx > 0) {
                z = x - PIO2_1;
                if (ix != 0x3ff921fb) {
                    y0 = z - PIO2_1T;
                    y1 = (z - y0) - PIO2_1T;
                } else {
                    z -= PIO2_2;
                    y0 = z - PIO2_2T;
                    y1 = (z - y0) - PIO2_2T;
                }
                n = 1;
            } else {
                z = x + PIO2_1;
                if (ix != 0x3ff921fb) {
                    y0 = z + PIO2_1T;
                    y1 = (z - y0) + PIO2_1T;
                } else {
                    z += PIO2_2;
                    y0 = z + PIO2_2T;
                    y1 = (z - y0) + PIO2_2T;
                }
                n = -1;
            }
        } else {
            final double t = Math.abs(x);
            n = (int) (t * INVPIO2 + 0.5);
            final double fn = n;
            double r = t - fn * PIO2_1;
            double w = fn * PIO2_1T;
            if (n < 32 && ix != NPIO2_HW[n - 1]) {
                y0 = r - w;
            } else {
                final int j = ix >> 20;
                y0 = r - w;
                int i = j - ((high(y0) >> 20) & 0x7ff);
                if (i > 16) {
                    double tt = r;
                    w = fn * PIO2_2;
                    r = tt - w;
                    w = fn * PIO2_2T - ((tt - r) - w);
                    y0 = r - w;
                    i = j - ((high(y0) >> 20) & 0x7ff);
                    if (i > 49) {
                        tt = r;
                        w = fn * PIO2_3;
                        r = tt - w;
                        w = fn * PIO2_3T - ((tt - r) - w);
                        y0 = r - w;
                    }
                }
            }
            y1 = (r - y0) - w;
            if (hx < 0) {
                y0 = -y0;
                y1 = -y1;
                n = -n;
            }
        }
        switch ((n + quarter) & 3) {
            case 0:
                return kernelSin(y0, y1, true);
            case 1:
                return kernelCos(y0, y1);
            case 2:
                return -kernelSin(y0, y1, true);
            default:
                return -kernelCos(y0, y1);
        }
    }

    /** @return cos(x), equal to StrictMath.cos(x); short common path as in {@link #sin} */
    public static double cos(double x) {
        final int hx = high(x);
        final int ix = hx & 0x7fffffff;
        if (ix <= 0x3fe921fb) {
            return kernelCos(x, 0.0);
        }
        if (hx > 0 && ix < 0x4002d97c) {
            // n = 1: cos(x) = -sin(x - pi/2)
            double z = x - PIO2_1;
            double t = PIO2_1T;
            if (ix == 0x3ff921fb) {
                z -= PIO2_2;
                t = PIO2_2T;
            }
            final double y0 = z - t;
            return -kernelSin(y0, (z - y0) - t, true);
        }
        return rest(x, 1);
    }

    /** k_sin.c: sin(x + y) for |x| &lt;= pi/4, y the tail of x (used when tail). */
    private static double kernelSin(double x, double y, boolean tail) {
        final int ix = high(x) & 0x7fffffff;
        if (ix < 0x3e400000 && (int) x == 0) {
            return x; // |x| < 2^-27, generating inexact as fdlibm
        }
        final double z = x * x;
        final double v = z * x;
        final double r = S2 + z * (S3 + z * (S4 + z * (S5 + z * S6)));
        if (!tail) {
            return x + v * (S1 + z * r);
        }
        return x - ((z * (0.5 * y - v * r) - y) - v * S1);
    }

    /** k_cos.c: cos(x + y) for |x| &lt;= pi/4, y the tail of x. */
    private static double kernelCos(double x, double y) {
        final int ix = high(x) & 0x7fffffff;
        if (ix < 0x3e400000 && (int) x == 0) {
            return 1.0;
        }
        final double z = x * x;
        final double r = z * (C1 + z * (C2 + z * (C3 + z * (C4 + z * (C5 + z * C6)))));
        if (ix < 0x3FD33333) {
            return 1.0 - (0.5 * z - (z * r - x * y));
        }
        final double qx = ix > 0x3fe90000 ? 0.28125 : Double.longBitsToDouble((long) (ix - 0x00200000) << 32);
        final double hz = 0.5 * z - qx;
        final double a = 1.0 - qx;
        return a - (hz - (z * r - x * y));
    }
}
