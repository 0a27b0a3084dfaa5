package org.spindrift.sim.light;

/** How a backward ray ended. */
public enum RayEnd {
    /** reached the capture radius (just outside the horizon, or the surface of a horizonless object): dark behind */
    CAPTURED,
    /** left the emission region outwards (or never entered it) */
    ESCAPED,
    /** non-finite state or too many steps */
    FAILED;

    /** @return the code stored in a byte array */
    public byte code() {
        return (byte) ordinal();
    }
}
