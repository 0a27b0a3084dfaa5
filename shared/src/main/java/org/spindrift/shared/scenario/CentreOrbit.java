package org.spindrift.shared.scenario;

/** How the orbit of a source's centre is given: circular, by elements, or by a ZAMO-frame velocity. */
public sealed interface CentreOrbit {
    /** @return the initial azimuth of the centre, degrees */
    double phiDeg();

    /**
     * Circular equatorial orbit.
     *
     * @param radiusM orbit radius, M
     * @param sense prograde or retrograde
     * @param phiDeg initial azimuth, degrees
     */
    record Circular(double radiusM, Sense sense, double phiDeg) implements CentreOrbit {
    }

    /**
     * Bound orbit given by elements, solved for (E, L, Q) in separable spacetimes (Schmidt 2002).
     *
     * @param semiLatusRectumM p, M
     * @param eccentricity e in [0, 1)
     * @param inclinationDeg orbital inclination to the equatorial plane, degrees (0 = equatorial)
     * @param sense prograde or retrograde
     * @param start where the centre starts: at periapsis or apoapsis
     * @param phiDeg initial azimuth, degrees
     */
    record Elements(double semiLatusRectumM, double eccentricity, double inclinationDeg, Sense sense,
            Start start, double phiDeg) implements CentreOrbit {
        /** @return the periapsis radius p/(1+e) */
        public double periapsisM() {
            return semiLatusRectumM / (1.0 + eccentricity);
        }

        /** @return the apoapsis radius p/(1-e) */
        public double apoapsisM() {
            return semiLatusRectumM / (1.0 - eccentricity);
        }
    }

    /** Where an orbit given by elements starts. */
    enum Start {
        /** At the smallest radius. */
        PERIAPSIS,
        /** At the largest radius. */
        APOAPSIS
    }

    /**
     * A position and a 3-velocity measured by the zero-angular-momentum observer (ZAMO) there, any
     * spacetime (scenario key {@code orbit.zamo_velocity}).
     *
     * @param radiusM r, M
     * @param thetaDeg polar angle theta, degrees (90 = equatorial plane)
     * @param phiDeg azimuth, degrees
     * @param vR radial velocity in the ZAMO frame, units of c
     * @param vTheta polar velocity in the ZAMO frame (along increasing theta), units of c
     * @param vPhi azimuthal velocity in the ZAMO frame, units of c
     */
    record ZamoVelocity(double radiusM, double thetaDeg, double phiDeg, double vR, double vTheta, double vPhi)
            implements CentreOrbit {
    }
}
