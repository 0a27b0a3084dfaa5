package org.spindrift.viewer;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.util.Locale;
import nom.tam.fits.Fits;
import nom.tam.fits.FitsException;
import nom.tam.fits.ImageHDU;
import org.spindrift.shared.archive.ArchiveColumns;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.RunArchiveWriter;

/**
 * Invented sky products for the synthetic runs (no ray tracing: straight projection onto the
 * observer's screen, flat-space delays), in the layout the light stage writes
 * (docs/archive-format.md): centroid.csv with all its columns (no steady source, moments left 0)
 * and images.fits with a frame cube on a linear time axis in minutes.
 */
final class SyntheticSky {
    static final int PIX = 64;
    static final double FOV_M = 40.0;

    private final double inc;
    private final double pa;
    private final double uasPerM;
    private final StringBuilder csv = new StringBuilder(ArchiveColumns.header(ArchiveColumns.CENTROID) + "\n");
    private final java.util.List<float[][]> frames = new java.util.ArrayList<>();
    private final java.util.List<Double> frameTimes = new java.util.ArrayList<>();
    private final double mSeconds;

    SyntheticSky(double inclinationDeg, double positionAngleDeg, double uasPerM, double mSeconds) {
        inc = Math.toRadians(inclinationDeg);
        pa = Math.toRadians(positionAngleDeg);
        this.uasPerM = uasPerM;
        this.mSeconds = mSeconds;
    }

    /** Sky offsets (east, north) in micro-arcseconds of a display-frame point; out[2] = n.x. */
    void project(double x, double y, double z, double[] out) {
        // screen axes of the light stage's camera: alpha = +y, beta = (-cos i, 0, sin i), n = (sin i, 0, cos i)
        double alpha = y;
        double beta = -Math.cos(inc) * x + Math.sin(inc) * z;
        out[0] = (alpha * -Math.cos(pa) + beta * Math.sin(pa)) * uasPerM;
        out[1] = (alpha * Math.sin(pa) + beta * Math.cos(pa)) * uasPerM;
        out[2] = Math.sin(inc) * x + Math.cos(inc) * z;
    }

    /** Adds one snapshot: positions and weights of the particles, centre of the first source. */
    void add(double t, double[] xs, double[] ys, double[] zs, float[] w, double[] centre, boolean frame) {
        double[] p = new double[3];
        double sx = 0;
        double sy = 0;
        double sw = 0;
        float[][] img = frame ? new float[PIX][PIX] : null;
        double pixUas = FOV_M / PIX * uasPerM;
        for (int i = 0; i < xs.length; i++) {
            project(xs[i], ys[i], zs[i], p);
            sx += w[i] * p[0];
            sy += w[i] * p[1];
            sw += w[i];
            if (img != null) {
                // column index grows westward (CDELT1 < 0: east to the left), row index northward
                int col = (int) Math.floor(-p[0] / pixUas + PIX / 2.0);
                int row = (int) Math.floor(p[1] / pixUas + PIX / 2.0);
                for (int dr = -1; dr <= 1; dr++) {
                    for (int dc = -1; dc <= 1; dc++) {
                        int rr = row + dr;
                        int cc = col + dc;
                        if (rr >= 0 && rr < PIX && cc >= 0 && cc < PIX) {
                            img[rr][cc] += w[i] * (dr == 0 && dc == 0 ? 0.4f : 0.075f);
                        }
                    }
                }
            }
        }
        project(centre[0], centre[1], centre[2], p);
        double tObs = t - p[2];
        if (sw > 0) {
            csv.append(String.format(Locale.ROOT, "%.6f,%.6f,%.6f,%.6f,%.6g,%.6f,%.6f,0,0,0%n", tObs * mSeconds / 60,
                    tObs, sx / sw, sy / sw, sw, sx / sw, sy / sw));
        }
        if (img != null) {
            frames.add(img);
            frameTimes.add(tObs);
        }
    }

    void write(RunArchiveWriter w) throws IOException {
        w.write(ArchiveLayout.CENTROID, tmp -> Files.writeString(tmp, csv, StandardCharsets.UTF_8));
        w.write(ArchiveLayout.IMAGES, tmp -> {
            try (Fits f = new Fits()) {
                float[][][] cube = frames.toArray(new float[0][][]);
                ImageHDU img = (ImageHDU) Fits.makeHDU(cube);
                double pixDeg = FOV_M / PIX * uasPerM / 3600e6;
                img.getHeader().addValue("CTYPE1", "OFLN-TAN", "offset east (sky x), east to the left");
                img.getHeader().addValue("CDELT1", -pixDeg, "deg");
                img.getHeader().addValue("CRPIX1", PIX / 2.0 + 0.5, "black hole");
                img.getHeader().addValue("CUNIT1", "deg", "");
                img.getHeader().addValue("CTYPE2", "OFLT-TAN", "offset north");
                img.getHeader().addValue("CDELT2", pixDeg, "deg");
                img.getHeader().addValue("CRPIX2", PIX / 2.0 + 0.5, "black hole");
                img.getHeader().addValue("CUNIT2", "deg", "");
                // a linear time axis through the first and last frame (the invented delays make the
                // frames nearly, not exactly, evenly spaced)
                int n = frameTimes.size();
                double t0 = frameTimes.get(0) * mSeconds / 60;
                double dt = n > 1 ? (frameTimes.get(n - 1) - frameTimes.get(0)) / (n - 1) * mSeconds / 60 : 1.0;
                img.getHeader().addValue("CTYPE3", "TIME", "observer time");
                img.getHeader().addValue("CUNIT3", ArchiveLayout.IMAGE_TIME_UNIT, "");
                img.getHeader().addValue("CRPIX3", 1.0, "");
                img.getHeader().addValue("CRVAL3", t0, "");
                img.getHeader().addValue("CDELT3", dt, "");
                f.addHDU(img);
                f.write(tmp.toFile());
            } catch (FitsException e) {
                throw new IOException(e);
            }
        });
    }
}
