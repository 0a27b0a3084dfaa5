package org.spindrift.sim.light;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.spindrift.shared.testing.ExternalPython;

/** Direct checks of the beam convolution against facts of the trade and scipy.ndimage. */
class GaussianBeamTest {
    /** FWHM = 2 sqrt(2 ln 2) sigma for a Gaussian (common practice, no source). */
    private static final double FWHM_PER_SIGMA = 2.0 * Math.sqrt(2.0 * Math.log(2.0));
    /** Sums of a few thousand float pixels: float rounding (2^-24 each) stays below 1e-5 relative. */
    private static final double FLOAT_SUM = 1e-5;
    /**
     * Relative deficit of the variance of a Gaussian truncated at 4 sigma:
     * 1 - 2 k phi(k) / (2 Phi(k) - 1) at k = 4 is 1.07e-3 (standard truncated-normal moments,
     * common practice); the kernel is cut at ceil(4 sigma), so the deficit is at most this.
     */
    private static final double TRUNCATION_VARIANCE = 1.1e-3;
    /**
     * Pixels of two composed beams against one, relative to the peak: the kernels are cut at 4.0 to
     * 4.3 sigma and sampled on whole pixels, which changes the result well below this (our choice).
     */
    private static final double COMPOSED_PIXEL = 5e-3;
    /** float images: values of order 1 rounded to 2^-24 through two passes. */
    private static final double FLOAT_PIXEL = 1e-6;

    private static float[] point(int n) {
        float[] img = new float[n * n];
        img[(n / 2) * n + n / 2] = 1f;
        return img;
    }

    private static double sum(float[] img) {
        double s = 0;
        for (float v : img) {
            s += v;
        }
        return s;
    }

    /** @return the variance of the image's marginal along columns (x), in pixels^2 */
    private static double varianceX(float[] img, int n) {
        double s = 0, sx = 0, sxx = 0;
        for (int row = 0; row < n; row++) {
            for (int col = 0; col < n; col++) {
                double v = img[row * n + col];
                s += v;
                sx += v * col;
                sxx += v * col * col;
            }
        }
        double m = sx / s;
        return sxx / s - m * m;
    }

    @Test
    void convolvedPointHasUnitSumAndTheBeamsWidth() {
        int n = 129;
        double fwhm = 9.0;   // half-maximum points between pixels, so the interpolation below is exercised
        float[] img = point(n);
        new GaussianBeam(fwhm, n).apply(img, img);
        // the kernel has unit sum, so a point away from the edges keeps its flux
        assertEquals(1.0, sum(img), FLOAT_SUM);
        double sigma = fwhm / FWHM_PER_SIGMA;
        double var = varianceX(img, n);
        assertEquals(sigma * sigma, var, TRUNCATION_VARIANCE * sigma * sigma, "variance of the convolved point");
        assertEquals(var, varianceX(transpose(img, n), n), FLOAT_SUM * var, "circular beam");
        // FWHM of the central row from the half-maximum crossings, linear between pixels: at
        // sigma = 3.8 px the chord across the Gaussian's curvature widens it by 0.021 px (computed
        // from the closed form), so 0.05 px
        int c = n / 2;
        double peak = img[c * n + c];
        int k = c;
        while (img[c * n + k + 1] > 0.5 * peak) {
            k++;
        }
        double a = img[c * n + k];
        double b = img[c * n + k + 1];
        double half = k + (a - 0.5 * peak) / (a - b) - c;
        assertEquals(fwhm, 2.0 * half, 0.05, "FWHM of the convolved point");
    }

    @Test
    void twoBeamsInSuccessionAddVariances() {
        // convolving Gaussians adds their variances (common practice): FWHM 6 then 8 equals FWHM 10
        int n = 129;
        float[] twice = point(n);
        new GaussianBeam(6.0, n).apply(twice, twice);
        new GaussianBeam(8.0, n).apply(twice, twice);
        float[] once = point(n);
        new GaussianBeam(10.0, n).apply(once, once);
        double v = varianceX(once, n);
        assertEquals(v, varianceX(twice, n), 2 * TRUNCATION_VARIANCE * v);
        double peak = once[(n / 2) * n + n / 2];
        for (int i = 0; i < once.length; i++) {
            assertEquals(once[i], twice[i], COMPOSED_PIXEL * peak, "pixel " + i);
        }
    }

    @Test
    void inPlaceEqualsSeparateOutput() {
        int n = 40;
        float[] src = pattern(n);
        float[] dst = new float[n * n];
        GaussianBeam beam = new GaussianBeam(4.0, n);
        beam.apply(src, dst);
        beam.apply(src, src);
        assertArrayEquals(dst, src);
    }

    private static float[] pattern(int n) {
        float[] img = new float[n * n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                img[i * n + j] = ((i * 7 + j * 13) % 17) / 17f;
            }
        }
        return img;
    }

    private static float[] transpose(float[] img, int n) {
        float[] t = new float[n * n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                t[j * n + i] = img[i * n + j];
            }
        }
        return t;
    }

    @Test
    void agreesWithScipyGaussianFilter() throws Exception {
        // scipy.ndimage.gaussian_filter (zero padding, kernel cut at int(4 sigma + 0.5) = 11 pixels and
        // normalised to unit sum) as the independent implementation; sigma = 2.65 makes both cuts 11
        int n = 32;
        double sigma = 2.65;
        String py = String.format(Locale.ROOT, String.join("\n",
                "import numpy as np",
                "from scipy.ndimage import gaussian_filter",
                "n = %d",
                "i, j = np.meshgrid(np.arange(n), np.arange(n), indexing='ij')",
                "img = (((i * 7 + j * 13) %% 17) / 17.0).astype(np.float64)",
                "out = gaussian_filter(img, sigma=%s, mode='constant', cval=0.0, truncate=4.0)",
                "for v in out.ravel():",
                "    print(repr(float(v)))",
                ""), n, sigma);
        List<String> out = ExternalPython.run(ExternalPython.require("scipy.ndimage", "python3-scipy"), py);
        float[] img = pattern(n);
        new GaussianBeam(sigma * FWHM_PER_SIGMA, n).apply(img, img);
        for (int k = 0; k < n * n; k++) {
            assertEquals(Double.parseDouble(out.get(k)), img[k], FLOAT_PIXEL, "pixel " + k);
        }
    }
}
