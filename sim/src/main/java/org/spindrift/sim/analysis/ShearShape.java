package org.spindrift.sim.analysis;

/**
 * The shape of one source at one snapshot. Lengths in M, angles in degrees.
 *
 * @param source source index
 * @param snapshot snapshot index
 * @param time coordinate time, M
 * @param alive members alive
 * @param centreX Cartesian centre of mass of the alive members, x
 * @param centreY y
 * @param centreZ z
 * @param centreR Boyer-Lindquist r of the centre of mass
 * @param major square root of the larger eigenvalue of the in-plane second-moment tensor
 * @param minor square root of the smaller eigenvalue
 * @param aspectRatio major / minor
 * @param orientationDeg angle of the major axis from the local radial direction towards the
 *     direction of motion, in (-90, 90]
 * @param azimuthalExtentDeg 5-95 % range of the members' azimuth phi
 * @param lag the azimuthal-lag profile at this snapshot
 */
public record ShearShape(int source, int snapshot, double time, int alive, double centreX, double centreY, double centreZ,
        double centreR, double major, double minor, double aspectRatio, double orientationDeg,
        double azimuthalExtentDeg, LagProfile lag) {
}
