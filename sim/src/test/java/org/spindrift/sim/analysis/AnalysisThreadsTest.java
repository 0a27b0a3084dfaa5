package org.spindrift.sim.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.spindrift.shared.scenario.VelocityModel;
import org.spindrift.sim.history.ParticleHistory;
import org.spindrift.sim.run.Evolution;
import org.spindrift.sim.run.ScenarioRun;
import org.spindrift.sim.run.TestScenarios;

/**
 * The analysis cut into chunks on several threads gives the same periods, centres and shapes bit
 * for bit as on one thread (the project's determinism rule; common practice, no source), on two
 * evolved sources with enough particles and snapshots to fill every chunk.
 */
class AnalysisThreadsTest {
    @Test void analysisIsTheSameOnOneAndOnSeveralThreads() {
        ScenarioRun.Prepared p = ScenarioRun.prepare(TestScenarios.scenario(TestScenarios.kerr(0.7),
                List.of(TestScenarios.ring(300, 6.0, 9.0, 40.0),
                        TestScenarios.hotSpot(2500, 8.0, 0.4, new VelocityModel(VelocityModel.Kind.THERMAL, 0.01))),
                150, 3, 5, 0));
        Evolution.Evolved e = Evolution.inMemory(p, 2);
        int[] first = p.placed().firstIndex();
        // separate copies of the history: each computes its centre-of-mass tracks afresh
        AnalysisResult one = AnalysisResult.of(copy(e.history()), e.turningPoints(), first, 1);
        AnalysisResult three = AnalysisResult.of(copy(e.history()), e.turningPoints(), first, 3);
        List<String> a = flatten(one);
        List<String> b = flatten(three);
        assertEquals(a.size(), b.size());
        for (int i = 0; i < a.size(); i++) {
            assertEquals(a.get(i), b.get(i), "value " + i);
        }
        // the comparison covers measured values, not only NaN
        assertTrue(Double.isFinite(one.periods().periodPhi(0)) && Double.isFinite(one.shapes().get(40).major()));
        assertTrue(one.shapes().get(one.shapes().size() - 1).lag().r().length > 0, "a lag profile at the end");
    }

    /** Every number of a result, as exact bit patterns. */
    private static List<String> flatten(AnalysisResult r) {
        List<String> out = new ArrayList<>();
        ParticlePeriods p = r.periods();
        for (double[] v : new double[][] {p.periodPhi(), p.periodR(), p.periodTheta(), p.advance()}) {
            for (double x : v) {
                out.add(Long.toHexString(Double.doubleToRawLongBits(x)));
            }
        }
        for (int i = 0; i < p.periodPhi().length; i++) {
            out.add(Long.toHexString(Double.doubleToRawLongBits(p.meanR(i))));
        }
        for (ShearShape s : r.shapes()) {
            out.add(s.source() + " " + s.snapshot() + " " + s.alive());
            for (double x : new double[] {s.time(), s.centreX(), s.centreY(), s.centreZ(), s.centreR(), s.major(),
                s.minor(), s.aspectRatio(), s.orientationDeg(), s.azimuthalExtentDeg(), s.lag().stationaryRadius(),
                s.lag().innerArm(), s.lag().outerArm()}) {
                out.add(Long.toHexString(Double.doubleToRawLongBits(x)));
            }
            for (int b = 0; b < s.lag().r().length; b++) {
                out.add(s.lag().r()[b] + " " + s.lag().lag()[b] + " " + s.lag().count()[b]);
            }
        }
        return out;
    }

    private static ParticleHistory copy(ParticleHistory h) {
        int s = h.snapshots();
        double[][] r = new double[s][];
        double[][] th = new double[s][];
        double[][] ph = new double[s][];
        double[][] ut = new double[s][];
        double[][] ur = new double[s][];
        double[][] uth = new double[s][];
        double[][] uph = new double[s][];
        float[][] w = new float[s][];
        byte[][] st = new byte[s][];
        for (int k = 0; k < s; k++) {
            r[k] = h.r(k);
            th[k] = h.theta(k);
            ph[k] = h.phi(k);
            ut[k] = h.ut(k);
            ur[k] = h.ur(k);
            uth[k] = h.uTheta(k);
            uph[k] = h.uPhi(k);
            w[k] = h.weight(k);
            st[k] = h.state(k);
        }
        return new ParticleHistory(h.times(), r, th, ph, ut, ur, uth, uph, w, st, h.sourceIndex(), h.spin());
    }
}
