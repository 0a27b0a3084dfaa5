package org.spindrift.shared.colour;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The ramps against colour science that does not go through Oklab: CIE 1976 L*a*b* from the
 * sRGB definition (IEC 61966-2-1:1999 transfer function and primaries, D65 white), and the
 * dichromat simulations of Machado, Oliveira &amp; Fernandes 2009 (IEEE TVCG 15, 1291, severity 1;
 * matrices recalled from memory).
 */
class ColourRampTest {
    /** sRGB to XYZ (IEC 61966-2-1), rows X, Y, Z. */
    static final double[][] SRGB_TO_XYZ = {{0.4124, 0.3576, 0.1805}, {0.2126, 0.7152, 0.0722}, {0.0193, 0.1192, 0.9505}};
    static final double[] WHITE = {0.9505, 1.0, 1.089};
    static final double[][] PROTAN = {{0.152286, 1.052583, -0.204868}, {0.114503, 0.786281, 0.099216},
        {-0.003882, -0.048116, 1.051998}};
    static final double[][] DEUTAN = {{0.367322, 0.860646, -0.227968}, {0.280085, 0.672501, 0.047413},
        {-0.011820, 0.042940, 0.968881}};

    /** Inverse sRGB transfer function (IEC 61966-2-1). */
    static double decode(double v) {
        return v <= 0.04045 ? v / 12.92 : Math.pow((v + 0.055) / 1.055, 2.4);
    }

    static double f(double x) {
        return x > 216.0 / 24389 ? Math.cbrt(x) : (24389.0 / 27 * x + 16) / 116;
    }

    /** CIE 1976 L*, a*, b* of a linear sRGB colour, optionally through a dichromat simulation. */
    static double[] lab(double[] lin, double[][] sim) {
        double[] c = lin.clone();
        if (sim != null) {
            for (int i = 0; i < 3; i++) {
                c[i] = Math.max(0, Math.min(1, sim[i][0] * lin[0] + sim[i][1] * lin[1] + sim[i][2] * lin[2]));
            }
        }
        double[] xyz = new double[3];
        for (int i = 0; i < 3; i++) {
            xyz[i] = (SRGB_TO_XYZ[i][0] * c[0] + SRGB_TO_XYZ[i][1] * c[1] + SRGB_TO_XYZ[i][2] * c[2]) / WHITE[i];
        }
        return new double[] {116 * f(xyz[1]) - 16, 500 * (f(xyz[0]) - f(xyz[1])), 200 * (f(xyz[1]) - f(xyz[2]))};
    }

    static double[] linear(ColourRamp r, double t) {
        double[] s = new double[3];
        r.srgb(t, s);
        return new double[] {decode(s[0]), decode(s[1]), decode(s[2])};
    }

    static double[] linear8(int rgb) {
        return new double[] {decode((rgb >> 16 & 255) / 255.0), decode((rgb >> 8 & 255) / 255.0), decode((rgb & 255) / 255.0)};
    }

    @Test void oklabWhiteIsSrgbWhite() {
        // Ottosson 2020: L = 1, a = b = 0 is the D65 white, linear sRGB (1, 1, 1)
        double[] out = new double[3];
        Oklab.toLinearSrgb(1, 0, 0, out);
        for (double v : out) {
            assertEquals(1.0, v, 1e-9);
        }
    }

    @Test void sequentialRampsRiseInLightnessEvenlyForEveryViewer() {
        for (ColourRamp r : new ColourRamp[] {ColourRamp.SKY, ColourRamp.GREY}) {
            for (double[][] sim : new double[][][] {null, PROTAN, DEUTAN}) {
                double prev = -1;
                double minStep = Double.MAX_VALUE;
                double maxStep = 0;
                int n = 40;
                for (int i = 0; i <= n; i++) {
                    double l = lab(linear(r, i / (double) n), sim)[0];
                    if (i > 0) {
                        assertTrue(l > prev, r + " L* rises at t = " + i / (double) n + " (" + prev + " -> " + l + ")");
                        minStep = Math.min(minStep, l - prev);
                        maxStep = Math.max(maxStep, l - prev);
                    }
                    prev = l;
                }
                if (sim == null) {
                    // perceptually even: CIE L* steps equal within a factor 1.5 (common practice, no source)
                    assertTrue(maxStep < 1.5 * minStep, r + " steps " + minStep + " .. " + maxStep);
                }
            }
            // the 8-bit table keeps the order too
            double prev = -1;
            for (int i = 0; i <= 32; i++) {
                double l = lab(linear8(r.rgb(i / 32.0)), null)[0];
                assertTrue(l > prev, r + " table at " + i);
                prev = l;
            }
        }
        double[] dark = lab(linear(ColourRamp.SKY, 0), null);
        double[] light = lab(linear(ColourRamp.SKY, 1), null);
        assertTrue(dark[0] < 15 && light[0] > 92, "dark to near white: " + dark[0] + " .. " + light[0]);
        // not grey: the ends are blue (b* < 0) and yellowish (b* > 0)
        assertTrue(dark[2] < -15 && light[2] > 15, "blue to yellow: " + dark[2] + ", " + light[2]);
    }

    @Test void skyRampHueMovesAlongBlueYellowNotRedGreen() {
        // spread of a* (red-green) is well below that of b* (blue-yellow) along the ramp
        double aLo = 1e9;
        double aHi = -1e9;
        double bLo = 1e9;
        double bHi = -1e9;
        for (int i = 0; i <= 20; i++) {
            double[] c = lab(linear(ColourRamp.SKY, i / 20.0), null);
            aLo = Math.min(aLo, c[1]);
            aHi = Math.max(aHi, c[1]);
            bLo = Math.min(bLo, c[2]);
            bHi = Math.max(bHi, c[2]);
        }
        assertTrue(aHi - aLo < 0.5 * (bHi - bLo), "a* spread " + (aHi - aLo) + ", b* spread " + (bHi - bLo));
    }

    @Test void divergingRampIsSymmetricInLightnessAndItsSidesStayApartForDichromats() {
        double centre = lab(linear(ColourRamp.RATIO, 0.5), null)[0];
        for (int i = 0; i < 10; i++) {
            double t = i / 20.0;
            double[] lo = lab(linear(ColourRamp.RATIO, t), null);
            double[] hi = lab(linear(ColourRamp.RATIO, 1 - t), null);
            assertTrue(lo[0] < centre && hi[0] < centre, "lightest at the centre, t = " + t);
            assertEquals(lo[0], hi[0], 4.0, "equal lightness at equal distance from 1, t = " + t);
            for (double[][] sim : new double[][][] {null, PROTAN, DEUTAN}) {
                double[] a = lab(linear(ColourRamp.RATIO, t), sim);
                double[] b = lab(linear(ColourRamp.RATIO, 1 - t), sim);
                double de = Math.sqrt(Math.pow(a[0] - b[0], 2) + Math.pow(a[1] - b[1], 2) + Math.pow(a[2] - b[2], 2));
                // CIE76 difference between the two sides: clearly visible (> 10) from t = 0.3 outwards
                if (t <= 0.3) {
                    assertTrue(de > 10, "sides apart at t = " + t + (sim == null ? "" : " (dichromat)") + ": " + de);
                }
            }
        }
    }

    @Test void skyOptionNames() {
        assertEquals(ColourRamp.SKY, ColourRamp.skyOption("default"));
        assertEquals(ColourRamp.GREY, ColourRamp.skyOption("grey"));
        assertNull(ColourRamp.skyOption("heat"));
    }
}
