package org.spindrift.sim.run;

import java.io.IOException;
import java.util.List;
import org.spindrift.shared.Coordinates;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.SnapshotWriter;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.Source;

/**
 * Writes {@code snapshots.h5}: a subsample of at most {@code run.archive_subsample} particles
 * (0: all), spread over the sources in proportion to their particle counts (at least one each),
 * taken evenly through each source's particles (which are independent draws, so any evenly
 * spaced subset is a fair sample). The {@code /centre} dataset is the centre of mass of all of a
 * source's alive particles, not only the kept ones.
 */
public final class SnapshotStage implements RunStage {
    @Override public String name() {
        return "snapshots";
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

    /** @return the indices (into the history) of the kept particles, source by source */
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

    @Override public void run(RunContext ctx) throws IOException {
        Scenario sc = ctx.scenario();
        ParticleHistory h = ctx.history();
        int[] idx = keptIndices(sc, ctx.placed().firstIndex());
        int m = idx.length;
        int k = sc.sources().size();
        int[] srcOfKept = new int[m];
        for (int j = 0; j < m; j++) {
            srcOfKept[j] = h.sourceIndex()[idx[j]];
        }
        SnapshotWriter w = new SnapshotWriter(h.snapshots(), srcOfKept, k, h.spin(), sc.blackHole().massSolar(),
                sc.blackHole().distanceMpc());
        double[][] cols = new double[7][m];
        float[] wt = new float[m];
        byte[] st = new byte[m];
        double[] xyz = new double[3];
        for (int s = 0; s < h.snapshots(); s++) {
            double[][] src = {h.r(s), h.theta(s), h.phi(s), h.ut(s), h.ur(s), h.uTheta(s), h.uPhi(s)};
            for (int j = 0; j < m; j++) {
                int i = idx[j];
                for (int c = 0; c < 7; c++) {
                    cols[c][j] = src[c][i];
                }
                wt[j] = h.weight(s)[i];
                st[j] = h.state(s)[i];
            }
            double[][] centres = new double[k][3];
            int[] alive = new int[k];
            for (int i = 0; i < h.particles(); i++) {
                if (h.state(s)[i] != ArchiveLayout.ALIVE) {
                    continue;
                }
                int q = h.sourceIndex()[i];
                Coordinates.cartesian(h.r(s)[i], h.theta(s)[i], h.phi(s)[i], h.spin(), xyz);
                centres[q][0] += xyz[0];
                centres[q][1] += xyz[1];
                centres[q][2] += xyz[2];
                alive[q]++;
            }
            for (int q = 0; q < k; q++) {
                for (int c = 0; c < 3; c++) {
                    centres[q][c] = alive[q] > 0 ? centres[q][c] / alive[q] : Double.NaN;
                }
            }
            w.add(h.time(s), cols[0], cols[1], cols[2], cols[3], cols[4], cols[5], cols[6], wt, st, centres);
        }
        w.write(ctx.archive().folder());
        ctx.archive().register(ArchiveLayout.SNAPSHOTS);
    }
}
