package org.spindrift.shared.scenario;

/**
 * A flare envelope f(t) multiplying a source's emission weight, in emitter (coordinate) time
 * (Boyer-Lindquist coordinate time t, not the gas's proper time). Peak value 1.
 */
public sealed interface Flare {
    /** Constant emission, f = 1. */
    record Constant() implements Flare {
    }

    /**
     * Gaussian envelope f = exp(-(t - peak)^2 / (2 width^2)).
     *
     * @param peak time of the maximum
     * @param width standard deviation
     */
    record Gaussian(TimeSpan peak, TimeSpan width) implements Flare {
    }

    /**
     * Exponential rise and decay: f = exp((t - peak)/rise) before the peak, exp(-(t - peak)/decay) after.
     *
     * @param peak time of the maximum
     * @param rise e-folding time of the rise
     * @param decay e-folding time of the decay
     */
    record Exponential(TimeSpan peak, TimeSpan rise, TimeSpan decay) implements Flare {
    }
}
