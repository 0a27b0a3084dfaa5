package org.spindrift.viewer.scene;

import org.spindrift.viewer.data.RunData;

/** What the particle colours show. Cycled with a key in the interactive view. */
public enum Quantity {
    /**
     * Time dilation 1/u^t = dtau/dt, the rate of the gas's clock against coordinate time at
     * infinity; it equals the frequency ratio g of a photon with zero angular momentum about the
     * spin axis that reaches a distant observer (g = 1/(u^t (1 - b Omega)) for circular equatorial
     * orbits with impact parameter b, Cunningham &amp; Bardeen 1973, ApJ 183, 237; here b = 0). A
     * per-particle indicator, not the ray-traced g. It can exceed 1 where m(r) &lt; 0 (e.g.
     * Kerr-Newman near a naked singularity), so it is drawn with a diverging ramp centred on 1.
     */
    TIME_DILATION("time-dilation", "time dilation 1/u^t (g of zero-angular-momentum photons)", "",
            RunData.TIME_DILATION),
    /** Emission weight with the flare envelope applied (archive dataset /weight). */
    EMISSION("emission", "emission weight", "", RunData.WEIGHT),
    /** Boyer-Lindquist-like radius r, M. */
    RADIUS("radius", "radius r", "M", RunData.RADIUS),
    /** Source membership (categorical colours). */
    SOURCE("source", "source", "", -1);

    private final String key;
    private final String label;
    private final String unit;
    private final int offset;

    Quantity(String key, String label, String unit, int offset) {
        this.key = key;
        this.label = label;
        this.unit = unit;
        this.offset = offset;
    }

    /** @return the name on the command line */
    public String key() {
        return key;
    }

    /** @return whether the quantity is a ratio shown with a diverging ramp centred on 1 */
    public boolean centredOnOne() {
        return this == TIME_DILATION;
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
            if (q.key().equalsIgnoreCase(s)) {
                return q;
            }
        }
        return null;
    }
}
