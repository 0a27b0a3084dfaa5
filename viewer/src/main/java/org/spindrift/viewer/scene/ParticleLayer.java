package org.spindrift.viewer.scene;

import static org.lwjgl.opengl.GL33C.*;

import java.nio.FloatBuffer;
import org.lwjgl.system.MemoryUtil;
import org.spindrift.viewer.data.RunData;

/**
 * The particles as point sprites. One persistent vertex buffer holds two snapshot slots (A and B)
 * of {@link RunData#STRIDE} floats per particle; the vertex shader mixes them linearly in time.
 * When playback crosses into the next snapshot, only the slot that is no longer needed is
 * rewritten with {@code glBufferSubData} and the two vertex-array objects swap roles, so steady
 * playback uploads one snapshot per snapshot interval and nothing else.
 */
public final class ParticleLayer implements AutoCloseable {
    private final org.spindrift.viewer.gl.Shader shader = new org.spindrift.viewer.gl.Shader("particles");
    private final int particles;
    private final int vbo;
    private final int sourceVbo;
    private final int[] vao = new int[2]; // vao[k]: slot k is A, slot 1-k is B
    private final int[] slotSnapshot = {-1, -1};
    private final int uViewProjection;
    private final int uMix;
    private final int uQuantity;
    private final int uRange;
    private final int uPixelsPerUnit;
    private final int uSize;
    private final int uMap;
    private final float[] mapPoints = new float[15];
    private final float[] sourceColours = new float[32];
    private final int uSources;

    public ParticleLayer(int[] sourceOf) {
        particles = sourceOf.length;
        long slotBytes = (long) particles * RunData.STRIDE * 4;
        vbo = glGenBuffers();
        glBindBuffer(GL_ARRAY_BUFFER, vbo);
        glBufferData(GL_ARRAY_BUFFER, Math.max(4, 2 * slotBytes), GL_DYNAMIC_DRAW);
        sourceVbo = glGenBuffers();
        glBindBuffer(GL_ARRAY_BUFFER, sourceVbo);
        FloatBuffer src = MemoryUtil.memAllocFloat(Math.max(1, particles));
        for (int s : sourceOf) {
            src.put(s);
        }
        src.flip();
        glBufferData(GL_ARRAY_BUFFER, src, GL_STATIC_DRAW);
        MemoryUtil.memFree(src);
        int stride = RunData.STRIDE * 4;
        for (int k = 0; k < 2; k++) {
            vao[k] = glGenVertexArrays();
            glBindVertexArray(vao[k]);
            glBindBuffer(GL_ARRAY_BUFFER, vbo);
            long a = k * slotBytes;
            long b = (1 - k) * slotBytes;
            glVertexAttribPointer(0, 3, GL_FLOAT, false, stride, a);
            glVertexAttribPointer(1, 4, GL_FLOAT, false, stride, a + 12);
            glVertexAttribPointer(2, 3, GL_FLOAT, false, stride, b);
            glVertexAttribPointer(3, 4, GL_FLOAT, false, stride, b + 12);
            glBindBuffer(GL_ARRAY_BUFFER, sourceVbo);
            glVertexAttribPointer(4, 1, GL_FLOAT, false, 4, 0);
            for (int i = 0; i < 5; i++) {
                glEnableVertexAttribArray(i);
            }
        }
        glBindVertexArray(0);
        uViewProjection = shader.uniform("u_viewProjection");
        uMix = shader.uniform("u_mix");
        uQuantity = shader.uniform("u_quantity");
        uRange = shader.uniform("u_range");
        uPixelsPerUnit = shader.uniform("u_pixelsPerUnit");
        uSize = shader.uniform("u_size");
        uMap = shader.uniform("u_map");
        uSources = shader.uniform("u_sources");
        for (int k = 0; k < 8; k++) {
            int rgba = Palette.source(k);
            sourceColours[4 * k] = ((rgba >>> 24) & 0xff) / 255f;
            sourceColours[4 * k + 1] = ((rgba >>> 16) & 0xff) / 255f;
            sourceColours[4 * k + 2] = ((rgba >>> 8) & 0xff) / 255f;
            sourceColours[4 * k + 3] = 1f;
        }
    }

    /** @return the slot (0 or 1) holding snapshot s, or -1 */
    public int slotOf(int s) {
        return slotSnapshot[0] == s ? 0 : slotSnapshot[1] == s ? 1 : -1;
    }

    /** Uploads snapshot s into the slot that does not hold {@code keep}. */
    public void upload(int s, FloatBuffer data, int keep) {
        int slot = slotSnapshot[0] == keep && keep >= 0 ? 1 : 0;
        data.position(0).limit(particles * RunData.STRIDE);
        glBindBuffer(GL_ARRAY_BUFFER, vbo);
        glBufferSubData(GL_ARRAY_BUFFER, (long) slot * particles * RunData.STRIDE * 4, data);
        data.clear();
        slotSnapshot[slot] = s;
    }

    /**
     * Draws the particles between snapshots a and b (both must be uploaded; a == b is allowed).
     *
     * @param mix             0 at snapshot a, 1 at snapshot b
     * @param pixelsPerUnit   viewport height / (2 tan(fov / 2))
     * @param sizeM           sprite diameter in M
     */
    public void draw(OrbitCamera camera, int a, int b, float mix, Quantity q, float lo, float hi,
                     float pixelsPerUnit, float sizeM, ColourMaps maps) {
        int sa = slotOf(a);
        int sb = slotOf(b);
        if (sa < 0 || particles == 0) {
            return;
        }
        if (sb < 0 || sb == sa) {
            mix = 0f; // only one of the two snapshots is in memory: show it unmixed
        }
        shader.use();
        org.spindrift.viewer.gl.Shader.setMatrix(uViewProjection, camera.viewProjection());
        glUniform1f(uMix, mix);
        glUniform1i(uQuantity, q.ordinal());
        glUniform2f(uRange, lo, hi);
        glUniform1f(uPixelsPerUnit, pixelsPerUnit);
        glUniform1f(uSize, sizeM);
        if (q != Quantity.SOURCE) {
            Palette.controlPoints(q.ordinal(), mapPoints);
            glUniform3fv(uMap, mapPoints);
        }
        glUniform4fv(uSources, sourceColours);
        glEnable(GL_PROGRAM_POINT_SIZE);
        glEnable(GL_DEPTH_TEST);
        glDepthMask(false);
        glEnable(GL_BLEND);
        glBlendFuncSeparate(GL_SRC_ALPHA, GL_ONE_MINUS_SRC_ALPHA, GL_ONE, GL_ONE_MINUS_SRC_ALPHA);
        // the sprites carry their own soft edge: multisampling them only multiplies the blending work
        glDisable(GL_MULTISAMPLE);
        glBindVertexArray(vao[sa]);
        glDrawArrays(GL_POINTS, 0, particles);
        glBindVertexArray(0);
        glEnable(GL_MULTISAMPLE);
        glDepthMask(true);
    }

    @Override public void close() {
        shader.close();
        glDeleteBuffers(vbo);
        glDeleteBuffers(sourceVbo);
        glDeleteVertexArrays(vao[0]);
        glDeleteVertexArrays(vao[1]);
    }
}
