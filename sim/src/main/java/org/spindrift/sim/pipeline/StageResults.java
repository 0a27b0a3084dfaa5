package org.spindrift.sim.pipeline;

import org.spindrift.sim.analysis.AnalysisResult;
import org.spindrift.sim.interferometry.InterferometryResult;
import org.spindrift.sim.light.LightResult;

/**
 * What the stages of a run hand to later ones, one typed slot per product: the analysis (periods
 * and shapes, for the plots), the light stage's frames (for the interferometry) and the
 * observation. A slot is empty (null) until its stage has run, and stays empty when the stage is
 * not part of the run or has nothing to do (no interferometer).
 */
public final class StageResults {
    private AnalysisResult analysis;
    private LightResult light;
    private InterferometryResult interferometry;

    /** @return the analysis, or null before the analysis stage */
    public AnalysisResult analysis() {
        return analysis;
    }

    /** @return the light stage's result, or null before it */
    public LightResult light() {
        return light;
    }

    /** @return the observation, or null when there is none */
    public InterferometryResult interferometry() {
        return interferometry;
    }

    void analysis(AnalysisResult a) {
        analysis = a;
    }

    void light(LightResult r) {
        light = r;
    }

    void interferometry(InterferometryResult r) {
        interferometry = r;
    }

    /** @return the analysis, which the caller cannot do without */
    AnalysisResult requireAnalysis(String who) {
        if (analysis == null) {
            throw new IllegalStateException(who + " needs the analysis stage first");
        }
        return analysis;
    }
}
