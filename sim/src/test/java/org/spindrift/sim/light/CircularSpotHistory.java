package org.spindrift.sim.light;

import java.util.Random;
import org.spindrift.sim.spacetime.CircularOrbits;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * A test emitter: a small ball of particles around a centre on a circular equatorial orbit at
 * radius r0, every particle carried rigidly with the centre's angular velocity Omega(r0) and
 * 4-velocity u = u^t (1, 0, 0, Omega) (analytic history, no integration).
 */
final class CircularSpotHistory implements EmitterHistory {
    private final double[] times;
    private final double[] dr, dth, dph;
    private final double r0, omega, ut, phase;
    private final double alpha;

    CircularSpotHistory(Spacetime st, double r0, double phase, double size, int particles, double t0, double t1,
                        int snapshots, double alpha, long seed) {
        this.r0 = r0;
        this.phase = phase;
        this.omega = CircularOrbits.omega(st, r0, true);
        this.ut = CircularOrbits.ut(st, r0, true);
        this.alpha = alpha;
        times = new double[snapshots];
        for (int s = 0; s < snapshots; s++) {
            times[s] = t0 + (t1 - t0) * s / (snapshots - 1);
        }
        Random rng = new Random(seed);
        dr = new double[particles];
        dth = new double[particles];
        dph = new double[particles];
        for (int p = 0; p < particles; p++) {
            dr[p] = size * rng.nextGaussian();
            dth[p] = size * rng.nextGaussian() / r0;
            dph[p] = size * rng.nextGaussian() / r0;
        }
    }

    /** @return Omega of the centre */
    double omega() {
        return omega;
    }

    @Override public int snapshots() {
        return times.length;
    }

    @Override public int particles() {
        return dr.length;
    }

    @Override public double time(int s) {
        return times[s];
    }

    @Override public double r(int s, int n) {
        return r0 + dr[n];
    }

    @Override public double theta(int s, int n) {
        return 0.5 * Math.PI + dth[n];
    }

    @Override public double phi(int s, int n) {
        return Math.IEEEremainder(phase + dph[n] + omega * times[s], 2 * Math.PI);
    }

    @Override public double u(int s, int n, int mu) {
        return switch (mu) {
            case 0 -> ut;
            case 3 -> ut * omega;
            default -> 0.0;
        };
    }

    @Override public double weight(int s, int n) {
        return 1.0;
    }

    @Override public int state(int s, int n) {
        return ALIVE;
    }

    @Override public double spectralIndex(int n) {
        return alpha;
    }

    @Override public int source(int n) {
        return 0;
    }
}
