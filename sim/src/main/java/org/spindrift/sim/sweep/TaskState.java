package org.spindrift.sim.sweep;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Iterator;
import java.util.Map;
import org.spindrift.shared.archive.AtomicFiles;
import org.spindrift.shared.archive.ArchiveLayout;

/**
 * The state of one task, read from the sweep folder only (never from a scheduler's accounting):
 * done = its run folder holds a finished run ({@link TaskKind#complete}: manifest present, every
 * listed file there, checksums valid when verifying); failed = a failure record and no finished run; started = a start
 * record only (running, or stopped without a trace, for example by a time limit); pending =
 * nothing yet.
 */
public enum TaskState {
    DONE, FAILED, STARTED, PENDING;

    /** @return the lower-case name used in tables */
    public String key() {
        return name().toLowerCase(java.util.Locale.ROOT);
    }

    /**
     * @param verify compare every file's SHA-256 with the manifest (reads every byte)
     */
    public static TaskState of(SweepLayout layout, TaskKind kind, int task, boolean verify) {
        if (kind.complete(layout.runFolder(task), verify)) {
            return DONE;
        }
        if (Files.isRegularFile(layout.failedRecord(task))) {
            return FAILED;
        }
        if (Files.isRegularFile(layout.startedRecord(task))) {
            return STARTED;
        }
        return PENDING;
    }

    /**
     * @return whether a run folder is complete in the generic sense: a readable manifest whose
     *     files all exist (and, when verifying, have the SHA-256 it lists)
     */
    public static boolean manifestComplete(Path folder, boolean verify) {
        Path mf = folder.resolve(ArchiveLayout.MANIFEST);
        if (!Files.isRegularFile(mf)) {
            return false;
        }
        JsonNode m;
        try {
            m = new ObjectMapper().readTree(mf.toFile());
        } catch (IOException e) {
            return false;
        }
        JsonNode files = m == null ? null : m.get("files");
        if (files == null || !files.isObject()) {
            return false;
        }
        for (Iterator<Map.Entry<String, JsonNode>> it = files.properties().iterator(); it.hasNext();) {
            Map.Entry<String, JsonNode> e = it.next();
            Path f = folder.resolve(e.getKey()).normalize();
            if (!f.startsWith(folder.normalize()) || !Files.isRegularFile(f)) {
                return false;
            }
            if (verify) {
                try {
                    if (!AtomicFiles.sha256(f).equals(e.getValue().asText())) {
                        return false;
                    }
                } catch (java.io.UncheckedIOException ex) {
                    return false;
                }
            }
        }
        return true;
    }

    /** @return the reason recorded for a failed task, or "" */
    public static String reason(SweepLayout layout, int task) {
        try {
            return new ObjectMapper().readTree(layout.failedRecord(task).toFile()).path("reason").asText("");
        } catch (IOException e) {
            return "";
        }
    }
}
