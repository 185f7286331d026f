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
import reprise.experiment.CaseResult;
import reprise.experiment.Comparisons;
import reprise.experiment.Experiment;
import reprise.experiment.ResultRow;
import reprise.experiment.Runner;
import reprise.experiment.Verdict;
import reprise.game.Horizon;

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
        StringBuilder sb = new StringBuilder();
        sb.append("# reprise report: ").append(e.name()).append("\n\n");
        if (!e.description().isBlank()) {
            sb.append(e.description().trim()).append("\n\n");
        }
        List<ResultRow> rows = c.outcome().rows();
        long disagree = rows.stream().filter(r -> counts(r) && r.verdict() == Verdict.DISAGREES).count();
        sb.append("## Verdict\n\n");
        if (disagree == 0) {
            sb.append("**No disagreement.** Every comparison of the simulation with the exact engine")
                .append(hasClaims(rows) ? " and with the claimed values" : "")
                .append(" agrees within the tolerance, is consistent, or is inconclusive (see below). Exit code 0.\n\n");
        } else {
            sb.append("**").append(disagree).append(disagree == 1 ? " comparison disagrees" : " comparisons disagree")
                .append("** (exit code 1):\n\n");
            sb.append("| case | quantity | comparison | predicted | observed | interval | p (adjusted) | note |\n");
            sb.append("|---|---|---|---|---|---|---|---|\n");
            rows.stream().filter(r -> counts(r) && r.verdict() == Verdict.DISAGREES).forEach(r -> sb.append("| ")
                .append(r.caseId()).append(" | ").append(r.quantity()).append(" | ").append(r.comparison()).append(" | ")
                .append(num(r.predicted())).append(" | ").append(num(r.observed())).append(" | ")
                .append(interval(r)).append(" | ").append(num(r.adjustedP())).append(" | ").append(cell(r.note()))
                .append(" |\n"));
            sb.append('\n');
        }
        Map<String, Map<Verdict, Integer>> tally = new LinkedHashMap<>();
        for (ResultRow r : rows) {
            tally.computeIfAbsent(r.comparison(), k -> new EnumMap<>(Verdict.class)).merge(r.verdict(), 1, Integer::sum);
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
            sb.append("| ").append(comp).append(" | ");
            for (Verdict v : Verdict.values()) {
                sb.append(m.getOrDefault(v, 0)).append(" | ");
            }
            sb.append('\n');
        });
        sb.append('\n');

        sb.append("## Exact engine against simulation, per case\n\n");
        sb.append("The Wald test compares the four mean state frequencies with the exact expectation for games of ")
            .append("the length played, using the exact covariance of a game's state counts; the transition test ")
            .append("(Anderson & Goodman 1957) compares the pooled transition counts with the transition matrix. ")
            .append("p-values are adjusted (").append(correction(e)).append(") across the whole experiment.\n\n");
        sb.append("| case | states: Wald p (adj.) | transitions p (adj.) | snapshots | quantities agree / inconclusive / "
            + "disagree |\n|---|---|---|---|---|\n");
        for (CaseResult r : c.results()) {
            List<ResultRow> mine = rows.stream().filter(x -> x.caseIndex() == r.c().index()
                && x.comparison().equals(Comparisons.EXACT)).toList();
            if (r.exact() == null) {
                sb.append("| ").append(r.c().id()).append(" | ").append(cell(r.noPrediction()))
                    .append(" | | | |\n");
                continue;
            }
            sb.append("| ").append(r.c().id()).append(" | ").append(testCell(mine, "states")).append(" | ")
                .append(testCell(mine, "transitions")).append(" | ");
            List<ResultRow> snaps = mine.stream().filter(x -> x.quantity().startsWith("snapshot_")).toList();
            long snapBad = snaps.stream().filter(x -> x.verdict() == Verdict.DISAGREES).count();
            sb.append(snaps.isEmpty() ? "" : (snaps.size() - snapBad) + " of " + snaps.size() + " consistent")
                .append(" | ");
            List<ResultRow> qs = mine.stream().filter(x -> !x.quantity().equals("states")
                && !x.quantity().equals("transitions") && !x.quantity().startsWith("snapshot_")).toList();
            sb.append(qs.stream().filter(x -> x.verdict() == Verdict.AGREES).count()).append(" / ")
                .append(qs.stream().filter(x -> x.verdict() == Verdict.INCONCLUSIVE).count()).append(" / ")
                .append(qs.stream().filter(x -> x.verdict() == Verdict.DISAGREES).count()).append(" |\n");
        }
        sb.append('\n');

        List<ResultRow> stationary = rows.stream().filter(r -> r.comparison().equals(Comparisons.STATIONARY)
            && r.quantity().equals("payoff_x")).toList();
        if (!stationary.isEmpty()) {
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
        if (hasClaims(rows)) {
            sb.append("## Claims\n\n| case | quantity | comparison | claimed | observed or exact | verdict | note |\n")
                .append("|---|---|---|---|---|---|---|\n");
            rows.stream().filter(r -> r.comparison().startsWith("claim")).forEach(r -> sb.append("| ")
                .append(r.caseId()).append(" | ").append(r.quantity()).append(" | ").append(r.comparison())
                .append(" | ").append(num(r.predicted())).append(" | ").append(num(r.observed())).append(" | ")
                .append(r.verdict().word()).append(" | ").append(cell(r.note())).append(" |\n"));
            sb.append('\n');
        }
        List<String> warnings = new ArrayList<>(c.outcome().warnings());
        for (CaseResult r : c.results()) {
            for (String w : r.warnings()) {
                warnings.add(r.c().id() + ": " + w);
            }
        }
        Map<String, List<String>> sparse = new LinkedHashMap<>();
        for (ResultRow r : rows) {
            String switched = smallCountNote(r.note());
            if (switched != null) {
                String how = switched.startsWith("Monte Carlo") ? "Monte Carlo multinomial test"
                    : switched.startsWith("exact") ? "exact multinomial test" : switched;
                sparse.computeIfAbsent(r.caseId(), k -> new ArrayList<>()).add(r.quantity() + " (" + how + ")");
            }
        }
        sparse.forEach((id, list) -> warnings.add(id + ": expected counts too small for the chi-square approximation, "
            + "handled in " + String.join(", ", list)));
        if (!warnings.isEmpty()) {
            sb.append("## Warnings\n\n");
            warnings.forEach(w -> sb.append("- ").append(w).append('\n'));
            sb.append('\n');
        }
        if (!c.figures().isEmpty()) {
            sb.append("## Figures\n\n");
            for (Plotter.Drawn d : c.figures()) {
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
        sb.append(ASSUMPTIONS);
        return sb.toString();
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
        "- **What \"agrees\" means.** A quantity *agrees* when two one-sided tests (Schuirmann 1987) show that its "
            + "difference from the prediction lies within the tolerance; it *disagrees* when the difference is "
            + "significant after the correction and larger than the tolerance; otherwise it is *inconclusive* and "
            + "more games are needed. A test without a tolerance (Wald, transitions, snapshots) is *consistent* "
            + "when it does not reject. Not rejecting is not proof: it says the data show no difference at this "
            + "sample size.",
        "- **Large-sample approximations.** The Wald, z and transition tests use chi-square and normal reference "
            + "distributions; the snapshot test switches to an exact multinomial test when expected counts are "
            + "small. For games of random length, per-round values are E[total] / E[length] (ratio of "
            + "expectations), not the mean of per-game averages.",
        "");

    /**
     * The part of a test's note saying that small expected counts changed the test (sparse transition
     * cells pooled, or an exact or Monte Carlo multinomial test used instead of chi-square), or null.
     */
    static String smallCountNote(String note) {
        if (note == null) {
            return null;
        }
        for (String part : note.split("; ")) {
            if (part.contains("pooled within their rows") || part.startsWith("exact multinomial test")
                || part.startsWith("Monte Carlo multinomial test")) {
                return part;
            }
        }
        return null;
    }

    private static String testCell(List<ResultRow> rows, String quantity) {
        return rows.stream().filter(r -> r.quantity().equals(quantity)).findFirst()
            .map(r -> num(r.adjustedP()) + " " + r.verdict().word()).orElse("");
    }

    private static boolean counts(ResultRow r) {
        return !r.comparison().equals(Comparisons.STATIONARY);
    }

    private static boolean hasClaims(List<ResultRow> rows) {
        return rows.stream().anyMatch(r -> r.comparison().startsWith("claim"));
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
            case "convergence" -> "State frequencies against game length (log scale): simulated with intervals, "
                + "exact finite-horizon expectation (solid), stationary value (dashed)";
            case "error" -> "Distance of the simulated payoff of X from its stationary value against game length, "
                + "with the exact bias and the sampling slope -1/2";
            case "payoff" -> "Payoffs per round against the continuation probability: exact and simulated";
            case "distribution" -> "State at round t: exact v_1 M^(t-1) and simulated snapshots";
            case "deviation" -> "|observed - stationary| payoff of X over execution error and game length";
            case "verdicts" -> "Does the stationary payoff of X hold within the tolerance, over execution error and "
                + "game length";
            default -> d.kind();
        };
        return what + " (" + d.group() + ")";
    }

    private static String interval(ResultRow r) {
        return Double.isNaN(r.lower()) ? "" : "[" + num(r.lower()) + ", " + num(r.upper()) + "]";
    }

    private static String cell(String s) {
        return s == null ? "" : s.replace("|", "\\|").replace("\n", " ");
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
