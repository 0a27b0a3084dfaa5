package org.spindrift.sim.spacetime;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spindrift.shared.UserInputException;

/** The factory: every family at zero deformation is Kerr; bad parameters give one-line messages. */
class SpacetimesTest {
    /**
     * A deformation set to zero must give the Kerr metric: differences of rounding only, relative to |g| +
     * 1e-3 (zeros).
     */
    private static final double SAME_METRIC = 1e-13;
    /** The critical core length as printed in the message (four decimals or more). */
    private static final double MESSAGE_DIGITS = 1e-4;

    @Test
    void everyFamilyReducesToKerrAtZeroDeformation() {
        double a = 0.73;
        Spacetime kerr = Spacetimes.create("kerr", a, Map.of(), false);
        Spacetime[] zero = {
            Spacetimes.create("kerr-newman", a, Map.of("charge", 0.0), false),
            Spacetimes.create("hayward", a, Map.of("core_length", 0.0), false),
            Spacetimes.create("bardeen", a, Map.of("core_charge", 0.0), false),
            Spacetimes.create("mass-series", a, Map.of("c2", 0.0, "c5", 0.0), false),
            Spacetimes.create("jp", a, Map.of("epsilon3", 0.0), false),
        };
        double[] ref = new double[Spacetime.SIZE];
        double[] got = new double[Spacetime.SIZE];
        Random rnd = new Random(7);
        for (int n = 0; n < 50; n++) {
            double r = 1.8 + 30.0 * rnd.nextDouble();
            double th = 0.05 + 3.0 * rnd.nextDouble();
            for (Spacetime st : zero) {
                for (boolean inverse : new boolean[] {false, true}) {
                    if (inverse) {
                        kerr.inverse(r, th, ref);
                        st.inverse(r, th, got);
                    } else {
                        kerr.covariant(r, th, ref);
                        st.covariant(r, th, got);
                    }
                    for (int i = 0; i < Spacetime.SIZE; i++) {
                        // common practice, no source: the deformation vanishes identically
                        assertEquals(ref[i], got[i], SAME_METRIC * (Math.abs(ref[i]) + 1e-3),
                                st.family() + (inverse ? " inverse " : " covariant ") + i + " at r=" + r);
                    }
                }
            }
        }
    }

    @Test
    void separabilityFlags() {
        assertTrue(Spacetimes.create("hayward", 0.5, Map.of("core_length", 0.3), false).separable());
        Spacetime jp = Spacetimes.create("jp", 0.5, Map.of("epsilon3", 1.0), false);
        assertFalse(jp.separable());
        assertTrue(Double.isNaN(jp.carter(1.0, 0.1, 0.9, 3.0, 1.0)));
    }

    @Test
    void badParametersNameTheParameterAndRange() {
        assertMessage("spin = 1.2 is out of range: |a| <= 1 for kerr (use allow_horizonless for a naked singularity)",
                () -> Spacetimes.create("kerr", 1.2, Map.of(), false));
        assertMessage("family = kerrr is not a known family: one of kerr, kerr-newman, hayward, bardeen, mass-series, johannsen-psaltis (alias jp)",
                () -> Spacetimes.create("kerrr", 0.5, Map.of(), false));
        assertMessage("charge = 0.8 with spin = 0.9 is out of range: a^2 + Q^2 <= 1 for kerr-newman"
                        + " (use allow_horizonless for a horizonless object)",
                () -> Spacetimes.create("kerr-newman", 0.9, Map.of("charge", 0.8), false));
        assertMessage("core_length = -0.1 is out of range: 0 <= core_length <= 10",
                () -> Spacetimes.create("hayward", 0.5, Map.of("core_length", -0.1), false));
        assertMessage("charge does not apply to family kerr (it belongs to family kerr-newman)",
                () -> Spacetimes.create("kerr", 0.5, Map.of("charge", 0.1), false));
        assertMessage("epsilon3 is required for family johannsen-psaltis", () -> Spacetimes.create("jp", 0.5, Map.of(), false));
        UserInputException noHorizon = assertThrows(UserInputException.class,
                () -> Spacetimes.create("hayward", 0.9, Map.of("core_length", 1.0), false));
        assertTrue(noHorizon.getMessage().startsWith("core_length = 1 with spin = 0.9 leaves no horizon: core_length <= 0."),
                noHorizon.getMessage());
        assertFalse(noHorizon.getMessage().contains("\n"));
        UserInputException series = assertThrows(UserInputException.class,
                () -> Spacetimes.create("mass-series", 0.5, Map.of("c1", -3.0), false));
        assertTrue(series.getMessage().contains("has no positive root"), series.getMessage());
        // the same objects are accepted when horizonless objects are allowed
        Spacetimes.create("kerr", 1.2, Map.of(), true);
        Spacetimes.create("hayward", 0.9, Map.of("core_length", 1.0), true);
    }

    @Test
    void criticalCoreLengthInMessageIsTheHorizonThreshold() {
        UserInputException ex = assertThrows(UserInputException.class,
                () -> Spacetimes.create("hayward", 0.0, Map.of("core_length", 2.0), false));
        double crit = Double.parseDouble(ex.getMessage().replaceAll(".*core_length <= ([0-9.]+) .*", "$1"));
        // Hayward 2006 (Phys. Rev. Lett. 96, 031103): the static horizon cubic r^3 - 2 r^2 + 2 l^2 = 0 has a double
        // root where also 3 r^2 - 4 r = 0, i.e. r = 4/3 and l^2 = 16/27 (l_crit = 4/(3 sqrt 3), derived by hand)
        assertEquals(Math.sqrt(16.0 / 27.0), crit, MESSAGE_DIGITS);
    }

    @Test
    void seriesParsing() {
        assertEquals(Map.of("c2", 0.5, "c3", -0.1), Spacetimes.parseSeries("2=0.5, 3=-0.1", "--series"));
        assertMessage("--series: term 'x=1' is not of the form k=c_k (k an integer in 1..12, c_k a number)",
                () -> Spacetimes.parseSeries("2=0.5,x=1", "--series"));
        assertMessage("--series: power 2 is given twice", () -> Spacetimes.parseSeries("2=0.5,2=1", "--series"));
        assertMessage("series: power 13 is out of range: k in 1..12",
                () -> Spacetimes.create("mass-series", 0.5, Map.of("c13", 0.1), false));
    }

    private static void assertMessage(String expected, org.junit.jupiter.api.function.Executable ex) {
        UserInputException e = assertThrows(UserInputException.class, ex);
        assertEquals(expected, e.getMessage());
    }
}
