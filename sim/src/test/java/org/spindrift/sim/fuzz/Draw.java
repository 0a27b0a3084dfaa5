package org.spindrift.sim.fuzz;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.function.Function;
import java.util.stream.Stream;
import org.junit.jupiter.api.Assertions;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.function.ThrowingConsumer;

/**
 * Seeded generated cases for the fuzz tests: a fixed number of draws from a {@link SplittableRandom}
 * with a fixed seed, each run as one named JUnit dynamic test, so every run draws the same cases and a
 * failing one is reproduced from its name (file, mutation or damage, and the seed of the mutation).
 */
final class Draw {
    /** Seed of every fuzz class's draws. */
    static final long SEED = 20261203L;

    private Draw() {
    }

    /**
     * @param tries number of cases
     * @param seed seed of the draws
     * @param draw draws one case (its values only; the work is done by check)
     * @param name the case's display name, enough to reproduce it
     * @param check the test of one case
     * @return the cases, drawn before any runs, each as one dynamic test whose failure message starts
     *     with its name
     */
    static <T> Stream<DynamicTest> cases(int tries, long seed, Function<SplittableRandom, T> draw,
            Function<T, String> name, ThrowingConsumer<T> check) {
        SplittableRandom rnd = new SplittableRandom(seed);
        List<DynamicTest> tests = new ArrayList<>(tries);
        for (int k = 1; k <= tries; k++) {
            T c = draw.apply(rnd);
            String n = "try " + k + "/" + tries + ": " + name.apply(c);
            tests.add(DynamicTest.dynamicTest(n, () -> {
                try {
                    check.accept(c);
                } catch (Exception | AssertionError e) {
                    // the report names dynamic tests by index: the case goes into the message as well
                    Assertions.fail(n + ": " + e.getMessage(), e);
                }
            }));
        }
        return tests.stream();
    }

    /** @return one element, each equally likely */
    static <T> T oneOf(SplittableRandom rnd, List<T> values) {
        return values.get(rnd.nextInt(values.size()));
    }

    /** @return one element, each equally likely */
    @SafeVarargs
    static <T> T oneOf(SplittableRandom rnd, T... values) {
        return values[rnd.nextInt(values.length)];
    }

    /** @return index i with probability weights[i] / sum(weights) */
    static int weighted(SplittableRandom rnd, int... weights) {
        int sum = 0;
        for (int w : weights) {
            sum += w;
        }
        int u = rnd.nextInt(sum);
        for (int i = 0; i < weights.length; i++) {
            u -= weights[i];
            if (u < 0) {
                return i;
            }
        }
        throw new IllegalStateException();
    }

    /** @return null with probability p, else one element, each equally likely */
    @SafeVarargs
    static <T> T oneOfOrNull(SplittableRandom rnd, double p, T... values) {
        return rnd.nextDouble() < p ? null : values[rnd.nextInt(values.length)];
    }
}
