package org.spindrift.shared.archive;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.jhdf.HdfFile;
import io.jhdf.api.Dataset;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.spindrift.shared.UserInputException;

/**
 * Reads a run folder written by {@link RunArchiveWriter} (format version 1): the manifest's
 * fields, the landmarks, the sources, and the particle snapshots one snapshot at a time
 * (jhdf slices, so a large archive is never read whole). Used by the viewer and the analysis.
 * Not thread-safe.
 */
public final class RunArchive implements AutoCloseable {
    /**
     * One source as listed in the manifest.
     *
     * @param name source name
     * @param kind {@code hot_spot}, {@code cloud} or {@code ring}
     * @param particles particles simulated
     * @param kept particles kept in {@code snapshots.h5}
     * @param firstIndex index of the source's first kept particle in the snapshot arrays (kept
     *     particles of one source are contiguous)
     */
    public record SourceEntry(String name, String kind, int particles, int kept, int firstIndex) {
    }

    private final Path folder;
    private final JsonNode manifest;
    private HdfFile hdf;
    private int snapshots = -1;
    private int particles = -1;

    private RunArchive(Path folder, JsonNode manifest) {
        this.folder = folder;
        this.manifest = manifest;
    }

    /**
     * Opens a run folder.
     *
     * @throws UserInputException when the folder has no manifest (missing or interrupted run), or
     *     the manifest is not a spindrift run of a supported format version
     */
    public static RunArchive open(Path folder) {
        Path mf = folder.resolve(ArchiveLayout.MANIFEST);
        if (!Files.isRegularFile(mf)) {
            throw new UserInputException("run folder " + folder + ": no " + ArchiveLayout.MANIFEST
                    + " (not a run folder, or the run did not complete)");
        }
        JsonNode m;
        try {
            // trailing bytes after the object are damage too (a parser stops at the first complete value)
            m = new ObjectMapper().enable(com.fasterxml.jackson.databind.DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
                    .readTree(mf.toFile());
        } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
            // one line, without the parser's source excerpt
            String msg = e.getOriginalMessage() == null ? "syntax error" : e.getOriginalMessage().lines().findFirst()
                    .orElse("syntax error");
            int line = e.getLocation() == null ? -1 : e.getLocation().getLineNr();
            throw new UserInputException("run folder " + folder + ": " + ArchiveLayout.MANIFEST + " is not valid JSON"
                    + (line > 0 ? " at line " + line : "") + ": " + msg);
        } catch (IOException e) {
            throw new UserInputException("run folder " + folder + ": " + ArchiveLayout.MANIFEST + " cannot be read ("
                    + e.getMessage() + ")");
        }
        if (m == null || !m.isObject()) {
            throw new UserInputException("run folder " + folder + ": " + ArchiveLayout.MANIFEST + " is not a JSON object");
        }
        if (!ArchiveLayout.FORMAT.equals(m.path(ArchiveLayout.K_FORMAT).asText())) {
            throw new UserInputException("run folder " + folder + ": " + ArchiveLayout.MANIFEST + ": key 'format' is not '"
                    + ArchiveLayout.FORMAT + "'");
        }
        if (!m.path(ArchiveLayout.K_FORMAT_VERSION).isInt()) {
            throw new UserInputException("run folder " + folder + ": " + typeProblem("format_version",
                    m.path(ArchiveLayout.K_FORMAT_VERSION), "a whole number"));
        }
        int v = m.path(ArchiveLayout.K_FORMAT_VERSION).asInt(-1);
        if (v != ArchiveLayout.FORMAT_VERSION) {
            throw new UserInputException("run folder " + folder + ": " + ArchiveLayout.MANIFEST + ": format_version " + v
                    + " is not supported (this reader knows " + ArchiveLayout.FORMAT_VERSION + ")");
        }
        return new RunArchive(folder, m);
    }

    /**
     * Opens a run folder and verifies it ({@link ArchiveVerifier}): manifest types and ranges,
     * optionally every file's SHA-256, that {@code snapshots.h5} belongs to the run, physical
     * values, complete light files.
     *
     * @param checksums whether to compare every file with its SHA-256 (reads every byte)
     */
    public static RunArchive open(Path folder, boolean checksums) {
        RunArchive a = open(folder);
        try {
            ArchiveVerifier.verify(a, checksums);
            return a;
        } catch (RuntimeException e) {
            a.close();
            if (e instanceof UserInputException) {
                throw e;
            }
            throw a.problem(ArchiveLayout.SNAPSHOTS + " cannot be read (" + firstLine(e) + ")");
        }
    }

    /** @return a one-line error about this run folder */
    UserInputException problem(String what) {
        return new UserInputException("run folder " + folder + ": " + what);
    }

    private static String firstLine(Throwable e) {
        String m = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
        int i = m.indexOf('\n');
        return i < 0 ? m : m.substring(0, i);
    }

    /** @return the node at a dotted key path such as {@code sources[1].kept} (missing node when absent) */
    static JsonNode at(JsonNode root, String path) {
        JsonNode n = root;
        for (String part : path.split("\\.")) {
            int b = part.indexOf('[');
            n = n.path(b < 0 ? part : part.substring(0, b));
            while (b >= 0) {
                int e = part.indexOf(']', b);
                n = n.path(Integer.parseInt(part.substring(b + 1, e)));
                b = part.indexOf('[', e);
            }
        }
        return n;
    }

    /** @return "manifest.json: key 'p' is missing" or "... must be WANT, got TYPE", telling the two apart */
    static String typeProblem(String path, JsonNode v, String want) {
        String where = ArchiveLayout.MANIFEST + ": key '" + path + "' ";
        if (v == null || v.isMissingNode()) {
            return where + "is missing";
        }
        String got = v.isNull() ? "null" : v.isTextual() ? "text '" + abbreviate(v.asText()) + "'" : v.isBoolean()
                ? "true/false" : v.isArray() ? "a list" : v.isObject() ? "a mapping" : v.isNumber() ? "the number "
                + v.asText() : v.getNodeType().toString().toLowerCase(java.util.Locale.ROOT);
        return where + "must be " + want + ", got " + got;
    }

    private static String abbreviate(String s) {
        return s.length() > 40 ? s.substring(0, 40) + "..." : s;
    }

    /** @return a root attribute of {@code snapshots.h5}, or null */
    io.jhdf.api.Attribute hdfAttribute(String name) {
        return read(() -> hdf().getAttribute(name));
    }

    /** @return the folder */
    public Path folder() {
        return folder;
    }

    /** @return the whole manifest */
    public JsonNode manifest() {
        return manifest;
    }

    /** @return the code version that wrote the run */
    public String codeVersion() {
        return manifest.path(ArchiveLayout.K_CODE_VERSION).asText();
    }

    /** @return the run's seed */
    public long seed() {
        return manifest.path(ArchiveLayout.K_SEED).asLong();
    }

    /** @return the scenario name */
    public String scenarioName() {
        return manifest.path(ArchiveLayout.K_SCENARIO).path(ArchiveLayout.K_NAME).asText("");
    }

    /** @return the black hole mass in solar masses */
    public double massSolar() {
        return manifest.path(ArchiveLayout.K_BLACK_HOLE).path(ArchiveLayout.K_MASS_SOLAR).asDouble(Double.NaN);
    }

    /** @return the distance in Mpc (manifest black_hole.distance_Mpc) */
    public double distanceMpc() {
        return manifest.path(ArchiveLayout.K_BLACK_HOLE).path(ArchiveLayout.K_DISTANCE_MPC).asDouble(Double.NaN);
    }

    /** @return the spacetime family */
    public String family() {
        return manifest.path(ArchiveLayout.K_BLACK_HOLE).path(ArchiveLayout.K_FAMILY).asText();
    }

    /** @return the spin a */
    public double spin() {
        return manifest.path(ArchiveLayout.K_BLACK_HOLE).path(ArchiveLayout.K_SPIN).asDouble(Double.NaN);
    }

    /** @return the family's parameters (name to value) */
    public Map<String, Double> parameters() {
        return numbers(manifest.path(ArchiveLayout.K_BLACK_HOLE).path(ArchiveLayout.K_PARAMETERS));
    }

    /** @return GM/c^3 in seconds */
    public double mSeconds() {
        return manifest.path(ArchiveLayout.K_UNITS).path(ArchiveLayout.K_M_SECONDS).asDouble(Double.NaN);
    }

    /** @return GM/c^2 in metres */
    public double mMetres() {
        return manifest.path(ArchiveLayout.K_UNITS).path(ArchiveLayout.K_M_METRES).asDouble(Double.NaN);
    }

    /** @return micro-arcseconds subtended by 1 M at the distance */
    public double mUas() {
        return manifest.path(ArchiveLayout.K_UNITS).path(ArchiveLayout.K_M_UAS).asDouble(Double.NaN);
    }

    /** @return inclination in degrees */
    public double inclinationDeg() {
        return manifest.path(ArchiveLayout.K_OBSERVER).path(ArchiveLayout.K_INCLINATION_DEG).asDouble(Double.NaN);
    }

    /** @return position angle in degrees */
    public double positionAngleDeg() {
        return manifest.path(ArchiveLayout.K_OBSERVER).path(ArchiveLayout.K_POSITION_ANGLE_DEG).asDouble(Double.NaN);
    }

    /**
     * @return the numeric landmarks (horizon, ISCO, Omega maximum, capture_radius, ...); a JSON null
     *     (landmark absent, for example no horizon) reads as NaN
     */
    public Map<String, Double> landmarks() {
        return numbers(manifest.path(ArchiveLayout.LANDMARKS));
    }

    /** @return the diagnostics object of the manifest */
    public JsonNode diagnostics() {
        return manifest.path(ArchiveLayout.K_DIAGNOSTICS);
    }

    /** @return end-state counts (alive, captured, escaped, failed) */
    public Map<String, Long> endStates() {
        Map<String, Long> out = new LinkedHashMap<>();
        Iterator<Map.Entry<String, JsonNode>> it = manifest.path(ArchiveLayout.END_STATES).properties().iterator();
        while (it.hasNext()) {
            Map.Entry<String, JsonNode> e = it.next();
            if (e.getValue().isNumber()) {
                out.put(e.getKey(), e.getValue().asLong());
            }
        }
        return Collections.unmodifiableMap(out);
    }

    /** @return the sources in manifest order (index = {@code source_index}) */
    public List<SourceEntry> sources() {
        List<SourceEntry> out = new ArrayList<>();
        for (JsonNode s : manifest.path(ArchiveLayout.K_SOURCES)) {
            int particles = s.path(ArchiveLayout.K_PARTICLES).asInt();
            out.add(new SourceEntry(s.path(ArchiveLayout.K_NAME).asText(), s.path(ArchiveLayout.K_KIND).asText(),
                    particles, s.path(ArchiveLayout.K_KEPT).asInt(particles),
                    s.path(ArchiveLayout.K_FIRST_INDEX).asInt()));
        }
        return Collections.unmodifiableList(out);
    }

    /** @return the files listed in the manifest with their SHA-256 */
    public Map<String, String> files() {
        Map<String, String> out = new LinkedHashMap<>();
        manifest.path(ArchiveLayout.K_FILES).properties().forEach(e -> out.put(e.getKey(), e.getValue().asText()));
        return Collections.unmodifiableMap(out);
    }

    /** @return whether the run lists a file (for example {@code centroid.csv}) */
    public boolean has(String name) {
        return manifest.path(ArchiveLayout.K_FILES).has(name);
    }

    /** @return the path of a file of the run */
    public Path path(String name) {
        return folder.resolve(name);
    }

    /**
     * Checks the SHA-256 of every listed file.
     *
     * @throws UserInputException naming the first file that is missing or differs
     */
    public void verifyChecksums() {
        for (Map.Entry<String, String> e : files().entrySet()) {
            Path p = folder.resolve(e.getKey());
            if (!Files.isRegularFile(p)) {
                throw new UserInputException("run folder " + folder + ": " + e.getKey() + " is listed in the manifest but missing");
            }
            if (!AtomicFiles.sha256(p).equals(e.getValue())) {
                throw new UserInputException("run folder " + folder + ": " + e.getKey()
                        + " does not match its sha256 in the manifest (changed or damaged since the run)");
            }
        }
    }

    private HdfFile hdf() {
        if (hdf == null) {
            Path p = folder.resolve(ArchiveLayout.SNAPSHOTS);
            if (!Files.isRegularFile(p)) {
                throw new UserInputException("run folder " + folder + ": no " + ArchiveLayout.SNAPSHOTS);
            }
            HdfFile h = read(() -> new HdfFile(p));
            hdf = h;
            int[] dims = read(() -> dataset(ArchiveLayout.D_R).getDimensions());
            if (dims.length != 2) {
                throw problem(ArchiveLayout.SNAPSHOTS + ": /" + ArchiveLayout.D_R + " has " + dims.length
                        + " dimensions, 2 expected (snapshot, particle)");
            }
            snapshots = dims[0];
            particles = dims[1];
        }
        return hdf;
    }

    private Dataset dataset(String name) {
        Dataset d = read(() -> {
            try {
                return hdf().getDatasetByPath("/" + name);
            } catch (io.jhdf.exceptions.HdfInvalidPathException e) {
                return null;
            }
        });
        if (d == null) {
            throw new UserInputException("run folder " + folder + ": " + ArchiveLayout.SNAPSHOTS + " has no dataset /" + name);
        }
        return d;
    }

    /**
     * Reads from {@code snapshots.h5}, turning whatever a damaged file makes the HDF5 library throw
     * (wrong types or shapes, broken structures, sizes larger than memory) into one line naming the file.
     */
    private <T> T read(java.util.function.Supplier<T> reader) {
        try {
            return reader.get();
        } catch (UserInputException | IndexOutOfBoundsException e) {
            throw e;
        } catch (RuntimeException e) {
            throw problem(ArchiveLayout.SNAPSHOTS + " cannot be read (" + firstLine(e) + "; damaged or not written by"
                    + " Spindrift)");
        } catch (OutOfMemoryError e) {
            throw problem(ArchiveLayout.SNAPSHOTS + " cannot be read (a dataset larger than memory: damaged?)");
        }
    }

    /** @return number of snapshots S */
    public int snapshotCount() {
        hdf();
        return snapshots;
    }

    /** @return number of kept particles N */
    public int particleCount() {
        hdf();
        return particles;
    }

    /** @return coordinate time of each snapshot, M */
    public double[] times() {
        return read(() -> (double[]) dataset(ArchiveLayout.D_TIME).getData());
    }

    /** @return source (0-based) of each kept particle */
    public int[] sourceIndex() {
        return read(() -> (int[]) dataset(ArchiveLayout.D_SOURCE_INDEX).getData());
    }

    private Object row(String name, int s, int... inner) {
        if (s < 0 || s >= snapshotCount()) {
            throw new IndexOutOfBoundsException("snapshot " + s + " outside 0.." + (snapshotCount() - 1));
        }
        return read(() -> {
            Dataset d = dataset(name);
            int[] dims = d.getDimensions();
            long[] off = new long[dims.length];
            off[0] = s;
            int[] shape = dims.clone();
            shape[0] = 1;
            return d.getData(off, shape);
        });
    }

    private double[] row2(String name, int s) {
        return read(() -> ((double[][]) row(name, s))[0]);
    }

    /** @return r of every kept particle at snapshot s */
    public double[] r(int s) {
        double[] r = row2(ArchiveLayout.D_R, s);
        ArchiveVerifier.checkSnapshot(this, s, r, null);
        return r;
    }

    /** @return theta of every kept particle at snapshot s */
    public double[] theta(int s) {
        return row2(ArchiveLayout.D_THETA, s);
    }

    /** @return phi of every kept particle at snapshot s */
    public double[] phi(int s) {
        return row2(ArchiveLayout.D_PHI, s);
    }

    /** @return {x, y, z} arrays (each of length N) at snapshot s, M */
    public double[][] positions(int s) {
        double[][] xyz = {row2(ArchiveLayout.D_X, s), row2(ArchiveLayout.D_Y, s), row2(ArchiveLayout.D_Z, s)};
        ArchiveVerifier.checkPositions(this, s, xyz);
        return xyz;
    }

    /** @return 4-velocities u^mu at snapshot s, [N][4] (u^t, u^r, u^theta, u^phi) */
    public double[][] velocities(int s) {
        return read(() -> ((double[][][]) row(ArchiveLayout.D_U, s))[0]);
    }

    /**
     * @return u^t of every kept particle at snapshot s: one component of {@code /u}, read without
     *     the other three (about half the time of {@link #velocities} for the viewer's redshift colours)
     */
    public double[] timeComponents(int s) {
        if (s < 0 || s >= snapshotCount()) {
            throw new IndexOutOfBoundsException("snapshot " + s + " outside 0.." + (snapshotCount() - 1));
        }
        double[][] col = read(() -> ((double[][][]) dataset(ArchiveLayout.D_U).getData(new long[] {s, 0, 0},
                new int[] {1, particleCount(), 1}))[0]);
        double[] out = new double[col.length];
        for (int i = 0; i < out.length; i++) {
            out[i] = col[i][0];
        }
        return out;
    }

    /** @return emission weights at snapshot s */
    public float[] weights(int s) {
        return read(() -> ((float[][]) row(ArchiveLayout.D_WEIGHT, s))[0]);
    }

    /** @return states at snapshot s (codes of {@link ArchiveLayout}) */
    public byte[] states(int s) {
        byte[] st = read(() -> ((byte[][]) row(ArchiveLayout.D_STATE, s))[0]);
        ArchiveVerifier.checkSnapshot(this, s, null, st);
        return st;
    }

    /**
     * @return the Cartesian centre of every source at every snapshot, [S][K][3], in one read (the
     *     whole of {@code /centre}, small: S x K x 3 numbers; faster than S calls of {@link #centres})
     */
    public double[][][] centreTracks() {
        return read(() -> (double[][][]) dataset(ArchiveLayout.D_CENTRE).getData());
    }

    /** @return Cartesian centre of each source at snapshot s, [K][3] */
    public double[][] centres(int s) {
        return read(() -> ((double[][][]) row(ArchiveLayout.D_CENTRE, s))[0]);
    }

    private static Map<String, Double> numbers(JsonNode obj) {
        Map<String, Double> out = new LinkedHashMap<>();
        Iterator<Map.Entry<String, JsonNode>> it = obj.properties().iterator();
        while (it.hasNext()) {
            Map.Entry<String, JsonNode> e = it.next();
            JsonNode v = e.getValue();
            if (v.isNumber()) {
                out.put(e.getKey(), v.asDouble());
            } else if (v.isNull()) {
                out.put(e.getKey(), Double.NaN);
            }
        }
        return Collections.unmodifiableMap(out);
    }

    @Override public void close() {
        if (hdf != null) {
            hdf.close();
            hdf = null;
        }
    }
}
