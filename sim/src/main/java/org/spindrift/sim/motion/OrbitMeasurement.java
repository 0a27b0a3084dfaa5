package org.spindrift.sim.motion;

import java.util.Arrays;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Integrates one bound orbit for a number of radial periods and measures from the trajectory
 * (not from formulas): the radial period as the mean spacing of periapsis passages
 * ({@link TurningPoints}: p_r rising through zero, refined on the dense output), the periastron
 * advance per radial period as the mean of |phi(t_k+1) - phi(t_k)| - 2 pi (in the sense of the
 * orbital motion, so retrograde orbits have a positive advance too), the azimuthal period
 * 2 pi / |mean dphi/dt| over those radial periods (periods are positive), and the polar period as the mean spacing of
 * northern polar turning points (p_theta rising through zero). All in coordinate time (M).
 * The means are weighted with a smooth window ({@link #weightedMeanIncrement}).
 * Also the mass-shell drift max |H + 1/2| and, for separable spacetimes, max |Q - Q_0| over
 * the snapshots.
 *
 * <p>For inclined orbits the radial and polar motions are not commensurate (and the azimuth of
 * a tilted orbit does not advance uniformly even in Schwarzschild), so the increments of single
 * periods fluctuate quasi-periodically; plain means over N periods converge to the fundamental
 * values only like 1/N, the windowed means much faster.
 */
public final class OrbitMeasurement {
    /**
     * @param orbits radial periods measured
     * @param periodRadial mean radial period (M)
     * @param periodAzimuthal 2 pi / |mean dphi/dt| (M)
     * @param periodPolar mean polar period (M), NaN for equatorial orbits
     * @param advance periastron advance per radial period in the sense of the motion (radians)
     * @param massShellDriftMax max |H + 1/2|
     * @param carterDriftMax max |Q - Q0| (M^2), NaN when not separable
     * @param endState how the integration ended
     * @param samples trajectory samples: rows t, r, theta, phi
     * @param periapses periapsis passages: rows t, r, theta, phi
     * @param evaluations right-hand-side evaluations used
     * @param uncertainty estimated uncertainty of each mean: {@link Uncertainty}
     */
    public record Result(int orbits, double periodRadial, double periodAzimuthal, double periodPolar, double advance,
                         double massShellDriftMax, double carterDriftMax, EndState endState, double[][] samples,
                         double[][] periapses, long evaluations, Uncertainty uncertainty) {
    }

    /**
     * Uncertainty of the measured means: the difference between the windowed mean over all the
     * measured periods and the same mean over the first half of them (NaN with fewer than two).
     * The windowed mean converges faster than any power of the number of periods for
     * quasi-periodic motion (Das &amp; Yorke 2018), so the half-length mean is much further off than
     * the full one and the difference is a conservative estimate of the full mean's error. For
     * equatorial orbits the increments are equal up to the integration error, which the difference
     * then measures.
     *
     * @param periodRadial of the radial period (M)
     * @param periodAzimuthal of the azimuthal period (M)
     * @param periodPolar of the polar period (M)
     * @param advance of the periastron advance (radians)
     */
    public record Uncertainty(double periodRadial, double periodAzimuthal, double periodPolar, double advance) {
    }

    private OrbitMeasurement() {
    }

    /**
     * @param st the spacetime
     * @param start initial state at a periapsis (p_r = 0), as from {@link OrbitElements}
     * @param orbits number of radial periods to measure (&gt;= 1)
     * @param config integrator settings (one thread is enough)
     * @param samplesPerOrbit trajectory samples per estimated radial period (for plots)
     * @param periodEstimate an estimate of the radial period (M), for the sampling cadence; for a
     *     circular orbit (no periapsis) the integration lasts orbits x periodEstimate and the
     *     azimuthal period comes from the mean dphi/dt over the samples
     */
    public static Result measure(Spacetime st, InitialState start, int orbits, BatchIntegrator.Config config,
                                 int samplesPerOrbit, double periodEstimate) {
        return measure(st, start, orbits, config, samplesPerOrbit, periodEstimate, false);
    }

    /** As {@link #measure(Spacetime, InitialState, int, BatchIntegrator.Config, int, double)}; circular when e = 0. */
    public static Result measure(Spacetime st, InitialState start, int orbits, BatchIntegrator.Config config,
                                 int samplesPerOrbit, double periodEstimate, boolean circular) {
        ParticleBatch b = new ParticleBatch(1);
        b.set(0, 0.0, start);
        TurningPoints tp = new TurningPoints(0);
        tp.addPeriapsis(0.0, start.r(), start.theta(), start.phi());
        GeodesicEquations eq = new GeodesicEquations(st);
        final double en = start.energy();
        final double l = start.angularMomentum();
        final boolean separable = st.separable();
        final double q0 = separable ? st.carter(start.theta(), start.pTheta(), en, l, 1.0) : Double.NaN;
        final double[] drift = {
            FastMath.abs(eq.hamiltonian(start.r(), start.theta(), start.pT(), start.pPhi(), start.pR(),
                    start.pTheta()) + 0.5), 0.0};
        int cap = 1024;
        final double[][] samples = new double[4][cap];
        final int[] ns = {0};
        SnapshotSink sink = (k, t, s) -> {
            if (s.endState(0) != EndState.ALIVE) {
                return;
            }
            double h = eq.hamiltonian(s.r(0), s.theta(0), s.pT(0), s.pPhi(0), s.pR(0), s.pTheta(0));
            drift[0] = FastMath.max(drift[0], FastMath.abs(h + 0.5));
            if (separable) {
                drift[1] = FastMath.max(drift[1], FastMath.abs(st.carter(s.theta(0), s.pTheta(0), en, l, 1.0) - q0));
            }
            if (ns[0] == samples[0].length) {
                for (int c = 0; c < 4; c++) {
                    samples[c] = Arrays.copyOf(samples[c], 2 * ns[0]);
                }
            }
            samples[0][ns[0]] = t;
            samples[1][ns[0]] = s.r(0);
            samples[2][ns[0]] = s.theta(0);
            samples[3][ns[0]] = s.phi(0);
            ns[0]++;
        };
        BatchIntegrator integ = new BatchIntegrator(st, config.withThreads(1));
        long evals = 0;
        double t = 0;
        int blocks = 0;
        int maxBlocks = 4 * orbits + 20;
        if (circular) {
            maxBlocks = orbits;
        }
        while ((circular || tp.periapsisCount() < orbits + 1) && b.endState(0) == EndState.ALIVE
                && blocks++ < maxBlocks) {
            double[] times = new double[samplesPerOrbit];
            for (int k = 0; k < samplesPerOrbit; k++) {
                times[k] = t + periodEstimate * (k + 1) / samplesPerOrbit;
            }
            evals += integ.integrate(b, times, sink, tp).evaluations();
            t = times[samplesPerOrbit - 1];
        }
        int n = circular ? 0 : FastMath.min(orbits, tp.periapsisCount() - 1);
        double tr = Double.NaN;
        double tphi = Double.NaN;
        double adv = Double.NaN;
        double trErr = Double.NaN;
        double tphiErr = Double.NaN;
        double advErr = Double.NaN;
        if (circular && ns[0] > 0 && b.endState(0) == EndState.ALIVE) {
            n = orbits;
            tphi = 2 * FastMath.PI * samples[0][ns[0] - 1] / FastMath.abs(samples[3][ns[0] - 1] - start.phi());
        } else if (n >= 1) {
            double dt = weightedMeanIncrement(tp::periapsisTime, n);
            double dphi = weightedMeanIncrement(tp::periapsisPhi, n);
            tr = dt;
            // in the sense of the orbital motion: retrograde orbits (phi decreasing) advance too
            adv = FastMath.abs(dphi) - 2 * FastMath.PI;
            tphi = 2 * FastMath.PI * dt / FastMath.abs(dphi);
            if (n >= 2) {
                double dtHalf = weightedMeanIncrement(tp::periapsisTime, n / 2);
                double dphiHalf = weightedMeanIncrement(tp::periapsisPhi, n / 2);
                trErr = FastMath.abs(dt - dtHalf);
                advErr = FastMath.abs(FastMath.abs(dphi) - FastMath.abs(dphiHalf));
                tphiErr = FastMath.abs(tphi - 2 * FastMath.PI * dtHalf / FastMath.abs(dphiHalf));
            }
        }
        double tth = Double.NaN;
        double tthErr = Double.NaN;
        if (start.pTheta() != 0.0 && tp.polarCount() >= 2) {
            // polar turning points up to the last periapsis used
            int m = 0;
            double tLast = circular ? Double.POSITIVE_INFINITY : tp.periapsisTime(n);
            while (m + 1 < tp.polarCount() && tp.polarTime(m + 1) <= tLast) {
                m++;
            }
            if (m >= 1) {
                tth = weightedMeanIncrement(tp::polarTime, m);
            }
            if (m >= 2) {
                tthErr = FastMath.abs(tth - weightedMeanIncrement(tp::polarTime, m / 2));
            }
        }
        double[][] peri = new double[4][tp.periapsisCount()];
        for (int k = 0; k < tp.periapsisCount(); k++) {
            peri[0][k] = tp.periapsisTime(k);
            peri[1][k] = tp.periapsisR(k);
            peri[2][k] = tp.periapsisTheta(k);
            peri[3][k] = tp.periapsisPhi(k);
        }
        double[][] smp = new double[4][];
        for (int c = 0; c < 4; c++) {
            smp[c] = Arrays.copyOf(samples[c], ns[0]);
        }
        return new Result(n, tr, tphi, tth, adv, drift[0], separable ? drift[1] : Double.NaN, b.endState(0), smp,
                peri, evals, new Uncertainty(trErr, tphiErr, tthErr, advErr));
    }

    /**
     * Weighted mean of the increments x(k+1) - x(k), k = 0..n-1, with the smooth window
     * w(s) = exp(-1 / (s (1 - s))), s = (k + 1/2)/n: the weighted Birkhoff average of Das,
     * Sander, Saiki &amp; Yorke 2017 (Nonlinearity 30, 4111; Das &amp; Yorke 2018, Nonlinearity
     * 31, 491). For equatorial orbits the increments are equal and this is their value; for
     * inclined orbits they fluctuate quasi-periodically and the weighted mean converges far
     * faster than the plain mean (which is off by O(1/n)).
     */
    static double weightedMeanIncrement(java.util.function.IntToDoubleFunction x, int n) {
        double sw = 0;
        double sum = 0;
        for (int k = 0; k < n; k++) {
            double s = (k + 0.5) / n;
            double w = FastMath.exp(-1.0 / (s * (1 - s)));
            sw += w;
            sum += w * (x.applyAsDouble(k + 1) - x.applyAsDouble(k));
        }
        return sum / sw;
    }

    /** @return a Keplerian estimate of the radial period, 2 pi (p / (1 - e^2))^(3/2) (Kepler's third law, M = 1) */
    public static double keplerPeriod(double p, double e) {
        return 2 * FastMath.PI * FastMath.pow(p / (1 - e * e), 1.5);
    }
}
