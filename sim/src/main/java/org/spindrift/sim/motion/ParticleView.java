package org.spindrift.sim.motion;

/**
 * Read-only per-particle view of a set of test masses: the coordinate-time state, the two
 * constants of motion and the end state. {@link ParticleBatch} (the integrator's live state)
 * and {@link Snapshot} (all particles at one snapshot time) both are one, so code that only
 * reads particles takes either.
 */
public interface ParticleView {
    /** @return the number of particles */
    int size();

    /** @return r of particle i (M) */
    double r(int i);

    /** @return theta of particle i (rad) */
    double theta(int i);

    /** @return phi of particle i (rad) */
    double phi(int i);

    /** @return the covariant p_r of particle i */
    double pR(int i);

    /** @return the covariant p_theta of particle i */
    double pTheta(int i);

    /** @return the conserved p_t = -E of particle i */
    double pT(int i);

    /** @return the conserved p_phi = L of particle i */
    double pPhi(int i);

    /** @return the end state of particle i */
    EndState endState(int i);
}
