package org.spindrift.viewer.app;

import static org.lwjgl.opengl.GL33C.glFinish;

import java.io.PrintStream;
import java.util.Locale;
import org.spindrift.viewer.gl.Framebuffer;

/**
 * {@code --bench-frames N}: frames per second of the full frame (3D view with every particle,
 * panels, text) rendered offscreen at the chosen size, in two regimes: streaming (every frame
 * shows the next snapshot, so it is read from the archive by the reader thread and uploaded to
 * the GPU) and replaying between two snapshots with the camera turning (no upload). glFinish
 * closes each frame so the GPU work is counted.
 */
public final class Benchmark {
    private Benchmark() {
    }

    /** @return CPU time of the whole process (all threads) in ns, or -1 where the JVM does not tell */
    private static long processCpuNanos() {
        java.lang.management.OperatingSystemMXBean os = java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        if (os instanceof com.sun.management.OperatingSystemMXBean sun) {
            return sun.getProcessCpuTime();
        }
        return -1;
    }

    /** @return bytes allocated on the heap by this thread so far, or -1 where the JVM does not tell */
    private static long threadAllocatedBytes() {
        java.lang.management.ThreadMXBean t = java.lang.management.ManagementFactory.getThreadMXBean();
        if (t instanceof com.sun.management.ThreadMXBean sun && sun.isThreadAllocatedMemorySupported()) {
            return sun.getThreadAllocatedBytes(Thread.currentThread().getId());
        }
        return -1;
    }

    private static String parts(long[] ns, int frames) {
        return String.format(Locale.ROOT, "; per frame: snapshot wait+upload %.1f ms, 3D %.1f ms, panels+text %.1f ms",
                ns[0] * 1e-6 / frames, ns[1] * 1e-6 / frames, ns[2] * 1e-6 / frames);
    }

    public static int run(ViewerSession.Options o, int frames, PrintStream out) {
        try (ViewerSession session = new ViewerSession(o, false);
             Framebuffer fb = new Framebuffer(o.width(), o.height(), session.samples(false))) {
            Playback p = session.playback();
            int snapshots = session.info().snapshots();
            FrameComposer c = session.composer();
            // warm-up: shaders, first uploads
            for (int i = 0; i < 5; i++) {
                p.seekSnapshot(i % snapshots);
                fb.bind();
                c.render(fb.width(), fb.height(), p, true, 0);
            }
            glFinish();
            c.profile(true);
            long cpu0 = processCpuNanos();
            long t0 = System.nanoTime();
            for (int i = 0; i < frames; i++) {
                p.seekSnapshot(i % snapshots);
                fb.bind();
                c.render(fb.width(), fb.height(), p, true, 0);
                glFinish();
            }
            double streaming = (System.nanoTime() - t0) * 1e-9;
            long cpu1 = processCpuNanos();
            long[] parts1 = c.profileNanos().clone();
            c.profile(true);
            p.seekSnapshot(0);
            double t1 = p.start();
            double dt = snapshots > 1 ? (session.info().times()[1] - t1) / (frames + 1) : 0;
            long cpu2 = processCpuNanos();
            long alloc0 = threadAllocatedBytes();
            long t2 = System.nanoTime();
            for (int i = 0; i < frames; i++) {
                p.seek(t1 + i * dt);
                c.scene().camera().orbit(0.01, 0);
                fb.bind();
                c.render(fb.width(), fb.height(), p, true, 0);
                glFinish();
            }
            double replay = (System.nanoTime() - t2) * 1e-9;
            long cpu3 = processCpuNanos();
            long alloc1 = threadAllocatedBytes();
            long[] parts2 = c.profileNanos().clone();
            c.profile(false);
            out.println(String.format(Locale.ROOT, "view bench: %s", session.gl().renderer()));
            out.println(String.format(Locale.ROOT, "view bench: %d particles, %d snapshots, %dx%d, %d samples per pixel,"
                    + " %d frames each, %d cores", session.info().particles(), snapshots, o.width(), o.height(),
                    session.samples(false), frames, Runtime.getRuntime().availableProcessors()));
            out.println(String.format(Locale.ROOT, "view bench: streaming (new snapshot every frame): %.1f fps (%.2f ms/frame)%s",
                    frames / streaming, 1e3 * streaming / frames, parts(parts1, frames)));
            out.println(String.format(Locale.ROOT, "view bench: between snapshots, camera turning:  %.1f fps (%.2f ms/frame)%s",
                    frames / replay, 1e3 * replay / frames, parts(parts2, frames)));
            if (cpu0 >= 0) {
                out.println(String.format(Locale.ROOT, "view bench: CPU time of this process (all its threads, including"
                        + " Mesa's) per frame: streaming %.1f ms, between snapshots %.1f ms",
                        (cpu1 - cpu0) * 1e-6 / frames, (cpu3 - cpu2) * 1e-6 / frames));
            }
            if (alloc0 >= 0) {
                out.println(String.format(Locale.ROOT, "view bench: heap allocated by the render thread between snapshots:"
                        + " %.1f bytes per frame", (alloc1 - alloc0) / (double) frames));
            }
            out.println(String.format(Locale.ROOT, "view bench: load average %.2f over %d cores (the machine may be shared)",
                    java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage(),
                    Runtime.getRuntime().availableProcessors()));
            return 0;
        }
    }
}
