package org.spindrift.sim.study;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.spindrift.shared.UserInputException;
import org.spindrift.sim.scenario.ConfigNode;
import org.spindrift.sim.scenario.ConfigSection;
import org.spindrift.sim.scenario.ConfigSection.Range;
import org.spindrift.sim.scenario.ConfigTreeReader;
import org.spindrift.sim.scenario.FitFile;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.scenario.ScenarioTree;

/**
 * A distinguishability study: a truth scenario in a non-Kerr family and a grid over its
 * deformation parameter, a reference model (the same scenario with the deformation at the
 * family's Kerr value by default) with the parameters it may adjust, an instrument grid, the
 * number of noise realisations per cell and the seed. Keys in configs/README.md.
 *
 * @param file the study file
 * @param name study name
 * @param truth the truth scenario's tree
 * @param deformationKey key path of the deformation parameter in the truth scenario
 * @param deformations deformation values of the grid
 * @param step spacing of the profile nodes over the deformation (the truth-family fit)
 * @param referenceValue deformation of the reference model
 * @param free parameters both models adjust (start at the truth's values)
 * @param sigmasUas astrometric one-sigma per epoch and axis, micro-arcseconds
 * @param beamsUas beam FWHM values, micro-arcseconds
 * @param cadenceMin cadence of the epochs, minutes
 * @param campaignMin campaign length, minutes
 * @param steadyRatio steady-source flux ratio of the instrument
 * @param fluxError photometric one-sigma relative to the peak flux (NaN: no photometry)
 * @param realisations noise realisations per cell
 * @param seed seed of the noise
 * @param starts least-squares starts per fit
 */
public record StudyFile(Path file, String name, ScenarioTree truth, String deformationKey, double[] deformations,
                        double step, double referenceValue, List<FitFile.Free> free, double[] sigmasUas,
                        double[] beamsUas, double cadenceMin, double campaignMin, double steadyRatio, double fluxError,
                        int realisations, long seed, int starts) {
    /** Key path of the beam in a scenario. */
    public static final String BEAM_KEY = "instrument.beam_fwhm_uas";
    /** Key path of the steady-source ratio in a scenario. */
    public static final String STEADY_KEY = "instrument.steady_source_flux_ratio";

    /** @return the number of cells (deformations x precisions x beams) */
    public int cells() {
        return deformations.length * sigmasUas.length * beamsUas.length;
    }

    /** One cell of the grid: deformation slowest, then beam, then precision. */
    public record Cell(int index, double deformation, double beamUas, double sigmaUas) {
    }

    /** @return cell i */
    public Cell cell(int i) {
        int ns = sigmasUas.length, nb = beamsUas.length;
        return new Cell(i, deformations[i / (ns * nb)], beamsUas[(i / ns) % nb], sigmasUas[i % ns]);
    }

    /** @return the truth scenario of a cell (deformation, beam and steady source set) */
    public ScenarioTree truthTree(double deformation, double beamUas) {
        return truth.with(deformationKey, deformation).with(BEAM_KEY, beamUas).with(STEADY_KEY, steadyRatio);
    }

    /** @return whether a YAML/JSON file looks like a study file (top-level {@code truth} and {@code instrument}) */
    public static boolean isStudyFile(Path file) {
        ConfigNode root = ConfigTreeReader.read(file);
        return root instanceof ConfigNode.Obj o && o.fields().containsKey("truth") && o.fields().containsKey("deformation");
    }

    /** Reads and checks a study file: one-line {@link UserInputException} naming file, line and key path. */
    public static StudyFile load(Path file) {
        return load(file, ConfigTreeReader.read(file));
    }

    /** Reads and checks a study file's tree (file named in messages). */
    public static StudyFile load(Path file, ConfigNode root) {
        if (!(root instanceof ConfigNode.Obj obj)) {
            throw ConfigSection.error(file, root.line(), "", "a study file must be a mapping of keys (truth, deformation,"
                    + " reference, instrument, ...), got " + root.typeName());
        }
        ConfigSection.LineIndex lines = new ConfigSection.LineIndex();
        ConfigSection top = new ConfigSection(file, "", obj, lines);
        top.allow("name", "description", "truth", "deformation", "reference", "instrument", "realisations", "seed",
                "starts");
        String dflt = file.getFileName().toString().replaceFirst("\\.(ya?ml|json)$", "");
        String name = top.string("name", dflt);
        if (!name.matches("[A-Za-z0-9._-]{1,80}")) {
            throw top.error("name", "'" + name + "' may use only letters, digits, '.', '_' and '-' (1 to 80 characters)");
        }
        top.string("description", "");
        String truthName = top.string("truth", null);
        Path truthFile = resolve(file, truthName);
        if (!java.nio.file.Files.isRegularFile(truthFile)) {
            throw top.error("truth", "scenario file " + truthFile + " does not exist");
        }
        ScenarioTree truth = ScenarioTree.read(truthFile);
        LoadedScenario base = truth.load();
        if (base.scenario().sources().size() != 1
                || base.scenario().sources().get(0).kind() == org.spindrift.shared.scenario.Source.Kind.RING) {
            throw top.error("truth", "the study's compact-source model takes one hot spot or cloud; this scenario has "
                    + base.scenario().sources().size() + " source(s) or a ring");
        }

        ConfigSection d = top.section("deformation", true);
        d.allow("key", "values", "step");
        String key = d.string("key", null);
        if (!ScenarioTree.isKeyPath(key) || !key.startsWith("black_hole.")) {
            throw d.error("key", "'" + key + "' is not a key path of the black hole (for example"
                    + " black_hole.parameters.core_length)");
        }
        double[] values = numbers(d, "values", Range.closed(-1e6, 1e6));
        for (double v : values) {
            probe(d, "values", truth, key, v);
        }
        double step = d.number("step", Range.positive(1e6));

        ConfigSection r = top.section("reference", true);
        r.allow("deformation", "free");
        double refValue = r.number("deformation", 0.0, Range.closed(-1e6, 1e6));
        probe(r, "deformation", truth, key, refValue);
        List<FitFile.Free> free = free(r, truth, key);

        ConfigSection in = top.section("instrument", true);
        in.allow("sigma_uas", "beam_fwhm_uas", "cadence_min", "campaign_min", "steady_source_flux_ratio", "flux_error");
        double[] sig = numbers(in, "sigma_uas", Range.positive(1e9));
        double[] beams = numbers(in, "beam_fwhm_uas", Range.nonNegative(1e9));
        double cadence = in.number("cadence_min", Range.positive(1e7));
        double campaign = in.number("campaign_min", Range.positive(1e8));
        if (!(campaign >= cadence)) {
            throw in.error("campaign_min", "must be at least one cadence (" + cadence + " min), got " + campaign);
        }
        long epochs = (long) Math.floor(campaign / cadence + 1e-9) + 1;
        if (epochs > 100_000) {
            throw in.error("cadence_min", "gives " + epochs + " epochs; allowed up to 100000");
        }
        if (2 * epochs <= free.size() + 1) {
            throw in.error("campaign_min", "gives " + epochs + " epochs, too few for " + (free.size() + 1)
                    + " fitted parameters");
        }
        double steady = in.number("steady_source_flux_ratio", 0.0, Range.nonNegative(1e6));
        double fe = in.number("flux_error", Double.POSITIVE_INFINITY, new Range(0, false, 10, true));
        int real = (int) top.integer("realisations", 20L, 1, 100_000);
        long seed = top.integer("seed", 1L, 0, Long.MAX_VALUE / 2);
        int starts = (int) top.integer("starts", 1L, 1, 100);
        return new StudyFile(file, name, truth, key, values, step, refValue, free, sig, beams, cadence, campaign, steady,
                Double.isInfinite(fe) ? Double.NaN : fe, real, seed, starts);
    }

    /** @return a number or a list of numbers (at least one), each in range */
    static double[] numbers(ConfigSection s, String k, Range range) {
        ConfigNode n = s.node(k);
        if (n == null || n instanceof ConfigNode.Null) {
            throw s.error(k, "missing required key '" + k + "' (a number or a list of numbers)");
        }
        List<ConfigNode> items = n instanceof ConfigNode.Arr a ? a.items() : List.of(n);
        if (items.isEmpty()) {
            throw s.error(k, "the list is empty; give at least one number");
        }
        double[] out = new double[items.size()];
        for (int i = 0; i < out.length; i++) {
            if (!(items.get(i) instanceof ConfigNode.Num num)) {
                throw ConfigSection.error(s.file(), items.get(i).line(), s.key(k) + "[" + i + "]", "must be a number, got "
                        + items.get(i).typeName());
            }
            if (!range.contains(num.value())) {
                throw ConfigSection.error(s.file(), num.line(), s.key(k) + "[" + i + "]", "value " + num.text()
                        + " is out of range; allowed " + range);
            }
            out[i] = num.value();
        }
        return out;
    }

    /** Checks that the truth scenario accepts the deformation value. */
    private static void probe(ConfigSection s, String k, ScenarioTree truth, String key, double v) {
        try {
            // the spacetime itself checks the family's parameter ranges
            org.spindrift.sim.scenario.ScenarioChecks.spacetime(truth.with(key, v).load());
        } catch (UserInputException | IllegalArgumentException e) {
            String msg = String.valueOf(e.getMessage());
            String tail = msg.contains(": ") ? msg.substring(msg.lastIndexOf(": ") + 2) : msg;
            throw s.error(k, "deformation " + v + " is not usable in the truth scenario (" + tail + ")");
        }
    }

    private static List<FitFile.Free> free(ConfigSection r, ScenarioTree truth, String defKey) {
        List<ConfigSection> list = r.sections("free", 1);
        List<FitFile.Free> out = new ArrayList<>();
        Set<String> seen = new HashSet<>();
        for (ConfigSection f : list) {
            f.allow("key", "min", "max");
            String key = f.string("key", null);
            if (!ScenarioTree.isKeyPath(key) || key.startsWith("data.")) {
                throw f.error("key", "'" + key + "' is not a scenario key path (for example"
                        + " sources[0].orbit.circular.radius_M)");
            }
            if (key.equals(defKey) || key.equals(BEAM_KEY) || key.equals(STEADY_KEY)) {
                throw f.error("key", "'" + key + "' is set by the study itself (deformation or instrument)");
            }
            if (!seen.add(key)) {
                throw f.error("key", "'" + key + "' is free twice");
            }
            double lo = f.number("min", Range.closed(-1e30, 1e30));
            double hi = f.number("max", Range.closed(-1e30, 1e30));
            if (!(hi > lo)) {
                throw f.error("max", "must be larger than min (" + lo + "), got " + hi);
            }
            double v;
            try {
                v = truth.value(key);
            } catch (UserInputException e) {
                throw f.error("key", "'" + key + "' is not a number in the truth scenario");
            }
            if (Double.isNaN(v)) {
                throw f.error("key", "'" + key + "' is not written in the truth scenario (the start of the fits is the"
                        + " truth's value): write it there");
            }
            if (!(v >= lo && v <= hi)) {
                throw f.error("key", "the truth's value " + v + " lies outside [min, max] = [" + lo + ", " + hi + "]");
            }
            try {
                truth.with(key, v).load();
            } catch (UserInputException e) {
                String msg = e.getMessage();
                throw f.error("key", "'" + key + "' is not usable in the scenario: " + msg.substring(msg.indexOf(": ") + 2));
            }
            out.add(new FitFile.Free(key, lo, hi, FitFile.Prior.UNIFORM, Double.NaN, Double.NaN, v, f.line()));
        }
        return out;
    }

    static Path resolve(Path file, String name) {
        Path p = Path.of(name);
        Path dir = file.toAbsolutePath().getParent();
        return p.isAbsolute() || dir == null ? p : dir.resolve(p).normalize();
    }
}
