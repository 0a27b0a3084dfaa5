package org.spindrift.sim.motion;

/**
 * First-order equations dy/dt = f(y; c0, c1) for the members of a batch, in the way Hipparchus
 * separates an OrdinaryDifferentialEquation from its integrator: the integrators
 * ({@link BatchIntegrator}, {@link ParticleStepper}) see only this interface, the physics lives
 * in the implementation ({@link GeodesicEquations}). Each member carries two constants of its
 * own (for geodesics the conserved p_t and p_phi), so one instance serves the whole batch.
 *
 * <p>An implementation writes into the caller's arrays and allocates nothing; it may keep
 * scratch space, so each thread uses its own instance.
 */
public interface BatchEquations {
    /** @return the dimension of one member's state */
    int dimension();

    /**
     * Derivative of one member's state.
     *
     * @param c0 the member's first constant
     * @param c1 the member's second constant
     * @param y state, read from {@code y[yOff .. yOff + dimension() - 1]}
     * @param dy derivative, written to {@code dy[dyOff .. dyOff + dimension() - 1]}
     * @return the health of the state: positive and finite where the equations hold there
     *     (for geodesics in coordinate time, dt/dlambda); zero, negative or non-finite ends
     *     the step as failed
     */
    double derivatives(double c0, double c1, double[] y, int yOff, double[] dy, int dyOff);
}
