package org.spindrift.shared.colour;

/**
 * The Oklab colour space (Ottosson 2020, "A perceptual color space for image processing",
 * bottosson.github.io/posts/oklab; matrices recalled from memory, checked in the tests by white
 * mapping to white and by an independent lightness formula): L is perceived lightness (0 black,
 * 1 white), a the green-red and b the blue-yellow opponent axis.
 */
public final class Oklab {
    private Oklab() {
    }

    /**
     * Oklab to linear-light sRGB (D65). Components outside [0, 1] mean the colour is outside the
     * sRGB gamut.
     *
     * @param out receives linear R, G, B
     */
    public static void toLinearSrgb(double lightness, double a, double b, double[] out) {
        // Ottosson 2020: M2^-1 then cube then M1^-1
        double l = lightness + 0.3963377774 * a + 0.2158037573 * b;
        double m = lightness - 0.1055613458 * a - 0.0638541728 * b;
        double s = lightness - 0.0894841775 * a - 1.2914855480 * b;
        l = l * l * l;
        m = m * m * m;
        s = s * s * s;
        out[0] = 4.0767416621 * l - 3.3077115913 * m + 0.2309699292 * s;
        out[1] = -1.2684380046 * l + 2.6097574011 * m - 0.3413193965 * s;
        out[2] = -0.0041960863 * l - 0.7034186147 * m + 1.7076147010 * s;
    }

    /** @return the sRGB transfer function (IEC 61966-2-1:1999) applied to a linear value in [0, 1] */
    public static double encodeSrgb(double linear) {
        double c = Math.max(0.0, Math.min(1.0, linear));
        return c <= 0.0031308 ? 12.92 * c : 1.055 * Math.pow(c, 1.0 / 2.4) - 0.055;
    }
}
