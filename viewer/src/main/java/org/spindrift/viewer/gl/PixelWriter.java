package org.spindrift.viewer.gl;

import static org.lwjgl.opengl.GL33C.*;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import org.lwjgl.stb.STBImageWrite;
import org.lwjgl.system.MemoryUtil;

/**
 * Reads the bound read framebuffer into a preallocated buffer and writes it as PNG (stb_image_write,
 * rows flipped so that the file's first row is the top of the picture). The file is written under
 * a temporary name and renamed when complete.
 */
public final class PixelWriter implements AutoCloseable {
    private ByteBuffer pixels;
    private int capacity;

    public PixelWriter() {
        capacity = 0;
        pixels = null;
    }

    /** Reads width x height RGBA pixels from the lower-left corner of the read framebuffer. */
    public void read(int width, int height) {
        int need = width * height * 4;
        if (need > capacity) {
            if (pixels != null) {
                MemoryUtil.memFree(pixels);
            }
            pixels = MemoryUtil.memAlloc(need);
            capacity = need;
        }
        pixels.clear();
        glPixelStorei(GL_PACK_ALIGNMENT, 1);
        glReadPixels(0, 0, width, height, GL_RGBA, GL_UNSIGNED_BYTE, pixels);
        // opaque output: the framebuffer's alpha is blending residue, not transparency
        for (int i = 3; i < need; i += 4) {
            pixels.put(i, (byte) 0xff);
        }
    }

    /** Writes the last {@link #read} as PNG to file. */
    public void writePng(Path file, int width, int height) throws IOException {
        Path abs = file.toAbsolutePath();
        Path tmp = abs.resolveSibling("." + abs.getFileName() + ".partial");
        STBImageWrite.stbi_flip_vertically_on_write(true);
        pixels.position(0).limit(width * height * 4);
        boolean ok = STBImageWrite.stbi_write_png(tmp.toString(), width, height, 4, pixels, width * 4);
        pixels.clear();
        if (!ok) {
            Files.deleteIfExists(tmp);
            throw new IOException("cannot write " + file);
        }
        Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    }

    @Override public void close() {
        if (pixels != null) {
            MemoryUtil.memFree(pixels);
            pixels = null;
        }
    }
}
