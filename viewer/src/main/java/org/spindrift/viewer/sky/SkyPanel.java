package org.spindrift.viewer.sky;

import static org.lwjgl.opengl.GL33C.*;

import java.nio.FloatBuffer;
import org.lwjgl.system.MemoryUtil;
import org.spindrift.viewer.gl.FontAtlas;
import org.spindrift.viewer.gl.Overlay;
import org.spindrift.viewer.gl.Shader;
import org.spindrift.viewer.gl.VertexArray;
import org.spindrift.viewer.scene.ColourMaps;
import org.spindrift.viewer.scene.Palette;
import org.spindrift.viewer.ui.Text;

/**
 * The sky panel: the image frame at the current observer time (when the run has images.fits),
 * the centroid track up to that time, north up and east left, with a scale bar in micro-arcseconds
 * and a compass. Sky x points east, y north, so a point (x, y) is drawn at
 * screen (cx - x s, cy - y s).
 */
public final class SkyPanel implements AutoCloseable {
    private final ImageCube cube;
    private final CentroidTrack track;
    private final double halfWidth; // micro-arcseconds from the centre to the panel's edge
    private final Text text = new Text();
    private final double minutesPerM;
    private Shader shader;
    private int texture;
    private VertexArray quad;
    private FloatBuffer frame;
    private int loadedFrame = -1;
    private int uRect;
    private int uViewport;
    private int uUv;
    private int uImage;
    private int uMaps;
    private int uMax;
    private int uRow;

    /**
     * Either data argument may be null (file absent).
     *
     * @param minutesPerM minutes per M of time, for labels
     */
    public SkyPanel(ImageCube cube, CentroidTrack track, double minutesPerM) {
        this.minutesPerM = minutesPerM;
        this.cube = cube;
        this.track = track;
        double hw = 0;
        if (cube != null) {
            double left = Math.abs((0.5 - cube.crpix1()) * cube.cdelt1());
            double right = Math.abs((cube.width() + 0.5 - cube.crpix1()) * cube.cdelt1());
            double bottom = Math.abs((0.5 - cube.crpix2()) * cube.cdelt2());
            double top = Math.abs((cube.height() + 0.5 - cube.crpix2()) * cube.cdelt2());
            hw = Math.max(Math.max(left, right), Math.max(bottom, top));
        } else if (track != null) {
            hw = Math.max(track.maxOffset() * 1.25, 1e-6);
        }
        halfWidth = hw > 0 ? hw : 1;
        if (cube != null) {
            shader = new Shader("image");
            uRect = shader.uniform("u_rect");
            uViewport = shader.uniform("u_viewport");
            uUv = shader.uniform("u_uv");
            uImage = shader.uniform("u_image");
            uMaps = shader.uniform("u_maps");
            uMax = shader.uniform("u_max");
            uRow = shader.uniform("u_row");
            texture = glGenTextures();
            glBindTexture(GL_TEXTURE_2D, texture);
            glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_MIN_FILTER, GL_LINEAR);
            glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_MAG_FILTER, GL_NEAREST);
            glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_WRAP_S, GL_CLAMP_TO_EDGE);
            glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_WRAP_T, GL_CLAMP_TO_EDGE);
            glTexImage2D(GL_TEXTURE_2D, 0, GL_R32F, cube.width(), cube.height(), 0, GL_RED, GL_FLOAT, (FloatBuffer) null);
            frame = MemoryUtil.memAllocFloat(cube.width() * cube.height());
            FloatBuffer unit = MemoryUtil.memAllocFloat(12).put(new float[] {0, 0, 1, 0, 1, 1, 0, 0, 1, 1, 0, 1}).flip();
            quad = VertexArray.of(unit, GL_STATIC_DRAW, 2);
            MemoryUtil.memFree(unit);
        }
    }

    public boolean hasData() {
        return cube != null || track != null;
    }

    /**
     * Draws the panel. The image is drawn immediately; the lines and labels go into the overlay
     * batch (flushed by the caller).
     *
     * @param fbW   framebuffer size, pixels; x, y, w, h are interface pixels (framebuffer / scale)
     * @param tObs observer time, M
     */
    public void draw(Overlay o, ColourMaps maps, int x, int y, int w, int h, int fbW, int fbH, float scale,
                     double tObs) {
        o.rect(x, y, w, h, Palette.PANEL);
        o.frame(x, y, w, h, Palette.PANEL_EDGE);
        FontAtlas font = o.font();
        float lh = font.lineHeight(FontAtlas.Size.SMALL);
        o.text(x + 10, y + 8, "Sky (observer's view)", FontAtlas.Size.LARGE, Palette.TEXT);
        boolean curve = track != null && track.size() > 1;
        int curveH = curve ? Math.max(70, Math.min(150, h / 5)) : 0;
        int side = Math.max(10, Math.min(w - 20, h - 96 - (curve ? curveH + 34 : 0)));
        int ix = x + (w - side) / 2;
        int iy = y + 40;
        double s = side / (2 * halfWidth); // pixels per uas (micro-arcseconds)
        float cx = ix + side / 2f;
        float cy = iy + side / 2f;
        int f = cube != null ? cube.frameAt(tObs) : -1;
        if (cube != null && f < 0) {
            o.rect(ix, iy, side, side, 0x000000ff);
        } else if (cube != null) {
            if (f != loadedFrame) {
                cube.readFrame(f, frame);
                glBindTexture(GL_TEXTURE_2D, texture);
                glPixelStorei(GL_UNPACK_ALIGNMENT, 4);
                glTexSubImage2D(GL_TEXTURE_2D, 0, 0, 0, cube.width(), cube.height(), GL_RED, GL_FLOAT, frame);
                loadedFrame = f;
            }
            // screen rectangle of the image: pixel centres at (i + 1 - crpix) * cdelt micro-arcseconds
            double e0 = (0.5 - cube.crpix1()) * cube.cdelt1();               // sky x of the left edge of pixel 1
            double e1 = (cube.width() + 0.5 - cube.crpix1()) * cube.cdelt1(); // right edge of the last pixel
            double n0 = (0.5 - cube.crpix2()) * cube.cdelt2();
            double n1 = (cube.height() + 0.5 - cube.crpix2()) * cube.cdelt2();
            float sx0 = (float) (cx - e0 * s);
            float sx1 = (float) (cx - e1 * s);
            float sy0 = (float) (cy - n0 * s);
            float sy1 = (float) (cy - n1 * s);
            o.flush();
            glViewport(0, 0, fbW, fbH);
            glEnable(GL_SCISSOR_TEST);
            glScissor(Math.round(ix * scale), fbH - Math.round((iy + side) * scale), Math.round(side * scale),
                    Math.round(side * scale));
            shader.use();
            glUniform2f(uViewport, fbW / scale, fbH / scale); // rectangle below in interface pixels
            // rectangle from min to max on screen; u runs from pixel 1 at sx0 to the last at sx1
            float left = Math.min(sx0, sx1);
            float top = Math.min(sy0, sy1);
            glUniform4f(uRect, left, top, Math.abs(sx1 - sx0), Math.abs(sy1 - sy0));
            glUniform4f(uUv, sx0 <= sx1 ? 0f : 1f, sy0 <= sy1 ? 0f : 1f, sx0 <= sx1 ? 1f : 0f, sy0 <= sy1 ? 1f : 0f);
            glActiveTexture(GL_TEXTURE1);
            glBindTexture(GL_TEXTURE_2D, texture);
            glUniform1i(uImage, 1);
            maps.bind(0);
            glUniform1i(uMaps, 0);
            glUniform1f(uMax, cube.max());
            glUniform1f(uRow, (Palette.SKY_MAP + 0.5f) / Palette.MAP_ROWS);
            glDisable(GL_BLEND);
            glDisable(GL_DEPTH_TEST);
            quad.bind();
            glDrawArrays(GL_TRIANGLES, 0, 6);
            glBindVertexArray(0);
            glDisable(GL_SCISSOR_TEST);
        } else {
            o.rect(ix, iy, side, side, 0x070a10ff);
        }
        o.frame(ix - 1, iy - 1, side + 2, side + 2, Palette.PANEL_EDGE);
        // black hole position
        o.line(cx - 5, cy, cx + 5, cy, 1, 0xffffff90);
        o.line(cx, cy - 5, cx, cy + 5, 1, 0xffffff90);
        if (track != null) {
            int last = track.indexAt(tObs);
            float px = Float.NaN;
            float py = Float.NaN;
            for (int i = 0; i <= last; i++) {
                double tx = track.x(i);
                double ty = track.y(i);
                if (!Double.isFinite(tx) || !Double.isFinite(ty)) {
                    px = Float.NaN;
                    continue;
                }
                float qx = (float) (cx - tx * s);
                float qy = (float) (cy - ty * s);
                if (!Float.isNaN(px)) {
                    int a = 0x50 + (int) (0xaf * (i / (double) Math.max(1, last)));
                    o.line(px, py, qx, qy, 1.5f, Palette.alpha(Palette.TRACK, a));
                }
                px = qx;
                py = qy;
            }
            if (last >= 0 && !Float.isNaN(px)) {
                o.rect(px - 3, py - 3, 7, 7, 0xffffffff);
                o.rect(px - 2, py - 2, 5, 5, Palette.TRACK);
            }
        }
        // compass: N up, E left
        float kx = ix + side - 18;
        float ky = iy + 34;
        o.line(kx, ky, kx, ky - 22, 1.5f, Palette.TEXT);
        o.line(kx, ky, kx - 22, ky, 1.5f, Palette.TEXT);
        o.textCentred(kx, ky - 38, "N", FontAtlas.Size.SMALL, Palette.TEXT);
        o.textRight(kx - 26, ky - 9, "E", FontAtlas.Size.SMALL, Palette.TEXT);
        // scale bar: a 1-2-5 length near a quarter of the field
        double bar = niceLength(halfWidth * 0.5);
        float bw = (float) (bar * s);
        float bx = ix + 14;
        float by = iy + side - 16;
        o.rect(bx, by, bw, 2, Palette.TEXT);
        o.rect(bx, by - 4, 1, 10, Palette.TEXT);
        o.rect(bx + bw - 1, by - 4, 1, 10, Palette.TEXT);
        text.clear().sig3(bar).add(" uas");
        o.text(bx, by - 6 - lh, text, FontAtlas.Size.SMALL, Palette.TEXT);
        // caption
        float ty = iy + side + 10;
        if (cube != null && f < 0) {
            o.text(x + 10, ty, "no image yet at this observer time (first frame later)", FontAtlas.Size.SMALL,
                    Palette.TEXT_DIM);
        } else if (cube != null) {
            text.clear().add("frame ").add(f + 1).add('/').add(cube.frames())
                    .add("  \u00b7  sqrt stretch  \u00b7  peak ").sig3(cube.max());
            o.text(x + 10, ty, text, FontAtlas.Size.SMALL, Palette.TEXT_DIM);
        } else {
            o.text(x + 10, ty, "no images.fits in this run", FontAtlas.Size.SMALL, Palette.TEXT_DIM);
        }
        ty += lh;
        if (track != null) {
            int last = track.indexAt(tObs);
            text.clear().add("centroid");
            if (last >= 0 && Double.isFinite(track.x(last))) {
                text.add("  x = ").sig3(track.x(last)).add("  y = ").sig3(track.y(last)).add(" uas");
            } else {
                text.add(": not yet observed");
            }
            o.rect(x + 10, ty + lh / 2 - 1, 14, 2, Palette.TRACK);
            o.text(x + 30, ty, text, FontAtlas.Size.SMALL, Palette.TEXT);
        } else {
            o.text(x + 10, ty, "no centroid.csv in this run", FontAtlas.Size.SMALL, Palette.TEXT_DIM);
        }
        if (curve) {
            lightCurve(o, x + 12, (int) (ty + lh + 16), w - 24, curveH, tObs);
        }
    }

    /** Total flux against observer time, the part up to tObs bright, with a marker at tObs. */
    private void lightCurve(Overlay o, int x, int y, int w, int h, double tObs) {
        FontAtlas font = o.font();
        float lh = font.lineHeight(FontAtlas.Size.SMALL);
        o.text(x, y - 2, "total flux (centroid.csv, relative units)", FontAtlas.Size.SMALL, Palette.TEXT);
        int py = (int) (y + lh + 2);
        int ph = (int) (h - lh - 2 - lh);
        o.rect(x, py, w, ph, 0x070a10ff);
        o.frame(x - 1, py - 1, w + 2, ph + 2, Palette.PANEL_EDGE);
        int n = track.size();
        double t0 = track.t(0);
        double t1 = track.t(n - 1);
        double fmax = track.maxFlux();
        if (!(t1 > t0) || !(fmax > 0)) {
            return;
        }
        double sx = w / (t1 - t0);
        double sy = (ph - 4) / fmax;
        float px = Float.NaN;
        float pyy = Float.NaN;
        for (int i = 0; i < n; i++) {
            double fl = track.flux(i);
            if (!Double.isFinite(fl)) {
                px = Float.NaN;
                continue;
            }
            float qx = (float) (x + (track.t(i) - t0) * sx);
            float qy = (float) (py + ph - 2 - fl * sy);
            if (!Float.isNaN(px)) {
                boolean past = track.t(i) <= tObs;
                o.line(px, pyy, qx, qy, past ? 1.5f : 1f, past ? Palette.TRACK : Palette.alpha(Palette.TRACK, 0x50));
            }
            px = qx;
            pyy = qy;
        }
        if (tObs >= t0 && tObs <= t1) {
            float mx = (float) (x + (tObs - t0) * sx);
            o.rect(mx, py, 1, ph, 0xffffffa0);
        }
        text.clear().fixed(t0 * minutesPerM, 1).add(" min");
        o.text(x, py + ph + 2, text, FontAtlas.Size.SMALL, Palette.TEXT_DIM);
        text.clear().add("observer time");
        o.textCentred(x + w / 2f, py + ph + 2, text, FontAtlas.Size.SMALL, Palette.TEXT_DIM);
        text.clear().fixed(t1 * minutesPerM, 1).add(" min");
        o.textRight(x + w, py + ph + 2, text, FontAtlas.Size.SMALL, Palette.TEXT_DIM);
    }

    static double niceLength(double x) {
        double p = Math.pow(10, Math.floor(Math.log10(x)));
        double m = x / p;
        return (m < 2 ? 1 : m < 5 ? 2 : 5) * p;
    }

    @Override public void close() {
        if (cube != null) {
            shader.close();
            glDeleteTextures(texture);
            quad.close();
            MemoryUtil.memFree(frame);
            cube.close();
        }
    }
}
