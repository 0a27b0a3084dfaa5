package org.spindrift.shared.scenario;

import org.spindrift.shared.colour.ColourRamp;

/**
 * The camera of the light stage. All keys optional in a scenario.
 *
 * @param fieldOfViewM full width of the square field of view on the screen, M
 * @param pixels pixels per side
 * @param frameCadence interval between image frames in observer time (minutes or M); null means
 *     the snapshot cadence
 * @param lensing true: ray-traced null geodesics; false: straight lines (delays kept), for comparison
 * @param skyColours colour ramp of the image plots ({@link ColourRamp#SKY} or {@link ColourRamp#GREY})
 * @param emissionSum how the gas is summed along each ray: a grid per emission time (faster;
 *     images within about 1 % of the particle sum when the grid resolves the gas), the particles
 *     at every ray sample, or the grid when it resolves the gas ({@link EmissionSum#AUTO})
 */
public record Imaging(double fieldOfViewM, int pixels, TimeSpan frameCadence, boolean lensing, ColourRamp skyColours,
                      EmissionSum emissionSum) {
    /** Default field of view, M. */
    public static final double DEFAULT_FIELD_OF_VIEW_M = 30.0;
    /** Default pixels per side. */
    public static final int DEFAULT_PIXELS = 96;

    /** Imaging with the emission sum chosen by the gas ({@link EmissionSum#AUTO}). */
    public Imaging(double fieldOfViewM, int pixels, TimeSpan frameCadence, boolean lensing, ColourRamp skyColours) {
        this(fieldOfViewM, pixels, frameCadence, lensing, skyColours, EmissionSum.AUTO);
    }

    /** @return a copy with the given emission sum */
    public Imaging withEmissionSum(EmissionSum sum) {
        return new Imaging(fieldOfViewM, pixels, frameCadence, lensing, skyColours, sum);
    }

    /** Imaging with the default sky colours. */
    public Imaging(double fieldOfViewM, int pixels, TimeSpan frameCadence, boolean lensing) {
        this(fieldOfViewM, pixels, frameCadence, lensing, ColourRamp.SKY);
    }

    /** @return the defaults used when a scenario has no {@code imaging} section */
    public static Imaging defaults() {
        return new Imaging(DEFAULT_FIELD_OF_VIEW_M, DEFAULT_PIXELS, null, true);
    }
}
