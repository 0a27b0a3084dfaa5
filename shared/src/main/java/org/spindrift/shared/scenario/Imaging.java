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
 * @param griddedEmission true: the gas density is read from a grid per emission time instead of
 *     summing the particles at every ray sample (about twice as fast; images differ by about 1 %)
 */
public record Imaging(double fieldOfViewM, int pixels, TimeSpan frameCadence, boolean lensing, ColourRamp skyColours,
                      boolean griddedEmission) {
    /** Default field of view, M. */
    public static final double DEFAULT_FIELD_OF_VIEW_M = 30.0;
    /** Default pixels per side. */
    public static final int DEFAULT_PIXELS = 96;

    /** Imaging that sums the particles at every ray sample. */
    public Imaging(double fieldOfViewM, int pixels, TimeSpan frameCadence, boolean lensing, ColourRamp skyColours) {
        this(fieldOfViewM, pixels, frameCadence, lensing, skyColours, false);
    }

    /** @return a copy with the gridded (true) or the particle (false) emission sum */
    public Imaging withGriddedEmission(boolean gridded) {
        return new Imaging(fieldOfViewM, pixels, frameCadence, lensing, skyColours, gridded);
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
