package org.spindrift.sim.sweep;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.spindrift.sim.scenario.ConfigNode;

/**
 * What one task of a sweep is: a file of some kind (a scenario today; fit and study files can be
 * added as further kinds) that the sweep varies through key paths, checks, runs into a run
 * folder and summarises in a few headline numbers.
 *
 * <p>The sweep engine only handles trees and folders: it puts the axis values into the base
 * file's tree, writes one task file per point, and asks the kind to check, run and summarise.
 * A kind registers itself in {@link TaskKinds}.
 */
public interface TaskKind {
    /** @return the name used in sweep files ({@code kind: NAME}) */
    String name();

    /**
     * @return key paths whose text values are file paths relative to the file that holds them;
     *     the planner writes them as absolute paths into the task files (which live elsewhere)
     */
    default List<String> pathKeys() {
        return List.of();
    }

    /**
     * Checks one task completely, as the kind's own {@code check} would, and writes nothing.
     *
     * @param label file named in messages
     * @param tree the task's file tree (base file with the task's axis values put in)
     * @return the resources the task is expected to need
     * @throws org.spindrift.shared.UserInputException {@code label:line: key.path: problem}
     */
    Estimate check(Path label, ConfigNode tree);

    /**
     * Runs a task file into its run folder, following the run-folder rules (temporary names,
     * manifest last); a failed run leaves no folder that looks complete.
     */
    void run(Path taskFile, Path runFolder, int threads) throws IOException;

    /**
     * @return whether a run folder holds a finished run of this kind: by default a manifest whose
     *     listed files all exist (and, when verifying, match their SHA-256); kinds with their own
     *     archive verifier use it
     * @param verify compare checksums (reads every byte)
     */
    default boolean complete(Path runFolder, boolean verify) {
        return TaskState.manifestComplete(runFolder, verify);
    }

    /**
     * @return the headline numbers of a finished task's run folder, in a fixed order (NaN where a
     *     quantity was not measured)
     */
    Map<String, Double> outputs(Path runFolder) throws IOException;

    /**
     * Resources of one task.
     *
     * @param heapBytes Java heap the task needs (the array job's memory adds the JVM's own)
     * @param diskBytes size of its run folder
     */
    record Estimate(long heapBytes, long diskBytes) {
    }
}
