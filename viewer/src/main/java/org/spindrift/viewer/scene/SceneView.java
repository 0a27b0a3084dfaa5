package org.spindrift.viewer.scene;

import static org.lwjgl.opengl.GL33C.*;

import java.nio.FloatBuffer;
import org.spindrift.shared.colour.ColourRamp;
import org.spindrift.viewer.data.RunData;
import org.spindrift.viewer.data.RunInfo;
import org.spindrift.viewer.data.SnapshotStream;

/**
 * The 3D panel: body, grid and landmark circles, source trails and particles, drawn into a
 * viewport rectangle of the current framebuffer. Owns the GL layers and the camera; keeps the two
 * snapshots that bracket the current time in the particle buffer.
 */
public final class SceneView implements AutoCloseable {
    /**
     * Sprite diameter as a fraction of the scene extent: about 0.3 of the mean spacing of N points
     * spread over the extent (0.3 / cbrt(N)), kept between 0.6 % and 3 % of the extent.
     */
    static double spriteFraction(int particles) {
        return Math.max(0.006, Math.min(0.03, 0.3 / Math.cbrt(Math.max(1, particles))));
    }

    private final RunInfo info;
    private final SnapshotStream stream;
    private final ParticleLayer particles;
    private final LandmarkLayer landmarks;
    private final TrailLayer trails;
    private final ColourMaps maps;
    private final ColourRanges ranges;
    private final OrbitCamera camera;
    private final ObserverGeometry observer;
    private final double extent;
    private final Uploader uploader = new Uploader();
    private float spriteSize;
    private float aspect = 1.3f;
    private int shownA = -1;
    private int shownB = -1;
    private Quantity quantity = Quantity.TIME_DILATION;
    private boolean showGrid = true;
    private boolean showRings = true;
    private boolean showTrails = true;

    /** Uploads a streamed snapshot into the particle buffer, keeping the other bracket snapshot. */
    private final class Uploader implements SnapshotStream.Sink {
        int keep = -1;

        @Override public void accept(int snapshot, FloatBuffer data) {
            particles.upload(snapshot, data, keep);
        }
    }

    /** Reads the first, middle and last snapshots (blocking) to fix colour ranges and the extent. */
    public SceneView(RunInfo info, SnapshotStream stream, ColourRamp skyColours) {
        this.maps = new ColourMaps(skyColours);
        this.info = info;
        this.stream = stream;
        this.particles = new ParticleLayer(info.sourceOf());
        this.observer = new ObserverGeometry(info.inclinationDeg(), info.positionAngleDeg());
        this.ranges = new ColourRanges();
        final double[] maxRho = {0};
        int s = info.snapshots();
        int[] probe = s >= 3 ? new int[] {0, s / 2, s - 1} : s == 2 ? new int[] {0, 1} : new int[] {0};
        for (int p : probe) {
            stream.get(p, true, (snap, data) -> {
                ranges.add(data, info.particles());
                maxRho[0] = Math.max(maxRho[0], robustExtent(data, info.particles()));
            });
        }
        ranges.finish();
        double lm = 0;
        for (double r : new double[] {info.landmarks().isco(), info.landmarks().omegaMax(),
            info.landmarks().ergoEquatorial(), info.landmarks().centralRadius()}) {
            if (Double.isFinite(r)) {
                lm = Math.max(lm, info.landmarks().displayRadius(r));
            }
        }
        extent = Math.max(Math.max(maxRho[0], lm * 1.3), 2.0);
        spriteSize = (float) (extent * spriteFraction(info.particles()));
        landmarks = new LandmarkLayer(info.landmarks(), extent);
        trails = new TrailLayer(info.centres(), info.times(), info.sourceNames().size());
        camera = new OrbitCamera(65, ObserverGeometry.AZIMUTH_DEG, defaultDistance());
        resetCamera();
    }

    /** 95th percentile of the distance from the origin of alive particles. */
    private static double robustExtent(FloatBuffer d, int n) {
        int step = Math.max(1, n / 20000);
        float[] r = new float[(n + step - 1) / step];
        int c = 0;
        for (int i = 0; i < n; i += step) {
            int o = i * RunData.STRIDE;
            if (d.get(o + RunData.ALIVE) > 0.5f) {
                float x = d.get(o);
                float y = d.get(o + 1);
                float z = d.get(o + 2);
                float v = (float) Math.sqrt(x * x + y * y + z * z);
                if (Float.isFinite(v)) {
                    r[c++] = v;
                }
            }
        }
        if (c == 0) {
            return 0;
        }
        java.util.Arrays.sort(r, 0, c);
        return r[(int) (0.95 * (c - 1))] * 1.15;
    }

    /** Distance at which the extent fills the smaller of the view's two directions. */
    private double defaultDistance() {
        double tanHalf = Math.tan(Math.toRadians(OrbitCamera.FOV_DEG) / 2) * Math.min(1.0, aspect);
        return extent / tanHalf * 0.9;
    }

    /** Sets the width/height of the 3D view used by the camera presets before the first frame. */
    public void aspect(float a) {
        if (a > 0) {
            aspect = a;
        }
    }

    /** The default camera: 25 degrees above the equatorial plane, the whole scene in view. */
    public void resetCamera() {
        camera.set(65, ObserverGeometry.AZIMUTH_DEG - 30, defaultDistance(), 0);
    }

    /** The camera where the observer is (inclination, position angle). */
    public void observerCamera() {
        observer.apply(camera, defaultDistance());
    }

    /** Face-on from above the equatorial plane (+x right, +y up). */
    public void faceOnCamera() {
        camera.set(0, -90, defaultDistance(), 0);
    }

    public OrbitCamera camera() {
        return camera;
    }

    public ObserverGeometry observer() {
        return observer;
    }

    public double extent() {
        return extent;
    }

    public double gridStep() {
        return landmarks.gridStep();
    }

    public Quantity quantity() {
        return quantity;
    }

    public void quantity(Quantity q) {
        quantity = q;
    }

    public ColourRanges ranges() {
        return ranges;
    }

    public void toggleGrid() {
        showGrid = !showGrid;
    }

    public void toggleRings() {
        showRings = !showRings;
    }

    public void toggleTrails() {
        showTrails = !showTrails;
    }

    public boolean ringsShown() {
        return showRings;
    }

    /** Sprite diameter, M. */
    public void spriteScale(float factor) {
        spriteSize = (float) Math.max(extent * 1e-4, Math.min(extent * 0.2, spriteSize * factor));
    }

    /**
     * Makes sure snapshots a and b are in the particle buffer.
     *
     * @param block wait for the reader (export, benchmark) rather than keep the previous pair
     * @return true when both are present
     */
    public boolean prepare(int a, int b, int direction, boolean block) {
        stream.aim(direction >= 0 ? a : b, direction);
        if (particles.slotOf(a) < 0) {
            uploader.keep = b;
            stream.get(a, block, uploader);
        }
        if (particles.slotOf(b) < 0) {
            uploader.keep = a;
            stream.get(b, block, uploader);
        }
        boolean ok = particles.slotOf(a) >= 0 && particles.slotOf(b) >= 0;
        if (ok) {
            shownA = a;
            shownB = b;
        }
        return ok;
    }

    /**
     * Draws the 3D view into the viewport (x, y from the bottom-left, in framebuffer pixels).
     *
     * @param now current time, M; a, b, mix: the bracketing snapshots as given to prepare
     */
    public void draw(int x, int y, int w, int h, double now, int a, int b, double mix) {
        glViewport(x, y, w, h);
        glEnable(GL_SCISSOR_TEST);
        glScissor(x, y, w, h);
        glClearColor(((Palette.BACKGROUND >>> 24) & 0xff) / 255f, ((Palette.BACKGROUND >>> 16) & 0xff) / 255f,
                ((Palette.BACKGROUND >>> 8) & 0xff) / 255f, 1f);
        glClear(GL_COLOR_BUFFER_BIT | GL_DEPTH_BUFFER_BIT);
        aspect = w / (float) Math.max(1, h);
        camera.update(aspect);
        landmarks.drawBody(camera);
        landmarks.drawLines(camera, showGrid, showRings);
        if (showTrails) {
            trails.draw(camera, a, now, Math.max((info.times()[info.snapshots() - 1] - info.times()[0]) * 0.35, 1e-9));
        }
        float mixF = (float) mix;
        int pa = a;
        int pb = b;
        if (particles.slotOf(a) < 0 || particles.slotOf(b) < 0) {
            pa = shownA; // the reader has not caught up: keep showing the last pair
            pb = shownB;
            mixF = 1f;
        }
        float ppu = (float) (h / (2 * Math.tan(Math.toRadians(OrbitCamera.FOV_DEG) / 2)));
        particles.draw(camera, pa, pb, mixF, quantity, ranges.lo(quantity), ranges.hi(quantity), ppu, spriteSize, maps);
        glDisable(GL_SCISSOR_TEST);
    }

    public ColourMaps maps() {
        return maps;
    }

    @Override public void close() {
        particles.close();
        landmarks.close();
        trails.close();
        maps.close();
    }
}
