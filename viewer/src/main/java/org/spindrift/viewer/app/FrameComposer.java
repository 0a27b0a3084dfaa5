package org.spindrift.viewer.app;

import static org.lwjgl.opengl.GL33C.*;

import org.spindrift.shared.colour.ColourRamp;
import org.spindrift.viewer.data.RunInfo;
import org.spindrift.viewer.data.SnapshotStream;
import org.spindrift.viewer.gl.FontAtlas;
import org.spindrift.viewer.gl.Overlay;
import org.spindrift.viewer.scene.Palette;
import org.spindrift.viewer.scene.SceneView;
import org.spindrift.viewer.sky.SkyPanel;
import org.spindrift.viewer.ui.Hud;
import org.spindrift.viewer.ui.Layout;

/**
 * Draws one complete frame (3D view, sky panel, title and time bars, help) into the bound
 * framebuffer. Shared by the window, the frame export and the benchmark, so all three show the
 * same picture.
 */
public final class FrameComposer implements AutoCloseable {
    private final RunInfo info;
    private final SceneView scene;
    private final SkyPanel sky;
    private FontAtlas font;
    private final Overlay overlay;
    private final Hud hud;
    private final Layout layout = new Layout();
    private final boolean bare;
    private boolean help;
    private float scale = 1f;
    private boolean profile;
    private long prepareNanos;
    private long sceneNanos;
    private long panelNanos;

    /**
     * @param sky  the sky panel, or null for none
     * @param bare draw the 3D view only, filling the frame (no panels, no text)
     * @param skyColours colour ramp of the sky image
     */
    public FrameComposer(RunInfo info, SnapshotStream stream, SkyPanel sky, boolean bare, ColourRamp skyColours) {
        this.info = info;
        this.bare = bare;
        this.scene = new SceneView(info, stream, skyColours);
        this.sky = sky;
        this.font = new FontAtlas(1f);
        this.overlay = new Overlay(font);
        this.hud = new Hud(info);
        if (!info.sourceNames().isEmpty()) {
            hud.sourceNote("(light from the centre of " + info.sourceNames().get(0) + ")");
        }
    }

    public SceneView scene() {
        return scene;
    }

    public Hud hud() {
        return hud;
    }

    public Layout layout() {
        return layout;
    }

    public FontAtlas font() {
        return font;
    }

    /**
     * Interface scale for a framebuffer: 1 up to 720 pixels high (or 1280 wide), growing in steps
     * of a quarter with the size (1.5 at 1920 x 1080, 2 on a HiDPI 1280 x 720 window), at most 3.
     */
    public static float uiScale(int fbW, int fbH) {
        double s = Math.min(fbH / 720.0, fbW / 1280.0);
        return (float) Math.max(1.0, Math.min(3.0, Math.floor(s * 4 + 0.25) / 4));
    }

    /** @return the interface scale of the last frame (framebuffer pixels per layout pixel) */
    public float scale() {
        return scale;
    }

    public void toggleHelp() {
        help = !help;
    }

    public void help(boolean on) {
        help = on;
    }

    /**
     * Observer time of the light from the first source's centre at emitter time t (flat-space
     * delay, see {@link org.spindrift.viewer.scene.ObserverGeometry#observerTime}); t itself when
     * the run has no sources.
     */
    public double observerTime(Playback p) {
        if (info.sourceNames().isEmpty()) {
            return p.now();
        }
        float[] a = info.centres()[p.index()];
        float[] b = info.centres()[p.next()];
        double m = p.mix();
        double x = a[0] + m * (b[0] - a[0]);
        double y = a[1] + m * (b[1] - a[1]);
        double z = a[2] + m * (b[2] - a[2]);
        return scene.observer().observerTime(p.now(), x, y, z);
    }

    /**
     * Renders the frame for the playback state.
     *
     * @param block wait for the snapshot reader (export, benchmark)
     * @param wallNow wall-clock seconds, for transient messages
     * @return false when the snapshots for this time were not in memory yet (an older pair was shown)
     */
    public boolean render(int fbW, int fbH, Playback p, boolean block, double wallNow) {
        float sc = uiScale(fbW, fbH);
        if (!bare && sc != font.scale()) {
            FontAtlas old = font;
            font = new FontAtlas(sc); // sharp glyphs at the new scale (only when the size class changes)
            overlay.font(font);
            old.close();
        }
        scale = bare ? 1f : sc;
        int vw = Math.max(1, Math.round(fbW / scale));
        int vh = Math.max(1, Math.round(fbH / scale));
        layout.update(vw, vh, bare, sky != null);
        glDisable(GL_SCISSOR_TEST);
        glViewport(0, 0, fbW, fbH);
        glClearColor(((Palette.BACKGROUND >>> 24) & 0xff) / 255f, ((Palette.BACKGROUND >>> 16) & 0xff) / 255f,
                ((Palette.BACKGROUND >>> 8) & 0xff) / 255f, 1f);
        glClear(GL_COLOR_BUFFER_BIT | GL_DEPTH_BUFFER_BIT);
        int a = p.index();
        int b = p.next();
        long t0 = 0;
        if (profile) {
            glFinish();
            t0 = System.nanoTime();
        }
        boolean ready = scene.prepare(a, b, p.direction(), block);
        if (profile) {
            glFinish();
            long t1 = System.nanoTime();
            prepareNanos += t1 - t0;
            t0 = t1;
        }
        int x0 = Math.round(layout.viewX * scale);
        int x1 = bare ? fbW : Math.round((layout.viewX + layout.viewW) * scale);
        int y0 = Math.round(layout.viewY * scale);
        int y1 = bare ? fbH : Math.round((layout.viewY + layout.viewH) * scale);
        scene.draw(x0, fbH - y1, Math.max(1, x1 - x0), Math.max(1, y1 - y0), p.now(), a, b, p.mix());
        if (profile) {
            glFinish();
            sceneNanos += System.nanoTime() - t0;
        }
        if (bare) {
            return ready;
        }
        if (profile) {
            t0 = System.nanoTime();
        }
        glViewport(0, 0, fbW, fbH);
        overlay.begin(vw, vh);
        double tObs = observerTime(p);
        if (sky != null) {
            sky.draw(overlay, scene.maps(), layout.skyX, layout.skyY, layout.skyW, layout.skyH, fbW, fbH, scale, tObs);
        }
        hud.titleBar(overlay, layout, info.particles());
        hud.colourBar(overlay, layout, scene);
        if (scene.ringsShown()) {
            hud.legend(overlay, layout, scene);
        }
        hud.timeBar(overlay, layout, p.now(), tObs, p.fraction(), p.playing(), p.speed(), p.index(), wallNow);
        if (help) {
            hud.help(overlay, layout);
        }
        overlay.flush();
        if (profile) {
            glFinish();
            panelNanos += System.nanoTime() - t0;
        }
        return ready;
    }

    /** Benchmark only: time each part of the frame (with glFinish between parts). */
    public void profile(boolean on) {
        profile = on;
        prepareNanos = 0;
        sceneNanos = 0;
        panelNanos = 0;
    }

    /** @return nanoseconds spent waiting for and uploading snapshots, drawing the 3D view, the panels */
    public long[] profileNanos() {
        return new long[] {prepareNanos, sceneNanos, panelNanos};
    }

    @Override public void close() {
        scene.close();
        overlay.close();
        font.close();
        if (sky != null) {
            sky.close();
        }
    }
}
