package org.spindrift.shared.scenario;

import java.util.Objects;

/**
 * Emission of a source.
 *
 * @param weight total emission weight of the source (relative luminosity), shared equally by
 *     its particles
 * @param spectralIndex alpha in F_nu ~ nu^-alpha
 * @param flare envelope in emitter time
 */
public record Emission(double weight, double spectralIndex, Flare flare) {
    public Emission {
        Objects.requireNonNull(flare, "flare");
    }
}
