package org.spindrift.shared.scenario;

import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;

/**
 * The central object.
 *
 * @param massSolar mass in solar masses
 * @param distanceKpc distance to the observer in kiloparsecs
 * @param family spacetime family name, for example {@code kerr} (see {@code landmarks --help})
 * @param spin spin parameter a in units of M
 * @param parameters the family's extra parameters by name (for example {@code l} for Hayward,
 *     {@code q} for Kerr-Newman), unmodifiable, sorted by name
 * @param allowHorizonless whether a metric without an event horizon is accepted
 */
public record BlackHole(double massSolar, double distanceKpc, String family, double spin,
        Map<String, Double> parameters, boolean allowHorizonless) {
    public BlackHole {
        Objects.requireNonNull(family, "family");
        parameters = java.util.Collections.unmodifiableMap(new TreeMap<>(parameters == null ? Map.of() : parameters));
    }

    /** @return a copy with another spin */
    public BlackHole withSpin(double a) {
        return new BlackHole(massSolar, distanceKpc, family, a, parameters, allowHorizonless);
    }
}
