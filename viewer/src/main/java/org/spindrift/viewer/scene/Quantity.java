package org.spindrift.viewer.scene;

import org.spindrift.viewer.data.RunData;

/** What the particle colours show. Cycled with a key in the interactive view. */
public enum Quantity {
    /**
     * g = 1/u^t: the redshift factor of a photon with zero angular momentum about the spin axis
     * reaching a distant observer (for circular equatorial orbits g = 1/(u^t (1 - b Omega)) with
     * impact parameter b; Cunningham & Bardeen 1973, ApJ 183, 237; here b = 0).
     */
    REDSHIFT("redshift factor g = 1/u^t", "", RunData.REDSHIFT),
    /** Emission weight with the flare envelope applied (archive dataset /weight). */
    EMISSION("emission weight", "", RunData.WEIGHT),
    /** Boyer-Lindquist-like radius r, M. */
    RADIUS("radius r", "M", RunData.RADIUS),
    /** Source membership (categorical colours). */
    SOURCE("source", "", -1);

    private final String label;
    private final String unit;
    private final int offset;

    Quantity(String label, String unit, int offset) {
        this.label = label;
        this.unit = unit;
        this.offset = offset;
    }

    public String label() {
        return label;
    }

    public String unit() {
        return unit;
    }

    /** @return the float offset in a snapshot record, or -1 for {@link #SOURCE} */
    public int offset() {
        return offset;
    }

    public Quantity next() {
        return values()[(ordinal() + 1) % values().length];
    }

    /** @return the quantity named s (case-insensitive, as on the command line) */
    public static Quantity parse(String s) {
        for (Quantity q : values()) {
            if (q.name().equalsIgnoreCase(s)) {
                return q;
            }
        }
        return null;
    }
}
