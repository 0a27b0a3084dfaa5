package org.spindrift.sim.motion;

import java.util.Arrays;

/**
 * Event detection on the continuous extension of single-particle steps (a {@link StepListener}
 * for one particle index): periapsis passages as the event function g = p_r rising through zero
 * and polar turning points at the northern extreme of theta as g = p_theta rising through zero;
 * each located on the 7th-order dense output with the shared root finder
 * ({@link DenseStep#locate}) to the resolution of t, the middle of the final bracket.
 *
 * <p>Conditioning: near a circular orbit p_r stays close to zero (its amplitude is of order e),
 * so a periapsis time is determined only to about (error of p_r) / (dp_r/dt), which grows like
 * 1/e; for e below about 1e-3 the passage times (and the advance derived from them) lose
 * accuracy, and at e = 0 there is no periapsis at all. The same holds for p_theta at small
 * inclination. Results are recorded in growable arrays (amortised, not per step).
 */
public final class TurningPoints implements StepListener {
    /** g = p_r: rises through zero at periapsis. */
    private static final EventFunction PERIAPSIS = EventFunction.above(GeodesicEquations.PR, 0.0);
    /** g = p_theta: rises through zero at the northern extreme of theta. */
    private static final EventFunction POLAR = EventFunction.above(GeodesicEquations.PTH, 0.0);

    private final int particle;
    private double[] periT = new double[16];
    private double[] periR = new double[16];
    private double[] periTheta = new double[16];
    private double[] periPhi = new double[16];
    private int nPeri;
    private double[] polarT = new double[16];
    private int nPolar;

    /** @param particle index of the particle observed */
    public TurningPoints(int particle) {
        this.particle = particle;
    }

    /** Writes the recorded turning points (for a checkpoint); {@link #readState} restores them exactly. */
    public void writeState(java.io.DataOutputStream out) throws java.io.IOException {
        out.writeInt(nPeri);
        for (int k = 0; k < nPeri; k++) {
            out.writeDouble(periT[k]);
            out.writeDouble(periR[k]);
            out.writeDouble(periTheta[k]);
            out.writeDouble(periPhi[k]);
        }
        out.writeInt(nPolar);
        for (int k = 0; k < nPolar; k++) {
            out.writeDouble(polarT[k]);
        }
    }

    /** Replaces the recorded turning points with those written by {@link #writeState}. */
    public void readState(java.io.DataInputStream in) throws java.io.IOException {
        int np = in.readInt();
        if (np < 0 || np > 1 << 26) {
            throw new java.io.IOException("damaged turning points");
        }
        nPeri = 0;
        for (int k = 0; k < np; k++) {
            addPeriapsis(in.readDouble(), in.readDouble(), in.readDouble(), in.readDouble());
        }
        int nq = in.readInt();
        if (nq < 0 || nq > 1 << 26) {
            throw new java.io.IOException("damaged turning points");
        }
        polarT = new double[Math.max(16, nq)];
        for (int k = 0; k < nq; k++) {
            polarT[k] = in.readDouble();
        }
        nPolar = nq;
    }

    /** Records a periapsis known by construction (for example the start of an orbit set up there). */
    public void addPeriapsis(double t, double r, double theta, double phi) {
        if (nPeri == periT.length) {
            int n = 2 * nPeri;
            periT = Arrays.copyOf(periT, n);
            periR = Arrays.copyOf(periR, n);
            periTheta = Arrays.copyOf(periTheta, n);
            periPhi = Arrays.copyOf(periPhi, n);
        }
        periT[nPeri] = t;
        periR[nPeri] = r;
        periTheta[nPeri] = theta;
        periPhi[nPeri] = phi;
        nPeri++;
    }

    @Override public void step(int i, DenseStep s) {
        if (i != particle) {
            return;
        }
        if (rising(s, PERIAPSIS)) {
            double t = root(s, PERIAPSIS);
            addPeriapsis(t, s.at(GeodesicEquations.R, t), s.at(GeodesicEquations.TH, t),
                    s.at(GeodesicEquations.PH, t));
        }
        if (rising(s, POLAR)) {
            if (nPolar == polarT.length) {
                polarT = Arrays.copyOf(polarT, 2 * nPolar);
            }
            polarT[nPolar++] = root(s, POLAR);
        }
    }

    /** @return true when g rises through zero in the step: g(t0) &lt; 0 &lt;= g(t1) */
    private static boolean rising(DenseStep s, EventFunction g) {
        return s.gStart(g) < 0.0 && s.gEnd(g) >= 0.0;
    }

    /** @return the rising zero of g in [t0, t1]: the middle of the shared root finder's final bracket */
    private static double root(DenseStep s, EventFunction g) {
        double after = s.locate(g);
        return 0.5 * (s.locatedBefore() + after);
    }

    /** @return the number of periapsis passages recorded */
    public int periapsisCount() {
        return nPeri;
    }

    public double periapsisTime(int k) {
        return periT[k];
    }

    public double periapsisR(int k) {
        return periR[k];
    }

    public double periapsisTheta(int k) {
        return periTheta[k];
    }

    public double periapsisPhi(int k) {
        return periPhi[k];
    }

    /** @return the number of northern polar turning points recorded */
    public int polarCount() {
        return nPolar;
    }

    public double polarTime(int k) {
        return polarT[k];
    }
}
