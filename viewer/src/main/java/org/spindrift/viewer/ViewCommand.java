package org.spindrift.viewer;

import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.colour.ColourRamp;
import org.spindrift.viewer.app.Benchmark;
import org.spindrift.viewer.app.FrameExport;
import org.spindrift.viewer.app.ViewerSession;
import org.spindrift.viewer.app.ViewerWindow;
import org.spindrift.viewer.scene.Quantity;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code spindrift view RUN_DIR}: the replay window; with {@code --export-frames} an offscreen
 * render into numbered PNG files; with {@code --bench-frames} a frame-rate measurement.
 * Exit status 0 on success, 2 for bad input, a missing display or no OpenGL 3.3 (one line on
 * stderr, no stack trace).
 */
@Command(name = "view", mixinStandardHelpOptions = true, sortOptions = false,
        versionProvider = ViewCommand.VersionProvider.class,
        description = {"Replay a run folder in 3D (particles, horizon, landmark circles, source paths) beside the"
                + " sky image and centroid track; or export the replay as PNG frames.",
            "Needs OpenGL 3.3: a desktop session, or a virtual X server:",
            "  xvfb-run -a ./spindrift view RUN_DIR --export-frames DIR"},
        footer = {"", "Turn exported frames into a movie, for example:",
            "  ffmpeg -framerate 30 -i DIR/frame_%%05d.png -c:v libx264 -pix_fmt yuv420p \\", "         -crf 18 replay.mp4"})
public final class ViewCommand implements Callable<Integer> {
    /** Version string for {@code view --version}. */
    public static final class VersionProvider implements CommandLine.IVersionProvider {
        @Override public String[] getVersion() {
            return new String[] {"spindrift view " + org.spindrift.shared.Version.get()};
        }
    }

    /** Exit status for bad input, no display or no OpenGL. */
    public static final int EXIT_USAGE = 2;

    @Parameters(index = "0", paramLabel = "RUN_DIR", description = "run folder written by `spindrift run`")
    Path runDir;

    @Option(names = "--export-frames", paramLabel = "DIR",
            description = "render offscreen into DIR/frame_00000.png ... instead of opening a window")
    Path exportDir;

    @Option(names = "--size", paramLabel = "WxH", defaultValue = "1280x720",
            description = "frame size for export and benchmark, initial window size (default: ${DEFAULT-VALUE})")
    String size;

    @Option(names = "--every", paramLabel = "K", defaultValue = "1",
            description = "export every K-th snapshot (default: ${DEFAULT-VALUE})")
    int every;

    @Option(names = "--bench-frames", paramLabel = "N",
            description = "render N frames offscreen and print frames per second, then exit")
    Integer benchFrames;

    @Option(names = "--colour", paramLabel = "Q", defaultValue = "time-dilation",
            description = "initial particle colouring: time-dilation (1/u^t, the g of zero-angular-momentum photons;"
                    + " diverging colours centred on 1), emission, radius or source (default: ${DEFAULT-VALUE})")
    String colour;

    @Option(names = "--sky-colours", paramLabel = "RAMP", defaultValue = "default",
            description = "colours of the sky image: default (the project's perceptually uniform ramp, dark indigo"
                    + " to cream) or grey (default: ${DEFAULT-VALUE})")
    String skyColours;

    @Option(names = "--camera", paramLabel = "VIEW", defaultValue = "default",
            description = "initial camera: default, observer (the line of sight) or face-on (default: ${DEFAULT-VALUE})")
    String camera;

    @Option(names = "--camera-distance", paramLabel = "M",
            description = "camera distance from the black hole, M (default: the whole scene in view)")
    Double cameraDistance;

    @Option(names = "--samples", paramLabel = "N",
            description = "multisample anti-aliasing samples per pixel, 0 for none (default: 4 for exported frames"
                    + " and on graphics hardware, 0 in the window and benchmark on software OpenGL, where it halves"
                    + " the frame time)")
    Integer samples;

    @Option(names = "--bare", description = "3D view only, filling the frame: no sky panel, bars or labels")
    boolean bare;

    @Option(names = "--no-sky", description = "leave out the sky panel even when the run has sky data")
    boolean noSky;

    @Option(names = "--no-verify", description = "skip comparing every file with its sha256 in manifest.json (for"
            + " huge archives; the manifest, the snapshot file's origin and the values read are still checked)")
    boolean noVerify;

    @Override public Integer call() {
        PrintStream err = System.err;
        try {
            ViewerSession.Options o = options();
            if (benchFrames != null) {
                return Benchmark.run(o, benchFrames, System.out);
            }
            if (exportDir != null) {
                return FrameExport.run(o, exportDir, every, System.out);
            }
            return ViewerWindow.run(o);
        } catch (UserInputException e) {
            err.println("spindrift view: " + e.getMessage());
            err.flush();
            return EXIT_USAGE;
        }
    }

    private ViewerSession.Options options() {
        String[] wh = size.toLowerCase(java.util.Locale.ROOT).split("x");
        int w;
        int h;
        try {
            if (wh.length != 2) {
                throw new NumberFormatException();
            }
            w = Integer.parseInt(wh[0].trim());
            h = Integer.parseInt(wh[1].trim());
        } catch (NumberFormatException e) {
            throw new UserInputException("option --size: '" + size + "' is not WIDTHxHEIGHT (for example 1280x720)");
        }
        if (w < 64 || h < 64 || w > 8192 || h > 8192) {
            throw new UserInputException("option --size: " + w + "x" + h + " outside 64..8192 in each direction");
        }
        if (samples != null && (samples < 0 || samples > 16)) {
            throw new UserInputException("option --samples: " + samples + " outside 0..16");
        }
        if (every < 1) {
            throw new UserInputException("option --every: " + every + " must be at least 1");
        }
        if (benchFrames != null && (benchFrames < 1 || benchFrames > 1_000_000)) {
            throw new UserInputException("option --bench-frames: " + benchFrames + " outside 1..1000000");
        }
        if (benchFrames != null && exportDir != null) {
            throw new UserInputException("options --bench-frames and --export-frames: choose one");
        }
        Quantity q = Quantity.parse(colour);
        if (q == null) {
            throw new UserInputException("option --colour: '" + colour
                    + "' is not one of time-dilation, emission, radius, source");
        }
        ColourRamp sky = ColourRamp.skyOption(skyColours);
        if (sky == null) {
            throw new UserInputException("option --sky-colours: '" + skyColours + "' is not one of default, grey");
        }
        ViewerSession.CameraStart cam = ViewerSession.CameraStart.parse(camera);
        if (cam == null) {
            throw new UserInputException("option --camera: '" + camera + "' is not one of default, observer, face-on");
        }
        if (cameraDistance != null && !(cameraDistance > 0 && cameraDistance < 1e5)) {
            throw new UserInputException("option --camera-distance: " + cameraDistance + " outside (0, 1e5) M");
        }
        if (exportDir != null && Files.exists(exportDir) && !Files.isDirectory(exportDir)) {
            throw new UserInputException("option --export-frames: " + exportDir + " exists and is not a folder");
        }
        if (!Files.isRegularFile(runDir.resolve(ArchiveLayout.MANIFEST)) && Files.isDirectory(runDir)) {
            throw new UserInputException("run folder " + runDir + ": no " + ArchiveLayout.MANIFEST
                    + " (not a run folder, or the run did not complete)");
        }
        return new ViewerSession.Options(runDir, w, h, q, cam, cameraDistance, bare, noSky, samples, sky, !noVerify);
    }

    /** Runs {@code view} on its own (tests start it in a child JVM). */
    public static void main(String[] args) {
        CommandLine cl = new CommandLine(new ViewCommand());
        cl.setParameterExceptionHandler((ex, a) -> {
            System.err.println("spindrift view: " + ex.getMessage() + " (see --help)");
            return EXIT_USAGE;
        });
        System.exit(cl.execute(args));
    }
}
