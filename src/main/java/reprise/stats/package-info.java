/**
 * Statistics that stay valid for autocorrelated play: each game is one independent observation.
 *
 * <p><b>Array orders.</b> Every state-indexed array is in the order CC, CD, DC, DD (indices 0..3, states
 * from X's view, as in {@link reprise.game.State}); 4 x 4 matrices are indexed [from][to] or [s][r] in
 * that order. Payoff vectors are per state in that order (Y's payoffs too, in X's order).
 *
 * <p><b>Inputs.</b> Plain values: {@link reprise.stats.GameSummary} holds the exact integer sufficient
 * statistics of G games (sum N_s, sum N_s N_r, sum L N_s, sum L, sum L^2); exact-engine quantities are
 * passed as double arrays (expected counts per game, per-game covariance, transition matrices, the
 * distribution of the state at round t, asymptotic variances).
 *
 * <p><b>Which tool for which question.</b>
 * <ul>
 *   <li>Means with intervals over games: {@link reprise.stats.ReplicateInference} (fixed length: the
 *       t-interval of per-game averages; random length: the ratio estimator sum N / sum L);
 *       proportions from independent trials: {@link reprise.stats.WilsonInterval}.</li>
 *   <li>Few games carry the variation (rare states, low error rates, short or few games): diagnose with
 *       {@link reprise.stats.Regime}; intervals that stay in range and never collapse with
 *       {@link reprise.stats.BoundedMeanInterval}; whether an asymptotic p-value holds at a corrected
 *       threshold with {@link reprise.stats.TailTrust}, and if not a Monte Carlo p-value under the exact
 *       model with {@link reprise.stats.MonteCarloPValue} and {@link reprise.stats.ExactModelReference}.</li>
 *   <li>Mean state counts against exact predictions: {@link reprise.stats.WaldTest} (exact covariance) or
 *       {@link reprise.stats.HotellingTest} (sample covariance).</li>
 *   <li>Transition counts against a transition matrix: {@link reprise.stats.TransitionTest}, after pooling
 *       sparse cells with {@link reprise.stats.SparseCells}.</li>
 *   <li>The state at round t across games: {@link reprise.stats.SnapshotTest}.</li>
 *   <li>The pooled-rounds chi-square, as a warning only: {@link reprise.stats.PooledRoundsIllustration}.</li>
 *   <li>One long chain: {@link reprise.stats.BatchMeans}.</li>
 *   <li>Agreement within a tolerance, and finite-horizon bias: {@link reprise.stats.Equivalence}.</li>
 *   <li>Sweeps: {@link reprise.stats.MultipleTesting}; study size: {@link reprise.stats.Planning};
 *       checking a test's calibration: {@link reprise.stats.Calibration}.</li>
 * </ul>
 */
package reprise.stats;
