package org.spindrift.viewer.data;

import java.nio.FloatBuffer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.RunArchive;

/**
 * A run folder read through the shared {@link RunArchive}: the small parts (times, sources,
 * centre tracks, landmarks) when opened, the particles one snapshot at a time on request. The
 * archive is used by one thread at a time: the opening thread, then only the snapshot reader.
 */
public final class ArchiveRunData implements RunData {
    private final RunArchive archive;
    private final RunInfo info;
    private final String snapshotsFile;

    private ArchiveRunData(RunArchive archive, RunInfo info) {
        this.archive = archive;
        this.info = info;
        this.snapshotsFile = archive.path(ArchiveLayout.SNAPSHOTS).toString();
    }

    /**
     * Opens a run folder and checks what the viewer relies on.
     *
     * @throws UserInputException naming the file and what is wrong
     */
    public static ArchiveRunData open(Path folder) {
        return open(folder, true);
    }

    /**
     * Opens a run folder, verifies it through the shared archive reader (manifest types and
     * physical ranges, that snapshots.h5 belongs to the run, complete light files, and with
     * {@code checksums} every file's sha256) and checks what the viewer relies on.
     *
     * @param checksums compare every file with its sha256 (reads every byte once)
     * @throws UserInputException naming the file and what is wrong
     */
    public static ArchiveRunData open(Path folder, boolean checksums) {
        if (!Files.isDirectory(folder)) {
            throw new UserInputException("run folder " + folder + ": "
                    + (Files.exists(folder) ? "is not a folder" : "does not exist"));
        }
        RunArchive a = RunArchive.open(folder, checksums);
        try {
            return new ArchiveRunData(a, readInfo(a, folder));
        } catch (RuntimeException e) {
            a.close();
            throw damaged(folder, e);
        }
    }

    private static UserInputException damaged(Path folder, RuntimeException e) {
        if (e instanceof UserInputException u) {
            return u;
        }
        return new UserInputException("run folder " + folder + ": " + ArchiveLayout.SNAPSHOTS
                + " cannot be read (" + oneLine(e) + ")", e);
    }

    private static String oneLine(Throwable e) {
        String m = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
        int i = m.indexOf('\n');
        return i < 0 ? m : m.substring(0, i);
    }

    private static RunInfo readInfo(RunArchive a, Path folder) {
        String where = "run folder " + folder + ": " + ArchiveLayout.SNAPSHOTS;
        int s = a.snapshotCount();
        int n = a.particleCount();
        if (s < 1) {
            throw new UserInputException(where + " holds no snapshots");
        }
        double[] times = a.times();
        if (times.length != s) {
            throw new UserInputException(where + ": /time has " + times.length + " entries, /r has " + s + " snapshots");
        }
        for (int i = 1; i < s; i++) {
            if (!(times[i] > times[i - 1])) {
                throw new UserInputException(where + ": /time does not increase at snapshot " + i);
            }
        }
        int[] sourceOf = a.sourceIndex();
        if (sourceOf.length != n) {
            throw new UserInputException(where + ": /source_index has " + sourceOf.length + " entries, /r has " + n
                    + " particles");
        }
        List<String> names = new ArrayList<>();
        for (RunArchive.SourceEntry e : a.sources()) {
            names.add(e.name());
        }
        int k = names.size();
        for (int src : sourceOf) {
            if (src < 0 || src >= Math.max(k, 1)) {
                throw new UserInputException(where + ": /source_index value " + src + " outside 0.." + (k - 1)
                        + " (manifest.json lists " + k + " sources)");
            }
        }
        float[][] centres = new float[s][3 * k];
        double[][][] all = k > 0 ? a.centreTracks() : new double[s][0][];
        if (all.length != s) {
            throw new UserInputException(where + ": /centre has " + all.length + " snapshots, /r has " + s);
        }
        for (int i = 0; i < s && k > 0; i++) {
            double[][] c = all[i];
            if (c.length != k) {
                throw new UserInputException(where + ": /centre has " + c.length + " sources, manifest.json lists " + k);
            }
            for (int j = 0; j < k; j++) {
                for (int d = 0; d < 3; d++) {
                    double v = c[j][d];
                    // a source with no alive particle has a NaN centre: hold the last known point
                    centres[i][3 * j + d] = Double.isFinite(v) ? (float) v : (i > 0 ? centres[i - 1][3 * j + d] : 0f);
                }
            }
        }
        Map<String, Double> lm = a.landmarks();
        double spin = a.spin();
        if (!Double.isFinite(spin)) {
            throw new UserInputException("run folder " + folder + ": manifest.json: key 'black_hole.spin' is missing");
        }
        Landmarks landmarks = new Landmarks(spin, pick(lm, ArchiveLayout.LM_HORIZON_OUTER),
                pick(lm, ArchiveLayout.LM_CAPTURE_RADIUS), pick(lm, ArchiveLayout.LM_ISCO_PROGRADE),
                pick(lm, ArchiveLayout.LM_OMEGA_MAX_RADIUS), pick(lm, ArchiveLayout.LM_ERGOSURFACE_EQUATOR));
        String title = a.scenarioName().isEmpty() ? String.valueOf(folder.toAbsolutePath().normalize().getFileName())
                : a.scenarioName();
        return new RunInfo(title, times, List.copyOf(names), sourceOf, centres, landmarks, a.mSeconds(),
                a.mUas(), a.inclinationDeg(), a.positionAngleDeg());
    }

    /** @return the landmark under key, NaN when absent */
    private static double pick(Map<String, Double> lm, String key) {
        Double v = lm.get(key);
        return v == null ? Double.NaN : v;
    }

    @Override public RunInfo info() {
        return info;
    }

    @Override public void readSnapshot(int s, FloatBuffer dest) {
        double[][] pos;
        double[] ut;
        float[] w;
        byte[] st;
        double[] r;
        try {
            pos = archive.positions(s);
            ut = archive.timeComponents(s);
            w = archive.weights(s);
            st = archive.states(s);
            r = archive.r(s);
        } catch (UserInputException e) {
            throw e;
        } catch (RuntimeException e) {
            throw new UserInputException(snapshotsFile + ": snapshot " + s + " cannot be read (" + oneLine(e) + ")", e);
        }
        int n = info.particles();
        for (int i = 0; i < n; i++) {
            int o = i * STRIDE;
            dest.put(o + X, (float) pos[0][i]);
            dest.put(o + Y, (float) pos[1][i]);
            dest.put(o + Z, (float) pos[2][i]);
            // time dilation 1/u^t = g of a zero-angular-momentum photon (see Quantity.TIME_DILATION)
            dest.put(o + TIME_DILATION, ut[i] > 0 ? (float) (1.0 / ut[i]) : 0f);
            dest.put(o + WEIGHT, w[i]);
            dest.put(o + RADIUS, (float) r[i]);
            boolean finite = Double.isFinite(pos[0][i]) && Double.isFinite(pos[1][i]) && Double.isFinite(pos[2][i]);
            dest.put(o + ALIVE, st[i] == ArchiveLayout.ALIVE && finite ? 1f : 0f);
            dest.put(o + 7, 0f);
        }
    }

    /** @return the shared archive (for the sky data files next to it) */
    public RunArchive archive() {
        return archive;
    }

    @Override public void close() {
        archive.close();
    }
}
