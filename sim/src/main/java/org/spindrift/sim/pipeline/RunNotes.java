package org.spindrift.sim.pipeline;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.spindrift.sim.plot.PlotGuard;

/**
 * Things a run reports without failing: warnings about the scenario (one line on stderr and a
 * {@code warnings} list in the manifest) and plots that could not be drawn (one line on stderr and
 * a {@code plot_failures} list in the manifest: plot name and reason). A plot failure never costs
 * the run its data files.
 */
public final class RunNotes {
    /** Manifest key of the warnings list. */
    public static final String WARNINGS = "warnings";
    /** Manifest key of the list of plots not drawn. */
    public static final String PLOT_FAILURES = "plot_failures";

    private RunNotes() {
    }

    /** @return the guard of a run: failures are recorded in its manifest and reported on stderr */
    public static PlotGuard guard(RunContext ctx) {
        return (name, plot) -> plot(ctx.manifest(), name, plot);
    }

    /**
     * Draws one plot; a failure is recorded in the manifest and reported in one line, never thrown.
     *
     * @return whether the plot was drawn
     */
    public static boolean plot(ObjectNode manifest, String name, PlotGuard.Plot plot) {
        try {
            plot.draw();
            return true;
        } catch (Exception | LinkageError | java.awt.AWTError e) {
            String reason = reason(e);
            synchronized (manifest) {
                ArrayNode a = manifest.has(PLOT_FAILURES) ? (ArrayNode) manifest.get(PLOT_FAILURES)
                        : manifest.putArray(PLOT_FAILURES);
                a.addObject().put("plot", name).put("reason", reason);
            }
            System.err.println("spindrift: warning: plot " + name + " not drawn (" + reason
                    + "); the run's data files are complete, see plot_failures in manifest.json");
            System.err.flush();
            return false;
        }
    }

    /** Records a warning in the run's manifest and prints it as one line on stderr. */
    public static void warn(RunContext ctx, String message) {
        warn(ctx.manifest(), message);
    }

    /** Records a warning in a manifest body and prints it as one line on stderr. */
    public static void warn(ObjectNode manifest, String message) {
        synchronized (manifest) {
            ArrayNode a = manifest.has(WARNINGS) ? (ArrayNode) manifest.get(WARNINGS) : manifest.putArray(WARNINGS);
            a.add(message);
        }
        System.err.println("spindrift: warning: " + message);
        System.err.flush();
    }

    /** @return the first line of an exception's message, with its type when that says more */
    static String reason(Throwable e) {
        String m = e.getMessage();
        String type = e.getClass().getSimpleName();
        if (m == null || m.isBlank()) {
            return type;
        }
        int nl = m.indexOf('\n');
        return type + ": " + (nl < 0 ? m : m.substring(0, nl)).strip();
    }
}
