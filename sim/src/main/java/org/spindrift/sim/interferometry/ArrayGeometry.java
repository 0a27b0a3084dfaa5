package org.spindrift.sim.interferometry;

import java.util.List;
import org.hipparchus.util.FastMath;
import org.spindrift.shared.scenario.Interferometer;

/**
 * Station geometry of an Earth-based array: geocentric latitude and east longitude of each
 * station, baseline coordinates in the equatorial frame, (u, v, w) of a baseline and the
 * elevation of the source at a station.
 *
 * <p>Frame (Thompson, Moran &amp; Swenson 2017, Interferometry and Synthesis in Radio Astronomy,
 * 3rd ed., section 4.1): X towards hour angle 0 (Greenwich meridian) on the equator, Y towards
 * hour angle -6 h (90 deg east), Z towards the north celestial pole. The baseline of the pair
 * (i, j) runs from station i to station j: L = r_j - r_i.
 */
public final class ArrayGeometry {
    private final String[] names;
    private final double[] x, y, z, latitude, longitude, sefd, elevationLimit;

    /** @param stations the stations (geocentric X, Y, Z in m) */
    public ArrayGeometry(List<Interferometer.Station> stations) {
        int n = stations.size();
        names = new String[n];
        x = new double[n];
        y = new double[n];
        z = new double[n];
        latitude = new double[n];
        longitude = new double[n];
        sefd = new double[n];
        elevationLimit = new double[n];
        for (int i = 0; i < n; i++) {
            Interferometer.Station s = stations.get(i);
            names[i] = s.name();
            x[i] = s.xM();
            y[i] = s.yM();
            z[i] = s.zM();
            // geocentric latitude and east longitude of the position vector
            latitude[i] = FastMath.atan2(s.zM(), FastMath.hypot(s.xM(), s.yM()));
            longitude[i] = FastMath.atan2(s.yM(), s.xM());
            sefd[i] = s.sefdJy();
            elevationLimit[i] = FastMath.toRadians(s.elevationLimitDeg());
        }
    }

    /** @return number of stations */
    public int stations() {
        return names.length;
    }

    /** @return the name of station i */
    public String name(int i) {
        return names[i];
    }

    /** @return geocentric X, Y, Z of station i, m */
    public double[] position(int i) {
        return new double[] {x[i], y[i], z[i]};
    }

    /** @return geocentric latitude of station i, rad */
    public double latitude(int i) {
        return latitude[i];
    }

    /** @return east longitude of station i, rad */
    public double longitude(int i) {
        return longitude[i];
    }

    /** @return SEFD of station i, Jy */
    public double sefd(int i) {
        return sefd[i];
    }

    /** @return elevation limit of station i, rad */
    public double elevationLimit(int i) {
        return elevationLimit[i];
    }

    /**
     * Elevation of a source at station i: sin(el) = sin(phi) sin(dec) + cos(phi) cos(dec) cos(h),
     * with h = H + lambda the local hour angle (standard spherical astronomy, e.g. Smart 1977,
     * Textbook on Spherical Astronomy, ch. 2; common practice).
     *
     * @param greenwichHourAngle hour angle of the source at the Greenwich meridian, rad
     * @param dec declination, rad
     * @return elevation, rad
     */
    public double elevation(int i, double greenwichHourAngle, double dec) {
        double h = greenwichHourAngle + longitude[i];
        double s = FastMath.sin(latitude[i]) * FastMath.sin(dec) + FastMath.cos(latitude[i]) * FastMath.cos(dec) * FastMath.cos(h);
        return FastMath.asin(FastMath.max(-1.0, FastMath.min(1.0, s)));
    }

    /**
     * (u, v, w) of the baseline from station i to station j, Thompson, Moran &amp; Swenson 2017,
     * eq. 4.1: u = sin H L_X + cos H L_Y; v = -sin d cos H L_X + sin d sin H L_Y + cos d L_Z;
     * w = cos d cos H L_X - cos d sin H L_Y + sin d L_Z, with H the Greenwich hour angle of the
     * source, d its declination and L the baseline in wavelengths.
     *
     * @param wavelength observing wavelength, m
     * @param out receives u, v, w in wavelengths
     */
    public void uvw(int i, int j, double greenwichHourAngle, double dec, double wavelength, double[] out) {
        double lx = (x[j] - x[i]) / wavelength;
        double ly = (y[j] - y[i]) / wavelength;
        double lz = (z[j] - z[i]) / wavelength;
        double sh = FastMath.sin(greenwichHourAngle), ch = FastMath.cos(greenwichHourAngle);
        double sd = FastMath.sin(dec), cd = FastMath.cos(dec);
        out[0] = sh * lx + ch * ly;
        out[1] = -sd * ch * lx + sd * sh * ly + cd * lz;
        out[2] = cd * ch * lx - cd * sh * ly + sd * lz;
    }

    /** @return the longest station separation, m (an upper bound of every projected baseline) */
    public double longestBaseline() {
        double m = 0;
        for (int i = 0; i < x.length; i++) {
            for (int j = i + 1; j < x.length; j++) {
                m = FastMath.max(m, FastMath.sqrt((x[j] - x[i]) * (x[j] - x[i]) + (y[j] - y[i]) * (y[j] - y[i])
                        + (z[j] - z[i]) * (z[j] - z[i])));
            }
        }
        return m;
    }
}
