package org.spindrift.shared.archive;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import nom.tam.fits.BasicHDU;
import nom.tam.fits.Fits;
import nom.tam.fits.Header;
import org.spindrift.shared.UserInputException;

/**
 * Reader of the light stage's files of a run folder (for the viewer and other tools):
 * {@code centroid.csv} (columns by header name) and the {@code images.fits} cube (primary HDU,
 * float32, axes x = east-west with CDELT1 &lt; 0, y = north, time; see DEVELOPERS.md).
 */
public final class LightArchive {
    private LightArchive() {
    }

    /**
     * The centroid track.
     *
     * @param timeMin observer time, minutes (and timeM in M)
     * @param x east offset of the centroid, micro-arcseconds (and y north)
     * @param flux total flux per frame
     * @param xSteady centroid with the steady point source, micro-arcseconds (and ySteady)
     */
    public record Track(double[] timeMin, double[] timeM, double[] x, double[] y, double[] flux, double[] xSteady,
                        double[] ySteady) {
        /** @return number of frames */
        public int size() {
            return timeMin.length;
        }
    }

    /**
     * The image cube.
     *
     * @param frames [frame][row][col], row 0 south, col 0 east (as stored in FITS)
     * @param pixelUas pixel size, micro-arcseconds
     * @param firstTimeMin observer time of frame 0, minutes
     * @param cadenceMin interval between frames, minutes
     * @param beamFwhmUas beam FWHM, micro-arcseconds (0 when the images are not convolved)
     */
    public record Cube(float[][][] frames, double pixelUas, double firstTimeMin, double cadenceMin,
                       double beamFwhmUas) {
        /** @return pixels per side */
        public int pixels() {
            return frames.length == 0 ? 0 : frames[0].length;
        }
    }

    /** Reads {@code centroid.csv} of a run folder. */
    public static Track readTrack(Path folder) {
        Path file = folder.resolve(ArchiveLayout.CENTROID);
        try (BufferedReader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            String header = r.readLine();
            if (header == null) {
                throw new UserInputException(file + ": empty file");
            }
            List<String> cols = Arrays.asList(header.split(","));
            int[] idx = new int[7];
            String[] names = {"t_obs_min", "t_obs_M", "x_uas", "y_uas", "flux", "x_with_steady_uas", "y_with_steady_uas"};
            for (int i = 0; i < names.length; i++) {
                idx[i] = cols.indexOf(names[i]);
                if (idx[i] < 0) {
                    throw new UserInputException(file + ": header has no column " + names[i]);
                }
            }
            List<double[]> rows = new ArrayList<>();
            String line;
            int lineNo = 1;
            while ((line = r.readLine()) != null) {
                lineNo++;
                if (line.isBlank()) {
                    continue;
                }
                String[] f = line.split(",");
                double[] v = new double[7];
                try {
                    for (int i = 0; i < 7; i++) {
                        v[i] = Double.parseDouble(f[idx[i]]);
                    }
                } catch (NumberFormatException | ArrayIndexOutOfBoundsException e) {
                    throw new UserInputException(file + ": line " + lineNo + " is not a row of numbers");
                }
                rows.add(v);
            }
            double[][] c = new double[7][rows.size()];
            for (int j = 0; j < rows.size(); j++) {
                for (int i = 0; i < 7; i++) {
                    c[i][j] = rows.get(j)[i];
                }
            }
            return new Track(c[0], c[1], c[2], c[3], c[4], c[5], c[6]);
        } catch (IOException | RuntimeException e) {
            if (e instanceof UserInputException u) {
                throw u;
            }
            throw new UserInputException(file + ": cannot read (" + firstLine(e) + ")", e);
        }
    }

    /** Reads {@code images.fits} of a run folder. */
    public static Cube readCube(Path folder) {
        Path file = folder.resolve(ArchiveLayout.IMAGES);
        try (Fits fits = new Fits(file.toFile())) {
            BasicHDU<?> hdu = fits.readHDU();
            if (hdu == null) {
                throw new UserInputException(file + ": no image");
            }
            Header h = hdu.getHeader();
            Object kernel = hdu.getKernel();
            float[][][] frames;
            if (kernel instanceof float[][][] k) {
                frames = k;
            } else if (kernel instanceof float[][] k2) {
                frames = new float[][][] {k2};
            } else {
                throw new UserInputException(file + ": primary HDU is not a float32 image cube");
            }
            double pixUas = Math.abs(h.getDoubleValue("CDELT2", Double.NaN)) * 3.6e9;
            double beam = h.getDoubleValue("BMAJ", 0.0) * 3.6e9;
            return new Cube(frames, pixUas, h.getDoubleValue("CRVAL3", 0.0), h.getDoubleValue("CDELT3", 1.0), beam);
        } catch (IOException | RuntimeException e) {
            if (e instanceof UserInputException u) {
                throw u;
            }
            throw new UserInputException(file + ": cannot read FITS (" + firstLine(e) + ")", e);
        }
    }

    private static String firstLine(Throwable e) {
        String m = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
        return m.lines().findFirst().orElse(e.getClass().getSimpleName());
    }
}
