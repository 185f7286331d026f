package reprise.chain;

import java.util.Arrays;
import org.apache.commons.rng.UniformRandomProvider;
import reprise.game.Horizon;

/**
 * Draws whole games from the exact chain: the first state from the chain's first-round distribution v_1,
 * each next state from the row of the transition matrix M. It is the exact side's own sampler, for Monte
 * Carlo p-values under the exact model; it never enacts a round's events (that is the simulator's job), so
 * it shares no probability code with {@code sim} and a mistake in either still shows as a disagreement.
 *
 * <p>Tallies follow the simulator's definitions: rounds t &gt; b (the burn-in) are counted by round state;
 * a transition is counted when both its rounds are tallied, on the chain's states (the 4 round states for
 * memory one, the 4^n true histories for longer memories, as {@link MarkovChain#observableTransitionMatrix()});
 * a snapshot at round t records the round state of round t of each game that reaches it (burn-in
 * included). Lengths: fixed ({@link Horizon.Rounds}) or geometric ({@link Horizon.Continuation}: after each
 * round another follows with probability delta, P(L = l) = (1 - delta) delta^(l-1)).
 *
 * <p>Implementation note: each row keeps only its positive entries and their running sums; a draw takes
 * one uniform u in [0, 1) and the first entry whose running sum exceeds u, and the last positive entry
 * takes whatever rounding leaves above its running sum, so no draw falls off the end of a row whose sum
 * is 1 - 1e-16. Cost O(d) per round for d positive entries per row (at most 4 for memory-one players).
 * The sampler is immutable and may be shared by threads; each caller passes its own generator.
 *
 * <p>References:
 * <ul>
 *   <li>Kemeny, J.G. &amp; Snell, J.L. (1960). Finite Markov Chains. Van Nostrand (the chain).</li>
 *   <li>Devroye, L. (1986). Non-Uniform Random Variate Generation. Springer, ch. III.2 (sequential search
 *       for a discrete distribution).</li>
 * </ul>
 */
public final class ChainSampler {

    private final int size;
    private final int[][] columns;
    private final double[][] cumulative;
    private final int[] initialColumns;
    private final double[] initialCumulative;
    private final int[] roundState;

    private ChainSampler(double[][] m, double[] v1, int[] roundState) {
        this.size = m.length;
        this.columns = new int[size][];
        this.cumulative = new double[size][];
        for (int i = 0; i < size; i++) {
            columns[i] = positive(m[i]);
            cumulative[i] = runningSums(m[i], columns[i]);
        }
        this.initialColumns = positive(v1);
        this.initialCumulative = runningSums(v1, initialColumns);
        this.roundState = roundState;
    }

    /**
     * The sampler of a chain.
     *
     * @param chain the exact chain
     * @return the sampler over the chain's states
     */
    public static ChainSampler of(MarkovChain chain) {
        int k = chain.size();
        int[] rs = new int[k];
        for (int s = 0; s < k; s++) {
            rs[s] = chain.roundState(s);
        }
        return new ChainSampler(chain.transitionMatrix(), chain.initialDistribution(), rs);
    }

    /**
     * A sampler of an explicit chain (for tests and for hypotheses given as matrices).
     *
     * @param transition M, k x k, rows probability vectors (sum within 1e-9 of 1)
     * @param initial v_1, the distribution of the state after round 1
     * @param roundState the round state 0..3 of each chain state (for k = 4 usually the identity)
     * @return the sampler
     */
    public static ChainSampler of(double[][] transition, double[] initial, int[] roundState) {
        if (transition == null || transition.length < 1) {
            throw new IllegalArgumentException("transition matrix must have at least 1 row: "
                + (transition == null ? "none" : 0));
        }
        int k = transition.length;
        double[][] m = new double[k][];
        for (int i = 0; i < k; i++) {
            m[i] = checkedDistribution("transition matrix row " + i, transition[i], k);
        }
        double[] v = checkedDistribution("first-round distribution", initial, k);
        if (roundState == null || roundState.length != k) {
            throw new IllegalArgumentException("round-state map must have " + k + " entries: "
                + (roundState == null ? "none" : roundState.length));
        }
        for (int s = 0; s < k; s++) {
            if (roundState[s] < 0 || roundState[s] > 3) {
                throw new IllegalArgumentException("round state of chain state " + s + " must be 0 (CC) to 3 (DD): "
                    + roundState[s]);
            }
        }
        return new ChainSampler(m, v, roundState.clone());
    }

    /** @return the number of chain states k */
    public int size() {
        return size;
    }

    /**
     * The tallies of G games.
     *
     * @param perGameCounts G x 4: each game's tallied rounds by round state CC, CD, DC, DD
     * @param transitions k x k: transitions between chain states, both rounds tallied, summed over games
     * @param snapshotRounds the rounds t_1 .. t_K asked for
     * @param snapshotCounts K x 4: games whose round t_k was in each round state
     */
    public record Sample(long[][] perGameCounts, long[][] transitions, long[] snapshotRounds, long[][] snapshotCounts) {
    }

    /**
     * Draws G independent games.
     *
     * @param rng the generator
     * @param games G &ge; 1
     * @param horizon fixed rounds or a continuation probability
     * @param burnIn b &ge; 0: rounds 1..b are not tallied
     * @param snapshotRounds rounds t &ge; 1 at which to record the round state (may be empty)
     * @return the tallies
     */
    public Sample sample(UniformRandomProvider rng, int games, Horizon horizon, long burnIn, long[] snapshotRounds) {
        if (games < 1) {
            throw new IllegalArgumentException("number of games must be at least 1: " + games);
        }
        if (burnIn < 0) {
            throw new IllegalArgumentException("burn-in must be >= 0: " + burnIn);
        }
        long[] snaps = snapshotRounds == null ? new long[0] : snapshotRounds.clone();
        for (long t : snaps) {
            if (t < 1) {
                throw new IllegalArgumentException("snapshot round must be at least 1: " + t);
            }
        }
        long fixed = horizon instanceof Horizon.Rounds r ? r.count() : -1;
        double delta = horizon instanceof Horizon.Continuation c ? c.probability() : 0;
        long[][] perGame = new long[games][4];
        long[][] transitions = new long[size][size];
        long[][] snapshotCounts = new long[snaps.length][4];
        for (int g = 0; g < games; g++) {
            long[] counts = perGame[g];
            int state = draw(initialColumns, initialCumulative, rng.nextDouble());
            long t = 1;
            while (true) {
                if (t > burnIn) {
                    counts[roundState[state]]++;
                }
                for (int k = 0; k < snaps.length; k++) {
                    if (snaps[k] == t) {
                        snapshotCounts[k][roundState[state]]++;
                    }
                }
                boolean more = fixed > 0 ? t < fixed : rng.nextDouble() < delta;
                if (!more) {
                    break;
                }
                int next = draw(columns[state], cumulative[state], rng.nextDouble());
                t++;
                if (t - 1 > burnIn) {
                    transitions[state][next]++;
                }
                state = next;
            }
        }
        return new Sample(perGame, transitions, snaps, snapshotCounts);
    }

    private static int draw(int[] cols, double[] sums, double u) {
        int last = cols.length - 1;
        for (int i = 0; i < last; i++) {
            if (u < sums[i]) {
                return cols[i];
            }
        }
        return cols[last];
    }

    private static int[] positive(double[] p) {
        int n = 0;
        int[] c = new int[p.length];
        for (int j = 0; j < p.length; j++) {
            if (p[j] > 0) {
                c[n++] = j;
            }
        }
        return Arrays.copyOf(c, n);
    }

    private static double[] runningSums(double[] p, int[] cols) {
        double[] s = new double[cols.length];
        double sum = 0;
        for (int i = 0; i < cols.length; i++) {
            sum += p[cols[i]];
            s[i] = sum;
        }
        return s;
    }

    private static double[] checkedDistribution(String name, double[] p, int k) {
        if (p == null || p.length != k) {
            throw new IllegalArgumentException(name + " must have " + k + " entries: " + (p == null ? "none" : p.length));
        }
        double sum = 0;
        for (int j = 0; j < k; j++) {
            if (!(p[j] >= 0 && p[j] <= 1)) {
                throw new IllegalArgumentException(name + "[" + j + "] must be a probability in [0, 1]: " + p[j]);
            }
            sum += p[j];
        }
        if (!(Math.abs(sum - 1) <= 1e-9)) {
            throw new IllegalArgumentException(name + " must sum to 1: " + sum);
        }
        return p.clone();
    }
}
