package org.spindrift.sim.fuzz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.stream.Stream;
import org.spindrift.sim.cli.Main;

/**
 * Runs the command line in-process under a time bound and checks the contract every input must
 * keep: exit status 0, or 2 with exactly one line on stderr; never another status, a stack trace
 * or a hang.
 */
final class Cli {
    /** Time bound of one command, seconds (a check takes well under a second). */
    static final long BOUND_S = 60;

    private static final ExecutorService POOL = Executors.newCachedThreadPool(r -> {
        Thread t = new Thread(r, "fuzz-cli");
        t.setDaemon(true);
        return t;
    });

    private Cli() {
    }

    /** @param code exit status @param out stdout @param err stderr */
    record Result(int code, String out, String err) {
    }

    /** Runs {@code spindrift args...} and checks the contract; @return the result. */
    static Result run(String what, String... args) throws Exception {
        return run(what, true, args);
    }

    /** As {@link #run}, but exit 2 may print several lines (one per problem, as {@code verify} does). */
    static Result runLines(String what, String... args) throws Exception {
        return run(what, false, args);
    }

    private static Result run(String what, boolean oneLine, String... args) throws Exception {
        PrintStream old = System.out;
        PrintStream oldErr = System.err;
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int code;
        try {
            System.setOut(new PrintStream(out, true, StandardCharsets.UTF_8));
            System.setErr(new PrintStream(err, true, StandardCharsets.UTF_8));
            Future<Integer> f = POOL.submit(() -> Main.execute(args));
            try {
                code = f.get(BOUND_S, TimeUnit.SECONDS);
            } catch (TimeoutException e) {
                f.cancel(true);
                fail(what + ": no answer within " + BOUND_S + " s");
                return null;
            } catch (java.util.concurrent.ExecutionException e) {
                fail(what + ": the command threw " + e.getCause(), e.getCause());
                return null;
            }
        } finally {
            System.setOut(old);
            System.setErr(oldErr);
        }
        Result r = new Result(code, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
        assertTrue(code == 0 || code == 2, what + ": exit status " + code + "; stderr: " + r.err);
        String trace = r.err + r.out;
        assertFalse(trace.contains("\tat ") || trace.contains("Exception:") || trace.contains("java.lang."),
                what + ": stack trace or exception name in the output: " + trace);
        if (code == 2 && oneLine) {
            List<String> lines = r.err.strip().lines().filter(l -> !l.startsWith("spindrift: warning")).toList();
            assertEquals(1, lines.size(), what + ": one line expected on stderr: " + r.err);
        }
        if (code == 2) {
            assertFalse(r.err.isBlank(), what + ": exit 2 without a message");
        }
        return r;
    }

    /** @return the names of every file and folder under dir, relative, sorted */
    static List<String> listing(Path dir) throws IOException {
        try (Stream<Path> s = Files.walk(dir)) {
            return s.map(p -> dir.relativize(p).toString()).sorted().toList();
        }
    }

    /** Deletes a folder tree. */
    static void delete(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return;
        }
        try (Stream<Path> s = Files.walk(dir)) {
            for (Path p : s.sorted(java.util.Comparator.reverseOrder()).toList()) {
                Files.delete(p);
            }
        }
    }
}
