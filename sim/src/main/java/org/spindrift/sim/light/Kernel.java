package org.spindrift.sim.light;

/**
 * The cubic-spline smoothing kernel of smoothed-particle hydrodynamics (Monaghan &amp; Lattanzio
 * 1985, A&amp;A 149, 135, eq. 2.4; Monaghan 1992, ARA&amp;A 30, 543), normalised in three
 * dimensions, support radius 2h.
 */
final class Kernel {
    private Kernel() {
    }

    /** @return W(d, h) for the squared distance d2 and inverse smoothing length; 0 beyond 2h */
    static double w(double d2, double invH, double norm) {
        double q2 = d2 * invH * invH;
        if (q2 >= 4.0) {
            return 0.0;
        }
        double q = Math.sqrt(q2);
        if (q < 1.0) {
            return norm * (1.0 - 1.5 * q2 + 0.75 * q2 * q);
        }
        double t = 2.0 - q;
        return norm * 0.25 * t * t * t;
    }

    /** @return the 3-D normalisation 1 / (pi h^3) */
    static double norm(double h) {
        return 1.0 / (Math.PI * h * h * h);
    }
}
