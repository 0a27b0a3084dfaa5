package org.spindrift.sim.spacetime;

import org.hipparchus.CalculusFieldElement;

/**
 * A stationary, axisymmetric, asymptotically flat metric in Boyer-Lindquist-like coordinates
 * (t, r, theta, phi), signature (-,+,+,+), geometric units with M = 1. Only the components
 * tt, t-phi, phi-phi, rr and theta-theta are non-zero (true of every family here).
 *
 * <p>Component layout of the {@code double[]} buffers (length {@link #SIZE}): index
 * {@code c} holds the value of component c, {@code DR + c} its r-derivative and {@code DTH + c}
 * its theta-derivative, with c one of {@link #TT}, {@link #TP}, {@link #PP}, {@link #RR},
 * {@link #HH}. Implementations must not allocate in {@link #inverse} or {@link #covariant}:
 * they are called inside the integrators' right-hand sides.
 */
public interface Spacetime {
    /** Component index: tt. */
    int TT = 0;
    /** Component index: t-phi. */
    int TP = 1;
    /** Component index: phi-phi. */
    int PP = 2;
    /** Component index: rr. */
    int RR = 3;
    /** Component index: theta-theta. */
    int HH = 4;
    /** Offset of the r-derivatives. */
    int DR = 5;
    /** Offset of the theta-derivatives. */
    int DTH = 10;
    /** Length of a metric buffer: 5 values, 5 r-derivatives, 5 theta-derivatives. */
    int SIZE = 15;

    /** @return the family name as used on the command line, for example {@code kerr} */
    String family();

    /** @return the spin parameter a (units of M) */
    double spin();

    /** Inverse metric g^{mu nu} and its analytic first derivatives at (r, theta), into out. */
    void inverse(double r, double theta, double[] out);

    /** Covariant metric g_{mu nu} and its analytic first derivatives at (r, theta), into out. */
    void covariant(double r, double theta, double[] out);

    /**
     * Covariant metric values (no derivatives) for any field type, so that landmarks can take
     * exact higher derivatives with Hipparchus automatic differentiation and tests can check the
     * analytic derivatives of {@link #covariant} and {@link #inverse}.
     *
     * @param out length 5, indexed by {@link #TT} ... {@link #HH}
     */
    <T extends CalculusFieldElement<T>> void covariant(T r, T theta, T[] out);

    /**
     * @return true when the geodesic equations separate (Hamilton-Jacobi, Carter 1968) and
     *     {@link #carter} is a constant of motion
     */
    boolean separable();

    /**
     * Carter constant Q = p_theta^2 + cos^2(theta) (a^2 (mu^2 - E^2) + L^2 / sin^2(theta))
     * (Carter 1968, Phys. Rev. 174, 1559), for separable members; NaN otherwise.
     *
     * @param mu2 rest mass squared: 1 for test masses, 0 for photons
     */
    double carter(double theta, double pTheta, double energy, double angularMomentum, double mu2);
}
