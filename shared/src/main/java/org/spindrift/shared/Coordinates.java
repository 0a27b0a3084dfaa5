package org.spindrift.shared;

/**
 * Boyer-Lindquist-like coordinates (r, theta, phi) and the Cartesian coordinates used for
 * display and spatial indexing:
 * x = sqrt(r^2+a^2) sin(theta) cos(phi), y = sqrt(r^2+a^2) sin(theta) sin(phi), z = r cos(theta)
 * (the oblate-spheroidal form of Boyer & Lindquist 1967, J. Math. Phys. 8, 265).
 */
public final class Coordinates {
    private Coordinates() {
    }

    /** Cartesian (x, y, z) of (r, theta, phi) for spin a, into out[0..2]. */
    public static void cartesian(double r, double theta, double phi, double spin, double[] out) {
        final double rho = Math.sqrt(r * r + spin * spin) * Math.sin(theta);
        out[0] = rho * Math.cos(phi);
        out[1] = rho * Math.sin(phi);
        out[2] = r * Math.cos(theta);
    }

    /**
     * Inverse of {@link #cartesian}: (r, theta, phi) into out[0..2], phi in (-pi, pi]. From
     * x^2 + y^2 = (r^2 + a^2) sin^2(theta) and z = r cos(theta), r^2 solves
     * r^4 - (R^2 - a^2) r^2 - a^2 z^2 = 0 with R^2 = x^2 + y^2 + z^2 (positive root).
     */
    public static void boyerLindquist(double x, double y, double z, double spin, double[] out) {
        radiusAndPolarAngle(x, y, z, spin, out);
        out[2] = Math.atan2(y, x);
    }

    /** The (r, theta) part of {@link #boyerLindquist} into out[0..1] (no azimuth). */
    public static void radiusAndPolarAngle(double x, double y, double z, double spin, double[] out) {
        final double a2 = spin * spin;
        final double b = x * x + y * y + z * z - a2;
        final double r2 = 0.5 * (b + Math.sqrt(b * b + 4.0 * a2 * z * z));
        final double r = Math.sqrt(r2);
        out[0] = r;
        out[1] = r > 0 ? Math.acos(Math.max(-1.0, Math.min(1.0, z / r))) : 0.5 * Math.PI;
    }
}
