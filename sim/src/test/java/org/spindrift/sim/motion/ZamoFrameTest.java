package org.spindrift.sim.motion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.Spacetime;

class ZamoFrameTest {
    @Test
    void zamoAtRestHasZeroAngularMomentumAndUnitNorm() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.9);
        ZamoFrame z = new ZamoFrame(st);
        double[] p = new double[4];
        z.momentum(5, 1.1, 0, 0, 0, p);
        // the ZAMO has L = 0 by definition (Bardeen, Press & Teukolsky 1972, sec. III)
        assertEquals(0.0, p[3], 1e-14);
        // E = alpha for the ZAMO: -p_t = alpha (u_t = -alpha since u = e_(t))
        assertEquals(z.lapse(5, 1.1), -p[0], 1e-14);
        assertEquals(-0.5, new GeodesicEquations(st).hamiltonian(5, 1.1, p[0], p[3], p[1], p[2]), 1e-14);
    }

    @Test
    void kerrZamoOmegaMatchesTheClosedForm() {
        double a = 0.7;
        ZamoFrame z = new ZamoFrame(KerrTestOrbits.kerr(a));
        double r = 3.3;
        double th = 0.8;
        double s2 = Math.sin(th) * Math.sin(th);
        double sig = r * r + a * a * Math.cos(th) * Math.cos(th);
        double del = r * r - 2 * r + a * a;
        double big = (r * r + a * a) * (r * r + a * a) - a * a * del * s2;
        // omega = 2 a r / A, alpha^2 = Sigma Delta / A (Bardeen, Press & Teukolsky 1972, eq. 3.2)
        assertEquals(2 * a * r / big, z.omega(r, th), 1e-15);
        assertEquals(Math.sqrt(sig * del / big), z.lapse(r, th), 1e-15);
    }

    @Test
    void momentumAndLocalVelocityAreInverse() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.95);
        ZamoFrame z = new ZamoFrame(st);
        double[] p = new double[4];
        double[] v = new double[3];
        z.momentum(4.2, 1.3, 0.2, -0.3, 0.5, p);
        z.localVelocity(4.2, 1.3, p[0], p[1], p[2], p[3], v);
        assertEquals(0.2, v[0], 1e-14);
        assertEquals(-0.3, v[1], 1e-14);
        assertEquals(0.5, v[2], 1e-14);
        assertEquals(-0.5, new GeodesicEquations(st).hamiltonian(4.2, 1.3, p[0], p[3], p[1], p[2]), 1e-14);
        assertThrows(IllegalArgumentException.class, () -> z.momentum(4, 1, 0.8, 0.7, 0, p));
    }

    @Test
    void circularOrbitThroughTheZamoFrameKeepsItsConstants() {
        double a = 0.9;
        Spacetime st = KerrTestOrbits.kerr(a);
        double[] el = KerrTestOrbits.circularEL(a, 7);
        ZamoFrame z = new ZamoFrame(st);
        double[] v = new double[3];
        z.localVelocity(7, Math.PI / 2, -el[0], 0, 0, el[1], v);
        double[] p = new double[4];
        z.momentum(7, Math.PI / 2, v[0], v[1], v[2], p);
        // Bardeen, Press & Teukolsky 1972, eq. 2.12-2.13, by two routes
        assertEquals(-el[0], p[0], 1e-13);
        assertEquals(el[1], p[3], 1e-12);
        InitialState c = OrbitSetup.circular(st, 7, true, 0.0);
        assertEquals(el[0], c.energy(), 1e-13);
        assertEquals(el[1], c.angularMomentum(), 1e-12);
    }

    @Test
    void velocityAdditionMatchesSpecialRelativity() {
        double[] out = new double[3];
        // collinear: (v + w) / (1 + v w) (Einstein 1905)
        ZamoFrame.addVelocities(new double[] {0, 0, 0.6}, new double[] {0, 0, 0.7}, out);
        assertEquals((0.6 + 0.7) / (1 + 0.42), out[2], 1e-15);
        // perpendicular: u_perp = w / gamma_v (Jackson 1999, eq. 11.31)
        ZamoFrame.addVelocities(new double[] {0.8, 0, 0}, new double[] {0, 0.5, 0}, out);
        assertEquals(0.8, out[0], 1e-15);
        assertEquals(0.5 * Math.sqrt(1 - 0.64), out[1], 1e-15);
    }
}
