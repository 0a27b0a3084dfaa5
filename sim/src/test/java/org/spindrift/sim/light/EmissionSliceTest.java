package org.spindrift.sim.light;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The emission slice's neighbour queries against the kernel sum taken over every particle (the
 * definition of the sum, no cell list; common practice, no source): the cell query of the
 * reference renderer and the query with the early exits of the frame renderer (gap field to the
 * gas, columns beyond the search radius, occupied z range per column) must give the same number
 * bit for bit, including at the edge of the gas where the shortcuts decide.
 */
class EmissionSliceTest {
    @Test
    void queriesEqualTheSumOverEveryParticle() {
        Spacetime st = LightTestSupport.kerr(0.5);
        CircularSpotHistory hist = new CircularSpotHistory(st, 6.0, 0.3, 0.4, 3000, 0.0, 200.0, 101, 1.0, 11L);
        double h = 0.2;
        double invH = 1 / h, norm = Kernel.norm(h), support2 = 4 * h * h;
        SplittableRandom rng = new SplittableRandom(3L);
        int nonZero = 0, zero = 0;
        for (double tau : new double[] {37.3, 120.05}) {
            EmissionSlice sl = EmissionSlice.build(hist, st, tau, 2 * h, 0.5 * h, 20.0);
            assertNotNull(sl, "the spot emits at t = " + tau);
            // sample points over the slice's grid and a margin of 3 h around it
            double x0 = sl.ox - 3 * h, y0 = sl.oy - 3 * h, z0 = sl.oz - 3 * h;
            double wx = sl.nx * sl.cell + 6 * h, wy = sl.ny * sl.cell + 6 * h, wz = sl.nz * sl.cell + 6 * h;
            for (int k = 0; k < 20_000; k++) {
                double sx = x0 + wx * rng.nextDouble(), sy = y0 + wy * rng.nextDouble(), sz = z0 + wz * rng.nextDouble();
                double dt = h * (rng.nextDouble() - 0.5);
                // photon momenta of escaping rays near r = 6 M (|p_theta|, |L| of a few M)
                double pr = rng.nextDouble() * 2 - 1, pth = rng.nextDouble() * 4 - 2, pph = rng.nextDouble() * 8 - 4;
                double all = sl.emissivityAllParticles(sx, sy, sz, dt, pr, pth, pph, invH, norm, support2);
                double cells = sl.emissivity(sx, sy, sz, dt, pr, pth, pph, invH, norm, support2);
                double near = sl.emissivityNear(sx, sy, sz, dt, pr, pth, pph, invH, norm, support2);
                assertEquals(all, cells, 0.0, "cell query at sample " + k);
                assertEquals(all, near, 0.0, "query with early exits at sample " + k);
                if (all != 0.0) {
                    nonZero++;
                } else {
                    zero++;
                }
            }
        }
        assertTrue(nonZero > 2000 && zero > 2000, "both cases exercised: " + nonZero + " with emission, " + zero
                + " without");
    }

    /**
     * A slice built into the arrays of an earlier slice (the renderer reuses the arrays of dropped
     * slices, longer than needed and full of the earlier slice's values) answers every query as
     * a slice built into fresh arrays, bit for bit (common practice, no source).
     */
    @Test
    void sliceBuiltIntoReusedArraysEqualsAFreshOne() {
        Spacetime st = LightTestSupport.kerr(0.5);
        double h = 0.2;
        double invH = 1 / h, norm = Kernel.norm(h), support2 = 4 * h * h;
        CircularSpotHistory big = new CircularSpotHistory(st, 6.0, 0.3, 0.8, 3000, 0.0, 200.0, 101, 1.0, 11L);
        CircularSpotHistory small = new CircularSpotHistory(st, 7.0, 1.3, 0.3, 1500, 0.0, 200.0, 101, 0.5, 12L);
        EmissionSlice.Storage reused = new EmissionSlice.Storage();
        assertNotNull(EmissionSlice.build(big, st, 80.0, 2 * h, 0.5 * h, 20.0, reused));
        EmissionSlice again = EmissionSlice.build(small, st, 37.3, 2 * h, 0.5 * h, 20.0, reused);
        EmissionSlice fresh = EmissionSlice.build(small, st, 37.3, 2 * h, 0.5 * h, 20.0);
        assertNotNull(again);
        assertEquals(fresh.count, again.count, "particles");
        SplittableRandom rng = new SplittableRandom(5L);
        int nonZero = 0;
        for (int k = 0; k < 20_000; k++) {
            double sx = fresh.ox - 3 * h + (fresh.nx * fresh.cell + 6 * h) * rng.nextDouble();
            double sy = fresh.oy - 3 * h + (fresh.ny * fresh.cell + 6 * h) * rng.nextDouble();
            double sz = fresh.oz - 3 * h + (fresh.nz * fresh.cell + 6 * h) * rng.nextDouble();
            double dt = h * (rng.nextDouble() - 0.5);
            double pr = rng.nextDouble() * 2 - 1, pth = rng.nextDouble() * 4 - 2, pph = rng.nextDouble() * 8 - 4;
            double want = fresh.emissivityAllParticles(sx, sy, sz, dt, pr, pth, pph, invH, norm, support2);
            assertEquals(want, again.emissivity(sx, sy, sz, dt, pr, pth, pph, invH, norm, support2), 0.0,
                    "cell query at sample " + k);
            assertEquals(want, again.emissivityNear(sx, sy, sz, dt, pr, pth, pph, invH, norm, support2), 0.0,
                    "query with early exits at sample " + k);
            nonZero += want != 0.0 ? 1 : 0;
        }
        assertTrue(nonZero > 1000, "samples with emission: " + nonZero);
    }
}
