package org.spindrift.sim.spacetime;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.function.DoublePredicate;
import java.util.function.Function;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.spindrift.shared.UserInputException;

/**
 * Builds a {@link Spacetime} from a family name, a spin and named parameters, checking the
 * ranges. This is the one place where user-given metric parameters are validated: the command
 * line ({@code SpacetimeOptions}) and scenario files both come through here.
 *
 * <table>
 *   <caption>families and parameter keys</caption>
 *   <tr><th>family</th><th>keys</th><th>metric</th></tr>
 *   <tr><td>kerr</td><td>-</td><td>m(r) = 1</td></tr>
 *   <tr><td>kerr-newman</td><td>charge</td><td>m(r) = 1 - Q^2 / (2 r)</td></tr>
 *   <tr><td>hayward</td><td>core_length</td><td>m(r) = r^3 / (r^3 + 2 l^2)</td></tr>
 *   <tr><td>bardeen</td><td>core_charge</td><td>m(r) = r^3 / (r^2 + g^2)^(3/2)</td></tr>
 *   <tr><td>mass-series</td><td>c1, c2, ... (ck: coefficient of (M/r)^k)</td>
 *       <td>m(r) = 1 + sum_k c_k r^-k</td></tr>
 *   <tr><td>johannsen-psaltis (alias jp)</td><td>epsilon3</td><td>{@link JohannsenPsaltisSpacetime}</td></tr>
 * </table>
 *
 * Ranges: |a| &lt;= {@value #MAX_SPIN}; charge, core_length and core_charge with magnitude
 * &lt;= {@value #MAX_LENGTH} (core lengths and charges non-negative); series powers k in
 * 1..{@value #MAX_POWER} with |c_k| &lt;= {@value #MAX_COEFFICIENT}; |epsilon3| &lt;=
 * {@value #MAX_EPSILON3}. Unless horizonless objects are allowed, the object must have a horizon
 * ({@link Horizons#outer} finite); for johannsen-psaltis with a horizon, also epsilon3 &gt; -r_+^3 with
 * r_+ = 1 + sqrt(1 - a^2), the bound of Johannsen &amp; Psaltis 2011 (Phys. Rev. D 83, 124015;
 * recalled from memory) that keeps 1 + h &gt; 0 outside the horizon, and a closed surface
 * g^rr = 0 (large positive epsilon3 at high spin opens it at the equator).
 */
public final class Spacetimes {
    /** Family names, as on the command line. */
    public static final List<String> FAMILIES =
            List.of("kerr", "kerr-newman", "hayward", "bardeen", "mass-series", "johannsen-psaltis");
    /** Short names accepted for a family (alias -> family). */
    public static final Map<String, String> ALIASES = Map.of("jp", "johannsen-psaltis");
    /** Largest |spin| accepted (horizonless objects), M. */
    public static final double MAX_SPIN = 5.0;
    /** Largest charge, core length or core charge accepted, M. */
    public static final double MAX_LENGTH = 10.0;
    /** Largest power k of the mass series. */
    public static final int MAX_POWER = 12;
    /** Largest |c_k| of the mass series. */
    public static final double MAX_COEFFICIENT = 100.0;
    /** Largest |epsilon3|. */
    public static final double MAX_EPSILON3 = 1000.0;

    /** Parameter key: Kerr-Newman charge Q. */
    public static final String CHARGE = "charge";
    /** Parameter key: Hayward core length l. */
    public static final String CORE_LENGTH = "core_length";
    /** Parameter key: Bardeen core charge g. */
    public static final String CORE_CHARGE = "core_charge";
    /** Parameter key: Johannsen-Psaltis epsilon_3. */
    public static final String EPSILON3 = "epsilon3";
    /** Name used in messages for the whole series (its keys are c1, c2, ...). */
    public static final String SERIES = "series";
    /** Name used in messages for the spin. */
    public static final String SPIN = "spin";
    /** Name used in messages for the family. */
    public static final String FAMILY = "family";
    /** Name used in messages for the horizonless allowance. */
    public static final String ALLOW_HORIZONLESS = "allow_horizonless";

    private static final Pattern SERIES_KEY = Pattern.compile("c([0-9]+)");
    private static final Pattern SERIES_TERM = Pattern.compile("\\s*([0-9]+)\\s*=\\s*([^,\\s]+)\\s*");

    private Spacetimes() {
    }

    /** @return the family name for a name or alias ({@link #ALIASES}), unchanged when unknown */
    public static String canonical(String family) {
        return family == null ? null : ALIASES.getOrDefault(family, family);
    }

    /** As {@link #create(String, double, Map, boolean, Function)} with the parameter keys as names. */
    public static Spacetime create(String family, double spin, Map<String, Double> params, boolean allowNoHorizon) {
        return create(family, spin, params, allowNoHorizon, Function.identity());
    }

    /**
     * @param name one of {@link #FAMILIES} or an alias ({@link #ALIASES})
     * @param spin a in units of M
     * @param params the family's parameters by key (see the class comment); may be empty
     * @param allowNoHorizon accept objects without a horizon (naked singularities, regular cores)
     * @param names maps a key ({@link #SPIN}, {@link #CHARGE}, ..., {@link #SERIES},
     *     {@link #ALLOW_HORIZONLESS}) to the name the user knows it by (an option, a config key)
     * @return the spacetime
     * @throws UserInputException with a one-line message naming the parameter and its allowed range
     */
    public static Spacetime create(String name, double spin, Map<String, Double> params, boolean allowNoHorizon,
                                   Function<String, String> names) {
        final String family = canonical(name);
        if (family == null || !FAMILIES.contains(family)) {
            throw new UserInputException(names.apply(FAMILY) + " = " + family
                    + " is not a known family: one of " + String.join(", ", FAMILIES) + " (alias jp)");
        }
        final Map<String, Double> p = params == null ? Map.of() : params;
        if (!Double.isFinite(spin) || Math.abs(spin) > MAX_SPIN) {
            throw new UserInputException(names.apply(SPIN) + " = " + fmt(spin)
                    + " is out of range: |a| <= " + fmt(MAX_SPIN));
        }
        checkKeys(family, p, names);
        final String hint = " (use " + names.apply(ALLOW_HORIZONLESS) + " for a horizonless object)";
        switch (family) {
            case "kerr" -> {
                if (!allowNoHorizon && Math.abs(spin) > 1.0) {
                    throw new UserInputException(names.apply(SPIN) + " = " + fmt(spin)
                            + " is out of range: |a| <= 1 for kerr (use " + names.apply(ALLOW_HORIZONLESS)
                            + " for a naked singularity)");
                }
                return new MassFunctionSpacetime(family, spin, MassFunctions.constant());
            }
            case "kerr-newman" -> {
                double q = required(p, CHARGE, family, names);
                range(names.apply(CHARGE), q, x -> Math.abs(x) <= MAX_LENGTH, "|Q| <= " + fmt(MAX_LENGTH));
                if (!allowNoHorizon && spin * spin + q * q > 1.0) {
                    throw new UserInputException(names.apply(CHARGE) + " = " + fmt(q) + " with "
                            + names.apply(SPIN) + " = " + fmt(spin)
                            + " is out of range: a^2 + Q^2 <= 1 for kerr-newman" + hint);
                }
                return new MassFunctionSpacetime(family, spin, MassFunctions.kerrNewman(q));
            }
            case "hayward", "bardeen" -> {
                boolean hay = family.equals("hayward");
                String key = hay ? CORE_LENGTH : CORE_CHARGE;
                double l = required(p, key, family, names);
                range(names.apply(key), l, x -> x >= 0.0 && x <= MAX_LENGTH, "0 <= " + key + " <= " + fmt(MAX_LENGTH));
                Function<Double, Spacetime> make = x -> new MassFunctionSpacetime(family, spin,
                        hay ? MassFunctions.hayward(x) : MassFunctions.bardeen(x));
                Spacetime st = make.apply(l);
                if (!allowNoHorizon) {
                    if (Math.abs(spin) > 1.0) {
                        throw new UserInputException(names.apply(SPIN) + " = " + fmt(spin)
                                + " is out of range: |a| <= 1 for " + family + " with a horizon" + hint);
                    }
                    if (Double.isNaN(Horizons.outer(st))) {
                        double crit = criticalParameter(make::apply, MAX_LENGTH);
                        throw new UserInputException(names.apply(key) + " = " + fmt(l) + " with "
                                + names.apply(SPIN) + " = " + fmt(spin) + " leaves no horizon: " + key
                                + " <= " + String.format(Locale.ROOT, "%.4f", crit)
                                + " has one at this spin" + hint);
                    }
                }
                return st;
            }
            case "mass-series" -> {
                TreeMap<Integer, Double> terms = seriesTerms(p, names);
                if (terms.isEmpty()) {
                    throw new UserInputException(names.apply(SERIES)
                            + " is required for family mass-series (terms k=c_k, k in 1.." + MAX_POWER + ")");
                }
                int[] k = terms.keySet().stream().mapToInt(Integer::intValue).toArray();
                double[] c = terms.values().stream().mapToDouble(Double::doubleValue).toArray();
                Spacetime st = new MassFunctionSpacetime(family, spin, MassFunctions.series(k, c));
                if (!allowNoHorizon && Double.isNaN(Horizons.outer(st))) {
                    throw new UserInputException(names.apply(SERIES) + " = " + describe(terms) + " with "
                            + names.apply(SPIN) + " = " + fmt(spin)
                            + " leaves no horizon: Delta = r^2 - 2 m(r) r + a^2 has no positive root" + hint);
                }
                return st;
            }
            case "johannsen-psaltis" -> {
                double e = required(p, EPSILON3, family, names);
                range(names.apply(EPSILON3), e, x -> Math.abs(x) <= MAX_EPSILON3, "|epsilon3| <= " + fmt(MAX_EPSILON3));
                if (!allowNoHorizon) {
                    if (Math.abs(spin) > 1.0) {
                        throw new UserInputException(names.apply(SPIN) + " = " + fmt(spin)
                                + " is out of range: |a| <= 1 for jp with a horizon" + hint);
                    }
                    double rPlus = 1.0 + Math.sqrt(1.0 - spin * spin);
                    double bound = -rPlus * rPlus * rPlus;
                    if (e <= bound) {
                        throw new UserInputException(names.apply(EPSILON3) + " = " + fmt(e)
                                + " is out of range: epsilon3 > -(1 + sqrt(1 - a^2))^3 = "
                                + String.format(Locale.ROOT, "%.4f", bound) + " at " + names.apply(SPIN)
                                + " = " + fmt(spin) + hint);
                    }
                    Spacetime st = new JohannsenPsaltisSpacetime(spin, e);
                    if (Double.isNaN(Horizons.outer(st))) {
                        // only epsilon3 > 0 can open the surface (W grows with epsilon3 there)
                        double crit = criticalParameter(x -> new JohannsenPsaltisSpacetime(spin, x), MAX_EPSILON3);
                        throw new UserInputException(names.apply(EPSILON3) + " = " + fmt(e) + " with "
                                + names.apply(SPIN) + " = " + fmt(spin)
                                + " leaves no closed horizon (g^rr = 0 does not reach the equator): epsilon3 <= "
                                + String.format(Locale.ROOT, "%.4f", crit) + " has one at this spin" + hint);
                    }
                    return st;
                }
                return new JohannsenPsaltisSpacetime(spin, e);
            }
            default -> throw new IllegalStateException(family);
        }
    }

    /**
     * Parses a series written {@code k=c,k=c,...} (for example {@code 2=0.5,3=-0.1}) into the
     * parameter map of family mass-series (keys c2, c3, ...).
     *
     * @param name how the user knows the series (an option or a config key), for messages
     */
    public static Map<String, Double> parseSeries(String text, String name) {
        Map<String, Double> out = new LinkedHashMap<>();
        if (text == null || text.isBlank()) {
            throw new UserInputException(name + " is empty: expected k=c_k terms separated by commas, e.g. 2=0.5,3=-0.1");
        }
        for (String term : text.split(",", -1)) {
            Matcher m = SERIES_TERM.matcher(term);
            if (!m.matches()) {
                throw new UserInputException(name + ": term '" + term.strip()
                        + "' is not of the form k=c_k (k an integer in 1.." + MAX_POWER + ", c_k a number)");
            }
            double c;
            try {
                c = Double.parseDouble(m.group(2));
            } catch (NumberFormatException ex) {
                throw new UserInputException(name + ": coefficient '" + m.group(2) + "' in term '" + term.strip()
                        + "' is not a number");
            }
            String key = "c" + Integer.parseInt(m.group(1));
            if (out.put(key, c) != null) {
                throw new UserInputException(name + ": power " + m.group(1) + " is given twice");
            }
        }
        return out;
    }

    private static void checkKeys(String family, Map<String, Double> p, Function<String, String> names) {
        Set<String> allowed = switch (family) {
            case "kerr-newman" -> Set.of(CHARGE);
            case "hayward" -> Set.of(CORE_LENGTH);
            case "bardeen" -> Set.of(CORE_CHARGE);
            case "johannsen-psaltis" -> Set.of(EPSILON3);
            default -> Set.of();
        };
        for (String key : p.keySet()) {
            boolean seriesKey = SERIES_KEY.matcher(key).matches();
            if (family.equals("mass-series") ? !seriesKey : !allowed.contains(key)) {
                String shown = seriesKey ? names.apply(SERIES) : names.apply(key);
                String owner = seriesKey ? "mass-series" : switch (key) {
                    case CHARGE -> "kerr-newman";
                    case CORE_LENGTH -> "hayward";
                    case CORE_CHARGE -> "bardeen";
                    case EPSILON3 -> "johannsen-psaltis";
                    default -> null;
                };
                throw new UserInputException(shown + " does not apply to family " + family
                        + (owner == null ? " (unknown parameter)" : " (it belongs to family " + owner + ")"));
            }
        }
    }

    private static double required(Map<String, Double> p, String key, String family, Function<String, String> names) {
        Double v = p.get(key);
        if (v == null) {
            throw new UserInputException(names.apply(key) + " is required for family " + family);
        }
        return v;
    }

    private static void range(String name, double v, DoublePredicate ok, String allowed) {
        if (!Double.isFinite(v) || !ok.test(v)) {
            throw new UserInputException(name + " = " + fmt(v) + " is out of range: " + allowed);
        }
    }

    private static TreeMap<Integer, Double> seriesTerms(Map<String, Double> p, Function<String, String> names) {
        TreeMap<Integer, Double> terms = new TreeMap<>();
        for (Map.Entry<String, Double> e : p.entrySet()) {
            Matcher m = SERIES_KEY.matcher(e.getKey());
            m.matches();
            int k;
            try {
                k = Integer.parseInt(m.group(1));
            } catch (NumberFormatException ex) {
                k = -1;
            }
            if (k < 1 || k > MAX_POWER) {
                throw new UserInputException(names.apply(SERIES) + ": power " + m.group(1)
                        + " is out of range: k in 1.." + MAX_POWER);
            }
            double c = e.getValue() == null ? Double.NaN : e.getValue();
            if (!Double.isFinite(c) || Math.abs(c) > MAX_COEFFICIENT) {
                throw new UserInputException(names.apply(SERIES) + ": coefficient of power " + k + " = " + fmt(c)
                        + " is out of range: |c_k| <= " + fmt(MAX_COEFFICIENT));
            }
            terms.put(k, c);
        }
        return terms;
    }

    /** Largest parameter value that still leaves a horizon (existence is monotone in it). */
    private static double criticalParameter(java.util.function.DoubleFunction<Spacetime> make, double max) {
        double lo = 0.0;
        double hi = max;
        for (int i = 0; i < 40; i++) {
            double mid = 0.5 * (lo + hi);
            if (Double.isNaN(Horizons.outer(make.apply(mid)))) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return lo;
    }

    private static String describe(TreeMap<Integer, Double> terms) {
        StringBuilder sb = new StringBuilder();
        terms.forEach((k, c) -> sb.append(sb.length() == 0 ? "" : ",").append(k).append('=').append(fmt(c)));
        return sb.toString();
    }

    private static String fmt(double x) {
        if (x == Math.rint(x) && Math.abs(x) < 1e15) {
            return String.valueOf((long) x);
        }
        return String.valueOf(x);
    }
}
