package org.spindrift.sim.spacetime;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import java.util.Random;
import java.util.stream.Stream;
import org.hipparchus.analysis.differentiation.Gradient;
import org.hipparchus.analysis.differentiation.GradientField;
import org.hipparchus.linear.FieldLUDecomposition;
import org.hipparchus.linear.FieldMatrix;
import org.hipparchus.linear.MatrixUtils;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The analytic first derivatives of every family, covariant and inverse, against Hipparchus
 * automatic differentiation (reference library): the covariant metric by differentiating the
 * generic {@code covariant(T, T, T[])}, the inverse by differentiating the field-valued LU
 * inverse of that 4x4 matrix, so the inverse check does not rely on any closed form of ours.
 */
class MetricDerivativesTest {
    /** Relative tolerance (project requirement for analytic derivatives), measured against |reference| + |component value|. */
    private static final double TOL = 1e-10;
    private static final int POINTS = 60;

    static Stream<Arguments> members() {
        return Stream.of(
                Arguments.of("kerr", 0.9, Map.of(), false),
                Arguments.of("kerr", -0.5, Map.of(), false),
                Arguments.of("kerr", 0.0, Map.of(), false),
                Arguments.of("kerr-newman", 0.6, Map.of("charge", 0.5), false),
                Arguments.of("hayward", 0.7, Map.of("core_length", 0.4), false),
                Arguments.of("hayward", 0.9, Map.of("core_length", 1.5), true),
                Arguments.of("bardeen", 0.5, Map.of("core_charge", 0.3), false),
                Arguments.of("bardeen", 0.8, Map.of("core_charge", 1.0), true),
                Arguments.of("mass-series", 0.8, Map.of("c1", 0.2, "c2", 0.5, "c3", -0.1), false),
                Arguments.of("jp", 0.6, Map.of("epsilon3", 1.0), false),
                Arguments.of("jp", 0.8, Map.of("epsilon3", 2.0), true),
                Arguments.of("jp", 0.5, Map.of("epsilon3", -1.5), false),
                Arguments.of("jp", 0.98, Map.of("epsilon3", 0.7), true),
                Arguments.of("jp", 1.2, Map.of("epsilon3", -0.5), true));
    }

    @ParameterizedTest(name = "{0} a={1} {2}")
    @MethodSource("members")
    void analyticDerivativesMatchAutomaticDifferentiation(String family, double spin, Map<String, Double> p,
                                                          boolean horizonless) {
        Spacetime st = Spacetimes.create(family, spin, p, horizonless);
        double rh = Horizons.outer(st);
        double rLo = 1.1 * (Double.isNaN(rh) ? Math.max(Landmarks.regularityLimit(st), 0.36) : rh);
        double rHi = 40.0;
        Random rnd = new Random(12345L + family.hashCode());
        GradientField field = GradientField.getField(2);
        double[] cov = new double[Spacetime.SIZE];
        double[] inv = new double[Spacetime.SIZE];
        Gradient[] g = new Gradient[5];
        for (int n = 0; n < POINTS; n++) {
            double r = rLo * Math.pow(rHi / rLo, rnd.nextDouble());
            double th = 0.1 + (Math.PI - 0.2) * rnd.nextDouble();
            st.covariant(r, th, cov);
            st.inverse(r, th, inv);
            st.covariant(Gradient.variable(2, 0, r), Gradient.variable(2, 1, th), g);
            String at = family + " at r=" + r + " theta=" + th;
            for (int c = 0; c < 5; c++) {
                check(g[c], cov, c, "covariant " + c + " " + at);
            }
            // 4x4 metric in the order (t, r, theta, phi), inverted with automatic differentiation
            FieldMatrix<Gradient> m = MatrixUtils.createFieldMatrix(field, 4, 4);
            Gradient zero = field.getZero();
            for (int i = 0; i < 4; i++) {
                for (int j = 0; j < 4; j++) {
                    m.setEntry(i, j, zero);
                }
            }
            m.setEntry(0, 0, g[Spacetime.TT]);
            m.setEntry(0, 3, g[Spacetime.TP]);
            m.setEntry(3, 0, g[Spacetime.TP]);
            m.setEntry(3, 3, g[Spacetime.PP]);
            m.setEntry(1, 1, g[Spacetime.RR]);
            m.setEntry(2, 2, g[Spacetime.HH]);
            FieldMatrix<Gradient> mi = new FieldLUDecomposition<>(m).getSolver().getInverse();
            Gradient[] gi = new Gradient[5];
            gi[Spacetime.TT] = mi.getEntry(0, 0);
            gi[Spacetime.TP] = mi.getEntry(0, 3);
            gi[Spacetime.PP] = mi.getEntry(3, 3);
            gi[Spacetime.RR] = mi.getEntry(1, 1);
            gi[Spacetime.HH] = mi.getEntry(2, 2);
            for (int c = 0; c < 5; c++) {
                check(gi[c], inv, c, "inverse " + c + " " + at);
            }
        }
    }

    private static void check(Gradient ref, double[] buf, int c, String what) {
        double scale = Math.abs(ref.getValue());
        assertTrue(Double.isFinite(buf[c]), what);
        assertEquals(ref.getValue(), buf[c], TOL * scale + 1e-300, what + " value");
        double dr = ref.getPartialDerivative(0);
        double dth = ref.getPartialDerivative(1);
        assertEquals(dr, buf[Spacetime.DR + c], TOL * (Math.abs(dr) + scale), what + " d/dr");
        assertEquals(dth, buf[Spacetime.DTH + c], TOL * (Math.abs(dth) + scale), what + " d/dtheta");
    }
}
