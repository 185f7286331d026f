package reprise.cli;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.PrintWriter;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.experiment.CaseAnalysis;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.State;
import reprise.sim.Enactment;
import reprise.sim.SimulationResult;
import reprise.sim.SimulationSpec;
import reprise.sim.Simulator;
import reprise.stats.Estimate;
import reprise.stats.GameSummary;
import reprise.stats.ReplicateInference;

/** {@code simulate}: plays independent games round by round and prints the exact integer tallies. */
@Command(name = "simulate", mixinStandardHelpOptions = true,
    description = {"Plays independent games round by round, with execution and perception errors as separate "
        + "events, and prints the tallies: state counts, transition counts, payoff totals, game lengths.",
        "The same seed gives the same numbers for any --threads."})
final class SimulateCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    MatchOptions options;

    @Mixin
    SimulationOptions simulation;

    @Option(names = "--literal", description = "Always enact every event with its own draw (slower; the fast "
        + "path for memory-one players is equal in distribution).")
    boolean literal;

    @Option(names = "--json", description = "Print one JSON object (documented in README).")
    boolean json;

    @Option(names = "--long-chain", description = "For one long game (--replicates 1 --rounds N, no burn-in): "
        + "95%% intervals of each state frequency and payoff by batch means (batch size floor(sqrt(N))) beside "
        + "those from the exact asymptotic variance.")
    boolean longChain;

    /** Confidence of the --long-chain intervals. */
    static final double LONG_CHAIN_CONFIDENCE = 0.95;

    @Override
    public Integer call() {
        Match match = options.match();
        Horizon horizon = options.requiredHorizon("simulate");
        simulation.check(1, "");
        SimulationSpec s = simulation.spec(match, horizon)
            .withEnactment(literal ? Enactment.LITERAL : Enactment.FASTEST);
        if (longChain) {
            if (simulation.replicates != 1 || !(horizon instanceof Horizon.Rounds rounds)
                || simulation.burnIn.burnIn != 0) {
                throw new IllegalArgumentException("--long-chain needs one game of fixed length: --replicates 1 "
                    + "--rounds N and no --burn-in");
            }
            if (rounds.count() < 4 || rounds.count() > Integer.MAX_VALUE) {
                throw new IllegalArgumentException("--long-chain needs --rounds between 4 and " + Integer.MAX_VALUE + ": "
                    + rounds.count());
            }
            s = s.withTimeResolved((int) rounds.count());
        }
        PrintWriter err = spec.commandLine().getErr();
        ProgressLine progress = new ProgressLine(err, !simulation.quiet(), "simulate: ");
        long t0 = System.nanoTime();
        SimulationResult r = new Simulator(s).run(progress);
        progress.finish();
        double seconds = (System.nanoTime() - t0) / 1e9;
        PrintWriter out = spec.commandLine().getOut();
        LongChain.Row[] chain = longChain ? LongChain.rows(r, match, horizon, LONG_CHAIN_CONFIDENCE) : null;
        if (json) {
            ObjectNode o = json(r, match, horizon, s.threads());
            o.put("burn_in", s.burnIn());
            if (chain != null) {
                o.set("long_chain", LongChain.json(chain));
            }
            out.println(Json.write(o));
        } else {
            table(out, r, match, horizon, s.threads(), seconds);
            if (chain != null) {
                LongChain.table(out, chain, r.roundsTotal(), LONG_CHAIN_CONFIDENCE);
            }
        }
        if (!simulation.quiet()) {
            err.println(String.format(Locale.ROOT, "simulate: %d rounds in %.2f s (%.3g rounds/s) on %d threads",
                r.roundsTotal(), seconds, r.roundsTotal() / Math.max(seconds, 1e-9), s.threads()));
        }
        return Main.OK;
    }

    static ObjectNode json(SimulationResult r, Match match, Horizon horizon, int threads) {
        ObjectNode o = Json.object();
        o.set("states", Json.strings("CC", "CD", "DC", "DD"));
        o.put("x", match.x().label());
        o.put("y", match.y().label());
        o.put("game", match.game().label());
        o.set("horizon", SolveCommand.horizonNode(horizon));
        o.put("replicates", r.replicates());
        o.put("rounds_total", r.roundsTotal());
        o.set("state_counts", Json.array(r.stateCounts()));
        o.set("transition_counts", Json.matrix(r.transitionCounts()));
        ObjectNode pay = Json.object();
        Json.put(pay, "x", r.payoffTotalX());
        Json.put(pay, "y", r.payoffTotalY());
        o.set("payoff_totals", pay);
        ObjectNode len = Json.object();
        len.put("sum", r.lengthSum());
        len.put("min", r.lengthMin());
        len.put("max", r.lengthMax());
        len.put("sum_of_squares", r.lengthSumOfSquares());
        o.set("game_lengths", len);
        o.put("seed", r.seed());
        o.put("generator", r.generator());
        o.put("fast_path", r.fastPath());
        o.put("threads", threads);
        ObjectNode sums = Json.object();
        ArrayNode products = sums.putArray("state_count_products");
        for (java.math.BigInteger[] row : r.sumOfStateCountProducts()) {
            ArrayNode a = products.addArray();
            for (java.math.BigInteger v : row) {
                a.add(v);
            }
        }
        ArrayNode lengthTimes = sums.putArray("length_times_state_counts");
        for (java.math.BigInteger v : r.sumOfLengthTimesStateCounts()) {
            lengthTimes.add(v);
        }
        sums.put("length_squares", r.lengthSumOfSquares());
        o.set("per_game_sums", sums);
        Estimate[] se = standardErrors(r, match);
        if (se == null) {
            o.putNull("standard_errors");
        } else {
            ObjectNode e = Json.object();
            double[] shares = new double[4];
            for (int st = 0; st < 4; st++) {
                shares[st] = se[st].standardError();
            }
            e.set("state_shares", Json.array(shares));
            Json.put(e, "payoff_x", se[4].standardError());
            Json.put(e, "payoff_y", se[5].standardError());
            o.set("standard_errors", e);
        }
        if (r.snapshotRounds().length > 0) {
            ArrayNode snaps = o.putArray("snapshots");
            long[][] c = r.snapshotCounts();
            for (int i = 0; i < r.snapshotRounds().length; i++) {
                ObjectNode sn = Json.object();
                sn.put("round", r.snapshotRounds()[i]);
                sn.put("games", r.snapshotReached()[i]);
                sn.set("counts", Json.array(c[i]));
                snaps.add(sn);
            }
        }
        return o;
    }

    /**
     * Standard errors of the state shares and the payoffs per round over games (the ratio estimator, each game
     * one observation), or null with fewer than 2 games or no tallied round.
     *
     * @return CC, CD, DC, DD, payoff of X, payoff of Y
     */
    static Estimate[] standardErrors(SimulationResult r, Match match) {
        GameSummary g = CaseAnalysis.summary(r);
        if (g.games() < 2 || g.sumLength() <= 0) {
            return null;
        }
        Estimate[] e = new Estimate[6];
        for (int st = 0; st < 4; st++) {
            e[st] = ReplicateInference.stateFrequency(g, st);
        }
        e[4] = ReplicateInference.payoff(g, match.game().payoffX());
        e[5] = ReplicateInference.payoff(g, match.game().payoffY());
        return e;
    }

    private static void table(PrintWriter out, SimulationResult r, Match match, Horizon horizon, int threads,
        double seconds) {
        out.printf(Locale.ROOT, "X: %s   Y: %s   game: %s   %s%n", match.x().label(), match.y().label(),
            match.game().label(), horizon.describe());
        out.printf(Locale.ROOT, "%d games, %d tallied rounds, seed %d, %s%s%n", r.replicates(), r.roundsTotal(),
            r.seed(), r.generator(), r.fastPath() ? ", fused memory-one path" : ", literal path");
        out.println();
        Estimate[] se = standardErrors(r, match);
        out.println(se == null ? "state   rounds          share" : "state   rounds          share       standard error");
        long[] c = r.stateCounts();
        for (int s = 0; s < 4; s++) {
            out.printf(Locale.ROOT, "%-6s  %-14d  %.6f%s%n", State.of(s), c[s],
                r.roundsTotal() == 0 ? Double.NaN : (double) c[s] / r.roundsTotal(),
                se == null ? "" : String.format(Locale.ROOT, "    %.6f", se[s].standardError()));
        }
        out.println();
        out.println("transitions (row: round t-1, column: round t)");
        out.println("        CC            CD            DC            DD");
        long[][] t = r.transitionCounts();
        for (int s = 0; s < 4; s++) {
            out.printf(Locale.ROOT, "%-6s%-14d%-14d%-14d%-14d%n", State.of(s), t[s][0], t[s][1], t[s][2], t[s][3]);
        }
        out.println();
        if (se == null) {
            out.printf(Locale.ROOT, "payoff per round: X %.6f   Y %.6f%n", r.meanPayoffX(), r.meanPayoffY());
        } else {
            out.printf(Locale.ROOT, "payoff per round: X %.6f (standard error %.6f)   Y %.6f (standard error %.6f)%n",
                r.meanPayoffX(), se[4].standardError(), r.meanPayoffY(), se[5].standardError());
            out.println("standard errors over games (each game one observation; ratio estimator sum w.N / sum L)");
        }
        out.printf(Locale.ROOT, "game length: mean %.4f, min %d, max %d%n", (double) r.lengthSum() / r.replicates(),
            r.lengthMin(), r.lengthMax());
        long[] rounds = r.snapshotRounds();
        if (rounds.length > 0) {
            out.println();
            out.println("round   games      CC        CD        DC        DD");
            long[][] sc = r.snapshotCounts();
            for (int i = 0; i < rounds.length; i++) {
                out.printf(Locale.ROOT, "%-8d%-11d%-10d%-10d%-10d%-10d%n", rounds[i], r.snapshotReached()[i], sc[i][0],
                    sc[i][1], sc[i][2], sc[i][3]);
            }
        }
    }
}
