package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.apache.commons.statistics.inference.BinomialTest;
import reprise.chain.NoPredictionException;
import reprise.chain.StrategyMatrix;
import reprise.evolution.Abundance;
import reprise.evolution.Fixation;
import reprise.evolution.PayoffBasis;
import reprise.sim.InvasionTally;
import reprise.stats.Interval;
import reprise.stats.MultipleTesting;
import reprise.stats.WilsonInterval;

/**
 * The analysis of a population experiment: at each grid point and for each ordered (mutant, resident) pair,
 * the exact fixation probability from three payoff bases, each its own prediction, against the simulated
 * fixation frequency of independent invasions.
 *
 * <ul>
 *   <li>{@link Basis#STATIONARY} (a): the payoff matrix of the infinitely repeated game (stationary payoffs,
 *       what papers use);</li>
 *   <li>{@link Basis#EXPECTED} (b): the exact expected payoffs of the finite or discounted game;</li>
 *   <li>{@link Basis#REALISED} (c): the exact law of realised payoffs of fresh finite games, the exact answer
 *       for the process that is simulated.</li>
 * </ul>
 *
 * <p><b>Verdicts.</b> The simulated count of fixations is tested against each basis' rho with the exact
 * two-sided binomial test (Commons Statistics {@code BinomialTest}); the p-values of each basis are
 * corrected together over the file (Holm or Benjamini-Hochberg, as {@code correction:}). For (c) the
 * verdict is a test of reprise itself: {@code consistent} or {@code disagrees} (counts towards the exit
 * code). For (a) and (b) the question is whether the analysis describes this population with games of
 * this length: {@code describes} when |rho / rho_c - 1| is within the file's relative tolerance, else
 * {@code misdescribes}, with the size of the error (exact, since (c) is exact for the process); whether
 * the basis puts the mutant on the same side of 1/N as (c); and whether the invasions detect the
 * difference (the corrected binomial test). The interval on the simulated frequency is Wilson's score
 * interval at 1 - alpha (valid for small counts; Wilson 1927).
 *
 * <p>References:
 * <ul>
 *   <li>Wilson, E.B. (1927). Probable inference, the law of succession, and statistical inference. JASA 22,
 *       209-212.</li>
 *   <li>Fudenberg, D. &amp; Imhof, L.A. (2006). Imitation processes with small mutations. Journal of Economic
 *       Theory 131, 251-262.</li>
 * </ul>
 */
public final class PopulationAnalysis {

    private PopulationAnalysis() {
    }

    /** The three payoff bases. */
    public enum Basis {
        /** (a) stationary payoffs of the infinitely repeated game. */
        STATIONARY,
        /** (b) exact expected payoffs of the finite or discounted game. */
        EXPECTED,
        /** (c) the exact law of realised payoffs. */
        REALISED;

        /** @return the name used in files */
        public String label() {
            return name().toLowerCase(java.util.Locale.ROOT);
        }
    }

    /**
     * Identifies one fixation question: a grid point and an ordered pair.
     *
     * @param point the grid point's index
     * @param mutant the mutant's strategy index
     * @param resident the resident's strategy index
     */
    public record Key(int point, int mutant, int resident) {
    }

    /**
     * The exact side of one grid point.
     *
     * @param point the grid point
     * @param fixation fixation[basis][m][r] (NaN on the diagonal; the stationary basis is NaN throughout when
     *     some pair has no unique stationary payoff)
     * @param results the exact results, results[basis][m][r] (null where NaN)
     * @param abundance abundance[basis][i]: rare-mutation abundances, or with an explicit rate the long-run
     *     fraction of strategies 0 and 1; null without mutation or without the basis
     */
    public record PointExact(PopulationExperiment.Point point, double[][][] fixation, Fixation.Result[][][] results,
        double[][] abundance) {
    }

    /**
     * One row of population.csv: a question, a basis, its prediction and the comparison with the invasions.
     *
     * @param point the grid point
     * @param mutant the mutant's strategy index
     * @param resident the resident's strategy index
     * @param basis the basis
     * @param result the exact result, null when the basis has no prediction here
     * @param realised rho of basis (c) for the same question
     * @param tally the simulated invasions (null when none were run)
     * @param interval Wilson's interval on the simulated frequency (null without invasions)
     * @param pValue the binomial test's p-value (NaN without invasions or prediction)
     * @param adjusted the corrected p-value (NaN likewise)
     * @param verdict consistent / disagrees for (c); describes / misdescribes for (a) and (b); no-prediction
     * @param detected whether the invasions reject the basis' rho after correction
     */
    public record Row(PopulationExperiment.Point point, int mutant, int resident, Basis basis, Fixation.Result result,
        double realised, InvasionTally tally, Interval interval, double pValue, double adjusted, String verdict,
        boolean detected) {

        /** @return rho / rho_c - 1 (NaN without a prediction or when rho_c is 0) */
        public double relativeError() {
            return result == null || realised == 0 ? Double.NaN : result.probability() / realised - 1;
        }

        /** @return whether the basis puts the mutant on the same side of 1/N as (c) */
        public boolean sameSideOfNeutral() {
            if (result == null) {
                return false;
            }
            double n = result.neutral();
            return Math.signum(result.probability() - n) == Math.signum(realised - n);
        }
    }

    /**
     * The whole analysis.
     *
     * @param exact the exact side of every grid point
     * @param rows the rows, point by point, pair by pair (mutant-major), then basis
     */
    public record Result(List<PointExact> exact, List<Row> rows, List<AbundanceRow> abundances,
        List<ClaimRow> claims) {
        /**
         * The analysis without claims.
         *
         * @param exact the exact side
         * @param rows the fixation rows
         * @param abundances the abundance rows
         */
        public Result(List<PointExact> exact, List<Row> rows, List<AbundanceRow> abundances) {
            this(exact, rows, abundances, List.of());
        }

        /**
         * @return 1 when any (c) row (fixation or abundance) disagrees with the simulation or any claim
         *     disagrees, else 0
         */
        public int exitCode() {
            boolean fix = rows.stream().anyMatch(r -> r.basis() == Basis.REALISED && "disagrees".equals(r.verdict()));
            boolean ab = abundances.stream().anyMatch(r -> r.basis() == Basis.REALISED
                && "disagrees".equals(r.verdict()));
            boolean cl = claims.stream().anyMatch(r -> "disagrees".equals(r.verdict()));
            return fix || ab || cl ? 1 : 0;
        }
    }

    /**
     * One claim of the claims file checked: against the exact value of basis (c) within the claim's tolerance,
     * and against the simulation (fixation: the exact binomial test of the invasions' count; abundance with an
     * explicit rate: the batch-means t test), its p-value corrected in the same family as the (c) rows.
     *
     * @param claim the claim
     * @param point its grid point
     * @param exact the exact value of basis (c)
     * @param tally the invasions of the claimed question (fixation; null otherwise or without invasions)
     * @param simulated the batch-means estimate (abundance with a run; null otherwise)
     * @param pValue the test's p-value (NaN without a simulation)
     * @param adjusted the corrected p-value (NaN likewise)
     * @param exactAgrees whether |claim - exact| is within the claim's margin around the exact value
     * @param detected whether the simulation rejects the claim after correction
     * @param verdict consistent (agrees with the exact value and is not rejected) or disagrees
     */
    public record ClaimRow(reprise.experiment.PopulationClaims.Claim claim, PopulationExperiment.Point point,
        double exact, InvasionTally tally, reprise.stats.Estimate simulated, double pValue, double adjusted,
        boolean exactAgrees, boolean detected, String verdict) {
    }

    /**
     * One row of abundance.csv: a grid point, a basis and a strategy, with the simulated abundance of one
     * long run with explicit mutation (batch means, valid for one autocorrelated run) where there is one.
     *
     * @param point the grid point
     * @param basis the basis
     * @param strategy the strategy's index
     * @param abundance the exact abundance of the basis (NaN without a prediction)
     * @param realised the exact abundance of basis (c)
     * @param simulated the batch-means estimate (null without a run)
     * @param interval its interval at 1 - alpha (null without a run)
     * @param pValue the t test of the estimate against the basis' abundance (NaN without a run)
     * @param adjusted the corrected p-value (NaN likewise)
     * @param verdict consistent / disagrees for (c), describes / misdescribes for (a) and (b)
     */
    public record AbundanceRow(PopulationExperiment.Point point, Basis basis, int strategy, double abundance,
        double realised, reprise.stats.Estimate simulated, Interval interval, double pValue, double adjusted,
        String verdict) {
    }

    /**
     * The exact side of one grid point: the three bases' fixation matrices and abundances.
     *
     * @param e the experiment
     * @param p the grid point
     * @return its exact results
     */
    public static PointExact exact(PopulationExperiment e, PopulationExperiment.Point p) {
        int k = e.strategies().size();
        PayoffBasis.Realised realised = new PayoffBasis.Realised(e.game(), e.strategies(), p.noise(), p.horizon());
        PayoffBasis[] bases = new PayoffBasis[3];
        bases[Basis.STATIONARY.ordinal()] = stationary(e, p);
        bases[Basis.EXPECTED.ordinal()] = Fixation.expectedPayoffs(realised);
        bases[Basis.REALISED.ordinal()] = realised;
        double[][][] fix = new double[3][k][k];
        Fixation.Result[][][] res = new Fixation.Result[3][k][k];
        double[][] abundance = new double[3][];
        for (int b = 0; b < 3; b++) {
            for (int m = 0; m < k; m++) {
                for (int r = 0; r < k; r++) {
                    fix[b][m][r] = Double.NaN;
                    if (m != r && bases[b] != null) {
                        res[b][m][r] = Fixation.probability(bases[b], p.population(), m, r);
                        fix[b][m][r] = res[b][m][r].probability();
                    }
                }
            }
            if (bases[b] == null) {
                continue;
            }
            if (e.mutation() == PopulationExperiment.Mutation.RARE) {
                abundance[b] = Abundance.rareMutation(fix[b]);
            } else if (e.mutation() == PopulationExperiment.Mutation.RATE) {
                double a = Abundance.explicitMutationAbundance(bases[b], p.population(), 0, 1, e.mu());
                abundance[b] = new double[] {a, 1 - a};
            }
        }
        return new PointExact(p, fix, res, abundance);
    }

    /**
     * One exact fixation probability at another selection strength (for curves between grid points).
     *
     * @param e the experiment
     * @param p the grid point whose population, errors and game length are kept
     * @param selection the selection strength
     * @param basis the basis
     * @param m the mutant
     * @param r the resident
     * @return rho, or NaN when the stationary basis has no unique payoffs
     */
    public static double fixation(PopulationExperiment e, PopulationExperiment.Point p, double selection, Basis basis,
        int m, int r) {
        PayoffBasis.Realised realised = new PayoffBasis.Realised(e.game(), e.strategies(), p.noise(), p.horizon());
        PayoffBasis b = switch (basis) {
            case STATIONARY -> stationary(e, p);
            case EXPECTED -> Fixation.expectedPayoffs(realised);
            case REALISED -> realised;
        };
        return b == null ? Double.NaN : Fixation.probability(b, p.population().withSelection(selection), m, r)
            .probability();
    }

    /** Basis (a), or null when some pair's long-run payoff depends on the start (no unique stationary state). */
    private static PayoffBasis.Matrix stationary(PopulationExperiment e, PopulationExperiment.Point p) {
        try {
            StrategyMatrix sm = StrategyMatrix.of(e.game(), e.strategies(), e.strategies(), p.noise(), null);
            for (int i = 0; i < sm.rows(); i++) {
                for (int j = 0; j < sm.columns(); j++) {
                    if (!sm.unique(i, j)) {
                        return null;
                    }
                }
            }
            return new PayoffBasis.Matrix(sm.payoffMatrixX());
        } catch (NoPredictionException ex) {
            return null;
        }
    }

    /**
     * Analyses the exact side against the invasions.
     *
     * @param e the experiment
     * @param exact the exact side of every grid point, in point order
     * @param tallies the invasions of every question (empty when {@code invasions: 0})
     * @return the rows and the exit code
     */
    public static Result analyse(PopulationExperiment e, List<PointExact> exact, Map<Key, InvasionTally> tallies) {
        return analyse(e, exact, tallies, Map.of());
    }

    /**
     * Analyses the exact side against the invasions and the runs with explicit mutation.
     *
     * <p>Abundances: with an explicit rate, the fraction of strategy 0 over one run of a grid point is
     * estimated by batch means ({@link reprise.stats.BatchMeans}) and tested against each basis' exact
     * abundance by the t statistic with the estimate's degrees of freedom; each basis' p-values are
     * corrected together (the abundance of strategy 1 is one minus it and is not tested again).
     *
     * @param e the experiment
     * @param exact the exact side of every grid point, in point order
     * @param tallies the invasions of every question
     * @param runs the run with mutation of every grid point, by point index (empty without)
     * @return the rows and the exit code
     */
    public static Result analyse(PopulationExperiment e, List<PointExact> exact, Map<Key, InvasionTally> tallies,
        Map<Integer, reprise.sim.MutationRun> runs) {
        int k = e.strategies().size();
        List<Row> rows = new ArrayList<>();
        List<List<Double>> ps = List.of(new ArrayList<>(), new ArrayList<>(), new ArrayList<>());
        for (PointExact px : exact) {
            for (int m = 0; m < k; m++) {
                for (int r = 0; r < k; r++) {
                    if (m == r) {
                        continue;
                    }
                    InvasionTally t = tallies.get(new Key(px.point().index(), m, r));
                    for (Basis b : Basis.values()) {
                        Fixation.Result res = px.results()[b.ordinal()][m][r];
                        double p = Double.NaN;
                        Interval w = null;
                        if (t != null && t.invasions() > 0) {
                            w = WilsonInterval.of(t.fixations(), t.invasions(), 1 - e.alpha(),
                                WilsonInterval.Correction.NONE);
                            if (res != null) {
                                p = BinomialTest.withDefaults().test(Math.toIntExact(t.invasions()),
                                    Math.toIntExact(t.fixations()), res.probability()).getPValue();
                                ps.get(b.ordinal()).add(p);
                            }
                        }
                        rows.add(new Row(px.point(), m, r, b, res, px.fixation()[Basis.REALISED.ordinal()][m][r],
                            t, w, p, Double.NaN, "", false));
                    }
                }
            }
        }
        List<ClaimRow> claimRows = new ArrayList<>();
        List<Double> abundanceClaimPs = new ArrayList<>();
        for (PopulationClaims.Claim c : e.claims()) {
            PointExact px = exact.get(c.point());
            double p = Double.NaN;
            if (c.kind() == PopulationClaims.Kind.FIXATION) {
                InvasionTally t = tallies.get(new Key(c.point(), c.mutant(), c.resident()));
                if (t != null && t.invasions() > 0) {
                    p = BinomialTest.withDefaults().test(Math.toIntExact(t.invasions()), Math.toIntExact(t.fixations()),
                        c.value()).getPValue();
                    ps.get(Basis.REALISED.ordinal()).add(p);
                }
                claimRows.add(new ClaimRow(c, px.point(), px.fixation()[Basis.REALISED.ordinal()][c.mutant()]
                    [c.resident()], t, null, p, Double.NaN, false, false, ""));
            } else {
                reprise.sim.MutationRun run = runs.get(c.point());
                reprise.stats.Estimate est = null;
                if (run != null) {
                    est = reprise.stats.BatchMeans.estimate(run.fractions());
                    if (c.strategy() == 1) {
                        est = new reprise.stats.Estimate(1 - est.value(), est.standardError(), est.degreesOfFreedom(),
                            est.replicates());
                    }
                    p = tTest(est, c.value());
                    abundanceClaimPs.add(p);
                }
                claimRows.add(new ClaimRow(c, px.point(), px.abundance()[Basis.REALISED.ordinal()][c.strategy()], null,
                    est, p, Double.NaN, false, false, ""));
            }
        }
        double[][] adjusted = new double[3][];
        for (int b = 0; b < 3; b++) {
            double[] raw = ps.get(b).stream().mapToDouble(Double::doubleValue).toArray();
            adjusted[b] = adjust(raw, e.correction());
        }
        int[] next = new int[3];
        List<Row> out = new ArrayList<>();
        for (Row row : rows) {
            int b = row.basis().ordinal();
            double adj = Double.NaN;
            if (!Double.isNaN(row.pValue())) {
                adj = adjusted[b][next[b]++];
            }
            boolean detected = adj < e.alpha();
            String verdict;
            if (row.result() == null) {
                verdict = Verdict.NO_PREDICTION.word();
            } else if (row.basis() == Basis.REALISED) {
                verdict = Double.isNaN(adj) ? "" : detected ? Verdict.DISAGREES.word() : Verdict.CONSISTENT.word();
            } else {
                verdict = Math.abs(row.relativeError()) <= e.tolerance() ? "describes" : "misdescribes";
            }
            out.add(new Row(row.point(), row.mutant(), row.resident(), row.basis(), row.result(), row.realised(),
                row.tally(), row.interval(), row.pValue(), adj, verdict, detected));
        }
        double[] abundanceClaimAdjusted = new double[abundanceClaimPs.size()];
        List<AbundanceRow> abundanceRows = abundances(e, exact, runs, abundanceClaimPs, abundanceClaimAdjusted);
        int nextAbundance = 0;
        int realised = Basis.REALISED.ordinal();
        List<ClaimRow> claimsOut = new ArrayList<>();
        for (ClaimRow c : claimRows) {
            double adj = Double.NaN;
            if (!Double.isNaN(c.pValue())) {
                adj = c.claim().kind() == PopulationClaims.Kind.FIXATION ? adjusted[realised][next[realised]++]
                    : abundanceClaimAdjusted[nextAbundance++];
            }
            boolean agrees = Math.abs(c.claim().value() - c.exact()) <= c.claim().tolerance().margin(c.exact());
            boolean detected = adj < e.alpha();
            claimsOut.add(new ClaimRow(c.claim(), c.point(), c.exact(), c.tally(), c.simulated(), c.pValue(), adj,
                agrees, detected, agrees && !detected ? Verdict.CONSISTENT.word() : Verdict.DISAGREES.word()));
        }
        return new Result(List.copyOf(exact), List.copyOf(out), abundanceRows, List.copyOf(claimsOut));
    }

    private static List<AbundanceRow> abundances(PopulationExperiment e, List<PointExact> exact,
        Map<Integer, reprise.sim.MutationRun> runs, List<Double> claimPs, double[] claimAdjusted) {
        List<AbundanceRow> raw = new ArrayList<>();
        List<List<Double>> ps = List.of(new ArrayList<>(), new ArrayList<>(), new ArrayList<>());
        for (PointExact px : exact) {
            double[] real = px.abundance()[Basis.REALISED.ordinal()];
            if (real == null) {
                continue;
            }
            reprise.sim.MutationRun run = runs.get(px.point().index());
            reprise.stats.Estimate est = run == null ? null : reprise.stats.BatchMeans.estimate(run.fractions());
            for (Basis b : Basis.values()) {
                double[] a = px.abundance()[b.ordinal()];
                for (int i = 0; i < real.length; i++) {
                    double value = a == null ? Double.NaN : a[i];
                    reprise.stats.Estimate ei = est == null ? null : i == 0 ? est
                        : new reprise.stats.Estimate(1 - est.value(), est.standardError(), est.degreesOfFreedom(),
                            est.replicates());
                    double p = Double.NaN;
                    if (ei != null && i == 0 && !Double.isNaN(value)) {
                        p = tTest(ei, value);
                        ps.get(b.ordinal()).add(p);
                    }
                    raw.add(new AbundanceRow(px.point(), b, i, value, real[i], ei, ei == null ? null
                        : ei.interval(1 - e.alpha()), p, Double.NaN, ""));
                }
            }
        }
        int own = ps.get(Basis.REALISED.ordinal()).size();
        ps.get(Basis.REALISED.ordinal()).addAll(claimPs);
        double[][] adjusted = new double[3][];
        for (int b = 0; b < 3; b++) {
            adjusted[b] = adjust(ps.get(b).stream().mapToDouble(Double::doubleValue).toArray(), e.correction());
        }
        System.arraycopy(adjusted[Basis.REALISED.ordinal()], own, claimAdjusted, 0, claimAdjusted.length);
        int[] next = new int[3];
        List<AbundanceRow> out = new ArrayList<>();
        double[] lastAdjusted = new double[3];
        for (AbundanceRow r : raw) {
            int b = r.basis().ordinal();
            double adj = Double.NaN;
            if (!Double.isNaN(r.pValue())) {
                adj = adjusted[b][next[b]++];
                lastAdjusted[b] = adj;
            } else if (r.simulated() != null && r.strategy() > 0 && !Double.isNaN(r.abundance())) {
                adj = lastAdjusted[b];
            }
            String verdict;
            if (Double.isNaN(r.abundance())) {
                verdict = Verdict.NO_PREDICTION.word();
            } else if (r.basis() == Basis.REALISED) {
                verdict = Double.isNaN(adj) ? "" : adj < e.alpha() ? Verdict.DISAGREES.word()
                    : Verdict.CONSISTENT.word();
            } else {
                verdict = Math.abs(r.abundance() / r.realised() - 1) <= e.tolerance() ? "describes" : "misdescribes";
            }
            out.add(new AbundanceRow(r.point(), r.basis(), r.strategy(), r.abundance(), r.realised(), r.simulated(),
                r.interval(), r.pValue(), adj, verdict));
        }
        return List.copyOf(out);
    }

    /** Two-sided p-value of (estimate - value) / se against Student's t (normal for infinite df). */
    private static double tTest(reprise.stats.Estimate est, double value) {
        if (!(est.standardError() > 0)) {
            return est.value() == value ? 1 : 0;
        }
        double t = Math.abs(est.value() - value) / est.standardError();
        double tail = Double.isInfinite(est.degreesOfFreedom())
            ? org.apache.commons.statistics.distribution.NormalDistribution.of(0, 1).survivalProbability(t)
            : org.apache.commons.statistics.distribution.TDistribution.of(est.degreesOfFreedom()).survivalProbability(t);
        return Math.min(1, 2 * tail);
    }

    private static double[] adjust(double[] raw, Experiment.Correction c) {
        if (raw.length == 0) {
            return raw;
        }
        return switch (c) {
            case HOLM -> MultipleTesting.adjust(raw, MultipleTesting.Method.HOLM);
            case BH -> MultipleTesting.adjust(raw, MultipleTesting.Method.BENJAMINI_HOCHBERG);
            case NONE -> raw.clone();
        };
    }
}
