package org.spindrift.viewer.scene;

import org.spindrift.shared.colour.ColourRamp;

/**
 * Colours of the viewer (0xRRGGBBAA). Continuous particle maps are five control points interpolated
 * linearly in sRGB: the time dilation samples the shared diverging ramp
 * ({@link ColourRamp#RATIO}), emission and radius are control points of our own choosing; the sky
 * image uses the shared sky ramp directly ({@link ColourMaps}). Sources use the colour-blind-safe
 * qualitative set of Okabe & Ito (2008, "Color Universal Design", values from memory).
 */
public final class Palette {
    private Palette() {
    }

    public static final int BACKGROUND = 0x0b1018ff;
    public static final int PANEL = 0x111823ff;
    public static final int PANEL_EDGE = 0x2a3646ff;
    public static final int TEXT = 0xd8dee9ff;
    public static final int TEXT_DIM = 0x8a96a8ff;
    public static final int ACCENT = 0x7fb8ffff;
    public static final int ISCO = 0xd3dbe4ff;
    public static final int OMEGA_MAX = 0xff5c8aff;
    public static final int ERGO = 0x8693a6ff;
    public static final int GRID = 0x27324080;
    public static final int TRACK = 0x7fd1ffff;

    /** Okabe & Ito (2008) qualitative colours (black omitted: it vanishes on the background). */
    private static final int[] SOURCES = {
        0xe69f00ff, 0x56b4e9ff, 0x009e73ff, 0xf0e442ff, 0x0072b2ff, 0xd55e00ff, 0xcc79a7ff, 0xbbbbbbff};

    /** @return the colour of source k */
    public static int source(int k) {
        return SOURCES[Math.floorMod(k, SOURCES.length)];
    }

    public static int sourceCount() {
        return SOURCES.length;
    }

    /** Control points per quantity map (RGB in 0..1, evenly spaced). */
    private static final float[][][] MAPS = {
        // time dilation: the diverging ratio ramp, blue (< 1) -> light grey (1) -> orange (> 1)
        ramp(ColourRamp.RATIO),
        // emission: indigo -> magenta -> coral -> amber -> pale yellow
        {{0.10f, 0.07f, 0.30f}, {0.45f, 0.10f, 0.50f}, {0.80f, 0.25f, 0.42f}, {0.98f, 0.55f, 0.25f},
         {0.99f, 0.93f, 0.60f}},
        // radius: deep blue -> teal -> green -> yellow-green
        {{0.16f, 0.20f, 0.55f}, {0.13f, 0.45f, 0.62f}, {0.15f, 0.66f, 0.55f}, {0.50f, 0.82f, 0.35f},
         {0.93f, 0.90f, 0.30f}},
        // sky image row: ColourMaps fills it from the chosen ColourRamp (these points only as a fallback)
        ramp(ColourRamp.SKY),
    };

    private static float[][] ramp(ColourRamp r) {
        float[][] c = new float[5][3];
        for (int i = 0; i < 5; i++) {
            int rgb = r.rgb(i / 4.0);
            c[i][0] = (rgb >> 16 & 255) / 255f;
            c[i][1] = (rgb >> 8 & 255) / 255f;
            c[i][2] = (rgb & 255) / 255f;
        }
        return c;
    }

    /** @return the five control points (r, g, b each) of map row as 15 floats, into dest */
    public static void controlPoints(int map, float[] dest) {
        float[][] c = MAPS[map];
        for (int i = 0; i < 5; i++) {
            dest[3 * i] = c[i][0];
            dest[3 * i + 1] = c[i][1];
            dest[3 * i + 2] = c[i][2];
        }
    }

    /** Row of the colour-map texture used for sky images. */
    public static final int SKY_MAP = 3;
    /** Number of rows (maps) in the colour-map texture. */
    public static final int MAP_ROWS = MAPS.length;

    /**
     * @param map row (quantity ordinal, or {@link #SKY_MAP})
     * @param x   position in 0..1
     * @return the colour as 0xRRGGBBAA
     */
    public static int map(int map, double x) {
        float[][] c = MAPS[map];
        double t = Math.max(0, Math.min(1, x)) * (c.length - 1);
        int i = Math.min((int) t, c.length - 2);
        double f = t - i;
        int r = (int) Math.round(255 * (c[i][0] + f * (c[i + 1][0] - c[i][0])));
        int g = (int) Math.round(255 * (c[i][1] + f * (c[i + 1][1] - c[i][1])));
        int b = (int) Math.round(255 * (c[i][2] + f * (c[i + 1][2] - c[i][2])));
        return r << 24 | g << 16 | b << 8 | 0xff;
    }

    /** @return rgba with its alpha replaced */
    public static int alpha(int rgba, int a) {
        return (rgba & 0xffffff00) | (a & 0xff);
    }
}
