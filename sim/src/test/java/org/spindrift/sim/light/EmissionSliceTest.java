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
 * reference renderer and the group query of the frame renderer (gap field to the gas, one walk of
 * the columns for up to eight nearby samples, occupied z range and chord of each search sphere
 * per column), for single samples and for groups, must give the same number bit for bit,
 * including at the edge of the gas where the shortcuts decide and in columns of hundreds of
 * particles.
 */
class EmissionSliceTest {
    @Test
    void queriesEqualTheSumOverEveryParticle() {
        Spacetime st = LightTestSupport.kerr(0.5);
        double h = 0.2;
        double invH = 1 / h, norm = Kernel.norm(h), support2 = 4 * h * h;
        SplittableRandom rng = new SplittableRandom(3L);
        EmissionSlice.Group group = new EmissionSlice.Group();
        int nonZero = 0, zero = 0, crowded = 0, grouped = 0;
        // a spot of 0.4 M and a dense one of 0.1 M, whose columns hold hundreds of candidates
        for (double size : new double[] {0.4, 0.1}) {
            CircularSpotHistory hist = new CircularSpotHistory(st, 6.0, 0.3, size, 3000, 0.0, 200.0, 101, 1.0, 11L);
            for (double tau : new double[] {37.3, 120.05}) {
                EmissionSlice sl = EmissionSlice.build(hist, st, tau, 2 * h, 0.5 * h, 20.0);
                assertNotNull(sl, "the spot emits at t = " + tau);
                for (int c = 0; c < sl.nx * sl.ny; c++) {
                    crowded = Math.max(crowded, sl.cellStart[(c + 1) * sl.nz] - sl.cellStart[c * sl.nz]);
                }
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
                    group.x[0] = sx;
                    group.y[0] = sy;
                    group.z[0] = sz;
                    group.dt[0] = dt;
                    group.pr[0] = pr;
                    group.pth[0] = pth;
                    group.pph[0] = pph;
                    sl.emissivityGroup(1, group, invH, norm, support2);
                    double near = group.out[0];
                    assertEquals(all, cells, 0.0, "cell query at sample " + k);
                    assertEquals(all, near, 0.0, "query with shortcuts (group of one) at sample " + k);
                    // a group: this sample and up to seven neighbours within 0.3 M and the same slice
                    if (k % 8 == 0) {
                        int n = 1 + k / 8 % EmissionSlice.GROUP;
                        double[] want = new double[n];
                        for (int m = 0; m < n; m++) {
                            double ox = m == 0 ? 0 : 0.6 * (rng.nextDouble() - 0.5);
                            double oy = m == 0 ? 0 : 0.6 * (rng.nextDouble() - 0.5);
                            double oz = m == 0 ? 0 : 0.6 * (rng.nextDouble() - 0.5);
                            group.x[m] = sx + ox;
                            group.y[m] = sy + oy;
                            group.z[m] = sz + oz;
                            group.dt[m] = m == 0 ? dt : h * (rng.nextDouble() - 0.5);
                            group.pr[m] = pr;
                            group.pth[m] = pth - 0.1 * m;
                            group.pph[m] = pph + 0.2 * m;
                            want[m] = sl.emissivityAllParticles(group.x[m], group.y[m], group.z[m], group.dt[m], group.pr[m],
                                    group.pth[m], group.pph[m], invH, norm, support2);
                        }
                        sl.emissivityGroup(n, group, invH, norm, support2);
                        for (int m = 0; m < n; m++) {
                            assertEquals(want[m], group.out[m], 0.0, "group query, sample " + m + " of " + n + " at " + k);
                            grouped += want[m] != 0.0 ? 1 : 0;
                        }
                    }
                    if (all != 0.0) {
                        nonZero++;
                    } else {
                        zero++;
                    }
                }
            }
        }
        assertTrue(nonZero > 4000 && zero > 4000, "both cases exercised: " + nonZero + " with emission, " + zero
                + " without");
        assertTrue(crowded > 500, "a column holds " + crowded + " particles");
        assertTrue(grouped > 500, "group queries with emission: " + grouped);
    }
}
