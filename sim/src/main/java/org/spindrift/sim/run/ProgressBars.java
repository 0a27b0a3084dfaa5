package org.spindrift.sim.run;

import me.tongfei.progressbar.ConsoleProgressBarConsumer;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import me.tongfei.progressbar.ProgressBarStyle;

/** The one look of Spindrift's progress bars: ASCII on stderr, refreshed four times a second. */
public final class ProgressBars {
    private ProgressBars() {
    }

    /**
     * @param on   false (quiet, or output not a terminal) gives no bar
     * @param task what the bar counts, shown before it
     * @param max  number of steps
     * @return a bar to step and close, or null when {@code on} is false
     */
    public static ProgressBar open(boolean on, String task, long max) {
        return on ? new ProgressBarBuilder().setTaskName(task).setInitialMax(max).setStyle(ProgressBarStyle.ASCII)
                .setConsumer(new ConsoleProgressBarConsumer(System.err)).setUpdateIntervalMillis(250).build()
                : null;
    }
}
