package org.spindrift.shared.archive;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.security.DigestOutputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/**
 * Writes a file under a temporary name ({@code .name.partial} in the same folder) and renames it
 * when complete, so that an interrupted run never leaves a file that looks complete.
 */
public final class AtomicFiles {
    private AtomicFiles() {
    }

    /** Writes the content of a file to the path it is given. */
    @FunctionalInterface
    public interface Writer {
        void write(Path temporary) throws IOException;
    }

    /** Writes the content of a file to a stream (which the caller closes). */
    @FunctionalInterface
    public interface StreamWriter {
        void write(OutputStream out) throws IOException;
    }

    /** @return the temporary name used while {@code target} is written */
    public static Path partialName(Path target) {
        return target.resolveSibling(ArchiveLayout.PARTIAL_PREFIX + target.getFileName() + ArchiveLayout.PARTIAL_SUFFIX);
    }

    /**
     * Writes target through its temporary name, then renames it (atomically where the file
     * system allows). On failure the temporary file is removed and target is untouched.
     */
    public static void write(Path target, Writer writer) throws IOException {
        Path tmp = partialName(target);
        Files.deleteIfExists(tmp);
        try {
            writer.write(tmp);
            try {
                Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
            }
        } catch (IOException | RuntimeException | Error e) {
            Files.deleteIfExists(tmp);
            throw e;
        }
    }

    /**
     * Writes target through its temporary name from a stream, computing the SHA-256 of exactly
     * the bytes handed to the file (no second read), then renames it.
     *
     * @return the lower-case hexadecimal SHA-256 of the content written
     */
    public static String writeStream(Path target, StreamWriter writer) throws IOException {
        MessageDigest md = sha256();
        write(target, tmp -> {
            try (OutputStream out = new DigestOutputStream(new BufferedOutputStream(Files.newOutputStream(tmp), 1 << 16),
                    md)) {
                writer.write(out);
            }
        });
        return HexFormat.of().formatHex(md.digest());
    }

    /**
     * Writes target through its temporary name with a path-based writer (libraries that seek
     * while writing, such as HDF5), and digests the finished temporary file before it is renamed.
     *
     * @return the lower-case hexadecimal SHA-256 of the file
     */
    public static String writeDigested(Path target, Writer writer) throws IOException {
        String[] sum = new String[1];
        write(target, tmp -> {
            writer.write(tmp);
            sum[0] = sha256(tmp);
        });
        return sum[0];
    }

    static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required by every Java platform", e);
        }
    }

    /** Writes bytes to target atomically. */
    public static void writeBytes(Path target, byte[] content) throws IOException {
        write(target, tmp -> Files.write(tmp, content));
    }

    /** @return the lower-case hexadecimal SHA-256 of a file's bytes */
    public static String sha256(Path file) {
        try (InputStream in = Files.newInputStream(file)) {
            MessageDigest md = sha256();
            byte[] buf = new byte[1 << 16];
            int n;
            while ((n = in.read(buf)) > 0) {
                md.update(buf, 0, n);
            }
            return HexFormat.of().formatHex(md.digest());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
