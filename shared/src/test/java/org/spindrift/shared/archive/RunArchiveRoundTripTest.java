package org.spindrift.shared.archive;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.UserInputException;

/** Writes a small run folder and reads it back through {@link RunArchive}. */
class RunArchiveRoundTripTest {
    @TempDir Path tmp;

    static final int S = 3;
    static final int N = 5;

    static double value(int s, int i, int c) {
        return 1.0 + 0.37 * s + 0.011 * i + 0.5 * c;
    }

    @Test void writesAndReadsBack() throws Exception {
        Path run = tmp.resolve("run");
        RunArchiveWriter w = RunArchiveWriter.create(run);
        int[] src = {0, 0, 0, 1, 1};
        double spin = 0.7;
        SnapshotWriter sw = new SnapshotWriter(S, src, 2, spin, 1.0e6, 1.0e-3);
        for (int s = 0; s < S; s++) {
            double[][] c = new double[9][N];
            for (int k = 0; k < 9; k++) {
                for (int i = 0; i < N; i++) {
                    c[k][i] = value(s, i, k);
                }
            }
            float[] wt = new float[N];
            byte[] st = new byte[N];
            for (int i = 0; i < N; i++) {
                wt[i] = (float) (0.25 * i + s);
                st[i] = i == 4 && s == 2 ? ArchiveLayout.CAPTURED : ArchiveLayout.ALIVE;
            }
            sw.add(10.0 * s, c[0], c[1], c[2], c[3], c[4], c[5], c[6], wt, st,
                    new double[][] {{s, 1, 2}, {s, 3, 4}});
        }
        sw.write(w.folder());
        w.register(ArchiveLayout.SNAPSHOTS);
        w.writeText(ArchiveLayout.PERIODS, "source,particle,period_phi_M\n");
        ObjectNode body = RunArchiveWriter.json().createObjectNode();
        body.put("seed", 42);
        body.putObject("black_hole").put("mass_solar", 1.0e6).put("distance_Mpc", 1.0e-3).put("family", "kerr")
                .put("spin", spin).putObject("parameters");
        body.putObject("landmarks").put("horizon", 1.714).putNull("omega_max_radius");
        body.putArray("sources").addObject().put("name", "a").put("kind", "hot_spot").put("particles", 30)
                .put("kept", 3).put("first_index", 0);
        ((com.fasterxml.jackson.databind.node.ArrayNode) body.get("sources")).addObject().put("name", "b")
                .put("kind", "ring").put("particles", 2).put("kept", 2).put("first_index", 3);
        w.finish(body);

        try (Stream<Path> files = Files.list(run)) {
            assertFalse(files.anyMatch(p -> p.getFileName().toString().endsWith(".partial")), "no partial files left");
        }
        try (RunArchive a = RunArchive.open(run)) {
            assertEquals(42, a.seed());
            assertEquals(0.7, a.spin());
            assertEquals("kerr", a.family());
            assertEquals(1.714, a.landmarks().get("horizon"));
            assertTrue(Double.isNaN(a.landmarks().get("omega_max_radius")));
            assertEquals(2, a.sources().size());
            assertEquals(3, a.sources().get(1).firstIndex());
            assertEquals(S, a.snapshotCount());
            assertEquals(N, a.particleCount());
            assertArrayEquals(new double[] {0, 10, 20}, a.times());
            assertArrayEquals(src, a.sourceIndex());
            double[] xyz = new double[3];
            for (int s = 0; s < S; s++) {
                double[] r = a.r(s);
                double[][] pos = a.positions(s);
                double[][] u = a.velocities(s);
                for (int i = 0; i < N; i++) {
                    assertEquals(value(s, i, 0), r[i]);
                    assertEquals(value(s, i, 2), a.phi(s)[i]);
                    ArchiveLayout.cartesian(value(s, i, 0), value(s, i, 1), value(s, i, 2), spin, xyz);
                    assertEquals(xyz[0], pos[0][i]);
                    assertEquals(xyz[2], pos[2][i]);
                    for (int k = 0; k < 4; k++) {
                        assertEquals(value(s, i, 3 + k), u[i][k]);
                    }
                    assertEquals(value(s, i, 3), a.timeComponents(s)[i]);
                    assertEquals((float) (0.25 * i + s), a.weights(s)[i]);
                }
                assertEquals(s == 2 ? ArchiveLayout.CAPTURED : ArchiveLayout.ALIVE, a.states(s)[4]);
                assertArrayEquals(new double[] {s, 3, 4}, a.centres(s)[1]);
                assertArrayEquals(a.centres(s)[0], a.centreTracks()[s][0]);
                assertArrayEquals(new double[] {s, 3, 4}, a.centreTracks()[s][1]);
            }
            a.verifyChecksums();
        }
        // A tampered file is caught by the checksums.
        Files.writeString(run.resolve(ArchiveLayout.PERIODS), "changed\n");
        try (RunArchive a = RunArchive.open(run)) {
            assertThrows(UserInputException.class, a::verifyChecksums);
        }
    }

    @Test void folderWithoutManifestIsRefused() throws Exception {
        Path run = tmp.resolve("interrupted");
        Files.createDirectories(run);
        Files.writeString(run.resolve(ArchiveLayout.PERIODS), "x\n");
        UserInputException e = assertThrows(UserInputException.class, () -> RunArchive.open(run));
        assertTrue(e.getMessage().contains("manifest.json"), e.getMessage());
    }
}
