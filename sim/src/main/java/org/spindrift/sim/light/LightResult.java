package org.spindrift.sim.light;

import java.util.List;

/**
 * What the light stage produced: frame times and moments, images, and the centroid with the
 * steady source included; mock astrometry when noise was asked.
 *
 * @param settings the settings used
 * @param camera the camera
 * @param timesM observer time of each frame, M (origin: see {@link LightStage})
 * @param moments per-frame flux and moments of the unbeamed images
 * @param images per-frame images as written (beam applied when one is set)
 * @param steadyFlux flux of the steady point source (same units as the frame fluxes)
 * @param steadyX centroid east offset with the steady source, M, per frame (and steadyY)
 * @param mock mock astrometric epochs (null when no noise was asked)
 * @param smoothingLength kernel smoothing length, M
 * @param emissionRadius outer radius of the emission region, M
 * @param table ray-table statistics
 */
public record LightResult(LightSettings settings, Camera camera, double[] timesM, List<FrameMoments> moments,
                          float[][] images, double steadyFlux, double[] steadyX, double[] steadyY,
                          MockAstrometry mock, double smoothingLength, double emissionRadius, TableStats table) {
    /**
     * @param rays number of rays
     * @param samples samples kept in the emission region
     * @param steps integration steps
     * @param seconds wall-clock seconds for tracing (reported, never asserted)
     */
    public record TableStats(int rays, long samples, long steps, double seconds) {
    }

    /**
     * Mock astrometric epochs: observer time (M), centroid with steady source plus Gaussian noise (M).
     */
    public record MockAstrometry(double[] timesM, double[] x, double[] y, double sigmaUas) {
    }
}
