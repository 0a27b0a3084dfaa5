package org.spindrift.sim.motion;

/**
 * A sign-change event of one member's trajectory, as Hipparchus' event handlers define them:
 * the event happens where g(t, y) changes sign. The integrator checks g at the end of every
 * accepted step and locates the change on the step's continuous extension with the shared root
 * finder ({@link DenseStep#locate}, {@link org.spindrift.sim.numerics.BracketedRoot}).
 * Implementations allocate nothing.
 */
@FunctionalInterface
public interface EventFunction {
    /**
     * @param t the independent variable (coordinate time, M)
     * @param y the state, read from {@code y[off ..]} (indices of {@link GeodesicEquations})
     * @return g(t, y)
     */
    double g(double t, double[] y, int off);

    /** @return g = y[c] - level: positive while component c is above the level */
    static EventFunction above(int c, double level) {
        return (t, y, off) -> y[off + c] - level;
    }

    /** @return g = level - y[c]: positive while component c is below the level */
    static EventFunction below(int c, double level) {
        return (t, y, off) -> level - y[off + c];
    }
}
