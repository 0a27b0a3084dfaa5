package org.spindrift.validation;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.motion.BatchIntegrator;
import org.spindrift.sim.motion.GeodesicEquations;
import org.spindrift.sim.motion.HipparchusOde;
import org.spindrift.sim.motion.MinoFrequencies;
import org.spindrift.sim.motion.OrbitElements;
import org.spindrift.sim.motion.OrbitMeasurement;
import org.spindrift.sim.motion.OrbitSetup;
import org.spindrift.sim.motion.ParticleBatch;
import org.spindrift.sim.motion.Predictions;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.MassFunctions;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The motion checks: periastron advance against the exact Schwarzschild result and
 * the post-Newtonian expansions (with the slope of the residuals), Kerr periods and advance
 * against quadrature of the potentials, and trajectories against Hipparchus'
 * DormandPrince853Integrator. Tolerances are named constants here, each with its reason.
 */
public final class MotionChecks {
    /** Integrator tolerance (absolute and relative) used for every measured orbit. */
    public static final double TOLERANCE = 1e-13;
    /** Eccentricity of the Schwarzschild series. */
    public static final double SERIES_E = 0.3;
    /** Semi-latus recta of the Schwarzschild series. */
    public static final double[] SERIES_P = {8, 10, 15, 25, 50, 100, 200, 400, 800, 1600};
    /** Radial periods measured per Schwarzschild orbit. */
    public static final int SERIES_ORBITS = 10;
    /** Smallest p used in the residual-slope fits (the p^-(n+1) law is asymptotic). */
    public static final double SLOPE_FROM_P = 50;
    /**
     * Allowed |measured - exact| advance (rad): the measured phase error over N orbits at
     * tolerance 1e-13 is about 1e-11 rad, so 1e-9 leaves two orders of margin (our choice).
     */
    public static final double ADVANCE_TOL = 1e-9;
    /**
     * Allowed deviation of the residual slope from the next order: for p &gt;= 50 the higher
     * terms shift the fitted slope by about 0.03 (computed from the exact formula), so 0.1.
     */
    public static final double SLOPE_TOL = 0.1;
    /** Relative tolerance of Kerr equatorial periods and advance against quadrature. */
    public static final double KERR_EQUATORIAL_REL = 1e-9;
    /**
     * Radial periods measured for inclined Kerr orbits: their per-period values fluctuate with
     * the incommensurate polar phase; the windowed means of {@link OrbitMeasurement} reach about
     * 1e-8 relative after a few hundred periods (measured while writing this suite).
     */
    public static final int INCLINED_ORBITS = 300;
    /** Relative tolerance for inclined Kerr orbits (about 100 x the residual seen at 300-400 periods). */
    public static final double KERR_INCLINED_REL = 1e-6;
    /**
     * Allowed R(r)/r_a^4 at the set-up's turning points: the quartic's terms are of order 1 after the
     * scaling and cancel to a few ulps each (about 50 ulps in all, our choice).
     */
    public static final double QUARTIC_ROOT_TOL = 1e-14;
    /** Quadrature nodes per period (midpoint rule, exponentially convergent). */
    public static final int NODES = 512;
    /**
     * Agreement with Hipparchus, relative to max(1, |y|): both integrators keep the local error
     * near the tolerance 1e-12; over about 100 steps per 5 orbits the global difference can
     * grow to about 1e2-1e3 times it (common practice, no source), so 1e3 x tolerance.
     */
    public static final double HIPPARCHUS_TOL = 1e-12;
    /** Factor on {@link #HIPPARCHUS_TOL} allowed for the global difference. */
    public static final double HIPPARCHUS_FACTOR = 1e3;

    /** A Kerr orbit of the suite. */
    public record KerrCase(String name, double a, double p, double e, double inclinationDeg) {
    }

    /** Kerr cases: equatorial and inclined, prograde and retrograde. */
    public static final List<KerrCase> KERR_CASES = List.of(
            new KerrCase("equatorial prograde", 0.9, 8, 0.3, 0),
            new KerrCase("equatorial retrograde", 0.9, 12, 0.3, 180),
            new KerrCase("inclined prograde", 0.9, 10, 0.4, 30),
            new KerrCase("inclined retrograde", 0.7, 14, 0.5, 140));

    /** Measured Schwarzschild advance for each p of {@link #SERIES_P} (for the plot). */
    public record Series(double e, double[] p, double[] measured) {
    }

    private MotionChecks() {
    }

    static Spacetime kerr(double a) {
        return new MassFunctionSpacetime("kerr", a, MassFunctions.constant());
    }

    static BatchIntegrator.Config config(Spacetime st, double tol) {
        return BatchIntegrator.Config.of(Landmarks.captureRadius(st)).withTolerance(tol, tol).withEscapeRadius(1e5);
    }

    static OrbitMeasurement.Result measure(Spacetime st, OrbitElements.Solution s, int orbits) {
        return OrbitMeasurement.measure(st, s.start(), orbits, config(st, TOLERANCE), 8,
                OrbitMeasurement.keplerPeriod(s.p(), s.e()));
    }

    /** @return the measured Schwarzschild advance series */
    public static Series schwarzschildSeries() {
        Spacetime st = kerr(0.0);
        double[] m = new double[SERIES_P.length];
        for (int i = 0; i < SERIES_P.length; i++) {
            OrbitElements.Solution s = OrbitElements.solve(st, SERIES_P[i], SERIES_E, 0.0);
            m[i] = measure(st, s, SERIES_ORBITS).advance();
        }
        return new Series(SERIES_E, SERIES_P.clone(), m);
    }

    /** Schwarzschild advance vs the exact closed form, and the slopes of the 1PN and 2PN residuals. */
    public static List<Check> schwarzschild(Series series) {
        List<Check> out = new ArrayList<>();
        String g = "Schwarzschild periastron advance";
        for (int i = 0; i < series.p().length; i++) {
            double p = series.p()[i];
            out.add(new Check(g, String.format(Locale.ROOT, "advance per radial period, p = %s, e = %s (rad)", p,
                    series.e()), SchwarzschildPrecession.exact(p, series.e()),
                    "Cutler, Kennefick & Poisson 1994, PRD 50, 3816 (elliptic-integral closed form, K by AGM)",
                    series.measured()[i], ADVANCE_TOL));
        }
        List<double[]> r1 = new ArrayList<>();
        List<double[]> r2 = new ArrayList<>();
        for (int i = 0; i < series.p().length; i++) {
            double p = series.p()[i];
            if (p < SLOPE_FROM_P) {
                continue;
            }
            double m = series.measured()[i];
            r1.add(new double[] {FastMath.log(p), FastMath.log(FastMath.abs(m - Predictions.advance1pn(p)))});
            r2.add(new double[] {FastMath.log(p), FastMath.log(FastMath.abs(m - Predictions.advance2pn(p, series.e())))});
        }
        String gs = "Post-Newtonian convergence";
        out.add(new Check(gs, String.format(Locale.ROOT,
                "slope of log|measured - 1PN| vs log p, p >= %s", SLOPE_FROM_P), -2.0,
                "next order of the 1PN expansion 6 pi/p (Einstein 1915): residual ~ p^-2", slope(r1), SLOPE_TOL));
        out.add(new Check(gs, String.format(Locale.ROOT,
                "slope of log|measured - 2PN| vs log p, p >= %s", SLOPE_FROM_P), -3.0,
                "next order of the 2PN test-mass expansion (Damour & Schafer 1988): residual ~ p^-3", slope(r2),
                SLOPE_TOL));
        return out;
    }

    /** Spin of the Lense-Thirring checks. */
    public static final double LT_SPIN = 0.9;
    /** Semi-latus recta of the Lense-Thirring checks. */
    public static final double[] LT_P = {400, 1600, 6400};

    /**
     * The leading spin term: the ratio of (Kerr equatorial advance - Schwarzschild exact advance)
     * to the Lense-Thirring term -+8 pi a / p^(3/2) must approach 1, prograde and retrograde. The
     * next spin terms (a / p^(5/2), a^2 / p^2) are smaller by about p^(-1/2), so the tolerance is
     * 0.1 sqrt(400 / p) (our choice; no published coefficients used).
     */
    public static List<Check> lenseThirring() {
        List<Check> out = new ArrayList<>();
        Spacetime st = kerr(LT_SPIN);
        for (boolean prograde : new boolean[] {true, false}) {
            for (double p : LT_P) {
                OrbitElements.Solution s = OrbitElements.solve(st, p, SERIES_E, prograde ? 0.0 : FastMath.PI);
                double spinPart = measure(st, s, SERIES_ORBITS).advance() - SchwarzschildPrecession.exact(p, SERIES_E);
                double lt = Predictions.advanceSpin(LT_SPIN, p, prograde);
                out.add(new Check("Spin term", String.format(Locale.ROOT,
                        "(Kerr - Schwarzschild advance) / (%s8 pi a p^-3/2), %s, a = %s, p = %s, e = %s",
                        prograde ? "-" : "+", prograde ? "prograde" : "retrograde", LT_SPIN, p, SERIES_E), 1.0,
                        "Lense & Thirring 1918 (equatorial periapsis term, see Predictions.advanceSpin)",
                        spinPart / lt, 0.1 * FastMath.sqrt(400 / p)));
            }
        }
        return out;
    }

    /** Kerr periods and advance vs quadrature, and the set-up's turning points vs the Kerr quartic. */
    public static List<Check> kerr() {
        List<Check> out = new ArrayList<>();
        String src = "quadrature of R(r), Theta(theta) in Mino time (Schmidt 2002; Fujita & Hikida 2009)";
        for (KerrCase c : KERR_CASES) {
            Spacetime st = kerr(c.a());
            OrbitElements.Solution s = OrbitElements.solve(st, c.p(), c.e(), FastMath.toRadians(c.inclinationDeg()));
            boolean eq = s.equatorial();
            OrbitMeasurement.Result m = measure(st, s, eq ? SERIES_ORBITS : INCLINED_ORBITS);
            MinoFrequencies.Result ref = MinoFrequencies.compute((MassFunctionSpacetime) st, s, NODES);
            double rel = eq ? KERR_EQUATORIAL_REL : KERR_INCLINED_REL;
            String name = String.format(Locale.ROOT, "%s (a = %s, p = %s, e = %s, iota = %s deg)", c.name(), c.a(),
                    c.p(), c.e(), c.inclinationDeg());
            String g = "Kerr fundamental periods: " + c.name();
            out.add(new Check(g, "radial period T_r (M), " + name, ref.periodRadial(), src, m.periodRadial(),
                    rel * FastMath.abs(ref.periodRadial())));
            out.add(new Check(g, "azimuthal period T_phi (M), " + name, ref.periodAzimuthal(), src,
                    m.periodAzimuthal(), rel * FastMath.abs(ref.periodAzimuthal())));
            if (!eq) {
                out.add(new Check(g, "polar period T_theta (M), " + name, ref.periodPolar(), src, m.periodPolar(),
                        rel * FastMath.abs(ref.periodPolar())));
            }
            out.add(new Check(g, "periastron advance per radial period (rad), " + name, ref.advance(), src,
                    m.advance(), rel * 2 * FastMath.PI));
            double scale = FastMath.pow(s.apoapsis(), 4);
            out.add(new Check(g, "Kerr quartic R(r_p)/r_a^4 of the Schmidt set-up, " + name, 0.0,
                    "Schmidt 2002, CQG 19, 2743: r_p is a root of R", kerrQuartic(c.a(), s.periapsis(),
                    s.energy(), s.angularMomentum(), s.carter()) / scale, QUARTIC_ROOT_TOL));
            out.add(new Check(g, "Kerr quartic R(r_a)/r_a^4 of the Schmidt set-up, " + name, 0.0,
                    "Schmidt 2002, CQG 19, 2743: r_a is a root of R", kerrQuartic(c.a(), s.apoapsis(),
                    s.energy(), s.angularMomentum(), s.carter()) / scale, QUARTIC_ROOT_TOL));
        }
        return out;
    }

    /**
     * @return the Kerr radial potential R(r) expanded as a quartic (Schmidt 2002, eq. 4 expanded;
     *     Carter 1968), written out here independently of the engine's metric code
     */
    static double kerrQuartic(double a, double r, double en, double l, double q) {
        return (en * en - 1) * r * r * r * r + 2 * r * r * r + (a * a * (en * en - 1) - l * l - q) * r * r
                + 2 * ((a * en - l) * (a * en - l) + q) * r - a * a * q;
    }

    /** The engine's trajectories against Hipparchus' DormandPrince853Integrator on the same equations. */
    public static List<Check> hipparchus() {
        List<Check> out = new ArrayList<>();
        List<KerrCase> cases = new ArrayList<>(KERR_CASES);
        cases.add(0, new KerrCase("Schwarzschild", 0.0, 10, 0.5, 0));
        for (KerrCase c : cases) {
            Spacetime st = kerr(c.a());
            OrbitElements.Solution s = OrbitElements.solve(st, c.p(), c.e(), FastMath.toRadians(c.inclinationDeg()));
            double tEnd = 5 * OrbitMeasurement.keplerPeriod(c.p(), c.e());
            int n = 50;
            double[] times = new double[n];
            for (int k = 0; k < n; k++) {
                times[k] = tEnd * (k + 1) / n;
            }
            double[][] ours = new double[n][3];
            ParticleBatch b = new ParticleBatch(1);
            b.set(0, 0.0, s.start());
            new BatchIntegrator(st, config(st, HIPPARCHUS_TOL)).integrate(b, times, (k, t, snap) -> {
                ours[k][0] = snap.r(0);
                ours[k][1] = snap.theta(0);
                ours[k][2] = snap.phi(0);
            });
            double[][] ref = hipparchusTrajectory(st, s, times);
            double worst = 0;
            for (int k = 0; k < n; k++) {
                for (int j = 0; j < 3; j++) {
                    worst = FastMath.max(worst, FastMath.abs(ours[k][j] - ref[k][j]) / FastMath.max(1, FastMath.abs(ref[k][j])));
                }
            }
            out.add(new Check("Reference integrator", String.format(Locale.ROOT,
                    "max relative difference of r, theta, phi at 50 times over 5 orbits, %s (a = %s, p = %s, e = %s,"
                            + " iota = %s deg), tolerance %.0e", c.name(), c.a(), c.p(), c.e(), c.inclinationDeg(),
                    HIPPARCHUS_TOL), 0.0, "Hipparchus 4.0.2 DormandPrince853Integrator, same equations and tolerance",
                    worst, HIPPARCHUS_FACTOR * HIPPARCHUS_TOL));
        }
        return out;
    }

    /** @return rows (r, theta, phi) at the given times from Hipparchus */
    static double[][] hipparchusTrajectory(Spacetime st, OrbitElements.Solution s, double[] times) {
        var x = s.start();
        double[][] ys = new HipparchusOde(new GeodesicEquations(st), x.pT(), x.pPhi()).sample(0,
                new double[] {x.r(), x.theta(), x.phi(), x.pR(), x.pTheta()}, times, HIPPARCHUS_TOL, 1e4);
        double[][] out = new double[times.length][];
        for (int k = 0; k < times.length; k++) {
            out[k] = new double[] {ys[k][0], ys[k][1], ys[k][2]};
        }
        return out;
    }

    /** @return the least-squares slope of y on x over the rows (x, y) (ordinary least squares) */
    public static double slope(List<double[]> xy) {
        double n = xy.size();
        double sx = 0;
        double sy = 0;
        for (double[] v : xy) {
            sx += v[0];
            sy += v[1];
        }
        double mx = sx / n;
        double my = sy / n;
        double sxy = 0;
        double sxx = 0;
        for (double[] v : xy) {
            sxy += (v[0] - mx) * (v[1] - my);
            sxx += (v[0] - mx) * (v[0] - mx);
        }
        return sxy / sxx;
    }
}
