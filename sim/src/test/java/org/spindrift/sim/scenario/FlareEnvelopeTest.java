package org.spindrift.sim.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.hipparchus.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.Test;
import org.spindrift.shared.Units;
import org.spindrift.shared.scenario.Flare;
import org.spindrift.shared.scenario.TimeSpan;

/**
 * The flare envelope against its documented closed forms (configs/README: Gaussian
 * f = exp(-(t - peak)^2 / (2 width^2)); exponential exp((t - peak)/rise) before the peak,
 * exp(-(t - peak)/decay) after) and their integrals by Hipparchus quadrature.
 */
class FlareEnvelopeTest {
    /** Closed forms in double precision. */
    private static final double EXACT = 1e-14;
    /** Legendre-Gauss quadrature held to 1e-12 relative. */
    private static final double QUADRATURE = 1e-10;
    /** GM/c^3 quoted to ten digits: 600 s / 4.925490947 s is known to about 1e-8 M. */
    private static final double QUOTED_DIGITS = 1e-6;
    /** GM/c^3 of a synthetic 1e6 solar-mass hole, s: 4.925 s (IAU 2015 GM_sun, c exact). */
    private static final double SECONDS_PER_M = Units.timeUnitSeconds(1e6);

    private static double integral(FlareEnvelope f, double a, double b) {
        return new IterativeLegendreGaussIntegrator(8, 1e-12, 1e-14).integrate(10_000_000, f::at, a, b);
    }

    @Test
    void constantIsOne() {
        FlareEnvelope f = new FlareEnvelope(new Flare.Constant(), SECONDS_PER_M);
        for (double t : new double[] {-1e6, 0, 3.5, 1e9}) {
            assertEquals(1.0, f.at(t), 0.0);
        }
    }

    @Test
    void gaussianHasPeakOneFwhmAndArea() {
        double peak = 300.0;
        double width = 40.0;
        FlareEnvelope f = new FlareEnvelope(new Flare.Gaussian(TimeSpan.geometric(peak), TimeSpan.geometric(width)),
                SECONDS_PER_M);
        assertEquals(1.0, f.at(peak), EXACT);
        assertEquals(Math.exp(-0.5), f.at(peak + width), EXACT);
        assertEquals(f.at(peak - 17.0), f.at(peak + 17.0), EXACT, "symmetric about the peak");
        // half maximum at peak +- sqrt(2 ln 2) width: FWHM = 2 sqrt(2 ln 2) sigma (common practice)
        double halfWidth = Math.sqrt(2 * Math.log(2)) * width;
        assertEquals(0.5, f.at(peak + halfWidth), EXACT);
        assertEquals(0.5, f.at(peak - halfWidth), EXACT);
        // area sigma sqrt(2 pi) (Gaussian integral); 12 sigma each side leave less than 1e-30
        assertEquals(width * Math.sqrt(2 * Math.PI), integral(f, peak - 12 * width, peak + 12 * width),
                QUADRATURE * width);
    }

    @Test
    void gaussianInMinutesUsesGmOverCCubed() {
        // 10 min peak, 3 min width around a 1e6 solar-mass hole: t = 600 s / (GM/c^3)
        FlareEnvelope f = new FlareEnvelope(new Flare.Gaussian(TimeSpan.minutes(10), TimeSpan.minutes(3)),
                SECONDS_PER_M);
        double peakM = 600.0 / SECONDS_PER_M;
        double widthM = 180.0 / SECONDS_PER_M;
        // GM_sun / c^3 = 4.925490947e-6 s (from memory; IAU 2015 nominal GM_sun): 121.8 M for 10 min
        assertEquals(600.0 / 4.925490947, peakM, QUOTED_DIGITS);
        assertEquals(1.0, f.at(peakM), EXACT);
        assertEquals(Math.exp(-0.5), f.at(peakM - widthM), EXACT);
    }

    @Test
    void exponentialRisesAndDecaysByEFoldingTimesWithAreaRisePlusDecay() {
        double peak = 100.0;
        double rise = 5.0;
        double decay = 30.0;
        FlareEnvelope f = new FlareEnvelope(new Flare.Exponential(TimeSpan.geometric(peak), TimeSpan.geometric(rise),
                TimeSpan.geometric(decay)), SECONDS_PER_M);
        assertEquals(1.0, f.at(peak), EXACT);
        assertEquals(Math.exp(-1), f.at(peak - rise), EXACT, "one e-folding of the rise");
        assertEquals(Math.exp(-1), f.at(peak + decay), EXACT, "one e-folding of the decay");
        assertEquals(Math.exp(-2), f.at(peak + 2 * decay), EXACT);
        // continuous at the peak: one ulp before it, exp(-ulp(peak) / rise) = 1 - 3e-15
        assertEquals(1.0, f.at(Math.nextDown(peak)), EXACT);
        // area: integral of exp(x/rise) over x < 0 plus exp(-x/decay) over x > 0 = rise + decay,
        // integrated on each side (the kink at the peak) to 40 e-foldings
        double area = integral(f, peak - 40 * rise, peak) + integral(f, peak, peak + 40 * decay);
        assertEquals(rise + decay, area, QUADRATURE * (rise + decay));
    }
}
