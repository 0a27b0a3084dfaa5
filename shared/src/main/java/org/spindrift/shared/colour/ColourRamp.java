package org.spindrift.shared.colour;

import java.util.Locale;

/**
 * The project's colour ramps, built by us as paths in the Oklab space ({@link Oklab}) and shared
 * by the plots of a run and the viewer (one definition). Each ramp maps t in [0, 1] to a colour:
 * <ul>
 *   <li>{@link #SKY} (sequential; sky images): lightness rises linearly from L = 0.21 (dark
 *       indigo) to 0.96 (near white), so equal steps of intensity look like equal steps of
 *       brightness and the order survives greyscale printing and every form of colour
 *       blindness. The hue moves from indigo through a muted mauve and peach to cream: the
 *       chroma lies mainly on the blue-yellow axis b (from -0.125 to +0.100), which dichromats
 *       still see, and only weakly on the red-green axis a (between -0.015 and +0.05), the axis
 *       that protan and deutan viewers confuse. Path:
 *       L = 0.21 + 0.75 t, a = 0.02 + 0.045 sin(pi t) - 0.035 t, b = -0.125 + 0.225 t.</li>
 *   <li>{@link #GREY} (sequential): L = 0.21 + 0.79 t with a = b = 0 (perceptually even greys,
 *       dark grey to white).</li>
 *   <li>{@link #RATIO} (diverging; ratios centred on 1 at t = 1/2): light neutral grey
 *       (L = 0.95) at the centre, darkening symmetrically (L = 0.95 - 0.5 |2t - 1|) to a blue end
 *       (t = 0: a = -0.02, b = -0.15) and an orange-brown end (t = 1: a = 0.06, b = 0.12);
 *       blue against orange is again mainly the blue-yellow axis.</li>
 * </ul>
 * Where a path point lies outside the sRGB gamut its chroma (a, b) is scaled down by bisection
 * until it fits, keeping L, so lightness stays exactly as designed. The sequential ramps start at
 * L = 0.21 rather than 0: below about L = 0.206 (luminance Y &lt; 0.0089) CIE lightness L* has its
 * linear toe and equal steps of L would no longer look equal. Colours are tabulated at
 * {@value #TABLE} points on first use.
 */
public enum ColourRamp {
    /** Sequential ramp for sky images (the default). */
    SKY("default"),
    /** Perceptually even greys. */
    GREY("grey"),
    /** Diverging ramp for ratios, centre (t = 1/2) at a ratio of 1. */
    RATIO("ratio");

    /** Points of the table. */
    public static final int TABLE = 1024;

    private final String key;
    private volatile int[] table;

    ColourRamp(String key) {
        this.key = key;
    }

    /** @return the name used on the command line and in scenario files */
    public String key() {
        return key;
    }

    /** @return the sky ramp named on the command line or in a scenario ({@code default} or {@code grey}), or null */
    public static ColourRamp skyOption(String name) {
        String n = name == null ? "" : name.toLowerCase(Locale.ROOT);
        return switch (n) {
            case "default" -> SKY;
            case "grey", "gray" -> GREY;
            default -> null;
        };
    }

    /**
     * The designed path before the gamut fit.
     *
     * @param out receives L, a, b
     */
    public void path(double t, double[] out) {
        double x = Math.max(0.0, Math.min(1.0, t));
        switch (this) {
            case SKY -> {
                out[0] = 0.21 + 0.75 * x;
                out[1] = 0.02 + 0.045 * Math.sin(Math.PI * x) - 0.035 * x;
                out[2] = -0.125 + 0.225 * x;
            }
            case GREY -> {
                out[0] = 0.21 + 0.79 * x;
                out[1] = 0.0;
                out[2] = 0.0;
            }
            default -> {
                double u = 2.0 * x - 1.0;
                double w = Math.abs(u);
                out[0] = 0.95 - 0.5 * w;
                out[1] = u < 0 ? -0.02 * w : 0.06 * w;
                out[2] = u < 0 ? -0.15 * w : 0.12 * w;
            }
        }
    }

    /**
     * The colour at t as encoded sRGB components in [0, 1] (exact path, gamut-fitted; not the
     * table).
     *
     * @param out receives R, G, B
     */
    public void srgb(double t, double[] out) {
        double[] lab = new double[3];
        path(t, lab);
        double[] lin = new double[3];
        double k = 1.0;
        Oklab.toLinearSrgb(lab[0], lab[1], lab[2], lin);
        if (!inGamut(lin)) {
            double lo = 0.0;
            double hi = 1.0;
            for (int i = 0; i < 40; i++) {
                double mid = 0.5 * (lo + hi);
                Oklab.toLinearSrgb(lab[0], mid * lab[1], mid * lab[2], lin);
                if (inGamut(lin)) {
                    lo = mid;
                } else {
                    hi = mid;
                }
            }
            k = lo;
            Oklab.toLinearSrgb(lab[0], k * lab[1], k * lab[2], lin);
        }
        for (int c = 0; c < 3; c++) {
            out[c] = Oklab.encodeSrgb(lin[c]);
        }
    }

    private static boolean inGamut(double[] lin) {
        for (double v : lin) {
            if (v < -1e-12 || v > 1.0 + 1e-12) {
                return false;
            }
        }
        return true;
    }

    /** @return the colour at t (clamped to [0, 1]) as 0xRRGGBB, from the table */
    public int rgb(double t) {
        int[] tab = table;
        if (tab == null) {
            tab = build();
        }
        double x = Double.isNaN(t) ? 0.0 : Math.max(0.0, Math.min(1.0, t));
        return tab[(int) Math.round(x * (TABLE - 1))];
    }

    private synchronized int[] build() {
        if (table == null) {
            int[] tab = new int[TABLE];
            double[] c = new double[3];
            for (int i = 0; i < TABLE; i++) {
                srgb(i / (TABLE - 1.0), c);
                tab[i] = (int) Math.round(255 * c[0]) << 16 | (int) Math.round(255 * c[1]) << 8
                        | (int) Math.round(255 * c[2]);
            }
            table = tab;
        }
        return table;
    }
}
