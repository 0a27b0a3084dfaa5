package org.spindrift.sim.interferometry;

import java.util.SplittableRandom;
import org.hipparchus.util.FastMath;

/**
 * Visibilities as the array records them: the model (flare image plus steady point source, in
 * Jy) multiplied by the station gains, V_ij = g_i conj(g_j) V_model (Thompson, Moran &amp;
 * Swenson 2017, ch. 10, antenna-based calibration), plus thermal noise of the radiometer
 * equation, independent and Gaussian in the real and imaginary parts.
 *
 * <p>Random draws come from one {@link SplittableRandom} seeded by the scenario seed (its own
 * stream): first the gains of every scan and station in order, amplitude 1 + gain_error N(0, 1)
 * and phase phase_error N(0, 1), then the noise of every sample in sample order. The draws are
 * sequential, so the result depends only on the seed.
 *
 * @param modelRe model visibility, real part, Jy (no gains, no noise); modelIm likewise
 * @param re recorded visibility, real part, Jy; im likewise
 * @param sigma thermal noise of the real (and of the imaginary) part, Jy
 * @param steadyJy flux density of the steady point source at the black hole, Jy (its visibility)
 */
public record Observation(double[] modelRe, double[] modelIm, double[] re, double[] im, double[] sigma,
                          double steadyJy) {
    /** Mixed into the scenario seed for this stream. */
    static final long STREAM = 0x6A09E667F3BCC909L;

    /**
     * @param scale Jy per image flux unit
     * @param imageRe visibilities of the flare images, image flux units; imageIm likewise
     * @param steadyFlux flux of the steady point source, image flux units
     */
    public static Observation of(ObservingSetup o, UvSampling s, double scale, double[] imageRe, double[] imageIm,
                                 double steadyFlux) {
        int n = s.size();
        int ns = o.array().stations();
        int scans = 0;
        for (int k = 0; k < n; k++) {
            scans = FastMath.max(scans, s.scan[k] + 1);
        }
        SplittableRandom rng = new SplittableRandom(o.seed() ^ STREAM);
        double[] gRe = new double[scans * ns], gIm = new double[scans * ns];
        for (int k = 0; k < scans * ns; k++) {
            double amp = 1.0 + o.gainError() * rng.nextGaussian();
            double ph = o.phaseError() * rng.nextGaussian();
            gRe[k] = amp * FastMath.cos(ph);
            gIm[k] = amp * FastMath.sin(ph);
        }
        double[] mRe = new double[n], mIm = new double[n], re = new double[n], im = new double[n];
        double steady = scale * steadyFlux;
        for (int k = 0; k < n; k++) {
            mRe[k] = scale * imageRe[k] + steady;
            mIm[k] = scale * imageIm[k];
            int a = s.scan[k] * ns + s.station1[k], b = s.scan[k] * ns + s.station2[k];
            // g = g_a conj(g_b)
            double cr = gRe[a] * gRe[b] + gIm[a] * gIm[b];
            double ci = gIm[a] * gRe[b] - gRe[a] * gIm[b];
            re[k] = cr * mRe[k] - ci * mIm[k] + s.sigma[k] * rng.nextGaussian();
            im[k] = cr * mIm[k] + ci * mRe[k] + s.sigma[k] * rng.nextGaussian();
        }
        return new Observation(mRe, mIm, re, im, s.sigma.clone(), steady);
    }
}
