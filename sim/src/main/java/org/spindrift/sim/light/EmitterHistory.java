package org.spindrift.sim.light;

/**
 * What the light layer reads of the particles: states at snapshot times (coordinate time, M),
 * Boyer-Lindquist-like positions, contravariant 4-velocities, emission weights (flare envelope
 * applied, so interpolating them in time evaluates the envelope in emitter time), end states
 * and the spectral index of each particle's source. An adapter over the scenario's particle
 * history implements it.
 */
public interface EmitterHistory {
    /** State code of a particle still on its orbit. */
    int ALIVE = 0;

    /** @return number of snapshots (at least 2 for interpolation) */
    int snapshots();

    /** @return number of particles */
    int particles();

    /** @return coordinate time of snapshot s, M (increasing) */
    double time(int s);

    double r(int s, int n);

    double theta(int s, int n);

    /** @return phi, not necessarily unwrapped */
    double phi(int s, int n);

    /** @return u^mu (mu = 0..3: t, r, theta, phi) */
    double u(int s, int n, int mu);

    /** @return emission weight of particle n at snapshot s */
    double weight(int s, int n);

    /** @return end-state code of particle n at snapshot s ({@link #ALIVE} while on its orbit) */
    int state(int s, int n);

    /** @return spectral index alpha (F_nu ~ nu^-alpha) of particle n's source */
    double spectralIndex(int n);

    /** @return index of particle n's source (0 for the first) */
    int source(int n);
}
