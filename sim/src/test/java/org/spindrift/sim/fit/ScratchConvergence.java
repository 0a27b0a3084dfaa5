package org.spindrift.sim.fit;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.sim.light.CompactSourceModel;
import org.spindrift.sim.light.RayTable;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.scenario.ScenarioLoader;

public class ScratchConvergence {
    @TempDir Path tmp;

    CompactSourceModel.Frames model(int px, RayTable.Refinement rule, double[] times, double inc) throws Exception {
        Path file = tmp.resolve("c" + px + ".yaml");
        Files.writeString(file, CompactModelVsRunTest.scenario("kerr", 0.5, "", inc).replace("pixels: 96", "pixels: " + px));
        LoadedScenario ls = ScenarioLoader.load(file);
        long t0 = System.nanoTime();
        CompactSourceModel.Frames f = FitModel.frames(ls, new FitModel.Cache(2, rule), new CompactSourceModel(), times);
        System.out.printf(Locale.ROOT, "px %d rule %s: %.2f s%n", px, rule, (System.nanoTime() - t0) * 1e-9);
        return f;
    }

    @Test
    void converge() throws Exception {
        double inc = Double.parseDouble(System.getProperty("inc", "60"));
        double[] times = new double[24];
        for (int i = 0; i < times.length; i++) {
            times[i] = 40 + 4 * i;
        }
        int refPx = Integer.getInteger("refpx", 192);
        CompactSourceModel.Frames ref = model(refPx, null, times, inc);
        for (String spec : System.getProperty("cases", "96:run,96:null").split(",")) {
            String[] a = spec.split(":");
            RayTable.Refinement rule = a[1].equals("run") ? RayTable.Refinement.RUN : null;
            CompactSourceModel.Frames m = model(Integer.parseInt(a[0]), rule, times, inc);
            double wc = 0, wf = 0;
            StringBuilder sb = new StringBuilder();
            for (int i = 0; i < times.length; i++) {
                double dc = Math.hypot(m.x()[i] - ref.x()[i], m.y()[i] - ref.y()[i]);
                double df = Math.abs(m.flux()[i] / ref.flux()[i] - 1);
                wc = Math.max(wc, dc);
                wf = Math.max(wf, df);
                sb.append(String.format(Locale.ROOT, " t=%.0f:%.3f/%.1f%%", times[i], dc, 100 * df));
            }
            System.out.printf(Locale.ROOT, "%s vs ref %d: worst centroid %.3f M flux %.2f %%%n%s%n", spec, refPx, wc, 100 * wf, sb);
        }
    }
}
