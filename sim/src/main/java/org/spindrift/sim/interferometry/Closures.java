package org.spindrift.sim.interferometry;

import java.util.Arrays;
import org.hipparchus.util.FastMath;

/**
 * Closure quantities of the samples of each frame: closure phases on every triangle of stations
 * that observe together, psi_ijk = arg(V_ij V_jk V_ki) with V_ki = conj(V_ik) (Jennison 1958,
 * MNRAS 118, 276), and log closure amplitudes on every quadrangle, the two independent ones
 * ln(|V_ij| |V_kl| / (|V_ik| |V_jl|)) and ln(|V_il| |V_jk| / (|V_ik| |V_jl|)) (Twiss, Carter &amp;
 * Little 1960, Observatory 80, 153). Both are free of station-based gain errors (phases for the
 * first, amplitudes for the second; Thompson, Moran &amp; Swenson 2017, section 10.3).
 *
 * <p>Errors by first-order propagation of independent thermal noise sigma per real and imaginary
 * part: sigma_arg(V) = sigma / |V| and sigma_ln|V| = sigma / |V|, added in quadrature over the
 * three or four baselines (high signal-to-noise limit; common practice, no source).
 */
public final class Closures {
    private Closures() {
    }

    /**
     * Closure phases, one row per (frame, triangle i &lt; j &lt; k).
     *
     * @param frame frame index per row; station1..3 the triangle
     * @param value closure phase, rad in (-pi, pi]
     * @param sigma its error, rad
     */
    public record Phases(int[] frame, int[] station1, int[] station2, int[] station3, double[] value, double[] sigma) {
        /** @return number of rows */
        public int size() {
            return value.length;
        }
    }

    /**
     * Log closure amplitudes, one row per (frame, quadrangle i &lt; j &lt; k &lt; l, kind).
     *
     * @param kind 0: ln(|V_ij||V_kl| / (|V_ik||V_jl|)); 1: ln(|V_il||V_jk| / (|V_ik||V_jl|))
     */
    public record LogAmplitudes(int[] frame, int[] station1, int[] station2, int[] station3, int[] station4, int[] kind,
                                double[] value, double[] sigma) {
        /** @return number of rows */
        public int size() {
            return value.length;
        }
    }

    /** Per frame: the sample index of each station pair (i &lt; j), -1 where absent. */
    private static void index(UvSampling s, int f, int[][] at) {
        for (int[] row : at) {
            Arrays.fill(row, -1);
        }
        for (int k = s.frameStart[f]; k < s.frameStart[f + 1]; k++) {
            at[s.station1[k]][s.station2[k]] = k;
        }
    }

    /** @return closure phases of visibilities re, im with noise sigma on the sampling's triangles */
    public static Phases phases(UvSampling s, int stations, double[] re, double[] im, double[] sigma) {
        int[][] at = new int[stations][stations];
        int count = 0;
        for (int pass = 0; pass < 2; pass++) {
            Phases out = pass == 0 ? null : new Phases(new int[count], new int[count], new int[count], new int[count],
                    new double[count], new double[count]);
            int r = 0;
            for (int f = 0; f < s.frames(); f++) {
                if (s.frameStart[f + 1] - s.frameStart[f] < 3) {
                    continue;
                }
                index(s, f, at);
                for (int i = 0; i < stations; i++) {
                    for (int j = i + 1; j < stations; j++) {
                        int ij = at[i][j];
                        if (ij < 0) {
                            continue;
                        }
                        for (int k = j + 1; k < stations; k++) {
                            int jk = at[j][k], ik = at[i][k];
                            if (jk < 0 || ik < 0) {
                                continue;
                            }
                            if (out != null) {
                                // V_ij V_jk conj(V_ik)
                                double pr = re[ij] * re[jk] - im[ij] * im[jk];
                                double pi = re[ij] * im[jk] + im[ij] * re[jk];
                                double tr = pr * re[ik] + pi * im[ik];
                                double ti = pi * re[ik] - pr * im[ik];
                                out.frame[r] = f;
                                out.station1[r] = i;
                                out.station2[r] = j;
                                out.station3[r] = k;
                                out.value[r] = FastMath.atan2(ti, tr);
                                out.sigma[r] = FastMath.sqrt(rel2(ij, re, im, sigma) + rel2(jk, re, im, sigma)
                                        + rel2(ik, re, im, sigma));
                            }
                            r++;
                        }
                    }
                }
            }
            if (out != null) {
                return out;
            }
            count = r;
        }
        throw new AssertionError();
    }

    /** @return log closure amplitudes of visibilities re, im with noise sigma on the sampling's quadrangles */
    public static LogAmplitudes logAmplitudes(UvSampling s, int stations, double[] re, double[] im, double[] sigma) {
        int[][] at = new int[stations][stations];
        int count = 0;
        for (int pass = 0; pass < 2; pass++) {
            int[] fr = new int[count], s1 = new int[count], s2 = new int[count], s3 = new int[count],
                    s4 = new int[count], kd = new int[count];
            double[] val = new double[count], sig = new double[count];
            int r = 0;
            for (int f = 0; f < s.frames(); f++) {
                if (s.frameStart[f + 1] - s.frameStart[f] < 6) {
                    continue;
                }
                index(s, f, at);
                for (int i = 0; i < stations; i++) {
                    for (int j = i + 1; j < stations; j++) {
                        for (int k = j + 1; k < stations; k++) {
                            for (int l = k + 1; l < stations; l++) {
                                int ij = at[i][j], kl = at[k][l], ik = at[i][k], jl = at[j][l], il = at[i][l],
                                        jk = at[j][k];
                                if (ij < 0 || kl < 0 || ik < 0 || jl < 0 || il < 0 || jk < 0) {
                                    continue;
                                }
                                for (int kind = 0; kind < 2; kind++) {
                                    if (pass == 1) {
                                        int a = kind == 0 ? ij : il, b = kind == 0 ? kl : jk;
                                        fr[r] = f;
                                        s1[r] = i;
                                        s2[r] = j;
                                        s3[r] = k;
                                        s4[r] = l;
                                        kd[r] = kind;
                                        val[r] = lnAmp(a, re, im) + lnAmp(b, re, im) - lnAmp(ik, re, im)
                                                - lnAmp(jl, re, im);
                                        sig[r] = FastMath.sqrt(rel2(a, re, im, sigma) + rel2(b, re, im, sigma)
                                                + rel2(ik, re, im, sigma) + rel2(jl, re, im, sigma));
                                    }
                                    r++;
                                }
                            }
                        }
                    }
                }
            }
            if (pass == 1) {
                return new LogAmplitudes(fr, s1, s2, s3, s4, kd, val, sig);
            }
            count = r;
        }
        throw new AssertionError();
    }

    private static double lnAmp(int k, double[] re, double[] im) {
        return FastMath.log(FastMath.hypot(re[k], im[k]));
    }

    /** @return (sigma / |V|)^2 of sample k */
    private static double rel2(int k, double[] re, double[] im, double[] sigma) {
        double a2 = re[k] * re[k] + im[k] * im[k];
        return sigma[k] * sigma[k] / a2;
    }
}
