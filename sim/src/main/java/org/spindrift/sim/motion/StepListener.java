package org.spindrift.sim.motion;

/**
 * Observer of accepted steps (for event detection on the dense output, for example periapsis
 * passages). Called from the worker thread that owns the particle's chunk: an implementation
 * used with more than one thread must only touch state indexed by particle.
 */
@FunctionalInterface
public interface StepListener {
    /**
     * @param particle index of the particle in its {@link ParticleBatch}
     * @param step the accepted step and its continuous extension
     */
    void step(int particle, DenseStep step);
}
