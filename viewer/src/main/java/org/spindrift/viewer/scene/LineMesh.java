package org.spindrift.viewer.scene;

import static org.lwjgl.opengl.GL33C.*;

/** A static vertex buffer of line vertices in the layout of {@link LineBuilder}. */
final class LineMesh implements AutoCloseable {
    final int vao;
    final int vbo;
    final int vertices;

    LineMesh(LineBuilder b) {
        vertices = b.vertices();
        vao = glGenVertexArrays();
        vbo = glGenBuffers();
        glBindVertexArray(vao);
        glBindBuffer(GL_ARRAY_BUFFER, vbo);
        glBufferData(GL_ARRAY_BUFFER, b.flip(), GL_STATIC_DRAW);
        int stride = LineBuilder.FLOATS * 4;
        glVertexAttribPointer(0, 3, GL_FLOAT, false, stride, 0);
        glVertexAttribPointer(1, 4, GL_FLOAT, false, stride, 12);
        glVertexAttribPointer(2, 1, GL_FLOAT, false, stride, 28);
        glEnableVertexAttribArray(0);
        glEnableVertexAttribArray(1);
        glEnableVertexAttribArray(2);
        glBindVertexArray(0);
    }

    @Override public void close() {
        glDeleteBuffers(vbo);
        glDeleteVertexArrays(vao);
    }
}
