package org.spindrift.sim.motion;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Supplier;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Advances a {@link ParticleBatch} of test masses in coordinate time with the adaptive
 * Dormand-Prince 8(5,3) method ({@link Dop853}; Dormand &amp; Prince 1980; Hairer, Norsett &amp;
 * Wanner 1993). It sees the physics only through {@link BatchEquations} (by default the
 * coordinate-time {@link GeodesicEquations}, one instance per worker) and two terminal
 * {@link EventFunction}s built from the radii of {@link Config}.
 *
 * <p>Design:
 * <ul>
 *   <li>Each particle has its own step size and its own time; steps are chosen by the error
 *       control only, then limited so that no step reaches past the snapshot after the one it
 *       crosses (and the last step lands on the last snapshot time). Snapshot values come from
 *       the 7th-order continuous extension of the step that crosses the snapshot time.</li>
 *   <li>Particles are split into fixed chunks of {@link Config#chunkSize}; worker threads take
 *       chunks from a counter. Every particle's arithmetic depends only on its own data, in a
 *       fixed order, so results are bitwise identical for any number of threads.</li>
 *   <li>Each worker owns a {@link ParticleStepper} with the stage scratch (16 stages x 5
 *       doubles); the batch keeps only {@link ParticleBatch#BYTES_PER_PARTICLE} bytes per
 *       particle plus the snapshot buffer (5 doubles and a byte). Nothing is allocated per step.</li>
 *   <li>End states: captured when the event function g = r - {@link Config#captureRadius}
 *       (outer horizon + delta, or the surface radius of a horizonless object) turns negative,
 *       escaped when g = {@link Config#escapeRadius} - r does; the sign change is located on
 *       the continuous extension with the shared root finder ({@link DenseStep#locate});
 *       failed when a non-finite value or dt/dlambda &lt;= 0 persists as the step shrinks below
 *       {@link Config#minStep}, or the step budget runs out.</li>
 * </ul>
 */
public final class BatchIntegrator {
    /**
     * Integration settings.
     *
     * @param absTol absolute tolerance per component
     * @param relTol relative tolerance per component
     * @param captureRadius r below which a particle is captured
     * @param escapeRadius r above which a particle has escaped
     * @param threads worker threads (results do not depend on it)
     * @param chunkSize particles per chunk
     * @param minStep smallest allowed step (M)
     * @param maxStep largest allowed step (M)
     * @param maxStepsPerInterval step budget per particle between two snapshots
     */
    public record Config(double absTol, double relTol, double captureRadius, double escapeRadius, int threads,
                         int chunkSize, double minStep, double maxStep, long maxStepsPerInterval) {
        public Config {
            if (!(absTol > 0) || !(relTol >= 0)) {
                throw new IllegalArgumentException("tolerances must be positive");
            }
            if (threads < 1 || chunkSize < 1) {
                throw new IllegalArgumentException("threads and chunkSize must be >= 1");
            }
        }

        /** Defaults: tolerance 1e-12 (abs and rel), escape at 1e4 M, one thread, chunks of 64. */
        public static Config of(double captureRadius) {
            return new Config(1e-12, 1e-12, captureRadius, 1e4, 1, 64, 1e-10, Double.POSITIVE_INFINITY, 10_000_000L);
        }

        public Config withTolerance(double abs, double rel) {
            return new Config(abs, rel, captureRadius, escapeRadius, threads, chunkSize, minStep, maxStep,
                    maxStepsPerInterval);
        }

        public Config withThreads(int n) {
            return new Config(absTol, relTol, captureRadius, escapeRadius, n, chunkSize, minStep, maxStep,
                    maxStepsPerInterval);
        }

        public Config withEscapeRadius(double rEsc) {
            return new Config(absTol, relTol, captureRadius, rEsc, threads, chunkSize, minStep, maxStep,
                    maxStepsPerInterval);
        }

        public Config withChunkSize(int n) {
            return new Config(absTol, relTol, captureRadius, escapeRadius, threads, n, minStep, maxStep,
                    maxStepsPerInterval);
        }

        public Config withMaxStep(double h) {
            return new Config(absTol, relTol, captureRadius, escapeRadius, threads, chunkSize, minStep, h,
                    maxStepsPerInterval);
        }
    }

    /**
     * Work counts of one {@link #integrate} call (independent of the thread count).
     *
     * @param evaluations right-hand-side evaluations
     * @param acceptedSteps accepted steps summed over particles
     * @param rejectedSteps rejected steps summed over particles
     * @param endStates particles per end state after the call, indexed by {@link EndState#ordinal()}
     */
    public record Result(long evaluations, long acceptedSteps, long rejectedSteps, int[] endStates) {
        public int count(EndState s) {
            return endStates[s.ordinal()];
        }
    }

    private final Supplier<? extends BatchEquations> equations;
    private final Config config;

    /** Geodesics of the spacetime in coordinate time ({@link GeodesicEquations}). */
    public BatchIntegrator(Spacetime spacetime, Config config) {
        this(() -> new GeodesicEquations(spacetime), config);
    }

    /**
     * @param equations makes one instance of the equations per worker thread (an instance may
     *     keep scratch space); their dimension must be {@link GeodesicEquations#DIM_T}, the
     *     layout of {@link ParticleBatch}
     * @param config the settings
     */
    public BatchIntegrator(Supplier<? extends BatchEquations> equations, Config config) {
        this.equations = equations;
        this.config = config;
    }

    /** @return the settings */
    public Config config() {
        return config;
    }

    /** Same as {@link #integrate(ParticleBatch, double[], SnapshotSink, StepListener)} without a listener. */
    public Result integrate(ParticleBatch batch, double[] times, SnapshotSink sink) {
        return integrate(batch, times, sink, null);
    }

    /**
     * Advances every alive particle through the snapshot times; afterwards each alive particle
     * is exactly at the last time.
     *
     * @param batch particles, each alive one at a time &lt;= times[0]; updated in place
     * @param times increasing snapshot times (M)
     * @param sink receives every snapshot (may be null)
     * @param listener sees every accepted step with its continuous extension (may be null)
     */
    public Result integrate(ParticleBatch batch, double[] times, SnapshotSink sink, StepListener listener) {
        for (int k = 1; k < times.length; k++) {
            if (!(times[k] > times[k - 1])) {
                throw new IllegalArgumentException("snapshot times must increase");
            }
        }
        final int n = batch.size();
        final int nChunks = (n + config.chunkSize() - 1) / config.chunkSize();
        final long[] evals = new long[nChunks];
        final long[] acc = new long[nChunks];
        final long[] rej = new long[nChunks];
        final Snapshot snap = new Snapshot(batch);
        final int nWorkers = Math.min(config.threads(), Math.max(1, nChunks));
        final Worker[] workers = new Worker[nWorkers];
        for (int w = 0; w < nWorkers; w++) {
            workers[w] = new Worker(batch, snap, times, listener, evals, acc, rej);
        }
        ExecutorService pool = nWorkers > 1 ? Executors.newFixedThreadPool(nWorkers, r -> {
            Thread th = new Thread(r, "spindrift-motion");
            th.setDaemon(true);
            return th;
        }) : null;
        try {
            for (int k = 0; k < times.length; k++) {
                AtomicInteger next = new AtomicInteger();
                final int target = k;
                if (pool == null) {
                    workers[0].run(target, next, nChunks);
                } else {
                    List<Future<?>> fs = new ArrayList<>(nWorkers);
                    for (Worker w : workers) {
                        fs.add(pool.submit(() -> w.run(target, next, nChunks)));
                    }
                    for (Future<?> f : fs) {
                        f.get();
                    }
                }
                if (sink != null) {
                    sink.accept(k, times[k], snap);
                }
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("integration interrupted", e);
        } catch (ExecutionException e) {
            throw new IllegalStateException("integration failed: " + e.getCause(), e.getCause());
        } finally {
            if (pool != null) {
                pool.shutdownNow();
            }
        }
        long e = 0;
        long a = 0;
        long rj = 0;
        for (int c = 0; c < nChunks; c++) {
            e += evals[c];
            a += acc[c];
            rj += rej[c];
        }
        return new Result(e, a, rj, batch.countByState());
    }

    /** One worker: a stepper and the loop over the particles of the chunks it takes. */
    private final class Worker {
        private final ParticleBatch b;
        private final Snapshot snap;
        private final double[] times;
        private final StepListener listener;
        private final long[] evals;
        private final long[] acc;
        private final long[] rej;
        private final ParticleStepper st;
        /** Terminal events, checked in this order at the end of every accepted step. */
        private final EventFunction[] terminal;
        /** The end state each terminal event leads to. */
        private final EndState[] outcome = {EndState.CAPTURED, EndState.ESCAPED};

        Worker(ParticleBatch b, Snapshot snap, double[] times, StepListener listener, long[] evals, long[] acc,
               long[] rej) {
            this.b = b;
            this.snap = snap;
            this.times = times;
            this.listener = listener;
            this.evals = evals;
            this.acc = acc;
            this.rej = rej;
            this.st = new ParticleStepper(equations.get(), config.absTol(), config.relTol(),
                    config.minStep(), config.maxStep());
            this.terminal = new EventFunction[] {
                EventFunction.above(GeodesicEquations.R, config.captureRadius()),
                EventFunction.below(GeodesicEquations.R, config.escapeRadius()),
            };
        }

        void run(int k, AtomicInteger next, int nChunks) {
            int c;
            while ((c = next.getAndIncrement()) < nChunks) {
                long e0 = st.evaluations;
                long a0 = st.accepted;
                long r0 = st.rejected;
                int from = c * config.chunkSize();
                int to = Math.min(b.size(), from + config.chunkSize());
                for (int i = from; i < to; i++) {
                    advance(i, k);
                }
                evals[c] += st.evaluations - e0;
                acc[c] += st.accepted - a0;
                rej[c] += st.rejected - r0;
            }
        }

        private void writeState(int i) {
            snap.r[i] = b.r[i];
            snap.th[i] = b.th[i];
            snap.ph[i] = b.ph[i];
            snap.pr[i] = b.pr[i];
            snap.pth[i] = b.pth[i];
            snap.state[i] = b.state[i];
        }

        private void writeDense(int i, double t) {
            snap.r[i] = st.at(GeodesicEquations.R, t);
            snap.th[i] = st.at(GeodesicEquations.TH, t);
            snap.ph[i] = st.at(GeodesicEquations.PH, t);
            snap.pr[i] = st.at(GeodesicEquations.PR, t);
            snap.pth[i] = st.at(GeodesicEquations.PTH, t);
            snap.state[i] = EndState.ALIVE.code();
        }

        private void end(int i, EndState s, Failure f, double t) {
            b.state[i] = s.code();
            b.failure[i] = (byte) f.ordinal();
            b.t[i] = t;
        }

        private void storeStart(int i) {
            b.r[i] = st.y(0);
            b.th[i] = st.y(1);
            b.ph[i] = st.y(2);
            b.pr[i] = st.y(3);
            b.pth[i] = st.y(4);
            b.t[i] = st.time();
        }

        private void advance(int i, int k) {
            if (b.state[i] != 0) {
                writeState(i);
                return;
            }
            final double target = times[k];
            final double limit = k + 1 < times.length ? times[k + 1] : target;
            double t = b.t[i];
            if (t == target) {
                writeState(i);
                return;
            }
            if (t > target) {
                throw new IllegalArgumentException("particle " + i + " is at t = " + t
                        + ", after the snapshot time " + target);
            }
            double hh;
            if (b.h[i] > 0) {
                // continuing: the derivative at the start is the last step's first-same-as-last stage
                st.loadWithDerivative(t, b.r[i], b.th[i], b.ph[i], b.pr[i], b.pth[i], b.pt[i], b.pphi[i], b.dy,
                        i * GeodesicEquations.DIM_T);
                hh = b.h[i];
            } else {
                Failure f0 = st.load(t, b.r[i], b.th[i], b.ph[i], b.pr[i], b.pth[i], b.pt[i], b.pphi[i]);
                if (f0 != Failure.NONE) {
                    end(i, EndState.FAILED, f0, t);
                    writeState(i);
                    return;
                }
                hh = st.initialStep();
            }
            long steps = 0;
            while (true) {
                final double room = limit - t;
                // compare the sum, not hh with room: t + hh could round past limit
                final boolean clamped = t + hh >= limit;
                final double hTry = clamped ? room : hh;
                final double err = st.attempt(hTry);
                if (Double.isNaN(err) || err > 1.0) {
                    st.rejected++;
                    Failure why = Double.isNaN(err) ? st.lastFailure : Failure.STEP_UNDERFLOW;
                    hh = Double.isNaN(err) ? 0.25 * hTry : ParticleStepper.nextStep(hTry, err);
                    if (hh < FastMath.max(config.minStep(), 4 * FastMath.ulp(t))) {
                        end(i, EndState.FAILED, why, t);
                        writeState(i);
                        return;
                    }
                    continue;
                }
                Failure f1 = st.finishAccepted();
                if (f1 != Failure.NONE) {
                    st.rejected++;
                    hh = 0.25 * hTry;
                    if (hh < FastMath.max(config.minStep(), 4 * FastMath.ulp(t))) {
                        end(i, EndState.FAILED, f1, t);
                        writeState(i);
                        return;
                    }
                    continue;
                }
                st.accepted++;
                final double tNew = clamped ? limit : t + hTry;
                if (listener != null) {
                    listener.step(i, st);
                }
                final int ev = firedEvent();
                if (ev >= 0) {
                    final double tEnd = st.locate(terminal[ev], tNew);
                    boolean wrote = false;
                    if (target < tEnd) {
                        writeDense(i, target);
                        wrote = true;
                    }
                    b.r[i] = st.at(GeodesicEquations.R, tEnd);
                    b.th[i] = st.at(GeodesicEquations.TH, tEnd);
                    b.ph[i] = st.at(GeodesicEquations.PH, tEnd);
                    b.pr[i] = st.at(GeodesicEquations.PR, tEnd);
                    b.pth[i] = st.at(GeodesicEquations.PTH, tEnd);
                    end(i, outcome[ev], Failure.NONE, tEnd);
                    if (!wrote) {
                        writeState(i);
                    }
                    return;
                }
                double hNext = ParticleStepper.nextStep(hTry, err);
                if (clamped) {
                    hNext = FastMath.max(hNext, hh);
                }
                hh = FastMath.min(hNext, config.maxStep());
                if (tNew >= target) {
                    if (tNew == target) {
                        st.advance();
                        storeStart(i);
                        b.t[i] = tNew;
                        writeState(i);
                    } else {
                        writeDense(i, target);
                        st.advance();
                        storeStart(i);
                        b.t[i] = tNew;
                    }
                    b.h[i] = hh;
                    st.storeDerivative(b.dy, i * GeodesicEquations.DIM_T);
                    return;
                }
                st.advance();
                t = tNew;
                if (++steps > config.maxStepsPerInterval()) {
                    storeStart(i);
                    b.t[i] = t;
                    end(i, EndState.FAILED, Failure.TOO_MANY_STEPS, t);
                    writeState(i);
                    return;
                }
            }
        }

        /** @return the index of the first terminal event whose g is negative at the end of the step, or -1 */
        private int firedEvent() {
            for (int e = 0; e < terminal.length; e++) {
                if (st.gEnd(terminal[e]) < 0.0) {
                    return e;
                }
            }
            return -1;
        }
    }
}
