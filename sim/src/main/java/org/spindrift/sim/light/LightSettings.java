package org.spindrift.sim.light;

import org.spindrift.shared.Units;
import org.spindrift.shared.colour.ColourRamp;
import org.spindrift.shared.scenario.Imaging;
import org.spindrift.shared.scenario.Instrument;
import org.spindrift.shared.scenario.Scenario;

/**
 * Everything the light stage needs from a scenario, in engine units.
 *
 * @param inclinationDeg observer inclination, deg
 * @param positionAngleDeg position angle of the projected spin axis, deg (north through east)
 * @param fieldOfViewM field of view, M
 * @param pixels pixels per side
 * @param frameCadenceM observer-time interval between frames, M (NaN: the snapshot cadence)
 * @param lensing ray-traced (true) or straight lines (false)
 * @param massSolar black hole mass, solar masses
 * @param distanceMpc distance, Mpc
 * @param beamFwhmUas beam FWHM, micro-arcseconds (0: none)
 * @param steadyFluxRatio steady point-source flux relative to the mean flare flux (0: none)
 * @param noiseUas astrometric noise per axis, micro-arcseconds (0: no mock data)
 * @param noiseCadenceMin mock-data cadence, minutes
 * @param seed seed of the mock-data noise
 * @param skyColours colour ramp of the image plots
 */
public record LightSettings(double inclinationDeg, double positionAngleDeg, double fieldOfViewM, int pixels,
                            double frameCadenceM, boolean lensing, double massSolar, double distanceMpc,
                            double beamFwhmUas, double steadyFluxRatio, double noiseUas, double noiseCadenceMin,
                            long seed, ColourRamp skyColours) {
    /** Settings with the default sky colours. */
    public LightSettings(double inclinationDeg, double positionAngleDeg, double fieldOfViewM, int pixels,
                         double frameCadenceM, boolean lensing, double massSolar, double distanceMpc,
                         double beamFwhmUas, double steadyFluxRatio, double noiseUas, double noiseCadenceMin, long seed) {
        this(inclinationDeg, positionAngleDeg, fieldOfViewM, pixels, frameCadenceM, lensing, massSolar, distanceMpc,
                beamFwhmUas, steadyFluxRatio, noiseUas, noiseCadenceMin, seed, ColourRamp.SKY);
    }

    /** Distance of the camera's start plane, M (Camera: error of order M b / d). */
    public static final double CAMERA_DISTANCE_M = 1.0e4;

    /** @return the settings of a scenario */
    public static LightSettings of(Scenario s) {
        Imaging im = s.imaging();
        Instrument in = s.instrument();
        double secondsPerM = Units.timeUnitSeconds(s.blackHole().massSolar());
        double cadence = im.frameCadence() == null ? Double.NaN : im.frameCadence().toM(secondsPerM);
        return new LightSettings(s.observer().inclinationDeg(), s.observer().positionAngleDeg(), im.fieldOfViewM(),
                im.pixels(), cadence, im.lensing(), s.blackHole().massSolar(), s.blackHole().distanceMpc(),
                in.beamFwhmUas(), in.steadySourceFluxRatio(), in.astrometricNoiseUas(), in.noiseCadenceMin(),
                s.run().seed(), im.skyColours());
    }

    /** @return micro-arcseconds per M at the source's distance */
    public double uasPerM() {
        return Units.uasPerM(massSolar, distanceMpc);
    }

    /** @return minutes per M */
    public double minutesPerM() {
        return Units.timeUnitSeconds(massSolar) / 60.0;
    }

    /** @return the camera (start plane at 1e4 M, or 100 fields of view for very wide fields) */
    public Camera camera() {
        return new Camera(inclinationDeg, positionAngleDeg, fieldOfViewM, pixels,
                Math.max(CAMERA_DISTANCE_M, 100.0 * fieldOfViewM));
    }

    /** @return a copy with another image size */
    public LightSettings withPixels(int n) {
        return new LightSettings(inclinationDeg, positionAngleDeg, fieldOfViewM, n, frameCadenceM, lensing, massSolar,
                distanceMpc, beamFwhmUas, steadyFluxRatio, noiseUas, noiseCadenceMin, seed, skyColours);
    }
}
