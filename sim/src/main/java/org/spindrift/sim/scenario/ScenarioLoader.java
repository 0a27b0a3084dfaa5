package org.spindrift.sim.scenario;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.spindrift.shared.Units;
import org.spindrift.shared.colour.ColourRamp;
import org.spindrift.shared.scenario.BlackHole;
import org.spindrift.shared.scenario.CentreOrbit;
import org.spindrift.shared.scenario.Emission;
import org.spindrift.shared.scenario.EmissionSum;
import org.spindrift.shared.scenario.Flare;
import org.spindrift.shared.scenario.Imaging;
import org.spindrift.shared.scenario.Instrument;
import org.spindrift.shared.scenario.Interferometer;
import org.spindrift.shared.scenario.Observer;
import org.spindrift.shared.scenario.RunSettings;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.Sense;
import org.spindrift.shared.scenario.Source;
import org.spindrift.shared.scenario.SourceShape;
import org.spindrift.shared.scenario.TimeSpan;
import org.spindrift.shared.scenario.VelocityModel;
import org.spindrift.sim.scenario.ConfigSection.Range;

/**
 * Reads and checks a scenario file (YAML or JSON; keys documented in configs/README.md). Every
 * problem is one {@link org.spindrift.shared.UserInputException} naming file, line and key path;
 * nothing is created on disk. This is the syntactic and range check; {@link ScenarioChecks} adds
 * the checks that need the metric (spin range, orbit radii, horizon).
 */
public final class ScenarioLoader {
    /** Largest number of particles per source. */
    public static final int MAX_PARTICLES = 5_000_000;
    /** Largest distance, Mpc. */
    public static final double MAX_DISTANCE_MPC = 1.0e4;

    private ScenarioLoader() {
    }

    /** Reads and checks a file. */
    public static LoadedScenario load(Path file) {
        return load(file, ConfigTreeReader.read(file));
    }

    /**
     * Checks a scenario tree already read (for example a sweep's base scenario with axis values
     * put in); messages name {@code file} and the lines the tree's nodes carry.
     */
    public static LoadedScenario load(Path file, ConfigNode root) {
        ConfigSection.LineIndex lines = new ConfigSection.LineIndex();
        if (!(root instanceof ConfigNode.Obj obj)) {
            throw ConfigSection.error(file, root.line(), "", "the file must be a mapping of keys (black_hole, observer,"
                    + " sources, run, ...), got " + root.typeName());
        }
        ConfigSection top = new ConfigSection(file, "", obj, lines);
        top.allow("name", "description", "black_hole", "observer", "sources", "run", "imaging", "instrument",
                "interferometer");
        String fileName = file.getFileName().toString();
        String dflt = fileName.replaceFirst("\\.(ya?ml|json)$", "");
        String name = top.string("name", dflt);
        if (!name.matches("[A-Za-z0-9._-]{1,80}")) {
            throw top.error("name", "'" + name + "' may use only letters, digits, '.', '_' and '-' (1 to 80 characters)");
        }
        String description = top.string("description", "");
        BlackHole bh = blackHole(top.section("black_hole", true));
        Observer obs = observer(top.section("observer", true));
        List<Source> sources = new ArrayList<>();
        Set<String> names = new HashSet<>();
        List<ConfigSection> list = top.sections("sources", 1);
        for (int i = 0; i < list.size(); i++) {
            Source s = source(list.get(i), i);
            if (!names.add(s.name())) {
                throw list.get(i).error("name", "source name '" + s.name() + "' is used twice; names must be unique");
            }
            sources.add(s);
        }
        RunSettings run = run(top.section("run", true));
        Imaging imaging = imaging(top.section("imaging", false));
        Instrument instrument = instrument(top.section("instrument", false));
        Interferometer array = InterferometerLoader.read(top.section("interferometer", false), file,
                Units.timeUnitSeconds(bh.massSolar()));
        return new LoadedScenario(file, new Scenario(name, description, bh, obs, sources, run, imaging, instrument, array),
                lines);
    }

    private static BlackHole blackHole(ConfigSection s) {
        s.renamed("distance_kpc", "distance", "a string with a unit, for example distance: \"40 Mpc\" (kpc and pc"
                + " also accepted)");
        s.allow("mass_solar", "distance", "family", "spin", "parameters", "allow_horizonless");
        double mass = s.number("mass_solar", Range.closed(1.0, 1.0e11));
        double dist = s.distanceMpc("distance", MAX_DISTANCE_MPC);
        String family = org.spindrift.sim.spacetime.Spacetimes.canonical(s.string("family", "kerr").toLowerCase(Locale.ROOT));
        double spin = s.number("spin", 0.0, Range.closed(-100, 100)); // family range: ScenarioChecks
        ConfigSection p = s.section("parameters", false);
        Map<String, Double> params = p == null ? Map.of() : p.numberMap(Range.closed(-1e6, 1e6));
        boolean horizonless = s.bool("allow_horizonless", false);
        return new BlackHole(mass, dist, family, spin, params, horizonless);
    }

    private static Observer observer(ConfigSection s) {
        s.allow("inclination_deg", "position_angle_deg");
        return new Observer(s.number("inclination_deg", Range.closed(0, 180)),
                s.number("position_angle_deg", 0.0, Range.closed(-360, 360)));
    }

    private static Source source(ConfigSection s, int index) {
        s.allow("name", "kind", "particles", "shape", "orbit", "velocity", "emission");
        String name = s.string("name", "source" + index);
        if (!name.matches("[A-Za-z0-9._-]{1,40}")) {
            throw s.error("name", "'" + name + "' may use only letters, digits, '.', '_' and '-' (1 to 40 characters)");
        }
        Source.Kind kind = Source.Kind.valueOf(s.choice("kind", null, "hot_spot", "cloud", "ring").toUpperCase(Locale.ROOT));
        int n = (int) s.integer("particles", null, 1, MAX_PARTICLES);
        SourceShape shape = shape(s.section("shape", true), kind);
        CentreOrbit orbit = orbit(s.section("orbit", true), kind, shape);
        VelocityModel vel = velocity(s.section("velocity", false), kind);
        Emission em = emission(s.section("emission", false));
        return new Source(name, kind, n, shape, orbit, vel, em);
    }

    private static SourceShape shape(ConfigSection s, Source.Kind kind) {
        if (kind == Source.Kind.RING) {
            s.allow("inner_radius_M", "outer_radius_M", "arc_deg");
            double in = s.number("inner_radius_M", Range.positive(1e5));
            double out = s.number("outer_radius_M", Range.positive(1e5));
            if (out < in) {
                // equal radii: a ring of zero width (every member on one circular orbit)
                throw s.error("outer_radius_M", "must be at least inner_radius_M (" + in + "), got " + out);
            }
            return new SourceShape.Ring(in, out, s.number("arc_deg", 10.0, new Range(0, false, 360, true)));
        }
        s.allow("sigma_M", "axes_M");
        if (s.has("sigma_M") == s.has("axes_M")) {
            throw s.error(s.has("sigma_M") ? "axes_M" : "sigma_M", "give exactly one of sigma_M (a ball) or axes_M"
                    + " [radial, azimuthal, vertical] (an ellipsoid), in M");
        }
        if (s.has("sigma_M")) {
            return new SourceShape.Ball(s.number("sigma_M", Range.positive(1e4)));
        }
        double[] a = s.numbers("axes_M", 3, Range.positive(1e4));
        return new SourceShape.Ellipsoid(a[0], a[1], a[2]);
    }

    private static Sense sense(ConfigSection s) {
        return Sense.valueOf(s.choice("sense", "prograde", "prograde", "retrograde").toUpperCase(Locale.ROOT));
    }

    private static CentreOrbit orbit(ConfigSection s, Source.Kind kind, SourceShape shape) {
        s.renamed("local", "zamo_velocity", "the same keys (r_M, theta_deg, phi_deg, v_r, v_theta, v_phi; velocities"
                + " measured by the zero-angular-momentum observer)");
        s.allow("circular", "elements", "zamo_velocity");
        int given = (s.has("circular") ? 1 : 0) + (s.has("elements") ? 1 : 0) + (s.has("zamo_velocity") ? 1 : 0);
        if (given != 1) {
            throw s.error(s.keys().isEmpty() ? "circular" : s.keys().iterator().next(),
                    "give exactly one of circular, elements or zamo_velocity (got " + given + ")");
        }
        if (kind == Source.Kind.RING && !s.has("circular")) {
            throw s.error(s.keys().iterator().next(), "a ring's centre moves on a circular orbit: use orbit.circular");
        }
        if (s.has("circular")) {
            ConfigSection c = s.section("circular", true).allow("radius_M", "sense", "phi_deg");
            double r;
            if (shape instanceof SourceShape.Ring ring) {
                r = c.number("radius_M", 0.5 * (ring.innerRadiusM() + ring.outerRadiusM()), Range.positive(1e5));
                if (r < ring.innerRadiusM() || r > ring.outerRadiusM()) {
                    throw c.error("radius_M", "a ring's centre radius must lie between inner_radius_M and outer_radius_M ["
                            + ring.innerRadiusM() + ", " + ring.outerRadiusM() + "], got " + r);
                }
            } else {
                r = c.number("radius_M", Range.positive(1e5));
            }
            return new CentreOrbit.Circular(r, sense(c), c.number("phi_deg", 0.0, Range.closed(-360, 360)));
        }
        if (s.has("elements")) {
            ConfigSection e = s.section("elements", true).allow("p_M", "e", "inclination_deg", "sense", "start", "phi_deg");
            double p = e.number("p_M", Range.positive(1e5));
            double ecc = e.number("e", Range.closed(0, 0.99));
            double inc = e.number("inclination_deg", 0.0, new Range(0, true, 90, false));
            Sense sense = sense(e);
            CentreOrbit.Start start = CentreOrbit.Start.valueOf(e.choice("start", "apoapsis", "periapsis", "apoapsis")
                    .toUpperCase(Locale.ROOT));
            return new CentreOrbit.Elements(p, ecc, inc, sense, start, e.number("phi_deg", 0.0, Range.closed(-360, 360)));
        }
        ConfigSection l = s.section("zamo_velocity", true).allow("r_M", "theta_deg", "phi_deg", "v_r", "v_theta", "v_phi");
        double r = l.number("r_M", Range.positive(1e5));
        double th = l.number("theta_deg", 90.0, new Range(0, false, 180, false));
        double ph = l.number("phi_deg", 0.0, Range.closed(-360, 360));
        double vr = l.number("v_r", 0.0, Range.closed(-1, 1));
        double vt = l.number("v_theta", 0.0, Range.closed(-1, 1));
        double vp = l.number("v_phi", 0.0, Range.closed(-1, 1));
        double v2 = vr * vr + vt * vt + vp * vp;
        if (!(v2 < 1.0)) {
            throw l.error("v_phi", "the speed sqrt(v_r^2 + v_theta^2 + v_phi^2) = " + Math.sqrt(v2)
                    + " must be below 1 (units of c)");
        }
        return new CentreOrbit.ZamoVelocity(r, th, ph, vr, vt, vp);
    }

    private static VelocityModel velocity(ConfigSection s, Source.Kind kind) {
        if (s == null) {
            return new VelocityModel(kind == Source.Kind.RING ? VelocityModel.Kind.SHEAR : VelocityModel.Kind.RIGID, 0.0);
        }
        s.allow("model", "dispersion");
        VelocityModel.Kind k = VelocityModel.Kind.valueOf(s.choice("model", kind == Source.Kind.RING ? "shear" : "rigid",
                "rigid", "shear", "thermal").toUpperCase(Locale.ROOT));
        if (k != VelocityModel.Kind.THERMAL && s.has("dispersion")) {
            throw s.error("dispersion", "is used only with model: thermal");
        }
        double d = k == VelocityModel.Kind.THERMAL ? s.number("dispersion", 0.01, new Range(0, true, 0.5, false)) : 0.0;
        return new VelocityModel(k, d);
    }

    private static Emission emission(ConfigSection s) {
        if (s == null) {
            return new Emission(1.0, 0.0, new Flare.Constant());
        }
        s.allow("weight", "spectral_index", "flare");
        double w = s.number("weight", 1.0, Range.positive(1e12));
        double alpha = s.number("spectral_index", 0.0, Range.closed(-10, 10));
        return new Emission(w, alpha, flare(s.section("flare", false)));
    }

    private static Flare flare(ConfigSection s) {
        if (s == null) {
            return new Flare.Constant();
        }
        String kind = s.choice("kind", null, "constant", "gaussian", "exponential");
        switch (kind) {
            case "constant":
                s.allow("kind");
                return new Flare.Constant();
            case "gaussian":
                s.allow("kind", "peak", "width");
                return new Flare.Gaussian(s.time("peak", null, false, false, false), s.time("width", null, false, false, true));
            default:
                s.renamed("start", "peak", "the time of the maximum");
                s.allow("kind", "peak", "rise", "decay");
                return new Flare.Exponential(s.time("peak", null, false, false, false), s.time("rise", null, false, false, true),
                        s.time("decay", null, false, false, true));
        }
    }

    private static RunSettings run(ConfigSection s) {
        s.allow("duration", "snapshot_cadence", "seed", "tolerance", "archive_subsample");
        TimeSpan d = s.time("duration", null, false, true, true);
        TimeSpan cadence = s.time("snapshot_cadence", null, true, false, true);
        long seed = s.integer("seed", RunSettings.DEFAULT_SEED, 0, Long.MAX_VALUE / 2);
        double tol = s.number("tolerance", RunSettings.DEFAULT_TOLERANCE, Range.closed(1e-14, 1e-3));
        int sub = (int) s.integer("archive_subsample", (long) RunSettings.DEFAULT_ARCHIVE_SUBSAMPLE, 0, MAX_PARTICLES);
        return new RunSettings(d, cadence, seed, tol, sub);
    }

    private static Imaging imaging(ConfigSection s) {
        if (s == null) {
            return Imaging.defaults();
        }
        s.allow("field_of_view_M", "pixels", "frame_cadence", "lensing", "sky_colours", "emission_sum");
        return new Imaging(s.number("field_of_view_M", Imaging.DEFAULT_FIELD_OF_VIEW_M, Range.positive(1e5)),
                (int) s.integer("pixels", (long) Imaging.DEFAULT_PIXELS, 8, 4096),
                s.time("frame_cadence", null, true, false, true), s.bool("lensing", true),
                ColourRamp.skyOption(s.choice("sky_colours", "default", "default", "grey")),
                EmissionSum.ofKey(s.choice("emission_sum", "auto", "auto", "particles", "grid")));
    }

    private static Instrument instrument(ConfigSection s) {
        if (s == null) {
            return Instrument.defaults();
        }
        s.allow("beam_fwhm_uas", "steady_source_flux_ratio", "astrometric_noise_uas", "noise_cadence_min");
        return new Instrument(s.number("beam_fwhm_uas", Instrument.DEFAULT_BEAM_FWHM_UAS, Range.nonNegative(1e6)),
                s.number("steady_source_flux_ratio", 0.0, Range.nonNegative(1e6)),
                s.number("astrometric_noise_uas", 0.0, Range.nonNegative(1e6)),
                s.number("noise_cadence_min", Instrument.DEFAULT_NOISE_CADENCE_MIN, Range.positive(1e6)));
    }
}
