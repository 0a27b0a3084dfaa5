package org.spindrift.shared.scenario;

/** Direction of orbital motion relative to the black hole's spin. */
public enum Sense {
    /** Co-rotating with the spin (increasing phi for a >= 0). */
    PROGRADE,
    /** Counter-rotating. */
    RETROGRADE;

    /** @return +1 for prograde, -1 for retrograde */
    public int sign() {
        return this == PROGRADE ? 1 : -1;
    }
}
