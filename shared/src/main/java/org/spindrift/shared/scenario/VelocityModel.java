package org.spindrift.shared.scenario;

import java.util.Objects;

/**
 * How member particles move relative to the centre at the start.
 *
 * @param kind rigid, shear or thermal
 * @param dispersion one-dimensional velocity dispersion in the comoving frame, units of c
 *     (used by {@link Kind#THERMAL}; zero otherwise)
 */
public record VelocityModel(Kind kind, double dispersion) {
    /** Member velocity models. */
    public enum Kind {
        /** Every member gets the centre's ZAMO-frame velocity (no internal motion at the start). */
        RIGID,
        /** The centre's velocity plus the difference of local circular velocities (differential rotation). */
        SHEAR,
        /** The centre's velocity boosted by an isotropic Gaussian velocity in the comoving frame. */
        THERMAL
    }

    public VelocityModel {
        Objects.requireNonNull(kind, "kind");
    }

    /** @return the rigid model */
    public static VelocityModel rigid() {
        return new VelocityModel(Kind.RIGID, 0.0);
    }
}
