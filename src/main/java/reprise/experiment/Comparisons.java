package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import reprise.stats.Equivalence;
import reprise.stats.Estimate;
import reprise.stats.GameSummary;
import reprise.stats.HotellingTest;
import reprise.stats.Interval;
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

    /** Comparison names. */
    public static final String EXACT = "exact";
    /** The stationary comparison. */
    public static final String STATIONARY = "stationary";
    /** A claim against the simulation. */
    public static final String CLAIM_SIMULATION = "claim-vs-simulation";
    /** A claim against the exact engine. */
    public static final String CLAIM_EXACT = "claim-vs-exact";

    private Comparisons() {
    }

    /**
     * A row with the extra p-value of its equivalence test, before correction.
     *
     * @param row the row (verdict provisional)
     * @param equivalenceP the TOST p-value, or NaN when the row has no margin
     * @param margin whether the row's verdict uses the tolerance
     * @param counts whether the row can make the experiment disagree (everything but stationary rows)
     */
    record Pending(ResultRow row, double equivalenceP, boolean margin, boolean counts) {
    }

    static List<Pending> rows(Experiment e, CaseResult r, Map<String, Claims.Claim> claims) {
        List<Pending> out = new ArrayList<>();
        Case c = r.c();
        GameSummary summary = CaseAnalysis.summary(r.simulation());
        double alpha = e.alpha();
        double h = e.tolerance();
        CaseAnalysis.Exact exact = r.exact();
        boolean enoughGames = summary.games() >= 2;
        if (exact != null && enoughGames) {
            List<CaseAnalysis.Named> named = CaseAnalysis.tests(exact, r.simulation(), Map.of());
            if (e.tests().contains(Experiment.Comparison.FREQUENCIES)) {
                for (CaseAnalysis.Named n : named) {
                    String quantity;
                    if (n.name().startsWith("frequencies")) {
                        quantity = "states";
                    } else {
                        continue;
                    }
                    out.add(test(c, quantity, EXACT, n.result(), "Wald test, exact covariance"));
                }
                for (String q : Quantities.NAMES) {
                    if (!Quantities.reported(q, e.quantities())) {
                        continue;
                    }
                    double[] w = Quantities.weights(q, c.match().game());
                    Estimate est = ReplicateInference.mean(summary, w);
                    TestResult z = CaseAnalysis.zTest(exact, est, w);
                    Equivalence.Result eq = Equivalence.assess(est, exact.value(w), h, alpha);
                    Interval ci = est.interval(1 - alpha);
                    out.add(new Pending(new ResultRow(c.index(), c.id(), q, EXACT, exact.value(w), est.value(),
                        ci.lower(), ci.upper(), z.statistic(), Double.NaN, z.pValue(), Double.NaN, Verdict.INCONCLUSIVE,
                        "z-test with exact standard error " + fmt(exact.standardError(w, est.replicates()))
                            + "; TOST within +-" + fmt(h) + " p = " + fmt(eq.equivalencePValue())),
                        eq.equivalencePValue(), true, true));
                }
            }
            if (e.tests().contains(Experiment.Comparison.TRANSITIONS)) {
                for (CaseAnalysis.Named n : named) {
                    if (n.name().equals("transitions (Pearson)")) {
                        out.add(test(c, "transitions", EXACT, n.result(), "Anderson & Goodman (1957) Pearson form"
                            + (n.result().note().isEmpty() ? "" : "; " + n.result().note())));
                    }
                }
            }
            if (e.tests().contains(Experiment.Comparison.SNAPSHOTS)) {
                for (CaseAnalysis.Named n : named) {
                    if (n.name().startsWith("snapshot t=")) {
                        String t = n.name().substring("snapshot t=".length());
                        out.add(test(c, "snapshot_" + t, EXACT, n.result(), "state at round " + t + " across games"
                            + (n.result().note().isEmpty() ? "" : "; " + n.result().note())));
                    }
                }
            }
            double[] pi = exact.prediction().stationary();
            if (e.tests().contains(Experiment.Comparison.STATIONARY) && pi != null) {
                for (String q : Quantities.NAMES) {
                    if (!Quantities.reported(q, e.quantities())) {
                        continue;
                    }
                    double[] w = Quantities.weights(q, c.match().game());
                    Estimate est = ReplicateInference.mean(summary, w);
                    double target = Quantities.dot(w, pi);
                    Equivalence.Result eq = Equivalence.assess(est, target, h, alpha);
                    Equivalence.BiasReport bias = Equivalence.biasReport(exact.value(w), target, est);
                    Interval ci = est.interval(1 - alpha);
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
                            + c.horizon().describe() + ": " + fmt(exact.value(w)) + "); longer games, not more games, "
                            + "would close the gap";
                    }
                    out.add(new Pending(new ResultRow(c.index(), c.id(), q, STATIONARY, target, est.value(), ci.lower(),
                        ci.upper(), Double.NaN, Double.NaN, eq.differencePValue(), Double.NaN, v, why + more),
                        eq.equivalencePValue(), true, false));
                }
            }
        }
        if (claims != null && enoughGames) {
            for (Map.Entry<String, Claims.Claim> cl : claims.entrySet()) {
                String q = cl.getKey();
                double claimed = cl.getValue().value();
                double[] w = Quantities.weights(q, c.match().game());
                Estimate est = ReplicateInference.mean(summary, w);
                Equivalence.Result eq = Equivalence.assess(est, claimed, h, alpha);
                Interval ci = est.interval(1 - alpha);
                out.add(new Pending(new ResultRow(c.index(), c.id(), q, CLAIM_SIMULATION, claimed, est.value(),
                    ci.lower(), ci.upper(), (est.value() - claimed) / est.standardError(), est.degreesOfFreedom(),
                    eq.differencePValue(), Double.NaN, Verdict.INCONCLUSIVE, "claim from line " + cl.getValue().line()
                        + "; t-test with replicate standard error; TOST within +-" + fmt(h) + " p = "
                        + fmt(eq.equivalencePValue())), eq.equivalencePValue(), true, true));
                if (exact != null) {
                    double x = exact.value(w);
                    Verdict v = Math.abs(x - claimed) <= h ? Verdict.AGREES : Verdict.DISAGREES;
                    out.add(new Pending(new ResultRow(c.index(), c.id(), q, CLAIM_EXACT, claimed, x, Double.NaN,
                        Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, v, "claim from line "
                            + cl.getValue().line() + "; exact expectation for " + c.horizon().describe()
                            + " differs by " + fmt(x - claimed)), Double.NaN, false, true));
                }
            }
            if (exact == null && claims.keySet().containsAll(List.of("CC", "CD", "DC", "DD"))) {
                double[] f = new double[4];
                for (int s = 0; s < 4; s++) {
                    f[s] = claims.get(Quantities.NAMES.get(s)).value();
                }
                TestResult t = HotellingTest.withDefaults().testRatio(summary, f);
                out.add(test(c, "states", CLAIM_SIMULATION, t, "Hotelling T^2 with the replicate covariance (no exact "
                    + "covariance for this case)"));
            }
        }
        if (exact == null && (claims == null || claims.isEmpty())) {
            out.add(new Pending(new ResultRow(c.index(), c.id(), "states", EXACT, Double.NaN, Double.NaN, Double.NaN,
                Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Verdict.NO_PREDICTION, r.noPrediction()),
                Double.NaN, false, false));
        }
        return out;
    }

    private static Pending test(Case c, String quantity, String comparison, TestResult t, String note) {
        return new Pending(new ResultRow(c.index(), c.id(), quantity, comparison, Double.NaN, Double.NaN, Double.NaN,
            Double.NaN, t.statistic(), t.degreesOfFreedom(), t.pValue(), Double.NaN, Verdict.CONSISTENT, note),
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
