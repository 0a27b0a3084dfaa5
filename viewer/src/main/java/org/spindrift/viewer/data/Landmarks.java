package org.spindrift.viewer.data;

/**
 * Radii (Boyer-Lindquist-like r, in M) that the 3D view draws. Missing ones are NaN.
 *
 * @param spin            a/M, for the display map x = sqrt(r^2 + a^2) sin(theta) cos(phi) ...
 * @param horizon         outer horizon radius (NaN for a horizonless object)
 * @param captureRadius   where the run stopped particles (manifest {@code capture_radius}: the horizon
 *                        + 0.01 M, or the surface of a horizonless object, drawn when there is no horizon)
 * @param isco            prograde innermost stable circular orbit
 * @param omegaMax        radius of the maximum of Omega(r), where one exists
 * @param ergoEquatorial  equatorial radius of the ergosurface (g_tt = 0)
 */
public record Landmarks(double spin, double horizon, double captureRadius, double isco, double omegaMax,
                        double ergoEquatorial) {

    /** @return the radius of the dark sphere at the centre: horizon, else the capture radius (surface), else NaN */
    public double centralRadius() {
        return Double.isFinite(horizon) && horizon > 0 ? horizon : captureRadius;
    }

    /**
     * Cylindrical display radius of an equatorial circle of coordinate radius r (the display map of
     * DEVELOPERS.md, run-archive layout: sqrt(r^2 + a^2) at theta = pi/2).
     */
    public double displayRadius(double r) {
        return Math.sqrt(r * r + spin * spin);
    }
}
