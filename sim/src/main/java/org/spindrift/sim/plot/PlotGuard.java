package org.spindrift.sim.plot;

import java.io.IOException;

/**
 * Draws plots and decides what a failure does: inside a run a plot that cannot be drawn is
 * recorded and the run's data are kept; outside a run ({@link #STRICT}) the failure goes through.
 */
@FunctionalInterface
public interface PlotGuard {
    /** One plot: draws it and writes its file(s). */
    @FunctionalInterface
    interface Plot {
        void draw() throws Exception;
    }

    /** @return whether the plot was drawn */
    boolean draw(String name, Plot plot) throws IOException;

    /** A guard that lets failures through (for callers outside a run). */
    PlotGuard STRICT = (name, plot) -> {
        try {
            plot.draw();
            return true;
        } catch (IOException | RuntimeException e) {
            throw e;
        } catch (Exception e) {
            throw new IOException(name + ": " + e.getMessage(), e);
        }
    };
}
