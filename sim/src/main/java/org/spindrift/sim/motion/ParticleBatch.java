package org.spindrift.sim.motion;

import java.util.Arrays;

/**
 * Structure-of-arrays state of N test masses for {@link BatchIntegrator}: per particle the
 * coordinate-time state (r, theta, phi, p_r, p_theta), the constants p_t = -E and p_phi = L,
 * the particle's own current time t (the end of its last step, which may lie beyond the last
 * snapshot), its next step size, the derivative d/dt of the state there (kept so that the next
 * {@link BatchIntegrator#integrate} interval starts without re-evaluating it: valid exactly when
 * the step size is set, h &gt; 0) and its end state. That is {@value #BYTES_PER_PARTICLE} bytes
 * per particle; the stage scratch of the Runge-Kutta method lives in the worker threads, not
 * here. When a particle has ended, t is the time at which it ended and the state is the state
 * there. Readers that need no more than the state see it as a {@link ParticleView}.
 */
public final class ParticleBatch extends ParticleColumns {
    /** Bytes of integrator state per particle: 14 doubles and 2 bytes. */
    public static final int BYTES_PER_PARTICLE = (9 + GeodesicEquations.DIM_T) * Double.BYTES + 2;

    final double[] pt;
    final double[] pphi;
    final double[] t;
    final double[] h;
    /** d/dt of (r, theta, phi, p_r, p_theta) at time t, particle i at [5 i .. 5 i + 4]; valid when h[i] &gt; 0. */
    final double[] dy;
    final byte[] failure;

    /** @param n number of particles, all initially unset (r = 0, alive) */
    public ParticleBatch(int n) {
        super(n);
        pt = new double[n];
        pphi = new double[n];
        t = new double[n];
        h = new double[n];
        dy = new double[GeodesicEquations.DIM_T * n];
        failure = new byte[n];
    }

    /**
     * Writes the whole integrator state (positions, momenta, own times, next step sizes, the
     * first-same-as-last derivatives, end states, failure reasons) for a checkpoint; {@link #readState}
     * restores it bit for bit.
     */
    public void writeState(java.io.DataOutputStream out) throws java.io.IOException {
        out.writeInt(size());
        for (double[] a : new double[][] {r, th, ph, pr, pth, pt, pphi, t, h, dy}) {
            for (double v : a) {
                out.writeLong(Double.doubleToRawLongBits(v));
            }
        }
        out.write(state);
        out.write(failure);
    }

    /**
     * Restores the state written by {@link #writeState}.
     *
     * @throws java.io.IOException when the stream holds another number of particles or ends early
     */
    public void readState(java.io.DataInputStream in) throws java.io.IOException {
        int n = in.readInt();
        if (n != size()) {
            throw new java.io.IOException("the checkpoint holds " + n + " particles, the run " + size());
        }
        for (double[] a : new double[][] {r, th, ph, pr, pth, pt, pphi, t, h, dy}) {
            for (int i = 0; i < a.length; i++) {
                a[i] = Double.longBitsToDouble(in.readLong());
            }
        }
        in.readFully(state);
        in.readFully(failure);
    }

    /**
     * Sets particle i at time t0 from its covariant momentum (p_t, p_r, p_theta, p_phi), as
     * produced by {@link ZamoFrame} or {@link OrbitSetup}.
     */
    public void set(int i, double t0, double rr, double theta, double phi, double pT, double pR,
                    double pTheta, double pPhi) {
        r[i] = rr;
        th[i] = theta;
        ph[i] = phi;
        pr[i] = pR;
        pth[i] = pTheta;
        pt[i] = pT;
        pphi[i] = pPhi;
        t[i] = t0;
        h[i] = 0.0;
        state[i] = EndState.ALIVE.code();
        failure[i] = (byte) Failure.NONE.ordinal();
    }

    /** Sets particle i from an {@link InitialState}. */
    public void set(int i, double t0, InitialState s) {
        set(i, t0, s.r(), s.theta(), s.phi(), s.pT(), s.pR(), s.pTheta(), s.pPhi());
    }

    @Override public double pT(int i) {
        return pt[i];
    }

    @Override public double pPhi(int i) {
        return pphi[i];
    }

    /** @return the particle's own time: end of its last step, or the time it ended */
    public double time(int i) {
        return t[i];
    }

    public Failure failure(int i) {
        return Failure.ofCode(failure[i]);
    }

    /** @return the number of particles in each end state, indexed by {@link EndState#ordinal()} */
    public int[] countByState() {
        int[] c = new int[EndState.values().length];
        for (byte s : state) {
            c[s]++;
        }
        return c;
    }

    /** @return a copy of all arrays (tests compare two batches bitwise) */
    public ParticleBatch copy() {
        ParticleBatch b = new ParticleBatch(size());
        System.arraycopy(r, 0, b.r, 0, size());
        System.arraycopy(th, 0, b.th, 0, size());
        System.arraycopy(ph, 0, b.ph, 0, size());
        System.arraycopy(pr, 0, b.pr, 0, size());
        System.arraycopy(pth, 0, b.pth, 0, size());
        System.arraycopy(pt, 0, b.pt, 0, size());
        System.arraycopy(pphi, 0, b.pphi, 0, size());
        System.arraycopy(t, 0, b.t, 0, size());
        System.arraycopy(h, 0, b.h, 0, size());
        System.arraycopy(dy, 0, b.dy, 0, dy.length);
        System.arraycopy(state, 0, b.state, 0, size());
        System.arraycopy(failure, 0, b.failure, 0, size());
        return b;
    }

    /** @return true when every array equals the other's bit for bit */
    public boolean bitwiseEquals(ParticleBatch o) {
        return Arrays.equals(r, o.r) && Arrays.equals(th, o.th) && Arrays.equals(ph, o.ph)
                && Arrays.equals(pr, o.pr) && Arrays.equals(pth, o.pth) && Arrays.equals(pt, o.pt)
                && Arrays.equals(pphi, o.pphi) && Arrays.equals(t, o.t) && Arrays.equals(h, o.h)
                && Arrays.equals(dy, o.dy)
                && Arrays.equals(state, o.state) && Arrays.equals(failure, o.failure);
    }
}
