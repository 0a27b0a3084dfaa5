package org.spindrift.sim.motion;

/** Why a particle ended in {@link EndState#FAILED}. */
public enum Failure {
    /** Not failed. */
    NONE,
    /** A non-finite value appeared in the state or its derivative and smaller steps did not help. */
    NON_FINITE,
    /** The step size fell below the minimum (or below the resolution of t) for another reason. */
    STEP_UNDERFLOW,
    /**
     * dt/dlambda became zero or negative, so coordinate time stopped being a valid independent
     * variable (for example on a trajectory that entered a region where the chosen sheet of
     * t is not future-directed), and smaller steps did not help.
     */
    TIME_NOT_INCREASING,
    /** The per-interval step budget ({@link BatchIntegrator.Config#maxStepsPerInterval}) ran out. */
    TOO_MANY_STEPS;

    private static final Failure[] VALUES = values();

    /** @return the failure with the given ordinal code */
    public static Failure ofCode(int code) {
        return VALUES[code];
    }
}
