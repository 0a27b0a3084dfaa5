package org.spindrift.viewer.sky;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;
import org.spindrift.shared.UserInputException;

/**
 * The flux-weighted centroid track of {@code centroid.csv}: observer time (M) and sky offsets
 * (micro-arcseconds, x east, y north). Columns are found by name in the header line; lines
 * starting with '#' are comments.
 */
public final class CentroidTrack {
    private static final String[] TIME_M = {"t_obs_m", "t_obs", "t_m", "time_m", "observer_time_m"};
    private static final String[] TIME_MIN = {"t_obs_min", "t_min", "time_min", "observer_time_min"};
    private static final String[] X = {"x_uas", "centroid_x_uas", "dx_uas", "east_uas", "x"};
    private static final String[] Y = {"y_uas", "centroid_y_uas", "dy_uas", "north_uas", "y"};

    private static final String[] FLUX = {"flux"};

    private final double[] t;
    private final double[] x;
    private final double[] y;
    private final double[] flux;

    private CentroidTrack(double[] t, double[] x, double[] y, double[] flux) {
        this.t = t;
        this.x = x;
        this.y = y;
        this.flux = flux;
    }

    /**
     * @param mSeconds GM/c^3 in seconds, to convert a time column given in minutes
     * @throws UserInputException naming the file, the line and what is wrong
     */
    public static CentroidTrack read(Path file, double mSeconds) {
        try (BufferedReader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            String header = null;
            String line;
            int lineNo = 0;
            while ((line = in.readLine()) != null) {
                lineNo++;
                if (!line.isBlank() && !line.startsWith("#")) {
                    header = line;
                    break;
                }
            }
            if (header == null) {
                throw new UserInputException(file + ": empty (no header line)");
            }
            String[] cols = header.split(",");
            for (int i = 0; i < cols.length; i++) {
                cols[i] = cols[i].trim().toLowerCase(Locale.ROOT);
            }
            int ct = find(cols, TIME_M);
            double tScale = 1;
            if (ct < 0) {
                ct = find(cols, TIME_MIN);
                tScale = 60.0 / mSeconds;
            }
            int cx = find(cols, X);
            int cy = find(cols, Y);
            int cf = find(cols, FLUX);
            if (ct < 0 || cx < 0 || cy < 0) {
                String missing = (ct < 0 ? " t_obs_M (or t_obs_min)" : "") + (cx < 0 ? " x_uas" : "")
                        + (cy < 0 ? " y_uas" : "");
                throw new UserInputException(file + ": header line '" + header + "' lacks the column(s)" + missing);
            }
            double[] t = new double[256];
            double[] x = new double[256];
            double[] y = new double[256];
            double[] fl = new double[256];
            int n = 0;
            while ((line = in.readLine()) != null) {
                lineNo++;
                if (line.isBlank() || line.startsWith("#")) {
                    continue;
                }
                String[] f = line.split(",");
                int need = Math.max(ct, Math.max(cx, cy));
                if (f.length <= need) {
                    throw new UserInputException(file + ": line " + lineNo + " has " + f.length + " fields, expected "
                            + cols.length);
                }
                if (n == t.length) {
                    t = Arrays.copyOf(t, 2 * n);
                    x = Arrays.copyOf(x, 2 * n);
                    y = Arrays.copyOf(y, 2 * n);
                    fl = Arrays.copyOf(fl, 2 * n);
                }
                try {
                    t[n] = Double.parseDouble(f[ct].trim()) * tScale;
                    x[n] = parse(f[cx]);
                    y[n] = parse(f[cy]);
                    fl[n] = cf >= 0 && cf < f.length ? parse(f[cf]) : Double.NaN;
                } catch (NumberFormatException e) {
                    throw new UserInputException(file + ": line " + lineNo + ": not a number (" + e.getMessage() + ")");
                }
                n++;
            }
            for (int i = 1; i < n; i++) {
                if (!(t[i] >= t[i - 1])) {
                    throw new UserInputException(file + ": observer time decreases at data row " + (i + 1));
                }
            }
            return new CentroidTrack(Arrays.copyOf(t, n), Arrays.copyOf(x, n), Arrays.copyOf(y, n),
                    cf >= 0 ? Arrays.copyOf(fl, n) : null);
        } catch (IOException e) {
            throw new UserInputException(file + ": cannot be read (" + e.getMessage() + ")");
        }
    }

    private static double parse(String s) {
        String v = s.trim();
        return v.isEmpty() || v.equalsIgnoreCase("nan") ? Double.NaN : Double.parseDouble(v);
    }

    private static int find(String[] cols, String[] names) {
        for (String n : names) {
            for (int i = 0; i < cols.length; i++) {
                if (cols[i].equals(n)) {
                    return i;
                }
            }
        }
        return -1;
    }

    public int size() {
        return t.length;
    }

    public double t(int i) {
        return t[i];
    }

    public double x(int i) {
        return x[i];
    }

    public double y(int i) {
        return y[i];
    }

    /** @return whether the table has a flux column */
    public boolean hasFlux() {
        return flux != null;
    }

    /** @return the total flux of row i (NaN without a flux column) */
    public double flux(int i) {
        return flux == null ? Double.NaN : flux[i];
    }

    /** @return the largest finite flux (0 if none) */
    public double maxFlux() {
        double m = 0;
        if (flux != null) {
            for (double f : flux) {
                if (f > m && Double.isFinite(f)) {
                    m = f;
                }
            }
        }
        return m;
    }

    /** @return the index of the last point at or before time tObs, or -1 */
    public int indexAt(double tObs) {
        int lo = 0;
        int hi = t.length - 1;
        if (hi < 0 || tObs < t[0]) {
            return -1;
        }
        if (tObs >= t[hi]) {
            return hi;
        }
        while (hi - lo > 1) {
            int mid = (lo + hi) >>> 1;
            if (t[mid] <= tObs) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /** @return the largest |x| or |y| of the finite points, micro-arcseconds */
    public double maxOffset() {
        double m = 0;
        for (int i = 0; i < t.length; i++) {
            if (Double.isFinite(x[i]) && Double.isFinite(y[i])) {
                m = Math.max(m, Math.max(Math.abs(x[i]), Math.abs(y[i])));
            }
        }
        return m;
    }
}
