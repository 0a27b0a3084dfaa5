package org.spindrift.sim.sweep;

import com.fasterxml.jackson.databind.JsonNode;
import io.jhdf.HdfFile;
import io.jhdf.WritableHdfFile;
import io.jhdf.api.WritableGroup;
import java.awt.Color;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.AtomicFiles;

/**
 * {@code sweep collect}: one row per task (task number, state, axis values, the kind's headline
 * outputs) into {@code sweep.csv} and {@code sweep.h5}, and plots of one output against each
 * numeric axis. Reads only the sweep folder. Numbers are written in Java's shortest exact form,
 * so the same results give the same bytes wherever the tasks ran.
 */
public final class SweepCollector {
    /**
     * The collected table.
     *
     * @param states state of each task
     * @param outputs output names, in order of first appearance over the tasks
     * @param values [task][output], NaN where absent
     */
    public record Table(TaskState[] states, List<String> outputs, double[][] values) {
        /** @return the column of one output */
        public double[] column(String name) {
            int c = outputs.indexOf(name);
            double[] out = new double[values.length];
            for (int i = 0; i < out.length; i++) {
                out[i] = c < 0 ? Double.NaN : values[i][c];
            }
            return out;
        }
    }

    /** Most lines in one plot (one per combination of the other axes); beyond, a cloud of points. */
    static final int MAX_LINES = 8;

    /** Okabe & Ito (2008) colour-blind-safe palette. */
    private static final Color[] COLOURS = {new Color(0, 114, 178), new Color(230, 159, 0), new Color(0, 158, 115),
        new Color(204, 121, 167), new Color(86, 180, 233), new Color(213, 94, 0), new Color(240, 228, 66),
        new Color(0, 0, 0)};

    private SweepCollector() {
    }

    /** Reads every task's state and outputs. */
    public static Table read(SweepPlan plan) throws IOException {
        int n = plan.tasks();
        TaskState[] states = new TaskState[n];
        List<Map<String, Double>> rows = new ArrayList<>();
        Set<String> names = new LinkedHashSet<>();
        for (int t = 0; t < n; t++) {
            states[t] = TaskState.of(plan.layout(), plan.kind(), t, false);
            Map<String, Double> row = Map.of();
            if (states[t] == TaskState.DONE) {
                try {
                    row = plan.kind().outputs(plan.layout().runFolder(t));
                } catch (IOException | RuntimeException e) {
                    throw new UserInputException("run folder " + plan.layout().runFolder(t) + ": its outputs cannot be read ("
                            + e.getMessage() + "); 'sweep status --verify' finds damaged tasks, 'sweep run' redoes them");
                }
            }
            names.addAll(row.keySet());
            rows.add(row);
        }
        List<String> outputs = new ArrayList<>(names);
        double[][] v = new double[n][outputs.size()];
        for (int t = 0; t < n; t++) {
            for (int c = 0; c < outputs.size(); c++) {
                Double x = rows.get(t).get(outputs.get(c));
                v[t][c] = x == null ? Double.NaN : x;
            }
        }
        return new Table(states, outputs, v);
    }

    /** Writes sweep.csv and sweep.h5 (each through a temporary name). */
    public static void write(SweepPlan plan, Table table) throws IOException {
        SweepLayout layout = plan.layout();
        List<String> axes = plan.axisKeys();
        StringBuilder csv = new StringBuilder("task,state");
        for (String a : axes) {
            csv.append(',').append(quote(a));
        }
        for (String o : table.outputs()) {
            csv.append(',').append(quote(o));
        }
        csv.append('\n');
        int n = plan.tasks();
        for (int t = 0; t < n; t++) {
            csv.append(t).append(',').append(table.states()[t].key());
            JsonNode vals = plan.values(t);
            for (int j = 0; j < axes.size(); j++) {
                JsonNode v = vals.get(j);
                csv.append(',').append(v.isNumber() ? num(v.asDouble()) : quote(v.asText()));
            }
            for (double x : table.values()[t]) {
                csv.append(',').append(num(x));
            }
            csv.append('\n');
        }
        byte[] bytes = csv.toString().getBytes(StandardCharsets.UTF_8);
        AtomicFiles.write(layout.dir().resolve(SweepLayout.CSV), tmp -> Files.write(tmp, bytes));
        AtomicFiles.write(layout.dir().resolve(SweepLayout.H5), tmp -> writeH5(tmp, plan, table));
    }

    private static void writeH5(Path tmp, SweepPlan plan, Table table) {
        int n = plan.tasks();
        try (WritableHdfFile f = HdfFile.write(tmp)) {
            f.putAttribute("format", SweepLayout.FORMAT + "-table");
            f.putAttribute("sweep", plan.name());
            f.putAttribute("kind", plan.kind().name());
            int[] task = new int[n];
            String[] state = new String[n];
            for (int t = 0; t < n; t++) {
                task[t] = t;
                state[t] = table.states()[t].key();
            }
            f.putDataset("task", task);
            f.putDataset("state", state);
            WritableGroup axes = f.putGroup("axes");
            List<String> keys = plan.axisKeys();
            for (int j = 0; j < keys.size(); j++) {
                boolean numeric = true;
                for (int t = 0; t < n; t++) {
                    numeric &= plan.values(t).get(j).isNumber();
                }
                if (numeric) {
                    double[] v = new double[n];
                    for (int t = 0; t < n; t++) {
                        v[t] = plan.values(t).get(j).asDouble();
                    }
                    axes.putDataset(keys.get(j), v);
                } else {
                    String[] v = new String[n];
                    for (int t = 0; t < n; t++) {
                        v[t] = plan.values(t).get(j).asText();
                    }
                    axes.putDataset(keys.get(j), v);
                }
            }
            WritableGroup outs = f.putGroup("outputs");
            for (String o : table.outputs()) {
                outs.putDataset(o, table.column(o));
            }
        }
    }

    /**
     * Plots one output against every numeric axis ({@code plots/OUTPUT_vs_AXIS.png}); failed or
     * unfinished tasks are left out.
     *
     * @return the files written
     */
    public static List<Path> plot(SweepPlan plan, Table table, String output) throws IOException {
        if (!table.outputs().contains(output)) {
            throw new UserInputException("--plot " + output + ": not an output of this sweep"
                    + (table.outputs().isEmpty() ? " (no task has finished yet)" : "; outputs: "
                    + String.join(", ", table.outputs())));
        }
        double[] y = table.column(output);
        List<Path> written = new ArrayList<>();
        Path dir = plan.layout().dir().resolve(SweepLayout.PLOTS);
        Files.createDirectories(dir);
        List<String> keys = plan.axisKeys();
        for (int j = 0; j < keys.size(); j++) {
            boolean numeric = true;
            boolean grid = !plan.axisSampled(j);
            // one line per combination of the other axes' values (grid sweeps), else one cloud of points
            Map<String, List<double[]>> groups = new LinkedHashMap<>();
            for (int t = 0; t < plan.tasks(); t++) {
                JsonNode v = plan.values(t).get(j);
                numeric &= v.isNumber();
                StringBuilder label = new StringBuilder();
                for (int o = 0; o < keys.size(); o++) {
                    if (o != j) {
                        grid &= !plan.axisSampled(o);
                        label.append(label.length() == 0 ? "" : ", ").append(keys.get(o)).append(" = ")
                                .append(plan.values(t).get(o).asText());
                    }
                }
                if (v.isNumber() && Double.isFinite(y[t]) && table.states()[t] == TaskState.DONE) {
                    groups.computeIfAbsent(label.toString(), k -> new ArrayList<>()).add(new double[] {v.asDouble(), y[t]});
                }
            }
            if (!numeric || groups.isEmpty()) {
                continue;
            }
            boolean lines = grid && groups.size() <= MAX_LINES;
            XYChart chart = new XYChartBuilder().width(800).height(560)
                    .title(plan.name() + ": " + output + " against " + keys.get(j))
                    .xAxisTitle(keys.get(j)).yAxisTitle(output).build();
            chart.getStyler().setLegendVisible(lines && groups.size() > 1);
            chart.getStyler().setLegendPosition(org.knowm.xchart.style.Styler.LegendPosition.OutsideS);
            boolean allPositive = groups.values().stream().flatMap(List::stream).allMatch(p -> p[0] > 0);
            chart.getStyler().setXAxisLogarithmic(plan.axisLog(j) && allPositive);
            int c = 0;
            if (lines) {
                for (Map.Entry<String, List<double[]>> g : groups.entrySet()) {
                    List<double[]> pts = new ArrayList<>(g.getValue());
                    pts.sort(java.util.Comparator.comparingDouble(p -> p[0]));
                    XYSeries s = chart.addSeries(g.getKey().isEmpty() ? "tasks" : g.getKey(),
                            pts.stream().map(p -> p[0]).toList(), pts.stream().map(p -> p[1]).toList());
                    s.setMarker(SeriesMarkers.CIRCLE);
                    s.setLineColor(COLOURS[c % COLOURS.length]);
                    s.setMarkerColor(COLOURS[c % COLOURS.length]);
                    c++;
                }
            } else {
                List<double[]> pts = groups.values().stream().flatMap(List::stream).toList();
                XYSeries s = chart.addSeries("tasks", pts.stream().map(p -> p[0]).toList(),
                        pts.stream().map(p -> p[1]).toList());
                s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
                s.setMarker(SeriesMarkers.CIRCLE);
                s.setMarkerColor(COLOURS[0]);
            }
            Path target = dir.resolve(safe(output) + "_vs_" + safe(keys.get(j)) + ".png");
            AtomicFiles.write(target, tmp -> {
                try (OutputStream os = Files.newOutputStream(tmp)) {
                    BitmapEncoder.saveBitmap(chart, os, BitmapEncoder.BitmapFormat.PNG);
                }
            });
            written.add(target);
        }
        return written;
    }

    /** @return counts of each state */
    public static Map<TaskState, Integer> counts(TaskState[] states) {
        Map<TaskState, Integer> c = new LinkedHashMap<>();
        for (TaskState s : TaskState.values()) {
            c.put(s, 0);
        }
        for (TaskState s : states) {
            c.merge(s, 1, Integer::sum);
        }
        return c;
    }

    private static String safe(String s) {
        return s.replaceAll("[^A-Za-z0-9_.-]", "_");
    }

    static String num(double v) {
        return Double.isFinite(v) ? Double.toString(v) : "";
    }

    private static String quote(String s) {
        return s.contains(",") || s.contains("\"") || s.contains("\n") ? "\"" + s.replace("\"", "\"\"") + "\"" : s;
    }
}
