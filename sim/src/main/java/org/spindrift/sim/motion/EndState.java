package org.spindrift.sim.motion;

/**
 * How a particle's integration ended. The codes are the values of the
 * {@code /state} dataset of the run archive (DEVELOPERS.md): 0 alive, 1 captured, 2 escaped,
 * 3 failed.
 */
public enum EndState {
    /** Still integrating. */
    ALIVE,
    /** Crossed the capture radius (outer horizon + delta, or the surface of a horizonless object). */
    CAPTURED,
    /** Went beyond the escape radius. */
    ESCAPED,
    /** Stopped by a numerical failure; see {@link Failure}. */
    FAILED;

    private static final EndState[] VALUES = values();

    /** @return the archive code of this state */
    public byte code() {
        return (byte) ordinal();
    }

    /** @return the state with the given archive code */
    public static EndState ofCode(int code) {
        return VALUES[code];
    }
}
