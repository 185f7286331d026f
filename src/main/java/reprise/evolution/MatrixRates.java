package reprise.evolution;

import org.apache.commons.statistics.distribution.HypergeometricDistribution;
import reprise.game.Population;

/**
 * Update probabilities from a deterministic payoff matrix (bases a and b).
 *
 * <p>With every co-player, a mutant's payoff is P_A(i) = [(i - 1) a + (N - i) b] / (N - 1) and a
 * resident's P_B(i) = [i c + (N - i - 1) d] / (N - 1), with a = M[A][A], b = M[A][B], c = M[B][A],
 * d = M[B][B] (Nowak et al. 2004, self-interaction excluded). With m sampled co-players the number K of
 * mutants among them is hypergeometric (N - 1 others, i - 1 of them mutants for a mutant focal, i for a
 * resident), P = [K x + (m - K) y] / m, and the rates are expectations over K (independent for the two
 * individuals of a pairwise comparison).
 */
final class MatrixRates {
    private MatrixRates() {
    }

    static Rates of(PayoffBasis.Matrix matrix, Population population, int mutant, int resident) {
        int n = population.size();
        double a = matrix.payoff(mutant, mutant);
        double b = matrix.payoff(mutant, resident);
        double c = matrix.payoff(resident, mutant);
        double d = matrix.payoff(resident, resident);
        int m = population.coPlayers();
        double beta = population.selection();
        double[] forward = new double[n + 1];
        double[] backward = new double[n + 1];
        boolean pairwise = population.update() == Population.Update.PAIRWISE_COMPARISON;
        for (int i = 0; i <= n; i++) {
            if (m == 0) {
                double pa = i >= 1 ? ((i - 1) * a + (n - i) * b) / (n - 1) : Double.NaN;
                double pb = i <= n - 1 ? (i * c + (n - i - 1) * d) / (n - 1) : Double.NaN;
                if (pairwise) {
                    if (i >= 1 && i <= n - 1) {
                        forward[i] = Rates.logistic(beta * (pa - pb));
                        backward[i] = Rates.logistic(-beta * (pa - pb));
                    }
                } else {
                    forward[i] = i >= 1 ? Rates.fitness(population, pa) : 0;
                    backward[i] = i <= n - 1 ? Rates.fitness(population, pb) : 0;
                }
                continue;
            }
            double[] ha = i >= 1 ? hypergeometric(n - 1, i - 1, m) : null;
            double[] hb = i <= n - 1 ? hypergeometric(n - 1, i, m) : null;
            if (pairwise) {
                if (i >= 1 && i <= n - 1) {
                    double f = 0;
                    double g = 0;
                    for (int ka = 0; ka <= m; ka++) {
                        if (ha[ka] == 0) {
                            continue;
                        }
                        double pa = (ka * a + (m - ka) * b) / m;
                        for (int kb = 0; kb <= m; kb++) {
                            if (hb[kb] == 0) {
                                continue;
                            }
                            double pb = (kb * c + (m - kb) * d) / m;
                            double w = ha[ka] * hb[kb];
                            f += w * Rates.logistic(beta * (pa - pb));
                            g += w * Rates.logistic(-beta * (pa - pb));
                        }
                    }
                    forward[i] = f;
                    backward[i] = g;
                }
            } else {
                if (ha != null) {
                    double f = 0;
                    for (int k = 0; k <= m; k++) {
                        f += ha[k] == 0 ? 0 : ha[k] * Rates.fitness(population, (k * a + (m - k) * b) / m);
                    }
                    forward[i] = f;
                }
                if (hb != null) {
                    double g = 0;
                    for (int k = 0; k <= m; k++) {
                        g += hb[k] == 0 ? 0 : hb[k] * Rates.fitness(population, (k * c + (m - k) * d) / m);
                    }
                    backward[i] = g;
                }
            }
        }
        return new Rates(population, forward, backward, 0, Fixation.Method.MATRIX);
    }

    /** P(K = k), k = 0..m, for m draws without replacement from `others` of which `successes` are mutants. */
    static double[] hypergeometric(int others, int successes, int m) {
        HypergeometricDistribution h = HypergeometricDistribution.of(others, successes, m);
        double[] p = new double[m + 1];
        for (int k = 0; k <= m; k++) {
            p[k] = h.probability(k);
        }
        return p;
    }
}
