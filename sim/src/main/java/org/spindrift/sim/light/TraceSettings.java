package org.spindrift.sim.light;

/**
 * Settings of the backward ray tracer.
 *
 * @param emissionRadius outer radius of the emission region, M: samples are kept inside it and a
 *     ray moving outwards beyond it ends
 * @param captureRadius rays reaching a smaller r end, M: the capture radius of the landmarks
 *     (outer horizon + 0.01 M, or the surface of a horizonless object)
 * @param endRadius rays moving outwards end beyond max(emissionRadius, endRadius), M
 * @param sampleSpacing largest spacing of samples along the ray inside the emission region, M
 * @param relativeTolerance relative tolerance of the Dormand-Prince 5(4) step control
 * @param absoluteTolerance absolute tolerance of the step control
 * @param maxSteps step budget per ray (the ray fails beyond it)
 * @param lensing false for straight lines (no bending, no redshift from the photon path; delays kept)
 * @param mask where gas may be (samples only there, long steps elsewhere); null: the whole sphere
 *     r &lt; emissionRadius
 * @param generalPath true: the general path for every metric, the reference for comparisons:
 *     Hamilton's equations in the affine parameter, and sub-pixel refinement of every stretched
 *     pixel; false: the separated equations in Mino time where the metric allows them (Kerr and
 *     the mass-function family; Hamilton's equations elsewhere), and refinement only of pixels
 *     whose neighbourhood sees gas
 */
public record TraceSettings(double emissionRadius, double captureRadius, double endRadius,
                            double sampleSpacing, double relativeTolerance, double absoluteTolerance,
                            int maxSteps, boolean lensing, EmissionMask mask, boolean generalPath) {
    /** Settings on the fast path where the metric allows it. */
    public TraceSettings(double emissionRadius, double captureRadius, double endRadius, double sampleSpacing,
                         double relativeTolerance, double absoluteTolerance, int maxSteps, boolean lensing,
                         EmissionMask mask) {
        this(emissionRadius, captureRadius, endRadius, sampleSpacing, relativeTolerance, absoluteTolerance, maxSteps,
                lensing, mask, false);
    }

    /** Default tolerances: tight enough for the validation checks (relative 1e-9). */
    public static TraceSettings of(double emissionRadius, double captureRadius, double sampleSpacing,
                                   boolean lensing) {
        return new TraceSettings(emissionRadius, captureRadius, 0.0, sampleSpacing, 1.0e-9, 1.0e-11,
                200_000, lensing, null);
    }

    public TraceSettings withTolerance(double rtol, double atol) {
        return new TraceSettings(emissionRadius, captureRadius, endRadius, sampleSpacing, rtol, atol,
                maxSteps, lensing, mask, generalPath);
    }

    public TraceSettings withMask(EmissionMask m) {
        return new TraceSettings(emissionRadius, captureRadius, endRadius, sampleSpacing, relativeTolerance,
                absoluteTolerance, maxSteps, lensing, m, generalPath);
    }

    /** @return a copy that traces with Hamilton's equations in the affine parameter (true) or not */
    public TraceSettings withGeneralPath(boolean general) {
        return new TraceSettings(emissionRadius, captureRadius, endRadius, sampleSpacing, relativeTolerance,
                absoluteTolerance, maxSteps, lensing, mask, general);
    }
}
