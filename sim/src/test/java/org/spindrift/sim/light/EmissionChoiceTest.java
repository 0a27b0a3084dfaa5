package org.spindrift.sim.light;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spindrift.shared.Coordinates;
import org.spindrift.shared.scenario.EmissionSum;

/**
 * The automatic emission sum: the thinnest source's rms width is taken per source and per axis
 * (against the two-pass population standard deviation of the same Cartesian positions, the
 * definition written out independently of the one-pass sums in the code), and decides
 * grid or particles against the grid spacing; several spectral indices always mean particles.
 */
class EmissionChoiceTest {
    private static final double SPIN = 0.5;

    /**
     * Two Gaussian clouds 16 M apart: source 0 with widths (0.3, 0.5, 0.4) M about (8, 0, 0), source 1
     * with widths (0.6, 0.7, 0.8) M about (-8, 0, 0); two identical snapshots, the first particle dead.
     */
    private static final class TwoClouds implements EmitterHistory {
        final int n = 4000;
        final double[][] x = new double[n][3];
        final double[] r = new double[n], th = new double[n], ph = new double[n];
        final double[] alpha = new double[2];

        TwoClouds(double alpha1) {
            alpha[1] = alpha1;
            Random rng = new Random(11);
            double[] bl = new double[3];
            for (int p = 0; p < n; p++) {
                boolean first = p % 2 == 0;
                x[p][0] = (first ? 8 : -8) + (first ? 0.3 : 0.6) * rng.nextGaussian();
                x[p][1] = (first ? 0.5 : 0.7) * rng.nextGaussian();
                x[p][2] = (first ? 0.4 : 0.8) * rng.nextGaussian();
                Coordinates.boyerLindquist(x[p][0], x[p][1], x[p][2], SPIN, bl);
                r[p] = bl[0];
                th[p] = bl[1];
                ph[p] = bl[2];
            }
        }

        @Override public int snapshots() {
            return 2;
        }

        @Override public int particles() {
            return n;
        }

        @Override public double time(int s) {
            return s;
        }

        @Override public double r(int s, int p) {
            return r[p];
        }

        @Override public double theta(int s, int p) {
            return th[p];
        }

        @Override public double phi(int s, int p) {
            return ph[p];
        }

        @Override public double u(int s, int p, int mu) {
            return mu == 0 ? 1.0 : 0.0;
        }

        @Override public double weight(int s, int p) {
            return 1.0;
        }

        @Override public int state(int s, int p) {
            return p == 0 ? 1 : ALIVE;
        }

        @Override public double spectralIndex(int p) {
            return alpha[source(p)];
        }

        @Override public int source(int p) {
            return p % 2;
        }
    }

    @Test void thinnestWidthIsPerSourceAndAxis() {
        TwoClouds h = new TwoClouds(0.0);
        double expected = Double.POSITIVE_INFINITY;
        for (int src = 0; src < 2; src++) {
            for (int k = 0; k < 3; k++) {
                double sum = 0;
                int count = 0;
                for (int p = 1; p < h.n; p++) {                      // particle 0 is dead
                    if (p % 2 == src) {
                        sum += h.x[p][k];
                        count++;
                    }
                }
                double mean = sum / count, ss = 0;
                for (int p = 1; p < h.n; p++) {
                    if (p % 2 == src) {
                        ss += (h.x[p][k] - mean) * (h.x[p][k] - mean);
                    }
                }
                expected = Math.min(expected, Math.sqrt(ss / count));   // population rms about the mean
            }
        }
        double w = EmissionChoice.thinnestRms(h, SPIN);
        assertEquals(expected, w, 1e-9);
        // the x width of source 0 (drawn with sigma 0.3 M; 2000 draws estimate it to ~ sigma / sqrt(2 x 2000),
        // 1.6 %, so 10 % is loose: common practice, no source), not the 16 M spread of both sources
        assertTrue(Math.abs(w - 0.3) < 0.03, "thinnest " + w);
    }

    @Test void autoComparesTheWidthWithTheGridSpacing() {
        TwoClouds h = new TwoClouds(0.0);
        double w = EmissionChoice.thinnestRms(h, SPIN);
        // grid spacing sqrt(0.9) h: smoothing lengths just below and above w / sqrt(0.9)
        EmissionChoice fine = EmissionChoice.of(EmissionSum.AUTO, h, SPIN, 0.99 * w / Math.sqrt(0.9));
        EmissionChoice coarse = EmissionChoice.of(EmissionSum.AUTO, h, SPIN, 1.01 * w / Math.sqrt(0.9));
        assertTrue(fine.gridded());
        assertEquals("grid", fine.used());
        assertFalse(coarse.gridded());
        assertEquals("particles", coarse.used());
        assertEquals(w, fine.thinnestRmsM(), 0.0);
        assertEquals(0.99 * w, fine.gridSpacingM(), 1e-12);
        // asked outright, no width is measured
        assertTrue(EmissionChoice.of(EmissionSum.GRID, h, SPIN, 10.0).gridded());
        assertFalse(EmissionChoice.of(EmissionSum.PARTICLES, h, SPIN, 0.01).gridded());
        assertTrue(Double.isNaN(EmissionChoice.of(EmissionSum.GRID, h, SPIN, 10.0).thinnestRmsM()));
    }

    @Test void severalSpectralIndicesMeanParticles() {
        TwoClouds h = new TwoClouds(1.5);
        assertFalse(EmissionChoice.of(EmissionSum.GRID, h, SPIN, 0.01).gridded());
        assertFalse(EmissionChoice.of(EmissionSum.AUTO, h, SPIN, 0.01).gridded());
    }
}
