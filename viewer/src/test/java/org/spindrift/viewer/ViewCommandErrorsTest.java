package org.spindrift.viewer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.archive.ArchiveLayout;
import picocli.CommandLine;

/**
 * Bad input gives exit status 2 and one line naming the file or option (common practice for
 * command-line tools, no source; the project's rule in DEVELOPERS.md). None of these cases needs
 * a display: the run folder is checked before any window is opened.
 */
class ViewCommandErrorsTest {
    @TempDir Path tmp;

    private String[] run(String... args) {
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        PrintStream old = System.err;
        int code;
        try {
            System.setErr(new PrintStream(err, true, StandardCharsets.UTF_8));
            code = new CommandLine(new ViewCommand()).execute(args);
        } finally {
            System.setErr(old);
        }
        return new String[] {String.valueOf(code), err.toString(StandardCharsets.UTF_8)};
    }

    private static void assertOneLine(String[] r, String... mustContain) {
        assertEquals("2", r[0], "exit status for bad input: " + r[1]);
        String msg = r[1].trim();
        assertFalse(msg.contains("\n"), "one line: " + msg);
        assertFalse(msg.contains("Exception"), "no stack trace: " + msg);
        for (String s : mustContain) {
            assertTrue(msg.contains(s), "message names '" + s + "': " + msg);
        }
    }

    @Test void missingFolder() {
        assertOneLine(run(tmp.resolve("nothing-here").toString()), "nothing-here", "does not exist");
    }

    @Test void folderWithoutManifest() throws Exception {
        Path d = tmp.resolve("half");
        Files.createDirectories(d);
        Files.writeString(d.resolve(ArchiveLayout.SNAPSHOTS), "x");
        assertOneLine(run(d.toString()), "manifest.json");
    }

    @Test void damagedSnapshots() throws Exception {
        Path d = tmp.resolve("damaged");
        SyntheticRun.writeHotSpot(d, 50, 4, 3);
        Files.write(d.resolve(ArchiveLayout.SNAPSHOTS), new byte[] {1, 2, 3, 4, 5, 6, 7, 8});
        assertOneLine(run(d.toString()), "snapshots.h5", "does not match its sha256");
        assertOneLine(run(d.toString(), "--no-verify"), "snapshots.h5", "cannot be read");
    }

    @Test void missingSnapshots() throws Exception {
        Path d = tmp.resolve("nosnap");
        SyntheticRun.writeHotSpot(d, 50, 4, 3);
        Files.delete(d.resolve(ArchiveLayout.SNAPSHOTS));
        assertOneLine(run(d.toString()), "snapshots.h5");
    }

    @Test void damagedImages() throws Exception {
        Path d = tmp.resolve("badfits");
        SyntheticRun.writeHotSpot(d, 50, 4, 3, true);
        Files.writeString(d.resolve(ArchiveLayout.IMAGES), "SIMPLE  = not really a FITS file");
        assertOneLine(run(d.toString()), "images.fits");
        assertOneLine(run(d.toString(), "--no-verify"), "images.fits");
    }

    @Test void badCentroidTable() throws Exception {
        Path d = tmp.resolve("badcsv");
        SyntheticRun.writeHotSpot(d, 50, 4, 3, true);
        Files.writeString(d.resolve(ArchiveLayout.CENTROID), "time,flux\n0,1\n");
        assertOneLine(run(d.toString()), "centroid.csv", "sha256");
        assertOneLine(run(d.toString(), "--no-verify"), "centroid.csv", "x_uas");
    }

    /** A byte flip that gives an absurd radius, written with valid checksums: refused by its range. */
    @Test void absurdRadius() throws Exception {
        Path d = tmp.resolve("farout");
        double[][] x = {{6, 1e284}, {6, 1e284}};
        double[][] y = {{0, 0}, {1, 0}};
        SyntheticRun.writeLayout(d, x, y, new double[] {0, 10});
        assertOneLine(run(d.toString()), "snapshots.h5", "/r = 1.0E284", "physical range");
    }

    /** Another run's snapshots.h5 (other spin, other particle count) beside this run's manifest. */
    @Test void anotherRunsSnapshots() throws Exception {
        Path a = tmp.resolve("a");
        Path b = tmp.resolve("b");
        SyntheticRun.writeHotSpot(a, 50, 4, 3);
        SyntheticRun.writeLayout(b, new double[][] {{6, 7}, {6, 7}}, new double[][] {{0, 0}, {1, 1}},
                new double[] {0, 10});
        Files.copy(b.resolve(ArchiveLayout.SNAPSHOTS), a.resolve(ArchiveLayout.SNAPSHOTS),
                java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        assertOneLine(run(a.toString()), "snapshots.h5", "sha256");
        assertOneLine(run(a.toString(), "--no-verify"), "snapshots.h5", "does not belong to this run");
    }

    /** A centroid.csv cut off in the middle of a row. */
    @Test void truncatedCentroidTable() throws Exception {
        Path d = tmp.resolve("cut");
        SyntheticRun.writeHotSpot(d, 50, 4, 3, true);
        Path csv = d.resolve(ArchiveLayout.CENTROID);
        String text = Files.readString(csv);
        Files.writeString(csv, text.substring(0, text.length() - 12));
        assertOneLine(run(d.toString()), "centroid.csv", "sha256");
        assertOneLine(run(d.toString(), "--no-verify"), "centroid.csv", "fields");
    }

    /** A wrongly typed manifest value is named as such, not as missing. */
    @Test void wronglyTypedManifestValue() throws Exception {
        Path d = tmp.resolve("typed");
        SyntheticRun.writeHotSpot(d, 50, 4, 3);
        Path m = d.resolve(ArchiveLayout.MANIFEST);
        Files.writeString(m, Files.readString(m).replaceFirst("\"spin\" : [-0-9.eE]+", "\"spin\" : \"fast\""));
        assertOneLine(run(d.toString()), "black_hole.spin", "must be a number, got text 'fast'");
        Files.writeString(m, "{\"format\": \"spindrift-run\", oops}");
        String[] r = run(d.toString());
        assertOneLine(r, "manifest.json", "not valid JSON at line 1");
        assertFalse(r[1].contains("Source:"), "no parser internals: " + r[1]);
    }

    @Test void badOptions() throws Exception {
        Path d = tmp.resolve("ok");
        SyntheticRun.writeHotSpot(d, 50, 4, 3);
        assertOneLine(run(d.toString(), "--size", "10x10"), "--size", "64..8192");
        assertOneLine(run(d.toString(), "--size", "wide"), "--size");
        assertOneLine(run(d.toString(), "--every", "0"), "--every");
        assertOneLine(run(d.toString(), "--colour", "purple"), "--colour", "time-dilation");
        assertOneLine(run(d.toString(), "--sky-colours", "heat"), "--sky-colours", "default, grey");
        assertOneLine(run(d.toString(), "--camera", "above"), "--camera");
    }

    /** Without any display the viewer says how to run it and exits with 2 (child JVM, no X needed). */
    @Test void noDisplay() throws Exception {
        Path d = tmp.resolve("nodisplay");
        SyntheticRun.writeHotSpot(d, 50, 4, 3);
        ChildViewer.Result r = ChildViewer.runWithoutDisplay(tmp, d.toString());
        assertEquals(2, r.exit(), r.err());
        String[] lines = r.err().lines().filter(l -> !l.startsWith("SLF4J")).toArray(String[]::new);
        assertEquals(1, lines.length, "one line: " + r.err());
        assertTrue(lines[0].contains("xvfb-run -a ./spindrift view"), lines[0]);
        assertTrue(lines[0].contains("display"), lines[0]);
    }
}
