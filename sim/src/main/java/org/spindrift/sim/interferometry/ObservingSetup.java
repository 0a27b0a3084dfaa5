package org.spindrift.sim.interferometry;

import org.hipparchus.util.FastMath;
import org.spindrift.shared.Units;
import org.spindrift.shared.scenario.Interferometer;
import org.spindrift.shared.scenario.Scenario;

/**
 * The interferometer section of a scenario in engine units.
 *
 * @param array station geometry
 * @param frequencyHz observing frequency, Hz
 * @param bandwidthHz bandwidth, Hz
 * @param rightAscension right ascension, rad
 * @param declination declination, rad
 * @param startSiderealTime Greenwich sidereal time at observer time zero, rad
 * @param scanLengthM scan length, M
 * @param scanCadenceM interval between scan starts, M
 * @param integrationS integration time per visibility, s
 * @param peakFluxJy flux density of the brightest frame (flare only), Jy
 * @param gainError one-sigma fractional amplitude-gain error per station and scan
 * @param phaseError one-sigma phase error per station and scan, rad
 * @param secondsPerM GM/c^3, s
 * @param seed seed of the noise and gain draws
 */
public record ObservingSetup(ArrayGeometry array, double frequencyHz, double bandwidthHz, double rightAscension,
                             double declination, double startSiderealTime, double scanLengthM, double scanCadenceM,
                             double integrationS, double peakFluxJy, double gainError, double phaseError,
                             double secondsPerM, long seed) {
    /**
     * Ratio of sidereal to solar (UT1) time, 1.00273790935 (Aoki et al. 1982, A&amp;A 105, 359;
     * value recalled from memory).
     */
    public static final double SIDEREAL_PER_SOLAR = 1.00273790935;

    /** @return the set-up of a scenario's interferometer (the scenario must have one) */
    public static ObservingSetup of(Scenario s) {
        Interferometer a = s.interferometer();
        double spm = Units.timeUnitSeconds(s.blackHole().massSolar());
        return new ObservingSetup(new ArrayGeometry(a.stations()), a.frequencyGhz() * 1e9, a.bandwidthGhz() * 1e9,
                FastMath.toRadians(a.rightAscensionDeg()), FastMath.toRadians(a.declinationDeg()),
                a.startSiderealTimeH() * FastMath.PI / 12.0, a.scanLength().toM(spm), a.scanCadence().toM(spm),
                a.integrationS(), a.peakFluxJy(), a.gainError(), FastMath.toRadians(a.phaseErrorDeg()), spm,
                s.run().seed());
    }

    /** @return observing wavelength, m */
    public double wavelength() {
        return Units.C / frequencyHz;
    }

    /** @return the Greenwich hour angle of the source at observer time t (M), rad */
    public double hourAngle(double tM) {
        return startSiderealTime + SIDEREAL_PER_SOLAR * tM * secondsPerM * (2.0 * FastMath.PI / 86400.0) - rightAscension;
    }

    /** @return a copy with another seed */
    public ObservingSetup withSeed(long s) {
        return new ObservingSetup(array, frequencyHz, bandwidthHz, rightAscension, declination, startSiderealTime,
                scanLengthM, scanCadenceM, integrationS, peakFluxJy, gainError, phaseError, secondsPerM, s);
    }
}
