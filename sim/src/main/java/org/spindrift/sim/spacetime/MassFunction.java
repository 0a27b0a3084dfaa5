package org.spindrift.sim.spacetime;

import org.hipparchus.CalculusFieldElement;

/**
 * A radial mass function m(r) in units of M, for the Kerr-like metric of
 * {@link MassFunctionSpacetime}. Implementations are immutable.
 */
public interface MassFunction {
    /** @return m(r) */
    double value(double r);

    /** @return dm/dr */
    double derivative(double r);

    /** @return m(r) for any field type (automatic differentiation) */
    <T extends CalculusFieldElement<T>> T value(T r);

    /** @return true when m(r) = 1 identically (plain Kerr) */
    default boolean isConstant() {
        return false;
    }
}
