package org.spindrift.sim.history;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;
import org.spindrift.sim.motion.BatchIntegrator;
import org.spindrift.sim.motion.ParticleBatch;
import org.spindrift.sim.spacetime.CircularOrbits;
import org.spindrift.sim.spacetime.Horizons;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.MassFunctions;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The recorder on particles evolved in memory: circular Kerr orbits give the published 4-velocity,
 * weights follow base weight times envelope, and a captured particle keeps weight 0.
 */
class HistoryRecorderTest {
    /** Integrator tolerance of the test, and the agreement it buys on u^mu (common practice, no source). */
    static final double TOLERANCE = 1e-11;
    static final double AGREEMENT = 1e-8;

    @Test void circularOrbitsGiveTheKerrFourVelocityAndWeightsFollowTheEnvelope() {
        double a = 0.5;
        Spacetime st = new MassFunctionSpacetime("kerr", a, MassFunctions.constant());
        double capture = Horizons.outer(st) + Landmarks.CAPTURE_MARGIN;
        double[] radii = {6.0, 9.0, 14.0};
        int n = radii.length + 1;
        ParticleBatch b = new ParticleBatch(n);
        for (int i = 0; i < radii.length; i++) {
            double r = radii[i];
            b.set(i, 0.0, r, 0.5 * Math.PI, 0.3 * i, -CircularOrbits.energy(st, r, true), 0.0, 0.0,
                    CircularOrbits.angularMomentum(st, r, true));
        }
        // a particle with no angular momentum, momentarily at rest in r at 4 M, falls in and ends captured:
        // unit mass shell g^tt p_t^2 = -1 (Misner, Thorne & Wheeler 1973, eq. 25.19 with H = -1/2)
        double[] g = new double[Spacetime.SIZE];
        st.inverse(4.0, 0.5 * Math.PI, g);
        b.set(n - 1, 0.0, 4.0, 0.5 * Math.PI, 0.0, -1.0 / Math.sqrt(-g[Spacetime.TT]), 0.0, 0.0, 0.0);
        double[] times = new double[41];
        for (int k = 0; k < times.length; k++) {
            times[k] = 5.0 * k;
        }
        double[] base = {0.5, 1.0, 2.0, 4.0};
        int[] source = {0, 0, 1, 1};
        DoubleUnaryOperator[] env = {t -> 1.0, t -> Math.exp(-t / 50.0)};
        HistoryRecorder rec = new HistoryRecorder(times, st, source, base, env);
        new BatchIntegrator(st, BatchIntegrator.Config.of(capture).withTolerance(TOLERANCE, TOLERANCE))
                .integrate(b, times, rec);
        ParticleHistory h = rec.history();
        assertEquals(times.length, h.snapshots());
        assertEquals(n, h.particles());
        for (int i = 0; i < radii.length; i++) {
            double r = radii[i];
            // prograde circular equatorial Kerr: Omega = 1/(r^1.5 + a) (Bardeen, Press & Teukolsky 1972,
            // ApJ 178, 347, eq. 2.16); u^t = (r^1.5 + a) / (r^0.75 sqrt(r^1.5 - 3 r^0.5 + 2a)) (the
            // normalisation u.u = -1 for that Omega; recalled from memory)
            double om = 1.0 / (Math.pow(r, 1.5) + a);
            double ut = (Math.pow(r, 1.5) + a) / (Math.pow(r, 0.75) * Math.sqrt(Math.pow(r, 1.5) - 3 * Math.sqrt(r) + 2 * a));
            for (int k = 0; k < times.length; k += 8) {
                assertEquals(ut, h.ut(k)[i], AGREEMENT * ut, "u^t, r = " + r + ", snapshot " + k);
                assertEquals(om * ut, h.uPhi(k)[i], AGREEMENT * om * ut, "u^phi");
                assertEquals(0.0, h.ur(k)[i], AGREEMENT, "u^r");
                assertEquals(0.0, h.uTheta(k)[i], AGREEMENT, "u^theta");
                assertEquals(0.3 * i + om * times[k], h.phi(k)[i], AGREEMENT * (1 + om * times[k]), "phi = phi0 + Omega t");
                double w = base[i] * env[source[i]].applyAsDouble(times[k]);
                assertEquals((float) w, h.weight(k)[i], "weight = base x envelope(t)");
                assertEquals(0, h.state(k)[i]);
            }
        }
        int last = times.length - 1;
        assertTrue(h.state(last)[n - 1] != 0, "the radial infall ends captured");
        assertEquals(0f, h.weight(last)[n - 1], "an ended particle emits nothing");
        assertEquals(base[n - 1], h.weight(0)[n - 1], 1e-7, "it emitted at the start");
    }
}
