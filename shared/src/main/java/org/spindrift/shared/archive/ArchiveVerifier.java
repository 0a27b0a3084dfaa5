package org.spindrift.shared.archive;

import com.fasterxml.jackson.databind.JsonNode;
import io.jhdf.api.Attribute;
import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.spindrift.shared.UserInputException;

/**
 * Checks that a run folder is what its manifest says, before anything is shown from it: the
 * manifest's keys have their types and physical ranges; the SHA-256 of every listed file matches
 * (optional: it reads every byte, slow for huge archives); {@code snapshots.h5} belongs to this
 * run (its attributes and sizes agree with the manifest); the first and last snapshots hold
 * physical values; the light CSV files are complete. Every problem is one line naming the folder,
 * the file and the key. {@link RunArchive} checks the values of every snapshot it reads as well.
 */
public final class ArchiveVerifier {
    /**
     * Largest radius accepted in an archive, M: particles are stopped at the escape radius
     * (1e4 M by default), so anything far beyond is damage, not physics.
     */
    public static final double MAX_RADIUS_M = 1.0e8;

    private ArchiveVerifier() {
    }

    /**
     * Verifies an opened run folder.
     *
     * @param checksums whether to compare every listed file with its SHA-256 (reads every byte)
     * @throws UserInputException naming the first problem
     */
    public static void verify(RunArchive a, boolean checksums) {
        manifest(a);
        if (checksums) {
            a.verifyChecksums();
        }
        snapshots(a);
        lightFiles(a);
    }

    /**
     * Checks a run folder completely and collects every problem instead of stopping at the first:
     * the manifest, each listed file's SHA-256 (one line per missing or changed file), files in the
     * folder the manifest does not list, {@code snapshots.h5} against the manifest and every one of
     * its snapshots, the light CSV files, and that the image cube can be read. Nothing is written.
     *
     * @return one line per problem, empty when the run is sound
     */
    public static java.util.List<String> problems(Path folder) {
        java.util.List<String> out = new java.util.ArrayList<>();
        RunArchive a;
        try {
            a = RunArchive.open(folder);
        } catch (UserInputException e) {
            out.add(e.getMessage());
            return out;
        }
        try (a) {
            boolean manifestOk = collect(out, a, ArchiveLayout.MANIFEST, () -> manifest(a));
            java.util.Map<String, String> files = manifestOk ? a.files() : java.util.Map.of();
            java.util.Set<String> damaged = new java.util.HashSet<>();
            for (java.util.Map.Entry<String, String> e : files.entrySet()) {
                Path p = folder.resolve(e.getKey());
                if (!Files.isRegularFile(p, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
                    out.add(a.problem(e.getKey() + " is listed in the manifest but missing").getMessage());
                    damaged.add(e.getKey());
                } else if (!AtomicFiles.sha256(p).equals(e.getValue())) {
                    out.add(a.problem(e.getKey() + " does not match its sha256 in the manifest (changed or damaged"
                            + " since the run)").getMessage());
                    damaged.add(e.getKey());
                }
            }
            if (manifestOk) {
                try {
                    for (String name : RunFolders.list(folder, "run folder " + folder + ": ")) {
                        if (!name.equals(ArchiveLayout.MANIFEST) && !files.containsKey(name)) {
                            out.add(a.problem(name + " is not listed in the manifest (a leftover or a foreign file)")
                                    .getMessage());
                        }
                    }
                } catch (UserInputException e) {
                    out.add(e.getMessage());
                } catch (IOException e) {
                    out.add(a.problem("cannot list the folder (" + e.getMessage() + ")").getMessage());
                }
            }
            if (manifestOk && !damaged.contains(ArchiveLayout.SNAPSHOTS)) {
                collect(out, a, ArchiveLayout.SNAPSHOTS, () -> {
                    snapshots(a);
                    for (int s = 0; s < a.snapshotCount(); s++) {
                        a.states(s);
                        a.r(s);
                    }
                });
            }
            if (manifestOk) {
                collect(out, a, "the light files", () -> lightFiles(a));
                if (a.has(ArchiveLayout.IMAGES) && !damaged.contains(ArchiveLayout.IMAGES)) {
                    collect(out, a, ArchiveLayout.IMAGES, () -> LightArchive.readCube(folder));
                }
                if (a.has(ArchiveLayout.CENTROID) && !damaged.contains(ArchiveLayout.CENTROID)) {
                    collect(out, a, ArchiveLayout.CENTROID, () -> LightArchive.readTrack(folder));
                }
            }
        }
        return out;
    }

    /** Runs one check, adding its problem (a damaged file's exception included) as one line. @return whether it passed */
    private static boolean collect(java.util.List<String> out, RunArchive a, String file, Runnable check) {
        try {
            check.run();
            return true;
        } catch (UserInputException e) {
            out.add(e.getMessage().lines().findFirst().orElse("damaged file"));
        } catch (RuntimeException | OutOfMemoryError | StackOverflowError e) {
            String m = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage().lines().findFirst()
                    .orElse(e.getClass().getSimpleName());
            out.add(a.problem(file + " cannot be read (" + m + ")").getMessage());
        }
        return false;
    }

    /** Types and ranges of the manifest keys the readers rely on. */
    static void manifest(RunArchive a) {
        JsonNode m = a.manifest();
        number(a, m, "black_hole.mass_solar", 0, false, 1e12);
        number(a, m, "black_hole.distance_Mpc", 0, false, 1e5);
        number(a, m, "black_hole.spin", -100, true, 100);
        number(a, m, "units.M_seconds", 0, false, 1e9);
        number(a, m, "units.M_uas", 0, false, 1e30);
        number(a, m, "observer.inclination_deg", 0, true, 180);
        number(a, m, "observer.position_angle_deg", -360, true, 360);
        JsonNode sources = m.path(ArchiveLayout.K_SOURCES);
        if (!sources.isArray()) {
            throw a.problem(RunArchive.typeProblem("sources", sources, "a list"));
        }
        for (int k = 0; k < sources.size(); k++) {
            JsonNode s = sources.get(k);
            String p = "sources[" + k + "]";
            if (!s.path(ArchiveLayout.K_NAME).isTextual()) {
                throw a.problem(RunArchive.typeProblem(p + ".name", s.path(ArchiveLayout.K_NAME), "text"));
            }
            number(a, m, p + ".particles", 0, true, 1e9);
            number(a, m, p + ".first_index", 0, true, 1e9);
            if (s.has(ArchiveLayout.K_KEPT)) {
                number(a, m, p + ".kept", 0, true, 1e9);
            }
        }
        JsonNode files = m.path(ArchiveLayout.K_FILES);
        if (!files.isObject()) {
            throw a.problem(RunArchive.typeProblem("files", files, "a mapping of file names to sha256"));
        }
        files.properties().forEach(e -> {
            if (!RunFolders.safeName(e.getKey())) {
                throw a.problem(ArchiveLayout.MANIFEST + ": files: '" + e.getKey() + "' is not a file name inside the run folder");
            }
            if (!e.getValue().isTextual() || !e.getValue().asText().matches("[0-9a-f]{64}")) {
                throw a.problem(ArchiveLayout.MANIFEST + ": files." + e.getKey() + ": not a sha256 (64 hexadecimal digits)");
            }
        });
        if (!files.has(ArchiveLayout.SNAPSHOTS)) {
            throw a.problem(ArchiveLayout.MANIFEST + ": files: " + ArchiveLayout.SNAPSHOTS + " is not listed");
        }
    }

    private static double number(RunArchive a, JsonNode m, String path, double lo, boolean loIncl, double hi) {
        JsonNode v = RunArchive.at(m, path);
        if (!v.isNumber()) {
            throw a.problem(RunArchive.typeProblem(path, v, "a number"));
        }
        double d = v.asDouble();
        if (!Double.isFinite(d) || (loIncl ? d < lo : d <= lo) || d > hi) {
            throw a.problem(ArchiveLayout.MANIFEST + ": key '" + path + "' = " + d + " is outside its physical range " + (loIncl ? "[" : "(")
                    + fmt(lo) + ", " + fmt(hi) + "]");
        }
        return d;
    }

    /** snapshots.h5 belongs to this run, and its first and last snapshots hold physical values. */
    static void snapshots(RunArchive a) {
        JsonNode m = a.manifest();
        String f = ArchiveLayout.SNAPSHOTS + " does not belong to this run: ";
        compare(a, f, "spin", a.spin());
        compare(a, f, "mass_solar", a.massSolar());
        compare(a, f, "distance_Mpc", a.distanceMpc());
        int s = a.snapshotCount();
        JsonNode ms = m.path(ArchiveLayout.K_TIME).path(ArchiveLayout.K_SNAPSHOTS);
        if (ms.isNumber() && ms.asInt() != s) {
            throw a.problem(f + "it holds " + s + " snapshots, the manifest says " + ms.asInt());
        }
        long kept = 0;
        for (RunArchive.SourceEntry e : a.sources()) {
            kept += e.kept();
        }
        if (!a.sources().isEmpty() && kept != a.particleCount()) {
            throw a.problem(f + "it holds " + a.particleCount() + " particles, the manifest's sources keep " + kept);
        }
        if (s > 0) {
            a.states(0);
            a.r(0);
            a.states(s - 1);
            a.r(s - 1);
        }
    }

    private static void compare(RunArchive a, String f, String attribute, double manifest) {
        Attribute at = a.hdfAttribute(attribute);
        if (at == null) {
            return;
        }
        Object v = at.getData();
        double d = v instanceof Number n ? n.doubleValue() : Double.NaN;
        if (Double.compare(d, manifest) != 0) {
            throw a.problem(f + "its " + attribute + " is " + d + ", the manifest's is " + manifest);
        }
    }

    /**
     * The light CSV files are complete: as many data rows as the manifest's frame count, each
     * with every column of the header.
     */
    static void lightFiles(RunArchive a) {
        JsonNode frames = a.manifest().path(ArchiveLayout.K_LIGHT).path(ArchiveLayout.K_FRAMES);
        for (String name : new String[] {ArchiveLayout.CENTROID, ArchiveLayout.LIGHTCURVE}) {
            if (!a.has(name)) {
                continue;
            }
            Path p = a.path(name);
            int rows = 0;
            try (BufferedReader r = Files.newBufferedReader(p, StandardCharsets.UTF_8)) {
                String header = r.readLine();
                if (header == null) {
                    throw a.problem(name + " is empty");
                }
                int cols = header.split(",", -1).length;
                String line;
                int lineNo = 1;
                while ((line = r.readLine()) != null) {
                    lineNo++;
                    if (line.isBlank()) {
                        continue;
                    }
                    if (line.split(",", -1).length != cols) {
                        throw a.problem(name + ": line " + lineNo + " has " + line.split(",", -1).length
                                + " fields, the header " + cols + " (truncated or damaged file)");
                    }
                    rows++;
                }
            } catch (IOException e) {
                throw a.problem(name + " cannot be read (" + e.getMessage() + ")");
            }
            if (frames.isNumber() && rows != frames.asInt()) {
                throw a.problem(name + " has " + rows + " rows, the manifest lists " + frames.asInt()
                        + " frames (truncated or from another run)");
            }
        }
    }

    /**
     * Checks one snapshot's radii and end-state codes.
     *
     * @throws UserInputException at the first value outside its range
     */
    static void checkSnapshot(RunArchive a, int s, double[] r, byte[] states) {
        if (states != null) {
            for (int i = 0; i < states.length; i++) {
                byte c = states[i];
                if (c < ArchiveLayout.ALIVE || c > ArchiveLayout.FAILED) {
                    throw a.problem(ArchiveLayout.SNAPSHOTS + ": /state = " + c + " at snapshot " + s + ", particle " + i
                            + " is not an end-state code (0 alive, 1 captured, 2 escaped, 3 failed)");
                }
            }
        }
        if (r != null) {
            for (int i = 0; i < r.length; i++) {
                double v = r[i];
                if (!(v >= 0 && v <= MAX_RADIUS_M) && !Double.isNaN(v)) {
                    throw a.problem(ArchiveLayout.SNAPSHOTS + ": /r = " + v + " M at snapshot " + s + ", particle " + i
                            + " is outside the physical range [0, " + fmt(MAX_RADIUS_M) + "] M");
                }
            }
        }
    }

    /** Checks Cartesian positions: finite (or NaN for a particle that ended) and within the largest radius. */
    static void checkPositions(RunArchive a, int s, double[][] xyz) {
        for (int c = 0; c < xyz.length; c++) {
            for (int i = 0; i < xyz[c].length; i++) {
                double v = xyz[c][i];
                if (!(Math.abs(v) <= MAX_RADIUS_M) && !Double.isNaN(v)) {
                    throw a.problem(ArchiveLayout.SNAPSHOTS + ": /" + "xyz".charAt(c) + " = " + v + " M at snapshot " + s
                            + ", particle " + i + " is outside the physical range [-" + fmt(MAX_RADIUS_M) + ", "
                            + fmt(MAX_RADIUS_M) + "] M");
                }
            }
        }
    }

    private static String fmt(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e6 ? Long.toString((long) v) : String.format(Locale.ROOT, "%g", v);
    }
}
