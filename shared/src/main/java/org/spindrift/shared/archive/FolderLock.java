package org.spindrift.shared.archive;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.OverlappingFileLockException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import org.spindrift.shared.UserInputException;

/**
 * An exclusive, inter-process lock on a run folder, held through a lock file beside it
 * ({@code .NAME.spindrift-lock} in the parent folder, so it survives the swap of the run folder).
 * The operating system releases the lock when the process ends, however it ends.
 *
 * <p>The lock file is left in place (empty but for the last holder's process id): removing it
 * would let a process that opened it just before lock an orphan while a third one locks a new
 * file. POSIX record locks are released when any descriptor of the file in the process is
 * closed, so the file is never opened a second time while locked, and a second lock within one
 * Java process is refused through an in-process registry first.
 */
final class FolderLock implements AutoCloseable {
    private static final java.util.Set<Path> HELD = java.util.concurrent.ConcurrentHashMap.newKeySet();

    private final Path file;
    private final FileChannel channel;
    private final FileLock lock;

    private FolderLock(Path file, FileChannel channel, FileLock lock) {
        this.file = file;
        this.channel = channel;
        this.lock = lock;
    }

    /** @return the lock file of a run folder */
    static Path lockFile(Path folder) {
        return RunFolders.sibling(folder, RunFolders.LOCK_SUFFIX);
    }

    /**
     * Takes the lock of a run folder without waiting.
     *
     * @throws UserInputException when another run holds it
     */
    static FolderLock acquire(Path folder) throws IOException {
        Path file = lockFile(folder);
        if (!HELD.add(file)) {
            throw busy(folder, file);
        }
        FileChannel ch = null;
        try {
            ch = FileChannel.open(file, StandardOpenOption.CREATE, StandardOpenOption.WRITE);
            FileLock l;
            try {
                l = ch.tryLock();
            } catch (OverlappingFileLockException e) {
                l = null;
            }
            if (l == null) {
                throw busy(folder, file);
            }
            ch.truncate(0);
            ch.write(ByteBuffer.wrap(("pid " + ProcessHandle.current().pid() + "\n").getBytes(StandardCharsets.US_ASCII)),
                    0);
            return new FolderLock(file, ch, l);
        } catch (IOException | RuntimeException e) {
            if (ch != null) {
                ch.close();
            }
            HELD.remove(file);
            throw e;
        }
    }

    private static UserInputException busy(Path folder, Path file) {
        return new UserInputException("output folder " + folder + ": another run is writing it (lock "
                + file.getFileName() + " is held); wait for it to finish or choose another folder with -o");
    }

    /** Releases the lock (the file stays). */
    @Override public synchronized void close() {
        if (!channel.isOpen()) {
            return;
        }
        try {
            lock.release();
        } catch (IOException e) {
            // released when the channel closes
        }
        try {
            channel.close();
        } catch (IOException e) {
            // nothing more to do
        }
        HELD.remove(file);
    }
}
