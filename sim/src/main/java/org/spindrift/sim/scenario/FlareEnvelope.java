package org.spindrift.sim.scenario;

import java.util.function.DoubleUnaryOperator;
import org.spindrift.shared.scenario.Flare;

/**
 * Evaluates a {@link Flare} envelope in emitter time: the coordinate time t of the emitting
 * particle (M), the time at which the run's snapshots are taken. Peak value 1.
 */
public final class FlareEnvelope implements DoubleUnaryOperator {
    private final int kind;
    private final double t0;
    private final double a;
    private final double b;

    /**
     * @param flare the envelope as given in the scenario
     * @param secondsPerM GM/c^3 of the black hole, to convert times given in minutes
     */
    public FlareEnvelope(Flare flare, double secondsPerM) {
        if (flare instanceof Flare.Gaussian g) {
            kind = 1;
            t0 = g.peak().toM(secondsPerM);
            a = g.width().toM(secondsPerM);
            b = 0;
        } else if (flare instanceof Flare.Exponential e) {
            kind = 2;
            t0 = e.peak().toM(secondsPerM);
            a = e.rise().toM(secondsPerM);
            b = e.decay().toM(secondsPerM);
        } else {
            kind = 0;
            t0 = 0;
            a = 0;
            b = 0;
        }
    }

    /** @return f(t) for t in M */
    public double at(double t) {
        switch (kind) {
            case 1: {
                double x = (t - t0) / a;
                return Math.exp(-0.5 * x * x); // Gaussian pulse, common practice
            }
            case 2:
                // fast-rise exponential-decay profile, common practice for flares (no source)
                return t < t0 ? Math.exp((t - t0) / a) : Math.exp(-(t - t0) / b);
            default:
                return 1.0;
        }
    }

    /** Same as {@link #at}: the envelope as a plain function of emitter time (M). */
    @Override public double applyAsDouble(double t) {
        return at(t);
    }
}
