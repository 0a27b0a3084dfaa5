package org.spindrift.shared;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class UnitsTest {

    @Test
    void parsecSubtendsOneArcsecondPerAstronomicalUnit() {
        // Definition of the parsec: 1 au subtends 1 arcsecond at 1 pc (IAU 2015 Resolution B2).
        double uas = Units.AU / Units.PARSEC * Units.UAS_PER_RAD;
        assertEquals(1.0e6, uas, 1e-6);
    }

    @Test
    void solarMassTimeAndLengthUnits() {
        // GM_sun/c^3 = 4.925490947e-6 s and GM_sun/c^2 = 1476.625 m for the IAU 2015 nominal
        // GM_sun (values recalled from memory; common practice, no source).
        assertEquals(4.925490947e-6, Units.timeUnitSeconds(1.0), 1e-14);
        assertEquals(1476.625, Units.lengthUnitMetres(1.0), 1e-3);
    }

    @Test
    void angularSizeScalesAsMassOverDistance() {
        // Small-angle relation theta = GM/(c^2 D) (common practice, no source): 1e6 M_sun at 1 kpc
        // is 1.476625e9 m / 3.0856776e19 m = 4.78537e-11 rad = 9.8704 uas.
        assertEquals(9.8704, Units.uasPerM(1.0e6, 1.0e-3), 1e-3);
        // the same angle for 1e9 M_sun at 1 Mpc (the ratio is what counts)
        assertEquals(9.8704, Units.uasPerM(1.0e9, 1.0), 1e-3);
    }
}
