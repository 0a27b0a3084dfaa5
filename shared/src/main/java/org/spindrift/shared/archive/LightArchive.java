package org.spindrift.shared.archive;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.FloatBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import nom.tam.fits.BasicHDU;
import nom.tam.fits.Fits;
import nom.tam.fits.Header;
import nom.tam.fits.ImageHDU;
import org.spindrift.shared.UserInputException;

/**
 * Reader of the light stage's files of a run folder (for the viewer, the verifier and other
 * tools): {@code centroid.csv} (columns by the header names of {@link ArchiveColumns#CENTROID})
 * and the {@code images.fits} cube (primary HDU, float32, axes x = east-west with CDELT1 &lt; 0,
 * y = north, observer time; docs/archive-format.md), the cube either whole or one frame at a time.
 */
public final class LightArchive {
    /** Micro-arcseconds per degree. */
    private static final double UAS_PER_DEG = 3.6e9;
    /** nom-tam-fits reports damaged files on java.util.logging as well; the readers report them themselves. */
    private static final java.util.logging.Logger FITS_LOG = java.util.logging.Logger.getLogger("nom.tam");

    static {
        FITS_LOG.setLevel(java.util.logging.Level.OFF);
    }

    private LightArchive() {
    }

    /**
     * The centroid track.
     *
     * @param timeMin observer time, minutes (and timeM in M), never decreasing
     * @param x east offset of the centroid, micro-arcseconds (and y north; NaN in a frame without flux)
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
        String[] names = {ArchiveColumns.T_OBS_MIN, ArchiveColumns.T_OBS_M, ArchiveColumns.X_UAS, ArchiveColumns.Y_UAS,
            ArchiveColumns.FLUX, ArchiveColumns.X_WITH_STEADY_UAS, ArchiveColumns.Y_WITH_STEADY_UAS};
        int k = names.length;
        try (BufferedReader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            String header = r.readLine();
            if (header == null) {
                throw new UserInputException(file + ": empty file");
            }
            List<String> cols = Arrays.asList(header.split(","));
            int[] idx = new int[k];
            List<String> missing = new ArrayList<>();
            for (int i = 0; i < k; i++) {
                idx[i] = cols.indexOf(names[i]);
                if (idx[i] < 0) {
                    missing.add(names[i]);
                }
            }
            if (!missing.isEmpty()) {
                throw new UserInputException(file + ": line 1: header has no column " + String.join(", ", missing));
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
                double[] v = new double[k];
                try {
                    for (int i = 0; i < k; i++) {
                        v[i] = Double.parseDouble(f[idx[i]]);
                    }
                } catch (NumberFormatException | ArrayIndexOutOfBoundsException e) {
                    throw new UserInputException(file + ": line " + lineNo + " is not a row of numbers");
                }
                if (!rows.isEmpty() && !(v[1] >= rows.get(rows.size() - 1)[1])) {
                    throw new UserInputException(file + ": line " + lineNo + ": observer time " + ArchiveColumns.T_OBS_M
                            + " decreases (or is not a number)");
                }
                rows.add(v);
            }
            double[][] c = new double[k][rows.size()];
            for (int j = 0; j < rows.size(); j++) {
                for (int i = 0; i < k; i++) {
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

    /** Reads the whole {@code images.fits} of a run folder. */
    public static Cube readCube(Path folder) {
        try (CubeFile c = openCube(folder)) {
            int nx = c.width();
            int ny = c.height();
            float[][][] frames = new float[c.frames()][ny][nx];
            FloatBuffer b = FloatBuffer.allocate(nx * ny);
            for (int f = 0; f < c.frames(); f++) {
                c.readFrame(f, b);
                for (int row = 0; row < ny; row++) {
                    b.get(row * nx, frames[f][row], 0, nx);
                }
            }
            return new Cube(frames, Math.abs(c.pixelUasY()), c.frames() > 0 ? c.timeMin(0) : 0.0, c.cadenceMin(),
                    c.beamFwhmUas());
        }
    }

    /**
     * Opens {@code images.fits} of a run folder for reading one frame at a time.
     *
     * @throws UserInputException naming the file and what is wrong
     */
    public static CubeFile openCube(Path folder) {
        return CubeFile.open(folder.resolve(ArchiveLayout.IMAGES));
    }

    /**
     * The image cube of a run, read one frame at a time (nom-tam-fits tiles). Pixel i (1-based) of
     * axis k lies at CRVALk + CDELTk (i - CRPIXk) (Greisen &amp; Calabretta 2002, A&amp;A 395, 1061,
     * eq. 1 and 3 with the unit matrix); the sky axes in degrees, the time axis in minutes. Used by
     * one thread at a time.
     */
    public static final class CubeFile implements AutoCloseable {
        private final Path file;
        private final Fits fits;
        private final ImageHDU hdu;
        private final int nx;
        private final int ny;
        private final int frames;
        private final boolean cube;
        private final double cdelt1;
        private final double cdelt2;
        private final double crpix1;
        private final double crpix2;
        private final double crval3;
        private final double cdelt3;
        private final double crpix3;
        private final double bmaj;
        /** Tile corner and size, reused for every frame (reading a frame allocates only the tile). */
        private final int[] corner;
        private final int[] size;

        /** Reads the header's numbers once: the accessors are called per drawn frame and must not allocate. */
        private CubeFile(Path file, Fits fits, ImageHDU hdu, int nx, int ny, int frames) {
            this.file = file;
            this.fits = fits;
            this.hdu = hdu;
            this.nx = nx;
            this.ny = ny;
            this.frames = frames;
            Header h = hdu.getHeader();
            cube = h.getIntValue("NAXIS", 0) == 3;
            cdelt1 = h.getDoubleValue("CDELT1");
            cdelt2 = h.getDoubleValue("CDELT2");
            crpix1 = h.getDoubleValue("CRPIX1", (nx + 1) / 2.0);
            crpix2 = h.getDoubleValue("CRPIX2", (ny + 1) / 2.0);
            crval3 = h.getDoubleValue("CRVAL3", 0.0);
            cdelt3 = h.getDoubleValue("CDELT3", 1.0);
            crpix3 = h.getDoubleValue("CRPIX3", 1.0);
            bmaj = h.getDoubleValue("BMAJ", 0.0);
            corner = cube ? new int[3] : new int[2];
            size = cube ? new int[] {1, ny, nx} : new int[] {ny, nx};
        }

        static CubeFile open(Path file) {
            Fits fits = null;
            try {
                fits = new Fits(file.toFile());
                BasicHDU<?> first = fits.getHDU(0);
                if (!(first instanceof ImageHDU img)) {
                    throw new UserInputException(file + ": the primary HDU is not an image");
                }
                Header h = img.getHeader();
                int naxis = h.getIntValue("NAXIS", 0);
                if (naxis < 2 || naxis > 3) {
                    throw new UserInputException(file + ": NAXIS = " + naxis + ", expected 3 (x, y, frame)");
                }
                if (h.getIntValue("BITPIX", 0) != -32) {
                    throw new UserInputException(file + ": BITPIX = " + h.getIntValue("BITPIX", 0)
                            + ", expected -32 (float32)");
                }
                int nx = h.getIntValue("NAXIS1", 0);
                int ny = h.getIntValue("NAXIS2", 0);
                int nf = naxis == 3 ? h.getIntValue("NAXIS3", 0) : 1;
                if (nx < 1 || ny < 1 || nf < 0) {
                    throw new UserInputException(file + ": empty image (NAXIS1 = " + nx + ", NAXIS2 = " + ny + ")");
                }
                for (int axis = 1; axis <= 2; axis++) {
                    if (!h.containsKey("CDELT" + axis)) {
                        throw new UserInputException(file + ": key CDELT" + axis + " (pixel size) is missing");
                    }
                    unit(h, axis, ArchiveLayout.IMAGE_SKY_UNIT, file);
                }
                if (naxis == 3) {
                    unit(h, 3, ArchiveLayout.IMAGE_TIME_UNIT, file);
                }
                return new CubeFile(file, fits, img, nx, ny, nf);
            } catch (IOException | RuntimeException e) {
                closeQuietly(fits);
                if (e instanceof UserInputException u) {
                    throw u;
                }
                throw new UserInputException(file + ": cannot read FITS (" + firstLine(e) + ")", e);
            }
        }

        /** CUNITk must be the archive's unit (a missing CUNIT means the FITS default, degrees, for the sky). */
        private static void unit(Header h, int axis, String expected, Path file) {
            String u = h.getStringValue("CUNIT" + axis);
            String have = u == null ? (axis < 3 ? "deg" : "") : u.trim();
            if (!have.toLowerCase(Locale.ROOT).equals(expected)) {
                throw new UserInputException(file + ": CUNIT" + axis + " = '" + have + "', expected '" + expected + "'");
            }
        }

        /** @return pixels along x (NAXIS1, east-west) */
        public int width() {
            return nx;
        }

        /** @return pixels along y (NAXIS2, south-north) */
        public int height() {
            return ny;
        }

        /** @return number of frames (NAXIS3) */
        public int frames() {
            return frames;
        }

        /** @return signed pixel size along x, micro-arcseconds (CDELT1; negative: east to the left) */
        public double pixelUasX() {
            return cdelt1 * UAS_PER_DEG;
        }

        /** @return signed pixel size along y, micro-arcseconds (CDELT2) */
        public double pixelUasY() {
            return cdelt2 * UAS_PER_DEG;
        }

        /** @return reference pixel along x (1-based, FITS), where the offset is CRVAL1 (the black hole) */
        public double crpix1() {
            return crpix1;
        }

        /** @return reference pixel along y (1-based, FITS) */
        public double crpix2() {
            return crpix2;
        }

        /** @return observer time of frame f (0-based), minutes */
        public double timeMin(int f) {
            return crval3 + (f + 1 - crpix3) * cdelt3;
        }

        /** @return interval between frames, minutes */
        public double cadenceMin() {
            return cdelt3;
        }

        /** @return beam FWHM, micro-arcseconds (0 when the images are not convolved) */
        public double beamFwhmUas() {
            return bmaj * UAS_PER_DEG;
        }

        /**
         * Reads frame f into dest from position 0: width x height floats, row j = y index,
         * NAXIS1 fastest (as stored).
         */
        public void readFrame(int f, FloatBuffer dest) {
            try {
                if (cube) {
                    corner[0] = f;
                }
                Object tile = hdu.getTiler().getTile(corner, size);
                if (tile instanceof float[] a) {
                    dest.put(0, a);
                } else {
                    throw new UserInputException(file + ": frame " + f + " is not float32");
                }
            } catch (IOException | RuntimeException e) {
                if (e instanceof UserInputException u) {
                    throw u;
                }
                throw new UserInputException(file + ": frame " + f + " cannot be read (" + firstLine(e) + ")", e);
            }
        }

        @Override public void close() {
            closeQuietly(fits);
        }

        private static void closeQuietly(Fits fits) {
            if (fits != null) {
                try {
                    fits.close();
                } catch (IOException ignored) {
                    // read-only: nothing to lose
                }
            }
        }
    }

    private static String firstLine(Throwable e) {
        String m = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
        return m.lines().findFirst().orElse(e.getClass().getSimpleName());
    }
}
