package org.spindrift.sim.pipeline;

import java.io.IOException;
import org.spindrift.shared.Coordinates;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.SnapshotWriter;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.sim.history.ParticleHistory;
import org.spindrift.sim.history.Subsample;

/**
 * Writes {@code snapshots.h5}: the particles of the {@link Subsample}. The {@code /centre}
 * dataset is the centre of mass of all of a source's alive particles, not only the kept ones.
 */
public final class SnapshotStage implements RunStage {
    @Override public String name() {
        return "snapshots";
    }

    @Override public void run(RunContext ctx) throws IOException {
        Scenario sc = ctx.scenario();
        ParticleHistory h = ctx.history();
        int[] idx = Subsample.keptIndices(sc, ctx.placed().firstIndex());
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
