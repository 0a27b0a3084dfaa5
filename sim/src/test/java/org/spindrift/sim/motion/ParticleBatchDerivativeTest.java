package org.spindrift.sim.motion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;

/**
 * The derivative a {@link ParticleBatch} keeps between snapshot intervals (the first-same-as-last
 * stage of each particle's last accepted step) must be exactly Hamilton's equations at the stored
 * state, as {@link GeodesicEquations} gives them afresh (Misner, Thorne &amp; Wheeler 1973,
 * eq. 25.19); otherwise resuming a particle would change its trajectory.
 */
class ParticleBatchDerivativeTest {
    @Test
    void keptDerivativeEqualsAFreshEvaluationBitForBit() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.9);
        ParticleBatch b = KerrTestOrbits.ball(st, 8, 0.5, 40, 5);
        BatchIntegrator.Config c = BatchIntegrator.Config.of(1 + Math.sqrt(1 - 0.81) + 0.05);
        new BatchIntegrator(st, c).integrate(b, KerrTestOrbits.grid(150, 5), null);
        GeodesicEquations eq = new GeodesicEquations(st);
        double[] y = new double[GeodesicEquations.DIM_T];
        double[] dy = new double[GeodesicEquations.DIM_T];
        int alive = 0;
        for (int i = 0; i < b.size(); i++) {
            if (b.endState(i) != EndState.ALIVE) {
                continue;
            }
            alive++;
            assertTrue(b.h[i] > 0, "particle " + i + " has no step size after integrating");
            y[0] = b.r(i);
            y[1] = b.theta(i);
            y[2] = b.phi(i);
            y[3] = b.pR(i);
            y[4] = b.pTheta(i);
            eq.coordinateTime(b.pT(i), b.pPhi(i), y, 0, dy, 0);
            for (int j = 0; j < GeodesicEquations.DIM_T; j++) {
                assertEquals(Double.doubleToRawLongBits(dy[j]),
                        Double.doubleToRawLongBits(b.dy[i * GeodesicEquations.DIM_T + j]),
                        "particle " + i + " component " + j);
            }
        }
        assertTrue(alive > 30, "too few particles survived to test: " + alive);
    }
}
