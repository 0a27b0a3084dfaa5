package org.spindrift.shared.scenario;

import java.util.List;
import java.util.Objects;

/**
 * An interferometric array observing the flare (optional scenario section {@code interferometer};
 * keys, units and ranges in configs/README.md). Earth-based stations only: positions are
 * geocentric (Earth-centred, Earth-fixed) Cartesian coordinates.
 *
 * @param arrayFile the separate array file the stations came from, as written (null: inline)
 * @param stations at least two stations, unique names
 * @param frequencyGhz observing frequency, GHz
 * @param bandwidthGhz recorded bandwidth, GHz (radiometer equation)
 * @param rightAscensionDeg source right ascension, deg
 * @param declinationDeg source declination, deg
 * @param startSiderealTimeH Greenwich apparent sidereal time at observer time zero of the run, hours
 * @param scanLength length of one scan
 * @param scanCadence interval between scan starts (at least the scan length)
 * @param integrationS integration time of one visibility, s
 * @param peakFluxJy total flux density of the brightest image frame (flare only), Jy: the scale
 *     of the image cube's relative units
 * @param gainError one-sigma fractional station amplitude-gain error per scan (0: none)
 * @param phaseErrorDeg one-sigma station phase error per scan, deg (0: none)
 */
public record Interferometer(String arrayFile, List<Station> stations, double frequencyGhz, double bandwidthGhz,
        double rightAscensionDeg, double declinationDeg, double startSiderealTimeH, TimeSpan scanLength,
        TimeSpan scanCadence, double integrationS, double peakFluxJy, double gainError, double phaseErrorDeg) {
    /** Default elevation limit of a station, deg. */
    public static final double DEFAULT_ELEVATION_LIMIT_DEG = 10.0;
    /** Default integration time, s. */
    public static final double DEFAULT_INTEGRATION_S = 10.0;

    public Interferometer {
        stations = List.copyOf(stations);
        Objects.requireNonNull(scanLength, "scanLength");
        Objects.requireNonNull(scanCadence, "scanCadence");
    }

    /**
     * One station.
     *
     * @param name name of the user's choice (letters, digits, '.', '_', '-'; at most 8 characters,
     *     the UVFITS antenna-name width)
     * @param xM geocentric X (towards longitude 0 on the equator), m; and yM (longitude 90 deg east),
     *     zM (north pole)
     * @param sefdJy system equivalent flux density, Jy
     * @param elevationLimitDeg lowest elevation it observes at, deg
     */
    public record Station(String name, double xM, double yM, double zM, double sefdJy, double elevationLimitDeg) {
    }
}
