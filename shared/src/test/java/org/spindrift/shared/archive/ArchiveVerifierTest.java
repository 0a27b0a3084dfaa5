package org.spindrift.shared.archive;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.UserInputException;

/** Values outside their physical ranges are refused by the shared reader, checksums or not. */
class ArchiveVerifierTest {
    @TempDir Path tmp;

    /** A one-source run of two particles over two snapshots; state and radius of particle 1 at snapshot 1 given. */
    static Path run(Path dir, byte state, double r) throws Exception {
        RunArchiveWriter w = RunArchiveWriter.create(dir);
        SnapshotWriter sw = new SnapshotWriter(2, new int[2], 1, 0.0, 1.0e6, 1.0e-3);
        double[] th = {Math.PI / 2, Math.PI / 2};
        double[] zero = new double[2];
        double[] ut = {1.5, 1.5};
        sw.add(0, new double[] {6, 7}, th, zero, ut, zero, zero, zero, new float[] {1, 1}, new byte[2],
                new double[][] {{6.5, 0, 0}});
        sw.add(10, new double[] {6, r}, th, zero, ut, zero, zero, zero, new float[] {1, 1}, new byte[] {0, state},
                new double[][] {{6.5, 0, 0}});
        sw.write(w.folder());
        w.register(ArchiveLayout.SNAPSHOTS);
        ObjectNode body = RunArchiveWriter.json().createObjectNode();
        body.putObject("black_hole").put("mass_solar", 1.0e6).put("distance_Mpc", 1.0e-3).put("spin", 0.0);
        body.putObject("units").put("M_seconds", 4.93).put("M_uas", 0.99);
        body.putObject("observer").put("inclination_deg", 30.0).put("position_angle_deg", 0.0);
        body.putArray("sources").addObject().put("name", "s").put("particles", 2).put("kept", 2).put("first_index", 0);
        body.putObject("time").put("snapshots", 2);
        w.finish(body);
        return dir;
    }

    @Test void aGoodArchivePasses() throws Exception {
        RunArchive.open(run(tmp.resolve("good"), ArchiveLayout.CAPTURED, 7.5), true).close();
    }

    @Test void unknownEndStateCodesAreRefused() throws Exception {
        Path d = run(tmp.resolve("state"), (byte) 118, 7.5);
        UserInputException e = assertThrows(UserInputException.class, () -> RunArchive.open(d, false));
        assertTrue(e.getMessage().contains("/state = 118") && e.getMessage().contains("not an end-state code"),
                e.getMessage());
    }

    @Test void absurdRadiiAreRefused() throws Exception {
        Path d = run(tmp.resolve("r"), ArchiveLayout.ALIVE, 1e284);
        UserInputException e = assertThrows(UserInputException.class, () -> RunArchive.open(d, true));
        assertTrue(e.getMessage().contains("/r = 1.0E284"), e.getMessage());
    }
}
