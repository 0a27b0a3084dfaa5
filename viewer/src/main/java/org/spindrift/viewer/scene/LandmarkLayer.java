package org.spindrift.viewer.scene;

import static org.lwjgl.opengl.GL33C.*;

import java.nio.FloatBuffer;
import org.lwjgl.system.MemoryUtil;
import org.spindrift.viewer.data.Landmarks;
import org.spindrift.viewer.gl.Shader;
import org.spindrift.viewer.gl.VertexArray;

/**
 * The fixed geometry of the 3D view: the horizon (or surface) as a dark oblate body, the
 * equatorial ergosurface, ISCO and Omega-maximum circles, a faint polar grid in the equatorial
 * plane and the spin axis (+z, from the pole of the body). Radii are Boyer-Lindquist-like r mapped to the display's Cartesian
 * coordinates (cylindrical radius sqrt(r^2 + a^2) in the equatorial plane).
 */
public final class LandmarkLayer implements AutoCloseable {
    private static final int STACKS = 48;
    private static final int SLICES = 96;

    private final Shader lines = new Shader("lines");
    private final Shader body = new Shader("sphere");
    private final LineMesh grid;
    private final LineMesh rings;
    private final LineMesh axis;
    private final VertexArray sphere;
    private final int sphereIndices;
    private final int uLinesVp;
    private final int uLinesTrail;
    private final int uBodyVp;
    private final int uBodyScale;
    private final int uBodyEye;
    private final int uBodyColour;
    private final int uBodyRim;
    private final Landmarks landmarks;
    private final double gridStep;
    private final int gridCircles;

    /**
     * @param landmarks radii to draw
     * @param extent    display radius the grid should reach, M
     */
    public LandmarkLayer(Landmarks landmarks, double extent) {
        this.landmarks = landmarks;
        gridStep = niceStep(extent / 4);
        gridCircles = (int) Math.ceil(extent / gridStep);
        try (LineBuilder b = new LineBuilder()) {
            int gridColour = Palette.GRID;
            for (int k = 1; k <= gridCircles; k++) {
                b.circle(k * gridStep, gridColour, false);
            }
            double rMax = gridCircles * gridStep;
            for (int k = 0; k < 12; k++) {
                double a = Math.PI * k / 6;
                double r0 = k % 3 == 0 ? 0 : gridStep;
                b.segment(r0 * Math.cos(a), r0 * Math.sin(a), 0, rMax * Math.cos(a), rMax * Math.sin(a), 0,
                        k % 3 == 0 ? Palette.alpha(gridColour, 0xa0) : gridColour);
            }
            grid = new LineMesh(b);
        }
        try (LineBuilder b = new LineBuilder()) {
            double rc = landmarks.centralRadius();
            double pole = Double.isFinite(rc) ? rc : 0;
            b.segment(0, 0, pole, 0, 0, pole + Math.max(2, 0.18 * extent), Palette.alpha(Palette.ACCENT, 0x80));
            axis = new LineMesh(b);
        }
        try (LineBuilder b = new LineBuilder()) {
            if (Double.isFinite(landmarks.ergoEquatorial())) {
                b.circle(landmarks.displayRadius(landmarks.ergoEquatorial()), Palette.ERGO, true);
            }
            if (Double.isFinite(landmarks.isco())) {
                b.circle(landmarks.displayRadius(landmarks.isco()), Palette.ISCO, false);
            }
            if (Double.isFinite(landmarks.omegaMax())) {
                b.circle(landmarks.displayRadius(landmarks.omegaMax()), Palette.OMEGA_MAX, true);
            }
            rings = new LineMesh(b);
        }
        // unit sphere, indexed triangles
        FloatBuffer v = MemoryUtil.memAllocFloat((STACKS + 1) * (SLICES + 1) * 3);
        for (int i = 0; i <= STACKS; i++) {
            double th = Math.PI * i / STACKS;
            for (int j = 0; j <= SLICES; j++) {
                double ph = 2 * Math.PI * j / SLICES;
                v.put((float) (Math.sin(th) * Math.cos(ph))).put((float) (Math.sin(th) * Math.sin(ph)))
                        .put((float) Math.cos(th));
            }
        }
        v.flip();
        java.nio.IntBuffer idx = MemoryUtil.memAllocInt(STACKS * SLICES * 6);
        for (int i = 0; i < STACKS; i++) {
            for (int j = 0; j < SLICES; j++) {
                int a = i * (SLICES + 1) + j;
                int c = a + SLICES + 1;
                idx.put(a).put(c).put(a + 1).put(a + 1).put(c).put(c + 1);
            }
        }
        idx.flip();
        sphereIndices = STACKS * SLICES * 6;
        sphere = VertexArray.indexed(v, idx, GL_STATIC_DRAW, 3);
        MemoryUtil.memFree(v);
        MemoryUtil.memFree(idx);
        uLinesVp = lines.uniform("u_viewProjection");
        uLinesTrail = lines.uniform("u_trail");
        uBodyVp = body.uniform("u_viewProjection");
        uBodyScale = body.uniform("u_scale");
        uBodyEye = body.uniform("u_eye");
        uBodyColour = body.uniform("u_colour");
        uBodyRim = body.uniform("u_rim");
    }

    /** @return a 1, 2 or 5 times a power of ten close to x */
    static double niceStep(double x) {
        if (!(x > 0)) {
            return 1;
        }
        double p = Math.pow(10, Math.floor(Math.log10(x)));
        double m = x / p;
        return (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * p;
    }

    /** @return the spacing of the grid circles, M */
    public double gridStep() {
        return gridStep;
    }

    /** Draws the opaque body (writes depth, so particles behind it are hidden). */
    public void drawBody(OrbitCamera camera) {
        double r = landmarks.centralRadius();
        if (!(r > 0)) {
            return;
        }
        boolean surface = !(landmarks.horizon() > 0);
        body.use();
        Shader.setMatrix(uBodyVp, camera.viewProjection());
        float rho = (float) landmarks.displayRadius(r);
        glUniform3f(uBodyScale, rho, rho, (float) r);
        glUniform3f(uBodyEye, camera.eye().x, camera.eye().y, camera.eye().z);
        if (surface) {
            glUniform3f(uBodyColour, 0.10f, 0.09f, 0.08f);
            glUniform3f(uBodyRim, 0.45f, 0.38f, 0.30f);
        } else {
            glUniform3f(uBodyColour, 0f, 0f, 0f);
            glUniform3f(uBodyRim, 0.22f, 0.30f, 0.42f);
        }
        glEnable(GL_DEPTH_TEST);
        glDepthMask(true);
        glDisable(GL_BLEND);
        sphere.bind();
        glDrawElements(GL_TRIANGLES, sphereIndices, GL_UNSIGNED_INT, 0);
        glBindVertexArray(0);
    }

    /** Draws grid, axis and landmark circles (depth-tested, no depth writes). */
    public void drawLines(OrbitCamera camera, boolean showGrid, boolean showRings) {
        lines.use();
        Shader.setMatrix(uLinesVp, camera.viewProjection());
        glUniform1i(uLinesTrail, 0);
        glEnable(GL_DEPTH_TEST);
        glDepthMask(false);
        glEnable(GL_BLEND);
        glBlendFuncSeparate(GL_SRC_ALPHA, GL_ONE_MINUS_SRC_ALPHA, GL_ONE, GL_ONE_MINUS_SRC_ALPHA);
        if (showGrid) {
            grid.array.bind();
            glDrawArrays(GL_LINES, 0, grid.vertices);
            // the spin axis, unless it is seen end-on (then it would be a stray dot at the centre)
            if (camera.polarDeg() > 3 && camera.polarDeg() < 177) {
                axis.array.bind();
                glDrawArrays(GL_LINES, 0, axis.vertices);
            }
        }
        if (showRings) {
            rings.array.bind();
            glDrawArrays(GL_LINES, 0, rings.vertices);
        }
        glBindVertexArray(0);
        glDepthMask(true);
    }

    @Override public void close() {
        lines.close();
        body.close();
        grid.close();
        rings.close();
        axis.close();
        sphere.close();
    }
}
