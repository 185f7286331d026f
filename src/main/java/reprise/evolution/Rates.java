package reprise.evolution;

import reprise.game.Population;

/**
 * The payoff-dependent parts of the update probabilities of a population of i mutants (strategy A) and
 * N - i residents (strategy B), for i = 0..N.
 *
 * <p>Pairwise comparison: {@code forward[i]} = E[F(beta D_i)], the probability that a resident learner
 * adopts from a mutant model, and {@code backward[i]} = E[F(-beta D_i)], with F the logistic function and
 * D_i = P_model - P_learner of a mutant and a resident (defined for i = 1..N-1). Moran: {@code forward[i]}
 * = E[f(P_A)] (i = 1..N) and {@code backward[i]} = E[f(P_B)] (i = 0..N-1), the expected fitnesses.
 *
 * @param population the population
 * @param forward see above
 * @param backward see above
 * @param absoluteError a bound (or, for rounding, an estimate) on the absolute error of each entry
 * @param method how the entries were computed
 */
record Rates(Population population, double[] forward, double[] backward, double absoluteError, Fixation.Method method) {

    /** The logistic function 1 / (1 + exp(-x)), without overflow. */
    static double logistic(double x) {
        if (x >= 0) {
            return 1 / (1 + Math.exp(-x));
        }
        double e = Math.exp(x);
        return e / (1 + e);
    }

    /** Fitness of payoff p under the Moran rule, refusing a negative linear fitness. */
    static double fitness(Population population, double p) {
        double w = population.selection();
        if (population.fitness() == Population.Fitness.EXPONENTIAL) {
            return Math.exp(w * p);
        }
        double f = 1 - w + w * p;
        if (!(f >= 0)) {
            throw new IllegalArgumentException("linear fitness 1 - w + w P is negative (w = " + w + ", P = " + p
                + "): lower w or shift the payoffs");
        }
        return f;
    }

    /**
     * The birth-death chain of the number of mutants, with probability mu that an update's new strategy
     * is the other one (mu = 0: no mutation).
     *
     * <p>Pairwise comparison: a learner drawn uniformly switches to the other strategy with probability mu,
     * else compares: T+_i = (N - i)/N [mu + (1 - mu) i/(N - 1) forward_i],
     * T-_i = i/N [mu + (1 - mu) (N - i)/(N - 1) backward_i]. Moran: the reproducer is a mutant with
     * probability a_i = i f_A / (i f_A + (N - i) f_B); its offspring mutates with probability mu and replaces
     * one of the other N - 1: T+_i = [a_i (1 - mu)(N - i) + (1 - a_i) mu (N - i - 1)] / (N - 1),
     * T-_i = [(1 - a_i)(1 - mu) i + a_i mu (i - 1)] / (N - 1).
     */
    BirthDeathChain chain(double mu) {
        int n = population.size();
        double[] up = new double[n + 1];
        double[] down = new double[n + 1];
        for (int i = 0; i <= n; i++) {
            if (population.update() == Population.Update.PAIRWISE_COMPARISON) {
                double fw = i > 0 && i < n ? forward[i] : 0;
                double bw = i > 0 && i < n ? backward[i] : 0;
                up[i] = i == n ? 0 : (double) (n - i) / n * (mu + (1 - mu) * i / (n - 1.0) * fw);
                down[i] = i == 0 ? 0 : (double) i / n * (mu + (1 - mu) * (n - i) / (n - 1.0) * bw);
            } else {
                double a;
                if (i == 0) {
                    a = 0;
                } else if (i == n) {
                    a = 1;
                } else {
                    double fa = i * forward[i];
                    double fb = (n - i) * backward[i];
                    a = fa / (fa + fb);
                }
                up[i] = i == n ? 0 : (a * (1 - mu) * (n - i) + (1 - a) * mu * (n - i - 1)) / (n - 1.0);
                down[i] = i == 0 ? 0 : ((1 - a) * (1 - mu) * i + a * mu * (i - 1)) / (n - 1.0);
            }
        }
        return new BirthDeathChain(up, down);
    }

    /**
     * A first-order bound on the relative error of the fixation probability from the entries' absolute
     * error e: |d log rho| &le; sum_i |d log gamma_i| &le; sum_i (e / forward_i + e / backward_i).
     */
    double relativeFixationError() {
        if (absoluteError == 0) {
            return 0;
        }
        double s = 0;
        for (int i = 1; i < population.size(); i++) {
            s += absoluteError / forward[i] + absoluteError / backward[i];
        }
        return s;
    }
}
