package org.spindrift.sim.run;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.AtomicFiles;
import org.spindrift.shared.archive.RunArchive;
import org.spindrift.shared.scenario.VelocityModel;
import org.spindrift.sim.history.ParticleHistory;
import org.spindrift.sim.history.Subsample;
import org.spindrift.sim.pipeline.RunContext;
import org.spindrift.sim.pipeline.RunStage;
import org.spindrift.sim.pipeline.SnapshotStage;
import org.spindrift.sim.scenario.LoadedScenario;

/** The run: reproducibility whatever the thread count, the archive's contents, interrupted runs. */
class ScenarioRunTest {
    @TempDir Path tmp;

    static LoadedScenario thermalSpot(int n) {
        return TestScenarios.scenario(TestScenarios.kerr(0.6),
                List.of(TestScenarios.hotSpot(n, 7.0, 0.8, new VelocityModel(VelocityModel.Kind.THERMAL, 0.02))),
                60, 6, 99, 50);
    }

    @Test void sameSeedGivesBitwiseIdenticalSnapshotsWhateverTheThreads() throws Exception {
        // 300 particles = 5 chunks of 64: several threads really share the work
        List<RunStage> stages = List.of(new SnapshotStage(), new org.spindrift.sim.pipeline.AnalysisStage(),
                new org.spindrift.sim.pipeline.PlotStage());
        Path a = ScenarioRun.run(ScenarioRun.prepare(thermalSpot(300)), new ScenarioRun.Options(tmp.resolve("a"), 1, false),
                stages).folder();
        Path b = ScenarioRun.run(ScenarioRun.prepare(thermalSpot(300)), new ScenarioRun.Options(tmp.resolve("b"), 3, false),
                stages).folder();
        byte[] ha = Files.readAllBytes(a.resolve(ArchiveLayout.SNAPSHOTS));
        byte[] hb = Files.readAllBytes(b.resolve(ArchiveLayout.SNAPSHOTS));
        assertArrayEquals(ha, hb, "snapshots.h5 differs between 1 and 3 threads");
        assertEquals(Files.readString(a.resolve(ArchiveLayout.PERIODS)), Files.readString(b.resolve(ArchiveLayout.PERIODS)));
        assertEquals(Files.readString(a.resolve(ArchiveLayout.SHEAR)), Files.readString(b.resolve(ArchiveLayout.SHEAR)));
        // the figures, drawn on the run's threads, are the same files in the same manifest order
        try (org.spindrift.shared.archive.RunArchive ra = org.spindrift.shared.archive.RunArchive.open(a);
                org.spindrift.shared.archive.RunArchive rb = org.spindrift.shared.archive.RunArchive.open(b)) {
            assertEquals(List.copyOf(ra.files().keySet()), List.copyOf(rb.files().keySet()));
            for (String f : ra.files().keySet()) {
                if (f.startsWith("plots/")) {
                    assertArrayEquals(Files.readAllBytes(a.resolve(f)), Files.readAllBytes(b.resolve(f)), f);
                }
            }
            assertTrue(ra.files().containsKey("plots/shape.svg"), "the figures were drawn");
        }
        // and a different seed gives different particles
        LoadedScenario other = thermalSpot(300);
        other = other.with(other.scenario().withRun(other.scenario().run().withSeed(100)));
        Path c = ScenarioRun.run(ScenarioRun.prepare(other), new ScenarioRun.Options(tmp.resolve("c"), 2, false),
                stages.subList(0, 1)).folder();
        assertFalse(java.util.Arrays.equals(ha, Files.readAllBytes(c.resolve(ArchiveLayout.SNAPSHOTS))));
    }

    @Test void archiveHoldsTheLayoutAndChecksums() throws Exception {
        ScenarioRun.Outcome o = ScenarioRun.run(ScenarioRun.prepare(thermalSpot(120)),
                new ScenarioRun.Options(tmp.resolve("run"), 2, false));
        try (RunArchive a = RunArchive.open(o.folder())) {
            a.verifyChecksums();
            for (String f : List.of(ArchiveLayout.SNAPSHOTS, ArchiveLayout.SUMMARY, ArchiveLayout.PERIODS,
                    ArchiveLayout.SHEAR, "plots/positions.png", "plots/shape.png", "plots/lag.png", "plots/periods.png")) {
                assertTrue(a.has(f), "manifest lists " + f);
            }
            assertEquals(99, a.seed());
            assertEquals(0.6, a.spin());
            // Kerr a = 0.6: r_+ = 1 + sqrt(1 - a^2) = 1.8 (Boyer & Lindquist 1967)
            assertEquals(1.8, a.landmarks().get("horizon_outer"), 1e-9);
            assertEquals(50, a.particleCount(), "archive_subsample keeps 50 of 120");
            assertEquals(11, a.snapshotCount(), "60 M at a cadence of 6 M: 11 snapshots");
            ParticleHistory h = o.history();
            int[] kept = Subsample.keptIndices(thermalSpot(120).scenario(), new int[] {0});
            double[] r = a.r(5);
            float[] w = a.weights(5);
            for (int j = 0; j < kept.length; j++) {
                assertEquals(h.r(5)[kept[j]], r[j], "r of kept particle " + j);
                assertEquals(h.weight(5)[kept[j]], w[j]);
            }
            // the flare envelope (Gaussian peak 20 M, width 10 M) times weight 2 / 120 particles, at t = 30 M
            double expected = 2.0 / 120 * Math.exp(-0.5 * Math.pow((30 - 20) / 10.0, 2));
            assertEquals(30.0, a.times()[5], 1e-12);
            assertEquals(expected, w[0], 1e-7);
            long alive = a.endStates().get("alive");
            assertEquals(120, alive + a.endStates().get("captured") + a.endStates().get("escaped")
                    + a.endStates().get("failed"));
            // diagnostics (largest over every snapshot of every particle, tolerance 1e-10 per step): the mass
            // shell and the Carter constant kept far below the orbit's own scale (common practice, no source)
            assertTrue(a.diagnostics().path("hamiltonian_error_max").asDouble() < 1e-6, a.diagnostics().toString());
            assertTrue(a.diagnostics().path("hamiltonian_error_median").asDouble() < 1e-9, a.diagnostics().toString());
            assertTrue(a.diagnostics().path("carter_drift_max").asDouble() < 1e-6, a.diagnostics().toString());
            // the manifest's scenario echo is itself a scenario file that reads back to the same scenario
            Path echo = tmp.resolve("echo.json");
            Files.writeString(echo, a.manifest().get("scenario").toString());
            assertEquals(thermalSpot(120).scenario(), org.spindrift.sim.scenario.ScenarioLoader.load(echo).scenario());
            // run --help names every file the run wrote (common practice, no source: help lists outputs)
            java.io.StringWriter help = new java.io.StringWriter();
            picocli.CommandLine cl = org.spindrift.sim.cli.Main.commandLine();
            cl.setOut(new java.io.PrintWriter(help, true));
            assertEquals(0, cl.execute("run", "--help"));
            java.util.Iterator<String> files = a.manifest().get("files").fieldNames();
            int n = 0;
            while (files.hasNext()) {
                String f = files.next();
                String base = f.substring(f.lastIndexOf('/') + 1);
                assertTrue(help.toString().contains(base), "run --help names " + f + ":\n" + help);
                n++;
            }
            assertTrue(n >= 12, "files listed in the manifest: " + n);
        }
    }

    @Test void aRunStoppedPartWayLeavesNothingThatLooksComplete() throws Exception {
        Path out = tmp.resolve("broken");
        List<RunStage> stages = new ArrayList<>(ScenarioRun.stages());
        stages.add(2, new RunStage() {
            @Override public String name() {
                return "failing";
            }

            @Override public void run(RunContext context) throws IOException {
                // a file half written when the failure hits
                context.archive().write("centroid.csv", tmpFile -> {
                    Files.writeString(tmpFile, "t,x\n0,");
                    throw new IOException("disk full (simulated)");
                });
            }
        });
        assertThrows(IOException.class, () -> ScenarioRun.run(ScenarioRun.prepare(thermalSpot(40)),
                new ScenarioRun.Options(out, 1, false), stages));
        assertFalse(Files.exists(out.resolve(ArchiveLayout.MANIFEST)), "no manifest");
        assertFalse(Files.exists(out.resolve(ArchiveLayout.SNAPSHOTS)), "the files written before the failure are removed");
        assertFalse(Files.exists(out), "the folder the run created is removed");
        assertFalse(Files.exists(out.resolve("centroid.csv")), "the half-written file keeps no final name");
        assertFalse(Files.exists(AtomicFiles.partialName(out.resolve("centroid.csv"))));
        UserInputException e = assertThrows(UserInputException.class, () -> RunArchive.open(out));
        assertTrue(e.getMessage().contains("did not complete"), e.getMessage());
        // a folder that existed before keeps existing, emptied of the run's files
        Files.createDirectories(out);
        assertThrows(IOException.class, () -> ScenarioRun.run(ScenarioRun.prepare(thermalSpot(40)),
                new ScenarioRun.Options(out, 1, false), stages));
        try (Stream<Path> left = Files.list(out)) {
            assertEquals(0, left.count(), "nothing left in the folder");
        }
        // re-running into the same folder works and completes it
        ScenarioRun.run(ScenarioRun.prepare(thermalSpot(40)), new ScenarioRun.Options(out, 1, false));
        try (RunArchive a = RunArchive.open(out); Stream<Path> files = Files.list(out)) {
            a.verifyChecksums();
            assertTrue(files.noneMatch(p -> p.getFileName().toString().endsWith(".partial")));
        }
    }

    @Test void aHistoryThatCannotFitInMemoryIsRefusedBeforeTheWork() {
        LoadedScenario ls = thermalSpot(10);
        // 149 bytes per particle and snapshot (history plus archive copy): 1e6 x 1000 needs 149 GB
        UserInputException e = assertThrows(UserInputException.class,
                () -> RunLimits.checkMemory(ls, 1_000_000, 1000, 8e9));
        assertTrue(e.getMessage().contains("run.snapshot_cadence") && e.getMessage().contains("149 GB"), e.getMessage());
        RunLimits.checkMemory(ls, 1000, 100, 8e9); // 15 MB: fine
    }
}
