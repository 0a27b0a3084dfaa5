package org.spindrift.sim.cli;

import java.util.LinkedHashMap;
import java.util.Map;
import org.spindrift.sim.spacetime.Spacetime;
import org.spindrift.sim.spacetime.Spacetimes;
import picocli.CommandLine.Option;

/**
 * The options that choose a spacetime, shared by every command that needs one (picocli mixin:
 * {@code @Mixin SpacetimeOptions spacetime;} then {@code spacetime.build()}). Validation is
 * {@link Spacetimes#create}'s; its messages name these options.
 */
public final class SpacetimeOptions {
    @Option(names = "--family", paramLabel = "NAME", defaultValue = "kerr",
            description = "Metric family: kerr, kerr-newman, hayward, bardeen, mass-series, johannsen-psaltis (alias jp)"
                    + " (default: ${DEFAULT-VALUE}).")
    String family;

    @Option(names = "--spin", paramLabel = "A", defaultValue = "0",
            description = "Spin a in units of M; negative means the hole turns against prograde (positive-phi) orbits"
                    + " (default: ${DEFAULT-VALUE}).")
    double spin;

    @Option(names = "--charge", paramLabel = "Q", description = "kerr-newman: charge Q in M, m(r) = M - Q^2/(2r).")
    Double charge;

    @Option(names = "--core-length", paramLabel = "L",
            description = "hayward: core length L in M, m(r) = M r^3/(r^3 + 2 M L^2).")
    Double coreLength;

    @Option(names = "--core-charge", paramLabel = "G",
            description = "bardeen: core charge G in M, m(r) = M r^3/(r^2 + G^2)^(3/2).")
    Double coreCharge;

    @Option(names = "--series", paramLabel = "k=c,...",
            description = "mass-series: terms of m(r) = M (1 + sum_k c_k (M/r)^k), e.g. 2=0.5,3=-0.1 (k in 1..12).")
    String series;

    @Option(names = "--epsilon3", paramLabel = "E", description = "johannsen-psaltis: deformation epsilon_3 (Johannsen & Psaltis 2011).")
    Double epsilon3;

    @Option(names = "--allow-horizonless",
            description = "Accept parameters without a horizon (naked singularity or regular horizonless object).")
    boolean allowHorizonless;

    /** @return the family name (an alias such as jp replaced by the full name) */
    public String family() {
        return Spacetimes.canonical(family);
    }

    /** @return the spin as given */
    public double spin() {
        return spin;
    }

    /** @return true when horizonless objects are allowed */
    public boolean allowHorizonless() {
        return allowHorizonless;
    }

    /** @return the parameters given, by the keys of {@link Spacetimes} (series terms as c1, c2, ...) */
    public Map<String, Double> parameters() {
        Map<String, Double> p = new LinkedHashMap<>();
        if (charge != null) {
            p.put(Spacetimes.CHARGE, charge);
        }
        if (coreLength != null) {
            p.put(Spacetimes.CORE_LENGTH, coreLength);
        }
        if (coreCharge != null) {
            p.put(Spacetimes.CORE_CHARGE, coreCharge);
        }
        if (epsilon3 != null) {
            p.put(Spacetimes.EPSILON3, epsilon3);
        }
        if (series != null) {
            p.putAll(Spacetimes.parseSeries(series, "--series"));
        }
        return p;
    }

    /**
     * @return the spacetime the options describe
     * @throws org.spindrift.shared.UserInputException naming the offending option and its range
     */
    public Spacetime build() {
        return Spacetimes.create(family, spin, parameters(), allowHorizonless, SpacetimeOptions::optionName);
    }

    /** @return the option a {@link Spacetimes} parameter key is given by */
    static String optionName(String key) {
        return switch (key) {
            case Spacetimes.SPIN -> "--spin";
            case Spacetimes.FAMILY -> "--family";
            case Spacetimes.CHARGE -> "--charge";
            case Spacetimes.CORE_LENGTH -> "--core-length";
            case Spacetimes.CORE_CHARGE -> "--core-charge";
            case Spacetimes.EPSILON3 -> "--epsilon3";
            case Spacetimes.SERIES -> "--series";
            case Spacetimes.ALLOW_HORIZONLESS -> "--allow-horizonless";
            default -> key;
        };
    }
}
