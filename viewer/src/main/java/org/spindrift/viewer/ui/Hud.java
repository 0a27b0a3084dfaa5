package org.spindrift.viewer.ui;

import org.spindrift.viewer.data.Landmarks;
import org.spindrift.viewer.data.RunInfo;
import org.spindrift.viewer.gl.FontAtlas;
import org.spindrift.viewer.gl.Overlay;
import org.spindrift.viewer.scene.ColourRanges;
import org.spindrift.viewer.scene.Palette;
import org.spindrift.viewer.scene.Quantity;
import org.spindrift.viewer.scene.SceneView;

/**
 * Text and 2D furniture around the 3D view: title bar, colour bar of the colouring quantity,
 * legend of the landmark circles, time bar with the scrub slider, the key help and short
 * messages. Everything is drawn through the {@link Overlay} batch with reused {@link Text}
 * buffers, so a frame allocates nothing.
 */
public final class Hud {
    /** Key help, two columns: key, action. */
    public static final String[][] KEYS = {
        {"Space", "play / pause"},
        {"Right / Left", "step one snapshot (pauses)"},
        {"Up / Down  or  + / -", "faster / slower"},
        {"Home / End", "first / last snapshot"},
        {"C", "cycle colouring: time dilation, emission, radius, source"},
        {"O", "observer's line of sight"},
        {"F", "face-on (from +z)"},
        {"R", "reset the camera"},
        {"[  ]", "smaller / larger particles"},
        {"G / L / T", "grid / landmark circles / trails on or off"},
        {"P  or  F12", "screenshot (PNG in the current folder)"},
        {"H  or  F1", "this help"},
        {"Esc  or  Q", "quit"},
        {"mouse: left drag", "orbit"},
        {"right drag, shift + left", "pan"},
        {"wheel", "zoom"},
        {"click / drag the time bar", "scrub"},
    };

    private final RunInfo info;
    private final Text t1 = new Text();
    private final Text t2 = new Text();
    private final Text t3 = new Text();
    private String message = "";
    private double messageUntil;
    private String sourceNote = "";

    public Hud(RunInfo info) {
        this.info = info;
    }

    /** Shows a short message (screenshot saved, ...) until the given wall time, seconds. */
    public void message(String m, double until) {
        message = m;
        messageUntil = until;
    }

    /** @return whether a message is on screen at wall time now (seconds) */
    public boolean messageShown(double now) {
        return !message.isEmpty() && now < messageUntil + 0.1;
    }

    /** Sets the note on how the observer time is derived (which source centre). */
    public void sourceNote(String note) {
        sourceNote = note;
    }

    public void titleBar(Overlay o, Layout l, int particles) {
        o.rect(0, 0, l.width, Layout.TOP, Palette.PANEL);
        o.rect(0, Layout.TOP - 1, l.width, 1, Palette.PANEL_EDGE);
        float x = o.text(12, 6, "Spindrift replay", FontAtlas.Size.LARGE, Palette.ACCENT);
        t1.clear().add("  \u00b7  ").add(info.title());
        o.text(x, 6, t1, FontAtlas.Size.LARGE, Palette.TEXT);
        t2.clear().add("a = ").fixed(info.landmarks().spin(), 3).add("   i = ").fixed(info.inclinationDeg(), 1)
                .add("\u00b0   PA = ").fixed(info.positionAngleDeg(), 1).add("\u00b0   ").add(particles)
                .add(" particles   ").add(info.snapshots()).add(" snapshots");
        o.textRight(l.width - 12, 9, t2, FontAtlas.Size.SMALL, Palette.TEXT_DIM);
    }

    /** Colour bar (or the source list) at the top left of the 3D view. */
    public void colourBar(Overlay o, Layout l, SceneView scene) {
        Quantity q = scene.quantity();
        ColourRanges r = scene.ranges();
        FontAtlas f = o.font();
        float lh = f.lineHeight(FontAtlas.Size.SMALL);
        float x = l.viewX + 14;
        float y = l.viewY + 12;
        t1.clear().add("colour: ").add(q.label());
        if (q == Quantity.SOURCE) {
            float w = f.width(t1, FontAtlas.Size.SMALL) + 20;
            for (String n : info.sourceNames()) {
                w = Math.max(w, f.width(n, FontAtlas.Size.SMALL) + 40);
            }
            float h = lh * (1 + info.sourceNames().size()) + 12;
            o.rect(x - 6, y - 4, w, h, 0x111823c8);
            o.text(x, y, t1, FontAtlas.Size.SMALL, Palette.TEXT);
            for (int k = 0; k < info.sourceNames().size(); k++) {
                float yy = y + lh * (k + 1) + 4;
                o.rect(x, yy + 3, 12, 10, Palette.source(k));
                o.text(x + 20, yy, info.sourceNames().get(k), FontAtlas.Size.SMALL, Palette.TEXT);
            }
            return;
        }
        float barW = 200;
        float barH = 12;
        float w = Math.max(barW, f.width(t1, FontAtlas.Size.SMALL)) + 16;
        o.rect(x - 6, y - 4, w, lh * 2 + barH + 16, 0x111823c8);
        o.text(x, y, t1, FontAtlas.Size.SMALL, Palette.TEXT);
        float by = y + lh + 4;
        int segments = 40;
        for (int i = 0; i < segments; i++) {
            int c0 = Palette.map(q.ordinal(), i / (double) segments);
            int c1 = Palette.map(q.ordinal(), (i + 1) / (double) segments);
            o.hgradient(x + barW * i / segments, by, barW / segments + 0.5f, barH, c0, c1);
        }
        o.frame(x - 1, by - 1, barW + 2, barH + 2, Palette.PANEL_EDGE);
        float lo = r.lo(q);
        float hi = r.hi(q);
        t2.clear().sig3(lo);
        o.text(x, by + barH + 3, t2, FontAtlas.Size.SMALL, Palette.TEXT_DIM);
        t2.clear().sig3(0.5 * (lo + hi));
        o.textCentred(x + barW / 2, by + barH + 3, t2, FontAtlas.Size.SMALL, Palette.TEXT_DIM);
        t2.clear().sig3(hi);
        if (!q.unit().isEmpty()) {
            t2.add(' ').add(q.unit());
        }
        o.textRight(x + barW, by + barH + 3, t2, FontAtlas.Size.SMALL, Palette.TEXT_DIM);
    }

    /** Legend of the fixed geometry at the bottom left of the 3D view. */
    public void legend(Overlay o, Layout l, SceneView scene) {
        Landmarks lm = info.landmarks();
        FontAtlas f = o.font();
        float lh = f.lineHeight(FontAtlas.Size.SMALL);
        int rows = 2;
        rows += Double.isFinite(lm.ergoEquatorial()) ? 1 : 0;
        rows += Double.isFinite(lm.isco()) ? 1 : 0;
        rows += Double.isFinite(lm.omegaMax()) ? 1 : 0;
        rows += info.sourceNames().isEmpty() ? 0 : 1;
        float x = l.viewX + 14;
        float y = l.viewY + l.viewH - 12 - rows * lh;
        t1.clear().add("equatorial grid: circles every ").num(scene.gridStep()).add(" M");
        float textW = f.width(t1, FontAtlas.Size.SMALL);
        if (Double.isFinite(lm.omegaMax())) {
            t1.clear().add("maximum of Omega(r)  r = ").fixed(lm.omegaMax(), 3).add(" M");
            textW = Math.max(textW, f.width(t1, FontAtlas.Size.SMALL));
        }
        if (Double.isFinite(lm.ergoEquatorial())) {
            t1.clear().add("ergosurface (equator)  r = ").fixed(lm.ergoEquatorial(), 3).add(" M");
            textW = Math.max(textW, f.width(t1, FontAtlas.Size.SMALL));
        }
        float boxW = Math.max(200, textW + 40);
        o.rect(x - 6, y - 6, boxW, rows * lh + 10, 0x111823c8);
        double rc = lm.centralRadius();
        boolean horizon = lm.horizon() > 0;
        t1.clear().add(horizon ? "horizon  r = " : "surface  r = ").fixed(rc, 3).add(" M");
        swatchDisc(o, x, y, lh, horizon ? 0x000000ff : 0x1a1714ff, horizon ? 0x3a4d6cff : 0x73604dff);
        o.text(x + 26, y, Double.isFinite(rc) ? t1 : "no horizon or surface given", FontAtlas.Size.SMALL, Palette.TEXT);
        y += lh;
        if (Double.isFinite(lm.ergoEquatorial())) {
            swatchLine(o, x, y, lh, Palette.ERGO, true);
            t1.clear().add("ergosurface (equator)  r = ").fixed(lm.ergoEquatorial(), 3).add(" M");
            o.text(x + 26, y, t1, FontAtlas.Size.SMALL, Palette.TEXT);
            y += lh;
        }
        if (Double.isFinite(lm.isco())) {
            swatchLine(o, x, y, lh, Palette.ISCO, false);
            t1.clear().add("ISCO (prograde)  r = ").fixed(lm.isco(), 3).add(" M");
            o.text(x + 26, y, t1, FontAtlas.Size.SMALL, Palette.TEXT);
            y += lh;
        }
        if (Double.isFinite(lm.omegaMax())) {
            swatchLine(o, x, y, lh, Palette.OMEGA_MAX, true);
            t1.clear().add("maximum of Omega(r)  r = ").fixed(lm.omegaMax(), 3).add(" M");
            o.text(x + 26, y, t1, FontAtlas.Size.SMALL, Palette.TEXT);
            y += lh;
        }
        if (!info.sourceNames().isEmpty()) {
            swatchLine(o, x, y, lh, Palette.source(0), false);
            o.text(x + 26, y, "path of each source's centre", FontAtlas.Size.SMALL, Palette.TEXT);
            y += lh;
        }
        swatchLine(o, x, y, lh, 0x3a4658ff, false);
        t1.clear().add("equatorial grid: circles every ").num(scene.gridStep()).add(" M");
        o.text(x + 26, y, t1, FontAtlas.Size.SMALL, Palette.TEXT_DIM);
    }

    private static void swatchLine(Overlay o, float x, float y, float lh, int c, boolean dashed) {
        float yy = y + lh / 2;
        if (dashed) {
            o.rect(x, yy - 1, 6, 2, c);
            o.rect(x + 10, yy - 1, 6, 2, c);
        } else {
            o.rect(x, yy - 1, 18, 2, c);
        }
    }

    private static void swatchDisc(Overlay o, float x, float y, float lh, int fill, int rim) {
        float yy = y + lh / 2;
        o.disc(x + 9, yy, 7, rim);
        o.disc(x + 9, yy, 5.5f, fill);
    }

    /**
     * The time bar with the slider.
     *
     * @param tObs observer time shown in the sky panel, M (NaN to hide)
     */
    public void timeBar(Overlay o, Layout l, double tEmit, double tObs, double fraction, boolean playing,
                       double speed, int snapshot, double wallNow) {
        int y0 = l.height - Layout.BOTTOM;
        o.rect(0, y0, l.width, Layout.BOTTOM, Palette.PANEL);
        o.rect(0, y0, l.width, 1, Palette.PANEL_EDGE);
        FontAtlas f = o.font();
        // play / pause symbol
        float px = 16;
        float py = y0 + 12;
        if (playing) {
            o.rect(px, py, 5, 16, Palette.TEXT);
            o.rect(px + 9, py, 5, 16, Palette.TEXT);
        } else {
            for (int i = 0; i < 16; i++) {
                float hw = (i < 8 ? i : 15 - i) + 1;
                o.rect(px, py + i, hw * 1.6f, 1, Palette.TEXT);
            }
        }
        // slider
        float sx = sliderX0();
        float sw = sliderWidth(l);
        float sy = y0 + 20;
        o.rect(sx, sy - 2, sw, 4, 0x2a3646ff);
        o.rect(sx, sy - 2, (float) (sw * fraction), 4, Palette.ACCENT);
        float kx = (float) (sx + sw * fraction);
        o.rect(kx - 5, sy - 8, 10, 16, 0xe6edf5ff);
        // times: emitter | observer (with its note if there is room) ... snapshot and speed on the right
        t1.clear().add("emitter time  t = ").fixed(tEmit, 1).add(" M  (").fixed(info.minutes(tEmit), 2).add(" min)");
        o.text(sx, y0 + 34, t1, FontAtlas.Size.SMALL, Palette.TEXT);
        float ox = sx + Math.max(330, f.width(t1, FontAtlas.Size.SMALL) + 30);
        t3.clear().add("snapshot ").add(snapshot + 1).add('/').add(info.snapshots()).add("   speed ").sig3(speed)
                .add(" M/s   H: help");
        float rightW = f.width(t3, FontAtlas.Size.SMALL);
        float room = l.width - 14 - rightW - 20 - ox;
        if (Double.isFinite(tObs)) {
            t2.clear().add("observer time  t = ").fixed(tObs, 1).add(" M  (").fixed(info.minutes(tObs), 2).add(" min)");
            float base = f.width(t2, FontAtlas.Size.SMALL);
            if (!sourceNote.isEmpty() && base + f.width(sourceNote, FontAtlas.Size.SMALL) + 10 <= room) {
                t2.add("  ").add(sourceNote);
            }
            if (ox + base > l.width - 14) {
                ox = sx; // very narrow window: observer time on its own line
                o.text(ox, y0 + 34 + f.lineHeight(FontAtlas.Size.SMALL), t2, FontAtlas.Size.SMALL, Palette.TEXT);
            } else {
                o.text(ox, y0 + 34, t2, FontAtlas.Size.SMALL, Palette.TEXT);
            }
            room -= base;
        }
        float ry = room >= 0 ? y0 + 34 : y0 + 34 + f.lineHeight(FontAtlas.Size.SMALL);
        o.textRight(l.width - 14, ry, t3, FontAtlas.Size.SMALL, Palette.TEXT_DIM);
        if (!message.isEmpty() && wallNow < messageUntil) {
            float w = f.width(message, FontAtlas.Size.SMALL) + 24;
            float mx = l.viewX + (l.viewW - w) / 2;
            float my = l.viewY + 14;
            o.rect(mx, my, w, f.lineHeight(FontAtlas.Size.SMALL) + 10, 0x1d2a3af0);
            o.text(mx + 12, my + 5, message, FontAtlas.Size.SMALL, Palette.TEXT);
        }
    }

    /** @return the slider's left end, pixels */
    public static float sliderX0() {
        return 48;
    }

    /** @return the slider's width for the layout, pixels */
    public static float sliderWidth(Layout l) {
        return Math.max(50, l.width - sliderX0() - 20);
    }

    /** @return true if (x, y) (pixels, top-left origin) is on the time bar's slider band */
    public static boolean onSlider(Layout l, double x, double y) {
        int y0 = l.height - Layout.BOTTOM;
        return y >= y0 + 6 && y <= y0 + 32 && x >= sliderX0() - 8 && x <= sliderX0() + sliderWidth(l) + 8;
    }

    /** The key help, centred on the 3D view. */
    public void help(Overlay o, Layout l) {
        FontAtlas f = o.font();
        float lh = f.lineHeight(FontAtlas.Size.SMALL) + 2;
        float keyW = 0;
        float actW = 0;
        for (String[] k : KEYS) {
            keyW = Math.max(keyW, f.width(k[0], FontAtlas.Size.SMALL));
            actW = Math.max(actW, f.width(k[1], FontAtlas.Size.SMALL));
        }
        float w = keyW + actW + 60;
        float h = lh * KEYS.length + 56;
        float x = l.viewX + (l.viewW - w) / 2;
        float y = l.viewY + (l.viewH - h) / 2;
        o.rect(x, y, w, h, 0x0d131cf2);
        o.frame(x, y, w, h, Palette.PANEL_EDGE);
        o.text(x + 20, y + 12, "Keys and mouse", FontAtlas.Size.LARGE, Palette.ACCENT);
        float yy = y + 44;
        for (String[] k : KEYS) {
            o.text(x + 20, yy, k[0], FontAtlas.Size.SMALL, Palette.ACCENT);
            o.text(x + 40 + keyW, yy, k[1], FontAtlas.Size.SMALL, Palette.TEXT);
            yy += lh;
        }
    }
}
