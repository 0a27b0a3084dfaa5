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
}
