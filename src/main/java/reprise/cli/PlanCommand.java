package reprise.cli;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.chain.NoPredictionException;
import reprise.experiment.CaseAnalysis;
import reprise.experiment.BaseQuantity;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.stats.Planning;

/**
 * {@code plan}: how many games (or rounds of one long chain) a comparison needs, from the exact
 * variances: for a target interval half-width, and for detecting a deviation with a given power.
 */
@Command(name = "plan", mixinStandardHelpOptions = true,
    description = {"Plans a simulation from the exact covariance of one game's counts: the number of independent "
        + "games for a target confidence-interval half-width of each state frequency and payoff (--half-width), "
        + "and the number to detect a deviation of that size with a given power (--detect); also the rounds of a "
        + "single long chain, from the asymptotic variance."})
final class PlanCommand implements Callable<Integer> {

    /** The quantities planned for: the four state frequencies and both payoffs per round. */
    static final List<BaseQuantity> QUANTITIES = List.of(BaseQuantity.CC, BaseQuantity.CD, BaseQuantity.DC,
        BaseQuantity.DD, BaseQuantity.PAYOFF_X, BaseQuantity.PAYOFF_Y);

    /** Variances below this times the largest squared weight are rounding error, taken as zero. */
    static final double ZERO_VARIANCE = 1e-12;

    @Spec
    CommandSpec spec;

    @Mixin
    MatchOptions options;

    @Mixin
    BurnInOption burnInOption;

    @Option(names = "--half-width", paramLabel = "W",
        description = "Target half-width of the confidence interval of each quantity (> 0).")
    Double halfWidth;

    @Option(names = "--confidence", paramLabel = "C", defaultValue = "0.95",
        description = "Confidence level of the intervals, in (0, 1). Default: ${DEFAULT-VALUE}.")
    double confidence;

    @Option(names = "--detect", paramLabel = "D",
        description = "Deviation of a quantity to detect (non-zero, in the quantity's units).")
    Double detect;

    @Option(names = "--power", paramLabel = "P", defaultValue = "0.8",
        description = "Power to detect --detect, in (alpha, 1). Default: ${DEFAULT-VALUE}.")
    double power;

    @Option(names = "--alpha", paramLabel = "A", defaultValue = "0.05",
        description = "Level of the two-sided test behind --detect, in (0, 1). Default: ${DEFAULT-VALUE}.")
    double alpha;

    @Option(names = "--json", description = "Print one JSON object (documented in README).")
    boolean json;

    /**
     * The plan for one quantity; the games and rounds are null when not asked for or not defined.
     *
     * @param name the quantity
     * @param exact its exact value over the tallied rounds, w . E[N] / E[L]
     * @param perGameVariance (w - r0)' Sigma (w - r0) / E[L]^2, Sigma the exact covariance of one game's counts
     * @param gamesForHalfWidth games for the half-width, or null
     * @param gamesToDetect games to detect the deviation, or null
     * @param asymptoticVariance lim Var(sum_t w(S_t)) / n of one long chain, or NaN when not unique
     * @param roundsForHalfWidth rounds of one long chain for the half-width, or null
     * @param roundsToDetect rounds of one long chain to detect the deviation, or null
     * @param note why something is missing, or empty
     */
    record Row(String name, double exact, double perGameVariance, Long gamesForHalfWidth, Long gamesToDetect,
        double asymptoticVariance, Long roundsForHalfWidth, Long roundsToDetect, String note) {
    }

    @Override
    public Integer call() {
        Match match = options.match();
        Horizon horizon = options.requiredHorizon("plan");
        if (halfWidth == null && detect == null) {
            throw new IllegalArgumentException("plan needs --half-width W, --detect D, or both");
        }
        if (halfWidth != null && !(halfWidth > 0 && halfWidth < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("--half-width must be a finite number > 0: " + halfWidth);
        }
        if (!(confidence > 0 && confidence < 1)) {
            throw new IllegalArgumentException("--confidence must be in (0, 1): " + confidence);
        }
        if (detect != null && !(detect != 0 && Double.isFinite(detect))) {
            throw new IllegalArgumentException("--detect must be a finite non-zero number: " + detect);
        }
        if (!(alpha > 0 && alpha < 1)) {
            throw new IllegalArgumentException("--alpha must be in (0, 1): " + alpha);
        }
        if (!(power > alpha && power < 1)) {
            throw new IllegalArgumentException("--power must be in (alpha, 1) = (" + alpha + ", 1): " + power);
        }
        long burnIn = burnInOption.shorterThan(horizon, "game");
        CaseAnalysis.Exact exact;
        try {
            exact = CaseAnalysis.exact(match, horizon, burnIn);
        } catch (NoPredictionException e) {
            throw new NoPredictionException("nothing to plan from: " + e.getMessage());
        }
        List<Row> rows = rows(exact, match);
        PrintWriter out = spec.commandLine().getOut();
        if (json) {
            out.println(Json.write(json(rows, exact, match, horizon)));
        } else {
            table(out, rows, exact, match, horizon);
        }
        return Main.OK;
    }

    private List<Row> rows(CaseAnalysis.Exact exact, Match match) {
        double[][] states = exact.prediction().asymptoticCovariance();
        double[][] payoffs = exact.prediction().payoffCovariance();
        List<Row> rows = new ArrayList<>();
        for (int i = 0; i < QUANTITIES.size(); i++) {
            BaseQuantity q = QUANTITIES.get(i);
            double[] w = q.weights(match.game());
            double se = exact.standardError(w, 1);
            double perGame = se * se;
            double asymptotic = Double.NaN;
            if (i < 4 && states != null) {
                asymptotic = states[i][i];
            } else if (i >= 4 && payoffs != null) {
                asymptotic = payoffs[i - 4][i - 4];
            }
            double scale = 0;
            for (double v : w) {
                scale = Math.max(scale, v * v);
            }
            double tiny = ZERO_VARIANCE * scale;
            List<String> notes = new ArrayList<>();
            Long gw = null;
            Long gd = null;
            if (perGame > tiny) {
                gw = halfWidth == null ? null : Planning.gamesForHalfWidth(perGame, halfWidth, confidence);
                gd = detect == null ? null : Planning.gamesToDetect(perGame, detect, alpha, power);
            } else {
                notes.add("no variation between games under the model: one game gives the exact value");
            }
            Long rw = null;
            Long rd = null;
            if (asymptotic > tiny) {
                rw = halfWidth == null ? null : Planning.roundsForHalfWidth(asymptotic, halfWidth, confidence);
                rd = detect == null ? null : Planning.gamesToDetect(asymptotic, detect, alpha, power);
            } else if (Double.isNaN(asymptotic)) {
                notes.add("no unique long-run limit, so no single-chain plan");
            } else {
                notes.add("no long-run variance: a long chain settles on the exact value");
            }
            rows.add(new Row(q.label(), exact.value(w), perGame, gw, gd, asymptotic, rw, rd, String.join("; ", notes)));
        }
        return rows;
    }

    private ObjectNode json(List<Row> rows, CaseAnalysis.Exact exact, Match match, Horizon horizon) {
        ObjectNode o = Json.object();
        o.put("x", match.x().label());
        o.put("y", match.y().label());
        o.put("game", match.game().label());
        o.set("horizon", SolveCommand.horizonNode(horizon));
        o.put("burn_in", burnInOption.burnIn);
        Json.put(o, "expected_tallied_length", exact.meanLength());
        Json.put(o, "confidence", confidence);
        if (halfWidth == null) {
            o.putNull("half_width");
        } else {
            o.put("half_width", halfWidth);
        }
        if (detect == null) {
            o.putNull("detect");
        } else {
            ObjectNode d = Json.object();
            d.put("deviation", detect);
            d.put("power", power);
            d.put("alpha", alpha);
            o.set("detect", d);
        }
        ArrayNode qs = o.putArray("quantities");
        long gw = 0;
        long gd = 0;
        for (Row r : rows) {
            ObjectNode n = Json.object();
            n.put("name", r.name());
            Json.put(n, "exact", r.exact());
            Json.put(n, "per_game_variance", r.perGameVariance());
            putLong(n, "games_for_half_width", r.gamesForHalfWidth());
            putLong(n, "games_to_detect", r.gamesToDetect());
            Json.put(n, "asymptotic_variance", r.asymptoticVariance());
            putLong(n, "rounds_for_half_width", r.roundsForHalfWidth());
            putLong(n, "rounds_to_detect", r.roundsToDetect());
            n.put("note", r.note());
            qs.add(n);
            gw = Math.max(gw, r.gamesForHalfWidth() == null ? 0 : r.gamesForHalfWidth());
            gd = Math.max(gd, r.gamesToDetect() == null ? 0 : r.gamesToDetect());
        }
        putLong(o, "games_for_half_width_all", halfWidth == null ? null : Math.max(1, gw));
        putLong(o, "games_to_detect_all", detect == null ? null : Math.max(1, gd));
        return o;
    }

    private static void putLong(ObjectNode o, String key, Long v) {
        if (v == null) {
            o.putNull(key);
        } else {
            o.put(key, v);
        }
    }

    private void table(PrintWriter out, List<Row> rows, CaseAnalysis.Exact exact, Match match, Horizon horizon) {
        out.printf(Locale.ROOT, "X: %s   Y: %s   game: %s   %s, burn-in %d%n", match.x().label(), match.y().label(),
            match.game().label(), horizon.describe(), burnInOption.burnIn);
        out.printf(Locale.ROOT, "expected tallied rounds per game: %s%n", SolveCommand.fmt(exact.meanLength()));
        if (halfWidth != null) {
            out.printf(Locale.ROOT, "half-width %s at confidence %s%n", SolveCommand.fmt(halfWidth),
                SolveCommand.fmt(confidence));
        }
        if (detect != null) {
            out.printf(Locale.ROOT, "detect a deviation of %s with power %s at alpha %s (two-sided)%n",
                SolveCommand.fmt(detect), SolveCommand.fmt(power), SolveCommand.fmt(alpha));
        }
        out.println();
        out.printf(Locale.ROOT, "%-10s %-14s %-14s %-12s %-12s %-14s %-14s %s%n", "quantity", "exact", "var/game",
            "games (W)", "games (D)", "var/round", "rounds (W)", "rounds (D)");
        for (Row r : rows) {
            out.printf(Locale.ROOT, "%-10s %-14s %-14s %-12s %-12s %-14s %-14s %s%n", r.name(), SolveCommand.fmt(r.exact()),
                SolveCommand.fmt(r.perGameVariance()), text(r.gamesForHalfWidth()), text(r.gamesToDetect()),
                SolveCommand.fmt(r.asymptoticVariance()), text(r.roundsForHalfWidth()), text(r.roundsToDetect()));
        }
        out.println();
        out.println("games: independent games of this horizon; rounds: one long chain after it has mixed");
        for (Row r : rows) {
            if (!r.note().isEmpty()) {
                out.println(r.name() + ": " + r.note());
            }
        }
    }

    private static String text(Long v) {
        return v == null ? "-" : Long.toString(v);
    }
}
