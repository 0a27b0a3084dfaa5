package org.spindrift.sim.light;

import org.hipparchus.util.FastMath;

/**
 * Convolution of images with a circular Gaussian beam given by its full width at half maximum,
 * FWHM = 2 sqrt(2 ln 2) sigma (common practice), done separably along rows and columns with the
 * kernel truncated at 4 sigma and normalised to unit sum, so flux is kept away from the edges.
 */
public final class GaussianBeam {
    private final double[] taps;
    private final int half;
    private final float[] scratch;
    private final int n;

    /**
     * @param fwhmPixels beam FWHM in pixels (&gt; 0)
     * @param n image side in pixels
     */
    public GaussianBeam(double fwhmPixels, int n) {
        double sigma = sigmaOf(fwhmPixels);
        half = (int) FastMath.ceil(4.0 * sigma);
        taps = new double[2 * half + 1];
        double sum = 0;
        for (int i = -half; i <= half; i++) {
            taps[i + half] = FastMath.exp(-0.5 * i * i / (sigma * sigma));
            sum += taps[i + half];
        }
        for (int i = 0; i < taps.length; i++) {
            taps[i] /= sum;
        }
        this.n = n;
        scratch = new float[n * n];
    }

    /** @return the standard deviation of a Gaussian of full width at half maximum fwhm: fwhm / (2 sqrt(2 ln 2)) */
    public static double sigmaOf(double fwhm) {
        return fwhm / (2.0 * FastMath.sqrt(2.0 * FastMath.log(2.0)));
    }

    /** Convolves src into dst (both N x N row-major; may be the same array). Not thread-safe. */
    public void apply(float[] src, float[] dst) {
        for (int row = 0; row < n; row++) {
            for (int col = 0; col < n; col++) {
                double s = 0;
                for (int k = -half; k <= half; k++) {
                    int c = col + k;
                    if (c >= 0 && c < n) {
                        s += taps[k + half] * src[row * n + c];
                    }
                }
                scratch[row * n + col] = (float) s;
            }
        }
        for (int row = 0; row < n; row++) {
            for (int col = 0; col < n; col++) {
                double s = 0;
                for (int k = -half; k <= half; k++) {
                    int r = row + k;
                    if (r >= 0 && r < n) {
                        s += taps[k + half] * scratch[r * n + col];
                    }
                }
                dst[row * n + col] = (float) s;
            }
        }
    }
}
