package org.spindrift.sim.sweep;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.testing.ExternalPython;

/** Running a small sweep locally: results, resume, failures, shards, collected table. */
class SweepRunTest {
    @TempDir Path tmp;

    private static final PrintWriter QUIET = new PrintWriter(new StringWriter());

    private SweepPlan plan(String name, String... axes) throws Exception {
        Path f = SweepFixtures.sweep(tmp, name, axes);
        SweepPlanner.plan(f, tmp.resolve(name), false, 2);
        return SweepPlan.open(tmp.resolve(name));
    }

    @Test void runResumeFailureAndCollect() throws Exception {
        SweepPlan plan = plan("spins", "black_hole.spin: [0.0, 0.5, 0.9]");
        SweepLayout l = plan.layout();
        // a task file edited after planning: that task fails with its reason, the others run
        Files.writeString(l.taskFile(1), Files.readString(l.taskFile(1)).replace("\"seed\" : 7", "\"seed\" : 8"));
        SweepRunner.Summary s = SweepRunner.run(plan, List.of(0, 1, 2), 2, 1, false, QUIET);
        assertEquals(new SweepRunner.Summary(2, 0, 1), s);
        assertEquals(TaskState.DONE, TaskState.of(l, plan.kind(), 0, true));
        assertEquals(TaskState.FAILED, TaskState.of(l, plan.kind(), 1, true));
        assertTrue(TaskState.reason(l, 1).contains("changed since the sweep was planned"), TaskState.reason(l, 1));
        assertFalse(Files.exists(l.runFolder(1).resolve("manifest.json")));
        assertFalse(Files.exists(l.startedRecord(0)));
        // --skip-failed leaves the failed task and its record alone
        assertEquals(new SweepRunner.Summary(0, 2, 0, 1), SweepRunner.run(plan, List.of(0, 1, 2), 1, 1, false, true, QUIET));
        assertEquals(TaskState.FAILED, TaskState.of(l, plan.kind(), 1, true));

        // resume: finished tasks are skipped (their files untouched); a damaged one runs again
        FileTime t2 = Files.getLastModifiedTime(l.runFolder(2).resolve("manifest.json"));
        Path csv = l.runFolder(0).resolve("centroid.csv");
        Files.writeString(csv, Files.readString(csv) + "0,0,0\n");
        assertEquals(TaskState.DONE, TaskState.of(l, plan.kind(), 0, false), "quick status looks only at the files' presence");
        assertFalse(plan.kind().complete(l.runFolder(0), true), "the damaged file no longer matches its checksum");
        Files.writeString(l.taskFile(1), Files.readString(l.taskFile(1)).replace("\"seed\" : 8", "\"seed\" : 7"));
        s = SweepRunner.run(plan, List.of(0, 1, 2), 1, 2, false, QUIET);
        assertEquals(new SweepRunner.Summary(2, 1, 0), s);
        assertEquals(t2, Files.getLastModifiedTime(l.runFolder(2).resolve("manifest.json")));
        assertFalse(Files.exists(l.failedRecord(1)), "a task that succeeds on a re-run loses its failure record");
        for (int t = 0; t < 3; t++) {
            assertEquals(TaskState.DONE, TaskState.of(l, plan.kind(), t, true));
        }

        SweepCollector.Table table = SweepCollector.read(plan);
        SweepCollector.write(plan, table);
        List<Path> plots = SweepCollector.plot(plan, table, "period_phi_M");
        assertEquals(1, plots.size());
        assertTrue(Files.size(plots.get(0)) > 1000);
        // azimuthal period of the spot's members against the circular-orbit period
        // T_phi = 2 pi (r^1.5 + a) (Bardeen, Press & Teukolsky 1972, eq. 2.16) at r = 8 M; the
        // members spread over sigma = 0.2 M, so 1 % (our tolerance)
        double[] period = table.column("period_phi_M");
        double[] spin = {0.0, 0.5, 0.9};
        for (int t = 0; t < 3; t++) {
            double expect = 2 * Math.PI * (Math.pow(8, 1.5) + spin[t]);
            assertEquals(expect, period[t], 0.01 * expect, "task " + t);
        }
        // h5py (Debian's python3-h5py) reads the same table as the CSV, and numpy recomputes the
        // centroid wander and extent from the task's own centroid.csv
        String py = ExternalPython.require("h5py, numpy", "python3-h5py, python3-numpy");
        List<String> out = ExternalPython.run(py, String.join("\n",
                "import sys, csv, h5py, numpy as np",
                "d = sys.argv[1]",
                "f = h5py.File(d + '/sweep.h5', 'r')",
                "rows = list(csv.DictReader(open(d + '/sweep.csv')))",
                "assert [r['state'] for r in rows] == [s.decode() for s in f['state'][:]]",
                "for k in f['outputs']:",
                "    col = np.array([float(r[k]) if r[k] else np.nan for r in rows])",
                "    assert np.array_equal(col, f['outputs'][k][:], equal_nan=True), k",
                "assert list(f['axes']['black_hole.spin'][:]) == [0.0, 0.5, 0.9]",
                "c = np.genfromtxt(d + '/runs/task-000002/centroid.csv', delimiter=',', names=True)",
                "m = np.isfinite(c['x_with_steady_uas']) & (c['flux'] > 0.01 * np.nanmax(c['flux']))",
                "x, y, w = c['x_with_steady_uas'][m], c['y_with_steady_uas'][m], c['flux'][m]",
                "mx, my = np.average(x, weights=w), np.average(y, weights=w)",
                "wander = np.sqrt(np.average((x - mx)**2 + (y - my)**2, weights=w))",
                "extent = max(np.hypot(x[i] - x[j], y[i] - y[j]) for i in range(len(x)) for j in range(len(x)))",
                "print(repr(float(wander)), repr(float(extent)), float(rows[2]['centroid_wander_uas']),"
                        + " float(rows[2]['centroid_extent_uas']))"), l.dir().toString());
        String[] v = out.get(out.size() - 1).split(" ");
        assertEquals(Double.parseDouble(v[0]), Double.parseDouble(v[2]), 1e-9 * Double.parseDouble(v[0]));
        assertEquals(Double.parseDouble(v[1]), Double.parseDouble(v[3]), 1e-9 * Double.parseDouble(v[1]));
    }

    @Test void shardsSplitTheTasksAndResultsDoNotDependOnJobsOrThreads() throws Exception {
        assertEquals(List.of(1, 4, 7), SweepRunner.shard(9, 1, 3));
        assertEquals(List.of(), SweepRunner.shard(2, 3, 5));
        SweepPlan a = plan("a", "observer.inclination_deg: [20, 70]");
        SweepPlan b = plan("b", "observer.inclination_deg: [20, 70]");
        SweepRunner.run(a, SweepRunner.shard(2, 1, 2), 1, 1, false, QUIET);
        assertEquals(TaskState.PENDING, TaskState.of(a.layout(), a.kind(), 0, true));
        assertEquals(TaskState.DONE, TaskState.of(a.layout(), a.kind(), 1, true));
        SweepRunner.run(a, SweepRunner.shard(2, 0, 2), 1, 1, false, QUIET);
        SweepRunner.run(b, List.of(0, 1), 2, 2, false, QUIET);
        SweepCollector.write(a, SweepCollector.read(a));
        SweepCollector.write(b, SweepCollector.read(b));
        assertArrayEquals(Files.readAllBytes(a.layout().dir().resolve("sweep.csv")),
                Files.readAllBytes(b.layout().dir().resolve("sweep.csv")));
        assertArrayEquals(Files.readAllBytes(a.layout().runFolder(1).resolve("snapshots.h5")),
                Files.readAllBytes(b.layout().runFolder(1).resolve("snapshots.h5")));
    }
}
