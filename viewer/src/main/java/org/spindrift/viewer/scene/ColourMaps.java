package org.spindrift.viewer.scene;

import static org.lwjgl.opengl.GL33C.*;

import java.nio.ByteBuffer;
import org.lwjgl.system.MemoryStack;
import org.spindrift.shared.colour.ColourRamp;

/**
 * The continuous colour maps of {@link Palette} as one 256 x N RGBA texture (one row per map); the
 * sky row is the chosen shared {@link ColourRamp} itself.
 */
public final class ColourMaps implements AutoCloseable {
    private static final int N = 256;
    private final int texture;

    /** @param sky ramp of the sky image row ({@link ColourRamp#SKY} or {@link ColourRamp#GREY}) */
    public ColourMaps(ColourRamp sky) {
        texture = glGenTextures();
        glBindTexture(GL_TEXTURE_2D, texture);
        try (MemoryStack stack = MemoryStack.stackPush()) {
            ByteBuffer px = stack.malloc(N * Palette.MAP_ROWS * 4);
            for (int row = 0; row < Palette.MAP_ROWS; row++) {
                for (int i = 0; i < N; i++) {
                    int c = row == Palette.SKY_MAP ? sky.rgb(i / (N - 1.0)) << 8 | 0xff
                            : Palette.map(row, i / (N - 1.0));
                    px.put((byte) (c >>> 24)).put((byte) (c >>> 16)).put((byte) (c >>> 8)).put((byte) 0xff);
                }
            }
            px.flip();
            glPixelStorei(GL_UNPACK_ALIGNMENT, 1);
            glTexImage2D(GL_TEXTURE_2D, 0, GL_RGBA8, N, Palette.MAP_ROWS, 0, GL_RGBA, GL_UNSIGNED_BYTE, px);
        }
        glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_MIN_FILTER, GL_LINEAR);
        glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_MAG_FILTER, GL_LINEAR);
        glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_WRAP_S, GL_CLAMP_TO_EDGE);
        glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_WRAP_T, GL_CLAMP_TO_EDGE);
    }

    public void bind(int unit) {
        glActiveTexture(GL_TEXTURE0 + unit);
        glBindTexture(GL_TEXTURE_2D, texture);
    }

    @Override public void close() {
        glDeleteTextures(texture);
    }
}
