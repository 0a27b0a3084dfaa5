package org.spindrift.viewer.scene;

import static org.lwjgl.opengl.GL33C.*;

import org.spindrift.viewer.gl.Shader;

/**
 * The path of each source's centre up to the current time, fading with age. The whole track
 * (S x K points, small) is uploaded once; each frame only the vertex count and two uniforms change.
 */
public final class TrailLayer implements AutoCloseable {
    private final Shader lines = new Shader("lines");
    private final LineMesh mesh;
    private final int sources;
    private final int snapshots;
    private final int uVp;
    private final int uTrail;
    private final int uNow;
    private final int uSpan;

    /** @param centres [snapshot][source * 3 + xyz]; @param times snapshot times, M */
    public TrailLayer(float[][] centres, double[] times, int sources) {
        this.sources = sources;
        this.snapshots = times.length;
        try (LineBuilder b = new LineBuilder()) {
            for (int k = 0; k < sources; k++) {
                int c = Palette.alpha(Palette.source(k), 0xe0);
                for (int s = 0; s < snapshots; s++) {
                    float[] row = centres[s];
                    b.vertex(row[3 * k], row[3 * k + 1], row[3 * k + 2], c, times[s]);
                }
            }
            mesh = new LineMesh(b);
        }
        uVp = lines.uniform("u_viewProjection");
        uTrail = lines.uniform("u_trail");
        uNow = lines.uniform("u_now");
        uSpan = lines.uniform("u_span");
    }

    /**
     * @param upTo index of the last snapshot to include
     * @param now  current time, M
     * @param span age over which the trail fades, M
     */
    public void draw(OrbitCamera camera, int upTo, double now, double span) {
        if (snapshots < 2 || sources == 0) {
            return;
        }
        lines.use();
        Shader.setMatrix(uVp, camera.viewProjection());
        glUniform1i(uTrail, 1);
        glUniform1f(uNow, (float) now);
        glUniform1f(uSpan, (float) span);
        glEnable(GL_DEPTH_TEST);
        glDepthMask(false);
        glEnable(GL_BLEND);
        glBlendFuncSeparate(GL_SRC_ALPHA, GL_ONE_MINUS_SRC_ALPHA, GL_ONE, GL_ONE_MINUS_SRC_ALPHA);
        mesh.array.bind();
        int n = Math.min(snapshots, upTo + 2); // one past: the shader hides the part after 'now'
        for (int k = 0; k < sources; k++) {
            glDrawArrays(GL_LINE_STRIP, k * snapshots, n);
        }
        glBindVertexArray(0);
        glDepthMask(true);
    }

    @Override public void close() {
        lines.close();
        mesh.close();
    }
}
