package reprise.output;

import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;
import reprise.experiment.BaseQuantity;
import reprise.experiment.CaseAnalysis;
import reprise.experiment.CaseResult;
import reprise.experiment.ComparisonKind;
import reprise.experiment.Experiment;
import reprise.experiment.Quantity;
import reprise.experiment.ResultRow;
import reprise.experiment.Runner;
import reprise.experiment.Subject;
import reprise.experiment.Verdict;
import reprise.game.Horizon;
import reprise.stats.TestResult;

/** {@code report.md}: what was run, the verdicts, the figures, and the assumptions behind the verdicts. */
public final class Report {

    private Report() {
    }

    /**
     * Everything the report shows.
     *
     * @param experiment the experiment
     * @param results the case results
     * @param outcome the corrected rows and warnings
     * @param figures the figures drawn (paths relative to the report)
     * @param toolVersion the tool version
     * @param generator the generator's name
     * @param start when the run started
     * @param end when it ended
     */
    public record Content(Experiment experiment, List<CaseResult> results, Runner.Outcome outcome,
        List<Plotter.Drawn> figures, String toolVersion, String generator, Instant start, Instant end) {
    }

    /**
     * Writes the report atomically.
     *
     * @param file the target
     * @param content what to show
     */
    public static void write(Path file, Content content) {
        String text = render(content, file.toAbsolutePath().getParent());
        AtomicFiles.writeText(file, w -> w.write(text));
    }

    static String render(Content c, Path folder) {
        Experiment e = c.experiment();
        List<ResultRow> rows = c.outcome().rows();
        StringBuilder sb = new StringBuilder();
        sb.append("# reprise report: ").append(e.name()).append("\n\n");
        if (!e.description().isBlank()) {
            sb.append(e.description().trim()).append("\n\n");
        }
        verdict(sb, rows);
        tally(sb, rows);
        perCase(sb, e, c.results(), rows);
        stationary(sb, e, rows);
        claims(sb, rows);
        warnings(sb, c);
        figures(sb, c.figures(), folder);
        whatWasRun(sb, c);
        sb.append(ASSUMPTIONS);
        return sb.toString();
    }

    /** The headline: no disagreement, or the table of disagreeing rows. */
    private static void verdict(StringBuilder sb, List<ResultRow> rows) {
        List<ResultRow> disagreeing = rows.stream().filter(r -> counts(r) && r.verdict() == Verdict.DISAGREES)
            .toList();
        int disagree = disagreeing.size();
        sb.append("## Verdict\n\n");
        if (disagree == 0) {
            sb.append("**No disagreement.** Every comparison of the simulation with the exact engine")
                .append(hasClaims(rows) ? " and with the claimed values" : "")
                .append(" agrees within the tolerance, is consistent, or is inconclusive (see below). Exit code 0.\n\n");
            return;
        }
        sb.append("**").append(disagree).append(disagree == 1 ? " comparison disagrees" : " comparisons disagree")
            .append("** (exit code 1):\n\n");
        sb.append("| case | quantity | comparison | predicted | observed | interval | p (adjusted) | note |\n");
        sb.append("|---|---|---|---|---|---|---|---|\n");
        disagreeing.forEach(r -> sb.append("| ").append(r.caseId()).append(" | ").append(r.subject().label())
            .append(" | ").append(r.comparisonKind().label()).append(" | ").append(num(r.predicted())).append(" | ")
            .append(num(r.observed())).append(" | ").append(interval(r)).append(" | ").append(pValue(r.adjustedP()))
            .append(" | ").append(cell(r.note())).append(" |\n"));
        sb.append('\n');
    }

    /** Verdicts counted per comparison kind, kinds in order of first appearance. */
    private static void tally(StringBuilder sb, List<ResultRow> rows) {
        Map<ComparisonKind, Map<Verdict, Integer>> tally = new LinkedHashMap<>();
        for (ResultRow r : rows) {
            tally.computeIfAbsent(r.comparisonKind(), k -> new EnumMap<>(Verdict.class)).merge(r.verdict(), 1,
                Integer::sum);
        }
        sb.append("| comparison | ");
        for (Verdict v : Verdict.values()) {
            sb.append(v.word()).append(" | ");
        }
        sb.append("\n|---|");
        for (int i = 0; i < Verdict.values().length; i++) {
            sb.append("---|");
        }
        sb.append('\n');
        tally.forEach((comp, m) -> {
            sb.append("| ").append(comp.label()).append(" | ");
            for (Verdict v : Verdict.values()) {
                sb.append(m.getOrDefault(v, 0)).append(" | ");
            }
            sb.append('\n');
        });
        sb.append('\n');
    }

    /** One line per case: the joint tests, the snapshots and the quantities against the exact engine. */
    private static void perCase(StringBuilder sb, Experiment e, List<CaseResult> results, List<ResultRow> rows) {
        sb.append("## Exact engine against simulation, per case\n\n");
        sb.append("The Wald test compares the four mean state frequencies with the exact expectation for games of ")
            .append("the length played, using the exact covariance of a game's state counts; the transition test ")
            .append("(Anderson & Goodman 1957) compares the pooled transition counts with the transition matrix. ")
            .append("p-values are adjusted (").append(correction(e)).append(") across the whole experiment.\n\n");
        sb.append("| case | states: Wald p (adj.) | transitions p (adj.) | snapshots | quantities agree / inconclusive / "
            + "disagree |\n|---|---|---|---|---|\n");
        for (CaseResult r : results) {
            if (r.exact() == null) {
                sb.append("| ").append(r.c().id()).append(" | ").append(cell(r.noPrediction()))
                    .append(" | | | |\n");
                continue;
            }
            List<ResultRow> mine = rows.stream().filter(x -> x.caseIndex() == r.c().index()
                && x.comparisonKind() == ComparisonKind.EXACT).toList();
            sb.append("| ").append(r.c().id()).append(" | ").append(testCell(mine, Subject.Joint.STATES))
                .append(" | ").append(testCell(mine, Subject.Joint.TRANSITIONS)).append(" | ");
            List<ResultRow> snaps = mine.stream().filter(x -> x.subject() instanceof Subject.Snapshot).toList();
            long snapBad = snaps.stream().filter(x -> x.verdict() == Verdict.DISAGREES).count();
            sb.append(snaps.isEmpty() ? "" : (snaps.size() - snapBad) + " of " + snaps.size() + " consistent")
                .append(" | ");
            List<ResultRow> qs = mine.stream().filter(x -> x.subject() instanceof Quantity).toList();
            sb.append(qs.stream().filter(x -> x.verdict() == Verdict.AGREES).count()).append(" / ")
                .append(qs.stream().filter(x -> x.verdict() == Verdict.INCONCLUSIVE).count()).append(" / ")
                .append(qs.stream().filter(x -> x.verdict() == Verdict.DISAGREES).count()).append(" |\n");
        }
        sb.append('\n');
    }

    /** The stationary payoff of X against the simulation, per case (descriptive rows). */
    private static void stationary(StringBuilder sb, Experiment e, List<ResultRow> rows) {
        List<ResultRow> stationary = rows.stream().filter(r -> r.comparisonKind() == ComparisonKind.STATIONARY
            && r.subject() == BaseQuantity.PAYOFF_X).toList();
        if (stationary.isEmpty()) {
            return;
        }
        sb.append("## Does the stationary payoff describe these games?\n\n");
        sb.append("Within +-").append(num(e.tolerance())).append(": the simulated payoff of X per round against ")
            .append("its stationary (infinitely repeated) value. The finite-horizon bias f_n - pi is known exactly ")
            .append("and does not shrink with more games; sampling error does. These rows describe; they do not ")
            .append("change the exit code (write a claim to assert a value).\n\n");
        sb.append("| case | stationary | simulated | interval | verdict | why |\n|---|---|---|---|---|---|\n");
        for (ResultRow r : stationary) {
            sb.append("| ").append(r.caseId()).append(" | ").append(num(r.predicted())).append(" | ")
                .append(num(r.observed())).append(" | ").append(interval(r)).append(" | ").append(r.verdict().word())
                .append(" | ").append(cell(r.note())).append(" |\n");
        }
        sb.append('\n');
    }

    private static void claims(StringBuilder sb, List<ResultRow> rows) {
        if (!hasClaims(rows)) {
            return;
        }
        sb.append("## Claims\n\n| case | quantity | comparison | claimed | observed or exact | verdict | note |\n")
            .append("|---|---|---|---|---|---|---|\n");
        rows.stream().filter(r -> r.comparisonKind().isClaim()).forEach(r -> sb.append("| ").append(r.caseId())
            .append(" | ").append(r.subject().label()).append(" | ").append(r.comparisonKind().label()).append(" | ")
            .append(num(r.predicted())).append(" | ").append(num(r.observed())).append(" | ")
            .append(r.verdict().word()).append(" | ").append(cell(r.note())).append(" |\n"));
        sb.append('\n');
    }

    /** Experiment and case warnings, then the tests that small expected counts changed, per case. */
    private static void warnings(StringBuilder sb, Content c) {
        List<String> warnings = new ArrayList<>(c.outcome().warnings());
        for (CaseResult r : c.results()) {
            for (String w : r.warnings()) {
                warnings.add(r.c().id() + ": " + w);
            }
        }
        Map<String, List<String>> sparse = new LinkedHashMap<>();
        for (ResultRow r : c.outcome().rows()) {
            String how = smallSampleRemedy(r.smallSample());
            if (how != null) {
                sparse.computeIfAbsent(r.caseId(), k -> new ArrayList<>()).add(r.subject().label() + " (" + how + ")");
            }
        }
        sparse.forEach((id, list) -> warnings.add(id + ": expected counts too small for the chi-square approximation, "
            + "handled in " + String.join(", ", list)));
        if (!warnings.isEmpty()) {
            sb.append("## Warnings\n\n");
            warnings.forEach(w -> sb.append("- ").append(w).append('\n'));
            sb.append('\n');
        }
    }

    private static void figures(StringBuilder sb, List<Plotter.Drawn> figures, Path folder) {
        if (figures.isEmpty()) {
            return;
        }
        sb.append("## Figures\n\n");
        for (Plotter.Drawn d : figures) {
            if (d.result().files().isEmpty()) {
                sb.append("*").append(caption(d)).append(":* ").append(String.join(" ", d.result().notes()))
                    .append("\n\n");
                continue;
            }
            Path png = d.result().files().stream().filter(p -> p.toString().endsWith(".png")).findFirst()
                .orElse(d.result().files().get(0));
            String rel = folder.relativize(png.toAbsolutePath()).toString().replace('\\', '/');
            sb.append("![").append(caption(d)).append("](").append(rel).append(")\n\n");
            sb.append("*").append(caption(d)).append(".*");
            if (!d.result().notes().isEmpty()) {
                sb.append(" ").append(String.join(" ", d.result().notes()));
            }
            sb.append("\n\n");
        }
    }

    private static void whatWasRun(StringBuilder sb, Content c) {
        Experiment e = c.experiment();
        sb.append("## What was run\n\n");
        sb.append("- experiment file: `").append(e.file()).append("` (SHA-256 ").append(e.sha256()).append(")\n");
        sb.append("- game: ").append(e.game().label()).append('\n');
        for (Experiment.Pair p : e.pairs()) {
            sb.append("- pair `").append(p.name()).append("`: X = `").append(p.x()).append("`, Y = `").append(p.y())
                .append("`\n");
        }
        sb.append("- grid: execution error ").append(String.join(", ", e.noise())).append("; perception error ")
            .append(String.join(", ", e.misperception())).append("; ")
            .append(e.horizons().stream().map(Horizon::describe).collect(Collectors.joining(", ")));
        e.parameters().forEach((k, v) -> sb.append("; ").append(k).append(" = ").append(v.stream().map(Report::num)
            .collect(Collectors.joining(", "))));
        sb.append('\n');
        sb.append("- ").append(c.results().size()).append(" cases, ").append(e.replicates())
            .append(" independent games each, burn-in ").append(e.burnIn()).append(" rounds, ")
            .append(String.format(Locale.ROOT, "%,d", c.results().stream().mapToLong(r -> r.simulation().roundsTotal())
                .sum())).append(" tallied rounds\n");
        sb.append("- seed ").append(e.seed()).append(", generator ").append(c.generator())
            .append("; case i uses seed SplitMix64(seed + (i+1) 0x9E3779B97F4A7C15), game g its own stream from ")
            .append("(case seed, g)\n");
        sb.append("- alpha ").append(num(e.alpha())).append(", tolerance +-").append(num(e.tolerance()))
            .append(", correction ").append(correction(e)).append('\n');
        sb.append("- reprise ").append(c.toolVersion()).append(", Java ").append(System.getProperty("java.version"))
            .append(", started ").append(c.start()).append(", wall time ")
            .append(String.format(Locale.ROOT, "%.1f s", Duration.between(c.start(), c.end()).toMillis() / 1000.0))
            .append("\n\n");
    }

    static final String ASSUMPTIONS = String.join("\n",
        "## What the verdicts assume",
        "",
        "- **Independent games.** Each simulated game is one independent observation; rounds within a game are "
            + "not, and no verdict treats them as if they were. Games are independent because each has its own "
            + "random stream, derived from the seed and the game's index.",
        "- **The random number generator.** Streams come from XoRoShiRo128++ (Commons RNG) seeded through "
            + "SplitMix64. Its statistical quality is excellent for this use, but it is a deterministic generator: "
            + "the verdicts assume its streams behave like independent uniform draws.",
        "- **Many tests.** Every p-value is adjusted across the whole experiment by the correction named above "
            + "(Holm controls the chance of any false alarm; Benjamini-Hochberg the expected share of false alarms "
            + "among the alarms). With no correction, about alpha of all true comparisons still disagree by chance.",
        "- **What the words mean.** A quantity *agrees* when its difference d from the prediction is shown to lie "
            + "within the tolerance h (|d| < h, two one-sided tests, Schuirmann 1987, corrected); it *disagrees* when "
            + "|d| > h is shown (corrected); otherwise it is *inconclusive* and more games are needed. A test without "
            + "a tolerance (Wald, transitions, snapshots) tests any difference: *consistent* when it does not reject "
            + "after the correction, *disagrees* when it does. Not rejecting is not proof: it says the data show no "
            + "difference at this sample size.",
        "- **Approximations, and what is done when they are not trusted.** The regime of every row (results.csv: "
            + "regime, informative_games, skewness, min_expected_count) comes from games drawn from the exact model. "
            + "The t-interval is used only where few-games effects are small; otherwise the interval is a "
            + "finite-sample one (games of one length: valid for any distribution, conservative) or the "
            + "effective-size interval (random lengths, skewed proportions: approximate), always inside the "
            + "quantity's range, never a point because the games happened to be identical. Where the chi-square or "
            + "normal tail is not trusted at the corrected threshold (alpha / m), the p-value is a Monte Carlo "
            + "p-value under the exact model, or an exact multinomial test for a snapshot (p_method, mc_draws); "
            + "if the budget cannot resolve the threshold the row is inconclusive, with the reason in its note. "
            + "For games of random length, per-round values are E[total] / E[length] (ratio of expectations), not "
            + "the mean of per-game averages.",
        "");

    /**
     * How a test handled expected counts too small for the chi-square approximation, in the words of the
     * warnings, or null when it did not need to.
     */
    static String smallSampleRemedy(TestResult.SmallSample s) {
        return switch (s.method()) {
            case NONE -> null;
            case POOLED -> CaseAnalysis.pooledCellsPhrase(s.cellsPooled());
            case EXACT -> "exact multinomial test";
            case MONTE_CARLO -> "Monte Carlo multinomial test";
        };
    }

    private static String testCell(List<ResultRow> rows, Subject subject) {
        return rows.stream().filter(r -> r.subject().equals(subject)).findFirst()
            .map(r -> pValue(r.adjustedP()) + " " + r.verdict().word()).orElse("");
    }

    private static boolean counts(ResultRow r) {
        return r.comparisonKind().countsTowardsExit();
    }

    private static boolean hasClaims(List<ResultRow> rows) {
        return rows.stream().anyMatch(r -> r.comparisonKind().isClaim());
    }

    private static String correction(Experiment e) {
        return switch (e.correction()) {
            case HOLM -> "Holm 1979";
            case BH -> "Benjamini & Hochberg 1995";
            case NONE -> "none";
        };
    }

    private static String caption(Plotter.Drawn d) {
        String what = switch (d.kind()) {
            case CONVERGENCE -> "State frequencies against game length (log scale): simulated with intervals, "
                + "exact finite-horizon expectation (solid), stationary value (dashed)";
            case ERROR -> "Distance of the simulated payoff of X from its stationary value against game length, "
                + "with intervals, the exact bias (solid) and the exact standard error of the mean (dashed)";
            case PAYOFF -> "Payoffs per round against the continuation probability: exact (solid), simulated with "
                + "intervals, stationary (dashed) and claimed values where given";
            case DISTRIBUTION -> "State at round t: exact v_1 M^(t-1) and simulated snapshots";
            case DEVIATION -> "Exact bias of the payoff of X from its stationary value, over execution error and "
                + "horizon (one colour scale for all pairs)";
            case VERDICTS -> "Does the stationary payoff of X hold within the tolerance, over execution error and "
                + "horizon";
            case CALIBRATION -> d.kind().label();
        };
        return what + " (" + d.group() + ")";
    }

    private static String interval(ResultRow r) {
        return Double.isNaN(r.lower()) ? "" : "[" + num(r.lower()) + ", " + num(r.upper()) + "]";
    }

    private static String cell(String s) {
        return s == null ? "" : s.replace("|", "\\|").replace("\n", " ");
    }

    /** Below this a p-value is written as "&lt; 1e-300" in report.md and on stdout. */
    public static final double SMALLEST_P_SHOWN = 1e-300;

    /**
     * A p-value for people: NaN as empty, values below {@link #SMALLEST_P_SHOWN} (0 included, which
     * only means the survival function underflowed near the floating-point limit of about 2.2e-308) as
     * "&lt; 1e-300", others as {@link #num}. results.csv keeps the computed number, so that it stays
     * machine-readable.
     *
     * @param p the p-value
     * @return the text
     */
    public static String pValue(double p) {
        if (Double.isNaN(p)) {
            return "";
        }
        return p < SMALLEST_P_SHOWN ? "< 1e-300" : num(p);
    }

    static String num(double v) {
        if (Double.isNaN(v)) {
            return "";
        }
        if (v == 0) {
            return "0";
        }
        if (Math.abs(v) < 1e-4 || Math.abs(v) >= 1e6) {
            return String.format(Locale.ROOT, "%.3g", v);
        }
        return String.format(Locale.ROOT, "%.5g", v).replaceFirst("(\\.\\d*?)0+$", "$1").replaceFirst("\\.$", "");
    }
}
