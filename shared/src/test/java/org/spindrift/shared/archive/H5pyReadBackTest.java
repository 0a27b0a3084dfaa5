package org.spindrift.shared.archive;

import org.spindrift.shared.testing.ExternalPython;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * An independent reader, Debian's python3-h5py, opens {@code snapshots.h5} written by
 * {@link SnapshotWriter} and reads back the same numbers, shapes and types (DEVELOPERS.md layout).
 * Skips when h5py is missing, unless SPINDRIFT_REQUIRE_EXTERNAL=1 (CI), where it fails.
 */
class H5pyReadBackTest {
    @TempDir Path tmp;

    @Test void h5pyReadsTheSameNumbers() throws Exception {
        String py = ExternalPython.require("h5py, numpy", "python3-h5py");
        int s = 2;
        int n = 3;
        SnapshotWriter w = new SnapshotWriter(s, new int[] {0, 1, 1}, 2, 0.5, 1.0e6, 1.0e-3);
        for (int k = 0; k < s; k++) {
            double[] r = {6 + k, 7 + k, 8 + k};
            double[] th = {1.5, 1.6, 1.4};
            double[] ph = {0.1 * k, 0.2, 0.3};
            double[] ut = {1.1, 1.2, 1.3};
            double[] ur = {0.01, -0.02, 0.03};
            double[] uth = {0, 0, 0.001};
            double[] uph = {0.05, 0.06, 0.07};
            w.add(5.0 * k, r, th, ph, ut, ur, uth, uph, new float[] {0.5f, 0.25f, 0.125f},
                    new byte[] {0, (byte) k, 3}, new double[][] {{1, 2, 3}, {4, 5, 6 + k}});
        }
        Path file = w.write(tmp);
        String script = String.join("\n",
                "import h5py, sys, numpy as np",
                "f = h5py.File(sys.argv[1], 'r')",
                "print(f['time'][:].tolist())",
                "print(f['r'].shape, f['u'].shape, f['centre'].shape)",
                "print(f['r'].dtype, f['weight'].dtype, f['state'].dtype, f['source_index'].dtype)",
                "print(f['r'][1, 2], f['u'][1, 1, 1], f['weight'][0, 2], f['state'][1, 1], f['centre'][1, 1, 2])",
                "x = np.sqrt(f['r'][:]**2 + 0.5**2) * np.sin(f['theta'][:]) * np.cos(f['phi'][:])",
                "print(float(np.max(np.abs(x - f['x'][:]))))",
                "print(float(f.attrs['spin']), int(f.attrs['format_version']))");
        String[] lines = ExternalPython.run(py, script, file.toString()).toArray(new String[0]);
        assertEquals("[0.0, 5.0]", lines[0]);
        assertEquals("(2, 3) (2, 3, 4) (2, 2, 3)", lines[1]);
        assertEquals("float64 float32 int8 int32", lines[2]);
        assertEquals("9.0 -0.02 0.125 1 7.0", lines[3]);
        // x recomputed by numpy from r, theta, phi with x = sqrt(r^2 + a^2) sin(theta) cos(phi)
        assertTrue(Double.parseDouble(lines[4]) < 1e-12, lines[4]);
        assertEquals("0.5 1", lines[5]);
        assertTrue(Files.size(file) > 0);
    }
}
