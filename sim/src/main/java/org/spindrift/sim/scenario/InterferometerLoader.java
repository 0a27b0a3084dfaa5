package org.spindrift.sim.scenario;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.spindrift.shared.scenario.Interferometer;
import org.spindrift.shared.scenario.TimeSpan;
import org.spindrift.sim.scenario.ConfigSection.Range;

/**
 * Reads the optional {@code interferometer} section of a scenario (keys in configs/README.md).
 * The stations are given inline ({@code stations}) or in a separate array file
 * ({@code array_file}, a path relative to the scenario's folder, holding a mapping with one key
 * {@code stations}); the array file goes through the same strict reader, so its errors name that
 * file, its line and the key path.
 */
final class InterferometerLoader {
    /** Geocentric radius range of a station, m: the Earth's surface give or take 50 km (no spacecraft). */
    static final Range STATION_RADIUS_M = Range.closed(6.30e6, 6.43e6);

    private InterferometerLoader() {
    }

    static Interferometer read(ConfigSection s, Path scenarioFile, double secondsPerM) {
        if (s == null) {
            return null;
        }
        s.allow("stations", "array_file", "frequency_ghz", "bandwidth_ghz", "right_ascension_deg", "declination_deg",
                "start_sidereal_time_h", "scan_length", "scan_cadence", "integration_s", "peak_flux_jy", "gain_error",
                "phase_error_deg");
        if (s.has("stations") == s.has("array_file")) {
            throw s.error(s.has("stations") ? "array_file" : "stations", "give exactly one of stations (a list) or"
                    + " array_file (a file holding the stations)");
        }
        String arrayFile = null;
        List<Interferometer.Station> stations;
        if (s.has("stations")) {
            stations = stations(s);
        } else {
            arrayFile = s.string("array_file", null);
            Path base = scenarioFile.toAbsolutePath().getParent();
            Path af = base == null ? Path.of(arrayFile) : base.resolve(arrayFile);
            ConfigNode root = ConfigTreeReader.read(af);
            if (!(root instanceof ConfigNode.Obj obj)) {
                throw ConfigSection.error(af, root.line(), "", "an array file must be a mapping with the key stations, got "
                        + root.typeName());
            }
            ConfigSection a = new ConfigSection(af, "", obj, new ConfigSection.LineIndex());
            a.allow("stations");
            stations = stations(a);
        }
        double freq = s.number("frequency_ghz", Range.closed(0.1, 2000));
        double bw = s.number("bandwidth_ghz", Range.positive(100));
        if (bw >= freq) {
            throw s.error("bandwidth_ghz", "must be smaller than frequency_ghz (" + freq + "), got " + bw);
        }
        double ra = s.number("right_ascension_deg", new Range(0, true, 360, false));
        double dec = s.number("declination_deg", Range.closed(-90, 90));
        double gst = s.number("start_sidereal_time_h", ra / 15.0, new Range(0, true, 24, false));
        TimeSpan scan = s.time("scan_length", TimeSpan.minutes(10), false, false, true);
        TimeSpan cadence = s.time("scan_cadence", TimeSpan.minutes(20), false, false, true);
        if (cadence.toM(secondsPerM) < scan.toM(secondsPerM) * (1 - 1e-12)) {
            throw s.error("scan_cadence", "must be at least scan_length (" + scan + "), got " + cadence);
        }
        double tint = s.number("integration_s", Interferometer.DEFAULT_INTEGRATION_S, Range.closed(0.01, 3600));
        double flux = s.number("peak_flux_jy", Range.positive(1e6));
        double gain = s.number("gain_error", 0.0, Range.closed(0, 0.5));
        double phase = s.number("phase_error_deg", 0.0, Range.closed(0, 180));
        return new Interferometer(arrayFile, stations, freq, bw, ra, dec, gst, scan, cadence, tint, flux, gain, phase);
    }

    private static List<Interferometer.Station> stations(ConfigSection s) {
        List<ConfigSection> list = s.sections("stations", 2);
        if (list.size() > 64) {
            throw s.error("stations", "at most 64 stations, got " + list.size());
        }
        List<Interferometer.Station> out = new ArrayList<>();
        Set<String> names = new HashSet<>();
        for (ConfigSection st : list) {
            st.allow("name", "x_m", "y_m", "z_m", "sefd_jy", "elevation_limit_deg");
            String name = st.string("name", null);
            if (!name.matches("[A-Za-z0-9._-]{1,8}")) {
                throw st.error("name", "'" + name + "' may use only letters, digits, '.', '_' and '-' (1 to 8 characters)");
            }
            if (!names.add(name)) {
                throw st.error("name", "station name '" + name + "' is used twice; names must be unique");
            }
            double x = st.number("x_m", Range.closed(-6.43e6, 6.43e6));
            double y = st.number("y_m", Range.closed(-6.43e6, 6.43e6));
            double z = st.number("z_m", Range.closed(-6.43e6, 6.43e6));
            double r = Math.sqrt(x * x + y * y + z * z);
            if (!STATION_RADIUS_M.contains(r)) {
                throw st.error("z_m", "the station lies " + Math.round(r) + " m from the Earth's centre; stations must"
                        + " lie on the surface, geocentric radius in " + STATION_RADIUS_M + " m");
            }
            double sefd = st.number("sefd_jy", Range.positive(1e9));
            double el = st.number("elevation_limit_deg", Interferometer.DEFAULT_ELEVATION_LIMIT_DEG, Range.closed(0, 89));
            out.add(new Interferometer.Station(name, x, y, z, sefd, el));
        }
        return out;
    }
}
