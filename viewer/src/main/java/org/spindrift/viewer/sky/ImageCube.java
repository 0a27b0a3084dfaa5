package org.spindrift.viewer.sky;

import java.io.IOException;
import java.nio.FloatBuffer;
import java.nio.file.Path;
import nom.tam.fits.BasicHDU;
import nom.tam.fits.BinaryTableHDU;
import nom.tam.fits.Fits;
import nom.tam.fits.FitsException;
import nom.tam.fits.Header;
import nom.tam.fits.ImageHDU;
import org.spindrift.shared.UserInputException;

/**
 * The sky image cube of {@code images.fits}, read one frame at a time (nom-tam-fits tiles): a
 * primary image of NAXIS1 x NAXIS2 pixels and NAXIS3 frames, with the FITS WCS keys
 * (Greisen & Calabretta 2002, A&A 395, 1061) CDELTi, CRPIXi, CUNITi for the sky axes (offsets
 * from the black hole) and either a linear third axis in time or a binary-table extension with a
 * time column for the frames' observer times.
 */
public final class ImageCube implements AutoCloseable {
    /** nom-tam-fits reports damaged files on java.util.logging as well; we report them ourselves. */
    private static final java.util.logging.Logger FITS_LOG = java.util.logging.Logger.getLogger("nom.tam");

    static {
        FITS_LOG.setLevel(java.util.logging.Level.OFF);
    }

    private final Path file;
    private final Fits fits;
    private final ImageHDU hdu;
    private final int nx;
    private final int ny;
    private final int frames;
    private final double cdelt1;
    private final double cdelt2;
    private final double crpix1;
    private final double crpix2;
    private final double[] times;
    private final float max;

    private ImageCube(Path file, Fits fits, ImageHDU hdu, int nx, int ny, int frames, double cdelt1, double cdelt2,
                      double crpix1, double crpix2, double[] times, float max) {
        this.file = file;
        this.fits = fits;
        this.hdu = hdu;
        this.nx = nx;
        this.ny = ny;
        this.frames = frames;
        this.cdelt1 = cdelt1;
        this.cdelt2 = cdelt2;
        this.crpix1 = crpix1;
        this.crpix2 = crpix2;
        this.times = times;
        this.max = max;
    }

    /**
     * @param mSeconds     GM/c^3 in seconds
     * @param mUas micro-arcseconds per M at the distance
     * @throws UserInputException naming the file and what is wrong
     */
    public static ImageCube open(Path file, double mSeconds, double mUas) {
        Fits fits = null;
        try {
            fits = new Fits(file.toFile());
            BasicHDU<?> first = fits.getHDU(0);
            if (first == null) {
                throw new UserInputException(file + ": not a FITS file (no primary header)");
            }
            if (!(first instanceof ImageHDU img)) {
                throw new UserInputException(file + ": the primary HDU is not an image");
            }
            Header h = img.getHeader();
            int naxis = h.getIntValue("NAXIS", 0);
            if (naxis < 2 || naxis > 3) {
                throw new UserInputException(file + ": NAXIS = " + naxis + ", expected 2 or 3 (x, y[, frame])");
            }
            int nx = h.getIntValue("NAXIS1", 0);
            int ny = h.getIntValue("NAXIS2", 0);
            int nf = naxis == 3 ? h.getIntValue("NAXIS3", 0) : 1;
            if (nx < 1 || ny < 1 || nf < 1) {
                throw new UserInputException(file + ": empty image (NAXIS1 = " + nx + ", NAXIS2 = " + ny + ", NAXIS3 = " + nf + ")");
            }
            double c1 = angle(h, 1, file, mUas);
            double c2 = angle(h, 2, file, mUas);
            double p1 = h.getDoubleValue("CRPIX1", (nx + 1) / 2.0);
            double p2 = h.getDoubleValue("CRPIX2", (ny + 1) / 2.0);
            double[] times = frameTimes(fits, h, nf, mSeconds, file);
            ImageCube cube = new ImageCube(file, fits, img, nx, ny, nf, c1, c2, p1, p2, times, 1f);
            float m = 0;
            FloatBuffer scratch = FloatBuffer.allocate(nx * ny);
            int step = Math.max(1, nf / 12);
            for (int f = 0; f < nf; f += step) {
                cube.readFrame(f, scratch);
                for (int i = 0; i < nx * ny; i++) {
                    float v = scratch.get(i);
                    if (v > m && Float.isFinite(v)) {
                        m = v;
                    }
                }
            }
            return new ImageCube(file, fits, img, nx, ny, nf, c1, c2, p1, p2, times, m > 0 ? m : 1f);
        } catch (IOException | RuntimeException e) {
            if (fits != null) {
                try {
                    fits.close();
                } catch (IOException ignored) {
                    // closing after a failed read
                }
            }
            if (e instanceof UserInputException u) {
                throw u;
            }
            throw new UserInputException(file + ": not a readable FITS image cube (" + e.getMessage() + ")", e);
        }
    }

    /** Pixel size along axis i in micro-arcseconds (signed, as CDELTi). */
    private static double angle(Header h, int axis, Path file, double mUas) {
        if (!h.containsKey("CDELT" + axis)) {
            throw new UserInputException(file + ": key CDELT" + axis + " (pixel size) is missing");
        }
        double d = h.getDoubleValue("CDELT" + axis);
        String unit = h.getStringValue("CUNIT" + axis);
        unit = unit == null ? "deg" : unit.trim().toLowerCase(java.util.Locale.ROOT);
        switch (unit) {
            case "deg": return d * 3600e6;  // FITS WCS default unit for celestial axes (Greisen & Calabretta 2002)
            case "arcsec": return d * 1e6;
            case "mas": return d * 1e3;
            case "uas": case "µas": return d;
            case "m": case "gm/c2": return d * mUas; // pixel size given in units of M
            default: throw new UserInputException(file + ": CUNIT" + axis + " = '" + unit
                    + "' is not an angle (deg, arcsec, mas, uas) or M");
        }
    }

    private static double[] frameTimes(Fits fits, Header h, int nf, double mSeconds, Path file)
            throws FitsException, IOException {
        double[] t = new double[nf];
        // a binary table with one time per frame
        for (int k = 1; k < 8; k++) {
            BasicHDU<?> ext;
            try {
                ext = fits.getHDU(k);
            } catch (IndexOutOfBoundsException e) {
                ext = null;
            }
            if (ext == null) {
                break;
            }
            if (ext instanceof BinaryTableHDU tab) {
                for (String name : new String[] {"T_OBS_M", "TIME_M", "T_M", "T_OBS_MIN", "TIME_MIN", "T_MIN"}) {
                    int c = findColumn(tab, name);
                    if (c >= 0 && tab.getNRows() == nf) {
                        double scale = name.endsWith("MIN") ? 60.0 / mSeconds : 1.0;
                        Object col = tab.getColumn(c);
                        for (int i = 0; i < nf; i++) {
                            t[i] = java.lang.reflect.Array.getDouble(col, i) * scale;
                        }
                        return t;
                    }
                }
            }
        }
        // a linear third axis in time
        if (h.containsKey("CDELT3")) {
            String unit = h.getStringValue("CUNIT3");
            unit = unit == null ? "" : unit.trim().toLowerCase(java.util.Locale.ROOT);
            double scale = switch (unit) {
                case "s" -> 1.0 / mSeconds;
                case "min" -> 60.0 / mSeconds;
                case "h" -> 3600.0 / mSeconds;
                default -> 1.0; // M
            };
            double c = h.getDoubleValue("CRVAL3", 0);
            double d = h.getDoubleValue("CDELT3");
            double p = h.getDoubleValue("CRPIX3", 1);
            for (int i = 0; i < nf; i++) {
                t[i] = (c + (i + 1 - p) * d) * scale;
            }
            return t;
        }
        if (nf == 1) {
            return t;
        }
        throw new UserInputException(file + ": no observer time per frame (neither a time column in a table"
                + " extension nor CDELT3 on the frame axis)");
    }

    private static int findColumn(BinaryTableHDU tab, String name) {
        for (int i = 0; i < tab.getNCols(); i++) {
            String n = tab.getColumnName(i);
            if (n != null && n.trim().equalsIgnoreCase(name)) {
                return i;
            }
        }
        return -1;
    }

    /** Reads frame f into dest (nx * ny floats, row j = y index, from position 0). */
    public void readFrame(int f, FloatBuffer dest) {
        try {
            int[] corner = frames > 1 || hdu.getAxes().length == 3 ? new int[] {f, 0, 0} : new int[] {0, 0};
            int[] size = corner.length == 3 ? new int[] {1, ny, nx} : new int[] {ny, nx};
            Object tile = hdu.getTiler().getTile(corner, size);
            int n = nx * ny;
            for (int i = 0; i < n; i++) {
                dest.put(i, (float) java.lang.reflect.Array.getDouble(tile, i));
            }
        } catch (IOException | RuntimeException e) {
            throw new UserInputException(file + ": frame " + f + " cannot be read (" + e.getMessage() + ")", e);
        }
    }

    public int width() {
        return nx;
    }

    public int height() {
        return ny;
    }

    public int frames() {
        return frames;
    }

    /** @return observer time of frame f, M */
    public double time(int f) {
        return times[f];
    }

    /**
     * @return the frame shown at observer time t: the last one at or before t (within half a frame
     *     interval before the first), or -1 before the first frame
     */
    public int frameAt(double t) {
        double half = frames > 1 ? 0.5 * (times[1] - times[0]) : 0;
        if (t < times[0] - half) {
            return -1;
        }
        int lo = 0;
        int hi = frames - 1;
        if (t >= times[hi]) {
            return hi;
        }
        while (hi - lo > 1) {
            int mid = (lo + hi) >>> 1;
            if (times[mid] <= t) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /** @return signed pixel sizes, micro-arcseconds (CDELT1, CDELT2) */
    public double cdelt1() {
        return cdelt1;
    }

    public double cdelt2() {
        return cdelt2;
    }

    /** @return reference pixel (1-based, FITS), at the black hole */
    public double crpix1() {
        return crpix1;
    }

    public double crpix2() {
        return crpix2;
    }

    /** @return the brightest pixel over a sample of frames (for a fixed display scale) */
    public float max() {
        return max;
    }

    @Override public void close() {
        try {
            fits.close();
        } catch (IOException ignored) {
            // read-only
        }
    }
}
