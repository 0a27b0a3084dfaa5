package org.spindrift.sim.interferometry;

import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.stream.IntStream;

/**
 * Model visibilities of a sequence of image frames, each at its own (u, v) points: points
 * frameStart[f] .. frameStart[f + 1] - 1 belong to frame f. Frames are split into fixed chunks
 * (independent of the thread count) and every point's sum is computed in one fixed order, so
 * the result is bitwise the same for any number of threads.
 */
public final class FrameVisibilities {
    /** Frames per task. */
    static final int CHUNK = 4;

    private FrameVisibilities() {
    }

    /**
     * @param images frames (n x n, row-major)
     * @param grid the transform of the image grid (copied per task)
     * @param u u per point, wavelengths; v likewise
     * @param frameStart first point of each frame, length frames + 1
     * @param re receives real parts (image flux units); im imaginary parts
     */
    public static void compute(float[][] images, DirectFourier grid, double[] u, double[] v, int[] frameStart,
                               double[] re, double[] im, int threads) {
        int chunks = (images.length + CHUNK - 1) / CHUNK;
        if (threads <= 1) {
            for (int c = 0; c < chunks; c++) {
                chunk(c, images, grid, u, v, frameStart, re, im);
            }
            return;
        }
        Runnable job = () -> IntStream.range(0, chunks).parallel()
                .forEach(c -> chunk(c, images, grid, u, v, frameStart, re, im));
        ForkJoinPool pool = new ForkJoinPool(threads);
        try {
            pool.submit(job).get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted", e);
        } catch (ExecutionException e) {
            throw e.getCause() instanceof RuntimeException r ? r : new IllegalStateException(e.getCause());
        } finally {
            pool.shutdown();
        }
    }

    /** Frames c * CHUNK .. (c + 1) * CHUNK - 1, with a transform of its own. */
    private static void chunk(int c, float[][] images, DirectFourier grid, double[] u, double[] v, int[] frameStart,
                              double[] re, double[] im) {
        DirectFourier ft = grid.copy();
        for (int f = c * CHUNK; f < Math.min(images.length, (c + 1) * CHUNK); f++) {
            if (frameStart[f + 1] > frameStart[f]) {
                ft.transform(images[f], u, v, frameStart[f], frameStart[f + 1], re, im);
            }
        }
    }
}
