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
 * @param rawImages per-frame images before the beam (the same arrays when there is no beam)
 * @param steadyFlux flux of the steady point source (same units as the frame fluxes)
 * @param steadyX centroid east offset with the steady source, M, per frame (and steadyY)
 * @param astrometricX the position the instrument reports, M, per frame (and astrometricY): with a
 *     beam the peak of the beam-convolved image with the steady source ({@link BeamAstrometry}),
 *     without one the centroid with the steady source (the same arrays as steadyX, steadyY)
 * @param mock mock astrometric epochs (null when no noise was asked)
 * @param smoothingLength kernel smoothing length, M
 * @param emissionRadius outer radius of the emission region, M
 * @param table ray-table statistics
 * @param coveredFrom first observer time (M) at which every sample sees an emission time inside
 *     the particle history (and coveredTo the last); frames outside may miss far-side light
 */
public record LightResult(LightSettings settings, Camera camera, double[] timesM, List<FrameMoments> moments,
                          float[][] images, float[][] rawImages, double steadyFlux, double[] steadyX, double[] steadyY,
                          double[] astrometricX, double[] astrometricY, MockAstrometry mock, double smoothingLength, double emissionRadius, TableStats table,
                          double coveredFrom, double coveredTo) {
    /** @return whether frame f lies in the fully covered observer-time interval */
    public boolean covered(int f) {
        return timesM[f] >= coveredFrom - 1e-9 && timesM[f] <= coveredTo + 1e-9;
    }

    /**
     * @param rays number of rays
     * @param samples samples kept in the emission region
     * @param steps integration steps
     * @param seconds wall-clock seconds for tracing (reported, never asserted)
     */
    public record TableStats(int rays, long samples, long steps, double seconds) {
    }

    /**
     * Mock astrometric epochs: observer time (M), the reported position (astrometricX, astrometricY)
     * plus Gaussian noise (M).
     */
    public record MockAstrometry(double[] timesM, double[] x, double[] y, double sigmaUas) {
    }
}
