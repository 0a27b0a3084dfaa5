package org.spindrift.sim.run;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.LinkedHashMap;
import java.util.Map;
import org.spindrift.shared.Units;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.RunArchiveWriter;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.ScenarioJson;
import org.spindrift.shared.scenario.Source;
import org.spindrift.sim.history.Subsample;
import org.spindrift.sim.motion.BatchIntegrator;
import org.spindrift.sim.motion.EndState;
import org.spindrift.sim.motion.MotionDiagnostics;
import org.spindrift.sim.motion.ParticleBatch;

/**
 * The run's own part of {@code manifest.json} (scenario echo, black hole, units, observer,
 * landmarks, time grid, sources, diagnostics, end states) and the {@code diagnostics} object,
 * which comes from the {@link MotionDiagnostics} of the evolution.
 */
final class RunManifest {
    /** What the diagnostics measure, written beside them. */
    static final String DIAGNOSTICS_MEANING = "hamiltonian_error: |H + 1/2| of each particle, its largest value over"
            + " the snapshots at which it was alive; carter_drift: |Q - Q_0| (M^2, separable metrics only), likewise;"
            + " _max over particles and _median over particles of those per-particle maxima";

    private RunManifest() {
    }

    /**
     * @return the diagnostics: largest and median per-particle mass-shell error and Carter drift
     *     over the snapshots, integrator work, failures by reason, and the resume point if any
     */
    static ObjectNode diagnostics(Evolution.Evolved e, boolean separable, ParticleBatch b) {
        MotionDiagnostics m = e.diagnostics();
        ObjectNode d = RunArchiveWriter.json().createObjectNode();
        put(d, "hamiltonian_error_max", m.massShellMax());
        put(d, "hamiltonian_error_median", m.massShellMedian());
        if (separable) {
            put(d, "carter_drift_max", m.carterDriftMax());
            put(d, "carter_drift_median", m.carterDriftMedian());
        } else {
            d.putNull("carter_drift_max");
            d.putNull("carter_drift_median");
        }
        d.put("measured", DIAGNOSTICS_MEANING);
        BatchIntegrator.Result res = e.result();
        d.put("rhs_evaluations", res.evaluations());
        d.put("accepted_steps", res.acceptedSteps());
        d.put("rejected_steps", res.rejectedSteps());
        Map<String, Integer> failures = new LinkedHashMap<>();
        for (int i = 0; i < b.size(); i++) {
            if (b.endState(i) == EndState.FAILED) {
                failures.merge(b.failure(i).name().toLowerCase(java.util.Locale.ROOT), 1, Integer::sum);
            }
        }
        ObjectNode f = d.putObject("failures");
        failures.forEach(f::put);
        if (e.resumedAfter() >= 0) {
            d.put("resumed_after_snapshot", e.resumedAfter());
        }
        return d;
    }

    static void put(ObjectNode o, String k, double v) {
        if (Double.isFinite(v)) {
            o.put(k, v);
        } else {
            o.putNull(k);
        }
    }

    static ObjectNode body(ScenarioRun.Prepared p, ObjectNode extra, ObjectNode diag, BatchIntegrator.Result res) {
        Scenario sc = p.loaded().scenario();
        ObjectNode m = RunArchiveWriter.json().createObjectNode();
        m.set(ArchiveLayout.K_SCENARIO, ScenarioJson.toJson(sc));
        m.put("scenario_file", p.loaded().file().toString());
        m.put(ArchiveLayout.K_SEED, sc.run().seed());
        ObjectNode bh = m.putObject(ArchiveLayout.K_BLACK_HOLE);
        bh.put(ArchiveLayout.K_MASS_SOLAR, sc.blackHole().massSolar());
        bh.put(ArchiveLayout.K_DISTANCE_MPC, sc.blackHole().distanceMpc());
        bh.put(ArchiveLayout.K_FAMILY, sc.blackHole().family());
        bh.put(ArchiveLayout.K_SPIN, sc.blackHole().spin());
        ObjectNode par = bh.putObject(ArchiveLayout.K_PARAMETERS);
        sc.blackHole().parameters().forEach(par::put);
        ObjectNode u = m.putObject(ArchiveLayout.K_UNITS);
        u.put(ArchiveLayout.K_M_SECONDS, p.secondsPerM());
        u.put(ArchiveLayout.K_M_METRES, Units.lengthUnitMetres(sc.blackHole().massSolar()));
        u.put(ArchiveLayout.K_M_UAS, p.uasPerM());
        m.putObject(ArchiveLayout.K_OBSERVER).put(ArchiveLayout.K_INCLINATION_DEG, sc.observer().inclinationDeg())
                .put(ArchiveLayout.K_POSITION_ANGLE_DEG, sc.observer().positionAngleDeg());
        ObjectNode lm = m.putObject(ArchiveLayout.LANDMARKS);
        p.landmarks().forEach((k, v) -> put(lm, k, v));
        ObjectNode time = m.putObject(ArchiveLayout.K_TIME);
        time.put("origin", "coordinate time t = 0 at the start of the run (emitter time)");
        time.put("duration_M", p.durationM());
        time.put("duration_requested_M", p.requestedDurationM());
        time.put("duration_min", p.durationM() * p.secondsPerM() / 60.0);
        time.put(ArchiveLayout.K_SNAPSHOTS, p.times().length);
        time.put("cadence_M", p.times()[1] - p.times()[0]);
        time.put("first_orbit_period_M", p.placed().centres()[0].periodM());
        ArrayNode sources = m.putArray(ArchiveLayout.K_SOURCES);
        int[] first = p.placed().firstIndex();
        int[] kept = Subsample.keptPerSource(sc);
        int at = 0;
        for (int k = 0; k < sc.sources().size(); k++) {
            Source s = sc.sources().get(k);
            sources.addObject().put(ArchiveLayout.K_NAME, s.name()).put(ArchiveLayout.K_KIND, s.kind().key())
                    .put(ArchiveLayout.K_PARTICLES, s.particles()).put(ArchiveLayout.K_KEPT, kept[k])
                    .put(ArchiveLayout.K_FIRST_INDEX, at).put("first_particle", first[k]);
            at += kept[k];
        }
        m.set(ArchiveLayout.K_DIAGNOSTICS, diag);
        ObjectNode es = m.putObject(ArchiveLayout.END_STATES);
        for (EndState e : EndState.values()) {
            es.put(e.key(), res.count(e));
        }
        extra.properties().forEach(e -> m.set(e.getKey(), e.getValue()));
        return m;
    }
}
