package org.spindrift.sim.cli;

import me.tongfei.progressbar.ProgressBar;
import org.spindrift.sim.run.ProgressBars;
import org.spindrift.sim.run.ProgressListener;

/** The command line's progress bar for a run's evolution (the project's one bar look, on stderr). */
final class ProgressBarListener implements ProgressListener {
    private ProgressBar bar;

    @Override public void begin(String task, long total, long done) {
        bar = ProgressBars.open(true, task, total);
        if (done > 0) {
            bar.stepTo(done);
        }
    }

    @Override public void advance(long done) {
        if (bar != null) {
            bar.stepTo(done);
        }
    }

    @Override public void end() {
        if (bar != null) {
            bar.close();
            bar = null;
        }
    }
}
