package org.spindrift.sim.light;

import org.spindrift.shared.Coordinates;
import org.spindrift.shared.scenario.EmissionSum;

/**
 * Which emission sum the frames use, and the measure behind an automatic choice.
 *
 * <p>The grid ({@link GriddedEmission}) turns each particle into a kernel whose shape depends on
 * where the particle sits between the nodes; summed over many particles spread over several nodes
 * that dependence averages out, but gas thinner than the node spacing is imaged through one
 * offset-dependent kernel, and its frame fluxes scatter by a few per cent about the particle sum
 * (measured: a spot of rms width 0.15 M on a 0.20 M grid, 1-3 % per frame; rms width 0.4 M on
 * 0.15-0.30 M grids, at most 0.9 %). {@link EmissionSum#AUTO} therefore takes the grid only when
 * the thinnest source as placed is at least one grid spacing thick: the smallest rms width of any
 * source's particles along any Cartesian axis at the first snapshot. (Later the widths change: a
 * spot placed off the plane with circular-orbit velocities oscillates vertically in phase and
 * flattens for a moment every half vertical period; the comparison above includes such moments.)
 * The grid also needs one spectral index for all particles (one power of g per grid).
 *
 * @param asked what the scenario asked for
 * @param gridded true: the frames are summed on grids
 * @param thinnestRmsM the thinnest source's smallest rms width, M (NaN when not measured)
 * @param gridSpacingM the grid spacing, M
 */
public record EmissionChoice(EmissionSum asked, boolean gridded, double thinnestRmsM, double gridSpacingM) {
    /**
     * @param spin the spacetime's spin parameter a (for the Cartesian map)
     * @param smoothingLength kernel smoothing length h, M
     */
    public static EmissionChoice of(EmissionSum asked, EmitterHistory history, double spin, double smoothingLength) {
        double spacing = EmissionRenderer.GRID_SPACING * smoothingLength;
        boolean one = EmissionRenderer.oneSpectralIndex(history);
        return switch (asked) {
            case PARTICLES -> new EmissionChoice(asked, false, Double.NaN, spacing);
            case GRID -> new EmissionChoice(asked, one, Double.NaN, spacing);
            case AUTO -> {
                double w = thinnestRms(history, spin);
                yield new EmissionChoice(asked, one && w >= spacing, w, spacing);
            }
        };
    }

    /** @return the key of the sum used: grid or particles */
    public String used() {
        return (gridded ? EmissionSum.GRID : EmissionSum.PARTICLES).key();
    }

    /**
     * The smallest rms width, M, of any source's live particles along x, y or z (the Cartesian map of
     * {@link Coordinates#cartesian}) at the first snapshot; 0 when a source has a single live particle.
     */
    public static double thinnestRms(EmitterHistory h, double spin) {
        int sources = 0;
        for (int p = 0; p < h.particles(); p++) {
            sources = Math.max(sources, h.source(p) + 1);
        }
        // per source: count and sums of x, y, z and of their squares
        double[] acc = new double[7 * sources];
        double[] c = new double[3];
        for (int p = 0; p < h.particles(); p++) {
            if (h.state(0, p) != EmitterHistory.ALIVE) {
                continue;
            }
            Coordinates.cartesian(h.r(0, p), h.theta(0, p), h.phi(0, p), spin, c);
            int q = 7 * h.source(p);
            acc[q]++;
            for (int k = 0; k < 3; k++) {
                acc[q + 1 + k] += c[k];
                acc[q + 4 + k] += c[k] * c[k];
            }
        }
        double thinnest = Double.POSITIVE_INFINITY;
        for (int src = 0; src < sources; src++) {
            int q = 7 * src;
            double n = acc[q];
            if (n == 0) {
                continue;
            }
            for (int k = 0; k < 3; k++) {
                double mean = acc[q + 1 + k] / n;
                double var = acc[q + 4 + k] / n - mean * mean;
                thinnest = Math.min(thinnest, n < 2 ? 0.0 : Math.sqrt(Math.max(0.0, var)));
            }
        }
        return thinnest == Double.POSITIVE_INFINITY ? 0.0 : thinnest;
    }
}
