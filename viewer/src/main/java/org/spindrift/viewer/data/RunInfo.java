package org.spindrift.viewer.data;

import java.util.List;

/**
 * What the viewer knows about a run besides the particle snapshots: snapshot times, sources,
 * landmarks, units and the observer's orientation. Small enough to hold in memory for any run
 * (the source-centre tracks are S x K x 3 numbers).
 *
 * @param title          a short name for the run (its folder name)
 * @param times          coordinate time of each snapshot, M (increasing)
 * @param sourceNames    source names, in archive order
 * @param sourceOf       source index of each particle
 * @param centres        source centres, [snapshot][source * 3 + xyz], Cartesian, M
 * @param landmarks      horizon, ISCO and the other radii drawn in the 3D view
 * @param mSeconds       the mass unit GM/c^3 in seconds
 * @param mUas   the angle 1 M subtends at the distance, micro-arcseconds
 * @param inclinationDeg observer inclination, degrees
 * @param positionAngleDeg position angle of the projected spin axis, degrees east of north
 */
public record RunInfo(String title, double[] times, List<String> sourceNames, int[] sourceOf,
                      float[][] centres, Landmarks landmarks, double mSeconds, double mUas,
                      double inclinationDeg, double positionAngleDeg) {

    public int snapshots() {
        return times.length;
    }

    public int particles() {
        return sourceOf.length;
    }

    /** @return the number of minutes in time t given in M */
    public double minutes(double tM) {
        return tM * mSeconds / 60.0;
    }
}
