package org.spindrift.sim.pipeline;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.Map;
import org.spindrift.shared.archive.RunArchiveWriter;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.sim.history.ParticleHistory;
import org.spindrift.sim.motion.TurningPoints;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.scenario.SourceSetup;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Everything a {@link RunStage} needs: the checked scenario, the spacetime and its landmarks,
 * unit conversions, the evolved particles, the run folder being written, and the manifest and
 * summary objects that stages may add keys to (written at the end of the run).
 *
 * @param loaded the scenario with its file and line index
 * @param spacetime the metric
 * @param landmarks landmarks by {@code landmarks --json} key (NaN where absent)
 * @param secondsPerM GM/c^3, s
 * @param uasPerM angle of 1 M at the distance, micro-arcseconds
 * @param placed initial conditions: source index, first index, centres
 * @param history every particle at every snapshot
 * @param turningPoints periapsis and polar turning points of every particle, found during the evolution
 * @param archive the run folder being written
 * @param manifest manifest keys added by stages (merged into manifest.json)
 * @param summary summary.json being built
 * @param threads worker threads allowed (results must not depend on it)
 * @param progress whether stages may print progress (false with --quiet or without a terminal)
 * @param results the products of the stages that have run, one typed slot per stage
 */
public record RunContext(LoadedScenario loaded, Spacetime spacetime, Map<String, Double> landmarks,
        double secondsPerM, double uasPerM, SourceSetup.Placed placed, ParticleHistory history,
        TurningPoints[] turningPoints, RunArchiveWriter archive, ObjectNode manifest, ObjectNode summary, int threads,
        boolean progress, StageResults results) {
    /** @return the scenario */
    public Scenario scenario() {
        return loaded.scenario();
    }

    /** @return a landmark, NaN when absent */
    public double landmark(String key) {
        Double v = landmarks.get(key);
        return v == null ? Double.NaN : v;
    }
}
