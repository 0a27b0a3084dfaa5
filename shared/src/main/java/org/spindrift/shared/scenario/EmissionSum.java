package org.spindrift.shared.scenario;

import java.util.Locale;

/** How the light stage sums the gas along each ray ({@code imaging.emission_sum}). */
public enum EmissionSum {
    /**
     * The grid when it resolves the gas (the thinnest source, as the rms width of its particles
     * along any axis, at least one grid spacing), the particles otherwise.
     */
    AUTO,
    /** Every particle's smoothing kernel at every ray sample. */
    PARTICLES,
    /** Each emission time's particles deposited on a grid and read back at the ray samples. */
    GRID;

    /** @return the scenario key: auto, particles or grid */
    public String key() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** @return the value of a key written by {@link #key()} */
    public static EmissionSum ofKey(String key) {
        return valueOf(key.toUpperCase(Locale.ROOT));
    }
}
