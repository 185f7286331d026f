package reprise.chain;

import reprise.game.Horizon;
import reprise.game.State;

/**
 * Expected frequencies of the 4 round states (CC, CD, DC, DD from X's view) over a finite or random
 * horizon.
 *
 * <ul>
 *   <li>Rounds [from, to]: f = (1/L) sum_{t=from..to} P(round t is in state s), L = to - from + 1; with
 *       from = 1 this is f_n = (1/n) sum_{t=1..n} v_t.</li>
 *   <li>Continuation delta after a burn-in of b rounds: f = (1 - delta) sum_{t&gt;b} delta^(t-1-b) v_t
 *       = (1 - delta) v_{b+1} (I - delta M)^-1. This equals E[counts of rounds after b] / E[number of
 *       such rounds] for a game whose length is geometric with P(another round) = delta; it is not the
 *       mean of per-game frequencies E[count / length].</li>
 * </ul>
 *
 * <p>Implementation note. Finite sums use doubling on sums of matrix powers, S(2m) = S(m) + M^m S(m),
 * over the binary digits of L: O(k^3 log L) work, no loop over rounds, and since every term is a
 * non-negative product the result has relative error about k log2(L) 2^-53 (below 1e-12 for L = 10^9
 * and 4 states). The discounted sum is the stationary distribution of the restart chain
 * delta M + (1 - delta) 1 v_{b+1}, computed by GTH on the states reachable from v_{b+1}: again no
 * subtraction, so it stays accurate as delta approaches 1.
 *
 * <p>References:
 * Grassmann, W.K., Taksar, M.I. &amp; Heyman, D.P. (1985). Regenerative analysis and steady state
 * distributions for Markov chains. Operations Research 33(5), 1107-1116.
 */
public final class Frequencies {
    private Frequencies() {
    }

    /**
     * Expected frequencies for a horizon, counting all rounds.
     *
     * @param chain the chain
     * @param horizon rounds(n) or continuation(delta)
     * @return 4 frequencies CC, CD, DC, DD summing to 1
     */
    public static double[] of(MarkovChain chain, Horizon horizon) {
        if (horizon instanceof Horizon.Rounds r) {
            return rounds(chain, 1, r.count());
        }
        return continuation(chain, ((Horizon.Continuation) horizon).probability(), 0);
    }

    /**
     * Expected frequencies over rounds from..to of one game.
     *
     * @param chain the chain
     * @param from first counted round, at least 1
     * @param to last counted round, at least from
     * @return 4 frequencies CC, CD, DC, DD
     */
    public static double[] rounds(MarkovChain chain, long from, long to) {
        checkWindow(from, to);
        double[] counts = expectedCounts(chain, chain.distributionAt(from), to - from + 1);
        double length = to - from + 1;
        for (int s = 0; s < counts.length; s++) {
            counts[s] /= length;
        }
        return counts;
    }

    /**
     * Expected counts of the 4 round states over rounds from..to.
     *
     * @param chain the chain
     * @param from first counted round, at least 1
     * @param to last counted round, at least from
     * @return 4 expected counts CC, CD, DC, DD, summing to to - from + 1
     */
    public static double[] expectedCounts(MarkovChain chain, long from, long to) {
        checkWindow(from, to);
        return expectedCounts(chain, chain.distributionAt(from), to - from + 1);
    }

    static void checkWindow(long from, long to) {
        if (from < 1) {
            throw new IllegalArgumentException("first counted round must be at least 1: " + from);
        }
        if (to < from) {
            throw new IllegalArgumentException("last counted round must be at least the first (" + from + "): " + to);
        }
    }

    /** v S(L) F: expected counts of round states over L rounds starting from chain distribution v. */
    static double[] expectedCounts(MarkovChain chain, double[] v, long length) {
        double[][] m = chain.matrix();
        int k = m.length;
        int[] round = chain.roundStates();
        double[][] p = m;
        double[][] sf = new double[k][State.COUNT];
        for (int i = 0; i < k; i++) {
            sf[i][round[i]] = 1;
        }
        double[] mu = v.clone();
        double[] acc = new double[State.COUNT];
        long rest = length;
        while (true) {
            if ((rest & 1) == 1) {
                Dense.addTo(acc, Dense.multiply(mu, sf));
                mu = Dense.multiply(mu, p);
            }
            rest >>= 1;
            if (rest == 0) {
                return acc;
            }
            sf = Dense.add(sf, Dense.multiply(p, sf));
            p = Dense.squareStochastic(p);
        }
    }

    /**
     * Normalised discounted frequencies of the rounds after a burn-in.
     *
     * @param chain the chain
     * @param delta continuation probability in [0, 1)
     * @param burnIn rounds left out of the tallies, b &ge; 0
     * @return 4 frequencies CC, CD, DC, DD: (1 - delta) v_{b+1} (I - delta M)^-1 projected
     */
    public static double[] continuation(MarkovChain chain, double delta, long burnIn) {
        checkDelta(delta);
        if (burnIn < 0) {
            throw new IllegalArgumentException("burn-in must be at least 0 rounds: " + burnIn);
        }
        return chain.project(discounted(chain.matrix(), chain.distributionAt(burnIn + 1), delta));
    }

    static void checkDelta(double delta) {
        if (!(delta >= 0 && delta < 1)) {
            throw new IllegalArgumentException("continuation probability must be in [0, 1): " + delta);
        }
    }

    /** (1 - delta) v (I - delta M)^-1 as the GTH stationary distribution of the restart chain. */
    static double[] discounted(double[][] m, double[] v, double delta) {
        int k = m.length;
        boolean[] reach = new boolean[k];
        java.util.ArrayDeque<Integer> queue = new java.util.ArrayDeque<>();
        for (int i = 0; i < k; i++) {
            if (v[i] > 0) {
                reach[i] = true;
                queue.add(i);
            }
        }
        while (!queue.isEmpty()) {
            int u = queue.poll();
            for (int w = 0; w < k; w++) {
                if (m[u][w] > 0 && !reach[w]) {
                    reach[w] = true;
                    queue.add(w);
                }
            }
        }
        int[] idx = java.util.stream.IntStream.range(0, k).filter(i -> reach[i]).toArray();
        int r = idx.length;
        double[][] sub = new double[r][r];
        double total = 0;
        for (int b : idx) {
            total += v[b];
        }
        for (int a = 0; a < r; a++) {
            for (int b = 0; b < r; b++) {
                sub[a][b] = delta * m[idx[a]][idx[b]] + (1 - delta) * v[idx[b]] / total;
            }
        }
        double[] pi = r == 1 ? new double[] {1} : Gth.stationary(sub);
        double[] out = new double[k];
        for (int a = 0; a < r; a++) {
            out[idx[a]] = pi[a];
        }
        return out;
    }
}
