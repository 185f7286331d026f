package reprise.cli;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ListResourceBundle;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.experiment.CalibrationStudy;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.output.AtomicFiles;
import reprise.output.Plotter;
import reprise.sim.SimulationSpec;
import reprise.stats.Calibration;
import reprise.stats.Interval;

/**
 * {@code calibrate}: repeats a simulation with independent seeds and reports, per test, how often it
 * rejects the exact prediction: the false-alarm rate under the true model, the power under a deliberately
 * wrong one.
 */
@Command(name = "calibrate", mixinStandardHelpOptions = true,
    description = {"Repeats the simulation K times with independent seeds, tests each repetition against the "
        + "exact prediction, and reports per test the rejection rate at alpha (with a Wilson interval) and a "
        + "Kolmogorov-Smirnov p-value for the uniformity of the K p-values.",
        "With the --predict-* options the exact side assumes a wrong model, so the rates measure power.",
        "Exit code 1 only under the true model, when a valid test's rejection count is inconsistent with alpha "
            + "(two-sided binomial p below 0.001)."})
final class CalibrateCommand implements Callable<Integer> {

    /**
     * calibrate's wording of the shared simulation options, keyed by option name without dashes (picocli
     * looks an option's description up in the command's resource bundle before using its annotation).
     */
    static final class Help extends ListResourceBundle {
        @Override
        protected Object[][] getContents() {
            return new Object[][] {
                {"replicates", "Independent games per repetition (at least 2). Default: ${DEFAULT-VALUE}."},
                {"seed", "Master seed; repetition k uses the seed SplitMix64(S, k) (see README). "
                    + "Default: ${DEFAULT-VALUE}."},
                {"threads", "Repetitions run at once. Default: all cores."},
                {"snapshots", "Also test the state at these rounds across games."},
            };
        }
    }

    /** Level of the binomial check behind exit code 1. */
    static final double CHECK_LEVEL = 0.001;

    @Spec
    CommandSpec spec;

    @Mixin
    MatchOptions options;

    @Mixin
    SimulationOptions simulation;

    @Option(names = "--repetitions", paramLabel = "K", defaultValue = "200",
        description = "Independent repetitions of the whole simulation. Default: ${DEFAULT-VALUE}.")
    int repetitions;

    @Option(names = "--alpha", paramLabel = "A", defaultValue = "0.05",
        description = "Nominal level of every test, in (0, 1). Default: ${DEFAULT-VALUE}.")
    double alpha;

    @Option(names = "--predict-noise", paramLabel = "E[,EY]",
        description = "Execution error the exact side assumes (default: the simulated one).")
    String predictNoise;

    @Option(names = "--predict-misperception", paramLabel = "H[,HY]",
        description = "Perception error the exact side assumes (default: the simulated one).")
    String predictMisperception;

    @ArgGroup(exclusive = true, multiplicity = "0..1")
    PredictedHorizon predictedHorizon;

    /** The two ways to give the horizon the exact side assumes. */
    static final class PredictedHorizon {
        @Option(names = "--predict-rounds", paramLabel = "N",
            description = "Number of rounds the exact side assumes (default: the simulated horizon).")
        Long rounds;

        @Option(names = "--predict-continuation", paramLabel = "DELTA",
            description = "Continuation probability the exact side assumes.")
        Double continuation;
    }

    @Option(names = "--out", paramLabel = "DIR",
        description = "Also write DIR/calibration.csv (test, repetition, p_value), atomically, and the QQ plot of "
            + "the p-values against the uniform distribution as DIR/figures/calibration-qq.png and .svg.")
    Path out;

    @Option(names = "--json", description = "Print one JSON object (documented in README).")
    boolean json;

    /**
     * The most repetitions one run keeps: their rejection rates are then known to about +-0.0014 at
     * alpha = 0.05 (binomial standard error), and their results still fit in a default heap.
     */
    static final int MOST_REPETITIONS = 100_000;

    @Override
    public Integer call() {
        Match match = options.match();
        Horizon horizon = options.requiredHorizon("calibrate");
        simulation.check(2, "the z tests estimate a standard error");
        if (repetitions < 1 || repetitions > MOST_REPETITIONS) {
            throw new IllegalArgumentException("--repetitions must be between 1 and " + MOST_REPETITIONS
                + " (each repetition's test results are kept in memory): " + repetitions);
        }
        if (!(alpha > 0 && alpha < 1)) {
            throw new IllegalArgumentException("--alpha must be in (0, 1): " + alpha);
        }
        Match predicted = predictedMatch(match);
        Horizon predictedH = predictedHorizon(horizon);
        simulation.burnIn.shorterThan(predictedH, "predicted game");
        SimulationSpec s = simulation.spec(match, horizon);
        CalibrationStudy study = CalibrationStudy.of(s).withRepetitions(repetitions).withAlpha(alpha)
            .withPrediction(predicted, predictedH);
        PrintWriter err = spec.commandLine().getErr();
        ProgressLine progress = new ProgressLine(err, !simulation.quiet(), "calibrate: ");
        long t0 = System.nanoTime();
        CalibrationStudy.Result r;
        try {
            r = study.run(progress);
        } finally {
            progress.finish();
        }
        double seconds = (System.nanoTime() - t0) / 1e9;
        if (out != null) {
            writeCsv(out.resolve("calibration.csv"), r);
            Plotter.Drawn d = Plotter.drawCalibration(out.resolve("calibration.csv"), out.resolve("figures"));
            Plotter.manifest(out.resolve("figures"), reprise.output.figures.Figures.withDefaults(), java.util.List.of(d));
            d.result().notes().forEach(n -> err.println("calibrate: figure: " + n));
        }
        PrintWriter o = spec.commandLine().getOut();
        if (json) {
            o.println(Json.write(json(r, match, horizon, predicted, predictedH, s)));
        } else {
            table(o, r, match, horizon, predicted, predictedH, s);
        }
        if (!simulation.quiet()) {
            err.println(String.format(Locale.ROOT, "calibrate: %d repetitions, %d rounds in %.2f s on %d threads",
                r.repetitions(), r.roundsTotal(), seconds, s.threads()));
            for (String w : r.warnings()) {
                err.println("calibrate: warning: " + w);
            }
        }
        return r.trueModel() && !consistent(r) ? Main.DISAGREES : Main.OK;
    }

    static boolean consistent(CalibrationStudy.Result r) {
        for (CalibrationStudy.TestCalibration t : r.tests()) {
            if (!t.illustration() && !t.summary().consistentWithAlpha(CHECK_LEVEL)) {
                return false;
            }
        }
        return true;
    }

    private Match predictedMatch(Match m) {
        Noise n = m.noise();
        double[] e = predictNoise == null ? new double[] {n.executionX(), n.executionY()}
            : MatchOptions.pair("--predict-noise", predictNoise);
        double[] h = predictMisperception == null ? new double[] {n.perceptionX(), n.perceptionY()}
            : MatchOptions.pair("--predict-misperception", predictMisperception);
        Noise predicted;
        try {
            predicted = new Noise(e[0], e[1], h[0], h[1]);
        } catch (IllegalArgumentException ex) {
            throw new IllegalArgumentException((predictNoise != null ? "--predict-noise" : "--predict-misperception")
                + ": " + ex.getMessage(), ex);
        }
        return new Match(m.game(), m.x(), m.y(), predicted);
    }

    private Horizon predictedHorizon(Horizon h) {
        if (predictedHorizon == null) {
            return h;
        }
        if (predictedHorizon.rounds != null) {
            if (predictedHorizon.rounds < 1) {
                throw new IllegalArgumentException("--predict-rounds must be at least 1: " + predictedHorizon.rounds);
            }
            return Horizon.rounds(predictedHorizon.rounds);
        }
        double d = predictedHorizon.continuation;
        if (!(d >= 0 && d < 1)) {
            throw new IllegalArgumentException("--predict-continuation must be a probability in [0, 1): " + d);
        }
        return Horizon.continuation(d);
    }

    static void writeCsv(Path target, CalibrationStudy.Result r) {
        try {
            AtomicFiles.writeText(target, w -> {
                try (CSVPrinter csv = new CSVPrinter(w, CSVFormat.DEFAULT.builder().setRecordSeparator('\n')
                    .setHeader("test", "repetition", "p_value").build())) {
                    for (CalibrationStudy.TestCalibration t : r.tests()) {
                        int[] ks = t.repetitionIndexes();
                        double[] p = t.pValues();
                        for (int i = 0; i < p.length; i++) {
                            csv.printRecord(t.name(), ks[i], Double.toString(p[i]));
                        }
                    }
                }
            });
        } catch (UncheckedIOException e) {
            throw new IllegalArgumentException("--out: " + e.getMessage(), e);
        }
    }

    static ObjectNode json(CalibrationStudy.Result r, Match match, Horizon horizon, Match predicted,
        Horizon predictedHorizon, SimulationSpec s) {
        ObjectNode o = Json.object();
        o.put("x", match.x().label());
        o.put("y", match.y().label());
        o.put("game", match.game().label());
        o.set("horizon", SolveCommand.horizonNode(horizon));
        o.set("noise", noiseNode(match.noise()));
        ObjectNode p = Json.object();
        p.set("horizon", SolveCommand.horizonNode(predictedHorizon));
        p.set("noise", noiseNode(predicted.noise()));
        o.set("predicted", p);
        o.put("true_model", r.trueModel());
        o.put("repetitions", r.repetitions());
        o.put("replicates", s.replicates());
        o.put("burn_in", s.burnIn());
        o.put("seed", s.seed());
        o.put("alpha", r.alpha());
        if (r.transitionsNote() == null) {
            o.putNull("transitions_note");
        } else {
            o.put("transitions_note", r.transitionsNote());
        }
        ArrayNode tests = o.putArray("tests");
        for (CalibrationStudy.TestCalibration t : r.tests()) {
            Calibration.Summary c = t.summary();
            ObjectNode n = Json.object();
            n.put("name", t.name());
            n.put("illustration", t.illustration());
            n.put("runs", c.replications());
            n.put("rejections", c.rejections());
            Json.put(n, "rejection_rate", c.rejectionRate().estimate());
            ObjectNode ci = Json.object();
            Json.put(ci, "lower", c.rejectionRate().lower());
            Json.put(ci, "upper", c.rejectionRate().upper());
            Json.put(ci, "confidence", c.rejectionRate().confidence());
            n.set("rejection_rate_interval", ci);
            Json.put(n, "binomial_p", c.binomialPValue());
            Json.put(n, "uniformity_p", c.uniformityPValue());
            ArrayNode tailNodes = n.putArray("tails");
            Calibration.TailSummary tails = t.tails();
            for (int j = 0; j < tails.levels().length; j++) {
                ObjectNode tn = Json.object();
                Json.put(tn, "level", tails.levels()[j]);
                tn.put("rejections", tails.rejections()[j]);
                Json.put(tn, "rate", tails.rates()[j].estimate());
                Json.put(tn, "lower", tails.rates()[j].lower());
                Json.put(tn, "upper", tails.rates()[j].upper());
                Json.put(tn, "excess_p", tails.excessPValues()[j]);
                tailNodes.add(tn);
            }
            n.put("lower_tail_departs", tails.lowerTailDeparts());
            n.put("note", t.note());
            n.set("p_values", Json.array(t.pValues()));
            tests.add(n);
        }
        o.set("warnings", Json.strings(r.warnings().toArray(String[]::new)));
        return o;
    }

    private static String tailCell(Calibration.TailSummary tails, int j) {
        Interval rate = tails.rates()[j];
        return String.format(Locale.ROOT, "%.4f [%.4f, %.4f]", rate.estimate(), rate.lower(), rate.upper());
    }

    private static ObjectNode noiseNode(Noise n) {
        ObjectNode o = Json.object();
        o.set("execution", Json.array(new double[] {n.executionX(), n.executionY()}));
        o.set("perception", Json.array(new double[] {n.perceptionX(), n.perceptionY()}));
        return o;
    }

    private static String noiseText(Noise n) {
        return "execution " + SolveCommand.fmt(n.executionX()) + "/" + SolveCommand.fmt(n.executionY()) + ", perception "
            + SolveCommand.fmt(n.perceptionX()) + "/" + SolveCommand.fmt(n.perceptionY());
    }

    private static void table(PrintWriter out, CalibrationStudy.Result r, Match match, Horizon horizon,
        Match predicted, Horizon predictedHorizon, SimulationSpec s) {
        out.printf(Locale.ROOT, "X: %s   Y: %s   game: %s   %s%n", match.x().label(), match.y().label(),
            match.game().label(), horizon.describe());
        out.printf(Locale.ROOT, "simulated: %s%n", noiseText(match.noise()));
        if (r.trueModel()) {
            out.println("predicted: the same model, so the rates are false-alarm rates (should be near alpha)");
        } else {
            out.printf(Locale.ROOT, "predicted: %s, %s: a wrong model, so the rates are power%n",
                noiseText(predicted.noise()),
                predictedHorizon.describe());
        }
        out.printf(Locale.ROOT, "%d repetitions of %d games (burn-in %d), seed %d, alpha %s%n", r.repetitions(),
            s.replicates(), s.burnIn(), s.seed(), SolveCommand.fmt(r.alpha()));
        out.println();
        out.printf(Locale.ROOT, "%-50s %-12s %-7s %-17s %-12s %-26s %-26s %s%n", "test", "rejections", "rate",
            "95% interval", "uniformity p", "p < 0.01: rate [95%]", "p < 0.001: rate [95%]", "lower tail");
        for (CalibrationStudy.TestCalibration t : r.tests()) {
            Calibration.Summary c = t.summary();
            Calibration.TailSummary tails = t.tails();
            out.printf(Locale.ROOT, "%-50s %-12s %-7.3f [%.3f, %.3f]    %-12.3g %-26s %-26s %s%n", t.name(),
                c.rejections() + "/" + c.replications(), c.rejectionRate().estimate(), c.rejectionRate().lower(),
                c.rejectionRate().upper(), c.uniformityPValue(), tailCell(tails, 1), tailCell(tails, 2),
                tails.lowerTailDeparts() ? "departs" : "ok");
        }
        out.println();
        out.println("The pooled-rounds chi-square is shown only to illustrate a pitfall: it treats autocorrelated "
            + "rounds as independent and is not a valid test.");
        if (r.transitionsNote() != null) {
            out.println("no transition tests: " + r.transitionsNote());
        }
        for (String w : r.warnings()) {
            out.println("warning: " + w);
        }
    }
}
