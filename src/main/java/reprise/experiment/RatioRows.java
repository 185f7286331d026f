package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.statistics.distribution.NormalDistribution;
import reprise.game.StageGame;
import reprise.stats.Equivalence;
import reprise.stats.Estimate;
import reprise.stats.GameSummary;

/**
 * The result rows that the w . N / L path of {@link Comparisons} cannot make: those of derived ratios
 * (exact, stationary and claims), and claims of a long-run value (for any quantity).
 *
 * <p>A ratio A / B is estimated by sum_g a . N_g / sum_g b . N_g with the delta-method replicate standard
 * error ({@link reprise.stats.ReplicateInference#ratio}); against its exact value E[a . N] / E[b . N] it is
 * z-tested with the exact delta-method standard error ({@link Quantities#ratioStandardError}) and
 * TOST-tested within the tolerance, as a quantity is.
 *
 * <p>A long-run claim is checked against the exact long-run value (a {@code claim-vs-exact} row that
 * counts), and for each game length the simulated games are compared with it in a descriptive
 * {@code long-run-claim-vs-simulation} row that reports the exact finite-horizon bias (exact value for
 * the length played minus the claimed long-run value) and whether games of this length match the claim
 * within the experiment's tolerance for the quantity (a row's own tolerance in the claims file judges the
 * claim against the exact long-run value).
 */
final class RatioRows {

    private static final NormalDistribution NORMAL = NormalDistribution.of(0, 1);

    private RatioRows() {
    }

    /** The reported derived ratios of an experiment. */
    private static List<DerivedQuantity> ratios(Experiment e) {
        List<DerivedQuantity> out = new ArrayList<>();
        for (Quantity q : Quantities.reported(e)) {
            if (q instanceof DerivedQuantity d && d.isRatio()) {
                out.add(d);
            }
        }
        return out;
    }

    /**
     * Each reported ratio against its exact value.
     *
     * @param e the experiment
     * @param r a case with an exact side
     * @param summary its games (at least 2)
     * @return one pending row per ratio
     */
    static List<Comparisons.Pending> exact(Experiment e, CaseResult r, GameSummary summary) {
        List<Comparisons.Pending> out = new ArrayList<>();
        StageGame game = r.c().match().game();
        for (DerivedQuantity d : ratios(e)) {
            double alpha = e.alpha();
            Estimate est = Quantities.estimate(d, game, summary);
            double exact = Quantities.exact(d, r.exact(), game);
            if (est == null || !Double.isFinite(exact)) {
                continue;
            }
            double h = Tolerance.of(e, d).margin(exact);
            double se = Quantities.ratioStandardError(d, r.exact(), game, est.replicates());
            double diff = est.value() - exact;
            double z;
            double p;
            if (!(se > 0)) {
                boolean same = Math.abs(diff) <= 1e-12 * Math.max(1, Math.abs(exact));
                z = same ? 0 : Double.POSITIVE_INFINITY;
                p = same ? 1 : 0;
            } else {
                z = diff / se;
                p = Math.min(1, 2 * NORMAL.survivalProbability(Math.abs(z)));
            }
            Equivalence.Result eq = Equivalence.assess(est, exact, h, alpha);
            ResultRow row = ResultRow.builder(r.c(), d, ComparisonKind.EXACT).predicted(exact).observed(est.value())
                .interval(est.interval(1 - alpha)).test(z, Double.NaN, p)
                .note("ratio: z-test with exact delta-method standard error " + Comparisons.fmt(se) + "; TOST within +-"
                    + Comparisons.fmt(h) + " p = " + Comparisons.fmt(eq.equivalencePValue()))
                .build();
            out.add(new Comparisons.Pending(row, eq.equivalencePValue(), eq.nonEquivalencePValue(), true, true, null));
        }
        return out;
    }

    /**
     * Each reported ratio against its stationary value (descriptive), with the exact finite-horizon bias.
     *
     * @param e the experiment
     * @param r a case with a unique stationary distribution
     * @param summary its games (at least 2)
     * @return one pending row per ratio
     */
    static List<Comparisons.Pending> stationary(Experiment e, CaseResult r, GameSummary summary) {
        List<Comparisons.Pending> out = new ArrayList<>();
        StageGame game = r.c().match().game();
        for (DerivedQuantity d : ratios(e)) {
            Estimate est = Quantities.estimate(d, game, summary);
            double target = Quantities.value(d, game, r.exact().prediction().stationary());
            if (est == null || !Double.isFinite(target)) {
                continue;
            }
            out.add(descriptive(e, r, d, est, target, Quantities.exact(d, r.exact(), game), ComparisonKind.STATIONARY,
                Tolerance.of(e, d), "exact finite-horizon bias f_n - pi = "));
        }
        return out;
    }

    /**
     * The rows of a claim on a ratio, or of a long-run claim on any quantity.
     *
     * @param e the experiment
     * @param r the case
     * @param summary its games (at least 2)
     * @param q the quantity claimed
     * @param claim the claim
     * @return the pending rows
     */
    static List<Comparisons.Pending> claim(Experiment e, CaseResult r, GameSummary summary, Quantity q,
        Claims.Claim claim) {
        List<Comparisons.Pending> out = new ArrayList<>();
        StageGame game = r.c().match().game();
        double alpha = e.alpha();
        double claimed = claim.value();
        Tolerance tolerance = claim.tolerance(e, q);
        double h = tolerance.margin(claimed);
        Estimate est = Quantities.estimate(q, game, summary);
        String from = "claim from line " + claim.line();
        if (claim.longRun()) {
            if (r.exact() != null) {
                double[] limit = r.exact().prediction().limitFrequencies();
                boolean unique = r.exact().prediction().stationary() != null;
                double longRun = Quantities.value(q, game, limit);
                Verdict v = !Double.isFinite(longRun) ? Verdict.NO_PREDICTION : Math.abs(longRun - claimed) <= h
                    ? Verdict.AGREES : Verdict.DISAGREES;
                out.add(new Comparisons.Pending(ResultRow.builder(r.c(), q, ComparisonKind.CLAIM_VS_EXACT)
                    .predicted(claimed).observed(longRun).verdict(v).note(from + " (long-run value); exact "
                        + (unique ? "stationary value" : "time-average limit (no unique stationary distribution)")
                        + " differs by " + Comparisons.fmt(longRun - claimed) + ", tolerance +-" + Comparisons.fmt(h))
                    .build(), Double.NaN, Double.NaN, false, true, null));
            }
            if (est != null) {
                double exact = r.exact() == null ? Double.NaN : Quantities.exact(q, r.exact(), game);
                exact = Double.isFinite(exact) ? exact : Double.NaN;
                out.add(descriptive(e, r, q, est, claimed, exact, ComparisonKind.LONG_RUN_CLAIM_VS_SIMULATION,
                    Tolerance.of(e, q), from + " (long-run value); exact finite-horizon bias (value for "
                        + r.c().horizon().describe() + " minus the claim) = "));
            }
            return out;
        }
        if (est != null) {
            Equivalence.Result eq = Equivalence.assess(est, claimed, h, alpha);
            out.add(new Comparisons.Pending(ResultRow.builder(r.c(), q, ComparisonKind.CLAIM_VS_SIMULATION)
                .predicted(claimed).observed(est.value()).interval(est.interval(1 - alpha))
                .test((est.value() - claimed) / est.standardError(), est.degreesOfFreedom(), eq.differencePValue())
                .note(from + "; t-test with replicate (delta-method) standard error; TOST within +-"
                    + Comparisons.fmt(h) + " p = " + Comparisons.fmt(eq.equivalencePValue()))
                .build(), eq.equivalencePValue(), eq.nonEquivalencePValue(), true, true, null));
        }
        if (r.exact() != null) {
            double exact = Quantities.exact(q, r.exact(), game);
            Verdict v = !Double.isFinite(exact) ? Verdict.NO_PREDICTION : Math.abs(exact - claimed) <= h
                ? Verdict.AGREES : Verdict.DISAGREES;
            out.add(new Comparisons.Pending(ResultRow.builder(r.c(), q, ComparisonKind.CLAIM_VS_EXACT)
                .predicted(claimed).observed(exact).verdict(v).note(from + "; exact expectation for "
                    + r.c().horizon().describe() + " differs by " + Comparisons.fmt(exact - claimed))
                .build(), Double.NaN, Double.NaN, false, true, null));
        }
        return out;
    }

    /**
     * A descriptive row: whether the simulated games match a target within the tolerance, with the exact
     * finite-horizon bias beside the sampling error (NaN bias without an exact side).
     */
    private static Comparisons.Pending descriptive(Experiment e, CaseResult r, Quantity q, Estimate est,
        double target, double exact, ComparisonKind kind, Tolerance tolerance, String biasText) {
        double alpha = e.alpha();
        double h = tolerance.margin(target);
        Equivalence.Result eq = Equivalence.assess(est, target, h, alpha);
        Verdict v = switch (eq.verdict()) {
            case AGREES -> Verdict.AGREES;
            case DISAGREES -> Verdict.DISAGREES;
            default -> Verdict.INCONCLUSIVE;
        };
        String why;
        if (Double.isFinite(exact)) {
            Equivalence.BiasReport bias = Equivalence.biasReport(exact, target, est);
            why = biasText + Comparisons.fmt(bias.bias()) + " (" + Comparisons.fmt(bias.biasInStandardErrors())
                + " standard errors of the simulated mean)";
            if (v == Verdict.DISAGREES && Math.abs(bias.bias()) > h) {
                why += "; the games are too short for the long-run value (exact value for "
                    + r.c().horizon().describe() + ": " + Comparisons.fmt(exact) + ")";
            }
        } else {
            why = biasText + "n/a (no exact chain)";
        }
        String more = eq.additionalGamesNeeded().isPresent()
            ? "; about " + eq.additionalGamesNeeded().getAsLong() + " more games would settle it" : "";
        ResultRow row = ResultRow.builder(r.c(), q, kind).predicted(target).observed(est.value())
            .interval(est.interval(1 - alpha)).test(Double.NaN, Double.NaN, eq.differencePValue()).verdict(v)
            .note(why + "; TOST within +-" + Comparisons.fmt(h) + more).build();
        return new Comparisons.Pending(row, eq.equivalencePValue(), eq.nonEquivalencePValue(), true, false, null);
    }
}
