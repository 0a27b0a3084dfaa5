package org.spindrift.sim.motion;

/**
 * Read-only view of one accepted step [t0, t1] of one particle with its 7th-order continuous
 * extension (Hairer, Norsett &amp; Wanner 1993, DOP853 contd8). Valid only during the
 * {@link StepListener#step} call that received it. Components are indexed as in
 * {@link GeodesicEquations} ({@code R, TH, PH, PR, PTH}).
 */
public interface DenseStep {
    /** @return start of the step (coordinate time, M) */
    double t0();

    /** @return end of the step */
    double t1();

    /** @return component c of the state at the start of the step */
    double start(int c);

    /** @return component c of the state at the end of the step */
    double end(int c);

    /**
     * Component c at time t in [t0, t1] from the continuous extension. The first call per step
     * costs three extra right-hand-side evaluations; later calls are polynomial evaluations.
     */
    double at(int c, double t);

    /** @return g(t0, y(t0)) of an event function at the start of the step */
    double gStart(EventFunction g);

    /** @return g(t1, y(t1)) of an event function at the end of the step */
    double gEnd(EventFunction g);

    /**
     * Locates the sign change of g inside the step on the continuous extension with the shared
     * bisection ({@link org.spindrift.sim.numerics.BracketedRoot#locate}), g(t0) and g(t1)
     * lying on different sides.
     *
     * @return the end of the final bracket (at most two ulps wide) past the sign change;
     *     {@link #locatedBefore} gives the other end
     */
    double locate(EventFunction g);

    /** @return the end of the last {@link #locate} bracket before the sign change */
    double locatedBefore();
}
