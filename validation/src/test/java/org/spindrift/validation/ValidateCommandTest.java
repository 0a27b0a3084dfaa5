package org.spindrift.validation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.sim.cli.Main;

class ValidateCommandTest {
    @Test
    void writesReportAndPlots(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("val");
        assertEquals(0, Main.execute("validate", "-o", out.toString()));
        String md = Files.readString(out.resolve("report.md"));
        assertTrue(md.contains("| quantity | reference | source | measured |"), md);
        assertTrue(md.contains("Cutler, Kennefick & Poisson 1994"));
        assertTrue(!md.contains("FAIL"));
        for (String png : new String[] {ValidationReport.ADVANCE_PLOT, ValidationReport.RESIDUAL_PLOT}) {
            byte[] b = Files.readAllBytes(out.resolve(png));
            assertEquals((byte) 0x89, b[0]); // PNG signature (ISO/IEC 15948)
            assertEquals('P', b[1]);
        }
        try (var s = Files.list(out)) {
            assertTrue(s.noneMatch(p -> p.getFileName().toString().contains("partial")));
        }
    }

    @Test
    void outputThatIsAFileIsBadInput(@TempDir Path dir) throws Exception {
        Path f = Files.writeString(dir.resolve("x"), "x");
        assertEquals(2, Main.execute("validate", "-o", f.toString()));
    }

    @Test
    void aFailedCheckGivesExitStatusOneAndIsMarkedInTheReport(@TempDir Path dir) throws Exception {
        MotionChecks.Series series = new MotionChecks.Series(0.3, new double[] {10, 100},
                new double[] {SchwarzschildPrecession.exact(10, 0.3), SchwarzschildPrecession.exact(100, 0.3)});
        java.util.List<Check> checks = java.util.List.of(new Check("g", "deliberately wrong", 1.0, "test", 2.0, 0.1),
                new Check("g", "right", 1.0, "test", 1.0, 0.1));
        java.io.PrintStream old = System.out;
        java.io.ByteArrayOutputStream buf = new java.io.ByteArrayOutputStream();
        int code;
        try {
            System.setOut(new java.io.PrintStream(buf, true, java.nio.charset.StandardCharsets.UTF_8));
            code = ValidateCommand.report(dir, new ValidationSuite.Run(checks, series));
        } finally {
            System.setOut(old);
        }
        assertEquals(1, code);
        assertTrue(buf.toString(java.nio.charset.StandardCharsets.UTF_8).contains("deliberately wrong"));
        String md = Files.readString(dir.resolve("report.md"));
        assertTrue(md.contains("**FAIL**") && md.contains("1 failed"), md);
    }
}
