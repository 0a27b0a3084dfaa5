package org.spindrift.sim.cli;

import java.util.Locale;
import java.util.concurrent.Callable;
import org.hipparchus.util.FastMath;
import org.spindrift.shared.UserInputException;
import org.spindrift.sim.motion.BatchIntegrator;
import org.spindrift.sim.motion.GeodesicEquations;
import org.spindrift.sim.motion.HipparchusOde;
import org.spindrift.sim.motion.MotionDiagnostics;
import org.spindrift.sim.motion.ParticleBall;
import org.spindrift.sim.motion.ParticleBatch;
import org.spindrift.sim.spacetime.CircularOrbits;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.MassFunctions;
import org.spindrift.sim.spacetime.Spacetime;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code spindrift bench motion}: a Gaussian ball of test masses ({@link ParticleBall}) around a
 * prograde circular orbit in Kerr, integrated with {@link BatchIntegrator} on 1 and 2 threads, and a subset of
 * the same particles with Hipparchus' DormandPrince853Integrator at the same tolerance, each
 * particle separately with the same snapshot times ({@link HipparchusOde#sample}).
 */
@Command(name = "motion", mixinStandardHelpOptions = true,
        description = {"Time the batched motion integrator: a ball (sigma 0.5 M by default) around the prograde circular"
                + " orbit r = 8 M in Kerr a = 0.9 for 10 orbits, snapshots every tenth of an orbit; 1 and 2"
                + " threads; and the same per-particle work with Hipparchus' DormandPrince853Integrator."})
public final class BenchMotionCommand implements Callable<Integer> {
    @Option(names = "--particles", paramLabel = "N", defaultValue = "10000",
            description = "Particles in the ball, 10..10000000 (default: ${DEFAULT-VALUE}).")
    int particles;

    @Option(names = "--reference-particles", paramLabel = "N", defaultValue = "500",
            description = "Particles integrated with Hipparchus, 1..particles (default: ${DEFAULT-VALUE}).")
    int referenceParticles;

    @Option(names = "--orbits", paramLabel = "N", defaultValue = "10",
            description = "Orbits of the circular orbit at the centre, 0.1..1000 (default: ${DEFAULT-VALUE}).")
    double orbits;

    @Option(names = "--tolerance", paramLabel = "TOL", defaultValue = "1e-11",
            description = "Absolute and relative tolerance, 1e-15..1e-3 (default: ${DEFAULT-VALUE}).")
    double tolerance;

    @Option(names = "--repeats", paramLabel = "N", defaultValue = "2",
            description = "Timed repeats of each of the 1- and 2-thread runs; the fastest counts, 1..20 (default: ${DEFAULT-VALUE}).")
    int repeats;

    @Option(names = "--sigma", paramLabel = "M", defaultValue = "0.5",
            description = "Ball radius (Gaussian sigma) in M, 0..2 (default: ${DEFAULT-VALUE}).")
    double sigma;

    private static final double A = 0.9;
    private static final double R0 = 8.0;

    @Override public Integer call() {
        if (particles < 10 || particles > 10_000_000) {
            throw new UserInputException("--particles must be in 10..10000000, got " + particles);
        }
        if (referenceParticles < 1 || referenceParticles > particles) {
            throw new UserInputException("--reference-particles must be in 1..--particles, got " + referenceParticles);
        }
        if (!(orbits >= 0.1 && orbits <= 1000)) {
            throw new UserInputException("--orbits must be in 0.1..1000, got " + orbits);
        }
        if (!(tolerance >= 1e-15 && tolerance <= 1e-3)) {
            throw new UserInputException("--tolerance must be in 1e-15..1e-3, got " + tolerance);
        }
        if (repeats < 1 || repeats > 20) {
            throw new UserInputException("--repeats must be in 1..20, got " + repeats);
        }
        if (!(sigma >= 0 && sigma <= 2)) {
            throw new UserInputException("--sigma must be in 0..2, got " + sigma);
        }
        Spacetime st = new MassFunctionSpacetime("kerr", A, MassFunctions.constant());
        double omega = CircularOrbits.omega(st, R0, true);
        double period = 2 * FastMath.PI / omega;
        double tEnd = orbits * period;
        int nSnap = (int) FastMath.max(1, FastMath.round(10 * orbits));
        double[] times = new double[nSnap];
        for (int k = 0; k < nSnap; k++) {
            times[k] = tEnd * (k + 1) / nSnap;
        }
        ParticleBatch initial = ParticleBall.around(st, R0, sigma, particles, 20261201L);
        BatchIntegrator.Config cfg = BatchIntegrator.Config.of(Landmarks.captureRadius(st))
                .withTolerance(tolerance, tolerance);
        System.out.printf(Locale.ROOT, "bench motion: %d particles, sigma %.2f M, circular orbit r = %.1f M, a = %.2f,"
                + " %.3g orbits (T = %.2f M), %d snapshots, tolerance %.1e, %d processors%n", particles, sigma, R0, A,
                orbits, period, nSnap, tolerance, Runtime.getRuntime().availableProcessors());

        // warm-up of both code paths (JIT), not timed
        warmUp(st, cfg, initial, times, period);

        // accuracy pass (untimed, also the integrator's warm-up): diagnostics at every snapshot
        ParticleBatch b1 = initial.copy();
        MotionDiagnostics d1 = new MotionDiagnostics(st, b1);
        BatchIntegrator.Result r1 = new BatchIntegrator(st, cfg.withThreads(1)).integrate(b1, times, d1);

        // timed passes without a sink; the fastest of the repeats counts (common benchmarking practice)
        double s1 = Double.POSITIVE_INFINITY;
        double s2 = Double.POSITIVE_INFINITY;
        double cpu1 = 0;
        double cpu2 = 0;
        double thread1 = 0;
        boolean identical = true;
        for (int rep = 0; rep < repeats; rep++) {
            ParticleBatch a = initial.copy();
            long c0 = cpuNanos();
            long tc0 = threadCpuNanos();
            long t0 = System.nanoTime();
            // with one thread the integrator runs on this thread, so its CPU time is this thread's
            new BatchIntegrator(st, cfg.withThreads(1)).integrate(a, times, null);
            double w = (System.nanoTime() - t0) * 1e-9;
            if (w < s1) {
                s1 = w;
                cpu1 = (cpuNanos() - c0) * 1e-9;
                thread1 = (threadCpuNanos() - tc0) * 1e-9;
            }
            ParticleBatch b2 = initial.copy();
            c0 = cpuNanos();
            t0 = System.nanoTime();
            new BatchIntegrator(st, cfg.withThreads(2)).integrate(b2, times, null);
            w = (System.nanoTime() - t0) * 1e-9;
            if (w < s2) {
                s2 = w;
                cpu2 = (cpuNanos() - c0) * 1e-9;
            }
            identical &= b1.bitwiseEquals(b2) && a.bitwiseEquals(b1);
        }
        double oursSubset = 0;
        for (int i = 0; i < referenceParticles; i++) {
            oursSubset = FastMath.max(oursSubset, d1.massShell(i));
        }

        // equal accuracy: tighten Hipparchus' tolerance until its max |H + 1/2| on the first particles is
        // no worse than ours on the same particles
        int calib = FastMath.min(100, referenceParticles);
        double oursCalib = 0;
        for (int i = 0; i < calib; i++) {
            oursCalib = FastMath.max(oursCalib, d1.massShell(i));
        }
        double hipTol = tolerance;
        for (int k = 0; k < 8; k++) {
            if (hipparchus(st, initial, calib, times, hipTol)[2] <= oursCalib) {
                break;
            }
            hipTol *= 0.5;
        }
        double[] hip = null;
        double cpuHip = 0;
        for (int rep = 0; rep < repeats; rep++) {
            long hc0 = cpuNanos();
            double[] h = hipparchus(st, initial, referenceParticles, times, hipTol);
            if (hip == null || h[0] < hip[0]) {
                hip = h;
                cpuHip = (cpuNanos() - hc0) * 1e-9;
            }
        }
        double sh = hip[0];
        double perParticleOurs = s1 / particles;
        double perParticleHip = sh / referenceParticles;

        int[] ends = r1.endStates();
        System.out.printf(Locale.ROOT, "end states: alive %d, captured %d, escaped %d, failed %d%n", ends[0], ends[1],
                ends[2], ends[3]);
        System.out.printf(Locale.ROOT, "accuracy: max |H + 1/2| = %.3e (median %.3e), max |Q - Q0| = %.3e; target"
                + " max |H + 1/2| < 1e-10: %s%n", d1.massShellMax(), d1.massShellMedian(), d1.carterDriftMax(),
                d1.massShellMax() < 1e-10 ? "met" : "NOT met");
        System.out.printf(Locale.ROOT, "work: %d accepted steps, %d rejected, %d evaluations (%.1f steps per particle"
                + " per orbit)%n", r1.acceptedSteps(), r1.rejectedSteps(), r1.evaluations(),
                r1.acceptedSteps() / (double) particles / orbits);
        System.out.printf(Locale.ROOT, "1 thread : %.3f s, %.3e particle-steps/s, %.3e particle-orbits/s"
                + " (process CPU %.2f s = %.2f cores busy)%n", s1, r1.acceptedSteps() / s1, particles * orbits / s1,
                cpu1, cpu1 / s1);
        System.out.printf(Locale.ROOT, "2 threads: %.3f s, %.3e particle-steps/s, %.3e particle-orbits/s"
                + " (process CPU %.2f s = %.2f cores busy)%n", s2, r1.acceptedSteps() / s2, particles * orbits / s2,
                cpu2, cpu2 / s2);
        System.out.printf(Locale.ROOT, "speed-up 1 -> 2 threads %.2fx (target >= 1.7x; needs 2 idle cores);"
                + " results bitwise identical: %s%n", s1 / s2, identical);
        System.out.printf(Locale.ROOT, "CPU time for the same work, 1 thread / 2 threads = %.2f (parallel overhead;"
                + " 1.00 = none): on two otherwise idle cores the speed-up would be about %.2fx%n", cpu1 / cpu2,
                2 * cpu1 / cpu2);
        System.out.printf(Locale.ROOT, "state: %d bytes per particle in the batch + %d bytes snapshot buffer = %d"
                + " (target < 200)%n", ParticleBatch.BYTES_PER_PARTICLE, 5 * Double.BYTES + 1,
                ParticleBatch.BYTES_PER_PARTICLE + 5 * Double.BYTES + 1);
        System.out.printf(Locale.ROOT, "Hipparchus DormandPrince853Integrator, %d particles one by one, same"
                + " snapshots, tolerance %.2e (tightened from %.1e until its max |H + 1/2| on %d particles is no worse"
                + " than ours): %.3f s, %.0f evaluations per particle (ours %.0f), max |H + 1/2| = %.3e (ours on the"
                + " same particles %.3e)%n", referenceParticles, hipTol, tolerance, calib, sh,
                hip[1] / referenceParticles, r1.evaluations() / (double) particles, hip[2], oursSubset);
        System.out.printf(Locale.ROOT, "per particle, wall clock: ours %.3e s, Hipparchus %.3e s: ratio %.2fx"
                + " (target >= 3x)%n", perParticleOurs, perParticleHip, perParticleHip / perParticleOurs);
        System.out.printf(Locale.ROOT, "per particle, process CPU time (incl. garbage collection; less sensitive to"
                + " other load): ours %.3e s, Hipparchus %.3e s: ratio %.2fx%n", cpu1 / particles,
                cpuHip / referenceParticles, (cpuHip / referenceParticles) / (cpu1 / particles));
        System.out.printf(Locale.ROOT, "per particle, integrating thread's CPU time only: ours %.3e s, Hipparchus"
                + " %.3e s: ratio %.2fx%n", thread1 / particles, hip[3] / referenceParticles,
                (hip[3] / referenceParticles) / (thread1 / particles));
        return 0;
    }

    private void warmUp(Spacetime st, BatchIntegrator.Config cfg, ParticleBatch initial, double[] times,
                        double period) {
        int n = FastMath.min(300, initial.size());
        ParticleBatch w = new ParticleBatch(n);
        for (int i = 0; i < n; i++) {
            w.set(i, 0.0, initial.r(i), initial.theta(i), initial.phi(i), initial.pT(i), initial.pR(i),
                    initial.pTheta(i), initial.pPhi(i));
        }
        double[] tw = {period, 2 * period};
        new BatchIntegrator(st, cfg.withThreads(1)).integrate(w, tw, null);
        hipparchus(st, w, n, tw, tolerance);
    }

    /** @return CPU time of the whole process so far (ns), or 0 when the platform does not say */
    private static long cpuNanos() {
        java.lang.management.OperatingSystemMXBean os = java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        if (os instanceof com.sun.management.OperatingSystemMXBean sun) {
            return sun.getProcessCpuTime();
        }
        return 0;
    }

    /** @return CPU time of the calling thread (ns) */
    private static long threadCpuNanos() {
        return java.lang.management.ManagementFactory.getThreadMXBean().getCurrentThreadCpuTime();
    }

    /** @return {seconds, evaluations, max |H + 1/2|, thread CPU seconds} for the first n particles with Hipparchus */
    private double[] hipparchus(Spacetime st, ParticleBatch b, int n, double[] times, double tol) {
        final GeodesicEquations eq = new GeodesicEquations(st);
        long evals = 0;
        double worst = 0;
        long t0 = System.nanoTime();
        long c0 = threadCpuNanos();
        for (int i = 0; i < n; i++) {
            final double pt = b.pT(i);
            final double pphi = b.pPhi(i);
            HipparchusOde ode = new HipparchusOde(new GeodesicEquations(st), pt, pphi);
            double[][] ys = ode.sample(0, new double[] {b.r(i), b.theta(i), b.phi(i), b.pR(i), b.pTheta(i)}, times,
                    tol, 1e4);
            for (double[] y : ys) {
                double h = eq.hamiltonian(y[0], y[1], pt, pphi, y[3], y[4]);
                worst = FastMath.max(worst, FastMath.abs(h + 0.5));
            }
            evals += ode.evaluations();
        }
        return new double[] {(System.nanoTime() - t0) * 1e-9, evals, worst, (threadCpuNanos() - c0) * 1e-9};
    }
}
