package org.spindrift.sim.light;

/**
 * Total flux, flux-weighted centroid and central second moments of one image on the sky
 * (x east, y north, in M; the image layout of {@link Camera}). Flux is the sum of intensity times
 * pixel solid angle in M^2 (arbitrary but consistent units).
 *
 * @param flux total flux
 * @param x centroid east offset, M (NaN when the flux is zero)
 * @param y centroid north offset, M
 * @param xx second central moment, M^2, and likewise yy, xy
 */
public record FrameMoments(double flux, double x, double y, double xx, double yy, double xy) {
    /** @return the moments of an image */
    public static FrameMoments of(float[] image, Camera camera) {
        int n = camera.pixels();
        double area = camera.pixelSize() * camera.pixelSize();
        double f = 0, sx = 0, sy = 0, sxx = 0, syy = 0, sxy = 0;
        for (int row = 0; row < n; row++) {
            double yy = camera.skyY(row);
            for (int col = 0; col < n; col++) {
                double v = image[row * n + col];
                if (v == 0) {
                    continue;
                }
                double xx = camera.skyX(col);
                f += v;
                sx += v * xx;
                sy += v * yy;
                sxx += v * xx * xx;
                syy += v * yy * yy;
                sxy += v * xx * yy;
            }
        }
        if (f <= 0) {
            return new FrameMoments(0.0, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN);
        }
        double cx = sx / f, cy = sy / f;
        return new FrameMoments(f * area, cx, cy, sxx / f - cx * cx, syy / f - cy * cy, sxy / f - cx * cy);
    }
}
