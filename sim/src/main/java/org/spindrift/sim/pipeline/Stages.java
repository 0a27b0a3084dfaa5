package org.spindrift.sim.pipeline;

import java.util.ArrayList;
import java.util.List;

/** The stages of a standard run, in order. */
public final class Stages {
    private Stages() {
    }

    /**
     * @return snapshots, analysis, light (ray table, images.fits, centroid.csv, lightcurve.csv,
     *     mock_astrometry.csv), interferometry (only with an interferometer), plots; a new list
     *     that callers may change
     */
    public static List<RunStage> standard() {
        List<RunStage> stages = new ArrayList<>();
        stages.add(new SnapshotStage());
        stages.add(new AnalysisStage());
        stages.add(new LightRunStage());
        stages.add(new InterferometryRunStage());
        stages.add(new PlotStage());
        return stages;
    }
}
