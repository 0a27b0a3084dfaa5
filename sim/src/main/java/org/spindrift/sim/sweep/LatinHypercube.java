package org.spindrift.sim.sweep;

import java.util.Random;

/**
 * Latin hypercube sampling (McKay, Beckman & Conover 1979, Technometrics 21, 239): each of the d
 * dimensions of the unit cube is cut into n equal strata, and every stratum of every dimension
 * holds exactly one of the n points, at a uniformly random place within it; the strata are
 * matched across dimensions by independent random permutations. Seeded with
 * {@link java.util.Random}, whose generator is fully specified, so the points are the same on
 * every machine.
 */
public final class LatinHypercube {
    private LatinHypercube() {
    }

    /** @return n points in [0,1)^d, as [n][d] */
    public static double[][] sample(int n, int d, long seed) {
        Random rnd = new Random(seed);
        double[][] u = new double[n][d];
        int[] perm = new int[n];
        for (int j = 0; j < d; j++) {
            for (int i = 0; i < n; i++) {
                perm[i] = i;
            }
            // Fisher-Yates shuffle (Durstenfeld 1964)
            for (int i = n - 1; i > 0; i--) {
                int k = rnd.nextInt(i + 1);
                int t = perm[i];
                perm[i] = perm[k];
                perm[k] = t;
            }
            for (int i = 0; i < n; i++) {
                u[i][j] = (perm[i] + rnd.nextDouble()) / n;
            }
        }
        return u;
    }
}
