package reprise.stats;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.apache.commons.statistics.inference.ChiSquareTest;

/**
 * Test of the state at one round t across G independent games against a given distribution (for
 * example the exact distribution of the state at round t from the exact engine). The G states are
 * independent draws, so this is an ordinary multinomial goodness-of-fit test.
 *
 * <p><b>Rule.</b> Cells with hypothesised probability 0 and count 0 are removed; a positive count in a
 * cell of probability 0 makes the hypothesis impossible (p = 0, with a note). If every remaining expected
 * count G p_j is at least {@code minimumExpected} (default 5, Cochran's common rule) the Pearson
 * chi-square with k - 1 degrees of freedom is used (Commons Statistics {@link ChiSquareTest}). Otherwise an
 * exact multinomial test is used: p = the total probability of all outcomes that are no more likely than
 * the observed one (ties within a relative 1e-7, common practice, to absorb rounding), enumerated over all
 * C(G + k - 1, k - 1) compositions of G into k cells when that number is at most the enumeration limit
 * (default 5,000,000; about G = 300 for 4 cells). Beyond it the same p-value is estimated by Monte Carlo
 * with a caller-supplied generator: M multinomial samples, p = (1 + #{samples no more likely}) / (M + 1),
 * which is a valid (slightly conservative) p-value for any M.
 *
 * <p>The reported statistic is always Pearson's X^2, for information, even when the p-value is exact.
 *
 * <p>References:
 * <ul>
 *   <li>Pearson, K. (1900). On the criterion that a given system of deviations from the probable in the
 *       case of a correlated system of variables is such that it can be reasonably supposed to have
 *       arisen from random sampling. Philosophical Magazine Series 5, 50, 157-175.</li>
 *   <li>Cochran, W.G. (1954). Some methods for strengthening the common chi-square tests. Biometrics 10,
 *       417-451 (the expected-count rule).</li>
 *   <li>Davison, A.C. &amp; Hinkley, D.V. (1997). Bootstrap Methods and their Application. Cambridge
 *       University Press, ch. 4 (Monte Carlo p-value (1 + #)/(M + 1)).</li>
 * </ul>
 */
public final class SnapshotTest {

    private static final double TIE_TOLERANCE = Math.log1p(1e-7);

    private final double minimumExpected;
    private final long enumerationLimit;
    private final UniformRandomProvider rng;
    private final int samples;

    private SnapshotTest(double minimumExpected, long enumerationLimit, UniformRandomProvider rng, int samples) {
        this.minimumExpected = minimumExpected;
        this.enumerationLimit = enumerationLimit;
        this.rng = rng;
        this.samples = samples;
    }

    /** @return the test with minimum expected count 5, enumeration limit 5,000,000, no Monte Carlo generator */
    public static SnapshotTest withDefaults() {
        return new SnapshotTest(5, 5_000_000, null, 100_000);
    }

    /**
     * @param minimum the expected count below which the exact test is used, &ge; 0 (0: always Pearson)
     * @return the configured test
     */
    public SnapshotTest withMinimumExpected(double minimum) {
        return new SnapshotTest(Checks.nonNegative("minimum expected count", minimum), enumerationLimit, rng, samples);
    }

    /**
     * @param limit the largest number of compositions to enumerate, &ge; 1
     * @return the configured test
     */
    public SnapshotTest withEnumerationLimit(long limit) {
        if (limit < 1) {
            throw new IllegalArgumentException("enumeration limit must be at least 1: " + limit);
        }
        return new SnapshotTest(minimumExpected, limit, rng, samples);
    }

    /**
     * Enables the Monte Carlo fallback.
     *
     * @param generator the source of randomness (seeded by the caller for reproducibility)
     * @param sampleCount M, the number of simulated tables, at least 1
     * @return the configured test
     */
    public SnapshotTest withMonteCarlo(UniformRandomProvider generator, int sampleCount) {
        if (generator == null) {
            throw new IllegalArgumentException("Monte Carlo generator must not be null");
        }
        if (sampleCount < 1) {
            throw new IllegalArgumentException("number of Monte Carlo samples must be at least 1: " + sampleCount);
        }
        return new SnapshotTest(minimumExpected, enumerationLimit, generator, sampleCount);
    }

    /**
     * Pearson's X^2 = sum_j (n_j - G p_j)^2 / (G p_j) over cells with p_j &gt; 0.
     *
     * @param counts the number of games in each state at round t (order CC, CD, DC, DD for 4 states)
     * @param probabilities the hypothesised distribution of that state (same order, sums to 1)
     * @return X^2, +infinity if a count falls in a cell of probability 0
     */
    public double statistic(long[] counts, double[] probabilities) {
        Cells c = cells(counts, probabilities);
        return c == null ? Double.POSITIVE_INFINITY : pearson(c);
    }

    /**
     * The test with the rule of the class description.
     *
     * @param counts games per state at round t, k &ge; 2 entries, total G &ge; 1
     * @param probabilities the hypothesised distribution, same order
     * @return statistic X^2, degrees of freedom k - 1, p-value, note naming the method used
     * @throws IllegalStateException if the Monte Carlo fallback is needed but no generator was given
     */
    public TestResult test(long[] counts, double[] probabilities) {
        Cells c = cells(counts, probabilities);
        if (c == null) {
            return TestResult.impossible(counts.length - 1,
                "a positive count in a state of hypothesised probability 0: the hypothesis is impossible");
        }
        int k = c.n.length;
        if (k < 2) {
            return new TestResult(0, 0, 1, "only one possible state: p = 1");
        }
        boolean small = false;
        for (double p : c.p) {
            small |= c.total * p < minimumExpected;
        }
        if (!small) {
            double[] expected = new double[k];
            for (int j = 0; j < k; j++) {
                expected[j] = c.total * c.p[j];
            }
            return new TestResult(pearson(c), k - 1,
                ChiSquareTest.withDefaults().test(expected, c.n).getPValue(), "Pearson chi-square");
        }
        return exact(c);
    }

    /**
     * The exact multinomial test regardless of expected counts (enumeration or Monte Carlo as in the class
     * description).
     *
     * @param counts games per state, k &ge; 2 entries
     * @param probabilities the hypothesised distribution
     * @return the result; the note says whether it was enumerated or simulated
     */
    public TestResult exactTest(long[] counts, double[] probabilities) {
        Cells c = cells(counts, probabilities);
        if (c == null) {
            return TestResult.impossible(counts.length - 1,
                "a positive count in a state of hypothesised probability 0: the hypothesis is impossible");
        }
        if (c.n.length < 2) {
            return new TestResult(0, 0, 1, "only one possible state: p = 1");
        }
        return exact(c);
    }

    private TestResult exact(Cells c) {
        int k = c.n.length;
        double compositions = 1;
        for (int j = 1; j < k; j++) {
            compositions = compositions * (c.total + j) / j;
        }
        double[] logP = new double[k];
        for (int j = 0; j < k; j++) {
            logP[j] = Math.log(c.p[j]);
        }
        if (compositions <= enumerationLimit) {
            double[] logFactorial = new double[(int) c.total + 1];
            for (int i = 2; i <= c.total; i++) {
                logFactorial[i] = logFactorial[i - 1] + Math.log(i);
            }
            double observed = logProbability(c.n, logP, logFactorial);
            double p = enumerate(0, k, c.total, 0, logP, logFactorial, logFactorial[(int) c.total],
                observed + TIE_TOLERANCE);
            return new TestResult(pearson(c), k - 1, Math.min(1, p), String.format(Locale.ROOT,
                "exact multinomial test, %d outcomes enumerated (an expected count is below %s)",
                (long) compositions, minimumExpected), TestResult.SmallSample.EXACT);
        }
        if (rng == null) {
            throw new IllegalStateException(String.format(Locale.ROOT, "exact test needs %.3g compositions, above "
                + "the enumeration limit %d; configure withMonteCarlo(generator, samples)", compositions,
                enumerationLimit));
        }
        List<java.util.Map<Long, MemoBinomial>> memo = new ArrayList<>();
        for (int j = 0; j < k; j++) {
            memo.add(new java.util.HashMap<>());
        }
        double observed = sample(c, c.n.clone(), false, memo);
        long[] draw = new long[k];
        long noMoreLikely = 0;
        for (int m = 0; m < samples; m++) {
            if (sample(c, draw, true, memo) <= observed + TIE_TOLERANCE) {
                noMoreLikely++;
            }
        }
        double p = (1.0 + noMoreLikely) / (samples + 1.0);
        return new TestResult(pearson(c), k - 1, p, String.format(Locale.ROOT,
            "Monte Carlo multinomial test, %d samples, p = (1 + %d)/(M + 1)", samples, noMoreLikely),
            TestResult.SmallSample.MONTE_CARLO);
    }

    /**
     * Sums exp(log-probability) over the compositions with the first j cells fixed, whose partial
     * log-probability (cells 0 to j - 1, accumulated in cell order exactly as
     * {@link #logProbability} does) is {@code prefix}; carrying it down keeps every floating-point
     * operation, and so every bit of the sum, the same as recomputing each leaf from scratch.
     */
    private static double enumerate(int j, int k, long remaining, double prefix, double[] logP, double[] logFactorial,
        double logTotalFactorial, double bound) {
        if (j == k - 1) {
            double lp = prefix - logFactorial[(int) remaining];
            if (remaining > 0) {
                lp += remaining * logP[j];
            }
            lp += logTotalFactorial;
            return lp <= bound ? Math.exp(lp) : 0;
        }
        double sum = 0;
        double logPj = logP[j];
        for (long v = 0; v <= remaining; v++) {
            double lp = prefix - logFactorial[(int) v];
            if (v > 0) {
                lp += v * logPj;
            }
            sum += enumerate(j + 1, k, remaining - v, lp, logP, logFactorial, logTotalFactorial, bound);
        }
        return sum;
    }

    private static double logProbability(long[] x, double[] logP, double[] logFactorial) {
        long total = 0;
        double lp = 0;
        for (int j = 0; j < x.length; j++) {
            total += x[j];
            lp -= logFactorial[(int) x[j]];
            if (x[j] > 0) {
                lp += x[j] * logP[j];
            }
        }
        return lp + logFactorial[(int) total];
    }

    /**
     * A multinomial draw by successive conditional binomials; returns its log-probability, computed by
     * the same chain rule (the library's binomial log-probabilities, accurate for any count). Each
     * binomial draw is the inversion of one uniform, as the library's sampler does; see
     * {@link MemoBinomial}.
     */
    private double sample(Cells c, long[] out, boolean draw, List<java.util.Map<Long, MemoBinomial>> memo) {
        long remaining = c.total;
        double mass = 1;
        double logProbability = 0;
        int k = c.n.length;
        for (int j = 0; j < k - 1; j++) {
            long v = draw ? 0 : out[j];
            if (remaining > 0) {
                double q = Math.min(1, c.p[j] / Math.max(mass, c.p[j]));
                long n = remaining;
                MemoBinomial b = memo.get(j).computeIfAbsent(n, m -> new MemoBinomial((int) (long) m, q));
                if (draw) {
                    v = b.inverseCumulativeProbability(rng.nextDouble());
                }
                logProbability += b.logProbability((int) v);
            }
            out[j] = v;
            remaining -= v;
            mass -= c.p[j];
        }
        out[k - 1] = remaining;
        return logProbability;
    }

    /**
     * One binomial distribution of the Monte Carlo draws with its cumulative and log-probabilities
     * remembered, since the same few values are asked for in every one of the M draws.
     *
     * <p>Implementation note: the library's sampler ({@code BinomialDistribution.createSampler}) is
     * inversion of {@code rng.nextDouble()} by {@code inverseCumulativeProbability}, which brackets the
     * answer with Chebyshev's inequality and bisects on the library's cumulative probability. The
     * method below repeats that search step by step (same bracket arithmetic, same comparisons) and only
     * looks the cumulative probabilities up in a table instead of recomputing them, so every draw, and
     * so every p-value, is bit for bit what the library's sampler gives; SnapshotTestTest compares the
     * two over many uniforms.
     */
    static final class MemoBinomial {
        private final BinomialDistribution distribution;
        private final int lower;
        private final int upper;
        private final double mean;
        private final double sd;
        private final java.util.Map<Integer, Double> cumulative = new java.util.HashMap<>();
        private final java.util.Map<Integer, Double> logProbabilities = new java.util.HashMap<>();

        MemoBinomial(int trials, double probability) {
            distribution = BinomialDistribution.of(trials, probability);
            lower = distribution.getSupportLowerBound();
            upper = distribution.getSupportUpperBound();
            mean = distribution.getMean();
            sd = Math.sqrt(distribution.getVariance());
        }

        double logProbability(int x) {
            return logProbabilities.computeIfAbsent(x, distribution::logProbability);
        }

        private int compare(int x, double p) {
            return Double.compare(cumulative.computeIfAbsent(x, distribution::cumulativeProbability), p);
        }

        /** The library's {@code inverseCumulativeProbability(p)} for p in [0, 1). */
        int inverseCumulativeProbability(double p) {
            double q = 1 - p;
            int lo = lower;
            if (p == 0) {
                return lo;
            }
            int hi = upper;
            if (q == 0) {
                return hi;
            }
            if (lo == Integer.MIN_VALUE) {
                if (compare(lo, p) >= 0) {
                    return lo;
                }
            } else {
                lo -= 1;
            }
            if (Double.isFinite(mean) && sd > 0 && sd < Double.POSITIVE_INFINITY) {
                double tmp = mean - sd * Math.sqrt(q / p);
                if (tmp > lo) {
                    lo = ((int) Math.ceil(tmp)) - 1;
                }
                tmp = mean + sd * Math.sqrt(p / q);
                if (tmp < hi) {
                    hi = ((int) Math.ceil(tmp)) - 1;
                }
            }
            long a = lo;
            long b = hi;
            while (a + 1 < b) {
                long mid = (a + b) / 2;
                if (compare((int) mid, p) < 0) {
                    a = mid;
                } else {
                    b = mid;
                }
            }
            return (int) b;
        }
    }

    private static double pearson(Cells c) {
        double sum = 0;
        for (int j = 0; j < c.n.length; j++) {
            double e = c.total * c.p[j];
            double d = c.n[j] - e;
            sum += d * d / e;
        }
        return sum;
    }

    /** The cells with positive probability, or null if a count falls in a zero-probability cell. */
    private static Cells cells(long[] counts, double[] probabilities) {
        long[] n = Checks.counts("snapshot counts", counts, -1);
        double[] p = Checks.distribution("snapshot probabilities", probabilities, n.length);
        if (n.length < 2) {
            throw new IllegalArgumentException("snapshot test needs at least 2 states: " + n.length);
        }
        List<Integer> keep = new ArrayList<>();
        long total = 0;
        for (int j = 0; j < n.length; j++) {
            total += n[j];
            if (p[j] > 0) {
                keep.add(j);
            } else if (n[j] > 0) {
                return null;
            }
        }
        if (total < 1) {
            throw new IllegalArgumentException("snapshot counts must add up to at least 1 game: " + total);
        }
        if (total > Integer.MAX_VALUE) {
            throw new IllegalArgumentException("snapshot counts must add up to at most " + Integer.MAX_VALUE
                + " games: " + total);
        }
        long[] kn = new long[keep.size()];
        double[] kp = new double[keep.size()];
        double sum = 0;
        for (int a = 0; a < kn.length; a++) {
            kn[a] = n[keep.get(a)];
            kp[a] = p[keep.get(a)];
            sum += kp[a];
        }
        for (int a = 0; a < kp.length; a++) {
            kp[a] /= sum;
        }
        return new Cells(kn, kp, total);
    }

    private record Cells(long[] n, double[] p, long total) {
    }
}
