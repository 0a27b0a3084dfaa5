package org.spindrift.sim.interferometry;

import java.util.ArrayList;
import java.util.List;
import org.hipparchus.util.FastMath;
import org.spindrift.shared.scenario.Interferometer;

/** Synthetic arrays for tests: stations at round latitudes and longitudes on a 6371 km sphere. */
final class TestArrays {
    static final double EARTH = 6.371e6;

    private TestArrays() {
    }

    static Interferometer.Station station(String name, double latDeg, double lonDeg, double sefd) {
        double la = FastMath.toRadians(latDeg), lo = FastMath.toRadians(lonDeg);
        return new Interferometer.Station(name, EARTH * FastMath.cos(la) * FastMath.cos(lo),
                EARTH * FastMath.cos(la) * FastMath.sin(lo), EARTH * FastMath.sin(la), sefd, 10.0);
    }

    /** Five stations, all seeing a source at declination +20 deg near hour angle 0. */
    static List<Interferometer.Station> five(double sefd) {
        List<Interferometer.Station> s = new ArrayList<>();
        s.add(station("A", 10, 0, sefd));
        s.add(station("B", 30, 20, sefd));
        s.add(station("C", -10, 30, sefd));
        s.add(station("D", 40, -20, sefd));
        s.add(station("E", 0, -40, sefd));
        return s;
    }

    /** Set-up at 230 GHz, 2 GHz bandwidth, 10 s integrations, declination +20 deg, scans every frame. */
    static ObservingSetup setup(List<Interferometer.Station> st, double gainError, double phaseErrorDeg, long seed) {
        return new ObservingSetup(new ArrayGeometry(st), 230e9, 2e9, 0.0, FastMath.toRadians(20), 0.0, 1e9, 1e9, 10.0,
                1.0, gainError, FastMath.toRadians(phaseErrorDeg), 10.0, seed);
    }
}
