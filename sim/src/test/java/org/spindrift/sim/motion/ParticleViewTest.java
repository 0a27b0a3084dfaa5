package org.spindrift.sim.motion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;

class ParticleViewTest {
    @Test
    void lastSnapshotAndFinalBatchAreTheSameParticlesThroughTheOneView() {
        // after integrate every alive particle sits exactly on the last time, and a particle that
        // ended shows its end state in both: the two views must agree bit for bit
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.9);
        ParticleBatch b = ParticleBall.around(st, 5, 1.0, 60, 3);
        ParticleView[] last = new ParticleView[1];
        double[][] copy = new double[1][];
        BatchIntegrator.Config c = BatchIntegrator.Config.of(1 + Math.sqrt(1 - 0.81) + 0.05);
        new BatchIntegrator(st, c).integrate(b, new double[] {40, 300}, (k, t, s) -> {
            last[0] = s;
            copy[0] = columns(s);
        });
        assertTrue(java.util.Arrays.equals(copy[0], columns(b)), "last snapshot differs from the final batch");
        int ended = 0;
        for (int i = 0; i < b.size(); i++) {
            assertEquals(b.endState(i), last[0].endState(i));
            ended += b.endState(i) == EndState.ALIVE ? 0 : 1;
        }
        // a wide ball (sigma 1 M) at r = 5 M around a = 0.9: some members fall in (common practice, no source)
        assertTrue(ended > 0 && ended < b.size(), "need both alive and ended particles, ended: " + ended);
    }

    private static double[] columns(ParticleView v) {
        double[] out = new double[7 * v.size()];
        for (int i = 0; i < v.size(); i++) {
            double[] row = {v.r(i), v.theta(i), v.phi(i), v.pR(i), v.pTheta(i), v.pT(i), v.pPhi(i)};
            System.arraycopy(row, 0, out, 7 * i, 7);
        }
        return out;
    }
}
