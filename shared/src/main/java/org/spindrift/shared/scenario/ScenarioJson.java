package org.spindrift.shared.scenario;

import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.Locale;
import java.util.Map;

/**
 * The scenario as JSON with the scenario-file keys and every default filled in: the manifest's
 * {@code scenario} echo. The echo is itself a valid scenario file (the same keys as
 * configs/README.md), so a run can be repeated from its manifest.
 */
public final class ScenarioJson {
    private ScenarioJson() {
    }

    /** @return the scenario as a JSON object with scenario-file keys */
    public static ObjectNode toJson(Scenario s) {
        ObjectNode o = JsonNodeFactory.instance.objectNode();
        o.put("name", s.name());
        o.put("description", s.description());
        BlackHole b = s.blackHole();
        ObjectNode bh = o.putObject("black_hole");
        bh.put("mass_solar", b.massSolar());
        bh.put("distance", distance(b.distanceMpc()));
        bh.put("family", b.family());
        bh.put("spin", b.spin());
        ObjectNode par = bh.putObject("parameters");
        for (Map.Entry<String, Double> e : b.parameters().entrySet()) {
            par.put(e.getKey(), e.getValue());
        }
        bh.put("allow_horizonless", b.allowHorizonless());
        o.putObject("observer").put("inclination_deg", s.observer().inclinationDeg())
                .put("position_angle_deg", s.observer().positionAngleDeg());
        var arr = o.putArray("sources");
        for (Source src : s.sources()) {
            arr.add(source(src));
        }
        RunSettings r = s.run();
        ObjectNode run = o.putObject("run");
        run.put("duration", r.duration().toString());
        if (r.snapshotCadence() != null) {
            run.put("snapshot_cadence", r.snapshotCadence().toString());
        }
        run.put("seed", r.seed());
        run.put("tolerance", r.tolerance());
        run.put("archive_subsample", r.archiveSubsample());
        Imaging im = s.imaging();
        ObjectNode img = o.putObject("imaging");
        img.put("field_of_view_M", im.fieldOfViewM());
        img.put("pixels", im.pixels());
        if (im.frameCadence() != null) {
            img.put("frame_cadence", im.frameCadence().toString());
        }
        img.put("lensing", im.lensing());
        img.put("sky_colours", im.skyColours().key());
        img.put("emission_sum", im.emissionSum().key());
        Instrument in = s.instrument();
        o.putObject("instrument").put("beam_fwhm_uas", in.beamFwhmUas())
                .put("steady_source_flux_ratio", in.steadySourceFluxRatio())
                .put("astrometric_noise_uas", in.astrometricNoiseUas())
                .put("noise_cadence_min", in.noiseCadenceMin());
        if (s.interferometer() != null) {
            o.set("interferometer", interferometer(s.interferometer()));
        }
        return o;
    }

    /** The interferometer with its stations written inline (so the echo needs no array file). */
    private static ObjectNode interferometer(Interferometer a) {
        ObjectNode o = JsonNodeFactory.instance.objectNode();
        var st = o.putArray("stations");
        for (Interferometer.Station s : a.stations()) {
            st.addObject().put("name", s.name()).put("x_m", s.xM()).put("y_m", s.yM()).put("z_m", s.zM())
                    .put("sefd_jy", s.sefdJy()).put("elevation_limit_deg", s.elevationLimitDeg());
        }
        o.put("frequency_ghz", a.frequencyGhz());
        o.put("bandwidth_ghz", a.bandwidthGhz());
        o.put("right_ascension_deg", a.rightAscensionDeg());
        o.put("declination_deg", a.declinationDeg());
        o.put("start_sidereal_time_h", a.startSiderealTimeH());
        o.put("scan_length", a.scanLength().toString());
        o.put("scan_cadence", a.scanCadence().toString());
        o.put("integration_s", a.integrationS());
        o.put("peak_flux_jy", a.peakFluxJy());
        o.put("gain_error", a.gainError());
        o.put("phase_error_deg", a.phaseErrorDeg());
        return o;
    }

    /** @return a distance in Mpc as the scenario-file string, for example {@code "40.0 Mpc"} (exact repr) */
    public static String distance(double mpc) {
        return Double.toString(mpc) + " Mpc";
    }

    private static String lower(Enum<?> e) {
        return e.name().toLowerCase(Locale.ROOT);
    }

    private static ObjectNode source(Source s) {
        ObjectNode o = JsonNodeFactory.instance.objectNode();
        o.put("name", s.name());
        o.put("kind", s.kind().key());
        o.put("particles", s.particles());
        ObjectNode sh = o.putObject("shape");
        if (s.shape() instanceof SourceShape.Ball b) {
            sh.put("sigma_M", b.sigmaM());
        } else if (s.shape() instanceof SourceShape.Ellipsoid e) {
            sh.putArray("axes_M").add(e.radialM()).add(e.azimuthalM()).add(e.verticalM());
        } else if (s.shape() instanceof SourceShape.Ring r) {
            sh.put("inner_radius_M", r.innerRadiusM()).put("outer_radius_M", r.outerRadiusM()).put("arc_deg", r.arcDeg());
        }
        ObjectNode orb = o.putObject("orbit");
        if (s.orbit() instanceof CentreOrbit.Circular c) {
            orb.putObject("circular").put("radius_M", c.radiusM()).put("sense", lower(c.sense())).put("phi_deg", c.phiDeg());
        } else if (s.orbit() instanceof CentreOrbit.Elements e) {
            orb.putObject("elements").put("p_M", e.semiLatusRectumM()).put("e", e.eccentricity())
                    .put("inclination_deg", e.inclinationDeg()).put("sense", lower(e.sense()))
                    .put("start", lower(e.start())).put("phi_deg", e.phiDeg());
        } else if (s.orbit() instanceof CentreOrbit.ZamoVelocity l) {
            orb.putObject("zamo_velocity").put("r_M", l.radiusM()).put("theta_deg", l.thetaDeg()).put("phi_deg", l.phiDeg())
                    .put("v_r", l.vR()).put("v_theta", l.vTheta()).put("v_phi", l.vPhi());
        }
        ObjectNode v = o.putObject("velocity").put("model", lower(s.velocity().kind()));
        if (s.velocity().kind() == VelocityModel.Kind.THERMAL) {
            v.put("dispersion", s.velocity().dispersion());
        }
        Emission em = s.emission();
        ObjectNode e = o.putObject("emission").put("weight", em.weight()).put("spectral_index", em.spectralIndex());
        ObjectNode f = e.putObject("flare");
        if (em.flare() instanceof Flare.Constant) {
            f.put("kind", "constant");
        } else if (em.flare() instanceof Flare.Gaussian g) {
            f.put("kind", "gaussian").put("peak", g.peak().toString()).put("width", g.width().toString());
        } else if (em.flare() instanceof Flare.Exponential x) {
            f.put("kind", "exponential").put("peak", x.peak().toString()).put("rise", x.rise().toString())
                    .put("decay", x.decay().toString());
        }
        return o;
    }
}
