package org.spindrift.shared.scenario;

import java.util.Locale;
import java.util.Objects;

/**
 * One source of emitting gas: a set of test particles about a centre on an orbit.
 *
 * @param name unique name within the scenario
 * @param kind hot spot, cloud or ring
 * @param particles number of particles simulated
 * @param shape initial spatial distribution
 * @param orbit orbit of the centre
 * @param velocity member velocity model
 * @param emission weight, spectral index and flare envelope
 */
public record Source(String name, Kind kind, int particles, SourceShape shape, CentreOrbit orbit,
        VelocityModel velocity, Emission emission) {
    /** Source kinds. */
    public enum Kind {
        /** A compact Gaussian ball (sigma ~ 0.3-2 M). */
        HOT_SPOT,
        /** A larger ball or ellipsoid, typically on an eccentric or plunging orbit. */
        CLOUD,
        /** Particles on neighbouring circular orbits (a shear probe). */
        RING;

        /** @return the name as written in scenario files, for example {@code hot_spot} */
        public String key() {
            return name().toLowerCase(Locale.ROOT);
        }
    }

    public Source {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(shape, "shape");
        Objects.requireNonNull(orbit, "orbit");
        Objects.requireNonNull(velocity, "velocity");
        Objects.requireNonNull(emission, "emission");
    }

    /** @return a copy with another particle count */
    public Source withParticles(int n) {
        return new Source(name, kind, n, shape, orbit, velocity, emission);
    }
}
