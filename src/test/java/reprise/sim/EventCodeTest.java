package reprise.sim;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.math.BigDecimal;
import java.util.stream.DoubleStream;
import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The integer decisions of the two table kernels are the documented events.
 *
 * <p>Literal path: an event of probability p drawn as {@code nextDouble() < p}, i.e. k 2^-53 &lt; p for
 * the top 53 bits k of one {@code nextLong()}, must be exactly k &lt; L with L from
 * {@link LiteralTableKernel#code(double)}, and must take a draw iff 0 &lt; p &lt; 1. Each comparison is
 * checked against k 2^-53 &lt; p computed independently in exact arithmetic (BigDecimal), at the
 * boundary k = L - 1, L and at the ends of the range. Fused path: a player cooperating with
 * probability c cooperates iff its 32-bit uniform u is below T = round(c 2^32), decided in the kernel
 * as limit - u &gt;= 0 with limit = T - 1; checked the same way at u = T - 1, T and at the ends.
 */
class EventCodeTest {
    private static final BigDecimal TWO_TO_53 = new BigDecimal(1L << 53);

    static Stream<Double> probabilities() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(20240607L);
        DoubleStream edges = DoubleStream.of(0, Double.MIN_VALUE, 0x1p-53, 0x1.8p-53, 0x1p-54, 1e-300, 0.05, 0.1,
            0.5, Math.nextDown(1.0), Math.nextDown(Math.nextDown(1.0)), 1 - 0x1p-52, 1);
        return Stream.concat(edges.boxed(), Stream.generate(rng::nextDouble).limit(200));
    }

    @ParameterizedTest
    @MethodSource("probabilities")
    void literalEventIsTheDoubleComparisonAndDrawsOnlyWhenUncertain(double p) {
        long code = LiteralTableKernel.code(p);
        long limit = code >>> 1;
        assertEquals(p > 0 && p < 1, (code & 1) == 1, "draws for p = " + p);
        BigDecimal exact = new BigDecimal(p);
        for (long k : new long[] {0, 1, limit - 1, limit, limit + 1, (1L << 53) - 1}) {
            if (k < 0 || k >= 1L << 53) {
                continue;
            }
            boolean expected = p >= 1 || new BigDecimal(k).divide(TWO_TO_53).compareTo(exact) < 0;
            boolean integer = ((k - limit) >>> 63) == 1;
            assertEquals(expected, integer, "p = " + p + ", k = " + k);
            if ((code & 1) == 1) {
                assertEquals(k * 0x1p-53 < p, integer, "as nextDouble() < p: p = " + p + ", k = " + k);
            }
        }
    }

    @ParameterizedTest
    @MethodSource("probabilities")
    void fusedDecisionIsTheThresholdComparison(double c) {
        long threshold = FusedTables.threshold(c);
        long limit = threshold - 1;
        for (long u : new long[] {0, 1, threshold - 1, threshold, threshold + 1, 0xFFFFFFFFL}) {
            if (u < 0 || u > 0xFFFFFFFFL) {
                continue;
            }
            boolean defects = ((limit - u) >>> 63) == 1;
            assertEquals(u >= threshold, defects, "c = " + c + ", u = " + u);
        }
    }
}
