package org.spindrift.shared.archive;

import java.nio.file.Path;

/** Child process of {@link RunFolderSafetyTest}: holds a run folder's lock until its stdin closes. */
public final class LockHolder {
    private LockHolder() {
    }

    // "try": the lock is the try block's whole purpose, held until the block ends, never read
    @SuppressWarnings("try")
    public static void main(String[] args) throws Exception {
        try (FolderLock l = FolderLock.acquire(Path.of(args[0]))) {
            System.out.println("locked");
            System.out.flush();
            while (System.in.read() >= 0) {
                // wait for the parent to close our stdin
            }
        }
    }
}
