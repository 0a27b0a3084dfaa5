package org.spindrift.shared.archive;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.Version;

/**
 * Writes one run folder (DEVELOPERS.md, "Run archive layout"): every file through a temporary
 * name, then {@code manifest.json} last with the SHA-256 of every other file. A folder without a
 * manifest is an incomplete run; {@link RunArchive#open} refuses it.
 *
 * <p>Re-using a folder that holds an earlier run removes that run's manifest first (so the folder
 * never looks complete while it is being rewritten) and then the files it listed.
 *
 * <p>A run that fails or is stopped calls {@link #abandon}: the files written so far are removed
 * (and the folder, when this writer created it and it is left empty), so an interrupted run
 * leaves no file that looks complete. The methods are synchronized so that a shutdown hook can
 * abandon the run while the main thread is writing.
 */
public final class RunArchiveWriter {
    /** Files of format version 1, allowed in a folder that is about to be re-used. */
    private static final Set<String> KNOWN = Set.of(ArchiveLayout.MANIFEST, ArchiveLayout.SNAPSHOTS,
            ArchiveLayout.SUMMARY, ArchiveLayout.PERIODS, ArchiveLayout.SHEAR, ArchiveLayout.CENTROID,
            ArchiveLayout.LIGHTCURVE, ArchiveLayout.IMAGES, ArchiveLayout.MOCK_ASTROMETRY, ArchiveLayout.PLOTS,
            ArchiveLayout.VISIBILITIES, ArchiveLayout.CLOSURE_PHASES, ArchiveLayout.CLOSURE_AMPLITUDES, ArchiveLayout.UVFITS);

    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    private final Path folder;
    private final boolean created;
    private final Map<String, Path> files = new LinkedHashMap<>();
    private boolean finished;
    private boolean abandoned;

    private RunArchiveWriter(Path folder, boolean created) {
        this.folder = folder;
        this.created = created;
    }

    /** @return the JSON mapper used for the manifest (indenting) */
    public static ObjectMapper json() {
        return JSON;
    }

    /**
     * Creates (or clears for re-use) a run folder.
     *
     * @throws UserInputException when the folder exists and holds files that are not a run's
     */
    public static RunArchiveWriter create(Path folder) throws IOException {
        boolean existed = Files.exists(folder);
        checkUsable(folder);
        if (existed) {
            clear(folder);
        }
        Files.createDirectories(folder);
        return new RunArchiveWriter(folder, !existed);
    }

    /**
     * Checks, without changing anything, that a folder may receive a run: it does not exist, or
     * it is a folder holding only files of a run (an earlier or interrupted one).
     *
     * @throws UserInputException naming the folder and the first foreign file
     */
    public static void checkUsable(Path folder) throws IOException {
        if (!Files.exists(folder)) {
            return;
        }
        if (!Files.isDirectory(folder)) {
            throw new UserInputException("output folder " + folder + ": exists and is not a folder; choose another with -o");
        }
        List<Path> foreign = new ArrayList<>();
        try (DirectoryStream<Path> ds = Files.newDirectoryStream(folder)) {
            for (Path p : ds) {
                String name = p.getFileName().toString();
                boolean partial = name.startsWith(ArchiveLayout.PARTIAL_PREFIX) && name.endsWith(ArchiveLayout.PARTIAL_SUFFIX);
                if (!KNOWN.contains(name) && !partial) {
                    foreign.add(p);
                }
            }
        }
        if (!foreign.isEmpty()) {
            throw new UserInputException("output folder " + folder + ": holds files that are not part of a run (for example "
                    + foreign.get(0).getFileName() + "); choose another with -o");
        }
    }

    /** Removes the manifest first, then the other files of an earlier or interrupted run. */
    private static void clear(Path folder) throws IOException {
        Files.deleteIfExists(folder.resolve(ArchiveLayout.MANIFEST));
        try (DirectoryStream<Path> ds = Files.newDirectoryStream(folder)) {
            for (Path p : ds) {
                if (Files.isDirectory(p)) {
                    try (DirectoryStream<Path> inner = Files.newDirectoryStream(p)) {
                        for (Path q : inner) {
                            Files.deleteIfExists(q);
                        }
                    }
                }
                Files.deleteIfExists(p);
            }
        }
    }

    /** @return the run folder */
    public Path folder() {
        return folder;
    }

    /** @return the path of a file of the run, relative names such as {@code plots/lag.png} allowed */
    public Path resolve(String relativeName) {
        return folder.resolve(relativeName);
    }

    /**
     * Writes one file of the run through its temporary name and registers it for the manifest.
     *
     * @param relativeName for example {@code periods.csv} or {@code plots/positions.png}
     */
    public synchronized Path write(String relativeName, AtomicFiles.Writer writer) throws IOException {
        checkOpen();
        Path target = folder.resolve(relativeName);
        Files.createDirectories(target.getParent());
        AtomicFiles.write(target, writer);
        files.put(relativeName, target);
        return target;
    }

    /** Writes a UTF-8 text file of the run. */
    public Path writeText(String relativeName, String text) throws IOException {
        return write(relativeName, tmp -> Files.writeString(tmp, text, StandardCharsets.UTF_8));
    }

    /** Writes a JSON file of the run (indented). */
    public Path writeJson(String relativeName, JsonNode node) throws IOException {
        return write(relativeName, tmp -> JSON.writeValue(tmp.toFile(), node));
    }

    /** Registers a file that another writer (for example {@link SnapshotWriter}) completed in the folder. */
    public synchronized void register(String relativeName) {
        Path p = folder.resolve(relativeName);
        if (abandoned) {
            try {
                Files.deleteIfExists(p);
            } catch (IOException e) {
                // best effort
            }
        }
        checkOpen();
        if (!Files.isRegularFile(p)) {
            throw new IllegalStateException("no file " + p + " to register");
        }
        files.put(relativeName, p);
    }

    /** @return the names registered so far, in order */
    public List<String> fileNames() {
        return List.copyOf(files.keySet());
    }

    /**
     * Completes the run: adds {@code format}, {@code format_version}, {@code code_version},
     * {@code created_utc} and {@code files} (name to SHA-256) to the body and writes
     * {@code manifest.json} last.
     *
     * @param body the run's manifest keys (scenario echo, seed, black hole, landmarks, ...)
     */
    public synchronized Path finish(ObjectNode body) throws IOException {
        checkOpen();
        ObjectNode m = JSON.createObjectNode();
        m.put("format", ArchiveLayout.FORMAT);
        m.put("format_version", ArchiveLayout.FORMAT_VERSION);
        m.put("code_version", Version.get());
        m.put("created_utc", Instant.now().truncatedTo(ChronoUnit.SECONDS).toString());
        body.fields().forEachRemaining(e -> {
            if (!m.has(e.getKey())) {
                m.set(e.getKey(), e.getValue());
            }
        });
        ObjectNode sums = m.putObject("files");
        for (Map.Entry<String, Path> e : files.entrySet()) {
            sums.put(e.getKey(), AtomicFiles.sha256(e.getValue()));
        }
        Path target = folder.resolve(ArchiveLayout.MANIFEST);
        AtomicFiles.write(target, tmp -> JSON.writeValue(tmp.toFile(), m));
        finished = true;
        return target;
    }

    private void checkOpen() {
        if (finished) {
            throw new IllegalStateException("run folder " + folder + " already finished");
        }
        if (abandoned) {
            throw new IllegalStateException("run folder " + folder + " was abandoned (run stopped)");
        }
    }

    /** @return whether {@link #finish} completed */
    public synchronized boolean finished() {
        return finished;
    }

    /**
     * Removes every file this run wrote and every temporary file in the folder (and the folder
     * itself when this writer created it and nothing else is left). Does nothing after
     * {@link #finish}. Best effort: errors are ignored.
     */
    public synchronized void abandon() {
        if (finished || abandoned) {
            return;
        }
        abandoned = true;
        for (Path p : files.values()) {
            try {
                Files.deleteIfExists(p);
            } catch (IOException e) {
                // best effort
            }
        }
        removePartials(folder);
        Path plots = folder.resolve(ArchiveLayout.PLOTS);
        removePartials(plots);
        try {
            if (Files.isDirectory(plots) && isEmpty(plots)) {
                Files.delete(plots);
            }
            if (created && isEmpty(folder)) {
                Files.delete(folder);
            }
        } catch (IOException e) {
            // best effort
        }
    }

    private static boolean isEmpty(Path dir) throws IOException {
        try (DirectoryStream<Path> ds = Files.newDirectoryStream(dir)) {
            return !ds.iterator().hasNext();
        }
    }

    private static void removePartials(Path dir) {
        if (!Files.isDirectory(dir)) {
            return;
        }
        try (DirectoryStream<Path> ds = Files.newDirectoryStream(dir,
                ArchiveLayout.PARTIAL_PREFIX + "*" + ArchiveLayout.PARTIAL_SUFFIX)) {
            for (Path q : ds) {
                Files.deleteIfExists(q);
            }
        } catch (IOException e) {
            // best effort
        }
    }
}
