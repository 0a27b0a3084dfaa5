package org.spindrift.sim.run;

import org.spindrift.shared.scenario.RunSettings;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.sim.scenario.LoadedScenario;

/** The snapshot times of a run: 0 to the duration at the snapshot cadence (coordinate time, M). */
public final class SnapshotGrid {
    /** Largest number of snapshots of a run. */
    public static final int MAX_SNAPSHOTS = 20_000;

    private SnapshotGrid() {
    }

    /**
     * The snapshot times of a scenario; the grid ends at the last whole cadence within the duration.
     *
     * @param firstPeriodM the first source centre's orbital period (what "1 orbit" means), M
     */
    public static double[] times(LoadedScenario ls, double secondsPerM, double firstPeriodM) {
        Scenario sc = ls.scenario();
        RunSettings run = sc.run();
        double duration = run.duration().toM(secondsPerM, firstPeriodM);
        if (!(duration > 0) || !Double.isFinite(duration)) {
            throw ls.error("run.duration", "gives no positive duration in M (" + duration + ")");
        }
        double cadence = run.snapshotCadence() == null ? duration / RunSettings.DEFAULT_SNAPSHOTS
                : run.snapshotCadence().toM(secondsPerM);
        double steps = duration / cadence;
        if (steps < 2) {
            throw ls.error("run.snapshot_cadence", "cadence " + run.snapshotCadence() + " = " + fmt(cadence)
                    + " M gives fewer than 3 snapshots over the duration of " + fmt(duration) + " M");
        }
        if (steps > MAX_SNAPSHOTS) {
            throw ls.error("run.snapshot_cadence", "cadence " + fmt(cadence) + " M gives " + (long) steps
                    + " snapshots over " + fmt(duration) + " M; at most " + MAX_SNAPSHOTS + " are allowed");
        }
        int s = (int) Math.floor(steps + 1e-9) + 1;
        double[] times = new double[s];
        for (int k = 0; k < s; k++) {
            times[k] = k * cadence;
        }
        return times;
    }

    /** Fraction of the requested duration lost to whole cadences above which the run warns. */
    static final double DURATION_CUT_WARNING = 0.01;

    /**
     * The grid ends at the last whole cadence (the manifest records both durations); a cut of more
     * than {@link #DURATION_CUT_WARNING} of the run is worth a warning, since durations in orbits
     * are rarely whole cadences.
     *
     * @param duration the duration the scenario asks for, M
     * @return the warning ({@code FILE:LINE: run.duration: ...}), or null
     */
    static String cutWarning(LoadedScenario ls, double duration, double[] times) {
        int s = times.length;
        if (duration - times[s - 1] > DURATION_CUT_WARNING * duration) {
            return ls.error("run.duration", "the duration of " + fmt(duration) + " M is not a whole number of"
                    + " snapshot cadences (" + fmt(times[1] - times[0]) + " M): the run ends at the last whole one, "
                    + fmt(times[s - 1]) + " M").getMessage();
        }
        return null;
    }

    static String fmt(double v) {
        return String.format(java.util.Locale.ROOT, "%.6g", v);
    }
}
