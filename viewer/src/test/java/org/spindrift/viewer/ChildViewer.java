package org.spindrift.viewer;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;

/**
 * Runs {@code view} in a child JVM (class path of the test), under {@code xvfb-run -a} (or an
 * {@code Xvfb} started here) when there is no DISPLAY. Tests that need OpenGL skip when there is no
 * display and no Xvfb, but fail when SPINDRIFT_REQUIRE_EXTERNAL=1 (CI).
 */
final class ChildViewer {
    private ChildViewer() {
    }

    /** Result of a child run. */
    record Result(int exit, String out, String err) {
    }

    static boolean required() {
        return "1".equals(System.getenv("SPINDRIFT_REQUIRE_EXTERNAL"));
    }

    static boolean onPath(String exe) {
        String path = System.getenv("PATH");
        if (path == null) {
            return false;
        }
        for (String d : path.split(File.pathSeparator)) {
            if (Files.isExecutable(Path.of(d, exe))) {
                return true;
            }
        }
        return false;
    }

    /** Skips (or fails in CI) when there is no way to get an X display. */
    static void requireDisplayOrXvfb() {
        String d = System.getenv("DISPLAY");
        boolean ok = (d != null && !d.isEmpty()) || onPath("xvfb-run") || onPath("Xvfb");
        if (!ok) {
            String msg = "no DISPLAY and neither xvfb-run nor Xvfb: the OpenGL viewer test cannot run (install xvfb,"
                    + " xauth, libgl1-mesa-dri)";
            if (required()) {
                throw new AssertionError(msg + " but SPINDRIFT_REQUIRE_EXTERNAL=1");
            }
            Assumptions.abort(msg);
        }
    }

    /**
     * Runs view with a display: the current one; else under {@code xvfb-run -a}; else on an X
     * server {@code Xvfb :N} started here for the run.
     */
    static Result runWithDisplay(Path workDir, String... args) throws IOException, InterruptedException {
        List<String> cmd = new ArrayList<>();
        String d = System.getenv("DISPLAY");
        if (d != null && !d.isEmpty()) {
            return run(workDir, cmd, null, args);
        }
        if (onPath("xvfb-run")) {
            cmd.addAll(List.of("xvfb-run", "-a", "-s", "-screen 0 1280x1024x24"));
            return run(workDir, cmd, null, args);
        }
        for (int n = 99; n > 80; n--) {
            if (Files.exists(Path.of("/tmp/.X11-unix/X" + n)) || Files.exists(Path.of("/tmp/.X" + n + "-lock"))) {
                continue;
            }
            Process x = new ProcessBuilder("Xvfb", ":" + n, "-screen", "0", "1280x1024x24", "-nolisten", "tcp")
                    .redirectErrorStream(true).redirectOutput(workDir.resolve("xvfb.log").toFile()).start();
            try {
                for (int i = 0; i < 100 && x.isAlive() && !Files.exists(Path.of("/tmp/.X11-unix/X" + n)); i++) {
                    Thread.sleep(100);
                }
                if (!x.isAlive()) {
                    continue; // display number taken meanwhile: try the next
                }
                return run(workDir, cmd, ":" + n, args);
            } finally {
                x.destroy();
                x.waitFor(10, TimeUnit.SECONDS);
            }
        }
        throw new AssertionError("could not start Xvfb on any display :81..:99");
    }

    /** Runs view with DISPLAY and WAYLAND_DISPLAY removed from the environment. */
    static Result runWithoutDisplay(Path workDir, String... args) throws IOException, InterruptedException {
        return run(workDir, new ArrayList<>(), "", args);
    }

    /** @param display null: inherit; "": remove DISPLAY and WAYLAND_DISPLAY; else set DISPLAY */
    private static Result run(Path workDir, List<String> cmd, String display, String... args)
            throws IOException, InterruptedException {
        cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        cmd.add("-Xmx512m");
        cmd.add("-Djava.awt.headless=true");
        cmd.add("-cp");
        cmd.add(System.getProperty("java.class.path"));
        cmd.add(ViewCommand.class.getName());
        cmd.addAll(List.of(args));
        ProcessBuilder pb = new ProcessBuilder(cmd).directory(workDir.toFile());
        Map<String, String> env = pb.environment();
        if (display != null && display.isEmpty()) {
            env.remove("DISPLAY");
            env.remove("WAYLAND_DISPLAY");
        } else if (display != null) {
            env.put("DISPLAY", display);
        }
        Path out = workDir.resolve("child.out");
        Path err = workDir.resolve("child.err");
        pb.redirectOutput(out.toFile()).redirectError(err.toFile());
        Process p = pb.start();
        if (!p.waitFor(180, TimeUnit.SECONDS)) {
            p.destroyForcibly();
            throw new AssertionError("view did not finish within 180 s: " + cmd);
        }
        return new Result(p.exitValue(), Files.readString(out, StandardCharsets.UTF_8),
                Files.readString(err, StandardCharsets.UTF_8));
    }
}
