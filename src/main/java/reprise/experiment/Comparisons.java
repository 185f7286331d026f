package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import reprise.stats.Equivalence;
import reprise.stats.Estimate;
import reprise.stats.GameSummary;
import reprise.stats.HotellingTest;
import reprise.stats.ReplicateInference;
import reprise.stats.TestResult;

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
 */
public final class Comparisons {

    private Comparisons() {
    }

    /**
     * A row with the extra p-value of its equivalence test, before correction.
     *
     * @param row the row (verdict provisional)
     * @param equivalenceP the TOST p-value, or NaN when the row has no margin
     * @param margin whether the row's verdict uses the tolerance
     * @param counts whether the row can make the experiment disagree (everything but stationary rows)
     * @param tolerance the margin h the row's verdict uses, or NaN for the experiment's {@code tolerance}
     */
    record Pending(ResultRow row, double equivalenceP, boolean margin, boolean counts, double tolerance) {
        /**
         * A row whose verdict uses the experiment's tolerance.
         *
         * @param row the row
         * @param equivalenceP the TOST p-value or NaN
         * @param margin whether the verdict uses the tolerance
         * @param counts whether the row can make the experiment disagree
         */
        Pending(ResultRow row, double equivalenceP, boolean margin, boolean counts) {
            this(row, equivalenceP, margin, counts, Double.NaN);
        }
    }

    /** What every comparison of one case needs. */
    private record Context(Experiment e, CaseResult r, GameSummary summary) {
        Case c() {
            return r.c();
        }

        CaseAnalysis.Exact exact() {
            return r.exact();
        }

        double[] weights(Quantity q) {
            return q.weights(r.c().match().game());
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
        Context x = new Context(e, r, CaseAnalysis.summary(r.simulation()));
        boolean enoughGames = x.summary().games() >= 2;
        if (r.exact() != null && enoughGames) {
            Map<TestId, TestResult> tests = CaseAnalysis.tests(r.exact(), r.simulation());
            if (e.tests().contains(Experiment.Comparison.FREQUENCIES)) {
                out.add(test(x.c(), Subject.Joint.STATES, ComparisonKind.EXACT,
                    tests.get(TestId.Standard.FREQUENCIES_WALD), "Wald test, exact covariance"));
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
                .verdict(Verdict.NO_PREDICTION).note(r.noPrediction()).build(), Double.NaN, false, false));
        }
        return out;
    }

    /** A quantity against its exact expectation: z-test with the exact standard error, TOST for agreement. */
    private static Pending exactQuantity(Context x, Quantity q) {
        double alpha = x.e().alpha();
        double[] w = x.weights(q);
        double h = Tolerance.of(x.e(), q).margin(x.exact().value(w));
        Estimate est = ReplicateInference.mean(x.summary(), w);
        TestResult z = CaseAnalysis.zTest(x.exact(), est, w);
        Equivalence.Result eq = Equivalence.assess(est, x.exact().value(w), h, alpha);
        ResultRow row = ResultRow.builder(x.c(), q, ComparisonKind.EXACT).predicted(x.exact().value(w))
            .observed(est.value()).interval(est.interval(1 - alpha)).test(z.statistic(), Double.NaN, z.pValue())
            .note("z-test with exact standard error " + fmt(x.exact().standardError(w, est.replicates()))
                + "; TOST within +-" + fmt(h) + " p = " + fmt(eq.equivalencePValue()))
            .build();
        return new Pending(row, eq.equivalencePValue(), true, true, h);
    }

    private static void transitions(Context x, Map<TestId, TestResult> tests, List<Pending> out) {
        TestResult t = tests.get(TestId.Standard.TRANSITIONS_PEARSON);
        if (t != null) {
            out.add(test(x.c(), Subject.Joint.TRANSITIONS, ComparisonKind.EXACT, t,
                "Anderson & Goodman (1957) Pearson form" + (t.note().isEmpty() ? "" : "; " + t.note())));
        }
    }

    private static void snapshots(Context x, Map<TestId, TestResult> tests, List<Pending> out) {
        tests.forEach((id, t) -> {
            if (id instanceof TestId.AtRound at) {
                out.add(test(x.c(), at.subject(), ComparisonKind.EXACT, t, "state at round " + at.round()
                    + " across games" + (t.note().isEmpty() ? "" : "; " + t.note())));
            }
        });
    }

    /**
     * Whether the stationary value describes games of this length within the tolerance, with the exact
     * finite-horizon bias beside the sampling error (descriptive).
     */
    private static Pending stationary(Context x, Quantity q) {
        double alpha = x.e().alpha();
        double[] w = x.weights(q);
        Estimate est = ReplicateInference.mean(x.summary(), w);
        double target = CaseAnalysis.dot(w, x.exact().prediction().stationary());
        double h = Tolerance.of(x.e(), q).margin(target);
        Equivalence.Result eq = Equivalence.assess(est, target, h, alpha);
        Equivalence.BiasReport bias = Equivalence.biasReport(x.exact().value(w), target, est);
        Verdict v = switch (eq.verdict()) {
            case AGREES -> Verdict.AGREES;
            case DISAGREES -> Verdict.DISAGREES;
            default -> Verdict.INCONCLUSIVE;
        };
        String more = eq.additionalGamesNeeded().isPresent()
            ? "; about " + eq.additionalGamesNeeded().getAsLong() + " more games would settle it" : "";
        String why = "exact finite-horizon bias f_n - pi = " + fmt(bias.bias()) + " ("
            + fmt(bias.biasInStandardErrors()) + " standard errors of the simulated mean)";
        if (v == Verdict.DISAGREES && Math.abs(bias.bias()) > h) {
            why += "; the games are too short for the stationary value (exact value for "
                + x.c().horizon().describe() + ": " + fmt(x.exact().value(w)) + "); longer games, not more games, "
                + "would close the gap";
        }
        ResultRow row = ResultRow.builder(x.c(), q, ComparisonKind.STATIONARY).predicted(target).observed(est.value())
            .interval(est.interval(1 - alpha)).test(Double.NaN, Double.NaN, eq.differencePValue()).verdict(v)
            .note(why + more).build();
        return new Pending(row, eq.equivalencePValue(), true, false, h);
    }

    /** A claimed value against the simulation (t-test and TOST) and against the exact expectation. */
    private static void claim(Context x, Quantity q, Claims.Claim claim, List<Pending> out) {
        double alpha = x.e().alpha();
        double claimed = claim.value();
        double h = claim.tolerance(x.e(), q).margin(claimed);
        double[] w = x.weights(q);
        Estimate est = ReplicateInference.mean(x.summary(), w);
        Equivalence.Result eq = Equivalence.assess(est, claimed, h, alpha);
        out.add(new Pending(ResultRow.builder(x.c(), q, ComparisonKind.CLAIM_VS_SIMULATION).predicted(claimed)
            .observed(est.value()).interval(est.interval(1 - alpha))
            .test((est.value() - claimed) / est.standardError(), est.degreesOfFreedom(), eq.differencePValue())
            .note("claim from line " + claim.line() + "; t-test with replicate standard error; TOST within +-"
                + fmt(h) + " p = " + fmt(eq.equivalencePValue()))
            .build(), eq.equivalencePValue(), true, true, h));
        if (x.exact() != null) {
            double exact = x.exact().value(w);
            Verdict v = Math.abs(exact - claimed) <= h ? Verdict.AGREES : Verdict.DISAGREES;
            out.add(new Pending(ResultRow.builder(x.c(), q, ComparisonKind.CLAIM_VS_EXACT).predicted(claimed)
                .observed(exact).verdict(v).note("claim from line " + claim.line() + "; exact expectation for "
                    + x.c().horizon().describe() + " differs by " + fmt(exact - claimed))
                .build(), Double.NaN, false, true));
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
            Double.NaN, false, true);
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
