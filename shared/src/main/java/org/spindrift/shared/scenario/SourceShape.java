package org.spindrift.shared.scenario;

/**
 * The initial spatial distribution of a source's particles about its centre, in the local
 * orthonormal frame of the centre (radial, azimuthal, vertical directions), lengths in M.
 */
public sealed interface SourceShape {
    /**
     * A spherical Gaussian ball.
     *
     * @param sigmaM standard deviation along each axis, M
     */
    record Ball(double sigmaM) implements SourceShape {
    }

    /**
     * A Gaussian ellipsoid aligned with the local radial, azimuthal and vertical directions.
     *
     * @param radialM standard deviation along r, M
     * @param azimuthalM standard deviation along phi, M
     * @param verticalM standard deviation along -theta (out of the plane), M
     */
    record Ellipsoid(double radialM, double azimuthalM, double verticalM) implements SourceShape {
    }

    /**
     * A ring segment: particles on neighbouring equatorial circular orbits with radii uniform in
     * [inner, outer] and azimuths uniform over an arc centred on the centre's azimuth.
     *
     * @param innerRadiusM inner radius, M
     * @param outerRadiusM outer radius, M
     * @param arcDeg azimuthal arc the particles start on, degrees (360 for a full ring)
     */
    record Ring(double innerRadiusM, double outerRadiusM, double arcDeg) implements SourceShape {
    }
}
