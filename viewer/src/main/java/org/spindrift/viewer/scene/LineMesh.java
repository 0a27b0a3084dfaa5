package org.spindrift.viewer.scene;

import static org.lwjgl.opengl.GL33C.GL_STATIC_DRAW;

import org.spindrift.viewer.gl.VertexArray;

/** A static vertex buffer of line vertices in the layout of {@link LineBuilder}: position, colour, trail parameter. */
final class LineMesh implements AutoCloseable {
    final VertexArray array;
    final int vertices;

    LineMesh(LineBuilder b) {
        vertices = b.vertices();
        array = VertexArray.of(b.flip(), GL_STATIC_DRAW, 3, 4, 1);
    }

    @Override public void close() {
        array.close();
    }
}
