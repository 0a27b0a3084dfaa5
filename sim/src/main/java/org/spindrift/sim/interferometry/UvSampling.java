package org.spindrift.sim.interferometry;

import java.util.Arrays;
import org.hipparchus.util.FastMath;

/**
 * Where and when the array samples the visibility function: one sample per frame time inside a
 * scan and per pair of stations that both see the source above their elevation limits.
 * Structure of arrays, samples ordered by frame, then station pair (i &lt; j). Scans start at the
 * first frame time and repeat at the scan cadence; a frame belongs to a scan when it falls in the
 * first scan-length of a cadence interval.
 */
public final class UvSampling {
    /** Per sample: frame index, scan index, stations i &lt; j. */
    public final int[] frame, scan, station1, station2;
    /** Per sample: u, v, w in wavelengths; elevations of the two stations, rad; thermal sigma, Jy. */
    public final double[] u, v, w, elevation1, elevation2, sigma;
    /** Per frame: first sample index; frameStart[f + 1] ends it (length frames + 1). */
    public final int[] frameStart;
    /** Per frame: observer time, M. */
    public final double[] timesM;

    private UvSampling(int n, double[] timesM) {
        frame = new int[n];
        scan = new int[n];
        station1 = new int[n];
        station2 = new int[n];
        u = new double[n];
        v = new double[n];
        w = new double[n];
        elevation1 = new double[n];
        elevation2 = new double[n];
        sigma = new double[n];
        frameStart = new int[timesM.length + 1];
        this.timesM = timesM.clone();
    }

    /** @return number of samples */
    public int size() {
        return u.length;
    }

    /** @return number of frames */
    public int frames() {
        return timesM.length;
    }

    /** @return the scan a frame at time t belongs to, or -1 when it falls between scans */
    static int scanOf(ObservingSetup o, double t0, double t) {
        double since = t - t0;
        int k = (int) FastMath.floor(since / o.scanCadenceM() + 1e-12);
        double into = since - k * o.scanCadenceM();
        return into <= o.scanLengthM() * (1 + 1e-12) + 1e-12 ? k : -1;
    }

    /** Samples the frames at observer times timesM (M). */
    public static UvSampling of(ObservingSetup o, double[] timesM) {
        ArrayGeometry a = o.array();
        int ns = a.stations();
        double lambda = o.wavelength();
        double[] el = new double[ns];
        double[] uvw = new double[3];
        // two passes: count, then fill
        int count = 0;
        for (int pass = 0; pass < 2; pass++) {
            UvSampling s = pass == 0 ? null : new UvSampling(count, timesM);
            int k = 0;
            for (int f = 0; f < timesM.length; f++) {
                if (s != null) {
                    s.frameStart[f] = k;
                }
                int sc = timesM.length == 0 ? -1 : scanOf(o, timesM[0], timesM[f]);
                if (sc < 0) {
                    continue;
                }
                double h = o.hourAngle(timesM[f]);
                for (int i = 0; i < ns; i++) {
                    el[i] = a.elevation(i, h, o.declination());
                }
                for (int i = 0; i < ns; i++) {
                    if (!(el[i] >= a.elevationLimit(i))) {
                        continue;
                    }
                    for (int j = i + 1; j < ns; j++) {
                        if (!(el[j] >= a.elevationLimit(j))) {
                            continue;
                        }
                        if (s != null) {
                            a.uvw(i, j, h, o.declination(), lambda, uvw);
                            s.frame[k] = f;
                            s.scan[k] = sc;
                            s.station1[k] = i;
                            s.station2[k] = j;
                            s.u[k] = uvw[0];
                            s.v[k] = uvw[1];
                            s.w[k] = uvw[2];
                            s.elevation1[k] = el[i];
                            s.elevation2[k] = el[j];
                            s.sigma[k] = Radiometer.sigma(a.sefd(i), a.sefd(j), o.bandwidthHz(), o.integrationS());
                        }
                        k++;
                    }
                }
            }
            if (s != null) {
                s.frameStart[timesM.length] = k;
                return s;
            }
            count = k;
        }
        throw new AssertionError();
    }

    /** @return the largest baseline length sqrt(u^2 + v^2) sampled, wavelengths (0 when empty) */
    public double maxBaseline() {
        double m = 0;
        for (int k = 0; k < u.length; k++) {
            m = FastMath.max(m, FastMath.hypot(u[k], v[k]));
        }
        return m;
    }

    @Override public String toString() {
        return "UvSampling[" + size() + " samples, " + frames() + " frames, scans " + Arrays.stream(scan).max().orElse(-1)
                + "]";
    }
}
