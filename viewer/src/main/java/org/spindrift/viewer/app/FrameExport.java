package org.spindrift.viewer.app;

import java.io.IOException;
import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import org.spindrift.shared.UserInputException;
import org.spindrift.viewer.gl.Framebuffer;
import org.spindrift.viewer.gl.PixelWriter;

/**
 * {@code --export-frames}: renders every K-th snapshot offscreen (hidden window, multisampled
 * framebuffer object) into DIR/frame_00000.png, frame_00001.png, ... Each file is written under a
 * temporary name and renamed when complete.
 */
public final class FrameExport {
    private FrameExport() {
    }

    /** File name of exported frame i. */
    public static String frameName(int i) {
        return String.format(java.util.Locale.ROOT, "frame_%05d.png", i);
    }

    public static int run(ViewerSession.Options o, Path dir, int every, PrintStream out) {
        try (ViewerSession session = new ViewerSession(o, false);
             Framebuffer fb = new Framebuffer(o.width(), o.height(), session.samples(true));
             PixelWriter pixels = new PixelWriter()) {
            try {
                Files.createDirectories(dir);
            } catch (IOException e) {
                throw new UserInputException("option --export-frames: cannot create folder " + dir + " (" + e.getMessage() + ")");
            }
            Playback p = session.playback();
            int snapshots = session.info().snapshots();
            int n = 0;
            for (int s = 0; s < snapshots; s += every) {
                p.seekSnapshot(s);
                fb.bind();
                session.composer().render(fb.width(), fb.height(), p, true, 0);
                fb.resolve();
                pixels.read(fb.width(), fb.height());
                Path file = dir.resolve(frameName(n));
                try {
                    pixels.writePng(file, fb.width(), fb.height());
                } catch (IOException e) {
                    throw new UserInputException("option --export-frames: cannot write " + file + " (" + e.getMessage() + ")");
                }
                n++;
            }
            out.println("view: wrote " + n + " frames (" + o.width() + "x" + o.height() + ") to " + dir);
            if (Files.exists(dir.resolve(frameName(n)))) {
                out.println("view: note: " + dir + " also holds " + frameName(n) + " and perhaps more from an earlier"
                        + " export; remove them before making a movie");
            }
            out.println("view: make a movie with: ffmpeg -framerate 30 -i " + dir.resolve("frame_%05d.png")
                    + " -c:v libx264 -pix_fmt yuv420p -crf 18 replay.mp4");
            return 0;
        }
    }
}
