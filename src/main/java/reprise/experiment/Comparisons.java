package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.DoubleFunction;
import java.util.function.DoubleSupplier;
import java.util.function.Supplier;
import reprise.stats.BoundedMeanInterval;
import reprise.stats.Equivalence;
import reprise.stats.Estimate;
import reprise.stats.ExactModelReference;
import reprise.stats.GameSummary;
import reprise.stats.HotellingTest;
import reprise.stats.MonteCarloPValue;
import reprise.stats.Regime;
import reprise.stats.ReplicateInference;
import reprise.stats.SnapshotTest;
import reprise.stats.SparseCells;
import reprise.stats.TailTrust;
import reprise.stats.TestResult;
import reprise.stats.TransitionTest;

/**
 * Turns one simulated case into result rows (before the multiple-testing correction).
 *
 * <p>Rows per case (each only when the experiment asks for it and it applies):
 * <ul>
 *   <li>{@code states / exact}: Wald test of the four mean state frequencies against the exact expectation
 *       for the tallied rounds, with the exact covariance (no margin: consistent or disagrees);</li>
 *   <li>{@code QUANTITY / exact}: each quantity against its exact expectation: z-test with the exact
 *       standard error, and two one-sided tests (with the replicate standard error) for agreement within
 *       the tolerance;</li>
 *   <li>{@code transitions / exact}: Anderson and Goodman test of the pooled transition counts;</li>
 *   <li>{@code snapshot_t / exact}: the state at round t across games against v_1 M^(t-1);</li>
 *   <li>{@code QUANTITY / stationary}: whether the stationary value describes games of this length within
 *       the tolerance, with the exact finite-horizon bias beside the sampling error (descriptive);</li>
 *   <li>{@code QUANTITY / claim-vs-simulation} and {@code claim-vs-exact}: a claimed value against the
 *       simulation (as for exact) and against the exact expectation (|difference| within the tolerance).</li>
 * </ul>
 *
 * <p><b>Regime and intervals.</b> For every quantity row the regime ({@link Regime}: expected informative
 * games, skewness, expected state counts) comes from games drawn from the exact model ({@link ModelDraws});
 * the reported interval is {@link BoundedMeanInterval#choose} at 1 - alpha for that regime (the t-interval
 * only where the normal approximation was measured to hold, a finite-sample or effective-size interval
 * otherwise; always inside the quantity's range; never a point unless the quantity cannot vary). The
 * verdict of a row with a tolerance h uses two p-values: "agrees" (|d| &lt; h, TOST) and "disagrees"
 * (|d| &gt; h), from the t-based TOST where the t-interval is used, else by inverting the chosen interval
 * family ({@link Equivalence#intervalPValues}); the runner corrects each family and applies
 * {@link Equivalence#verdict}.
 *
 * <p><b>Tails.</b> The Wald, transition and snapshot tests are refined once the corrected threshold
 * alpha* (alpha / m, the first step of Holm's procedure over the m counting rows) is known
 * ({@link Pending#refine}): if {@link TailTrust} does not trust the asymptotic reference at alpha* nor at
 * the observed p-value, the p-value is a sequential Monte Carlo p-value under the exact model (Besag &amp;
 * Clifford 1991; studies drawn by the exact side's {@code ChainSampler}, or the exact multinomial for a
 * snapshot), with enough draws to resolve alpha* within the budget {@link #MONTE_CARLO_ROUNDS}; if the budget
 * cannot resolve alpha*, the row is inconclusive with the reason.
 */
public final class Comparisons {

    /** Rounds of exact-model games one Monte Carlo p-value may draw (about a second or two of sampling). */
    static final double MONTE_CARLO_ROUNDS = 5e7;
    /** Sequential Monte Carlo stops after this many draws reach the observed statistic. */
    static final int EXCEEDANCES = MonteCarloPValue.DEFAULT_EXCEEDANCES;

    private Comparisons() {
    }

    /**
     * A row with the p-values of its verdict, before correction.
     *
     * @param row the row (verdict provisional)
     * @param equivalenceP the "agrees" (TOST) p-value, or NaN when the row has no margin
     * @param disagreeP the "disagrees" p-value: |d| &gt; h for rows with a margin, the difference test's
     *     p-value for the others; NaN when there is none
     * @param margin whether the row's verdict uses the tolerance
     * @param counts whether the row can make the experiment disagree (everything but stationary rows)
     * @param refine recomputes the row once the corrected threshold is known (null: nothing to refine)
     */
    record Pending(ResultRow row, double equivalenceP, double disagreeP, boolean margin, boolean counts,
        DoubleFunction<Pending> refine) {

        /** @return the row refined for the corrected threshold alpha*, or this row */
        Pending at(double threshold) {
            return refine == null ? this : refine.apply(threshold);
        }
    }

    /** What every comparison of one case needs. */
    private record Context(Experiment e, CaseResult r, GameSummary summary, ModelDraws draws) {
        Case c() {
            return r.c();
        }

        CaseAnalysis.Exact exact() {
            return r.exact();
        }

        double[] weights(Quantity q) {
            return q.weights(r.c().match().game());
        }

        /** The regime of a quantity: from the exact model's games, or a stand-in from the data without one. */
        Regime regime(double[] w) {
            Regime m = draws == null ? null : draws.regime(w, summary.games());
            return m != null ? m : ModelDraws.fromData(summary, ReplicateInference.mean(summary, w).standardError() > 0);
        }

        /**
         * The quantities of the form w . N / L the experiment reports: the base quantities of its groups,
         * then its derived combinations (derived ratios have rows of their own, {@link RatioRows}).
         */
        List<Quantity> reported() {
            return Quantities.reported(e).stream().filter(q -> !Quantities.isRatio(q)).toList();
        }
    }

    static List<Pending> rows(Experiment e, CaseResult r, Map<? extends Quantity, Claims.Claim> claims) {
        List<Pending> out = new ArrayList<>();
        GameSummary summary = CaseAnalysis.summary(r.simulation());
        ModelDraws draws = r.exact() == null ? null : new ModelDraws(r.exact(), r.c().horizon(), e.burnIn(), r.seed());
        Context x = new Context(e, r, summary, draws);
        boolean enoughGames = x.summary().games() >= 2;
        if (r.exact() != null && enoughGames) {
            Map<TestId, TestResult> tests = CaseAnalysis.tests(r.exact(), r.simulation());
            if (e.tests().contains(Experiment.Comparison.FREQUENCIES)) {
                out.add(wald(x, tests.get(TestId.Standard.FREQUENCIES_WALD)));
                x.reported().forEach(q -> out.add(exactQuantity(x, q)));
                out.addAll(RatioRows.exact(e, r, x.summary()));
            }
            if (e.tests().contains(Experiment.Comparison.TRANSITIONS)) {
                transitions(x, tests, out);
            }
            if (e.tests().contains(Experiment.Comparison.SNAPSHOTS)) {
                snapshots(x, tests, out);
            }
            if (e.tests().contains(Experiment.Comparison.STATIONARY) && r.exact().prediction().stationary() != null) {
                x.reported().forEach(q -> out.add(stationary(x, q)));
                out.addAll(RatioRows.stationary(e, r, x.summary()));
            }
        }
        if (claims != null && enoughGames) {
            claims.forEach((q, claim) -> {
                if (Quantities.isRatio(q) || claim.longRun()) {
                    out.addAll(RatioRows.claim(e, r, x.summary(), q, claim));
                } else {
                    claim(x, q, claim, out);
                }
            });
            if (r.exact() == null && claims.keySet().containsAll(BaseQuantity.STATES)) {
                out.add(claimedStates(x, claims));
            }
        }
        if (r.exact() == null && (claims == null || claims.isEmpty())) {
            out.add(new Pending(ResultRow.builder(x.c(), Subject.Joint.STATES, ComparisonKind.EXACT)
                .verdict(Verdict.NO_PREDICTION).note(r.noPrediction()).build(), Double.NaN, Double.NaN, false, false,
                null));
        }
        return out;
    }

    /**
     * The interval and the two verdict p-values of a quantity against a target.
     *
     * @param estimate the estimate
     * @param choice the reported interval (1 - alpha)
     * @param agreeP the "agrees" p-value
     * @param disagreeP the "disagrees" p-value
     * @param pMethod "asymptotic" (t-based TOST) or "interval" (inverted from the chosen interval family)
     * @param regime the regime
     */
    private record Margin(Estimate estimate, BoundedMeanInterval.Choice choice, double agreeP, double disagreeP,
        String pMethod, Regime regime) {

        ResultRow.Diagnosis diagnosis(double[] w) {
            return new ResultRow.Diagnosis(regime.describe(), regime.informativeGames(), regime.skewness(),
                smallestCount(regime, w), pMethod, Double.NaN, methodName(choice.method()), agreeP, Double.NaN,
                disagreeP);
        }

        String note() {
            return "interval " + methodName(choice.method()) + " (" + choice.reason() + ")";
        }
    }

    private static Margin margin(Context x, double[] w, double target, double h) {
        double alpha = x.e().alpha();
        GameSummary summary = x.summary();
        Estimate est = ReplicateInference.mean(summary, w);
        Regime regime = x.regime(w);
        double[] range = BoundedMeanInterval.range(w);
        BoundedMeanInterval.Choice reported = BoundedMeanInterval.choose(summary, w, range[0], range[1], 1 - alpha,
            regime);
        if (reported.method() == BoundedMeanInterval.Method.T) {
            Equivalence.Result eq = Equivalence.assess(est, target, h, alpha);
            return new Margin(est, reported, eq.equivalencePValue(), eq.nonEquivalencePValue(), "asymptotic", regime);
        }
        double[] p = Equivalence.intervalPValues(c -> BoundedMeanInterval.choose(summary, w, range[0], range[1], c,
            regime).interval(), target, h);
        return new Margin(est, reported, p[0], p[1], "interval", regime);
    }

    /** The smallest positive expected count over the G games of a state the quantity depends on. */
    private static double smallestCount(Regime regime, double[] w) {
        double[] counts = regime.expectedStateCounts();
        boolean proportion = true;
        for (double v : w) {
            proportion &= v == 0 || v == 1;
        }
        if (proportion) {
            double sum = 0;
            for (int s = 0; s < 4; s++) {
                sum += w[s] * counts[s];
            }
            return sum;
        }
        double min = Double.POSITIVE_INFINITY;
        for (double v : counts) {
            if (v > 0) {
                min = Math.min(min, v);
            }
        }
        return Double.isInfinite(min) ? 0 : min;
    }

    private static String methodName(BoundedMeanInterval.Method m) {
        return switch (m) {
            case T -> "t";
            case EFFECTIVE_SIZE -> "effective-size";
            case FINITE_SAMPLE -> "finite-sample";
            case CONSTANT -> "constant";
        };
    }

    /** A quantity against its exact expectation: z-test with the exact standard error, agreement within h. */
    private static Pending exactQuantity(Context x, Quantity q) {
        double[] w = x.weights(q);
        double target = x.exact().value(w);
        double h = Tolerance.of(x.e(), q).margin(target);
        Margin m = margin(x, w, target, h);
        Estimate est = m.estimate();
        TestResult z = CaseAnalysis.zTest(x.exact(), est, w);
        ResultRow row = ResultRow.builder(x.c(), q, ComparisonKind.EXACT).predicted(target)
            .observed(est.value()).interval(m.choice().interval()).test(z.statistic(), Double.NaN, z.pValue())
            .note("z-test with exact standard error " + fmt(x.exact().standardError(w, est.replicates()))
                + "; within +-" + fmt(h) + ": agrees p = " + fmt(m.agreeP()) + ", disagrees p = " + fmt(m.disagreeP())
                + "; " + m.note())
            .diagnosis(m.diagnosis(w)).build();
        return new Pending(row, m.agreeP(), m.disagreeP(), true, true, null);
    }

    /** The Wald test of the four mean state frequencies, refined for its tail at the corrected threshold. */
    private static Pending wald(Context x, TestResult t) {
        Pending base = test(x.c(), Subject.Joint.STATES, ComparisonKind.EXACT, t, "Wald test, exact covariance");
        double[] mu = x.exact().moments().mean();
        List<Regime> states = new ArrayList<>();
        double smallest = Double.POSITIVE_INFINITY;
        for (int s = 0; s < 4; s++) {
            if (mu[s] > 0) {
                double[] w = new double[4];
                w[s] = 1;
                Regime r = x.draws().regime(w, x.summary().games());
                if (r != null) {
                    states.add(r);
                }
                smallest = Math.min(smallest, mu[s] * x.summary().games());
            }
        }
        if (states.isEmpty()) {
            return base;
        }
        Regime[] regimes = states.toArray(Regime[]::new);
        Regime worst = states.stream().min(java.util.Comparator.comparingDouble(Regime::informativeGames)).get();
        double minCount = smallest;
        Supplier<DoubleSupplier> reference = () -> reference(x).wald(x.draws().generator(1), mu,
            x.exact().moments().covariance());
        return tail(x, base, t, a -> TailTrust.means(regimes, a), reference, worst, minCount);
    }

    private static ExactModelReference reference(Context x) {
        return ExactModelReference.of(x.draws().sampler(), (int) x.summary().games(), x.c().horizon(), x.e().burnIn());
    }

    /**
     * The refinement of a distribution test for its tail (see the class description).
     *
     * @param rule the tail-trust rule at a level
     * @param reference draws of the statistic under the exact model (null: no Monte Carlo reference)
     */
    private static Pending tail(Context x, Pending base, TestResult t, DoubleFunction<TailTrust.Trust> rule,
        Supplier<DoubleSupplier> reference, Regime regime, double minCount) {
        DoubleFunction<Pending> refine = threshold -> {
            ResultRow row = base.row();
            String regimeText = regime == null ? "" : regime.describe();
            double informative = regime == null ? Double.NaN : regime.informativeGames();
            double skew = regime == null ? Double.NaN : regime.skewness();
            TailTrust.Trust atThreshold = rule.apply(threshold);
            double p = t.pValue();
            ResultRow.Diagnosis asymptotic = new ResultRow.Diagnosis(regimeText, informative, skew, minCount,
                "asymptotic", Double.NaN, "", Double.NaN, Double.NaN, p);
            if (atThreshold.trusted() || !(p > 0) || !Double.isFinite(t.statistic())) {
                return withRow(base, rebuild(row, row.note(), asymptotic).build(), p);
            }
            TailTrust.Trust atObserved = rule.apply(Math.min(0.999, p));
            if (atObserved.trusted() && p > (1 + TailTrust.RELATIVE_ERROR) * threshold) {
                return withRow(base, rebuild(row, row.note() + "; asymptotic tail not trusted at the corrected "
                    + "threshold " + fmt(threshold) + " but trusted at the observed p", asymptotic).build(), p);
            }
            long games = x.summary().games();
            double perDraw = Math.max(1, games * x.exact().meanLength());
            long budget = (long) Math.min(Long.MAX_VALUE / 2.0, MONTE_CARLO_ROUNDS / perDraw);
            long cap = Math.min(MonteCarloPValue.drawsToResolve(threshold, EXCEEDANCES), budget);
            if (reference == null || games > Integer.MAX_VALUE || cap < EXCEEDANCES) {
                return inconclusive(base, row, asymptotic, atThreshold, "a Monte Carlo p-value would need "
                    + MonteCarloPValue.drawsToResolve(threshold, EXCEEDANCES) + " studies of " + games
                    + " games, beyond the budget");
            }
            MonteCarloPValue.Result mc = MonteCarloPValue.sequential(t.statistic(), reference.get(), EXCEEDANCES, cap);
            ResultRow.Diagnosis d = new ResultRow.Diagnosis(regimeText, informative, skew, minCount, "monte-carlo",
                mc.draws(), "", Double.NaN, Double.NaN, mc.pValue());
            if (mc.exceedances() < EXCEEDANCES && !mc.resolves(threshold)) {
                return inconclusive(base, row, d, atThreshold, mc.note() + ", too few to resolve the corrected "
                    + "threshold " + fmt(threshold));
            }
            return withRow(base, rebuild(row, row.note() + "; " + atThreshold.reason() + "; " + mc.note(), d)
                .test(row.statistic(), row.degreesOfFreedom(), mc.pValue()).build(), mc.pValue());
        };
        return new Pending(base.row(), base.equivalenceP(), base.disagreeP(), base.margin(), base.counts(), refine);
    }

    private static Pending inconclusive(Pending base, ResultRow row, ResultRow.Diagnosis d, TailTrust.Trust trust,
        String why) {
        ResultRow.Diagnosis none = new ResultRow.Diagnosis(d.regime(), d.informativeGames(), d.skewness(),
            d.minimumExpectedCount(), d.pMethod(), d.monteCarloDraws(), "", Double.NaN, Double.NaN, Double.NaN);
        return withRow(base, rebuild(row, row.note() + "; inconclusive: " + trust.reason() + "; " + why
            + " (asymptotic p = " + fmt(row.pValue()) + ")", none).test(row.statistic(), row.degreesOfFreedom(),
            Double.NaN).verdict(Verdict.INCONCLUSIVE).build(), Double.NaN);
    }

    private static Pending withRow(Pending base, ResultRow row, double disagreeP) {
        return new Pending(row, base.equivalenceP(), disagreeP, base.margin(), base.counts(), null);
    }

    private static ResultRow.Builder rebuild(ResultRow row, String note, ResultRow.Diagnosis d) {
        ResultRow.Builder b = ResultRow.builder(row.caseIndex(), row.caseId(), row.subject(), row.comparisonKind())
            .predicted(row.predicted()).observed(row.observed()).interval(row.lower(), row.upper())
            .test(new TestResult(row.statistic(), row.degreesOfFreedom(), row.pValue(), "", row.smallSample()))
            .verdict(row.verdict()).note(note).diagnosis(d);
        return b;
    }

    private static void transitions(Context x, Map<TestId, TestResult> tests, List<Pending> out) {
        TestResult t = tests.get(TestId.Standard.TRANSITIONS_PEARSON);
        if (t != null) {
            Pending base = test(x.c(), Subject.Joint.TRANSITIONS, ComparisonKind.EXACT, t,
                "Anderson & Goodman (1957) Pearson form" + (t.note().isEmpty() ? "" : "; " + t.note()));
            SparseCells.Pooled pooled = CaseAnalysis.pooledTransitions(x.exact(), x.r().simulation());
            double smallest = pooled.smallestExpectedCount();
            double cells = Double.isInfinite(smallest) ? 0 : smallest;
            double[][] hypothesis = x.exact().transitions();
            out.add(tail(x, base, t, a -> TailTrust.cells(cells, a), () -> reference(x).transitions(
                x.draws().generator(2), hypothesis, CaseAnalysis.MINIMUM_EXPECTED_TRANSITIONS,
                TransitionTest.Form.PEARSON), null, cells));
        }
    }

    private static void snapshots(Context x, Map<TestId, TestResult> tests, List<Pending> out) {
        int[] stream = {3};
        tests.forEach((id, t) -> {
            if (id instanceof TestId.AtRound at) {
                Pending base = test(x.c(), at.subject(), ComparisonKind.EXACT, t, "state at round " + at.round()
                    + " across games" + (t.note().isEmpty() ? "" : "; " + t.note()));
                out.add(snapshot(x, base, t, at.round(), stream[0]++));
            }
        });
    }

    /**
     * A snapshot row: the asymptotic Pearson p-value where its tail is trusted at the corrected threshold,
     * else the exact multinomial test (enumerated, or by Monte Carlo from the exact distribution of the
     * round state with enough draws to resolve the threshold within the budget).
     */
    private static Pending snapshot(Context x, Pending base, TestResult t, long round, int stream) {
        double[] p = x.exact().chain().roundStateDistributionAt(round);
        long reached = 0;
        long[] counts = null;
        long[] rounds = x.r().simulation().snapshotRounds();
        for (int i = 0; i < rounds.length; i++) {
            if (rounds[i] == round) {
                counts = x.r().simulation().snapshotCounts()[i];
                reached = x.r().simulation().snapshotReached()[i];
            }
        }
        double smallest = Double.POSITIVE_INFINITY;
        for (double v : p) {
            if (v > 0) {
                smallest = Math.min(smallest, v * reached);
            }
        }
        double cells = Double.isInfinite(smallest) ? 0 : smallest;
        if (counts == null || t.smallSample().method() != TestResult.SmallSample.Method.NONE) {
            ResultRow.Diagnosis d = new ResultRow.Diagnosis("", Double.NaN, Double.NaN, cells,
                switch (t.smallSample().method()) {
                    case NONE -> "asymptotic";
                    case MONTE_CARLO -> "monte-carlo";
                    default -> "exact";
                }, Double.NaN, "",
                Double.NaN, Double.NaN, t.pValue());
            return withRow(base, rebuild(base.row(), base.row().note(), d).build(), t.pValue());
        }
        long[] observed = counts;
        long games = reached;
        DoubleFunction<Pending> refine = threshold -> {
            TailTrust.Trust trust = TailTrust.cells(cells, threshold);
            TailTrust.Trust atObserved = TailTrust.cells(cells, Math.min(0.999, Math.max(t.pValue(), 1e-300)));
            ResultRow row = base.row();
            if (trust.trusted() || (atObserved.trusted() && t.pValue() > (1 + TailTrust.RELATIVE_ERROR) * threshold)) {
                ResultRow.Diagnosis d = new ResultRow.Diagnosis("", Double.NaN, Double.NaN, cells, "asymptotic",
                    Double.NaN, "", Double.NaN, Double.NaN, t.pValue());
                return withRow(base, rebuild(row, row.note(), d).build(), t.pValue());
            }
            long samples = (long) Math.max(CaseAnalysis.SNAPSHOT_MONTE_CARLO, Math.min(
                MonteCarloPValue.drawsToResolve(threshold, EXCEEDANCES), MONTE_CARLO_ROUNDS / Math.max(1, games)));
            TestResult exact = SnapshotTest.withDefaults().withMonteCarlo(x.draws().generator(stream),
                (int) Math.min(Integer.MAX_VALUE, samples)).exactTest(observed, p);
            boolean mc = exact.smallSample().method() == TestResult.SmallSample.Method.MONTE_CARLO;
            ResultRow.Diagnosis d = new ResultRow.Diagnosis("", Double.NaN, Double.NaN, cells, mc ? "monte-carlo"
                : "exact", mc ? samples : Double.NaN, "", Double.NaN, Double.NaN, exact.pValue());
            return withRow(base, rebuild(row, row.note() + "; " + trust.reason() + "; exact multinomial test: "
                + exact.note(), d).test(row.statistic(), row.degreesOfFreedom(), exact.pValue()).build(),
                exact.pValue());
        };
        return new Pending(base.row(), base.equivalenceP(), base.disagreeP(), false, true, refine);
    }

    /**
     * Whether the stationary value describes games of this length within the tolerance, with the exact
     * finite-horizon bias beside the sampling error (descriptive).
     */
    private static Pending stationary(Context x, Quantity q) {
        double alpha = x.e().alpha();
        double[] w = x.weights(q);
        double target = CaseAnalysis.dot(w, x.exact().prediction().stationary());
        double h = Tolerance.of(x.e(), q).margin(target);
        Margin m = margin(x, w, target, h);
        Estimate est = m.estimate();
        Equivalence.Result eq = Equivalence.assess(est, target, h, alpha);
        Equivalence.BiasReport bias = Equivalence.biasReport(x.exact().value(w), target, est);
        Verdict v = switch (Equivalence.verdict(m.agreeP(), m.disagreeP(), alpha)) {
            case AGREES -> Verdict.AGREES;
            case DISAGREES -> Verdict.DISAGREES;
            default -> Verdict.INCONCLUSIVE;
        };
        String more = v == Verdict.INCONCLUSIVE && eq.additionalGamesNeeded().isPresent()
            ? "; about " + eq.additionalGamesNeeded().getAsLong() + " more games would settle it" : "";
        String why = "exact finite-horizon bias f_n - pi = " + fmt(bias.bias()) + " ("
            + fmt(bias.biasInStandardErrors()) + " standard errors of the simulated mean)";
        if (v == Verdict.DISAGREES && Math.abs(bias.bias()) > h) {
            why += "; the games are too short for the stationary value (exact value for "
                + x.c().horizon().describe() + ": " + fmt(x.exact().value(w)) + "); longer games, not more games, "
                + "would close the gap";
        }
        ResultRow row = ResultRow.builder(x.c(), q, ComparisonKind.STATIONARY).predicted(target).observed(est.value())
            .interval(m.choice().interval()).test(Double.NaN, Double.NaN, eq.differencePValue()).verdict(v)
            .note(why + more + "; " + m.note()).diagnosis(m.diagnosis(w)).build();
        return new Pending(row, m.agreeP(), m.disagreeP(), true, false, null);
    }

    /** A claimed value against the simulation (t-test and TOST) and against the exact expectation. */
    private static void claim(Context x, Quantity q, Claims.Claim claim, List<Pending> out) {
        double alpha = x.e().alpha();
        double claimed = claim.value();
        double h = claim.tolerance(x.e(), q).margin(claimed);
        double[] w = x.weights(q);
        Margin m = margin(x, w, claimed, h);
        Estimate est = m.estimate();
        Equivalence.Result eq = Equivalence.assess(est, claimed, h, alpha);
        double t = est.standardError() > 0 ? (est.value() - claimed) / est.standardError() : Double.NaN;
        out.add(new Pending(ResultRow.builder(x.c(), q, ComparisonKind.CLAIM_VS_SIMULATION).predicted(claimed)
            .observed(est.value()).interval(m.choice().interval())
            .test(t, est.degreesOfFreedom(), eq.differencePValue())
            .note("claim from line " + claim.line() + "; t-test with replicate standard error; within +-"
                + fmt(h) + ": agrees p = " + fmt(m.agreeP()) + ", disagrees p = " + fmt(m.disagreeP()) + "; "
                + m.note())
            .diagnosis(m.diagnosis(w)).build(), m.agreeP(), m.disagreeP(), true, true, null));
        if (x.exact() != null) {
            double exact = x.exact().value(w);
            Verdict v = Math.abs(exact - claimed) <= h ? Verdict.AGREES : Verdict.DISAGREES;
            out.add(new Pending(ResultRow.builder(x.c(), q, ComparisonKind.CLAIM_VS_EXACT).predicted(claimed)
                .observed(exact).verdict(v).note("claim from line " + claim.line() + "; exact expectation for "
                    + x.c().horizon().describe() + " differs by " + fmt(exact - claimed))
                .build(), Double.NaN, Double.NaN, false, true, null));
        }
    }

    /** All four claimed state frequencies against the simulation, when there is no exact covariance. */
    private static Pending claimedStates(Context x, Map<? extends Quantity, Claims.Claim> claims) {
        double[] f = new double[4];
        for (int s = 0; s < 4; s++) {
            f[s] = claims.get(BaseQuantity.STATES.get(s)).value();
        }
        TestResult t = HotellingTest.withDefaults().testRatio(x.summary(), f);
        return test(x.c(), Subject.Joint.STATES, ComparisonKind.CLAIM_VS_SIMULATION, t, "Hotelling T^2 with the "
            + "replicate covariance (no exact covariance for this case)");
    }

    private static Pending test(Case c, Subject subject, ComparisonKind kind, TestResult t, String note) {
        return new Pending(ResultRow.builder(c, subject, kind).test(t).verdict(Verdict.CONSISTENT).note(note).build(),
            Double.NaN, t.pValue(), false, true, null);
    }

    static String fmt(double v) {
        if (Double.isNaN(v)) {
            return "n/a";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "inf" : "-inf";
        }
        return String.format(Locale.ROOT, "%.4g", v);
    }
}
