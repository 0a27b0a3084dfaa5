package org.spindrift.sim.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.RunArchive;
import org.spindrift.sim.pipeline.RunContext;
import org.spindrift.sim.pipeline.RunNotes;
import org.spindrift.sim.pipeline.RunStage;
import org.spindrift.sim.run.ScenarioRun;
import org.spindrift.sim.scenario.ScenarioLoader;

/**
 * Degenerate sources (a very compact spot, a single particle, a ring of zero width, a source
 * that falls into the hole) finish with exit status 0, every data file and every plot; a plot
 * that cannot be drawn costs the run nothing but that plot, which the manifest records.
 */
class DegenerateRunsTest {
    @TempDir Path tmp;

    /** A small scenario; SOURCE is replaced by each case's source. */
    static final String BASE = String.join("\n",
            "name: degenerate",
            "black_hole:",
            "  mass_solar: 1.0e6",
            "  distance: 1 kpc",
            "  family: kerr",
            "  spin: 0.0",
            "observer:",
            "  inclination_deg: 30",
            "sources:",
            "SOURCE",
            "run:",
            "  duration: 40 M",
            "  snapshot_cadence: 4 M",
            "  tolerance: 1.0e-8",
            "imaging:",
            "  field_of_view_M: 24",
            "  pixels: 16",
            "");

    static final String SPOT = String.join("\n",
            "  - name: spot",
            "    kind: hot_spot",
            "    particles: PARTICLES",
            "    shape:",
            "      sigma_M: SIGMA",
            "    orbit:",
            "      circular:",
            "        radius_M: 8.0");

    static String scenario(String kind) {
        return BASE.replace("SOURCE", switch (kind) {
            case "compact" -> SPOT.replace("PARTICLES", "40").replace("SIGMA", "0.001");
            case "single" -> SPOT.replace("PARTICLES", "1").replace("SIGMA", "0.3");
            case "zero-width-ring" -> String.join("\n",
                    "  - name: ring",
                    "    kind: ring",
                    "    particles: 30",
                    "    shape:",
                    "      inner_radius_M: 8.0",
                    "      outer_radius_M: 8.0",
                    "      arc_deg: 40",
                    "    orbit:",
                    "      circular:",
                    "        radius_M: 8.0");
            // a spot falling radially from r = 2.6 M towards a Schwarzschild horizon at 2 M at 0.6 c:
            // every particle is captured within a few M
            case "captured" -> String.join("\n",
                    "  - name: plunge",
                    "    kind: hot_spot",
                    "    particles: 20",
                    "    shape:",
                    "      sigma_M: 0.05",
                    "    orbit:",
                    "      zamo_velocity:",
                    "        r_M: 2.6",
                    "        v_r: -0.6");
            default -> throw new IllegalArgumentException(kind);
        });
    }

    static final List<String> DATA = List.of(ArchiveLayout.MANIFEST, ArchiveLayout.SNAPSHOTS, ArchiveLayout.SUMMARY,
            ArchiveLayout.PERIODS, ArchiveLayout.SHEAR, ArchiveLayout.CENTROID, ArchiveLayout.LIGHTCURVE,
            ArchiveLayout.IMAGES);

    static final List<String> PLOTS = List.of("plots/positions.png", "plots/shape.png", "plots/lag.png",
            "plots/periods.png", "plots/light_track.png", "plots/light_offsets.png", "plots/light_curve.png",
            "plots/light_images.png");

    @ParameterizedTest
    @ValueSource(strings = {"compact", "single", "zero-width-ring", "captured"})
    void degenerateSourcesGiveACompleteRun(String kind) throws Exception {
        Path file = tmp.resolve(kind + ".yaml");
        Files.writeString(file, scenario(kind));
        Path out = tmp.resolve("run-" + kind);
        String[] io = CliCapture.run(0, "run", file.toString(), "-o", out.toString(), "--quiet", "--threads", "2");
        assertFalse(io[1].contains("Exception"), io[1]);
        for (String f : DATA) {
            assertTrue(Files.isRegularFile(out.resolve(f)), kind + ": " + f);
        }
        try (RunArchive a = RunArchive.open(out, true)) {
            assertFalse(a.manifest().has(RunNotes.PLOT_FAILURES), kind + ": " + a.manifest().get(RunNotes.PLOT_FAILURES));
            for (String p : PLOTS) {
                assertTrue(a.has(p), kind + ": " + p + " drawn and listed");
            }
            if (kind.equals("captured")) {
                // the scenario is built so that the whole source falls in (radial infall, see above)
                assertEquals(20L, a.endStates().get("captured"), a.manifest().get("end_states").toString());
            }
        }
    }

    @Test void aPlotThatFailsLeavesTheDataAndAManifestNote() throws Exception {
        Path file = tmp.resolve("single.yaml");
        Files.writeString(file, scenario("single"));
        Path out = tmp.resolve("run");
        List<RunStage> stages = new ArrayList<>(ScenarioRun.stages());
        stages.add(new RunStage() {
            @Override public String name() {
                return "broken-plot";
            }

            @Override public void run(RunContext ctx) throws IOException {
                RunNotes.guard(ctx).draw("plots/broken.png", () -> ctx.archive().writeStream("plots/broken.png", os -> {
                    os.write(new byte[] {1, 2, 3});
                    throw new IllegalArgumentException("Series name >r 6.00 - 6.00 M< has already been used");
                }));
            }
        });
        java.io.ByteArrayOutputStream err = new java.io.ByteArrayOutputStream();
        java.io.PrintStream old = System.err;
        try {
            System.setErr(new java.io.PrintStream(err, true, java.nio.charset.StandardCharsets.UTF_8));
            ScenarioRun.run(ScenarioRun.prepare(ScenarioLoader.load(file)), new ScenarioRun.Options(out, 1, false),
                    stages);
        } finally {
            System.setErr(old);
        }
        String[] lines = err.toString(java.nio.charset.StandardCharsets.UTF_8).lines()
                .filter(l -> l.contains("plots/broken.png")).toArray(String[]::new);
        assertEquals(1, lines.length, "one line on stderr");
        assertTrue(lines[0].contains("has already been used"), lines[0]);
        try (RunArchive a = RunArchive.open(out, true)) {
            JsonNode f = a.manifest().get(RunNotes.PLOT_FAILURES);
            assertEquals(1, f.size(), f.toString());
            assertEquals("plots/broken.png", f.get(0).get("plot").asText());
            assertTrue(f.get(0).get("reason").asText().contains("IllegalArgumentException"), f.toString());
            assertFalse(a.has("plots/broken.png"));
            for (String d : DATA) {
                assertTrue(Files.isRegularFile(out.resolve(d)), d);
            }
        }
        assertFalse(Files.exists(out.resolve("plots/broken.png")), "no half-written plot");
        assertFalse(Files.exists(out.resolve("plots/.broken.png.partial")), "no temporary file");
    }
}
