package org.spindrift.viewer.gl;

import static org.lwjgl.opengl.GL33C.*;

import java.awt.Color;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.lwjgl.stb.STBTTBakedChar;
import org.lwjgl.stb.STBTruetype;
import org.lwjgl.system.MemoryUtil;

/**
 * Glyphs of printable ASCII and Latin-1 at two pixel sizes baked into one single-channel texture.
 * The font is a TrueType file found on the system (stb_truetype); when none is found, Java's
 * own logical sans-serif font is drawn into the atlas instead. Nothing is fetched from the net.
 * Glyph metrics are copied into plain arrays so that laying out text does not allocate.
 */
public final class FontAtlas implements AutoCloseable {
    /** Text sizes. */
    public enum Size { SMALL, LARGE }

    static final int FIRST = 32;
    static final int COUNT = 224; // 32..255: ASCII and Latin-1 (for the micro sign and the degree sign)
    private static final float[] PIXELS = {14f, 19f};

    private static final List<String> CANDIDATES = List.of(
            "/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf",
            "/usr/share/fonts/TTF/DejaVuSans.ttf",
            "/usr/share/fonts/dejavu/DejaVuSans.ttf",
            "/usr/share/fonts/truetype/liberation/LiberationSans-Regular.ttf",
            "/usr/share/fonts/truetype/liberation2/LiberationSans-Regular.ttf",
            "/usr/share/fonts/liberation-sans/LiberationSans-Regular.ttf",
            "/usr/share/fonts/truetype/noto/NotoSans-Regular.ttf",
            "/usr/share/fonts/noto/NotoSans-Regular.ttf",
            "/usr/share/fonts/truetype/freefont/FreeSans.ttf",
            "/Library/Fonts/Arial.ttf",
            "/System/Library/Fonts/Supplemental/Arial.ttf",
            "C:/Windows/Fonts/segoeui.ttf",
            "C:/Windows/Fonts/arial.ttf");

    /** per size, per glyph: x0, y0, x1, y1 (atlas pixels), xoff, yoff, xadvance (atlas pixels) */
    private final float[][] metrics = new float[2][COUNT * 7];
    private final float[] lineHeight = new float[2];
    private final float[] ascent = new float[2];
    private final int texture;
    private final String source;
    private final float scale;
    /** Atlas size in pixels (square). */
    final int size;

    /**
     * @param scale interface scale: glyphs are baked at scale times their nominal pixel size, so
     *              text stays sharp when the overlay is drawn scaled (large frames, HiDPI screens)
     */
    public FontAtlas(float scale) {
        this.scale = scale;
        this.size = scale > 1.25f ? 1024 : 512;
        final int W = size;
        final int H = size;
        ByteBuffer bitmap = MemoryUtil.memCalloc(W * H);
        try {
            String used = bakeTrueType(bitmap);
            if (used == null) {
                used = bakeAwt(bitmap);
            }
            source = used;
            texture = glGenTextures();
            glBindTexture(GL_TEXTURE_2D, texture);
            glPixelStorei(GL_UNPACK_ALIGNMENT, 1);
            glTexImage2D(GL_TEXTURE_2D, 0, GL_R8, W, H, 0, GL_RED, GL_UNSIGNED_BYTE, bitmap);
            glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_MIN_FILTER, GL_LINEAR);
            glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_MAG_FILTER, GL_LINEAR);
            glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_WRAP_S, GL_CLAMP_TO_EDGE);
            glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_WRAP_T, GL_CLAMP_TO_EDGE);
        } finally {
            MemoryUtil.memFree(bitmap);
        }
    }

    private String bakeTrueType(ByteBuffer bitmap) {
        final int W = size;
        final int H = size;
        for (String c : CANDIDATES) {
            Path p = Path.of(c);
            if (!Files.isReadable(p)) {
                continue;
            }
            ByteBuffer ttf;
            try {
                byte[] bytes = Files.readAllBytes(p);
                ttf = MemoryUtil.memAlloc(bytes.length);
                ttf.put(bytes).flip();
            } catch (IOException e) {
                continue;
            }
            try (STBTTBakedChar.Buffer cdata = STBTTBakedChar.malloc(COUNT)) {
                boolean ok = true;
                for (int s = 0; s < 2 && ok; s++) {
                    int rowOffset = s * (H / 2);
                    ByteBuffer half = MemoryUtil.memSlice(bitmap, rowOffset * W, (H / 2) * W);
                    int r = STBTruetype.stbtt_BakeFontBitmap(ttf, PIXELS[s] * scale, half, W, H / 2, FIRST, cdata);
                    if (r == 0) {
                        ok = false;
                        break;
                    }
                    for (int g = 0; g < COUNT; g++) {
                        STBTTBakedChar b = cdata.get(g);
                        float[] m = metrics[s];
                        m[g * 7] = b.x0();
                        m[g * 7 + 1] = b.y0() + rowOffset;
                        m[g * 7 + 2] = b.x1();
                        m[g * 7 + 3] = b.y1() + rowOffset;
                        m[g * 7 + 4] = b.xoff();
                        m[g * 7 + 5] = b.yoff();
                        m[g * 7 + 6] = b.xadvance();
                    }
                    lineHeight[s] = Math.round(PIXELS[s] * 1.3f);
                    ascent[s] = Math.round(PIXELS[s] * 0.78f);
                }
                if (ok) {
                    return p.toString();
                }
            } finally {
                MemoryUtil.memFree(ttf);
            }
            MemoryUtil.memSet(bitmap, 0);
        }
        return null;
    }

    private String bakeAwt(ByteBuffer bitmap) {
        final int W = size;
        final int H = size;
        try {
            for (int s = 0; s < 2; s++) {
                int rowOffset = s * (H / 2);
                BufferedImage img = new BufferedImage(W, H / 2, BufferedImage.TYPE_BYTE_GRAY);
                Graphics2D g2 = img.createGraphics();
                g2.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
                g2.setFont(new java.awt.Font(java.awt.Font.SANS_SERIF, java.awt.Font.PLAIN, Math.round(PIXELS[s] * scale)));
                g2.setColor(Color.WHITE);
                FontMetrics fm = g2.getFontMetrics();
                int cell = fm.getHeight() + 2;
                int x = 1;
                int y = 1;
                for (int g = 0; g < COUNT; g++) {
                    char ch = (char) (FIRST + g);
                    int adv = fm.charWidth(ch);
                    if (x + adv + 2 >= W) {
                        x = 1;
                        y += cell;
                    }
                    g2.drawString(String.valueOf(ch), x, y + fm.getAscent());
                    float[] m = metrics[s];
                    m[g * 7] = x;
                    m[g * 7 + 1] = y + rowOffset;
                    m[g * 7 + 2] = x + adv + 1;
                    m[g * 7 + 3] = y + cell - 1 + rowOffset;
                    m[g * 7 + 4] = 0;
                    m[g * 7 + 5] = -fm.getAscent();
                    m[g * 7 + 6] = adv;
                    x += adv + 3;
                }
                g2.dispose();
                byte[] data = ((java.awt.image.DataBufferByte) img.getRaster().getDataBuffer()).getData();
                for (int i = 0; i < data.length; i++) {
                    bitmap.put(rowOffset * W + i, data[i]);
                }
                lineHeight[s] = Math.round(PIXELS[s] * 1.3f);
                ascent[s] = Math.round(fm.getAscent() / scale);
            }
            return "Java sans-serif";
        } catch (RuntimeException | Error e) {
            return "none (labels are blank: no TrueType font and no Java font found)";
        }
    }

    /** @return where the glyphs came from (a file path, or the Java fallback) */
    public String source() {
        return source;
    }

    public int texture() {
        return texture;
    }

    float[] metrics(Size size) {
        return metrics[size.ordinal()];
    }

    /** @return line height in interface pixels */
    public float lineHeight(Size size) {
        return lineHeight[size.ordinal()];
    }

    public float ascent(Size size) {
        return ascent[size.ordinal()];
    }

    /** @return the interface scale the glyphs were baked for */
    public float scale() {
        return scale;
    }

    /** @return the advance width of the text in interface pixels */
    public float width(CharSequence s, Size size) {
        float[] m = metrics[size.ordinal()];
        float w = 0;
        for (int i = 0; i < s.length(); i++) {
            int g = s.charAt(i) - FIRST;
            if (g < 0 || g >= COUNT) {
                g = '?' - FIRST;
            }
            w += m[g * 7 + 6];
        }
        return w / scale;
    }

    @Override public void close() {
        glDeleteTextures(texture);
    }
}
