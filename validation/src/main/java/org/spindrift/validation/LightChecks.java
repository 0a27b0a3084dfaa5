package org.spindrift.validation;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.hipparchus.analysis.solvers.BrentSolver;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.light.Camera;
import org.spindrift.sim.light.RayEnd;
import org.spindrift.sim.light.RayTracer;
import org.spindrift.sim.light.SchwarzschildRays;
import org.spindrift.sim.light.ScreenProbe;
import org.spindrift.sim.light.TraceSettings;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The light checks: the backward ray tracer and the camera against the Kerr shadow edge
 * (Bardeen 1973), the Schwarzschild deflection (Epstein &amp; Shapiro 1980 to second order, Darwin
 * 1959 exactly) and the face-on direct image radius of an equatorial ring (quadrature). The
 * reference values come from {@link LightReferences} and {@link SchwarzschildRays}; tolerances
 * are named here with their reason.
 */
public final class LightChecks {
    /**
     * Distance of the camera's start plane, M. Starting at a finite distance instead of infinity
     * shifts screen positions by about M b / d (the camera's construction): 5e-4 M at b = 5 M.
     */
    public static final double START_PLANE = 1.0e4;
    /** Spin of the Kerr shadow check. */
    public static final double SHADOW_SPIN = 0.9;
    /** Inclination of the Schwarzschild shadow check, deg. */
    public static final double SHADOW_INCLINATION_DEG = 60.0;
    /** Inclinations of the Kerr shadow checks, deg: edge-on (beta^2 = eta) and inclined. */
    public static final double[] KERR_SHADOW_INCLINATIONS_DEG = {90.0, 60.0};
    /** Positions of the checked edge points along the range of photon-orbit radii that reach the screen. */
    public static final double[] SHADOW_FRACTIONS = {0.1, 0.3, 0.5, 0.7, 0.9};
    /**
     * Allowed difference of a shadow-edge distance, M: 2 x the start-plane shift M b / d = 5e-4 M
     * (our choice); the bisection (2^-40 of the bracket) and the tracer tolerance 1e-9 add far less.
     */
    public static final double SHADOW_TOL = 1.0e-3;
    /** Impact parameters of the deflection checks, M (weak field: the series converges fast). */
    public static final double[] DEFLECTION_B = {200.0, 400.0, 800.0};
    /** Start (and end) distance of the deflected rays, M: the bending beyond it is about M b / d^2 &lt; 1e-11. */
    public static final double DEFLECTION_DISTANCE = 1.0e7;
    /** Relative tolerance of the tracer for the deflection rays (absolute: 1e-2 of it). */
    public static final double DEFLECTION_RAY_TOL = 1.0e-12;
    /**
     * Allowed difference from the exact deflection, rad: about 100 x the 1e-13 measured with the
     * tracer held to {@link #DEFLECTION_RAY_TOL} (our choice); the bending beyond the start
     * distance adds less than 1e-11 / b.
     */
    public static final double DEFLECTION_EXACT_TOL = 1.0e-11;
    /**
     * Allowed deviation of (measured - 4/b) / (15 pi / (4 b^2)) from 1 at b = 200 M, scaled by
     * 200 / b: the third-order term 128/(3 b^3) makes the ratio 1 + 512 / (45 pi b), i.e. 1.018 at
     * b = 200 (our choice: about 3 x that).
     */
    public static final double SECOND_ORDER_TOL = 0.05;
    /** Ring radii of the face-on image checks, M. */
    public static final double[] FACE_ON_RADII = {6.0, 10.0, 20.0};
    /** Sample spacing along the face-on rays, M (the equator crossing is interpolated linearly between samples). */
    public static final double FACE_ON_SPACING = 0.05;
    /**
     * Relative tolerance of the face-on image radius: the bound M b / d / b = 1e-4 of the start-plane
     * shift (measured: about 1e-6; the linear interpolation of the crossing and the float samples
     * add less).
     */
    public static final double FACE_ON_REL = 1.0e-4;
    /** Halvings of the bisection for the face-on screen radius (2^-30 of a bracket of about b). */
    public static final int FACE_ON_HALVINGS = 30;

    private static final String SHADOW_GROUP = "Shadow edge";

    private LightChecks() {
    }

    /** @return all light checks, in report order */
    public static List<Check> all() {
        List<Check> out = new ArrayList<>(shadow());
        out.addAll(deflection());
        out.addAll(faceOn());
        return out;
    }

    private static TraceSettings shadowSettings(Spacetime st) {
        return TraceSettings.of(20.0, Landmarks.captureRadius(st), 0.5, true);
    }

    /**
     * The Schwarzschild shadow radius sqrt(27) and points of the Kerr shadow edge at
     * {@link #SHADOW_SPIN} and {@link #KERR_SHADOW_INCLINATIONS_DEG}: the distance from a point
     * inside the shadow to the capture boundary, found by bisection along the direction of each
     * published edge point.
     */
    public static List<Check> shadow() {
        List<Check> out = new ArrayList<>();
        Spacetime sch = MotionChecks.kerr(0.0);
        Camera cam = new Camera(SHADOW_INCLINATION_DEG, 0.0, 20.0, 64, START_PLANE);
        double w0 = 1.0;
        double r0 = new ScreenProbe(sch, cam, shadowSettings(sch)).captureEdge(0.0, 0.0, w0, 4.0, 7.0);
        out.add(new Check(SHADOW_GROUP, String.format(Locale.ROOT, "Schwarzschild shadow radius along screen"
                + " angle %s rad, i = %s deg (M)", w0, SHADOW_INCLINATION_DEG), FastMath.sqrt(27.0),
                "Synge 1966, MNRAS 131, 463: critical impact parameter sqrt(27) M", r0, SHADOW_TOL));

        for (double incDeg : KERR_SHADOW_INCLINATIONS_DEG) {
            out.addAll(kerrShadow(incDeg));
        }
        return out;
    }

    private static List<Check> kerrShadow(double incDeg) {
        List<Check> out = new ArrayList<>();
        double inc = FastMath.toRadians(incDeg);
        double a = SHADOW_SPIN;
        Spacetime st = MotionChecks.kerr(a);
        Camera cam = new Camera(incDeg, 0.0, 20.0, 64, START_PLANE);
        ScreenProbe probe = new ScreenProbe(st, cam, shadowSettings(st));
        double[] range = visibleOrbits(a, inc);
        double centre = 0.5 * (LightReferences.shadowEdge(a, range[0], inc)[0]
                + LightReferences.shadowEdge(a, range[1], inc)[0]);
        for (int k = 0; k < SHADOW_FRACTIONS.length; k++) {
            double r = range[0] + SHADOW_FRACTIONS[k] * (range[1] - range[0]);
            double[] e = LightReferences.shadowEdge(a, r, inc);
            double beta = (k % 2 == 0 ? 1 : -1) * FastMath.sqrt(e[1]);
            double dx = e[0] - centre;
            double expected = FastMath.hypot(dx, beta);
            double got = probe.captureEdge(centre, 0.0, FastMath.atan2(beta, dx), 0.5 * expected, 1.5 * expected);
            out.add(new Check(SHADOW_GROUP, String.format(Locale.ROOT, "Kerr a = %s, i = %s deg: distance from"
                    + " (alpha, beta) = (%.4f, 0) to the edge point of the photon orbit r = %.4f, beta %s 0 (M)", a,
                    incDeg, centre, r, beta > 0 ? ">" : "<"), expected,
                    "Bardeen 1973 (Black Holes, Les Houches, p. 215): alpha = -lambda / sin i, beta^2 = eta"
                            + " + a^2 cos^2 i - lambda^2 cot^2 i; photon orbits of Bardeen, Press & Teukolsky 1972",
                    got, SHADOW_TOL));
        }
        return out;
    }

    /**
     * @return the radii {r1, r2} between the prograde and retrograde photon orbits whose spherical
     *     photon orbits reach an observer at inclination inc (beta^2 &gt;= 0 between them); edge-on
     *     these are the equatorial photon orbits themselves (eta = 0 there)
     */
    static double[] visibleOrbits(double a, double inc) {
        double lo = LightReferences.photonOrbit(a, true);
        double hi = LightReferences.photonOrbit(a, false);
        int n = 400;
        int first = -1;
        int last = -1;
        for (int i = 1; i < n; i++) {
            double r = lo + (hi - lo) * i / n;
            if (LightReferences.shadowEdge(a, r, inc)[1] >= 0) {
                if (first < 0) {
                    first = i;
                }
                last = i;
            }
        }
        BrentSolver brent = new BrentSolver(1e-14);
        double step = (hi - lo) / n;
        double r1 = LightReferences.shadowEdge(a, lo, inc)[1] >= 0 ? lo : brent.solve(200,
                r -> LightReferences.shadowEdge(a, r, inc)[1], lo + (first - 1) * step, lo + first * step);
        double r2 = LightReferences.shadowEdge(a, hi, inc)[1] >= 0 ? hi : brent.solve(200,
                r -> LightReferences.shadowEdge(a, r, inc)[1], lo + last * step, lo + (last + 1) * step);
        return new double[] {r1, r2};
    }

    /**
     * Schwarzschild deflection of rays from far away at impact parameters {@link #DEFLECTION_B}:
     * against the exact integral, the second-order series, and the ratio of its second-order term.
     */
    public static List<Check> deflection() {
        List<Check> out = new ArrayList<>();
        Spacetime st = MotionChecks.kerr(0.0);
        double far = DEFLECTION_DISTANCE;
        TraceSettings s = new TraceSettings(0.0, Landmarks.captureRadius(st), far, 1.0, DEFLECTION_RAY_TOL,
                DEFLECTION_RAY_TOL * 1e-2, 100_000, true, null);
        RayTracer tr = new RayTracer(st, s);
        double[] y0 = new double[6];
        double[] g = new double[Spacetime.SIZE];
        String grp = "Weak-field deflection (Schwarzschild)";
        for (double b0 : DEFLECTION_B) {
            // the physical photon leaves along +x at y = b0; the backward ray starts there moving along -x
            double l = Camera.initialState(st, far, b0, 0.0, 1.0, 0.0, 0.0, y0, g);
            RayEnd end = tr.trace(y0, l, 0.0, null);
            double measured = end == RayEnd.ESCAPED ? deflection(tr.lastState(), tr.lastDerivative()) : Double.NaN;
            double b = FastMath.abs(l);   // p_t = -1: |p_phi| is the impact parameter
            String at = String.format(Locale.ROOT, "b = %s M", b0);
            out.add(new Check(grp, "deflection angle, " + at + " (rad)", SchwarzschildRays.deflectionExact(b),
                    "Darwin 1959, Proc. R. Soc. A 249, 180: exact integral, Hipparchus quadrature", measured,
                    DEFLECTION_EXACT_TOL));
            out.add(new Check(grp, "deflection angle, " + at + " (rad)", LightReferences.deflectionSecondOrder(b),
                    "Epstein & Shapiro 1980, PRD 22, 2947: 4/b + 15 pi/(4 b^2); tolerance 2 x the third-order term",
                    measured, 2.0 * LightReferences.deflectionThirdOrder(b)));
            double first = 4.0 / b;
            double second = LightReferences.deflectionSecondOrder(b) - first;
            out.add(new Check(grp, "(measured - 4/b) / (15 pi / (4 b^2)), " + at, 1.0,
                    "Epstein & Shapiro 1980: second-order term of the deflection", (measured - first) / second,
                    SECOND_ORDER_TOL * 200.0 / b0));
        }
        return out;
    }

    /** @return the angle between the backward ray's final Cartesian direction and -x (rad) */
    private static double deflection(double[] y, double[] d) {
        double r = y[1];
        double th = y[2];
        double ph = y[3];
        double vx = FastMath.sin(th) * FastMath.cos(ph) * d[1] + r * FastMath.cos(th) * FastMath.cos(ph) * d[2]
                - r * FastMath.sin(th) * FastMath.sin(ph) * d[3];
        double vy = FastMath.sin(th) * FastMath.sin(ph) * d[1] + r * FastMath.cos(th) * FastMath.sin(ph) * d[2]
                + r * FastMath.sin(th) * FastMath.cos(ph) * d[3];
        return FastMath.atan2(-vy, -vx);
    }

    /**
     * Face-on direct image of equatorial rings at {@link #FACE_ON_RADII} around a Schwarzschild
     * hole: the screen radius whose ray first crosses the equator at the ring, by bisection, against
     * the impact parameter from quadrature.
     */
    public static List<Check> faceOn() {
        List<Check> out = new ArrayList<>();
        Spacetime st = MotionChecks.kerr(0.0);
        Camera cam = new Camera(0.0, 0.0, 30.0, 64, START_PLANE);
        ScreenProbe probe = new ScreenProbe(st, cam, TraceSettings.of(30.0, Landmarks.captureRadius(st),
                FACE_ON_SPACING, true));
        for (double re : FACE_ON_RADII) {
            double lo = 0.8 * re;
            double hi = 1.5 * re;
            for (int it = 0; it < FACE_ON_HALVINGS; it++) {
                double mid = 0.5 * (lo + hi);
                if (probe.equatorCrossing(mid, 0.0) < re) {
                    lo = mid;
                } else {
                    hi = mid;
                }
            }
            double expected = SchwarzschildRays.faceOnImpactParameter(re);
            out.add(new Check("Face-on direct image (Schwarzschild)", String.format(Locale.ROOT,
                    "screen radius of the direct image of the ring r = %s M, i = 0 (M)", re), expected,
                    "Darwin 1959 / Luminet 1979, A&A 75, 228, eq. 3: azimuth sweep pi/2, Hipparchus quadrature",
                    0.5 * (lo + hi), FACE_ON_REL * expected));
        }
        return out;
    }
}
