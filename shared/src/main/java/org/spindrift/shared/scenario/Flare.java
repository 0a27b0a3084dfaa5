package org.spindrift.shared.scenario;

/**
 * A flare envelope f(t) multiplying a source's emission weight, in emitter (coordinate) time
 * (DESIGN section 6). Peak value 1.
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
     * Exponential rise and decay: f = exp((t - start)/rise) before start, exp(-(t - start)/decay) after.
     *
     * @param start time of the maximum
     * @param rise e-folding time of the rise
     * @param decay e-folding time of the decay
     */
    record Exponential(TimeSpan start, TimeSpan rise, TimeSpan decay) implements Flare {
    }
}
