package org.spindrift.shared.testing;

import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;

/**
 * Debian's Python (python3-h5py, python3-astropy, python3-scipy) as an independent reader and
 * calculator for tests. Prefers {@code /usr/bin/python3}, where Debian installs those packages (a
 * {@code python3} earlier on PATH, for example from pyenv, may lack them), else {@code python3}.
 *
 * <p>When the modules cannot be imported the calling test is skipped with a message, unless the
 * environment sets {@code SPINDRIFT_REQUIRE_EXTERNAL=1} (as {@code .ci/run} does): then it fails.
 */
public final class ExternalPython {
    private static final long TIMEOUT_S = 120;

    private ExternalPython() {
    }

    /**
     * @param modules comma-separated modules to import, for example {@code "h5py, numpy"}
     * @param packages the Debian packages that provide them, for the skip or failure message
     * @return the interpreter that imports them (the test is skipped or failed otherwise)
     */
    public static String require(String modules, String packages) {
        for (String exe : candidates()) {
            try {
                Process p = new ProcessBuilder(exe, "-c", "import " + modules).redirectErrorStream(true).start();
                p.getInputStream().readAllBytes();
                if (p.waitFor(TIMEOUT_S, TimeUnit.SECONDS) && p.exitValue() == 0) {
                    return exe;
                }
            } catch (IOException | InterruptedException e) {
                // try the next interpreter
            }
        }
        String why = packages + " not installed (python3 cannot import " + modules + ")";
        if ("1".equals(System.getenv("SPINDRIFT_REQUIRE_EXTERNAL"))) {
            throw new AssertionError(why + "; required because SPINDRIFT_REQUIRE_EXTERNAL=1");
        }
        System.out.println("skipping: " + why);
        assumeTrue(false, why);
        return null;
    }

    /**
     * Runs a script with arguments and returns the lines it printed; fails the test on a non-zero
     * exit status or a time-out.
     */
    public static List<String> run(String interpreter, String script, String... args)
            throws IOException, InterruptedException {
        List<String> cmd = new ArrayList<>(List.of(interpreter, "-c", script));
        cmd.addAll(List.of(args));
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
        String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        if (!p.waitFor(TIMEOUT_S, TimeUnit.SECONDS)) {
            p.destroyForcibly();
            throw new AssertionError("python3 timed out: " + text);
        }
        if (p.exitValue() != 0) {
            throw new AssertionError("python3 failed (exit " + p.exitValue() + "): " + text);
        }
        return text.isBlank() ? List.of() : List.of(text.strip().split("\\R"));
    }

    private static List<String> candidates() {
        return Files.isExecutable(Path.of("/usr/bin/python3")) ? List.of("/usr/bin/python3", "python3")
                : List.of("python3");
    }
}
