package reprise.sim;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;

/**
 * The exact integer tallies of a set of simulated games, with everything derived from them.
 *
 * <p>All states are from X's view in the order CC, CD, DC, DD (index 2 xDefects + yDefects). "Tallied"
 * rounds are those after the burn-in. Results over disjoint replicate ranges of the same configuration
 * and seed combine with {@link #merge(SimulationResult)}; since every tally is an integer, the merged
 * result is bit-identical to a single run over the union, whatever the order, the chunking or the
 * number of threads.
 *
 * <p>Per-game sufficient statistics: for game g let N_s be its tallied rounds in state s and
 * L = sum_s N_s its tallied length. The result holds sum_g N_s ({@link #stateCounts()}),
 * sum_g N_s N_r, sum_g L N_s, sum_g L ({@link #roundsTotal()}) and sum_g L^2. A per-game payoff total is
 * sum_s N_s u_s, so its first two moments, and those of any linear function of the state counts, follow
 * exactly from these sums.
 */
public final class SimulationResult {

    /**
     * A half-open range [from, to) of replicate indexes.
     *
     * @param from first index
     * @param to one past the last index
     */
    public record ReplicateRange(long from, long to) {
        /**
         * Validates the range.
         *
         * @param from first index, at least 0
         * @param to greater than from
         */
        public ReplicateRange {
            if (!(from >= 0 && to > from)) {
                throw new IllegalArgumentException("replicate range must satisfy 0 <= from < to: [" + from + ", "
                    + to + ")");
            }
        }
    }

    private final String configuration;
    private final long seed;
    private final boolean fastPath;
    private final double[] payoffX;
    private final double[] payoffY;
    private final List<ReplicateRange> ranges;
    private final Accumulator acc;

    SimulationResult(String configuration, long seed, boolean fastPath, double[] payoffX, double[] payoffY,
        List<ReplicateRange> ranges, Accumulator acc) {
        this.configuration = configuration;
        this.seed = seed;
        this.fastPath = fastPath;
        this.payoffX = payoffX.clone();
        this.payoffY = payoffY.clone();
        this.ranges = List.copyOf(ranges);
        this.acc = acc;
    }

    /**
     * Combines the results of two disjoint replicate sets of the same run configuration.
     *
     * @param other a result with the same configuration and seed
     * @return the result over both sets
     * @throws IllegalArgumentException if configurations or seeds differ or the replicate ranges overlap
     */
    public SimulationResult merge(SimulationResult other) {
        if (!configuration.equals(other.configuration) || fastPath != other.fastPath) {
            throw new IllegalArgumentException("cannot merge results of different runs: '" + configuration
                + "' and '" + other.configuration + "'");
        }
        if (seed != other.seed) {
            throw new IllegalArgumentException("cannot merge results with different seeds: " + seed + " and "
                + other.seed);
        }
        List<ReplicateRange> all = new ArrayList<>(ranges);
        all.addAll(other.ranges);
        all.sort(Comparator.comparingLong(ReplicateRange::from));
        List<ReplicateRange> merged = new ArrayList<>();
        for (ReplicateRange r : all) {
            if (!merged.isEmpty()) {
                ReplicateRange last = merged.get(merged.size() - 1);
                if (r.from() < last.to()) {
                    throw new IllegalArgumentException("cannot merge overlapping replicate ranges: [" + last.from()
                        + ", " + last.to() + ") and [" + r.from() + ", " + r.to() + ")");
                }
                if (r.from() == last.to()) {
                    merged.set(merged.size() - 1, new ReplicateRange(last.from(), r.to()));
                    continue;
                }
            }
            merged.add(r);
        }
        Accumulator sum = copy(acc);
        sum.merge(other.acc);
        return new SimulationResult(configuration, seed, fastPath, payoffX, payoffY, merged, sum);
    }

    Accumulator accumulator() {
        return acc;
    }

    double[] payoffVector(boolean x) {
        return (x ? payoffX : payoffY).clone();
    }

    private static Accumulator copy(Accumulator a) {
        Accumulator c = new Accumulator(a.historyMemory, a.snapshotRounds, a.timeRounds);
        c.merge(a);
        return c;
    }

    /** @return a text that identifies the run's configuration (match, noise, horizon, burn-in, requests) */
    public String configuration() {
        return configuration;
    }

    /** @return the master seed */
    public long seed() {
        return seed;
    }

    /** @return the generator of every replicate stream, as a Commons RNG RandomSource name */
    public String generator() {
        return Simulator.GENERATOR;
    }

    /** @return whether the fused memory-one path made the draws (otherwise the literal path) */
    public boolean fastPath() {
        return fastPath;
    }

    /** @return the replicate ranges covered, sorted and coalesced */
    public List<ReplicateRange> replicateRanges() {
        return ranges;
    }

    /** @return the number of games */
    public long replicates() {
        return acc.games;
    }

    /** @return the number of games with at least one tallied round (longer than the burn-in) */
    public long gamesTallied() {
        return acc.gamesTallied;
    }

    /** @return tallied rounds over all games, sum_g L */
    public long roundsTotal() {
        return acc.talliedSum;
    }

    /** @return tallied rounds per state, long[4] in the order CC, CD, DC, DD; equals sum_g N_s */
    public long[] stateCounts() {
        return acc.states.clone();
    }

    /**
     * Round-to-round transitions within games, both rounds tallied.
     *
     * @return long[4][4], row = state of round t - 1, column = state of round t
     */
    public long[][] transitionCounts() {
        long[][] m = new long[4][4];
        for (int h = 0; h < acc.historySize; h++) {
            for (int s = 0; s < 4; s++) {
                m[h & 3][s] += acc.steps[4 * h + s];
            }
        }
        return m;
    }

    /**
     * @return n, the memory of the true-history tallies: the longest memory of the two players' lookup
     *     tables (1 when neither is a table)
     */
    public int historyMemory() {
        return acc.historyMemory;
    }

    /**
     * Transitions of the true n-round history (X's view, pre-game rounds CC), both rounds tallied.
     * A history index is laid out like a strategy table: s_t + 4 s_{t-1} + 16 s_{t-2}.
     *
     * @return long[4^n][4^n], row = history after round t - 1, column = history after round t (only
     *     the 4 columns reachable from a row can be non-zero)
     */
    public long[][] historyTransitionCounts() {
        int size = acc.historySize;
        long[][] m = new long[size][size];
        for (int h = 0; h < size; h++) {
            for (int s = 0; s < 4; s++) {
                m[h][((h << 2) | s) & (size - 1)] += acc.steps[4 * h + s];
            }
        }
        return m;
    }

    /** @return X's total payoff over tallied rounds, sum_s N_s u_X(s), correctly rounded from exact arithmetic */
    public double payoffTotalX() {
        return total(payoffX).doubleValue();
    }

    /** @return Y's total payoff over tallied rounds, correctly rounded from exact arithmetic */
    public double payoffTotalY() {
        return total(payoffY).doubleValue();
    }

    /** @return X's payoff per tallied round, sum_g total / sum_g L (NaN without tallied rounds) */
    public double meanPayoffX() {
        return mean(payoffX);
    }

    /** @return Y's payoff per tallied round (NaN without tallied rounds) */
    public double meanPayoffY() {
        return mean(payoffY);
    }

    private BigDecimal total(double[] u) {
        BigDecimal t = BigDecimal.ZERO;
        for (int s = 0; s < 4; s++) {
            t = t.add(new BigDecimal(u[s]).multiply(BigDecimal.valueOf(acc.states[s])));
        }
        return t;
    }

    private double mean(double[] u) {
        if (acc.talliedSum == 0) {
            return Double.NaN;
        }
        return total(u).divide(BigDecimal.valueOf(acc.talliedSum), MathContext.DECIMAL128).doubleValue();
    }

    /** @return the snapshot rounds t_1 &lt; t_2 &lt; ... */
    public long[] snapshotRounds() {
        return acc.snapshotRounds.clone();
    }

    /** @return long[k][4]: games whose round t_k was in state CC, CD, DC, DD */
    public long[][] snapshotCounts() {
        return rows(acc.snapshotCounts, acc.snapshotRounds.length);
    }

    /** @return long[k]: games that reached round t_k (the row sums of {@link #snapshotCounts()}) */
    public long[] snapshotReached() {
        long[] r = new long[acc.snapshotRounds.length];
        for (int k = 0; k < r.length; k++) {
            for (int s = 0; s < 4; s++) {
                r[k] += acc.snapshotCounts[4 * k + s];
            }
        }
        return r;
    }

    /** @return long[T][4]: row t - 1 counts the games whose round t was in each state (burn-in included) */
    public long[][] timeResolvedCounts() {
        return rows(acc.timeCounts, acc.timeRounds);
    }

    private static long[][] rows(long[] flat, int k) {
        long[][] m = new long[k][];
        for (int i = 0; i < k; i++) {
            m[i] = Arrays.copyOfRange(flat, 4 * i, 4 * i + 4);
        }
        return m;
    }

    /** @return BigInteger[4][4]: sum over games of N_s N_r */
    public BigInteger[][] sumOfStateCountProducts() {
        BigInteger[][] m = new BigInteger[4][4];
        for (int s = 0; s < 4; s++) {
            for (int r = 0; r < 4; r++) {
                m[s][r] = Wide.value(acc.productSums, 4 * s + r);
            }
        }
        return m;
    }

    /** @return BigInteger[4]: sum over games of L N_s */
    public BigInteger[] sumOfLengthTimesStateCounts() {
        BigInteger[] v = new BigInteger[4];
        for (int s = 0; s < 4; s++) {
            v[s] = Wide.value(acc.lengthStateSums, s);
        }
        return v;
    }

    /** @return sum over games of L (the same as {@link #roundsTotal()}) */
    public long sumOfTalliedLengths() {
        return acc.talliedSum;
    }

    /** @return sum over games of L^2 */
    public BigInteger sumOfSquaredTalliedLengths() {
        return Wide.value(acc.talliedSquares, 0);
    }

    /** @return the number of rounds played, burn-in included: sum over games of N */
    public long lengthSum() {
        return acc.lengthSum;
    }

    /** @return sum over games of N^2 (played lengths) */
    public BigInteger lengthSumOfSquares() {
        return Wide.value(acc.lengthSquares, 0);
    }

    /** @return the shortest played game */
    public long lengthMin() {
        return acc.lengthMin;
    }

    /** @return the longest played game */
    public long lengthMax() {
        return acc.lengthMax;
    }

    @Override
    public boolean equals(Object o) {
        if (!(o instanceof SimulationResult r)) {
            return false;
        }
        Accumulator a = acc;
        Accumulator b = r.acc;
        return configuration.equals(r.configuration) && seed == r.seed && fastPath == r.fastPath
            && ranges.equals(r.ranges) && a.games == b.games && a.gamesTallied == b.gamesTallied
            && a.lengthSum == b.lengthSum && a.lengthMin == b.lengthMin && a.lengthMax == b.lengthMax
            && a.talliedSum == b.talliedSum && Arrays.equals(a.states, b.states) && Arrays.equals(a.steps, b.steps)
            && Arrays.equals(a.snapshotCounts, b.snapshotCounts) && Arrays.equals(a.timeCounts, b.timeCounts)
            && Arrays.equals(a.lengthSquares, b.lengthSquares) && Arrays.equals(a.talliedSquares, b.talliedSquares)
            && Arrays.equals(a.productSums, b.productSums) && Arrays.equals(a.lengthStateSums, b.lengthStateSums);
    }

    @Override
    public int hashCode() {
        return Objects.hash(configuration, seed, ranges, Arrays.hashCode(acc.states), Arrays.hashCode(acc.steps));
    }

    @Override
    public String toString() {
        return "SimulationResult[" + configuration + ", seed=" + seed + ", games=" + acc.games + ", rounds="
            + acc.talliedSum + ", states=" + Arrays.toString(acc.states) + "]";
    }
}
