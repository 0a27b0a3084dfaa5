package org.spindrift.viewer.gl;

import static org.lwjgl.opengl.GL33C.*;

import java.nio.FloatBuffer;
import org.lwjgl.system.MemoryUtil;

/**
 * Batched 2D drawing in interface pixels (framebuffer pixels divided by the interface scale,
 * origin top-left): filled rectangles, gradient
 * rectangles, 1-pixel lines and text. Vertices go into one preallocated buffer that is uploaded
 * by orphaning ({@code glBufferData(NULL)} then {@code glBufferSubData}) when flushed; drawing
 * allocates nothing.
 */
public final class Overlay implements AutoCloseable {
    private static final int FLOATS = 8;
    private static final int CAPACITY = 60_000; // vertices per batch

    private final Shader shader = new Shader("overlay");
    private final int uViewport;
    private final int uFont;
    private final VertexArray array;
    private final FloatBuffer data = MemoryUtil.memAllocFloat(CAPACITY * FLOATS);
    private FontAtlas font;
    private int count;
    private float viewportW = 1;
    private float viewportH = 1;

    public Overlay(FontAtlas font) {
        this.font = font;
        uViewport = shader.uniform("u_viewport");
        uFont = shader.uniform("u_font");
        array = VertexArray.empty(CAPACITY, GL_STREAM_DRAW, 2, 2, 4); // position, glyph uv, colour
    }

    public FontAtlas font() {
        return font;
    }

    /** Replaces the glyph atlas (when the interface scale changes); the caller closes the old one. */
    public void font(FontAtlas f) {
        flush();
        font = f;
    }

    /** Starts a batch for a framebuffer of the given size in interface pixels (framebuffer / scale). */
    public void begin(int width, int height) {
        viewportW = width;
        viewportH = height;
        count = 0;
        data.clear();
    }

    private void vertex(float x, float y, float u, float v, int rgba) {
        if (count == CAPACITY) {
            flush();
        }
        data.put(x).put(y).put(u).put(v)
                .put(((rgba >>> 24) & 0xff) / 255f).put(((rgba >>> 16) & 0xff) / 255f)
                .put(((rgba >>> 8) & 0xff) / 255f).put((rgba & 0xff) / 255f);
        count++;
    }

    private void quad(float x0, float y0, float x1, float y1, float u0, float v0, float u1, float v1,
                      int c00, int c10, int c11, int c01) {
        if (count + 6 > CAPACITY) {
            flush();
        }
        vertex(x0, y0, u0, v0, c00);
        vertex(x1, y0, u1, v0, c10);
        vertex(x1, y1, u1, v1, c11);
        vertex(x0, y0, u0, v0, c00);
        vertex(x1, y1, u1, v1, c11);
        vertex(x0, y1, u0, v1, c01);
    }

    /** Filled rectangle; colours are 0xRRGGBBAA. */
    public void rect(float x, float y, float w, float h, int rgba) {
        quad(x, y, x + w, y + h, -1, 0, -1, 0, rgba, rgba, rgba, rgba);
    }

    /** Rectangle with a left-to-right colour gradient. */
    public void hgradient(float x, float y, float w, float h, int left, int right) {
        quad(x, y, x + w, y + h, -1, 0, -1, 0, left, right, right, left);
    }

    /** Rectangle with a bottom-to-top colour gradient. */
    public void vgradient(float x, float y, float w, float h, int bottom, int top) {
        quad(x, y, x + w, y + h, -1, 0, -1, 0, top, top, bottom, bottom);
    }

    /** Filled disc, as one-pixel rows (for small markers). */
    public void disc(float cx, float cy, float r, int rgba) {
        for (float y = -r + 0.5f; y < r; y += 1f) {
            float hw = (float) Math.sqrt(Math.max(0, r * r - y * y));
            rect(cx - hw, cy + y - 0.5f, 2 * hw, 1, rgba);
        }
    }

    /** Outline of a rectangle, 1 pixel wide. */
    public void frame(float x, float y, float w, float h, int rgba) {
        rect(x, y, w, 1, rgba);
        rect(x, y + h - 1, w, 1, rgba);
        rect(x, y, 1, h, rgba);
        rect(x + w - 1, y, 1, h, rgba);
    }

    /** A line of the given width between two points, drawn as a thin quad. */
    public void line(float x0, float y0, float x1, float y1, float width, int rgba) {
        float dx = x1 - x0;
        float dy = y1 - y0;
        float len = (float) Math.sqrt(dx * dx + dy * dy);
        if (len < 1e-6f) {
            return;
        }
        float nx = -dy / len * width * 0.5f;
        float ny = dx / len * width * 0.5f;
        if (count + 6 > CAPACITY) {
            flush();
        }
        vertex(x0 + nx, y0 + ny, -1, 0, rgba);
        vertex(x1 + nx, y1 + ny, -1, 0, rgba);
        vertex(x1 - nx, y1 - ny, -1, 0, rgba);
        vertex(x0 + nx, y0 + ny, -1, 0, rgba);
        vertex(x1 - nx, y1 - ny, -1, 0, rgba);
        vertex(x0 - nx, y0 - ny, -1, 0, rgba);
    }

    /**
     * Draws text with its top-left corner at (x, y).
     *
     * @return the x coordinate after the last glyph
     */
    public float text(float x, float y, CharSequence s, FontAtlas.Size size, int rgba) {
        float[] m = font.metrics(size);
        float sc = font.scale();
        float inv = 1f / sc;
        // snap the baseline and pen to framebuffer pixels so the glyphs stay sharp
        float baseline = Math.round((y + font.ascent(size)) * sc) * inv;
        float pen = Math.round(x * sc) * inv;
        float iw = 1f / font.size;
        float ih = 1f / font.size;
        for (int i = 0; i < s.length(); i++) {
            int g = s.charAt(i) - FontAtlas.FIRST;
            if (g < 0 || g >= FontAtlas.COUNT) {
                g = '?' - FontAtlas.FIRST;
            }
            int o = g * 7;
            float gx0 = pen + m[o + 4] * inv;
            float gy0 = baseline + m[o + 5] * inv;
            float gx1 = gx0 + (m[o + 2] - m[o]) * inv;
            float gy1 = gy0 + (m[o + 3] - m[o + 1]) * inv;
            if (m[o + 2] > m[o]) {
                quad(gx0, gy0, gx1, gy1, m[o] * iw, m[o + 1] * ih, m[o + 2] * iw, m[o + 3] * ih,
                        rgba, rgba, rgba, rgba);
            }
            pen += m[o + 6] * inv;
        }
        return pen;
    }

    /** Draws text right-aligned so that it ends at x. */
    public void textRight(float x, float y, CharSequence s, FontAtlas.Size size, int rgba) {
        text(x - font.width(s, size), y, s, size, rgba);
    }

    /** Draws text centred on x. */
    public void textCentred(float x, float y, CharSequence s, FontAtlas.Size size, int rgba) {
        text(x - font.width(s, size) * 0.5f, y, s, size, rgba);
    }

    /** Uploads and draws what was batched (blending on, depth off). */
    public void flush() {
        if (count == 0) {
            return;
        }
        data.flip();
        glDisable(GL_DEPTH_TEST);
        glEnable(GL_BLEND);
        glBlendFuncSeparate(GL_SRC_ALPHA, GL_ONE_MINUS_SRC_ALPHA, GL_ONE, GL_ONE_MINUS_SRC_ALPHA);
        shader.use();
        glUniform2f(uViewport, viewportW, viewportH);
        glActiveTexture(GL_TEXTURE0);
        glBindTexture(GL_TEXTURE_2D, font.texture());
        glUniform1i(uFont, 0);
        array.upload(data, CAPACITY, GL_STREAM_DRAW);
        glDrawArrays(GL_TRIANGLES, 0, count);
        glBindVertexArray(0);
        count = 0;
        data.clear();
    }

    @Override public void close() {
        shader.close();
        array.close();
        MemoryUtil.memFree(data);
    }
}
