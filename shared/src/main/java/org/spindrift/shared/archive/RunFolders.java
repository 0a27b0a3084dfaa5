package org.spindrift.shared.archive;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import org.spindrift.shared.UserInputException;

/**
 * What an output folder holds, decided without changing it, and the only way Spindrift removes
 * an earlier run: file by file, exactly the files its manifest lists, never following a link.
 *
 * <p>Names beside a run folder {@code runs/NAME}: {@code runs/.NAME.spindrift-lock} (the lock),
 * {@code runs/.NAME.spindrift-new} (the new run being built), {@code runs/.NAME.spindrift-old}
 * (the previous run during the swap).
 */
public final class RunFolders {
    /** Suffix of the lock file beside a run folder. */
    static final String LOCK_SUFFIX = ".spindrift-lock";
    /** Suffix of the folder where a new run is built. */
    static final String NEW_SUFFIX = ".spindrift-new";
    /** Suffix of the previous run while the new one is swapped in. */
    static final String OLD_SUFFIX = ".spindrift-old";
    /** Marker file inside a folder being built, proving Spindrift made it. */
    static final String BUILD_MARK = ".spindrift-building";

    private RunFolders() {
    }

    /** What an output folder holds. */
    public enum State {
        /** Nothing there yet. */
        ABSENT,
        /** An empty folder. */
        EMPTY,
        /** A finished Spindrift run and nothing else. */
        RUN
    }

    /** @return {@code parent/.NAME<suffix>} for the folder {@code parent/NAME} */
    static Path sibling(Path folder, String suffix) {
        Path abs = folder.toAbsolutePath().normalize();
        return abs.resolveSibling("." + abs.getFileName() + suffix);
    }

    /**
     * Checks, without changing anything, that a run may be written to {@code folder}: it can be
     * created (no file in the way, the nearest existing parent writable) or it is an empty folder
     * or a finished Spindrift run (replaced only with {@code overwrite}), with no link inside and
     * no file the run's manifest does not list.
     *
     * @param option the option naming the folder in messages, for example {@code -o}
     * @throws UserInputException one line naming the folder and the problem
     */
    public static State check(Path folder, boolean overwrite, String option) throws IOException {
        String where = "output folder " + folder + ": ";
        Path abs = folder.toAbsolutePath().normalize();
        if (abs.getParent() == null) {
            throw new UserInputException(where + "cannot write a run into the file-system root; choose another with "
                    + option);
        }
        if (Files.isSymbolicLink(abs)) {
            throw new UserInputException(where + "is a symbolic link; Spindrift does not follow links: give the folder"
                    + " it points to with " + option);
        }
        if (!Files.exists(abs, LinkOption.NOFOLLOW_LINKS)) {
            Path p = abs.getParent();
            while (p != null && !Files.exists(p)) {
                p = p.getParent();
            }
            if (p == null) {
                throw new UserInputException(where + "no existing parent folder");
            }
            if (!Files.isDirectory(p)) {
                throw new UserInputException(where + "cannot be created: " + p + " is a file, not a folder; choose"
                        + " another with " + option);
            }
            if (!Files.isWritable(p)) {
                throw new UserInputException(where + "cannot be created: " + p + " is not writable; choose another with "
                        + option);
            }
            return State.ABSENT;
        }
        if (!Files.isDirectory(abs, LinkOption.NOFOLLOW_LINKS)) {
            throw new UserInputException(where + "exists and is not a folder; choose another with " + option);
        }
        if (!Files.isWritable(abs.getParent()) || !Files.isWritable(abs)) {
            throw new UserInputException(where + "is not writable (the folder and its parent must be); choose another"
                    + " with " + option);
        }
        List<String> present = list(abs, where);
        if (present.isEmpty()) {
            return State.EMPTY;
        }
        if (!present.contains(ArchiveLayout.MANIFEST)) {
            throw new UserInputException(where + "holds files that Spindrift did not write (for example "
                    + present.get(0) + ") and no run manifest; choose another with " + option);
        }
        Set<String> listed = listedFiles(abs.resolve(ArchiveLayout.MANIFEST), where);
        for (String name : present) {
            if (!name.equals(ArchiveLayout.MANIFEST) && !listed.contains(name)) {
                throw new UserInputException(where + "holds " + name + ", which is not a file of the run there;"
                        + " Spindrift replaces only a folder holding nothing but its own run; choose another with "
                        + option);
            }
        }
        if (!overwrite) {
            throw new UserInputException(where + "holds a finished run; use --overwrite to replace it (the old run"
                    + " stays until the new one is complete) or choose another folder with " + option);
        }
        return State.RUN;
    }

    /**
     * @return the regular files under dir as relative names with '/', sorted
     * @throws UserInputException at a link or anything that is neither a file nor a folder
     */
    static List<String> list(Path dir, String where) throws IOException {
        List<String> out = new ArrayList<>();
        walk(dir, "", out, where);
        out.sort(null);
        return out;
    }

    private static void walk(Path dir, String prefix, List<String> out, String where) throws IOException {
        try (DirectoryStream<Path> ds = Files.newDirectoryStream(dir)) {
            for (Path p : ds) {
                String name = prefix + p.getFileName();
                if (Files.isSymbolicLink(p)) {
                    throw new UserInputException(where + name + " is a symbolic link; Spindrift never follows or"
                            + " removes links in a run folder; choose another folder");
                }
                if (Files.isDirectory(p, LinkOption.NOFOLLOW_LINKS)) {
                    walk(p, name + "/", out, where);
                } else if (Files.isRegularFile(p, LinkOption.NOFOLLOW_LINKS)) {
                    out.add(name);
                } else {
                    throw new UserInputException(where + name + " is neither a file nor a folder; choose another folder");
                }
            }
        }
    }

    /** @return the names a Spindrift manifest lists under {@code files} */
    static Set<String> listedFiles(Path manifest, String where) {
        JsonNode m;
        try {
            m = new ObjectMapper().readTree(manifest.toFile());
        } catch (IOException e) {
            m = null;
        }
        if (m == null || !ArchiveLayout.FORMAT.equals(m.path(ArchiveLayout.K_FORMAT).asText()) || !m.path(ArchiveLayout.K_FILES).isObject()) {
            throw new UserInputException(where + ArchiveLayout.MANIFEST + " was not written by Spindrift (no '"
                    + ArchiveLayout.FORMAT + "' format with a files list); choose another folder");
        }
        Set<String> out = new TreeSet<>();
        m.path(ArchiveLayout.K_FILES).fieldNames().forEachRemaining(n -> {
            if (safeName(n)) {
                out.add(n);
            }
        });
        return out;
    }

    /** @return whether a manifest's file name stays inside the run folder (no '..', not absolute) */
    static boolean safeName(String n) {
        if (n.isEmpty() || n.startsWith("/") || n.contains("\\") || n.contains("\0")) {
            return false;
        }
        for (String part : n.split("/", -1)) {
            if (part.isEmpty() || part.equals(".") || part.equals("..")) {
                return false;
            }
        }
        return true;
    }

    /**
     * Removes a finished run folder written by Spindrift: the manifest first (so it never looks
     * complete again), then each listed file, then the folders left empty. A link, an unlisted file
     * or anything else is left alone, and so is the folder holding it.
     *
     * @return whether the folder is gone
     */
    static boolean removeRun(Path dir) throws IOException {
        Set<String> listed = listedFiles(dir.resolve(ArchiveLayout.MANIFEST), "folder " + dir + ": ");
        Files.delete(dir.resolve(ArchiveLayout.MANIFEST));
        for (String name : listed) {
            Path p = dir.resolve(name);
            if (Files.isRegularFile(p, LinkOption.NOFOLLOW_LINKS) && !hasLinkOnTheWay(dir, name)) {
                Files.delete(p);
            }
        }
        return removeEmptyFolders(dir);
    }

    /** @return whether a folder on the way from dir to the named file is a link */
    static boolean hasLinkOnTheWay(Path dir, String name) {
        Path p = dir;
        String[] parts = name.split("/");
        for (int i = 0; i < parts.length - 1; i++) {
            p = p.resolve(parts[i]);
            if (Files.isSymbolicLink(p)) {
                return true;
            }
        }
        return false;
    }

    /** Removes dir and the folders below it when they hold nothing (no links followed). @return whether dir is gone */
    static boolean removeEmptyFolders(Path dir) throws IOException {
        if (!Files.isDirectory(dir, LinkOption.NOFOLLOW_LINKS)) {
            return !Files.exists(dir, LinkOption.NOFOLLOW_LINKS);
        }
        boolean empty = true;
        try (DirectoryStream<Path> ds = Files.newDirectoryStream(dir)) {
            for (Path p : ds) {
                if (Files.isDirectory(p, LinkOption.NOFOLLOW_LINKS)) {
                    empty &= removeEmptyFolders(p);
                } else {
                    empty = false;
                }
            }
        }
        if (empty) {
            Files.delete(dir);
        }
        return empty;
    }
}
