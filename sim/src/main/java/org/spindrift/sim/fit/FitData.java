package org.spindrift.sim.fit;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.ArchiveColumns;

/**
 * Measured data of a fit, read from CSV files with a header row (columns in configs/README.md):
 * astrometry (observer time, x and y offsets in micro-arcseconds with one-sigma errors, optional
 * correlation and flux) and optional photometry (observer time, flux, optional error). A run's
 * {@code mock_astrometry.csv} and {@code lightcurve.csv} load as they are. Every problem is one
 * line {@code FILE:LINE: column: problem}.
 *
 * @param timeMin observer times of the astrometric epochs, minutes (increasing)
 * @param x east offsets, micro-arcseconds (and y north)
 * @param sx one-sigma error of x, micro-arcseconds (and sy)
 * @param rho correlation of the x and y errors
 * @param fluxTimeMin observer times of the flux points, minutes (empty without flux)
 * @param flux measured flux (with the steady source)
 * @param sflux one-sigma flux error
 */
public record FitData(double[] timeMin, double[] x, double[] y, double[] sx, double[] sy, double[] rho,
                      double[] fluxTimeMin, double[] flux, double[] sflux) {
    /** Time columns accepted, with their factor to minutes. */
    private static final String[] TIME_COLUMNS = {ArchiveColumns.T_OBS_MIN, "t_obs_s", "t_obs_h", "t_obs_d"};
    private static final double[] TIME_FACTORS = {1.0, 1.0 / 60.0, 60.0, 1440.0};

    /** @return the number of residuals (two per astrometric epoch, one per flux point) */
    public int residuals() {
        return 2 * timeMin.length + flux.length;
    }

    /**
     * Reads the data.
     *
     * @param astrometry astrometry CSV (may hold flux and sigma_flux columns too)
     * @param photometry optional light-curve CSV (null)
     * @param fluxError flux error relative to the peak flux, for flux columns without an error column (NaN: none)
     */
    public static FitData read(Path astrometry, Path photometry, double fluxError) {
        Table a = Table.read(astrometry);
        double[] t = a.time();
        double[] x = a.column(ArchiveColumns.X_UAS, true);
        double[] y = a.column(ArchiveColumns.Y_UAS, true);
        double[] sx, sy;
        if (a.has(ArchiveColumns.SIGMA_UAS)) {
            sx = a.sigma(ArchiveColumns.SIGMA_UAS);
            sy = sx.clone();
        } else if (a.has("sigma_x_uas") || a.has("sigma_y_uas")) {
            sx = a.sigma("sigma_x_uas");
            sy = a.sigma("sigma_y_uas");
        } else {
            throw a.error(1, "header", "needs an error column: sigma_uas (both axes) or sigma_x_uas and sigma_y_uas");
        }
        double[] rho = new double[t.length];
        if (a.has("rho_xy")) {
            rho = a.column("rho_xy", true);
            for (int i = 0; i < rho.length; i++) {
                if (!(Math.abs(rho[i]) < 1)) {
                    throw a.error(i + 2, "rho_xy", "correlation " + rho[i] + " is out of range; allowed (-1, 1)");
                }
            }
        }
        List<double[]> flux = new ArrayList<>();
        if (a.fluxColumn() != null) {
            flux.add(t);
            flux.add(a.column(a.fluxColumn(), true));
            flux.add(a.fluxSigma(flux.get(1), fluxError));
        }
        if (photometry != null) {
            Table p = Table.read(photometry);
            if (p.fluxColumn() == null) {
                throw p.error(1, "header", "needs a flux column: flux_with_steady or flux");
            }
            double[] pt = p.time();
            double[] pf = p.column(p.fluxColumn(), true);
            double[] ps = p.fluxSigma(pf, fluxError);
            if (!flux.isEmpty()) {
                throw p.error(1, "header", "flux is given twice: the astrometry file " + astrometry + " has a flux column too");
            }
            flux.add(pt);
            flux.add(pf);
            flux.add(ps);
        }
        double[] empty = new double[0];
        return new FitData(t, x, y, sx, sy, rho, flux.isEmpty() ? empty : flux.get(0), flux.isEmpty() ? empty : flux.get(1),
                flux.isEmpty() ? empty : flux.get(2));
    }

    /** A CSV table with a header row. */
    private record Table(Path file, List<String> header, List<double[]> rows) {
        static Table read(Path file) {
            List<String> lines;
            try {
                lines = Files.readAllLines(file, StandardCharsets.UTF_8);
            } catch (NoSuchFileException e) {
                throw new UserInputException(file + ": no such file");
            } catch (IOException e) {
                throw new UserInputException(file + ": cannot be read as UTF-8 text (" + e.getMessage() + ")");
            }
            if (lines.isEmpty() || lines.get(0).isBlank()) {
                throw new UserInputException(file + ":1: header: the file is empty; the first line names the columns");
            }
            List<String> header = Arrays.stream(lines.get(0).split(",", -1)).map(String::strip).toList();
            List<double[]> rows = new ArrayList<>();
            for (int i = 1; i < lines.size(); i++) {
                String ln = lines.get(i);
                if (ln.isBlank() || ln.startsWith("#")) {
                    continue;
                }
                String[] cells = ln.split(",", -1);
                if (cells.length != header.size()) {
                    throw new UserInputException(file + ":" + (i + 1) + ": row: " + cells.length + " values for "
                            + header.size() + " columns");
                }
                double[] v = new double[cells.length + 1];
                for (int c = 0; c < cells.length; c++) {
                    String s = cells[c].strip();
                    try {
                        v[c] = s.isEmpty() ? Double.NaN : Double.parseDouble(s);
                    } catch (NumberFormatException e) {
                        throw new UserInputException(file + ":" + (i + 1) + ": " + header.get(c) + ": '" + s
                                + "' is not a number");
                    }
                }
                v[cells.length] = i + 1;       // line number
                rows.add(v);
            }
            if (rows.size() < 2) {
                throw new UserInputException(file + ": rows: needs at least 2 data rows, got " + rows.size());
            }
            return new Table(file, header, rows);
        }

        UserInputException error(int line, String column, String problem) {
            return new UserInputException(file + ":" + line + ": " + column + ": " + problem);
        }

        boolean has(String c) {
            return header.contains(c);
        }

        int line(int row) {
            return (int) rows.get(row)[header.size()];
        }

        double[] column(String c, boolean finite) {
            int k = header.indexOf(c);
            if (k < 0) {
                throw error(1, "header", "missing column '" + c + "' (columns: " + String.join(", ", header) + ")");
            }
            double[] out = new double[rows.size()];
            for (int i = 0; i < out.length; i++) {
                out[i] = rows.get(i)[k];
                if (finite && !Double.isFinite(out[i])) {
                    throw error(line(i), c, "value " + out[i] + " is not a finite number");
                }
            }
            return out;
        }

        double[] sigma(String c) {
            double[] s = column(c, true);
            for (int i = 0; i < s.length; i++) {
                if (!(s[i] > 0)) {
                    throw error(line(i), c, "one-sigma error " + s[i] + " must be positive");
                }
            }
            return s;
        }

        /** @return observer times in minutes, checked increasing */
        double[] time() {
            for (int j = 0; j < TIME_COLUMNS.length; j++) {
                if (has(TIME_COLUMNS[j])) {
                    double[] t = column(TIME_COLUMNS[j], true);
                    for (int i = 0; i < t.length; i++) {
                        t[i] *= TIME_FACTORS[j];
                        if (i > 0 && !(t[i] > t[i - 1])) {
                            throw error(line(i), TIME_COLUMNS[j], "times must increase (row before: "
                                    + String.format(Locale.ROOT, "%.6g", t[i - 1] / TIME_FACTORS[j]) + ")");
                        }
                    }
                    return t;
                }
            }
            throw error(1, "header", "needs an observer-time column with its unit: " + String.join(", ", TIME_COLUMNS)
                    + (has(ArchiveColumns.T_OBS_M) ? " (t_obs_M alone is not enough: M depends on the fitted mass)" : ""));
        }

        /** @return the flux column (flux_with_steady preferred, as a run's lightcurve.csv has it), or null */
        String fluxColumn() {
            return has(ArchiveColumns.FLUX_WITH_STEADY) ? ArchiveColumns.FLUX_WITH_STEADY
                    : has(ArchiveColumns.FLUX) ? ArchiveColumns.FLUX : null;
        }

        double[] fluxSigma(double[] f, double relative) {
            if (has("sigma_flux")) {
                return sigma("sigma_flux");
            }
            if (Double.isNaN(relative)) {
                throw error(1, "header", "the flux has no sigma_flux column: add one, or give data.flux_error in the fit"
                        + " file (relative one-sigma error)");
            }
            double peak = 0;
            for (double v : f) {
                peak = Math.max(peak, Math.abs(v));
            }
            if (!(peak > 0)) {
                throw error(2, fluxColumn(), "every flux is zero: flux_error (relative to the peak flux) gives no error");
            }
            double[] s = new double[f.length];
            Arrays.fill(s, relative * peak);
            return s;
        }
    }
}
