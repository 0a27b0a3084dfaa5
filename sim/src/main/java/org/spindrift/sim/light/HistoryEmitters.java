package org.spindrift.sim.light;

import org.spindrift.sim.history.ParticleHistory;

/** {@link EmitterHistory} over the run's {@link ParticleHistory} (no copies). */
public final class HistoryEmitters implements EmitterHistory {
    private final ParticleHistory h;
    private final double[] alphaBySource;
    private final int[] source;

    /** @param alphaBySource spectral index alpha (F_nu ~ nu^-alpha) of each source, in the history's source order */
    public HistoryEmitters(ParticleHistory history, double[] alphaBySource) {
        this.h = history;
        this.source = history.sourceIndex();
        this.alphaBySource = alphaBySource.clone();
    }

    @Override public int snapshots() {
        return h.snapshots();
    }

    @Override public int particles() {
        return h.particles();
    }

    @Override public double time(int s) {
        return h.time(s);
    }

    @Override public double r(int s, int n) {
        return h.r(s)[n];
    }

    @Override public double theta(int s, int n) {
        return h.theta(s)[n];
    }

    @Override public double phi(int s, int n) {
        return h.phi(s)[n];
    }

    @Override public double u(int s, int n, int mu) {
        return switch (mu) {
            case 0 -> h.ut(s)[n];
            case 1 -> h.ur(s)[n];
            case 2 -> h.uTheta(s)[n];
            default -> h.uPhi(s)[n];
        };
    }

    @Override public double weight(int s, int n) {
        return h.weight(s)[n];
    }

    @Override public int state(int s, int n) {
        return h.state(s)[n];
    }

    @Override public double spectralIndex(int n) {
        return alphaBySource[source[n]];
    }

    @Override public int source(int n) {
        return source[n];
    }
}
