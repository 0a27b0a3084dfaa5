package org.spindrift.sim.study;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.spindrift.sim.scenario.ConfigNode;
import org.spindrift.sim.sweep.TaskKind;

/**
 * Study files as sweep tasks ({@code kind: study}): the sweep's axes are the study file's key
 * paths (for example {@code deformation.values} or {@code instrument.sigma_uas}, one value per
 * task), each task is a whole study run into its run folder, and its headline numbers are those
 * of its first cell. So a study's cells run as a Slurm array through {@code sweep slurm}.
 */
public final class StudyTaskKind implements TaskKind {
    @Override public String name() {
        return "study";
    }

    @Override public List<String> pathKeys() {
        return List.of("truth");
    }

    @Override public Estimate check(Path label, ConfigNode tree) {
        StudyFile s = StudyFile.load(label, tree);
        // ray tables (a few per deformation), the fit's buffers and the JVM: our own estimate
        long heap = (512L << 20) + (64L << 20) * s.deformations().length;
        long disk = (1L << 20) + 20_000L * s.cells() * (s.realisations() + 4L);
        return new Estimate(heap, disk);
    }

    @Override public void run(Path taskFile, Path runFolder, int threads) throws IOException {
        StudyRun.run(StudyFile.load(taskFile), runFolder, 1, threads, false);
    }

    @Override public Map<String, Double> outputs(Path runFolder) throws IOException {
        return StudyRun.outputs(runFolder);
    }
}
