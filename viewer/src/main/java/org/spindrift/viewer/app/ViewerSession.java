package org.spindrift.viewer.app;

import java.nio.file.Files;
import java.nio.file.Path;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.colour.ColourRamp;
import org.spindrift.viewer.data.ArchiveRunData;
import org.spindrift.viewer.data.RunData;
import org.spindrift.viewer.data.RunInfo;
import org.spindrift.viewer.data.SnapshotStream;
import org.spindrift.viewer.gl.GlContext;
import org.spindrift.viewer.scene.Quantity;
import org.spindrift.viewer.scene.SceneView;
import org.spindrift.viewer.sky.CentroidTrack;
import org.spindrift.viewer.sky.ImageCube;
import org.spindrift.viewer.sky.SkyPanel;

/**
 * Everything one replay needs, opened in a safe order (run folder and sky files first, so bad
 * input is reported before any window appears; then the OpenGL context and the GPU resources)
 * and closed in reverse.
 */
public final class ViewerSession implements AutoCloseable {
    /** Initial camera. */
    public enum CameraStart {
        DEFAULT, OBSERVER, FACE_ON;

        public static CameraStart parse(String s) {
            String k = s.trim().toLowerCase(java.util.Locale.ROOT).replace('_', '-');
            return switch (k) {
                case "default" -> DEFAULT;
                case "observer" -> OBSERVER;
                case "face-on", "faceon" -> FACE_ON;
                default -> null;
            };
        }
    }

    /** Parsed command-line options. */
    public record Options(Path runDir, int width, int height, Quantity colour, CameraStart camera,
                          Double cameraDistance, boolean bare, boolean noSky, Integer samples, ColourRamp skyColours,
                          boolean verify) {
        /** Options with the default sky colours and the run folder verified (checksums included). */
        public Options(Path runDir, int width, int height, Quantity colour, CameraStart camera, Double cameraDistance,
                       boolean bare, boolean noSky, Integer samples) {
            this(runDir, width, height, colour, camera, cameraDistance, bare, noSky, samples, ColourRamp.SKY, true);
        }

        /** Multisampling chosen by the user, else 4 (software renderers: see {@link ViewerSession#samples}). */
        public int samplesOr(int fallback) {
            return samples != null ? samples : fallback;
        }
    }

    /** Samples per pixel when the user gave none (4 with exported frames). */
    static final int DEFAULT_SAMPLES = 4;

    private final RunData run;
    private final GlContext gl;
    private final SnapshotStream stream;
    private final FrameComposer composer;
    private final Playback playback;
    private final Options options;

    /**
     * @param visible open a visible window (else a hidden one for offscreen work)
     */
    public ViewerSession(Options o, boolean visible) {
        this.options = o;
        RunData r = ArchiveRunData.open(o.runDir(), o.verify());
        ImageCube cube = null;
        CentroidTrack track = null;
        GlContext ctx = null;
        SnapshotStream s = null;
        FrameComposer c = null;
        SkyPanel sky = null;
        try {
            RunInfo info = r.info();
            if (!o.bare() && !o.noSky()) {
                Path img = o.runDir().resolve(ArchiveLayout.IMAGES);
                Path csv = o.runDir().resolve(ArchiveLayout.CENTROID);
                // only the run's own files: those its manifest lists (and the verification covered)
                if (Files.isRegularFile(img) && listed(r, ArchiveLayout.IMAGES)) {
                    cube = ImageCube.open(o.runDir(), info.mSeconds());
                }
                if (Files.isRegularFile(csv) && listed(r, ArchiveLayout.CENTROID)) {
                    track = CentroidTrack.read(o.runDir());
                }
            }
            String title = "Spindrift replay - " + info.title();
            ctx = GlContext.open(o.width(), o.height(), title, visible, visible ? o.samplesOr(DEFAULT_SAMPLES) : 0);
            if (visible && o.samples() == null && ctx.software()) {
                // software OpenGL: multisampling roughly doubles the frame time; trade it for speed
                ctx.close();
                ctx = null;
                ctx = GlContext.open(o.width(), o.height(), title, true, 0);
            }
            s = new SnapshotStream(r);
            if (!o.bare() && !o.noSky() && (cube != null || track != null)) {
                sky = new SkyPanel(cube, track, info.mSeconds() / 60.0);
                cube = null; // owned by the panel now
            }
            c = new FrameComposer(info, s, sky, o.bare(), o.skyColours());
            c.scene().quantity(o.colour());
            c.layout().update(o.width(), o.height(), o.bare(), sky != null);
            c.scene().aspect(c.layout().viewW / (float) Math.max(1, c.layout().viewH));
            applyCamera(c.scene(), o);
            playback = new Playback(info.times());
        } catch (RuntimeException e) {
            if (c != null) {
                c.close(); // closes the sky panel too
            } else if (sky != null) {
                sky.close();
            }
            if (s != null) {
                s.close();
            }
            if (cube != null) {
                cube.close();
            }
            if (ctx != null) {
                ctx.close();
            }
            r.close();
            throw e;
        }
        this.run = r;
        this.gl = ctx;
        this.stream = s;
        this.composer = c;
    }

    private static boolean listed(RunData r, String name) {
        return !(r instanceof ArchiveRunData a) || a.archive().has(name);
    }

    /** Puts the camera where the options ask. */
    public static void applyCamera(SceneView scene, Options o) {
        switch (o.camera()) {
            case OBSERVER -> scene.observerCamera();
            case FACE_ON -> scene.faceOnCamera();
            default -> scene.resetCamera();
        }
        if (o.cameraDistance() != null) {
            scene.camera().zoom(o.cameraDistance() / scene.camera().distance());
        }
    }

    /**
     * @param offscreenExport true for exported frames (always 4 samples unless the user chose)
     * @return samples per pixel for an offscreen framebuffer
     */
    public int samples(boolean offscreenExport) {
        if (options.samples() != null) {
            return options.samples();
        }
        return offscreenExport || !gl.software() ? DEFAULT_SAMPLES : 0;
    }

    public Options options() {
        return options;
    }

    public RunInfo info() {
        return run.info();
    }

    public GlContext gl() {
        return gl;
    }

    public FrameComposer composer() {
        return composer;
    }

    public Playback playback() {
        return playback;
    }

    @Override public void close() {
        composer.close();
        stream.close();
        gl.close();
        run.close();
    }
}
