package org.spindrift.sim.analysis;

import java.util.List;
import org.spindrift.sim.history.ParticleHistory;
import org.spindrift.sim.motion.TurningPoints;

/**
 * The analysis of a particle history: periods and periastron advance of every particle, and the
 * shape of every source at every snapshot.
 *
 * @param periods per particle
 * @param shapes per source and snapshot, source-major ({@code shapes.get(k * S + s)})
 */
public record AnalysisResult(ParticlePeriods periods, List<ShearShape> shapes) {
    public AnalysisResult {
        shapes = List.copyOf(shapes);
    }

    /**
     * Analyses a history (a run's or one built in memory).
     *
     * @param turning turning points of every particle found during the evolution, or null to
     *     measure the periods from the snapshots alone
     * @param firstIndex first particle of each source
     */
    public static AnalysisResult of(ParticleHistory h, TurningPoints[] turning, int[] firstIndex) {
        return of(h, turning, firstIndex, 1);
    }

    /** As {@link #of(ParticleHistory, TurningPoints[], int[])} on up to threads threads (the same result for any count). */
    public static AnalysisResult of(ParticleHistory h, TurningPoints[] turning, int[] firstIndex, int threads) {
        return new AnalysisResult(ParticlePeriods.of(h, turning, threads), ShearAnalysis.of(h, firstIndex, threads));
    }
}
