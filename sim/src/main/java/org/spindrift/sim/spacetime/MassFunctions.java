package org.spindrift.sim.spacetime;

import java.util.Arrays;
import java.util.Objects;
import org.hipparchus.CalculusFieldElement;

/** The mass functions m(r) of the Kerr-like families (Kerr, Kerr-Newman, Hayward, Bardeen, mass series), all with M = 1. */
public final class MassFunctions {
    private MassFunctions() {
    }

    /** m(r) = M: the Kerr metric (Kerr 1963; Boyer & Lindquist 1967). */
    public static MassFunction constant() {
        return Constant.INSTANCE;
    }

    /**
     * m(r) = M - Q^2 / (2 r): Kerr-Newman for neutral test particles (Newman et al. 1965,
     * J. Math. Phys. 6, 918), since then Delta = r^2 - 2 M r + a^2 + Q^2.
     */
    public static MassFunction kerrNewman(double charge) {
        return new KerrNewman(charge);
    }

    /**
     * m(r) = M r^3 / (r^3 + 2 M l^2): Hayward's regular core (Hayward 2006, Phys. Rev. Lett. 96,
     * 031103, eq. 2), made rotating in the Guerses-Guersey form (Bambi & Modesto 2013, Phys. Lett.
     * B 721, 329).
     */
    public static MassFunction hayward(double coreLength) {
        return new Hayward(coreLength);
    }

    /**
     * m(r) = M r^3 / (r^2 + g^2)^(3/2): Bardeen's regular core (Bardeen 1968) in the form of
     * Ayon-Beato & Garcia 2000 (Phys. Lett. B 493, 149), rotating as in Bambi & Modesto 2013.
     */
    public static MassFunction bardeen(double coreCharge) {
        return new Bardeen(coreCharge);
    }

    /**
     * m(r) = M (1 + sum_k c_k (M/r)^k), a generic inverse-power series.
     *
     * @param powers the exponents k (positive integers)
     * @param coefficients the c_k, same length
     */
    public static MassFunction series(int[] powers, double[] coefficients) {
        return new Series(powers, coefficients);
    }

    private static final class Constant implements MassFunction {
        static final Constant INSTANCE = new Constant();

        @Override public double value(double r) {
            return 1.0;
        }

        @Override public double derivative(double r) {
            return 0.0;
        }

        @Override public <T extends CalculusFieldElement<T>> T value(T r) {
            return r.getField().getOne();
        }

        @Override public boolean isConstant() {
            return true;
        }
    }

    private record KerrNewman(double q) implements MassFunction {
        @Override public double value(double r) {
            return 1.0 - q * q / (2.0 * r);
        }

        @Override public double derivative(double r) {
            return q * q / (2.0 * r * r);
        }

        @Override public <T extends CalculusFieldElement<T>> T value(T r) {
            return r.reciprocal().multiply(-0.5 * q * q).add(1.0);
        }

        @Override public boolean isConstant() {
            return q == 0.0;
        }
    }

    private record Hayward(double l) implements MassFunction {
        @Override public double value(double r) {
            double r3 = r * r * r;
            return r3 / (r3 + 2.0 * l * l);
        }

        @Override public double derivative(double r) {
            double r3 = r * r * r;
            double d = r3 + 2.0 * l * l;
            // d/dr [r^3 / (r^3 + b)] = 3 r^2 b / (r^3 + b)^2 with b = 2 l^2
            return 3.0 * r * r * 2.0 * l * l / (d * d);
        }

        @Override public <T extends CalculusFieldElement<T>> T value(T r) {
            T r3 = r.multiply(r).multiply(r);
            return r3.divide(r3.add(2.0 * l * l));
        }

        @Override public boolean isConstant() {
            return l == 0.0;
        }
    }

    private record Bardeen(double g) implements MassFunction {
        @Override public double value(double r) {
            double s = r * r + g * g;
            return r * r * r / (s * Math.sqrt(s));
        }

        @Override public double derivative(double r) {
            double s = r * r + g * g;
            // d/dr [r^3 s^-3/2] = 3 r^2 s^-3/2 - 3 r^4 s^-5/2 = 3 r^2 g^2 s^-5/2
            return 3.0 * r * r * g * g / (s * s * Math.sqrt(s));
        }

        @Override public <T extends CalculusFieldElement<T>> T value(T r) {
            T s = r.multiply(r).add(g * g);
            return r.multiply(r).multiply(r).divide(s.multiply(s.sqrt()));
        }

        @Override public boolean isConstant() {
            return g == 0.0;
        }
    }

    private static final class Series implements MassFunction {
        private final int[] k;
        private final double[] c;

        Series(int[] powers, double[] coefficients) {
            Objects.requireNonNull(powers);
            if (powers.length != coefficients.length) {
                throw new IllegalArgumentException("powers and coefficients differ in length");
            }
            this.k = powers.clone();
            this.c = coefficients.clone();
        }

        @Override public double value(double r) {
            double m = 1.0;
            for (int i = 0; i < k.length; i++) {
                m += c[i] * Math.pow(r, -k[i]);
            }
            return m;
        }

        @Override public double derivative(double r) {
            double d = 0.0;
            for (int i = 0; i < k.length; i++) {
                d -= k[i] * c[i] * Math.pow(r, -k[i] - 1);
            }
            return d;
        }

        @Override public <T extends CalculusFieldElement<T>> T value(T r) {
            T m = r.getField().getOne();
            for (int i = 0; i < k.length; i++) {
                m = m.add(r.pow(-k[i]).multiply(c[i]));
            }
            return m;
        }

        @Override public boolean isConstant() {
            return Arrays.stream(c).allMatch(x -> x == 0.0);
        }
    }
}
