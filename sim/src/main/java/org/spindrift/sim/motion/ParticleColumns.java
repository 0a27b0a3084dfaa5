package org.spindrift.sim.motion;

/**
 * The columns {@link ParticleBatch} and {@link Snapshot} share, structure of arrays: the state
 * (r, theta, phi, p_r, p_theta) and the end-state code of every particle, with their
 * {@link ParticleView} accessors. The integrator writes the arrays directly (same package).
 */
abstract class ParticleColumns implements ParticleView {
    final double[] r;
    final double[] th;
    final double[] ph;
    final double[] pr;
    final double[] pth;
    final byte[] state;

    ParticleColumns(int n) {
        r = new double[n];
        th = new double[n];
        ph = new double[n];
        pr = new double[n];
        pth = new double[n];
        state = new byte[n];
    }

    @Override public final int size() {
        return r.length;
    }

    @Override public final double r(int i) {
        return r[i];
    }

    @Override public final double theta(int i) {
        return th[i];
    }

    @Override public final double phi(int i) {
        return ph[i];
    }

    @Override public final double pR(int i) {
        return pr[i];
    }

    @Override public final double pTheta(int i) {
        return pth[i];
    }

    @Override public final EndState endState(int i) {
        return EndState.ofCode(state[i]);
    }
}
