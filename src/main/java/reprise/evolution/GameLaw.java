package reprise.evolution;

import reprise.chain.MarkovChain;
import reprise.game.Horizon;
import reprise.game.State;

/**
 * The exact law of an accumulated lattice payoff over one game, from the game's Markov chain.
 *
 * <p>Implementation note. The joint law of (chain state, accumulated payoff in lattice steps) is pushed
 * forward round by round: after round 1 it is v_1(s) at step k(s); one round moves mass m at (s, a) to
 * (s', a + k(s')) with weight m M[s][s']. A fixed horizon of n rounds reads the marginal after round n.
 * With continuation probability delta the game lasts t rounds with probability (1 - delta) delta^(t-1);
 * the marginals are mixed with these weights up to round T and the remaining mass delta^T is left out
 * ({@link #missing}), a bound on the total-variation error of the returned law. All weights are
 * non-negative, so the relative rounding error of each probability is a few units of 2^-53 per round.
 *
 * @param lowest the step value of index 0
 * @param probability probability[j] = P(total = lowest + j)
 * @param missing the probability mass left out by truncation (0 for a fixed horizon)
 */
record GameLaw(int lowest, double[] probability, double missing) {

    /** The rounds a truncated continuation game keeps so that delta^T &le; tolerance. */
    static long truncation(Horizon horizon, double tolerance) {
        if (horizon instanceof Horizon.Rounds r) {
            return r.count();
        }
        double delta = ((Horizon.Continuation) horizon).probability();
        if (delta == 0) {
            return 1;
        }
        return Math.max(1, (long) Math.ceil(Math.log(tolerance) / Math.log(delta)));
    }

    /**
     * The law of sum_t k(roundState_t) over one game.
     *
     * @param chain the game's chain
     * @param stepOfRoundState k for CC, CD, DC, DD (X's view)
     * @param horizon fixed rounds or continuation
     * @param rounds T: n for fixed rounds, the truncation for continuation
     * @return the law
     */
    static GameLaw of(MarkovChain chain, int[] stepOfRoundState, Horizon horizon, long rounds) {
        int states = chain.size();
        int[] inc = new int[states];
        int kmin = Integer.MAX_VALUE;
        int kmax = Integer.MIN_VALUE;
        for (int s = 0; s < states; s++) {
            inc[s] = stepOfRoundState[chain.roundState(s)];
            kmin = Math.min(kmin, inc[s]);
            kmax = Math.max(kmax, inc[s]);
        }
        long loL = Math.min(kmin, rounds * kmin);
        long hiL = Math.max(kmax, rounds * kmax);
        if (hiL - loL + 1 > (1 << 24)) {
            throw new IllegalArgumentException("the payoff lattice of one game is too large for the exact law: "
                + (hiL - loL + 1) + " points (more than 2^24)");
        }
        int lo = (int) loL;
        int width = (int) (hiL - loL + 1);
        double[][] m = chain.transitionMatrix();
        double[] init = chain.initialDistribution();
        double[][] cur = new double[states][width];
        double[][] next = new double[states][width];
        for (int s = 0; s < states; s++) {
            cur[s][inc[s] - lo] = init[s];
        }
        double[] out = new double[width];
        boolean continuation = horizon instanceof Horizon.Continuation;
        double delta = continuation ? ((Horizon.Continuation) horizon).probability() : 0;
        double weight = 1 - delta;
        for (long t = 1; t <= rounds; t++) {
            int from = (int) (Math.min(t * kmin, kmin) - lo);
            int to = (int) (Math.max(t * kmax, kmax) - lo);
            if (continuation) {
                for (int s = 0; s < states; s++) {
                    double[] c = cur[s];
                    for (int k = from; k <= to; k++) {
                        out[k] += weight * c[k];
                    }
                }
                weight *= delta;
            } else if (t == rounds) {
                for (int s = 0; s < states; s++) {
                    double[] c = cur[s];
                    for (int k = from; k <= to; k++) {
                        out[k] += c[k];
                    }
                }
            }
            if (t == rounds) {
                break;
            }
            for (int s = 0; s < states; s++) {
                java.util.Arrays.fill(next[s], 0);
            }
            for (int s = 0; s < states; s++) {
                double[] c = cur[s];
                for (int s2 = 0; s2 < states; s2++) {
                    double p = m[s][s2];
                    if (p == 0) {
                        continue;
                    }
                    double[] nx = next[s2];
                    int shift = inc[s2];
                    for (int k = from; k <= to; k++) {
                        nx[k + shift] += p * c[k];
                    }
                }
            }
            double[][] tmp = cur;
            cur = next;
            next = tmp;
        }
        double missing = continuation ? Math.pow(delta, rounds) : 0;
        return new GameLaw(lo, out, missing);
    }

    /** Steps of X's payoff from X's lattice steps: the state's own entry. */
    static int[] focalSteps(Lattice lattice) {
        return lattice.steps().clone();
    }

    /** Steps of X's minus Y's payoff in a symmetric game: k(s) - k(mirror(s)). */
    static int[] differenceSteps(Lattice lattice) {
        int[] k = lattice.steps();
        int[] d = new int[State.COUNT];
        for (int s = 0; s < State.COUNT; s++) {
            d[s] = k[s] - k[State.mirror(s)];
        }
        return d;
    }

    int highest() {
        return lowest + probability.length - 1;
    }

    /**
     * E[exp(theta total)] of one game with real payoffs u (X's view of the round state), exactly for a
     * fixed horizon and as a truncated series for continuation.
     *
     * <p>Continuation: with r = max_s exp(theta u_s), the terms after round T sum to at most
     * S_T (1 - delta) delta^(T-1) delta r / (1 - delta r), S_T the mass of the tilted vector after round T;
     * the series is stopped when that bound is below 1e-15 of the sum. Needs delta r &lt; 1.
     *
     * @return {value, bound on the left-out tail}
     */
    static double[] momentGenerating(MarkovChain chain, double[] payoffOfRoundState, Horizon horizon, double theta) {
        int states = chain.size();
        double[] tilt = new double[states];
        double r = 0;
        for (int s = 0; s < states; s++) {
            tilt[s] = Math.exp(theta * payoffOfRoundState[chain.roundState(s)]);
            r = Math.max(r, tilt[s]);
        }
        double[][] m = chain.transitionMatrix();
        double[] v = chain.initialDistribution();
        for (int s = 0; s < states; s++) {
            v[s] *= tilt[s];
        }
        boolean continuation = horizon instanceof Horizon.Continuation;
        double delta = continuation ? ((Horizon.Continuation) horizon).probability() : 0;
        long n = continuation ? Long.MAX_VALUE : ((Horizon.Rounds) horizon).count();
        if (continuation && !(delta * r < 1)) {
            throw new IllegalArgumentException("exponential fitness with continuation probability " + delta
                + " has no finite expectation at this selection strength (delta * exp(theta * max payoff) = "
                + delta * r + " >= 1)");
        }
        double weight = 1 - delta;
        double sum = 0;
        double[] w = new double[states];
        for (long t = 1; ; t++) {
            double mass = 0;
            for (double x : v) {
                mass += x;
            }
            if (continuation) {
                sum += weight * mass;
                double tail = mass * weight * delta * r / (1 - delta * r);
                if (tail <= 1e-15 * sum || t > 100_000_000L) {
                    return new double[] {sum, tail};
                }
                weight *= delta;
            } else if (t == n) {
                return new double[] {mass, 0};
            }
            java.util.Arrays.fill(w, 0);
            for (int s = 0; s < states; s++) {
                double x = v[s];
                if (x == 0) {
                    continue;
                }
                for (int s2 = 0; s2 < states; s2++) {
                    w[s2] += x * m[s][s2];
                }
            }
            for (int s = 0; s < states; s++) {
                v[s] = w[s] * tilt[s];
            }
        }
    }
}
