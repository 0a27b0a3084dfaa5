package org.spindrift.shared.scenario;

/**
 * Instrument effects applied to the light outputs. All keys optional.
 *
 * @param beamFwhmUas full width at half maximum of the Gaussian beam, micro-arcseconds (0: no beam)
 * @param steadySourceFluxRatio flux of a steady point source at the black hole, relative to the
 *     mean flux of the flare (0: none); it pulls the apparent centroid towards the black hole
 * @param astrometricNoiseUas one-sigma astrometric noise per axis for mock data, micro-arcseconds
 * @param noiseCadenceMin interval between mock astrometric points, minutes
 */
public record Instrument(double beamFwhmUas, double steadySourceFluxRatio, double astrometricNoiseUas,
        double noiseCadenceMin) {
    /** Default beam FWHM, micro-arcseconds (0 = none). */
    public static final double DEFAULT_BEAM_FWHM_UAS = 0.0;
    /** Default mock-data cadence, minutes. */
    public static final double DEFAULT_NOISE_CADENCE_MIN = 1.0;

    /** @return the defaults used when a scenario has no {@code instrument} section */
    public static Instrument defaults() {
        return new Instrument(DEFAULT_BEAM_FWHM_UAS, 0.0, 0.0, DEFAULT_NOISE_CADENCE_MIN);
    }
}
