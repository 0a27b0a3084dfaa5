package org.spindrift.shared.scenario;

import java.util.Objects;

/**
 * A time or duration as written in a scenario file: a value and its unit. Minutes and M
 * (GM/c^3) are physical/geometric times; {@link Unit#ORBITS} counts orbits of the first source's
 * centre and is allowed only for the run duration (the engine converts it).
 *
 * @param value the number as written
 * @param unit its unit
 */
public record TimeSpan(double value, Unit unit) {
    /** Units a time may be given in. */
    public enum Unit {
        /** Minutes of coordinate time at infinity. */
        MINUTES("min"),
        /** Geometric units, GM/c^3 of the black hole. */
        M("M"),
        /** Orbits of the first source's centre (run duration only). */
        ORBITS("orbits");

        private final String symbol;

        Unit(String symbol) {
            this.symbol = symbol;
        }

        /** @return the unit as written in scenario files */
        public String symbol() {
            return symbol;
        }
    }

    public TimeSpan {
        Objects.requireNonNull(unit, "unit");
    }

    /** @return a time in minutes */
    public static TimeSpan minutes(double v) {
        return new TimeSpan(v, Unit.MINUTES);
    }

    /** @return a time in M */
    public static TimeSpan geometric(double v) {
        return new TimeSpan(v, Unit.M);
    }

    /**
     * @param secondsPerM GM/c^3 in seconds for the black hole ({@code Units.timeUnitSeconds})
     * @return the time in M
     * @throws IllegalStateException for {@link Unit#ORBITS}, which needs an orbital period
     */
    public double toM(double secondsPerM) {
        return switch (unit) {
            case M -> value;
            case MINUTES -> value * 60.0 / secondsPerM;
            case ORBITS -> throw new IllegalStateException("a time in orbits needs the orbital period: use toM(secondsPerM, periodM)");
        };
    }

    /** @return the time in M, with the orbital period (in M) used for {@link Unit#ORBITS} */
    public double toM(double secondsPerM, double orbitalPeriodM) {
        return unit == Unit.ORBITS ? value * orbitalPeriodM : toM(secondsPerM);
    }

    /** @return the time as written in a scenario file, for example {@code "30 min"} */
    @Override public String toString() {
        return (value == Math.rint(value) && Math.abs(value) < 1e15 ? Long.toString((long) value) : Double.toString(value))
                + " " + unit.symbol();
    }
}
