package org.spindrift.viewer.sky;

import java.nio.FloatBuffer;
import java.nio.file.Path;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.LightArchive;

/**
 * The sky image cube of a run, as the shared {@link LightArchive} reads it, with what the display
 * needs on top: frame times in M, the frame shown at an observer time and a fixed brightness scale.
 */
public final class ImageCube implements AutoCloseable {
    /** Frames sampled for the brightness scale (the whole cube would be read once more). */
    private static final int SCALE_SAMPLES = 12;

    private final LightArchive.CubeFile file;
    private final double[] times;
    private final float max;

    private ImageCube(LightArchive.CubeFile file, double[] times, float max) {
        this.file = file;
        this.times = times;
        this.max = max;
    }

    /**
     * @param folder   the run folder
     * @param mSeconds GM/c^3 in seconds, to give frame times in M
     * @throws UserInputException naming the file and what is wrong
     */
    public static ImageCube open(Path folder, double mSeconds) {
        LightArchive.CubeFile c = LightArchive.openCube(folder);
        try {
            int nf = c.frames();
            if (nf < 1) {
                throw new UserInputException(folder + ": the image cube has no frames");
            }
            double[] t = new double[nf];
            for (int f = 0; f < nf; f++) {
                t[f] = c.timeMin(f) * 60.0 / mSeconds;
            }
            float m = 0;
            FloatBuffer scratch = FloatBuffer.allocate(c.width() * c.height());
            for (int f = 0; f < nf; f += Math.max(1, nf / SCALE_SAMPLES)) {
                c.readFrame(f, scratch);
                for (int i = 0; i < scratch.capacity(); i++) {
                    float v = scratch.get(i);
                    if (v > m && Float.isFinite(v)) {
                        m = v;
                    }
                }
            }
            return new ImageCube(c, t, m > 0 ? m : 1f);
        } catch (RuntimeException e) {
            c.close();
            throw e;
        }
    }

    /** Reads frame f into dest (width x height floats, row j = y index, from position 0). */
    public void readFrame(int f, FloatBuffer dest) {
        file.readFrame(f, dest);
    }

    public int width() {
        return file.width();
    }

    public int height() {
        return file.height();
    }

    public int frames() {
        return times.length;
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
        int n = times.length;
        double half = n > 1 ? 0.5 * (times[1] - times[0]) : 0;
        if (t < times[0] - half) {
            return -1;
        }
        return Math.max(0, TimeIndex.lastAtOrBefore(times, t));
    }

    /** @return signed pixel sizes, micro-arcseconds (CDELT1, CDELT2) */
    public double cdelt1() {
        return file.pixelUasX();
    }

    public double cdelt2() {
        return file.pixelUasY();
    }

    /** @return reference pixel (1-based, FITS), at the black hole */
    public double crpix1() {
        return file.crpix1();
    }

    public double crpix2() {
        return file.crpix2();
    }

    /** @return the brightest pixel over a sample of frames (for a fixed display scale) */
    public float max() {
        return max;
    }

    @Override public void close() {
        file.close();
    }
}
