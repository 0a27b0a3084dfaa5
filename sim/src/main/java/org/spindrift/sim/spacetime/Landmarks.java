package org.spindrift.sim.spacetime;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.function.DoubleUnaryOperator;
import org.hipparchus.util.FastMath;
import org.spindrift.shared.archive.ArchiveLayout;

/**
 * The metric landmarks of a {@link Spacetime}, computed numerically for any member: radii in M, frequencies in 1/M, NaN where a landmark does not exist (null in
 * {@link #toMap()}). Immutable.
 *
 * <p>Definitions (prograde / retrograde as in {@link CircularOrbits}: Omega &gt; 0 / &lt; 0):
 * <ul>
 *   <li>{@code horizon_outer}: {@link Horizons#outer}.</li>
 *   <li>{@code ergosurface_equator}: the outermost root of g_tt(r, pi/2) = 0 (static limit).</li>
 *   <li>{@code photon_orbit_*}: the outermost radius where the circular orbit becomes null,
 *       g_tt + 2 Omega g_tphi + Omega^2 g_phiphi = 0 (Bardeen, Press &amp; Teukolsky 1972, ApJ 178,
 *       347, sec. II for Kerr).</li>
 *   <li>{@code isco_*}: the inner edge of the band of stable circular orbits that reaches
 *       infinity: the outermost root of Omega_r^2 = 0 (where dE/dr = dL/dr = 0, BPT 1972
 *       sec. II for Kerr) or of Omega_theta^2 = 0, whichever lies further out. Kerr orbits are
 *       always vertically stable, so there it is the BPT radius; Johannsen-Psaltis orbits with
 *       epsilon_3 &gt; 0 at high spin turn vertically unstable first, as Johannsen &amp; Psaltis
 *       2011 note (recalled from memory). Null when circular orbits stay stable down to the
 *       photon orbit, the horizon or the place where circular orbits cease to exist.</li>
 *   <li>{@code marginally_bound_prograde}: the outermost radius with E = 1 (BPT 1972 sec. II).</li>
 *   <li>{@code omega_max_*}: the outermost maximum of the prograde Omega(r), i.e. the outermost
 *       root of dOmega/dr, searched only where prograde circular orbits are timelike and
 *       connected to infinity; null when Omega grows monotonically inwards (as in Kerr).</li>
 *   <li>{@code capture_radius}: where particles and rays are stopped, see
 *       {@link #captureRadius()}; the only such cut-off in the project.</li>
 * </ul>
 * Searches cover r up to {@value #R_OUT} M on a geometric grid of
 * {@value RadialSearch#POINTS_PER_DECADE} points per decade, each sign change polished with
 * Hipparchus' Brent solver to about 1e-15 relative.
 */
public final class Landmarks {
    /** Outer end of the landmark searches, M. */
    public static final double R_OUT = 1000.0;
    /** Smallest surface radius of a horizonless object, M. */
    public static final double MIN_SURFACE = 0.05;
    /** Surface radius as a fraction of the innermost circular-orbit landmark. */
    public static final double SURFACE_FRACTION = 0.5;
    /**
     * Margin added to the outer horizon for the capture radius, M (common practice, no source:
     * Boyer-Lindquist-like coordinates are singular at the horizon, where coordinate-time steps
     * shrink without bound, so trajectories end just outside it).
     */
    public static final double CAPTURE_MARGIN = 0.01;

    private final String family;
    private final double spin;
    private final double horizonOuter;
    private final double ergosurfaceEquator;
    private final double iscoPrograde;
    private final double iscoRetrograde;
    private final double photonOrbitPrograde;
    private final double photonOrbitRetrograde;
    private final double marginallyBoundPrograde;
    private final double omegaMaxRadius;
    private final double omegaMaxValue;
    private final double captureRadius;

    private Landmarks(String family, double spin, double[] v) {
        this.family = family;
        this.spin = spin;
        this.horizonOuter = v[0];
        this.ergosurfaceEquator = v[1];
        this.iscoPrograde = v[2];
        this.iscoRetrograde = v[3];
        this.photonOrbitPrograde = v[4];
        this.photonOrbitRetrograde = v[5];
        this.marginallyBoundPrograde = v[6];
        this.omegaMaxRadius = v[7];
        this.omegaMaxValue = v[8];
        this.captureRadius = Double.isNaN(v[0]) ? v[9] : v[0] + CAPTURE_MARGIN;
    }

    /** Computes the landmarks of st (a few tens of milliseconds). */
    public static Landmarks of(Spacetime st) {
        final double rh = Horizons.outer(st);
        final boolean horizon = !Double.isNaN(rh);
        final double rReg = horizon ? Double.NaN : regularityLimit(st);
        // innermost radius of the searches: just outside the horizon, or the regular region
        final double rIn = horizon ? rh * (1.0 + 1e-9) : FastMath.max(rReg * (1.0 + 1e-6), 1e-3);

        final double[] g = new double[Spacetime.SIZE];
        final double ergo = RadialSearch.outermostRoot(r -> {
            st.covariant(r, 0.5 * FastMath.PI, g);
            return g[Spacetime.TT];
        }, R_OUT, horizon ? 0.5 * rh : rIn, false);

        double[] photon = new double[2];
        double[] isco = new double[2];
        for (int k = 0; k < 2; k++) {
            final boolean pro = k == 0;
            photon[k] = RadialSearch.outermostRoot(r -> CircularOrbits.timelikeNorm(st, r, pro), R_OUT, rIn, false);
            // stable means both epicyclic frequencies real: the ISCO is the outer one of the
            // radial and the vertical marginal-stability radii
            double radial = RadialSearch.outermostRoot(
                    r -> CircularOrbits.radialEpicyclicSquared(st, r, pro), R_OUT, rIn, false);
            double vertical = RadialSearch.outermostRoot(
                    r -> CircularOrbits.verticalEpicyclicSquared(st, r, pro), R_OUT, rIn, false);
            isco[k] = Double.isNaN(vertical) ? radial : Double.isNaN(radial) ? vertical : FastMath.max(radial, vertical);
        }
        final double mb = RadialSearch.outermostRoot(r -> CircularOrbits.energy(st, r, true) - 1.0, R_OUT, rIn, false);
        // dOmega/dr < 0 far out; only where prograde orbits are timelike (NaN ends the search)
        final DoubleUnaryOperator slope = r -> CircularOrbits.timelikeNorm(st, r, true) > 0.0
                ? CircularOrbits.omegaDerivative(st, r, true) : Double.NaN;
        final double wMaxR = RadialSearch.outermostRoot(slope, R_OUT, rIn, false);
        final double wMax = Double.isNaN(wMaxR) ? Double.NaN : CircularOrbits.omega(st, wMaxR, true);

        double surface = Double.NaN;
        if (!horizon) {
            double inner = Double.POSITIVE_INFINITY;
            for (double x : new double[] {ergo, photon[0], photon[1], isco[0], isco[1], mb, wMaxR}) {
                if (!Double.isNaN(x)) {
                    inner = FastMath.min(inner, x);
                }
            }
            surface = Double.isInfinite(inner) ? MIN_SURFACE : SURFACE_FRACTION * inner;
            surface = FastMath.max(surface, MIN_SURFACE);
            if (!Double.isNaN(rReg) && rReg > 0.0) {
                surface = FastMath.max(surface, 1.1 * rReg);
            }
        }
        return new Landmarks(st.family(), st.spin(), new double[] {rh, ergo, isco[0], isco[1], photon[0], photon[1],
            mb, wMaxR, wMax, surface});
    }

    /**
     * Outermost radius where a horizonless member stops being a regular Lorentzian metric:
     * for Johannsen-Psaltis the outermost root over theta of W = Delta + a^2 sin^2 h or of
     * 1 + h (g_rr changes sign there); 0 for the mass-function family, whose only irregular
     * place without a horizon is the ring r = 0 (Kerr's ring singularity; the regular cores
     * are finite there).
     */
    static double regularityLimit(Spacetime st) {
        if (!(st instanceof JohannsenPsaltisSpacetime jp)) {
            return 0.0;
        }
        double best = 0.0;
        for (int k = 0; k <= 8; k++) {
            final double th = 0.5 * FastMath.PI * k / 8;
            double w = RadialSearch.outermostRoot(r -> jp.w(r, th), Horizons.R_MAX, Horizons.R_MIN, true);
            double f = RadialSearch.outermostRoot(r -> 1.0 + jp.h(r, th), Horizons.R_MAX, Horizons.R_MIN, false);
            for (double x : new double[] {w, f}) {
                if (!Double.isNaN(x)) {
                    best = FastMath.max(best, x);
                }
            }
        }
        return best;
    }

    /** @return the family of the spacetime these landmarks belong to */
    public String family() {
        return family;
    }

    /** @return the spin a */
    public double spin() {
        return spin;
    }

    /** @return the outer horizon radius, NaN if none */
    public double horizonOuter() {
        return horizonOuter;
    }

    /** @return true when the object has a horizon */
    public boolean hasHorizon() {
        return !Double.isNaN(horizonOuter);
    }

    /** @return the equatorial radius of the ergosurface (g_tt = 0), NaN if none */
    public double ergosurfaceEquator() {
        return ergosurfaceEquator;
    }

    /** @return the ISCO radius of the given sense, NaN if none */
    public double isco(boolean prograde) {
        return prograde ? iscoPrograde : iscoRetrograde;
    }

    /** @return the circular photon orbit radius of the given sense, NaN if none */
    public double photonOrbit(boolean prograde) {
        return prograde ? photonOrbitPrograde : photonOrbitRetrograde;
    }

    /** @return the prograde marginally bound radius (E = 1), NaN if none */
    public double marginallyBoundPrograde() {
        return marginallyBoundPrograde;
    }

    /** @return the radius of the maximum of the prograde Omega(r), NaN if none */
    public double omegaMaxRadius() {
        return omegaMaxRadius;
    }

    /** @return the maximum of the prograde Omega(r), 1/M, NaN if none */
    public double omegaMaxValue() {
        return omegaMaxValue;
    }

    /**
     * The capture radius {@code capture_radius}: particles and rays that reach r below it are
     * stopped (end state captured), and scenario orbits must start outside it. One definition
     * for the whole project:
     * <ul>
     *   <li>with a horizon: the outer horizon + {@value #CAPTURE_MARGIN} M;</li>
     *   <li>without one: a surface of our choice (no published convention):
     *       {@value #SURFACE_FRACTION} times the innermost of the other landmark radii that exist
     *       (ergosurface, ISCOs, photon orbits, marginally bound orbit, Omega maximum), at least
     *       {@value #MIN_SURFACE} M, and at least 1.1 times the radius where the metric stops
     *       being regular ({@link #regularityLimit}). Everything the landmarks describe lies well
     *       outside it.</li>
     * </ul>
     */
    public double captureRadius() {
        return captureRadius;
    }

    /**
     * @return the capture radius of st ({@link #captureRadius()}); with a horizon without
     *     computing the other landmarks
     */
    public static double captureRadius(Spacetime st) {
        double rh = Horizons.outer(st);
        return Double.isNaN(rh) ? of(st).captureRadius() : rh + CAPTURE_MARGIN;
    }

    /**
     * @return the landmarks under the keys of {@code landmarks --json}: horizon_outer,
     *     ergosurface_equator, isco_prograde, isco_retrograde, photon_orbit_prograde,
     *     photon_orbit_retrograde, marginally_bound_prograde, omega_max_radius, omega_max_value,
     *     capture_radius, in that order; absent landmarks as null
     */
    public Map<String, Double> toMap() {
        Map<String, Double> m = new LinkedHashMap<>();
        m.put(ArchiveLayout.LM_HORIZON_OUTER, nullable(horizonOuter));
        m.put(ArchiveLayout.LM_ERGOSURFACE_EQUATOR, nullable(ergosurfaceEquator));
        m.put(ArchiveLayout.LM_ISCO_PROGRADE, nullable(iscoPrograde));
        m.put(ArchiveLayout.LM_ISCO_RETROGRADE, nullable(iscoRetrograde));
        m.put(ArchiveLayout.LM_PHOTON_ORBIT_PROGRADE, nullable(photonOrbitPrograde));
        m.put(ArchiveLayout.LM_PHOTON_ORBIT_RETROGRADE, nullable(photonOrbitRetrograde));
        m.put(ArchiveLayout.LM_MARGINALLY_BOUND_PROGRADE, nullable(marginallyBoundPrograde));
        m.put(ArchiveLayout.LM_OMEGA_MAX_RADIUS, nullable(omegaMaxRadius));
        m.put(ArchiveLayout.LM_OMEGA_MAX_VALUE, nullable(omegaMaxValue));
        m.put(ArchiveLayout.LM_CAPTURE_RADIUS, nullable(captureRadius));
        return m;
    }

    private static Double nullable(double x) {
        return Double.isNaN(x) ? null : x;
    }

    @Override public String toString() {
        return "Landmarks" + toMap();
    }
}
