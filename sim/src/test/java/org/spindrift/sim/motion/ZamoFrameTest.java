package org.spindrift.sim.motion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.Spacetime;

class ZamoFrameTest {
    /** One closed form against another on values of order 1: a few ulps (2.2e-16 each). */
    private static final double ROUNDING = 1e-15;
    /** Through the tetrad and back (about 50 operations on values of order 1): about 50 ulps. */
    private static final double FRAME_ROUND_TRIP = 1e-14;
    /** E of a circular orbit by two routes (BPT closed form, tetrad or set-up): about 500 ulps. */
    private static final double ENERGY = 1e-13;
    /** L of about 3.5 M by two routes: the relative precision of ENERGY times L, and a little more. */
    private static final double ANGULAR_MOMENTUM = 1e-12;

    @Test
    void zamoAtRestHasZeroAngularMomentumAndUnitNorm() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.9);
        ZamoFrame z = new ZamoFrame(st);
        double[] p = new double[4];
        z.momentum(5, 1.1, 0, 0, 0, p);
        // the ZAMO has L = 0 by definition (Bardeen, Press & Teukolsky 1972, sec. III)
        assertEquals(0.0, p[3], FRAME_ROUND_TRIP);
        // E = alpha for the ZAMO: -p_t = alpha (u_t = -alpha since u = e_(t))
        assertEquals(z.lapse(5, 1.1), -p[0], FRAME_ROUND_TRIP);
        assertEquals(-0.5, new GeodesicEquations(st).hamiltonian(5, 1.1, p[0], p[3], p[1], p[2]), FRAME_ROUND_TRIP);
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
        assertEquals(2 * a * r / big, z.omega(r, th), ROUNDING);
        assertEquals(Math.sqrt(sig * del / big), z.lapse(r, th), ROUNDING);
    }

    @Test
    void momentumAndLocalVelocityAreInverse() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.95);
        ZamoFrame z = new ZamoFrame(st);
        double[] p = new double[4];
        double[] v = new double[3];
        z.momentum(4.2, 1.3, 0.2, -0.3, 0.5, p);
        z.localVelocity(4.2, 1.3, p[0], p[1], p[2], p[3], v);
        assertEquals(0.2, v[0], FRAME_ROUND_TRIP);
        assertEquals(-0.3, v[1], FRAME_ROUND_TRIP);
        assertEquals(0.5, v[2], FRAME_ROUND_TRIP);
        assertEquals(-0.5, new GeodesicEquations(st).hamiltonian(4.2, 1.3, p[0], p[3], p[1], p[2]), FRAME_ROUND_TRIP);
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
        assertEquals(-el[0], p[0], ENERGY);
        assertEquals(el[1], p[3], ANGULAR_MOMENTUM);
        InitialState c = OrbitSetup.circular(st, 7, true, 0.0);
        assertEquals(el[0], c.energy(), ENERGY);
        assertEquals(el[1], c.angularMomentum(), ANGULAR_MOMENTUM);
    }

    @Test
    void velocityAdditionMatchesSpecialRelativity() {
        double[] out = new double[3];
        // collinear: (v + w) / (1 + v w) (Einstein 1905)
        ZamoFrame.addVelocities(new double[] {0, 0, 0.6}, new double[] {0, 0, 0.7}, out);
        assertEquals((0.6 + 0.7) / (1 + 0.42), out[2], ROUNDING);
        // perpendicular: u_perp = w / gamma_v (Jackson 1999, eq. 11.31)
        ZamoFrame.addVelocities(new double[] {0.8, 0, 0}, new double[] {0, 0.5, 0}, out);
        assertEquals(0.8, out[0], ROUNDING);
        assertEquals(0.5 * Math.sqrt(1 - 0.64), out[1], ROUNDING);
    }
}
