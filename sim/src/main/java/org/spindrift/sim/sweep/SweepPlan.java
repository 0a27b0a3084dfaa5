package org.spindrift.sim.sweep;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.spindrift.shared.UserInputException;

/** A sweep folder's plan ({@code sweep.json}) as read back by run, slurm, status and collect. */
public final class SweepPlan {
    private final SweepLayout layout;
    private final JsonNode json;
    private final TaskKind kind;
    private final List<String> axisKeys = new ArrayList<>();
    private final List<Boolean> axisLog = new ArrayList<>();
    private final List<Boolean> axisSampled = new ArrayList<>();

    private SweepPlan(SweepLayout layout, JsonNode json, TaskKind kind) {
        this.layout = layout;
        this.json = json;
        this.kind = kind;
        for (JsonNode a : json.path("axes")) {
            axisKeys.add(a.path("key").asText());
            String sp = a.path("spacing").asText();
            axisLog.add(sp.endsWith("log"));
            axisSampled.add(sp.startsWith("sampled"));
        }
    }

    /** Opens a sweep folder. */
    public static SweepPlan open(Path dir) {
        SweepLayout layout = new SweepLayout(dir);
        Path f = layout.plan();
        if (!Files.isRegularFile(f)) {
            throw new UserInputException("sweep folder " + dir + ": no " + SweepLayout.PLAN
                    + " (not a sweep folder, or its plan did not complete; make one with 'spindrift sweep plan')");
        }
        JsonNode j;
        try {
            j = new ObjectMapper().readTree(f.toFile());
        } catch (IOException e) {
            throw new UserInputException("sweep folder " + dir + ": " + SweepLayout.PLAN + " is not valid JSON ("
                    + e.getMessage().lines().findFirst().orElse("") + ")");
        }
        if (j == null || !SweepLayout.FORMAT.equals(j.path("format").asText())
                || j.path("format_version").asInt(-1) != SweepLayout.FORMAT_VERSION) {
            throw new UserInputException("sweep folder " + dir + ": " + SweepLayout.PLAN + " is not a " + SweepLayout.FORMAT
                    + " plan of format version " + SweepLayout.FORMAT_VERSION);
        }
        String k = j.path("kind").asText();
        TaskKind kind = TaskKinds.get(k);
        if (kind == null) {
            throw new UserInputException("sweep folder " + dir + ": task kind '" + k + "' is not known to this version");
        }
        return new SweepPlan(layout, j, kind);
    }

    public SweepLayout layout() {
        return layout;
    }

    public JsonNode json() {
        return json;
    }

    public TaskKind kind() {
        return kind;
    }

    public String name() {
        return json.path("name").asText();
    }

    public int tasks() {
        return json.path("tasks").size();
    }

    /** @return the axes' key paths, in order */
    public List<String> axisKeys() {
        return axisKeys;
    }

    /** @return whether axis j lies on a logarithmic scale */
    public boolean axisLog(int j) {
        return axisLog.get(j);
    }

    /** @return whether axis j is sampled by the Latin hypercube */
    public boolean axisSampled(int j) {
        return axisSampled.get(j);
    }

    /** @return the axis values of a task, in axis order */
    public JsonNode values(int task) {
        return json.path("tasks").get(task).path("values");
    }

    /** @return the SHA-256 of a task file as planned */
    public String taskSha256(int task) {
        return json.path("tasks").get(task).path("sha256").asText();
    }

    /** @return the largest heap of a task, bytes */
    public long heapBytes() {
        return json.path("estimate").path("heap_bytes_max").asLong();
    }

    /** @return the largest run folder of a task, bytes */
    public long diskBytes() {
        return json.path("estimate").path("disk_bytes_max").asLong();
    }
}
