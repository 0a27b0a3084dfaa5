package org.spindrift.sim.run;

import java.io.BufferedInputStream;
import java.io.BufferedOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.FileOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.security.DigestInputStream;
import java.security.DigestOutputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.stream.Stream;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.Version;
import org.spindrift.sim.history.HistoryRecorder;
import org.spindrift.sim.motion.MotionDiagnostics;
import org.spindrift.sim.motion.ParticleBatch;
import org.spindrift.sim.motion.TurningPoints;

/**
 * The checkpoint of a run being evolved, in {@code .NAME.spindrift-checkpoint} beside the run
 * folder (under the run's lock): {@code state.bin} holds the whole integrator state (every
 * particle's position, momentum, own time, next step size and first-same-as-last derivative, end
 * state), the turning points found so far, the motion diagnostics so far and the last finished
 * snapshot; {@code rows-A-B.bin} hold the particle history of snapshots A..B, each file written
 * once. Every file goes through a
 * temporary name and ends with the SHA-256 of its bytes; {@code state.bin} is replaced last, so a
 * kill at any moment leaves the previous checkpoint or the new one, never a mixture.
 *
 * <p>No random numbers are drawn during the evolution (sources are placed from the seed before
 * it; the light and interferometry stages draw from their own seeded generators and restart from
 * their beginning on resume), so the checkpoint needs no generator state: the seed in the
 * scenario reproduces every draw.
 */
final class Checkpoint {
    static final String SUFFIX = ".spindrift-checkpoint";
    static final String STATE = "state.bin";
    private static final String MAGIC = "spindrift-checkpoint";
    private static final int VERSION = 2;

    private final Path dir;
    private final String scenarioSha;
    private final List<int[]> rowFiles = new ArrayList<>();
    private int rowsSaved;

    /**
     * @param target the run folder
     * @param scenarioSha SHA-256 of the scenario file's bytes (a checkpoint resumes only the same file)
     */
    Checkpoint(Path target, String scenarioSha) {
        Path abs = target.toAbsolutePath().normalize();
        this.dir = abs.resolveSibling("." + abs.getFileName() + SUFFIX);
        this.scenarioSha = scenarioSha;
    }

    Path folder() {
        return dir;
    }

    boolean exists() {
        return Files.isRegularFile(dir.resolve(STATE), LinkOption.NOFOLLOW_LINKS);
    }

    /** Removes the checkpoint folder (only the files a checkpoint writes). */
    void clear() throws IOException {
        if (!Files.isDirectory(dir, LinkOption.NOFOLLOW_LINKS)) {
            return;
        }
        try (Stream<Path> s = Files.list(dir)) {
            for (Path p : s.toList()) {
                String n = p.getFileName().toString();
                if (Files.isRegularFile(p, LinkOption.NOFOLLOW_LINKS)
                        && (n.equals(STATE) || n.startsWith("rows-") || n.endsWith(".partial"))) {
                    Files.delete(p);
                }
            }
        }
        try {
            Files.delete(dir);
        } catch (java.nio.file.DirectoryNotEmptyException e) {
            // something else was put there: leave it
        }
        rowFiles.clear();
        rowsSaved = 0;
    }

    /**
     * Writes a checkpoint after snapshot k: the history rows not saved yet, then the state.
     */
    synchronized void write(int k, ParticleBatch batch, TurningPoints[] turning, HistoryRecorder h,
            MotionDiagnostics diagnostics)
            throws IOException {
        Files.createDirectories(dir);
        if (k >= rowsSaved) {
            int from = rowsSaved;
            String name = String.format(java.util.Locale.ROOT, "rows-%06d-%06d.bin", from, k);
            atomically(name, out -> h.writeRows(out, from, k));
            rowFiles.add(new int[] {from, k});
            rowsSaved = k + 1;
        }
        atomically(STATE, out -> {
            out.writeUTF(MAGIC);
            out.writeInt(VERSION);
            out.writeUTF(scenarioSha);
            out.writeUTF(Version.get());
            out.writeInt(batch.size());
            out.writeInt(h.snapshots());
            out.writeInt(k);
            out.writeInt(rowFiles.size());
            for (int[] f : rowFiles) {
                out.writeInt(f[0]);
                out.writeInt(f[1]);
            }
            batch.writeState(out);
            for (TurningPoints t : turning) {
                t.writeState(out);
            }
            diagnostics.writeState(out);
        });
        // rows files of an older checkpoint that the new state does not list (none in normal use)
    }

    /**
     * Restores the last checkpoint into a freshly prepared run.
     *
     * @return the last snapshot the checkpoint had finished
     * @throws UserInputException (one line) when the checkpoint is damaged or belongs to another scenario
     */
    int read(ParticleBatch batch, TurningPoints[] turning, HistoryRecorder h, MotionDiagnostics diagnostics) {
        Path state = dir.resolve(STATE);
        try {
            int[] k = new int[1];
            List<int[]> files = new ArrayList<>();
            verified(state, in -> {
                if (!MAGIC.equals(in.readUTF()) || in.readInt() != VERSION) {
                    throw new IOException("not a checkpoint of this version");
                }
                if (!scenarioSha.equals(in.readUTF())) {
                    throw new UserInputException("checkpoint " + dir + " was made from another scenario (the file"
                            + " has changed); run without --resume to start again (the checkpoint is then replaced)");
                }
                String code = in.readUTF();
                if (!code.equals(Version.get())) {
                    throw new UserInputException("checkpoint " + dir + " was made by spindrift " + code + ", this is "
                            + Version.get() + "; run without --resume to start again");
                }
                int n = in.readInt();
                int s = in.readInt();
                k[0] = in.readInt();
                if (n != batch.size() || s != h.snapshots() || k[0] < 0 || k[0] >= s) {
                    throw new IOException("sizes differ from the scenario's");
                }
                int nf = in.readInt();
                for (int f = 0; f < nf; f++) {
                    files.add(new int[] {in.readInt(), in.readInt()});
                }
                batch.readState(in);
                for (TurningPoints t : turning) {
                    t.readState(in);
                }
                diagnostics.readState(in);
            });
            int next = 0;
            for (int[] f : files) {
                if (f[0] != next || f[1] < f[0]) {
                    throw new IOException("history rows are not contiguous");
                }
                String name = String.format(java.util.Locale.ROOT, "rows-%06d-%06d.bin", f[0], f[1]);
                verified(dir.resolve(name), in -> h.readRows(in, f[0], f[1]));
                next = f[1] + 1;
            }
            if (next != k[0] + 1) {
                throw new IOException("history rows end at " + (next - 1) + ", the state at " + k[0]);
            }
            rowFiles.clear();
            rowFiles.addAll(files);
            rowsSaved = next;
            return k[0];
        } catch (IOException e) {
            throw new UserInputException("checkpoint " + dir + " is damaged (" + e.getMessage() + "); run without"
                    + " --resume to start again");
        }
    }

    private interface Body {
        void write(DataOutputStream out) throws IOException;
    }

    private interface Reader {
        void read(DataInputStream in) throws IOException;
    }

    /** Writes a file through a temporary name, with its SHA-256 at the end, synced before the rename. */
    private void atomically(String name, Body body) throws IOException {
        Path tmp = dir.resolve("." + name + ".partial");
        MessageDigest md = sha256();
        try (FileOutputStream fo = new FileOutputStream(tmp.toFile())) {
            DataOutputStream out = new DataOutputStream(new DigestOutputStream(new BufferedOutputStream(fo, 1 << 16), md));
            body.write(out);
            out.flush();
            fo.write(md.digest());
            fo.flush();
            fo.getFD().sync();
        }
        Files.move(tmp, dir.resolve(name), StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
    }

    /** Reads a file written by {@link #atomically} and checks its SHA-256. */
    private static void verified(Path p, Reader reader) throws IOException {
        long size = Files.size(p);
        if (size < 32) {
            throw new IOException(p.getFileName() + " is truncated");
        }
        MessageDigest md = sha256();
        try (InputStream raw = new BufferedInputStream(Files.newInputStream(p), 1 << 16)) {
            InputStream body = new LimitedStream(raw, size - 32);
            DataInputStream in = new DataInputStream(new DigestInputStream(body, md));
            try {
                reader.read(in);
            } catch (java.io.EOFException e) {
                throw new IOException(p.getFileName() + " is truncated");
            }
            if (in.read() != -1) {
                throw new IOException(p.getFileName() + " has bytes after its content");
            }
            byte[] sum = raw.readNBytes(32);
            if (!Arrays.equals(sum, md.digest())) {
                throw new IOException(p.getFileName() + " does not match its sha256");
            }
        }
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    /** At most n bytes of another stream. */
    private static final class LimitedStream extends java.io.FilterInputStream {
        private long left;

        LimitedStream(InputStream in, long n) {
            super(in);
            left = n;
        }

        @Override public int read() throws IOException {
            if (left <= 0) {
                return -1;
            }
            int b = super.read();
            if (b >= 0) {
                left--;
            }
            return b;
        }

        @Override public int read(byte[] b, int off, int len) throws IOException {
            if (left <= 0) {
                return -1;
            }
            int n = super.read(b, off, (int) Math.min(len, left));
            if (n > 0) {
                left -= n;
            }
            return n;
        }

        @Override public void close() {
            // the caller closes the underlying stream
        }
    }

    /**
     * @return the SHA-256 of the scenario as parsed (its echo in the manifest, seed included): a
     *     checkpoint resumes only the same scenario, whatever comments or layout the file has
     */
    static String fingerprint(org.spindrift.shared.scenario.Scenario sc) {
        try {
            byte[] b = new com.fasterxml.jackson.databind.ObjectMapper().writeValueAsBytes(
                    org.spindrift.shared.scenario.ScenarioJson.toJson(sc));
            StringBuilder hex = new StringBuilder();
            for (byte x : sha256().digest(b)) {
                hex.append(String.format("%02x", x));
            }
            return hex.toString();
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }
}
