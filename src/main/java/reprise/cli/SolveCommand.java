package reprise.cli;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.PrintWriter;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.chain.CooperationRates;
import reprise.chain.Payoffs;
import reprise.chain.Prediction;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Player;
import reprise.game.StrategyDescription;
import reprise.game.ZeroDeterminant;

/** {@code solve}: the exact Markov-chain predictions for one match. */
@Command(name = "solve", mixinStandardHelpOptions = true,
    description = {"Computes the exact predictions of the Markov chain of a match: stationary distribution "
        + "(or, for non-ergodic play, the closed classes and the time-average limit), payoffs, cooperation "
        + "rates, the expected frequencies over a fixed or random game length, mixing, and the asymptotic "
        + "covariance of the state frequencies."})
final class SolveCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    MatchOptions options;

    @Option(names = "--json", description = "Print one JSON object (documented in README).")
    boolean json;

    @Override
    public Integer call() {
        Match match = options.match();
        Horizon horizon = options.horizonOrNull();
        Prediction p = Prediction.of(match, horizon);
        StrategyDescription dx = StrategyDescription.of(options.x, match.game(), Player.X);
        StrategyDescription dy = StrategyDescription.of(options.y, match.game(), Player.Y);
        PrintWriter out = spec.commandLine().getOut();
        if (json) {
            out.println(Json.write(fullJson(p, match, horizon, dx, dy)));
        } else {
            table(out, p, match);
            out.println("X resolved: " + dx.describe());
            out.println("Y resolved: " + dy.describe());
            Payoffs closed = closedForm(match, p);
            if (closed != null) {
                out.printf(Locale.ROOT, "closed form (Press & Dyson determinant): payoff X %s, payoff Y %s%n",
                    fmt(closed.x()), fmt(closed.y()));
            }
        }
        return Main.OK;
    }

    static ObjectNode horizonNode(Horizon h) {
        ObjectNode o = Json.object();
        if (h instanceof Horizon.Rounds r) {
            o.put("kind", "rounds");
            o.put("value", r.count());
        } else {
            o.put("kind", "continuation");
            o.put("value", ((Horizon.Continuation) h).probability());
        }
        return o;
    }

    static ObjectNode json(Prediction p, Match match, Horizon horizon) {
        ObjectNode o = Json.object();
        o.set("states", Json.strings(p.states().toArray(String[]::new)));
        o.put("x", match.x().label());
        o.put("y", match.y().label());
        o.put("game", match.game().label());
        o.put("chain_states", p.chainSize());
        if (p.stationary() != null) {
            o.set("stationary", Json.array(p.stationary()));
            o.putNull("stationary_note");
            o.set("stationary_payoffs", payoffs(p.stationaryPayoffs()));
            o.set("stationary_cooperation", cooperation(p.stationaryCooperation()));
        } else {
            o.putNull("stationary");
            o.put("stationary_note", p.stationaryNote());
            o.putNull("stationary_payoffs");
            o.putNull("stationary_cooperation");
        }
        o.set("limit_frequencies", Json.array(p.limitFrequencies()));
        o.set("limit_payoffs", payoffs(p.limitPayoffs()));
        o.set("closed_classes", Json.strings(p.closedClasses().toArray(String[]::new)));
        if (p.horizon() != null) {
            ObjectNode h = horizonNode(horizon);
            h.set("frequencies", Json.array(p.horizon().frequencies()));
            h.set("payoffs", payoffs(p.horizon().payoffs()));
            h.set("cooperation", cooperation(p.horizon().cooperation()));
            o.set("horizon", h);
        } else {
            o.putNull("horizon");
        }
        Json.put(o, "second_eigenvalue_modulus", p.secondEigenvalueModulus());
        if (p.mixingTime().isPresent()) {
            o.put("mixing_time", p.mixingTime().getAsLong());
        } else {
            o.putNull("mixing_time");
        }
        o.set("asymptotic_covariance", p.asymptoticCovariance() == null ? null : Json.matrix(p.asymptoticCovariance()));
        o.set("payoff_asymptotic_covariance", p.payoffCovariance() == null ? null : Json.matrix(p.payoffCovariance()));
        return o;
    }

    /**
     * Everything {@code solve --json} prints: the prediction, both resolved strategies and the closed form.
     */
    static ObjectNode fullJson(Prediction p, Match match, Horizon horizon, StrategyDescription dx,
        StrategyDescription dy) {
        ObjectNode o = json(p, match, horizon);
        o.set("x_strategy", strategyNode(dx));
        o.set("y_strategy", strategyNode(dy));
        Payoffs closed = closedForm(match, p);
        if (closed == null) {
            o.putNull("closed_form_payoffs");
        } else {
            o.set("closed_form_payoffs", payoffs(closed));
        }
        return o;
    }

    /**
     * The long-run payoffs by Press &amp; Dyson's determinant formula, an independent closed form beside the
     * chain's answer, for two memory-one players with a unique stationary distribution; null otherwise.
     */
    static Payoffs closedForm(Match match, Prediction p) {
        if (p.stationary() == null || !(match.x() instanceof reprise.game.MemoryStrategy x)
            || !(match.y() instanceof reprise.game.MemoryStrategy y) || x.memory() != 1 || y.memory() != 1) {
            return null;
        }
        try {
            return reprise.chain.ClosedForms.pressDyson(match.game(), x.table(), y.table(), match.noise());
        } catch (reprise.chain.NoPredictionException e) {
            return null;
        }
    }

    /**
     * The resolved strategy as JSON: label, kind, memory, table, first_move and zero_determinant (null, or
     * {family, chi, score, phi, phi_low, phi_high, delta}).
     */
    static ObjectNode strategyNode(StrategyDescription d) {
        ObjectNode o = Json.object();
        o.put("label", d.label());
        o.put("kind", d.kind());
        o.put("memory", d.memory());
        o.set("table", Json.array(d.table()));
        Json.put(o, "first_move", d.firstMove());
        ZeroDeterminant.Parameters z = d.zeroDeterminant();
        if (z == null) {
            o.putNull("zero_determinant");
        } else {
            ObjectNode zo = Json.object();
            zo.put("family", z.family());
            Json.put(zo, "chi", z.chi());
            Json.put(zo, "score", z.score());
            Json.put(zo, "phi", z.phi());
            Json.put(zo, "phi_low", z.phiLow());
            Json.put(zo, "phi_high", z.phiHigh());
            Json.put(zo, "delta", z.delta());
            o.set("zero_determinant", zo);
        }
        return o;
    }

    private static ObjectNode payoffs(Payoffs p) {
        ObjectNode o = Json.object();
        Json.put(o, "x", p.x());
        Json.put(o, "y", p.y());
        return o;
    }

    private static ObjectNode cooperation(CooperationRates c) {
        ObjectNode o = Json.object();
        Json.put(o, "x", c.x());
        Json.put(o, "y", c.y());
        return o;
    }

    private static void table(PrintWriter out, Prediction p, Match match) {
        out.printf(Locale.ROOT, "X: %s   Y: %s   game: %s%n", match.x().label(), match.y().label(), match.game().label());
        out.printf(Locale.ROOT, "noise: execution %s/%s, perception %s/%s; exact chain on %d states%n",
            fmt(match.noise().executionX()), fmt(match.noise().executionY()), fmt(match.noise().perceptionX()),
            fmt(match.noise().perceptionY()), p.chainSize());
        out.println();
        double[] st = p.stationary();
        double[] lim = p.limitFrequencies();
        Prediction.HorizonResult h = p.horizon();
        StringBuilder head = new StringBuilder(String.format(Locale.ROOT, "%-16s%-14s", "", st != null ? "stationary"
            : "limit"));
        if (h != null) {
            head.append(h.kind().equals("rounds") ? String.format(Locale.ROOT, "%d rounds", (long) h.value())
                : "continuation " + fmt(h.value()));
        }
        out.println(head.toString().stripTrailing());
        double[] longRun = st != null ? st : lim;
        double[] hf = h == null ? null : h.frequencies();
        for (int s = 0; s < 4; s++) {
            row(out, p.states().get(s), longRun[s], hf == null ? Double.NaN : hf[s]);
        }
        Payoffs lp = st != null ? p.stationaryPayoffs() : p.limitPayoffs();
        CooperationRates lc = CooperationRates.of(longRun);
        row(out, "cooperation X", lc.x(), h == null ? Double.NaN : h.cooperation().x());
        row(out, "cooperation Y", lc.y(), h == null ? Double.NaN : h.cooperation().y());
        row(out, "payoff X", lp.x(), h == null ? Double.NaN : h.payoffs().x());
        row(out, "payoff Y", lp.y(), h == null ? Double.NaN : h.payoffs().y());
        out.println();
        if (st == null) {
            out.println("not ergodic: " + p.stationaryNote());
            out.println("the 'limit' column is the time average from the actual first round");
        }
        out.printf(Locale.ROOT, "second eigenvalue modulus %.6g; mixing time %s%n", p.secondEigenvalueModulus(),
            p.mixingTime().isPresent() ? p.mixingTime().getAsLong() + " rounds (total variation <= 1/4)"
                : "not defined (no unique stationary distribution)");
        if (p.asymptoticCovariance() != null) {
            out.println("asymptotic covariance of state frequencies (x n):");
            double[][] c = p.asymptoticCovariance();
            for (int s = 0; s < 4; s++) {
                out.printf(Locale.ROOT, "  %-4s %12.6g %12.6g %12.6g %12.6g%n", p.states().get(s), c[s][0], c[s][1],
                    c[s][2], c[s][3]);
            }
        }
    }

    private static void row(PrintWriter out, String label, double a, double b) {
        out.printf(Locale.ROOT, "%-16s%-14s%s%n", label, fmt(a), Double.isNaN(b) ? "" : fmt(b));
    }

    static String fmt(double v) {
        if (Double.isNaN(v)) {
            return "-";
        }
        return String.format(Locale.ROOT, "%.10g", v).replaceFirst("(\\.\\d*?)0+(e|$)", "$1$2").replaceFirst("\\.(e|$)",
            "$1");
    }
}
