package org.spindrift.sim.scenario;

import java.util.List;
import java.util.SplittableRandom;
import org.spindrift.shared.Coordinates;
import org.spindrift.shared.scenario.CentreOrbit;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.Sense;
import org.spindrift.shared.scenario.Source;
import org.spindrift.shared.scenario.SourceShape;
import org.spindrift.shared.scenario.VelocityModel;
import org.spindrift.sim.motion.ParticleBatch;
import org.spindrift.sim.motion.ZamoFrame;
import org.spindrift.sim.spacetime.CircularOrbits;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Initial conditions of every source's particles, at coordinate time 0.
 *
 * <ul>
 *   <li>Hot spot and cloud: positions Gaussian about the centre along its local radial,
 *       azimuthal and vertical directions (ball: one sigma; ellipsoid: three), in the Cartesian
 *       display coordinates (x = sqrt(r^2 + a^2) sin(theta) cos(phi), ...), mapped back with
 *       {@link Coordinates#boyerLindquist}; draws that land inside the capture radius are drawn
 *       again (a Gaussian truncated at the horizon).</li>
 *   <li>Ring: radii uniform in [inner, outer], azimuths uniform over the arc, in the equatorial
 *       plane.</li>
 *   <li>Velocities are 3-velocities measured by the local zero-angular-momentum observer
 *       ({@link ZamoFrame}): rigid = the centre's local velocity; shear = the centre's plus the
 *       difference of the local circular-orbit velocities at the member's and the centre's
 *       radius (for a ring: exactly the circular orbit at the member's radius); thermal = the
 *       centre's velocity composed relativistically ({@link ZamoFrame#addVelocities}) with an
 *       isotropic Gaussian velocity of the given dispersion in the comoving frame. The
 *       4-momentum is then normalised by {@link ZamoFrame#momentum}.</li>
 *   <li>All draws come from one {@link SplittableRandom} per source, split in source order from
 *       the run seed, so a source's particles depend only on the seed and the sources before it
 *       in the file (not on threads).</li>
 * </ul>
 */
public final class SourceSetup {
    private static final double EQUATOR = 0.5 * Math.PI;
    private static final int MAX_REDRAWS = 1000;

    /**
     * The start of a source's centre.
     *
     * @param r radius, M
     * @param theta polar angle
     * @param phi azimuth
     * @param velocity ZAMO-frame 3-velocity (v_r, v_theta, v_phi), units of c
     * @param periodM the centre's orbital period in coordinate time, M (what "1 orbit" means):
     *     circular orbits 2 pi / |Omega|, orbit elements the measured radial period, ZAMO-velocity starts a
     *     Keplerian estimate
     * @param prediction the metric's prediction of the periods for this centre
     */
    public record Centre(double r, double theta, double phi, double[] velocity, double periodM, Prediction prediction) {
        public Centre {
            velocity = velocity.clone();
        }

        /** @return r, theta, phi, v_r, v_theta, v_phi: the start as plain numbers */
        public double[] start() {
            return new double[] {r, theta, phi, velocity[0], velocity[1], velocity[2]};
        }
    }

    /**
     * The metric's prediction of the periods of a source's centre (coordinate time, M).
     *
     * @param azimuthal azimuthal period
     * @param radial radial period (NaN if none)
     * @param vertical vertical (polar) period (NaN if none)
     * @param advance periastron advance per radial period, radians
     * @param method how it was obtained
     */
    public record Prediction(double azimuthal, double radial, double vertical, double advance, String method) {
        /**
         * Circular equatorial orbit at r: 2 pi / |Omega|, 2 pi / Omega_r, 2 pi / Omega_theta from the
         * epicyclic frequencies, and the epicyclic advance 2 pi (|Omega| / Omega_r - 1) per radial
         * period (small-eccentricity limit; e.g. Binney & Tremaine 2008, Galactic Dynamics, sec. 3.2.3,
         * with the relativistic frequencies).
         */
        static Prediction circular(Spacetime st, double r, boolean prograde) {
            double om = Math.abs(CircularOrbits.omega(st, r, prograde));
            double kr = CircularOrbits.radialEpicyclic(st, r, prograde);
            double kt = CircularOrbits.verticalEpicyclic(st, r, prograde);
            return new Prediction(2 * Math.PI / om, 2 * Math.PI / kr, 2 * Math.PI / kt, 2 * Math.PI * (om / kr - 1),
                    "circular equatorial orbit at r = " + r + " M (epicyclic frequencies)");
        }
    }

    /**
     * The placed particles.
     *
     * @param batch the particles, at t = 0
     * @param sourceIndex the source of each particle
     * @param firstIndex index of each source's first particle (sources are contiguous)
     * @param centres each source's centre
     * @param baseWeights emission weight per particle before the flare envelope
     */
    public record Placed(ParticleBatch batch, int[] sourceIndex, int[] firstIndex, Centre[] centres, double[] baseWeights) {
    }

    private SourceSetup() {
    }

    /** Places every source's particles. */
    public static Placed place(Scenario sc, Spacetime st, double captureRadius) {
        return place(sc, st, captureRadius, centres(sc, st, captureRadius));
    }

    /** @return every source's centre */
    public static Centre[] centres(Scenario sc, Spacetime st, double captureRadius) {
        ZamoFrame zamo = new ZamoFrame(st);
        Centre[] c = new Centre[sc.sources().size()];
        for (int k = 0; k < c.length; k++) {
            c[k] = centre(sc.sources().get(k), st, zamo, captureRadius);
        }
        return c;
    }

    /** Places every source's particles about the given centres. */
    public static Placed place(Scenario sc, Spacetime st, double captureRadius, Centre[] centres) {
        List<Source> sources = sc.sources();
        int n = sc.totalParticles();
        ParticleBatch batch = new ParticleBatch(n);
        int[] sourceIndex = new int[n];
        int[] first = new int[sources.size()];
        double[] weights = new double[n];
        ZamoFrame zamo = new ZamoFrame(st);
        SplittableRandom root = new SplittableRandom(sc.run().seed());
        int at = 0;
        for (int k = 0; k < sources.size(); k++) {
            Source s = sources.get(k);
            SplittableRandom rng = root.split();
            Centre c = centres[k];
            first[k] = at;
            double w = s.emission().weight() / s.particles();
            for (int j = 0; j < s.particles(); j++) {
                sourceIndex[at] = k;
                weights[at] = w;
                member(s, c, st, zamo, rng, captureRadius, batch, at);
                at++;
            }
        }
        return new Placed(batch, sourceIndex, first, centres, weights);
    }

    /** @return the start of a source's centre */
    public static Centre centre(Source s, Spacetime st, ZamoFrame zamo, double captureRadius) {
        CentreOrbit o = s.orbit();
        double phi0 = Math.toRadians(o.phiDeg());
        if (o instanceof CentreOrbit.Circular c) {
            boolean pro = c.sense() == Sense.PROGRADE;
            double om = CircularOrbits.omega(st, c.radiusM(), pro);
            double[] v = circularVelocity(st, zamo, c.radiusM(), pro);
            return new Centre(c.radiusM(), EQUATOR, phi0, v, 2.0 * Math.PI / Math.abs(om),
                    Prediction.circular(st, c.radiusM(), pro));
        }
        if (o instanceof CentreOrbit.Elements e) {
            return ElementsStart.centre(e, st, zamo, captureRadius);
        }
        CentreOrbit.ZamoVelocity l = (CentreOrbit.ZamoVelocity) o;
        double th = Math.toRadians(l.thetaDeg());
        boolean pro = l.vPhi() >= 0;
        double om = CircularOrbits.omega(st, l.radiusM(), pro);
        // "1 orbit" of a free start: the Keplerian period 2 pi a^1.5 with a from the Newtonian
        // vis-viva relation a = 1 / (2/r - v^2) (Kepler's third law, G = M = 1); an approximation
        // for a duration unit only. Falls back to the circular period at r when unbound.
        double v2 = l.vR() * l.vR() + l.vTheta() * l.vTheta() + l.vPhi() * l.vPhi();
        double inv = 2.0 / l.radiusM() - v2;
        double period = inv > 0 ? 2.0 * Math.PI * Math.pow(1.0 / inv, 1.5) : 2.0 * Math.PI / Math.abs(om);
        return new Centre(l.radiusM(), th, phi0, new double[] {l.vR(), l.vTheta(), l.vPhi()}, period,
                Prediction.circular(st, l.radiusM(), pro));
    }

    /** @return the ZAMO-frame velocity (0, 0, v_phi) of the circular equatorial orbit at r, NaN if none */
    static double[] circularVelocity(Spacetime st, ZamoFrame zamo, double r, boolean prograde) {
        double e = CircularOrbits.energy(st, r, prograde);
        double l = CircularOrbits.angularMomentum(st, r, prograde);
        double[] v = new double[3];
        zamo.localVelocity(r, EQUATOR, -e, 0.0, 0.0, l, v);
        return v;
    }

    private static void member(Source s, Centre c, Spacetime st, ZamoFrame zamo, SplittableRandom rng,
            double captureRadius, ParticleBatch batch, int i) {
        double[] pos = new double[3];
        double[] v = new double[3];
        boolean pro = c.velocity()[2] >= 0;
        for (int attempt = 0; ; attempt++) {
            if (attempt == MAX_REDRAWS) {
                throw new IllegalStateException("source " + s.name() + ": could not place a particle outside r = "
                        + captureRadius + " in " + MAX_REDRAWS + " draws");
            }
            if (s.shape() instanceof SourceShape.Ring ring) {
                double r = ring.innerRadiusM() + (ring.outerRadiusM() - ring.innerRadiusM()) * rng.nextDouble();
                double ph = c.phi() + Math.toRadians(ring.arcDeg()) * (rng.nextDouble() - 0.5);
                pos[0] = r;
                pos[1] = EQUATOR;
                pos[2] = ph;
            } else {
                drawOffset(s.shape(), c, st.spin(), rng, pos);
            }
            if (pos[0] > captureRadius) {
                break;
            }
        }
        velocity(s, c, st, zamo, rng, pos[0], pro, v);
        double[] p = new double[4];
        zamo.momentum(pos[0], pos[1], v[0], v[1], v[2], p);
        batch.set(i, 0.0, pos[0], pos[1], pos[2], p[0], p[1], p[2], p[3]);
    }

    /** Gaussian offset about the centre in Cartesian display coordinates; result (r, theta, phi) in pos. */
    private static void drawOffset(SourceShape shape, Centre c, double spin, SplittableRandom rng, double[] pos) {
        double sr;
        double sp;
        double sz;
        if (shape instanceof SourceShape.Ball b) {
            sr = b.sigmaM();
            sp = b.sigmaM();
            sz = b.sigmaM();
        } else {
            SourceShape.Ellipsoid e = (SourceShape.Ellipsoid) shape;
            sr = e.radialM();
            sp = e.azimuthalM();
            sz = e.verticalM();
        }
        double[] xc = new double[3];
        Coordinates.cartesian(c.r(), c.theta(), c.phi(), spin, xc);
        double st = Math.sin(c.theta());
        double ct = Math.cos(c.theta());
        double sph = Math.sin(c.phi());
        double cph = Math.cos(c.phi());
        // local unit vectors at the centre: radial, azimuthal, vertical (= -e_theta)
        double[] er = {st * cph, st * sph, ct};
        double[] ep = {-sph, cph, 0.0};
        double[] ez = {-ct * cph, -ct * sph, st};
        double g1 = sr * rng.nextGaussian();
        double g2 = sp * rng.nextGaussian();
        double g3 = sz * rng.nextGaussian();
        double x = xc[0] + g1 * er[0] + g2 * ep[0] + g3 * ez[0];
        double y = xc[1] + g1 * er[1] + g2 * ep[1] + g3 * ez[1];
        double z = xc[2] + g1 * er[2] + g2 * ep[2] + g3 * ez[2];
        Coordinates.boyerLindquist(x, y, z, spin, pos);
        // keep phi continuous with the centre's azimuth (the integrator's phi is not wrapped)
        pos[2] = c.phi() + Math.IEEEremainder(pos[2] - c.phi(), 2.0 * Math.PI);
    }

    private static void velocity(Source s, Centre c, Spacetime st, ZamoFrame zamo, SplittableRandom rng, double r,
            boolean pro, double[] out) {
        double[] vc = c.velocity();
        VelocityModel m = s.velocity();
        boolean ring = s.shape() instanceof SourceShape.Ring;
        double[] base = vc.clone();
        if (m.kind() == VelocityModel.Kind.SHEAR || (ring && m.kind() == VelocityModel.Kind.THERMAL)) {
            double[] vi = circularVelocity(st, zamo, r, pro);
            if (ring) {
                base = vi;
            } else {
                double[] v0 = circularVelocity(st, zamo, c.r(), pro);
                if (Double.isFinite(vi[2]) && Double.isFinite(v0[2])) {
                    base[2] = vc[2] + vi[2] - v0[2];
                }
            }
        }
        if (m.kind() == VelocityModel.Kind.THERMAL) {
            double[] w = new double[3];
            do {
                w[0] = m.dispersion() * rng.nextGaussian();
                w[1] = m.dispersion() * rng.nextGaussian();
                w[2] = m.dispersion() * rng.nextGaussian();
            } while (w[0] * w[0] + w[1] * w[1] + w[2] * w[2] >= 0.98);
            ZamoFrame.addVelocities(base, w, out);
        } else {
            System.arraycopy(base, 0, out, 0, 3);
        }
        double v2 = out[0] * out[0] + out[1] * out[1] + out[2] * out[2];
        if (!(v2 < 0.9999)) {
            // a member placed where the shifted velocity would be superluminal keeps the centre's
            System.arraycopy(vc, 0, out, 0, 3);
        }
    }
}
