package org.spindrift.shared.scenario;

import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;

/**
 * The central object.
 *
 * @param massSolar mass in solar masses
 * @param distanceMpc distance to the observer in megaparsecs (scenario key {@code distance}, a string
 *     with a unit: Mpc, kpc or pc)
 * @param family spacetime family name, for example {@code kerr} (see {@code landmarks --help})
 * @param spin spin parameter a in units of M
 * @param parameters the family's extra parameters by name (for example {@code l} for Hayward,
 *     {@code q} for Kerr-Newman), unmodifiable, sorted by name
 * @param allowHorizonless whether a metric without an event horizon is accepted
 */
public record BlackHole(double massSolar, double distanceMpc, String family, double spin,
        Map<String, Double> parameters, boolean allowHorizonless) {
    public BlackHole {
        Objects.requireNonNull(family, "family");
        parameters = java.util.Collections.unmodifiableMap(new TreeMap<>(parameters == null ? Map.of() : parameters));
    }

    /** @return a copy with another spin */
    public BlackHole withSpin(double a) {
        return new BlackHole(massSolar, distanceMpc, family, a, parameters, allowHorizonless);
    }
}
