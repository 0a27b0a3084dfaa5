package org.spindrift.sim.study;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Future;
import java.util.stream.Stream;
import me.tongfei.progressbar.ProgressBar;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.AtomicFiles;
import org.spindrift.sim.sweep.Workers;
import org.spindrift.sim.fit.FitModel;
import org.spindrift.sim.run.ProgressBars;

/**
 * A whole study into one folder: every cell (resuming: a cell whose record {@code
 * cells/cell-NNNNNN.json} exists for the same study file is not run again), then {@code
 * distinguish.csv}, {@code distinguish.json}, the plots and {@code manifest.json} last (each
 * written under a temporary name and renamed when complete).
 */
public final class StudyRun {
    static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
    /** Output file names. */
    public static final String CSV = "distinguish.csv";
    public static final String JSON_FILE = "distinguish.json";
    public static final String MANIFEST = "manifest.json";
    static final String CELLS = "cells";

    /**
     * @param ran cells run now
     * @param skipped cells found done
     */
    public record Summary(int ran, int skipped) {
    }

    private StudyRun() {
    }

    /**
     * Runs the study's cells (jobs at a time, threads each) and writes the folder.
     *
     * @param progress show a progress bar
     */
    public static Summary run(StudyFile study, Path dir, int jobs, int threads, boolean progress) throws IOException {
        String sha = AtomicFiles.sha256(study.file());
        checkFolder(dir);
        FitModel.Cache cache = new FitModel.Cache(threads);
        CellStudy.Shared shared = new CellStudy.Shared();
        for (int d = 0; d < study.deformations().length; d++) {
            // the campaign must fit in every truth's run: checked before anything is written
            new CellStudy(study, cache, threads).checkCampaign(study.cell(d * study.sigmasUas().length
                    * study.beamsUas().length));
        }
        Files.createDirectories(dir.resolve(CELLS));
        Files.deleteIfExists(dir.resolve(MANIFEST));
        int n = study.cells();
        CellStudy.Result[] results = new CellStudy.Result[n];
        JsonNode[] records = new JsonNode[n];
        List<Integer> todo = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            records[i] = done(dir, study, i, sha);
            if (records[i] == null) {
                todo.add(i);
            }
        }
        // precision slowest: cells running side by side then differ in deformation or beam and do not wait
        // for each other's shared noise-free fits (the results do not depend on the order)
        int ns = study.sigmasUas().length;
        todo.sort(java.util.Comparator.comparingInt((Integer i) -> i % ns).thenComparingInt(i -> i));
        ExecutorService pool = Workers.daemonPool(jobs, "spindrift-study-cell");
        try (ProgressBar bar = ProgressBars.open(progress, "study " + study.name(), todo.size())) {
            List<Future<?>> fs = new ArrayList<>();
            for (int i : todo) {
                fs.add(pool.submit(() -> {
                    CellStudy.Result r = new CellStudy(study, cache, threads, shared).run(study.cell(i));
                    ObjectNode rec = StudyOutputs.cellJson(study, r, sha);
                    AtomicFiles.write(cellFile(dir, i), tmp -> JSON.writeValue(tmp.toFile(), rec));
                    records[i] = rec;
                    results[i] = r;
                    if (bar != null) {
                        bar.step();
                    }
                    return null;
                }));
            }
            Workers.awaitAll(fs);
        } finally {
            pool.shutdownNow();
        }
        StudyOutputs.write(study, dir, records, sha);
        return new Summary(todo.size(), n - todo.size());
    }

    /** A folder that is new, empty, or an earlier (possibly interrupted) study's; anything else is refused. */
    static void checkFolder(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return;
        }
        if (!Files.isDirectory(dir)) {
            throw new UserInputException("-o " + dir + ": exists and is not a folder");
        }
        try (Stream<Path> s = Files.list(dir)) {
            for (Path p : (Iterable<Path>) s::iterator) {
                String f = p.getFileName().toString();
                if (!(f.equals(CELLS) || f.equals(CSV) || f.equals(JSON_FILE) || f.equals(MANIFEST) || f.equals("plots")
                        || f.startsWith("."))) {
                    throw new UserInputException("-o " + dir + ": the folder holds other files (" + f
                            + "); give a new folder or an earlier study's");
                }
            }
        }
    }

    static Path cellFile(Path dir, int i) {
        return dir.resolve(CELLS).resolve(String.format("cell-%06d.json", i));
    }

    /** @return the record of a finished cell of this study (same file content and cell), or null */
    static JsonNode done(Path dir, StudyFile study, int i, String sha) {
        Path f = cellFile(dir, i);
        if (!Files.isRegularFile(f)) {
            return null;
        }
        try {
            JsonNode n = JSON.readTree(f.toFile());
            StudyFile.Cell c = study.cell(i);
            boolean same = n.path("study_sha256").asText().equals(sha) && n.path("deformation").asDouble() == c.deformation()
                    && n.path("sigma_uas").asDouble() == c.sigmaUas() && n.path("beam_fwhm_uas").asDouble() == c.beamUas();
            return same ? n : null;
        } catch (IOException e) {
            return null;
        }
    }

    /** @return the headline numbers of a finished study folder's first cell (for sweeps) */
    public static Map<String, Double> outputs(Path dir) throws IOException {
        JsonNode j = JSON.readTree(dir.resolve(JSON_FILE).toFile());
        JsonNode c = j.path("cells").path(0);
        Map<String, Double> out = new LinkedHashMap<>();
        for (String k : new String[] {"expected_delta_chi2", "expected_sigma", "delta_chi2_p16", "delta_chi2_p50",
            "delta_chi2_p84", "median_sigma"}) {
            out.put(k, c.path(k).isNumber() ? c.path(k).asDouble() : Double.NaN);
        }
        return out;
    }

    static void writeText(Path target, String text) throws IOException {
        AtomicFiles.write(target, tmp -> Files.writeString(tmp, text, StandardCharsets.UTF_8));
    }

    static ArrayNode array(double[] v) {
        ArrayNode a = JSON.createArrayNode();
        for (double d : v) {
            a.add(d);
        }
        return a;
    }

    static PrintWriter writer(Path tmp) throws IOException {
        return new PrintWriter(Files.newBufferedWriter(tmp, StandardCharsets.UTF_8));
    }
}
