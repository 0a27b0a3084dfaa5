package org.spindrift.sim.light;

/**
 * The image budget of the light stage: frame cadences and image sizes whose cube would not fit in
 * memory are refused before any ray is traced (checked by {@code check}, before {@code run}
 * starts and again by the light stage).
 */
public final class FrameBudget {
    /** Largest image cube kept in memory, in pixels (frames x N^2), about 2 GB of floats. */
    public static final long MAX_CUBE_PIXELS = 500_000_000L;

    /** Largest delay spread across the field expected before tracing, M (generous). */
    static final double DELAY_SPREAD_M = 200.0;

    private FrameBudget() {
    }

    /**
     * The budget, estimated from the run span plus a delay spread of {@link #DELAY_SPREAD_M}.
     *
     * @return the problem in words, or null when the cube fits
     */
    public static String problem(LightSettings s, double t0, double t1, int snapshots) {
        double frames = frameEstimate(s, t0, t1, snapshots);
        double cube = frames * s.pixels() * (double) s.pixels() * (s.beamFwhmUas() > 0 ? 2 : 1);
        if (cube > MAX_CUBE_PIXELS) {
            return String.format(java.util.Locale.ROOT, "about %.3g frames of %d x %d pixels%s exceed the image"
                    + " budget of %d pixels; use a longer frame_cadence or fewer pixels", frames, s.pixels(), s.pixels(),
                    s.beamFwhmUas() > 0 ? " (twice: with and without the beam)" : "", MAX_CUBE_PIXELS);
        }
        return null;
    }

    /**
     * @return an upper estimate of the number of frames (the emission window widened by the largest
     *     expected delay spread), before any ray is traced
     */
    public static double frameEstimate(LightSettings s, double t0, double t1, int snapshots) {
        double cadence = Double.isNaN(s.frameCadenceM()) ? (t1 - t0) / Math.max(1, snapshots - 1) : s.frameCadenceM();
        return (t1 - t0 + DELAY_SPREAD_M) / cadence + 1;
    }

    /** @throws org.spindrift.shared.UserInputException when the cube would not fit */
    public static void check(LightSettings s, double t0, double t1, int snapshots) {
        String problem = problem(s, t0, t1, snapshots);
        if (problem != null) {
            throw new org.spindrift.shared.UserInputException("imaging.frame_cadence / imaging.pixels: " + problem);
        }
    }
}
