package org.spindrift.sim.motion;

import java.util.Arrays;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Health checks of a run, as a {@link SnapshotSink} (chain it with others through
 * {@link #then}): per particle the largest mass-shell error |H + 1/2| over the snapshots
 * (H = 1/2 g^{mu nu} p_mu p_nu = -1/2 for unit-mass test particles, Misner, Thorne &amp; Wheeler
 * 1973, eq. 25.19) and, for separable spacetimes, the largest drift |Q - Q_0| of the Carter
 * constant (Carter 1968) from its value when the diagnostics were created. Summaries: the
 * maximum and the median over particles of those per-particle maxima, over particles alive at
 * each snapshot. Not thread-safe (snapshots arrive on one thread); no allocation per snapshot.
 */
public final class MotionDiagnostics implements SnapshotSink {
    private final Spacetime spacetime;
    private final GeodesicEquations eq;
    private final double[] massShell;
    private final double[] carter0;
    private final double[] carterDrift;
    private final boolean separable;

    /** @param batch the particles, at their initial state (Q_0 is taken now) */
    public MotionDiagnostics(Spacetime spacetime, ParticleBatch batch) {
        this.spacetime = spacetime;
        this.eq = new GeodesicEquations(spacetime);
        int n = batch.size();
        this.massShell = new double[n];
        this.separable = spacetime.separable();
        this.carter0 = new double[separable ? n : 0];
        this.carterDrift = new double[separable ? n : 0];
        for (int i = 0; i < n; i++) {
            massShell[i] = FastMath.abs(eq.hamiltonian(batch.r(i), batch.theta(i), batch.pT(i), batch.pPhi(i),
                    batch.pR(i), batch.pTheta(i)) + 0.5);
            if (separable) {
                carter0[i] = spacetime.carter(batch.theta(i), batch.pTheta(i), -batch.pT(i), batch.pPhi(i), 1.0);
            }
        }
    }

    @Override public void accept(int index, double t, Snapshot s) {
        for (int i = 0; i < s.size(); i++) {
            if (s.stateCode(i) != EndState.ALIVE.code()) {
                continue;
            }
            double h = eq.hamiltonian(s.r(i), s.theta(i), s.pT(i), s.pPhi(i), s.pR(i), s.pTheta(i));
            double d = FastMath.abs(h + 0.5);
            if (d > massShell[i] || Double.isNaN(d)) {
                massShell[i] = d;
            }
            if (separable) {
                double q = spacetime.carter(s.theta(i), s.pTheta(i), -s.pT(i), s.pPhi(i), 1.0);
                double dq = FastMath.abs(q - carter0[i]);
                if (dq > carterDrift[i] || Double.isNaN(dq)) {
                    carterDrift[i] = dq;
                }
            }
        }
    }

    /** Writes the per-particle maxima bit for bit (for a checkpoint; Q_0 comes from the initial state). */
    public void writeState(java.io.DataOutputStream out) throws java.io.IOException {
        out.writeInt(massShell.length);
        out.writeInt(carterDrift.length);
        for (double v : massShell) {
            out.writeLong(Double.doubleToRawLongBits(v));
        }
        for (double v : carterDrift) {
            out.writeLong(Double.doubleToRawLongBits(v));
        }
    }

    /** Reads what {@link #writeState} wrote, into diagnostics made for the same particles. */
    public void readState(java.io.DataInputStream in) throws java.io.IOException {
        if (in.readInt() != massShell.length || in.readInt() != carterDrift.length) {
            throw new java.io.IOException("diagnostics sizes differ");
        }
        for (int i = 0; i < massShell.length; i++) {
            massShell[i] = Double.longBitsToDouble(in.readLong());
        }
        for (int i = 0; i < carterDrift.length; i++) {
            carterDrift[i] = Double.longBitsToDouble(in.readLong());
        }
    }

    /** @return a sink that feeds this one, then other */
    public SnapshotSink then(SnapshotSink other) {
        return (k, t, s) -> {
            accept(k, t, s);
            other.accept(k, t, s);
        };
    }

    /** @return max over particles and snapshots of |H + 1/2| */
    public double massShellMax() {
        return max(massShell);
    }

    /** @return median over particles of each particle's max |H + 1/2| */
    public double massShellMedian() {
        return median(massShell);
    }

    /** @return max |Q - Q_0| (M^2), NaN when the spacetime is not separable */
    public double carterDriftMax() {
        return separable ? max(carterDrift) : Double.NaN;
    }

    /** @return median over particles of each particle's max |Q - Q_0|, NaN when not separable */
    public double carterDriftMedian() {
        return separable ? median(carterDrift) : Double.NaN;
    }

    /** @return particle i's largest |H + 1/2| */
    public double massShell(int i) {
        return massShell[i];
    }

    private static double max(double[] v) {
        double m = 0;
        for (double x : v) {
            if (Double.isNaN(x)) {
                return Double.NaN;
            }
            m = FastMath.max(m, x);
        }
        return m;
    }

    private static double median(double[] v) {
        if (v.length == 0) {
            return Double.NaN;
        }
        double[] c = v.clone();
        Arrays.sort(c);
        int n = c.length;
        return n % 2 == 1 ? c[n / 2] : 0.5 * (c[n / 2 - 1] + c[n / 2]);
    }
}
