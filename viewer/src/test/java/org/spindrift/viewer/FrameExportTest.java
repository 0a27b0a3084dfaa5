package org.spindrift.viewer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import javax.imageio.ImageIO;
import org.joml.Matrix4f;
import org.joml.Vector4f;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Exports two frames of a small invented run under a (virtual) X server with Mesa and checks the
 * pixels against the camera maths done here independently with JOML: a perspective projection
 * (35 degree vertical field of view) looking down the -z axis from z = 40 M with +y up, i.e. a
 * face-on view of the equatorial plane.
 */
class FrameExportTest {
    static final int W = 320;
    static final int H = 240;
    static final float DISTANCE = 40f;
    /** Background colour of the 3D view (Palette.BACKGROUND), 0x0b1018. */
    static final int[] BACKGROUND = {0x0b, 0x10, 0x18};

    @TempDir Path tmp;

    /** Particle layout: snapshot 0 and snapshot 1 (turned by 45 degrees), equatorial plane, M. */
    static final double[][] X = new double[2][];
    static final double[][] Y = new double[2][];

    static {
        double[] r = {10, 8, 9, 11, 7.5};
        double[] a = {0, 80, 150, 215, 290};
        for (int s = 0; s < 2; s++) {
            X[s] = new double[r.length];
            Y[s] = new double[r.length];
            for (int i = 0; i < r.length; i++) {
                double phi = Math.toRadians(a[i] + 45 * s);
                X[s][i] = r[i] * Math.cos(phi);
                Y[s][i] = r[i] * Math.sin(phi);
            }
        }
    }

    @Test void exportedFramesShowParticlesWhereTheCameraPutsThemAndADarkHorizon() throws Exception {
        ChildViewer.requireDisplayOrXvfb();
        Path run = tmp.resolve("run");
        SyntheticRun.writeLayout(run, X, Y, new double[] {0, 10});
        Path frames = tmp.resolve("frames");
        ChildViewer.Result r = ChildViewer.runWithDisplay(tmp, run.toString(), "--export-frames", frames.toString(),
                "--size", W + "x" + H, "--bare", "--camera", "face-on", "--camera-distance", String.valueOf(DISTANCE),
                "--colour", "source");
        if (r.exit() == 2 && r.err().contains("xvfb-run") && !ChildViewer.required()) {
            Assumptions.abort("no OpenGL 3.3 on this display: " + r.err().trim());
        }
        assertEquals(0, r.exit(), "view --export-frames failed: " + r.err());
        BufferedImage[] img = {ImageIO.read(frames.resolve("frame_00000.png").toFile()),
            ImageIO.read(frames.resolve("frame_00001.png").toFile())};
        assertTrue(!Files.exists(frames.resolve("frame_00002.png")), "two snapshots, two frames");

        // JOML camera: perspective(35 deg, W/H) * lookAt(eye (0,0,40), centre 0, up +y)
        Matrix4f vp = new Matrix4f().perspective((float) Math.toRadians(35), W / (float) H, 0.02f * DISTANCE,
                50f * DISTANCE).lookAt(0, 0, DISTANCE, 0, 0, 0, 0, 1, 0);
        for (int s = 0; s < 2; s++) {
            BufferedImage im = img[s];
            assertEquals(W, im.getWidth());
            assertEquals(H, im.getHeight());
            // not blank: a fair number of pixels differ from the background
            int differ = 0;
            for (int y = 0; y < H; y++) {
                for (int x = 0; x < W; x++) {
                    if (maxDiff(im.getRGB(x, y), BACKGROUND) > 12) {
                        differ++;
                    }
                }
            }
            assertTrue(differ > 200, "frame " + s + " is nearly blank (" + differ + " pixels differ)");
            // background where nothing is drawn (a corner, outside the grid)
            assertTrue(maxDiff(im.getRGB(2, 2), BACKGROUND) <= 3, "corner of frame " + s + " is the background");
            // the horizon disc (r = 2 M, face-on) is dark at the centre, darker than the background
            int c = im.getRGB(W / 2, H / 2);
            assertTrue(maxChannel(c) <= 6, "centre of frame " + s + " is dark: " + Integer.toHexString(c));
            for (int i = 0; i < X[s].length; i++) {
                int[] px = project(vp, X[s][i], Y[s][i]);
                assertTrue(brightest(im, px[0], px[1], 2) >= 150,
                        "frame " + s + ": particle " + i + " lit at (" + px[0] + ", " + px[1] + ")");
                // where the particle is in the other snapshot, this frame must be dark (it moved)
                int[] other = project(vp, X[1 - s][i], Y[1 - s][i]);
                assertTrue(brightest(im, other[0], other[1], 1) < 100,
                        "frame " + s + ": no particle at (" + other[0] + ", " + other[1] + ")");
            }
        }
    }

    /**
     * The observer's camera shows the sky as the light stage's camera defines it: line of sight n = (sin i, 0, cos i), screen axes alpha = (0, 1, 0) (west at PA = 0) and
     * beta = (-cos i, 0, sin i) (north at PA = 0), sky (east, north) = alpha (-cos PA, sin PA) +
     * beta (sin PA, cos PA), drawn east to the left and north up. Pixel positions follow from a
     * pinhole at distance D: column = W/2 - f east / (D - n.p), row = H/2 - f north / (D - n.p),
     * f = (H/2) / tan(17.5 deg). Worked out here without the viewer's camera code.
     */
    @Test void observerCameraShowsEastLeftNorthUp() throws Exception {
        ChildViewer.requireDisplayOrXvfb();
        double incl = 60;
        double pa = 30;
        Path run = tmp.resolve("run-observer");
        SyntheticRun.writeLayout(run, X, Y, new double[] {0, 10}, incl, pa);
        Path frames = tmp.resolve("frames-observer");
        ChildViewer.Result r = ChildViewer.runWithDisplay(tmp, run.toString(), "--export-frames", frames.toString(),
                "--size", W + "x" + H, "--bare", "--camera", "observer", "--camera-distance", String.valueOf(DISTANCE),
                "--colour", "source", "--every", "2");
        if (r.exit() == 2 && r.err().contains("xvfb-run") && !ChildViewer.required()) {
            Assumptions.abort("no OpenGL 3.3 on this display: " + r.err().trim());
        }
        assertEquals(0, r.exit(), "view --export-frames failed: " + r.err());
        BufferedImage im = ImageIO.read(frames.resolve("frame_00000.png").toFile());
        double i = Math.toRadians(incl);
        double p = Math.toRadians(pa);
        double f = (H / 2.0) / Math.tan(Math.toRadians(17.5));
        for (int k = 0; k < X[0].length; k++) {
            double x = X[0][k];
            double y = Y[0][k];
            double alpha = y;
            double beta = -Math.cos(i) * x;
            double east = -alpha * Math.cos(p) + beta * Math.sin(p);
            double north = alpha * Math.sin(p) + beta * Math.cos(p);
            double depth = DISTANCE - Math.sin(i) * x;
            int col = (int) Math.floor(W / 2.0 - f * east / depth);
            int row = (int) Math.floor(H / 2.0 - f * north / depth);
            assertTrue(brightest(im, col, row, 2) >= 150, "particle " + k + " lit at (" + col + ", " + row + ")");
            // its mirror image (east and west swapped) is dark: the sky is not flipped
            int mirror = (int) Math.floor(W / 2.0 + f * east / depth);
            if (Math.abs(mirror - col) > 6) {
                assertTrue(brightest(im, mirror, row, 1) < 100, "particle " + k + " not mirrored to (" + mirror + ", "
                        + row + ")");
            }
        }
    }

    /** Pixel (column, row from the top) of a point in the equatorial plane. */
    static int[] project(Matrix4f vp, double x, double y) {
        Vector4f p = new Vector4f((float) x, (float) y, 0f, 1f).mul(vp);
        float nx = p.x / p.w;
        float ny = p.y / p.w;
        return new int[] {(int) Math.floor((nx + 1) / 2 * W), (int) Math.floor((1 - ny) / 2 * H)};
    }

    static int brightest(BufferedImage im, int cx, int cy, int radius) {
        int best = 0;
        for (int y = cy - radius; y <= cy + radius; y++) {
            for (int x = cx - radius; x <= cx + radius; x++) {
                if (x >= 0 && y >= 0 && x < im.getWidth() && y < im.getHeight()) {
                    best = Math.max(best, maxChannel(im.getRGB(x, y)));
                }
            }
        }
        return best;
    }

    static int maxChannel(int rgb) {
        return Math.max((rgb >> 16) & 0xff, Math.max((rgb >> 8) & 0xff, rgb & 0xff));
    }

    static int maxDiff(int rgb, int[] ref) {
        return Math.max(Math.abs(((rgb >> 16) & 0xff) - ref[0]),
                Math.max(Math.abs(((rgb >> 8) & 0xff) - ref[1]), Math.abs((rgb & 0xff) - ref[2])));
    }
}
