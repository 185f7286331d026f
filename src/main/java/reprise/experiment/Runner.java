package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import reprise.chain.NoPredictionException;
import reprise.game.Horizon;
import reprise.sim.ProgressListener;
import reprise.sim.SimulationResult;
import reprise.sim.SimulationSpec;
import reprise.sim.Simulator;
import reprise.stats.Equivalence;
import reprise.stats.MultipleTesting;
import reprise.stats.Regime;

/**
 * Runs an experiment: per case the exact side and the simulation, then the comparisons with the
 * multiple-testing correction applied across the whole experiment.
 *
 * <p>Seeds: case i's master seed is {@link #caseSeed(long, int)} of the experiment's seed, so a case's
 * numbers do not depend on which other cases are in the file before it is expanded, only on its index;
 * game g of that case then uses the simulator's stream for (case seed, g).
 */
public final class Runner {

    /** A mixing time longer than this fraction of the game length triggers a warning. */
    static final double MIXING_WARNING_FRACTION = 0.1;
    /** A second eigenvalue modulus this close to 1 marks a nearly reducible chain. */
    static final double NEARLY_REDUCIBLE = 1e-6;
    /** More tests than this without a correction triggers a warning. */
    static final int MANY_TESTS = 20;

    private Runner() {
    }

    /**
     * The overall outcome.
     *
     * @param rows every result row, corrected, in case order
     * @param warnings experiment-level warnings
     * @param disagrees whether any row that can make the experiment fail disagrees
     */
    public record Outcome(List<ResultRow> rows, List<String> warnings, boolean disagrees) {
        /**
         * Copies the lists.
         *
         * @param rows rows
         * @param warnings warnings
         * @param disagrees flag
         */
        public Outcome {
            rows = List.copyOf(rows);
            warnings = List.copyOf(warnings);
        }
    }

    /**
     * Case i's master seed: the SplitMix64 output function applied to seed + (i + 1) * 0x9E3779B97F4A7C15.
     *
     * <p>References: Steele, G.L., Lea, D. &amp; Flood, C.H. (2014). Fast splittable pseudorandom number
     * generators. OOPSLA 2014, 453-472.
     *
     * @param seed the experiment's seed
     * @param index the case index
     * @return the case's seed
     */
    public static long caseSeed(long seed, int index) {
        long z = seed + (index + 1L) * 0x9E3779B97F4A7C15L;
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }

    /**
     * The simulation spec of a case.
     *
     * @param e the experiment
     * @param c the case
     * @param threads worker threads
     * @return the spec
     */
    public static SimulationSpec spec(Experiment e, Case c, int threads) {
        long[] snaps = e.snapshots().stream().mapToLong(Long::longValue).toArray();
        return SimulationSpec.of(c.match(), c.horizon(), e.replicates(), caseSeed(e.seed(), c.index()))
            .withBurnIn(e.burnIn()).withSnapshots(snaps).withThreads(threads);
    }

    /**
     * Checks, before anything is simulated or written, that the simulator accepts every case: its agents
     * exist and take their arguments, and its tallies fit in memory with this many threads (the
     * simulator's estimate is quoted, with the way out).
     *
     * @param e the experiment
     * @param cases its cases
     * @param threads worker threads
     * @throws InvalidExperimentException one line per problem, naming the file, the pair's line and field
     */
    public static void preflight(Experiment e, List<Case> cases, int threads) {
        Problems problems = new Problems(e.file().toString());
        List<String> seen = new ArrayList<>();
        for (Case c : cases) {
            try {
                new Simulator(spec(e, c, threads));
            } catch (IllegalArgumentException ex) {
                String message = ex.getMessage();
                if (seen.contains(c.pair() + message)) {
                    continue;
                }
                seen.add(c.pair() + message);
                int line = e.pairs().stream().filter(p -> p.name().equals(c.pair())).mapToInt(Experiment.Pair::line)
                    .findFirst().orElse(0);
                problems.add(line, "pairs." + c.pair(), "case " + c.id() + ": " + message
                    + (message.contains("MiB") ? " (in an experiment: fewer snapshots:, or a smaller --threads)" : ""));
            }
        }
        problems.throwIfAny();
    }

    /**
     * The exact side of a case, or the reason there is none.
     *
     * @param e the experiment
     * @param c the case
     * @param warnings receives guard-rail warnings
     * @return the exact side, or null (a reason is added to {@code warnings} as its first entry)
     */
    static CaseAnalysis.Exact exact(Experiment e, Case c, List<String> warnings) {
        try {
            CaseAnalysis.Exact exact = CaseAnalysis.exact(c.match(), c.horizon(), e.burnIn());
            double length = c.horizon().expectedLength();
            if (exact.prediction().mixingTime().isPresent() && e.tests().contains(Experiment.Comparison.STATIONARY)) {
                long t = exact.prediction().mixingTime().getAsLong();
                if (t > MIXING_WARNING_FRACTION * length) {
                    warnings.add(String.format(Locale.ROOT, "mixing time %d rounds against a%s game length of %s rounds: "
                        + "the stationary values are not expected to hold (the exact finite-horizon values are what "
                        + "the simulation is tested against)", t, c.horizon() instanceof Horizon.Rounds ? "" : " mean",
                        ExperimentFile.num(Math.round(length * 10) / 10.0)));
                }
            }
            double slem = exact.prediction().secondEigenvalueModulus();
            if (exact.prediction().stationary() != null && slem > 1 - NEARLY_REDUCIBLE) {
                warnings.add(String.format(Locale.ROOT, "nearly reducible chain (second eigenvalue modulus 1 - %.2g): "
                    + "the stationary distribution is ill-conditioned and mixing is very slow", 1 - slem));
            }
            if (exact.prediction().stationary() == null) {
                String note = exact.prediction().stationaryNote();
                String prefix = "no unique stationary distribution";
                double[] limit = exact.prediction().limitFrequencies();
                warnings.add((note != null && note.startsWith(prefix) ? note : prefix + ": " + note)
                    + "; time average from the first round: CC " + short6(limit[0]) + ", CD " + short6(limit[1])
                    + ", DC " + short6(limit[2]) + ", DD " + short6(limit[3]) + "; no stationary comparison is made");
            }
            if (exact.transitions() == null && exact.transitionsNote() != null
                && e.tests().contains(Experiment.Comparison.TRANSITIONS)) {
                warnings.add("no transition test: " + exact.transitionsNote());
            }
            return exact;
        } catch (NoPredictionException ex) {
            warnings.add(0, ex.getMessage());
            return null;
        }
    }

    /** Six significant digits without trailing zeros, e.g. 0.5, 0, 0.333333. */
    private static String short6(double v) {
        return new java.math.BigDecimal(v).round(new java.math.MathContext(6)).stripTrailingZeros().toPlainString();
    }

    /**
     * Runs one case: exact side and simulation.
     *
     * @param e the experiment
     * @param c the case
     * @param threads worker threads
     * @param listener progress, or null
     * @return the case result
     */
    public static CaseResult runCase(Experiment e, Case c, int threads, ProgressListener listener) {
        List<String> warnings = new ArrayList<>();
        CaseAnalysis.Exact exact = exact(e, c, warnings);
        SimulationResult sim = new Simulator(spec(e, c, threads)).run(listener);
        return withSimulation(e, c, sim, exact, warnings);
    }

    /**
     * Joins a case's simulation (for example merged from shards) with its exact side.
     *
     * @param e the experiment
     * @param c the case
     * @param sim the simulation over all replicates
     * @return the case result
     */
    public static CaseResult fromSimulation(Experiment e, Case c, SimulationResult sim) {
        List<String> warnings = new ArrayList<>();
        CaseAnalysis.Exact exact = exact(e, c, warnings);
        return withSimulation(e, c, sim, exact, warnings);
    }

    private static CaseResult withSimulation(Experiment e, Case c, SimulationResult sim, CaseAnalysis.Exact exact,
        List<String> warnings) {
        if (sim.gamesTallied() < sim.replicates() && c.horizon() instanceof Horizon.Continuation) {
            warnings.add(String.format(Locale.ROOT, "%d of %d games ended within the burn-in and count as empty "
                + "games", sim.replicates() - sim.gamesTallied(), sim.replicates()));
        }
        if (exact != null) {
            double[] expected = exact.moments().mean();
            for (int s = 0; s < 4; s++) {
                expected[s] *= sim.replicates();
            }
            warnings.addAll(Regime.sparseStateWarnings(expected));
        }
        return new CaseResult(c, caseSeed(e.seed(), c.index()), sim, exact, exact == null ? warnings.get(0) : null,
            warnings);
    }

    /**
     * Compares every case and applies the correction across the experiment.
     *
     * @param e the experiment
     * @param results the case results, in case order
     * @param claims claims by case index, each by the quantity's name in the claims file (may be empty)
     * @return the outcome
     */
    public static Outcome analyse(Experiment e, List<CaseResult> results,
        Map<Integer, ? extends Map<? extends Quantity, Claims.Claim>> claims) {
        List<Comparisons.Pending> pending = new ArrayList<>();
        for (CaseResult r : results) {
            pending.addAll(Comparisons.rows(e, r, claims.get(r.c().index())));
        }
        double threshold = correctedThreshold(e, pending);
        pending.replaceAll(p -> p.at(threshold));
        List<Integer> disagree = new ArrayList<>();
        List<Integer> agree = new ArrayList<>();
        for (int i = 0; i < pending.size(); i++) {
            Comparisons.Pending p = pending.get(i);
            if (p.counts() && Double.isFinite(p.disagreeP())) {
                disagree.add(i);
            }
            if (p.counts() && p.margin() && Double.isFinite(p.equivalenceP())) {
                agree.add(i);
            }
        }
        double[] byRowDisagree = byRow(pending.size(), disagree, adjust(e, pending, disagree, true));
        double[] byRowAgree = byRow(pending.size(), agree, adjust(e, pending, agree, false));
        List<ResultRow> rows = new ArrayList<>();
        boolean disagrees = false;
        for (int i = 0; i < pending.size(); i++) {
            Comparisons.Pending p = pending.get(i);
            Verdict v = verdict(e, p, byRowDisagree[i], byRowAgree[i]);
            rows.add(p.row().adjusted(p.counts() ? byRowDisagree[i] : Double.NaN, p.counts() ? byRowAgree[i]
                : Double.NaN, v));
            disagrees |= p.counts() && v == Verdict.DISAGREES;
        }
        double alpha = e.alpha();
        List<String> warnings = new ArrayList<>();
        if (e.correction() == Experiment.Correction.NONE && disagree.size() > MANY_TESTS) {
            warnings.add(disagree.size() + " tests were made without a multiple-testing correction: at alpha = " + alpha
                + " about " + Math.round(disagree.size() * alpha) + " false alarms are expected even if every "
                + "prediction is right (use correction: holm)");
        }
        long rare = results.stream().filter(r -> r.warnings().stream().anyMatch(w -> w.startsWith(RARE_STATE))).count();
        if (rare > 0) {
            warnings.add(rare + " of " + results.size() + " cases have a state expected fewer than "
                + (int) Regime.SPARSE_STATE_COUNT + " times over their games: their tests use finite-sample intervals "
                + "and Monte Carlo p-values under the exact model where the normal approximation is not trusted "
                + "(listed in report.md)");
        }
        return new Outcome(rows, warnings, disagrees);
    }

    /** The start of the rare-state warning of a case (the rule of {@link Regime#sparseStateWarnings}). */
    static final String RARE_STATE = "state ";

    /**
     * The smallest threshold the correction will apply to one p-value: alpha / m for Holm and
     * Benjamini-Hochberg (their first step), alpha without a correction; m is the number of rows that can
     * make the experiment disagree.
     */
    private static double correctedThreshold(Experiment e, List<Comparisons.Pending> pending) {
        long m = pending.stream().filter(p -> p.counts() && (Double.isFinite(p.disagreeP()) || p.refine() != null))
            .count();
        return e.correction() == Experiment.Correction.NONE || m <= 1 ? e.alpha() : e.alpha() / m;
    }

    /** Adjusted p-values spread back to their rows; NaN for rows not in {@code idx}. */
    private static double[] byRow(int size, List<Integer> idx, double[] adjusted) {
        double[] out = new double[size];
        java.util.Arrays.fill(out, Double.NaN);
        for (int k = 0; k < idx.size(); k++) {
            out[idx.get(k)] = adjusted[k];
        }
        return out;
    }

    /**
     * The final verdict of a row from its adjusted p-values. A row with a margin: {@link Equivalence#verdict}
     * (agrees = |d| &lt; h shown, its adjusted TOST p-value below alpha; disagrees = |d| &gt; h shown, its
     * adjusted non-equivalence p-value below alpha; otherwise inconclusive). A row without a margin is
     * consistent or disagrees (its adjusted difference p-value below alpha). Rows that do not count, or
     * have no p-value, keep their provisional verdict.
     */
    private static Verdict verdict(Experiment e, Comparisons.Pending p, double adjustedDisagree, double adjustedAgree) {
        ResultRow row = p.row();
        if (!p.counts() || !Double.isFinite(p.disagreeP())) {
            return row.verdict();
        }
        if (!p.margin()) {
            return adjustedDisagree < e.alpha() ? Verdict.DISAGREES : Verdict.CONSISTENT;
        }
        double agreeP = Double.isFinite(adjustedAgree) ? adjustedAgree : 1;
        return switch (Equivalence.verdict(agreeP, adjustedDisagree, e.alpha())) {
            case AGREES -> Verdict.AGREES;
            case DISAGREES -> Verdict.DISAGREES;
            default -> Verdict.INCONCLUSIVE;
        };
    }

    private static double[] adjust(Experiment e, List<Comparisons.Pending> pending, List<Integer> idx, boolean diff) {
        double[] p = new double[idx.size()];
        for (int k = 0; k < p.length; k++) {
            Comparisons.Pending r = pending.get(idx.get(k));
            p[k] = diff ? r.disagreeP() : r.equivalenceP();
        }
        if (p.length == 0) {
            return p;
        }
        return switch (e.correction()) {
            case HOLM -> MultipleTesting.adjust(p, MultipleTesting.Method.HOLM);
            case BH -> MultipleTesting.adjust(p, MultipleTesting.Method.BENJAMINI_HOCHBERG);
            case NONE -> p;
        };
    }
}
