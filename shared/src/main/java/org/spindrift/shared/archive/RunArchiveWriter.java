package org.spindrift.shared.archive;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileVisitResult;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.SimpleFileVisitor;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.BasicFileAttributes;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.Version;

/**
 * Writes one run folder (DEVELOPERS.md, "Run archive layout") so that no earlier result is lost:
 * <ul>
 *   <li>an exclusive lock on the folder for the whole run (a second run into it is refused);</li>
 *   <li>the new run is built in a sibling folder ({@code .NAME.spindrift-new}), every file through
 *       a temporary name, its SHA-256 taken from the bytes as they are written;</li>
 *   <li>{@link #finish} writes {@code manifest.json} last and only then swaps the new folder in;
 *       an earlier run there is replaced only when asked ({@code overwrite}) and only if the folder
 *       holds nothing but that run's listed files (see {@link RunFolders#check});</li>
 *   <li>a run that fails or is stopped calls {@link #abandon}: the new folder goes, the old run
 *       stays as it was.</li>
 * </ul>
 * The methods are synchronized so that a shutdown hook can abandon the run while the main thread
 * is writing.
 */
public final class RunArchiveWriter {
    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT)
            .disable(JsonGenerator.Feature.AUTO_CLOSE_TARGET);

    private final Path target;
    private final Path staging;
    private final boolean overwrite;
    private final FolderLock lock;
    private final List<Path> createdParents;
    private final Map<String, String> sums = new LinkedHashMap<>();
    private final Thread cleanup = new Thread(this::abandon, "spindrift-cleanup");
    private boolean finished;
    private boolean abandoned;

    private RunArchiveWriter(Path target, Path staging, boolean overwrite, FolderLock lock, List<Path> createdParents) {
        this.target = target;
        this.staging = staging;
        this.overwrite = overwrite;
        this.lock = lock;
        this.createdParents = createdParents;
        // stopped (Ctrl-C, SIGTERM) from here on: the build folder goes, the run folder stays as it was
        Runtime.getRuntime().addShutdownHook(cleanup);
    }

    private void removeHook() {
        if (Thread.currentThread() == cleanup) {
            return;
        }
        try {
            Runtime.getRuntime().removeShutdownHook(cleanup);
        } catch (IllegalStateException e) {
            // shutting down already: the hook is running or has run
        }
    }

    /** @return the JSON mapper used for the manifest (indenting) */
    public static ObjectMapper json() {
        return JSON;
    }

    /** As {@link #create(Path, boolean)} without replacing a finished run. */
    public static RunArchiveWriter create(Path folder) throws IOException {
        return create(folder, false);
    }

    /**
     * Locks the run folder and opens the sibling folder the new run is built in. Nothing in
     * {@code folder} changes before {@link #finish}.
     *
     * @param overwrite whether a finished run in the folder may be replaced (at {@link #finish})
     * @throws UserInputException when the folder cannot take a run (see {@link RunFolders#check})
     *     or another run holds its lock
     */
    public static RunArchiveWriter create(Path folder, boolean overwrite) throws IOException {
        Path target = folder.toAbsolutePath().normalize();
        RunFolders.check(folder, overwrite, "-o");
        List<Path> created = new ArrayList<>();
        for (Path p = target.getParent(); p != null && !Files.exists(p); p = p.getParent()) {
            created.add(0, p);
        }
        Files.createDirectories(target.getParent());
        FolderLock lock = null;
        try {
            lock = FolderLock.acquire(folder);
            recoverOld(target);
            RunFolders.check(folder, overwrite, "-o"); // again, now that no other run can change it
            Path staging = RunFolders.sibling(target, RunFolders.NEW_SUFFIX);
            if (Files.exists(staging, LinkOption.NOFOLLOW_LINKS)) {
                if (!Files.isRegularFile(staging.resolve(RunFolders.BUILD_MARK), LinkOption.NOFOLLOW_LINKS)) {
                    throw new UserInputException("output folder " + folder + ": " + staging.getFileName()
                            + " exists and was not made by Spindrift; remove it or choose another folder with -o");
                }
                deleteTree(staging); // left by a run that was killed
            }
            RunArchiveWriter w = new RunArchiveWriter(target, staging, overwrite, lock, created);
            try {
                Files.createDirectory(staging);
                Files.writeString(staging.resolve(RunFolders.BUILD_MARK), "spindrift run being built; removed when done\n");
            } catch (IOException | RuntimeException e) {
                w.abandon();
                throw e;
            }
            return w;
        } catch (IOException | RuntimeException e) {
            if (lock != null) {
                lock.close();
            }
            removeCreated(created);
            throw e;
        }
    }

    /** A previous run moved aside by a swap that was cut short: put it back, or remove it when the swap had finished. */
    private static void recoverOld(Path target) throws IOException {
        Path old = RunFolders.sibling(target, RunFolders.OLD_SUFFIX);
        if (!Files.exists(old, LinkOption.NOFOLLOW_LINKS)) {
            return;
        }
        if (!Files.exists(target, LinkOption.NOFOLLOW_LINKS)) {
            move(old, target);
        } else if (!RunFolders.removeRun(old)) {
            throw new UserInputException("output folder " + target + ": " + old.getFileName()
                    + " (an earlier run moved aside) holds files that are not its own; move it away first");
        }
    }

    /**
     * Checks, without changing anything, that a folder may receive a run.
     *
     * @throws UserInputException naming the folder and the problem
     */
    public static RunFolders.State checkUsable(Path folder, boolean overwrite) throws IOException {
        return RunFolders.check(folder, overwrite, "-o");
    }

    /** @return the folder the run's files are written into now (the sibling build folder until {@link #finish}) */
    public Path folder() {
        return staging;
    }

    /** @return the run folder the run ends up in */
    public Path target() {
        return target;
    }

    /** @return the path of a file of the run being built, relative names such as {@code plots/lag.png} allowed */
    public Path resolve(String relativeName) {
        return staging.resolve(relativeName);
    }

    private Path place(String relativeName) throws IOException {
        checkOpen();
        if (!RunFolders.safeName(relativeName)) {
            throw new IllegalArgumentException("not a file name inside the run folder: " + relativeName);
        }
        Path p = staging.resolve(relativeName);
        Files.createDirectories(p.getParent());
        return p;
    }

    /**
     * Writes one file of the run from a stream, through its temporary name, and registers its
     * SHA-256 (of the bytes as written) for the manifest.
     *
     * @param relativeName for example {@code periods.csv} or {@code plots/positions.png}
     */
    public synchronized Path writeStream(String relativeName, AtomicFiles.StreamWriter writer) throws IOException {
        Path target = place(relativeName);
        sums.put(relativeName, AtomicFiles.writeStream(target, writer));
        return target;
    }

    /**
     * Writes one file of the run with a writer that needs a path (a library that seeks while
     * writing), through its temporary name; the finished temporary file is digested before it
     * is renamed.
     */
    public synchronized Path write(String relativeName, AtomicFiles.Writer writer) throws IOException {
        Path target = place(relativeName);
        sums.put(relativeName, AtomicFiles.writeDigested(target, writer));
        return target;
    }

    /** Writes a UTF-8 text file of the run. */
    public Path writeText(String relativeName, String text) throws IOException {
        return writeStream(relativeName, out -> out.write(text.getBytes(StandardCharsets.UTF_8)));
    }

    /** Writes a JSON file of the run (indented). */
    public Path writeJson(String relativeName, JsonNode node) throws IOException {
        return writeStream(relativeName, out -> JSON.writeValue(out, node));
    }

    /**
     * Registers a file that another writer (for example {@link SnapshotWriter}) has just completed
     * in {@link #folder()}; it is digested now, in the locked build folder.
     */
    public synchronized void register(String relativeName) {
        checkOpen();
        Path p = staging.resolve(relativeName);
        if (!Files.isRegularFile(p, LinkOption.NOFOLLOW_LINKS)) {
            throw new IllegalStateException("no file " + p + " to register");
        }
        sums.put(relativeName, AtomicFiles.sha256(p));
    }

    /** @return the names registered so far, in order */
    public synchronized List<String> fileNames() {
        return List.copyOf(sums.keySet());
    }

    /**
     * Completes the run: adds {@code format}, {@code format_version}, {@code code_version},
     * {@code created_utc} and {@code files} (name to SHA-256) to the body, writes
     * {@code manifest.json} last, then swaps the new folder in place of the old one (if any) and
     * releases the lock.
     *
     * @param body the run's manifest keys (scenario echo, seed, black hole, landmarks, ...)
     * @return the manifest in the run folder
     */
    public synchronized Path finish(ObjectNode body) throws IOException {
        checkOpen();
        ObjectNode m = JSON.createObjectNode();
        m.put(ArchiveLayout.K_FORMAT, ArchiveLayout.FORMAT);
        m.put(ArchiveLayout.K_FORMAT_VERSION, ArchiveLayout.FORMAT_VERSION);
        m.put(ArchiveLayout.K_CODE_VERSION, Version.get());
        m.put("created_utc", Instant.now().truncatedTo(ChronoUnit.SECONDS).toString());
        body.properties().forEach(e -> {
            if (!m.has(e.getKey())) {
                m.set(e.getKey(), e.getValue());
            }
        });
        ObjectNode files = m.putObject(ArchiveLayout.K_FILES);
        sums.forEach(files::put);
        AtomicFiles.writeStream(staging.resolve(ArchiveLayout.MANIFEST), out -> JSON.writeValue(out, m));
        // the folder may have changed during the run (a user's file put into it): check again
        RunFolders.State state = RunFolders.check(target, overwrite, "-o");
        Files.delete(staging.resolve(RunFolders.BUILD_MARK));
        Path old = RunFolders.sibling(target, RunFolders.OLD_SUFFIX);
        if (state == RunFolders.State.RUN) {
            move(target, old);
            try {
                move(staging, target);
            } catch (IOException | RuntimeException e) {
                move(old, target);
                throw e;
            }
            finished = true;
            try {
                RunFolders.removeRun(old);
            } catch (IOException | RuntimeException e) {
                System.err.println("spindrift: warning: the replaced run could not be removed completely from " + old);
            }
        } else {
            if (state == RunFolders.State.EMPTY) {
                Files.delete(target);
            }
            move(staging, target);
            finished = true;
        }
        lock.close();
        removeHook();
        return target.resolve(ArchiveLayout.MANIFEST);
    }

    private static void move(Path from, Path to) throws IOException {
        try {
            Files.move(from, to, StandardCopyOption.ATOMIC_MOVE);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(from, to);
        }
    }

    private void checkOpen() {
        if (finished) {
            throw new IllegalStateException("run folder " + target + " already finished");
        }
        if (abandoned) {
            throw new IllegalStateException("run folder " + target + " was abandoned (run stopped)");
        }
    }

    /** @return whether {@link #finish} completed */
    public synchronized boolean finished() {
        return finished;
    }

    /**
     * Removes the folder the new run was being built in and releases the lock; the run folder
     * itself (and an earlier run in it) is left as it was. Does nothing after {@link #finish}.
     * Best effort: errors are ignored.
     */
    public synchronized void abandon() {
        if (finished || abandoned) {
            return;
        }
        abandoned = true;
        try {
            deleteTree(staging);
        } catch (IOException e) {
            // best effort
        }
        removeCreated(createdParents);
        lock.close();
        removeHook();
    }

    /** Removes the parent folders a writer created, innermost first, while they are empty. */
    private static void removeCreated(List<Path> created) {
        for (int i = created.size() - 1; i >= 0; i--) {
            try {
                Files.deleteIfExists(created.get(i));
            } catch (IOException e) {
                return; // not empty: something else is there now
            }
        }
    }

    /** Deletes a build folder of Spindrift's; links inside are removed, never followed. */
    private static void deleteTree(Path dir) throws IOException {
        if (!Files.exists(dir, LinkOption.NOFOLLOW_LINKS)) {
            return;
        }
        Files.walkFileTree(dir, new SimpleFileVisitor<>() {
            @Override public FileVisitResult visitFile(Path file, BasicFileAttributes attrs) throws IOException {
                Files.delete(file);
                return FileVisitResult.CONTINUE;
            }

            @Override public FileVisitResult postVisitDirectory(Path d, IOException exc) throws IOException {
                Files.delete(d);
                return FileVisitResult.CONTINUE;
            }
        });
    }
}
