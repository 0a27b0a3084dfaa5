package org.spindrift.sim.motion;

import org.spindrift.shared.archive.ArchiveLayout;

/**
 * How a particle's integration ended. The codes and names are those of the run archive
 * ({@link ArchiveLayout.EndStateName}): the values of the {@code state} dataset and the keys of the
 * manifest's {@code end_states} counts.
 */
public enum EndState {
    /** Still integrating. */
    ALIVE(ArchiveLayout.EndStateName.ALIVE),
    /** Crossed the capture radius (outer horizon + delta, or the surface of a horizonless object). */
    CAPTURED(ArchiveLayout.EndStateName.CAPTURED),
    /** Went beyond the escape radius. */
    ESCAPED(ArchiveLayout.EndStateName.ESCAPED),
    /** Stopped by a numerical failure; see {@link Failure}. */
    FAILED(ArchiveLayout.EndStateName.FAILED);

    /** Indexed by archive code. */
    private static final EndState[] VALUES = values();

    static {
        for (int i = 0; i < VALUES.length; i++) {
            if (VALUES[i].code() != i) {
                throw new ExceptionInInitializerError("end-state codes must be 0.." + (VALUES.length - 1) + " in order");
            }
        }
    }

    private final ArchiveLayout.EndStateName archive;

    EndState(ArchiveLayout.EndStateName archive) {
        this.archive = archive;
    }

    /** @return the archive code of this state */
    public byte code() {
        return archive.code();
    }

    /** @return the key of this state in the manifest's {@code end_states} counts */
    public String key() {
        return archive.key();
    }

    /** @return the state with the given archive code */
    public static EndState ofCode(int code) {
        return VALUES[code];
    }
}
