package org.spindrift.sim.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

/** Runs the command line in-process, capturing what it prints, and checks the exit status. */
final class CliCapture {
    private CliCapture() {
    }

    /** @return {stdout, stderr} of {@code spindrift args...}, after asserting the exit status */
    static String[] run(int expectedExit, String... args) {
        PrintStream old = System.out;
        PrintStream oldErr = System.err;
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        try {
            System.setOut(new PrintStream(out, true, StandardCharsets.UTF_8));
            System.setErr(new PrintStream(err, true, StandardCharsets.UTF_8));
            int code = Main.execute(args);
            assertEquals(expectedExit, code, "exit status; stderr: " + err.toString(StandardCharsets.UTF_8));
        } finally {
            System.setOut(old);
            System.setErr(oldErr);
        }
        return new String[] {out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8)};
    }
}
