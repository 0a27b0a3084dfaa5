package org.spindrift.viewer.scene;

import java.nio.FloatBuffer;
import org.lwjgl.system.MemoryUtil;

/** Collects line vertices (x, y, z, r, g, b, a, time) at load time, for a static vertex buffer. */
final class LineBuilder implements AutoCloseable {
    static final int FLOATS = 8;
    private FloatBuffer data = MemoryUtil.memAllocFloat(4096 * FLOATS);

    int vertices() {
        return data.position() / FLOATS;
    }

    void vertex(double x, double y, double z, int rgba, double time) {
        if (data.remaining() < FLOATS) {
            data = MemoryUtil.memRealloc(data, data.capacity() * 2);
        }
        data.put((float) x).put((float) y).put((float) z)
                .put(((rgba >>> 24) & 0xff) / 255f).put(((rgba >>> 16) & 0xff) / 255f)
                .put(((rgba >>> 8) & 0xff) / 255f).put((rgba & 0xff) / 255f).put((float) time);
    }

    /** Circle of cylindrical radius rho in the plane z = 0, as line segments; dashed if asked. */
    void circle(double rho, int rgba, boolean dashed) {
        int n = 192;
        for (int i = 0; i < n; i++) {
            if (dashed && (i % 4) >= 2) {
                continue;
            }
            double a0 = 2 * Math.PI * i / n;
            double a1 = 2 * Math.PI * (i + 1) / n;
            vertex(rho * Math.cos(a0), rho * Math.sin(a0), 0, rgba, 0);
            vertex(rho * Math.cos(a1), rho * Math.sin(a1), 0, rgba, 0);
        }
    }

    void segment(double x0, double y0, double z0, double x1, double y1, double z1, int rgba) {
        vertex(x0, y0, z0, rgba, 0);
        vertex(x1, y1, z1, rgba, 0);
    }

    FloatBuffer flip() {
        data.flip();
        return data;
    }

    @Override public void close() {
        MemoryUtil.memFree(data);
    }
}
