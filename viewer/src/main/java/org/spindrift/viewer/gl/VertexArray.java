package org.spindrift.viewer.gl;

import static org.lwjgl.opengl.GL33C.*;

import java.nio.FloatBuffer;
import java.nio.IntBuffer;

/**
 * A vertex array object with one vertex buffer of interleaved float attributes: attribute i has
 * {@code sizes[i]} floats, in order, at locations 0, 1, ...; optionally an element (index) buffer.
 * Needs a current OpenGL context; leaves no vertex array bound.
 */
public final class VertexArray implements AutoCloseable {
    private final int vao;
    private final int vbo;
    private final int ibo;
    private final int strideBytes;

    private VertexArray(int vao, int vbo, int ibo, int strideBytes) {
        this.vao = vao;
        this.vbo = vbo;
        this.ibo = ibo;
        this.strideBytes = strideBytes;
    }

    /**
     * @param vertices interleaved vertex data, from position to limit
     * @param usage    {@code GL_STATIC_DRAW} etc.
     * @param sizes    floats per attribute, locations 0, 1, ...
     */
    public static VertexArray of(FloatBuffer vertices, int usage, int... sizes) {
        return create(vertices, 0, usage, null, sizes);
    }

    /** As {@link #of}, with an element buffer of triangle indices. */
    public static VertexArray indexed(FloatBuffer vertices, IntBuffer indices, int usage, int... sizes) {
        return create(vertices, 0, usage, indices, sizes);
    }

    /** A buffer of {@code vertices} vertices to be filled later ({@link #upload}). */
    public static VertexArray empty(int vertices, int usage, int... sizes) {
        return create(null, vertices, usage, null, sizes);
    }

    private static VertexArray create(FloatBuffer data, int capacity, int usage, IntBuffer indices, int... sizes) {
        int floats = 0;
        for (int s : sizes) {
            floats += s;
        }
        int stride = floats * Float.BYTES;
        int vao = glGenVertexArrays();
        int vbo = glGenBuffers();
        glBindVertexArray(vao);
        glBindBuffer(GL_ARRAY_BUFFER, vbo);
        if (data != null) {
            glBufferData(GL_ARRAY_BUFFER, data, usage);
        } else {
            glBufferData(GL_ARRAY_BUFFER, (long) capacity * stride, usage);
        }
        long offset = 0;
        for (int i = 0; i < sizes.length; i++) {
            glVertexAttribPointer(i, sizes[i], GL_FLOAT, false, stride, offset);
            glEnableVertexAttribArray(i);
            offset += (long) sizes[i] * Float.BYTES;
        }
        int ibo = 0;
        if (indices != null) {
            ibo = glGenBuffers();
            glBindBuffer(GL_ELEMENT_ARRAY_BUFFER, ibo);
            glBufferData(GL_ELEMENT_ARRAY_BUFFER, indices, usage);
        }
        glBindVertexArray(0);
        return new VertexArray(vao, vbo, ibo, stride);
    }

    /** Binds the vertex array for drawing. */
    public void bind() {
        glBindVertexArray(vao);
    }

    /**
     * Replaces the contents of an {@link #empty} buffer (orphaning the old storage, so a draw still
     * reading it does not stall) and leaves the vertex array bound.
     *
     * @param capacity vertices the buffer holds
     */
    public void upload(FloatBuffer data, int capacity, int usage) {
        glBindVertexArray(vao);
        glBindBuffer(GL_ARRAY_BUFFER, vbo);
        glBufferData(GL_ARRAY_BUFFER, (long) capacity * strideBytes, usage);
        glBufferSubData(GL_ARRAY_BUFFER, 0, data);
    }

    @Override public void close() {
        glDeleteBuffers(vbo);
        if (ibo != 0) {
            glDeleteBuffers(ibo);
        }
        glDeleteVertexArrays(vao);
    }
}
