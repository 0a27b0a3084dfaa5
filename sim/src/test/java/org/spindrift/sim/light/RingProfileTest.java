package org.spindrift.sim.light;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.function.DoubleUnaryOperator;
import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.sim.fit.CompactModelVsRunTest;
import org.spindrift.sim.fit.FitModel;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.scenario.ScenarioChecks;
import org.spindrift.sim.scenario.ScenarioLoader;
import org.spindrift.sim.scenario.SourceSetup;
import org.spindrift.sim.spacetime.CircularOrbits;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The binned sum of a sheared spot ({@link RingProfile}) against the plain sum over every table
 * sample of the same emitter-frame density (written out here from its definition: the sheared
 * Gaussian in radial, along-orbit and vertical offsets, the envelope at each sample's own emission
 * time, g^(2 + alpha) from the centre's 4-velocity: I_nu / nu^3 invariant, Rybicki &amp; Lightman
 * 1979, Radiative Processes in Astrophysics, sect. 1.4), and the independence of the result from the
 * orbits evaluated before (the base bins grow by whole radial bins). The full-run comparison is
 * {@code CompactModelVsRunTest}.
 */
class RingProfileTest {
    /**
     * Binning error allowed: bins half a blob width wide summed at their weighted mean positions are
     * a Riemann sum of the Gaussian (our choice of bound, common practice, no source; measured here at 48 px: 0.23 % of the
     * track radius and 0.46 % in flux).
     */
    private static final double CENTROID_REL = 0.005;
    private static final double FLUX_REL = 0.01;

    @TempDir static Path tmp;
    static LoadedScenario ls;
    static Spacetime st;
    static CentreTrack track;
    static CompactSourceModel.Index index;
    static CompactSourceModel.Spot spot;
    static double tEnd;

    @BeforeAll
    static void setUp() throws Exception {
        Path file = tmp.resolve("c.yaml");
        Files.writeString(file, CompactModelVsRunTest.scenario("kerr", 0.5, "", 60));
        ls = ScenarioLoader.load(file);
        st = ScenarioChecks.spacetime(ls);
        double capture = Landmarks.of(st).captureRadius();
        tEnd = 150.0;
        track = FitModel.centreTrack(ls.scenario(), SourceSetup.centres(ls.scenario(), st, capture), st, capture,
                tEnd, 0.36, 1.0e-10);
        Camera cam = new Camera(60.0, 0.0, 20.0, 48, LightSettings.CAMERA_DISTANCE_M);
        double h = LightStage.smoothingLength(cam);
        TraceSettings ts = TraceSettings.of(12.0, capture, LightStage.SAMPLES_PER_H * h, true).withTolerance(1e-8, 1e-10);
        index = new CompactSourceModel.Index(RayTable.trace(st, cam, ts, 2), 0.5);
        DoubleUnaryOperator flare = t -> FastMath.exp(-0.5 * (t - 70.0) * (t - 70.0) / (30.0 * 30.0));
        spot = new CompactSourceModel.Spot(0.3, 1.0, flare,
                CompactSourceModel.shearRate(8.0, 0.5, CircularOrbits.omegaDerivative(st, 8.0, true)));
    }

    private static double[] times() {
        double[] t = new double[40];
        for (int i = 0; i < t.length; i++) {
            t[i] = 30.0 + 4.0 * i;
        }
        return t;
    }

    @Test
    void binnedSumMatchesThePlainSampleSum() {
        double[] times = times();
        CompactSourceModel.Frames fr = new CompactSourceModel().frames(index, track, new CompactSourceModel.Spot[] {spot},
                0.0, times, 0.0);
        double h = index.smoothingLength();
        double blob2 = spot.sigmaM() * spot.sigmaM(), kern2 = CompactSourceModel.KERNEL_VARIANCE * h * h;
        double aa = blob2 + kern2, box = CompactSourceModel.CUT_SIGMAS * FastMath.sqrt(aa);
        double[] c = new double[7];
        double radius = 0, worstC = 0, worstF = 0;
        int frames = 0;
        for (int f = 0; f < times.length; f++) {
            double to = times[f];
            double sf = 0, sx = 0, sy = 0;
            for (int i = 0; i < index.m; i++) {
                double te = to - index.d[i];
                if (te < 0 || te > tEnd || !track.at(0, te, c)) {
                    continue;
                }
                double rhoC = FastMath.hypot(c[0], c[1]), rho = FastMath.hypot(index.x[i], index.y[i]);
                double u = rho - rhoC, dz = index.z[i] - c[2];
                if (FastMath.abs(u) > box || FastMath.abs(dz) > box) {
                    continue;
                }
                double dphi = FastMath.atan2(index.y[i], index.x[i]) - FastMath.atan2(c[1], c[0]);
                dphi -= 2 * FastMath.PI * FastMath.rint(dphi / (2 * FastMath.PI));
                double w = rhoC * dphi, sh = spot.shearRate() * te;
                // Gaussian of covariance [[aa, b sh], [b sh, b (1 + sh^2) + k]] in (u, w), aa vertically
                double bb = blob2 * sh, cc = blob2 * (1 + sh * sh) + kern2, det = aa * cc - bb * bb;
                double q = (cc * u * u - 2 * bb * u * w + aa * w * w) / det + dz * dz / aa;
                if (q >= CompactSourceModel.CUT_SIGMAS * CompactSourceModel.CUT_SIGMAS) {
                    continue;
                }
                double gInv = Redshift.inverse(index.pr[i], index.pth[i], index.pph[i], c[3], c[4], c[5], c[6]);
                double dens = spot.weight() * spot.flare().applyAsDouble(te) / c[3]
                        * FastMath.pow(2 * FastMath.PI, -1.5) / FastMath.sqrt(det * aa) * FastMath.exp(-0.5 * q);
                double val = index.dl[i] * dens * FastMath.pow(gInv, -3.0);
                sf += val;
                sx += val * index.east[i];
                sy += val * index.north[i];
            }
            if (!(sf > 0) || to < fr.coveredFrom() || to > fr.coveredTo()) {
                continue;
            }
            // position angle 0: sky offsets alpha = -east, beta = north as the model rotates them
            double ex = index.camera.east(-sx / sf, sy / sf), ny = index.camera.north(-sx / sf, sy / sf);
            radius = FastMath.max(radius, FastMath.hypot(ex, ny));
            worstC = FastMath.max(worstC, FastMath.hypot(fr.x()[f] - ex, fr.y()[f] - ny));
            worstF = FastMath.max(worstF, FastMath.abs(fr.flux()[f] / (sf * index.area) - 1));
            frames++;
        }
        String msg = String.format(Locale.ROOT, "%d frames, track radius %.3f M: worst centroid difference %.4f M,"
                + " worst flux difference %.3f %%", frames, radius, worstC, 100 * worstF);
        System.out.println(msg);
        assertTrue(frames >= 15, msg);
        assertTrue(worstC <= CENTROID_REL * radius, msg);
        assertTrue(worstF <= FLUX_REL, msg);
    }

    @Test
    void resultDoesNotDependOnTheOrbitsEvaluatedBefore() throws Exception {
        double[] times = times();
        CompactSourceModel.Spot[] spots = {spot};
        CompactSourceModel fresh = new CompactSourceModel();
        CompactSourceModel.Frames a = fresh.frames(index, track, spots, 25.0, times, 0.5);
        // another model first sums orbits further out and further in (its base bins grow around them)
        CompactSourceModel used = new CompactSourceModel();
        for (double r : new double[] {10.5, 6.5}) {
            Path file = tmp.resolve("r" + r + ".yaml");
            Files.writeString(file, CompactModelVsRunTest.scenario("kerr", 0.5, "", 60)
                    .replace("radius_M: 8.0", "radius_M: " + r));
            LoadedScenario other = ScenarioLoader.load(file);
            double capture = Landmarks.of(st).captureRadius();
            CentreTrack t = FitModel.centreTrack(other.scenario(), SourceSetup.centres(other.scenario(), st, capture), st,
                    capture, tEnd, 0.36, 1.0e-10);
            used.frames(index, t, spots, 25.0, times, 0.5);
        }
        CompactSourceModel.Frames b = used.frames(index, track, spots, 25.0, times, 0.5);
        // bitwise: a walker's result must not depend on which thread's model evaluated it
        assertArrayEquals(a.flux(), b.flux(), 0.0);
        assertArrayEquals(a.x(), b.x(), 0.0);
        assertArrayEquals(a.y(), b.y(), 0.0);
    }
}
