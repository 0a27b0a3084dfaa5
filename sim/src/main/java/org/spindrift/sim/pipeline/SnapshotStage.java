package org.spindrift.sim.pipeline;

import java.io.IOException;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.SnapshotWriter;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.sim.history.CentreTracks;
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
        CentreTracks tracks = h.centres(ctx.threads());
        for (int s = 0; s < h.snapshots(); s++) {
            double[][] src = {h.r(s), h.theta(s), h.phi(s), h.ut(s), h.ur(s), h.uTheta(s), h.uPhi(s)};
            float[] weight = h.weight(s);
            byte[] state = h.state(s);
            for (int c = 0; c < 7; c++) {
                double[] from = src[c];
                double[] to = cols[c];
                for (int j = 0; j < m; j++) {
                    to[j] = from[idx[j]];
                }
            }
            for (int j = 0; j < m; j++) {
                wt[j] = weight[idx[j]];
                st[j] = state[idx[j]];
            }
            double[][] centres = new double[k][];
            for (int q = 0; q < k; q++) {
                centres[q] = q < tracks.sources() ? tracks.centre()[q][s].clone()
                        : new double[] {Double.NaN, Double.NaN, Double.NaN};
            }
            w.add(h.time(s), cols[0], cols[1], cols[2], cols[3], cols[4], cols[5], cols[6], wt, st, centres);
        }
        w.write(ctx.archive().folder());
        ctx.archive().register(ArchiveLayout.SNAPSHOTS);
    }
}
