package org.spindrift.sim.history;

import java.util.List;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.Source;

/**
 * The particles a run keeps in its archive: at most {@code run.archive_subsample} (0: all), spread
 * over the sources in proportion to their particle counts (at least one each), taken evenly
 * through each source's particles (independent draws, so any evenly spaced subset is a fair
 * sample).
 */
public final class Subsample {
    private Subsample() {
    }

    /** @return the number of particles kept in the archive for each source */
    public static int[] keptPerSource(Scenario sc) {
        List<Source> src = sc.sources();
        int total = sc.totalParticles();
        int limit = sc.run().archiveSubsample();
        int[] kept = new int[src.size()];
        for (int k = 0; k < kept.length; k++) {
            int n = src.get(k).particles();
            kept[k] = limit == 0 || total <= limit ? n
                    : (int) Math.max(1, Math.min(n, Math.floor((double) limit * n / total)));
        }
        return kept;
    }

    /**
     * @param first first particle of each source in the history
     * @return the indices (into the history) of the kept particles, source by source
     */
    public static int[] keptIndices(Scenario sc, int[] first) {
        int[] kept = keptPerSource(sc);
        int m = 0;
        for (int c : kept) {
            m += c;
        }
        int[] idx = new int[m];
        int at = 0;
        for (int k = 0; k < kept.length; k++) {
            int n = sc.sources().get(k).particles();
            for (int j = 0; j < kept[k]; j++) {
                idx[at++] = first[k] + (int) ((long) j * n / kept[k]);
            }
        }
        return idx;
    }
}
