package org.spindrift.sim.motion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;

class ParticleBallTest {
    @Test
    void ballHasTheRequestedCentreAndWidthAndIsReproducible() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.9);
        int n = 4000;
        double sigma = 0.5;
        ParticleBatch b = ParticleBall.around(st, 8, sigma, n, 42);
        double sx = 0;
        double sz = 0;
        double szz = 0;
        for (int i = 0; i < n; i++) {
            double z = b.r(i) * Math.cos(b.theta(i));
            sx += b.r(i) * Math.sin(b.theta(i)) * Math.cos(b.phi(i));
            sz += z;
            szz += z * z;
        }
        // sample mean and standard deviation of a Gaussian: errors sigma / sqrt(n) and
        // sigma / sqrt(2 n) (common practice, no source); 5 standard errors
        assertEquals(8.0, sx / n, 5 * sigma / Math.sqrt(n));
        assertEquals(0.0, sz / n, 5 * sigma / Math.sqrt(n));
        assertEquals(sigma, Math.sqrt(szz / n - (sz / n) * (sz / n)), 5 * sigma / Math.sqrt(2.0 * n));
        assertTrue(b.bitwiseEquals(ParticleBall.around(st, 8, sigma, n, 42)), "same seed, same ball");
        // every member is a unit-mass test particle: H = -1/2 (Misner, Thorne & Wheeler 1973, eq. 25.19)
        GeodesicEquations eq = new GeodesicEquations(st);
        for (int i = 0; i < n; i += 97) {
            assertEquals(-0.5, eq.hamiltonian(b.r(i), b.theta(i), b.pT(i), b.pPhi(i), b.pR(i), b.pTheta(i)), 1e-12);
        }
    }
}
