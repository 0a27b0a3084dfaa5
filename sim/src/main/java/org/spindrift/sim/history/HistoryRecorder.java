package org.spindrift.sim.history;

import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.util.function.DoubleUnaryOperator;
import org.spindrift.sim.motion.Snapshot;
import org.spindrift.sim.motion.SnapshotSink;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Records the {@link ParticleHistory} from the integrator's snapshots: positions, the
 * contravariant 4-velocity u^mu = g^{mu nu} p_nu (unit rest mass; index raised with the metric's
 * inverse), the emission weight (base weight of the particle times its source's envelope at the
 * snapshot time, 0 once the particle has ended) and the state code. Rows of snapshot k are
 * allocated when snapshot k arrives, so a run that stops early holds only what it evolved.
 *
 * <p>Inputs are plain values (times, source of each particle, base weights, one envelope per
 * source), so the recorder knows nothing about scenario files.
 */
public final class HistoryRecorder implements SnapshotSink {
    private final double[] times;
    private final Spacetime st;
    private final double[] g = new double[Spacetime.SIZE];
    private final int n;
    private final int[] sourceIndex;
    private final double[] baseWeights;
    private final DoubleUnaryOperator[] envelopes;
    private final double[] envelopeNow;
    private final double[][] r;
    private final double[][] th;
    private final double[][] ph;
    private final double[][] ut;
    private final double[][] ur;
    private final double[][] uth;
    private final double[][] uph;
    private final float[][] w;
    private final byte[][] state;
    private final double[] pr;
    private final double[] pth;

    /**
     * @param times snapshot times, M
     * @param st the metric (raises the momentum's index)
     * @param sourceIndex source of each particle
     * @param baseWeights emission weight of each particle before the envelope
     * @param envelopes envelope of each source against coordinate time (M), a factor
     */
    public HistoryRecorder(double[] times, Spacetime st, int[] sourceIndex, double[] baseWeights,
            DoubleUnaryOperator[] envelopes) {
        this.times = times.clone();
        this.st = st;
        this.n = sourceIndex.length;
        if (baseWeights.length != n) {
            throw new IllegalArgumentException("one base weight per particle");
        }
        this.sourceIndex = sourceIndex.clone();
        this.baseWeights = baseWeights;
        this.envelopes = envelopes.clone();
        this.envelopeNow = new double[envelopes.length];
        int s = times.length;
        r = new double[s][];
        th = new double[s][];
        ph = new double[s][];
        ut = new double[s][];
        ur = new double[s][];
        uth = new double[s][];
        uph = new double[s][];
        w = new float[s][];
        state = new byte[s][];
        pr = new double[n];
        pth = new double[n];
    }

    /** @return number of snapshots of the grid */
    public int snapshots() {
        return times.length;
    }

    /** @return number of particles */
    public int particles() {
        return n;
    }

    private void allocate(int k) {
        r[k] = new double[n];
        th[k] = new double[n];
        ph[k] = new double[n];
        ut[k] = new double[n];
        ur[k] = new double[n];
        uth[k] = new double[n];
        uph[k] = new double[n];
        w[k] = new float[n];
        state[k] = new byte[n];
    }

    @Override public void accept(int k, double t, Snapshot snap) {
        allocate(k);
        snap.copyR(r[k]);
        snap.copyTheta(th[k]);
        snap.copyPhi(ph[k]);
        snap.copyPR(pr);
        snap.copyPTheta(pth);
        snap.copyStates(state[k]);
        for (int j = 0; j < envelopes.length; j++) {
            envelopeNow[j] = envelopes[j].applyAsDouble(t);
        }
        for (int i = 0; i < n; i++) {
            // raise the index: u^mu = g^{mu nu} p_nu (unit rest mass)
            st.inverse(r[k][i], th[k][i], g);
            double pt = snap.pT(i);
            double pphi = snap.pPhi(i);
            ut[k][i] = g[Spacetime.TT] * pt + g[Spacetime.TP] * pphi;
            ur[k][i] = g[Spacetime.RR] * pr[i];
            uth[k][i] = g[Spacetime.HH] * pth[i];
            uph[k][i] = g[Spacetime.TP] * pt + g[Spacetime.PP] * pphi;
            w[k][i] = state[k][i] == 0 ? (float) (baseWeights[i] * envelopeNow[sourceIndex[i]]) : 0f;
        }
    }

    /** Writes the rows of snapshots from..to, bit for bit (for a checkpoint). */
    public void writeRows(DataOutputStream out, int from, int to) throws IOException {
        for (int s = from; s <= to; s++) {
            for (double[][] a : new double[][][] {r, th, ph, ut, ur, uth, uph}) {
                for (double v : a[s]) {
                    out.writeLong(Double.doubleToRawLongBits(v));
                }
            }
            for (float v : w[s]) {
                out.writeInt(Float.floatToRawIntBits(v));
            }
            out.write(state[s]);
        }
    }

    /** Reads rows written by {@link #writeRows} back into snapshots from..to. */
    public void readRows(DataInputStream in, int from, int to) throws IOException {
        for (int s = from; s <= to; s++) {
            allocate(s);
            for (double[][] a : new double[][][] {r, th, ph, ut, ur, uth, uph}) {
                for (int i = 0; i < a[s].length; i++) {
                    a[s][i] = Double.longBitsToDouble(in.readLong());
                }
            }
            for (int i = 0; i < n; i++) {
                w[s][i] = Float.intBitsToFloat(in.readInt());
            }
            in.readFully(state[s]);
        }
    }

    /** @return the history (every snapshot must have been recorded or read back) */
    public ParticleHistory history() {
        return new ParticleHistory(times.clone(), r, th, ph, ut, ur, uth, uph, w, state, sourceIndex.clone(),
                st.spin());
    }
}
