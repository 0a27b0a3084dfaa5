package org.spindrift.sim.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * Quantiles and order statistics by selection against the JDK's full sort ({@link Arrays#sort}
 * as the independent reference, with the type-7 formula of Hyndman & Fan 1996): equal bit for
 * bit, on data that stress a selection (duplicates, signed zeros, sorted and reversed runs,
 * all-equal values, a NaN, tiny and large sizes).
 */
class StatsSelectionTest {
    /** Probabilities the analysis uses (extent ends, median, 16-84 % range) and the ends. */
    static final double[] QS = {0, 0.05, 0.16, 0.5, 0.84, 0.95, 1};

    static double[][] cases() {
        SplittableRandom rnd = new SplittableRandom(7);
        int[] sizes = {1, 2, 3, 5, 39, 40, 41, 100, 1000, 20000};
        double[][] out = new double[sizes.length * 7][];
        int c = 0;
        for (int n : sizes) {
            double[] uniform = new double[n];
            double[] dup = new double[n];
            double[] zeros = new double[n];
            double[] sorted = new double[n];
            double[] reversed = new double[n];
            double[] equal = new double[n];
            double[] withNaN = new double[n];
            for (int i = 0; i < n; i++) {
                uniform[i] = rnd.nextDouble() * 20 - 10;
                dup[i] = rnd.nextInt(5);
                zeros[i] = rnd.nextInt(3) == 0 ? -0.0 : rnd.nextInt(2) == 0 ? 0.0 : rnd.nextGaussian();
                sorted[i] = i * 0.5;
                reversed[i] = n - i;
                equal[i] = 3.25;
                withNaN[i] = rnd.nextGaussian();
            }
            withNaN[n / 2] = Double.NaN;
            out[c++] = uniform;
            out[c++] = dup;
            out[c++] = zeros;
            out[c++] = sorted;
            out[c++] = reversed;
            out[c++] = equal;
            out[c++] = withNaN;
        }
        return out;
    }

    @Test void quantilesEqualThoseOfAFullSortBitForBit() {
        for (double[] data : cases()) {
            double[] sorted = data.clone();
            Arrays.sort(sorted);
            double[] got = new double[QS.length];
            Stats.quantiles(data.clone(), data.length, QS, got);
            for (int j = 0; j < QS.length; j++) {
                double want = Stats.quantile(sorted, QS[j]);
                assertEquals(Double.doubleToRawLongBits(want), Double.doubleToRawLongBits(got[j]),
                        "n = " + data.length + ", q = " + QS[j] + ": " + want + " vs " + got[j]);
            }
        }
    }

    @Test void everyRankEqualsTheSortedValue() {
        for (double[] data : cases()) {
            int n = data.length;
            double[] sorted = data.clone();
            Arrays.sort(sorted);
            SplittableRandom rnd = new SplittableRandom(n);
            int[] ranks = new int[Math.min(n, 30)];
            for (int j = 0; j < ranks.length; j++) {
                ranks[j] = j < 3 ? new int[] {0, n - 1, n / 2}[j] : rnd.nextInt(n);
            }
            double[] got = Stats.orderStatistics(data.clone(), n, ranks);
            for (int j = 0; j < ranks.length; j++) {
                assertEquals(Double.doubleToRawLongBits(sorted[ranks[j]]), Double.doubleToRawLongBits(got[j]),
                        "n = " + n + ", rank " + ranks[j]);
            }
        }
    }

    @Test void onlyTheFirstNValuesCount() {
        double[] a = {5, 1, 4, 2, 3, -100, 100};
        double[] got = new double[3];
        Stats.quantiles(a, 5, new double[] {0, 0.5, 1}, got);
        assertEquals(1.0, got[0]);
        assertEquals(3.0, got[1]);
        assertEquals(5.0, got[2]);
        Stats.quantiles(a, 0, new double[] {0.5}, got);
        assertEquals(Double.NaN, got[0]);
    }
}
