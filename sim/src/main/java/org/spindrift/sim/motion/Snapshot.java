package org.spindrift.sim.motion;

/**
 * Read-only view ({@link ParticleView}) of all particles at one snapshot time: the state interpolated with the
 * integrator's continuous extension for alive particles, the final state (at
 * {@link #endTime}) for particles that have ended. Indexing is the {@link ParticleBatch}'s.
 */
public final class Snapshot extends ParticleColumns {
    private final ParticleBatch batch;

    Snapshot(ParticleBatch batch) {
        super(batch.size());
        this.batch = batch;
    }

    /** @return the conserved p_t = -E of particle i */
    @Override public double pT(int i) {
        return batch.pt[i];
    }

    /** @return the conserved p_phi = L of particle i */
    @Override public double pPhi(int i) {
        return batch.pphi[i];
    }

    /** @return the archive code of the end state (0 alive, 1 captured, 2 escaped, 3 failed) */
    public byte stateCode(int i) {
        return state[i];
    }

    /** @return the time particle i ended, or NaN while it is alive at this snapshot */
    public double endTime(int i) {
        return state[i] == 0 ? Double.NaN : batch.t[i];
    }

    /** @return why particle i failed (NONE unless its state is FAILED) */
    public Failure failure(int i) {
        return state[i] == EndState.FAILED.code() ? batch.failure(i) : Failure.NONE;
    }

    /** Copies the r column into dest (length &gt;= size). Likewise the other copy methods. */
    public void copyR(double[] dest) {
        System.arraycopy(r, 0, dest, 0, r.length);
    }

    public void copyTheta(double[] dest) {
        System.arraycopy(th, 0, dest, 0, th.length);
    }

    public void copyPhi(double[] dest) {
        System.arraycopy(ph, 0, dest, 0, ph.length);
    }

    public void copyPR(double[] dest) {
        System.arraycopy(pr, 0, dest, 0, pr.length);
    }

    public void copyPTheta(double[] dest) {
        System.arraycopy(pth, 0, dest, 0, pth.length);
    }

    public void copyStates(byte[] dest) {
        System.arraycopy(state, 0, dest, 0, state.length);
    }
}
