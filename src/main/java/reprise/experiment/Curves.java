package reprise.experiment;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
import reprise.chain.CountMoments;
import reprise.chain.Frequencies;
import reprise.game.Horizon;
import reprise.game.State;
import reprise.stats.Estimate;
import reprise.stats.GameSummary;
import reprise.stats.Interval;
import reprise.stats.ReplicateInference;
import reprise.stats.WilsonInterval;

/**
 * The data behind the figures, as tidy points: what {@code curves.csv} holds and what the figures are
 * drawn from (so that {@code plot} redraws them without simulating again).
 *
 * <p>Figures: {@code convergence} (state frequencies against game length, with the exact finite-horizon
 * curve and the stationary value), {@code error} (|observed - stationary| payoff of X against game length,
 * with the exact bias), {@code payoff} (payoffs against the continuation probability),
 * {@code distribution} (state at round t: exact v_1 M^(t-1) and simulated snapshots), {@code deviation}
 * and {@code verdicts} (heatmaps over noise x game length). A group is every case that differs only in
 * the horizon (for heatmaps: in noise and horizon).
 */
public final class Curves {

    /** The series of the deviation heatmap: the exact bias of the stationary payoff at each cell's horizon. */
    public static final String DEVIATION_SERIES = "exact bias of X's payoff";

    /** Points of the dense exact curves between the shortest and the longest game. */
    static final int DENSE = 60;

    private Curves() {
    }

    /**
     * One point of one series.
     *
     * @param figure the figure
     * @param group the group label (one figure per group)
     * @param series the series label
     * @param horizon the kind of horizon of the cases behind the point: {@code rounds} (fixed game
     *     length), {@code continuation} (geometric length), or blank when not known (files written before
     *     this column existed)
     * @param x the x value (for heatmaps: the column's label value)
     * @param y the y value (for heatmaps: the row's label value)
     * @param value the cell value of a heatmap, NaN otherwise
     * @param lower the lower end of an interval, or NaN
     * @param upper the upper end, or NaN
     */
    public record Point(FigureKind figure, String group, String series, String horizon, double x, double y,
        double value, double lower, double upper) {
        /**
         * Validates the labels.
         *
         * @param figure not null
         * @param group not null
         * @param series not null
         * @param horizon not null: rounds, continuation or blank
         * @param x x
         * @param y y
         * @param value value
         * @param lower lower
         * @param upper upper
         */
        public Point {
            java.util.Objects.requireNonNull(figure, "figure");
            java.util.Objects.requireNonNull(group, "group");
            java.util.Objects.requireNonNull(series, "series");
            if (!(horizon.equals(ROUNDS) || horizon.equals(CONTINUATION) || horizon.isEmpty())) {
                throw new IllegalArgumentException("horizon of a figure point must be rounds, continuation or blank: "
                    + horizon);
            }
        }
    }

    /** The {@link Point#horizon()} of fixed-length games. */
    public static final String ROUNDS = "rounds";
    /** The {@link Point#horizon()} of games with a continuation probability. */
    public static final String CONTINUATION = "continuation";

    /** Exact moments over a dense grid of lengths are computed only for chains up to this many states. */
    static final int DENSE_MOMENTS_STATES = 16;

    private static String horizonKind(Case c) {
        return c.horizon() instanceof Horizon.Rounds ? ROUNDS : CONTINUATION;
    }

    /**
     * Builds every figure's points.
     *
     * @param e the experiment
     * @param results the case results
     * @param rows the corrected result rows
     * @param confidence the interval confidence (1 - alpha)
     * @return the points
     */
    public static List<Point> of(Experiment e, List<CaseResult> results, List<ResultRow> rows, double confidence) {
        List<Point> out = new ArrayList<>();
        Map<String, List<CaseResult>> groups = new LinkedHashMap<>();
        for (CaseResult r : results) {
            groups.computeIfAbsent(group(r.c(), true), k -> new ArrayList<>()).add(r);
        }
        for (Map.Entry<String, List<CaseResult>> g : groups.entrySet()) {
            List<CaseResult> list = g.getValue();
            if (list.get(0).c().horizon() instanceof Horizon.Rounds) {
                convergence(out, g.getKey(), list, e.burnIn(), confidence);
            } else {
                payoff(out, g.getKey(), list, rows, e, confidence);
            }
            distribution(out, g.getKey(), list, confidence);
        }
        heatmaps(out, e, results, rows);
        return out;
    }

    static String group(Case c, boolean withNoise) {
        StringBuilder sb = new StringBuilder(c.pair());
        c.parameters().forEach((k, v) -> sb.append(", ").append(k).append('=').append(ExperimentFile.num(v)));
        if (withNoise) {
            sb.append(", noise=").append(c.noise());
        }
        if (!c.misperception().equals("0")) {
            sb.append(", misperception=").append(c.misperception());
        }
        return sb.toString();
    }

    private static void convergence(List<Point> out, String group, List<CaseResult> list, long burnIn,
        double confidence) {
        TreeSet<Long> lengths = new TreeSet<>();
        java.util.Set<Long> games = new java.util.HashSet<>();
        for (CaseResult r : list) {
            GameSummary s = CaseAnalysis.summary(r.simulation());
            long n = ((Horizon.Rounds) r.c().horizon()).count();
            lengths.add(n);
            if (s.games() < 2) {
                continue;
            }
            games.add(s.games());
            for (int st = 0; st < 4; st++) {
                Estimate est = ReplicateInference.stateFrequency(s, st);
                Interval ci = est.interval(confidence);
                out.add(new Point(FigureKind.CONVERGENCE, group, State.of(st) + " simulated", ROUNDS, n, est.value(),
                    Double.NaN, ci.lower(), ci.upper()));
            }
            if (r.exact() != null && r.exact().prediction().stationary() != null) {
                double[] pi = r.exact().prediction().stationary();
                double[] u = r.c().match().game().payoffX();
                double target = CaseAnalysis.dot(u, pi);
                Estimate est = ReplicateInference.payoff(s, u);
                Interval ci = est.interval(confidence);
                double[] bounds = absoluteErrorBounds(ci.lower(), ci.upper(), target);
                out.add(new Point(FigureKind.ERROR, group, "simulated", ROUNDS, n, Math.abs(est.value() - target),
                    Double.NaN, bounds[0], bounds[1]));
            }
        }
        CaseResult last = list.get(list.size() - 1);
        if (last.exact() == null) {
            return;
        }
        long lo = Math.max(lengths.first(), burnIn + 1);
        long hi = lengths.last();
        TreeSet<Long> dense = new TreeSet<>(lengths);
        for (int i = 0; i <= DENSE && hi > lo; i++) {
            dense.add(Math.round(Math.exp(Math.log(lo) + (Math.log(hi) - Math.log(lo)) * i / DENSE)));
        }
        double[] pi = last.exact().prediction().stationary();
        double[] u = last.c().match().game().payoffX();
        // the standard error of the mean of G games needs one G: drawn when every simulated length has the same
        boolean withStandardError = pi != null && games.size() == 1;
        long g = withStandardError ? games.iterator().next() : 0;
        boolean denseMoments = last.exact().chain().size() <= DENSE_MOMENTS_STATES;
        for (long n : dense) {
            if (n <= burnIn) {
                continue;
            }
            double[] f = Frequencies.rounds(last.exact().chain(), burnIn + 1, n);
            for (int st = 0; st < 4; st++) {
                out.add(new Point(FigureKind.CONVERGENCE, group, State.of(st) + " exact", ROUNDS, n, f[st], Double.NaN,
                    Double.NaN, Double.NaN));
            }
            if (pi != null) {
                out.add(new Point(FigureKind.ERROR, group, "exact bias", ROUNDS, n,
                    Math.abs(CaseAnalysis.dot(u, f) - CaseAnalysis.dot(u, pi)), Double.NaN, Double.NaN, Double.NaN));
            }
            if (withStandardError && (denseMoments || lengths.contains(n))) {
                CountMoments m = CountMoments.rounds(last.exact().chain(), burnIn + 1, n);
                double rounds = n - burnIn;
                double se = Math.sqrt(Math.max(0, m.quadraticForm(u))) / rounds / Math.sqrt(g);
                out.add(new Point(FigureKind.ERROR, group, "exact standard error", ROUNDS, n, se, Double.NaN,
                    Double.NaN, Double.NaN));
            }
        }
        if (pi != null) {
            for (int st = 0; st < 4; st++) {
                out.add(new Point(FigureKind.CONVERGENCE, group, State.of(st) + " stationary", ROUNDS, Double.NaN,
                    pi[st], Double.NaN, Double.NaN, Double.NaN));
            }
        }
    }

    /**
     * Bounds on |m - target| for m in [lower, upper]: from the distance of the nearer end (0 when the
     * interval covers the target) to the distance of the farther end.
     */
    static double[] absoluteErrorBounds(double lower, double upper, double target) {
        if (!(lower <= upper)) {
            return new double[] {Double.NaN, Double.NaN};
        }
        double a = Math.abs(lower - target);
        double b = Math.abs(upper - target);
        double near = lower <= target && target <= upper ? 0 : Math.min(a, b);
        return new double[] {near, Math.max(a, b)};
    }

    /** A strategy template with its placeholders shown as names: "delta={continuation}" becomes "delta=\u03b4". */
    static String template(String spec) {
        return spec.replace("{" + Grid.CONTINUATION + "}", "\u03b4");
    }

    /** The legend name of a player in the payoff figure: "X (TFT)". */
    static String player(String role, String spec) {
        return role + " (" + spec + ")";
    }

    private static void payoff(List<Point> out, String group, List<CaseResult> list, List<ResultRow> rows,
        Experiment e, double confidence) {
        long burnIn = e.burnIn();
        Case first = list.get(0).c();
        // one match for the whole group unless a strategy takes the horizon as a parameter
        boolean oneMatch = list.stream().allMatch(r -> r.c().xSpec().equals(first.xSpec())
            && r.c().ySpec().equals(first.ySpec()));
        Experiment.Pair pair = e.pairs().stream().filter(p -> p.name().equals(first.pair())).findFirst().orElse(null);
        String px = player("X", oneMatch || pair == null ? first.xSpec() : template(Grid.substitute(pair.x(), first.parameters())));
        String py = player("Y", oneMatch || pair == null ? first.ySpec() : template(Grid.substitute(pair.y(), first.parameters())));
        double[] ux = first.match().game().payoffX();
        double[] uy = first.match().game().payoffY();
        TreeSet<Double> deltas = new TreeSet<>();
        CaseResult withExact = null;
        for (CaseResult r : list) {
            double delta = ((Horizon.Continuation) r.c().horizon()).probability();
            deltas.add(delta);
            GameSummary s = CaseAnalysis.summary(r.simulation());
            if (r.exact() != null) {
                withExact = r;
            }
            if (s.games() >= 2 && s.sumLength() > 0) {
                Estimate x = ReplicateInference.payoff(s, ux);
                Estimate y = ReplicateInference.payoff(s, uy);
                Interval cx = x.interval(confidence);
                Interval cy = y.interval(confidence);
                out.add(new Point(FigureKind.PAYOFF, group, px + " simulated", CONTINUATION, delta, x.value(), Double.NaN,
                    cx.lower(), cx.upper()));
                out.add(new Point(FigureKind.PAYOFF, group, py + " simulated", CONTINUATION, delta, y.value(), Double.NaN,
                    cy.lower(), cy.upper()));
            }
            for (ResultRow row : rows) {
                if (row.caseIndex() == r.c().index() && row.comparisonKind() == ComparisonKind.CLAIM_VS_EXACT
                    && (row.subject() == BaseQuantity.PAYOFF_X || row.subject() == BaseQuantity.PAYOFF_Y)) {
                    out.add(new Point(FigureKind.PAYOFF, group, (row.subject() == BaseQuantity.PAYOFF_X ? px : py)
                        + " claimed", CONTINUATION, delta, row.predicted(), Double.NaN, Double.NaN, Double.NaN));
                }
            }
        }
        if (withExact == null) {
            return;
        }
        if (!oneMatch) {
            // each delta has its own strategies: the exact payoff of each case at its own delta, nothing between
            for (CaseResult r : list) {
                if (r.exact() != null) {
                    double delta = ((Horizon.Continuation) r.c().horizon()).probability();
                    out.add(new Point(FigureKind.PAYOFF, group, px + " exact", CONTINUATION, delta, r.exact().value(ux),
                        Double.NaN, Double.NaN, Double.NaN));
                    out.add(new Point(FigureKind.PAYOFF, group, py + " exact", CONTINUATION, delta, r.exact().value(uy),
                        Double.NaN, Double.NaN, Double.NaN));
                }
            }
            return;
        }
        // the exact payoffs at the grid's values and densely between them (the chain is the same for every delta)
        TreeSet<Double> dense = new TreeSet<>(deltas);
        double lo = deltas.first();
        double hi = deltas.last();
        for (int i = 1; i < DENSE && hi > lo; i++) {
            // even steps in log(1 - delta), so that long games near delta = 1 are resolved
            dense.add(1 - Math.exp(Math.log(1 - lo) + (Math.log(1 - hi) - Math.log(1 - lo)) * i / DENSE));
        }
        for (double delta : dense) {
            double[] f = Frequencies.continuation(withExact.exact().chain(), delta, burnIn);
            out.add(new Point(FigureKind.PAYOFF, group, px + " exact", CONTINUATION, delta, CaseAnalysis.dot(ux, f),
                Double.NaN, Double.NaN, Double.NaN));
            out.add(new Point(FigureKind.PAYOFF, group, py + " exact", CONTINUATION, delta, CaseAnalysis.dot(uy, f),
                Double.NaN, Double.NaN, Double.NaN));
        }
        double[] pi = withExact.exact().prediction().stationary();
        if (pi != null) {
            out.add(new Point(FigureKind.PAYOFF, group, px + " stationary", CONTINUATION, Double.NaN,
                CaseAnalysis.dot(ux, pi), Double.NaN, Double.NaN, Double.NaN));
            out.add(new Point(FigureKind.PAYOFF, group, py + " stationary", CONTINUATION, Double.NaN,
                CaseAnalysis.dot(uy, pi), Double.NaN, Double.NaN, Double.NaN));
        }
    }

    private static void distribution(List<Point> out, String group, List<CaseResult> list, double confidence) {
        CaseResult r = list.get(list.size() - 1);
        long[] rounds = r.simulation().snapshotRounds();
        if (rounds.length == 0) {
            return;
        }
        long[][] counts = r.simulation().snapshotCounts();
        long[] reached = r.simulation().snapshotReached();
        String g = group + ", " + r.c().horizon().describe();
        for (int i = 0; i < rounds.length; i++) {
            if (reached[i] == 0) {
                continue;
            }
            for (int st = 0; st < 4; st++) {
                Interval ci = WilsonInterval.of(counts[i][st], reached[i], confidence, WilsonInterval.Correction.NONE);
                out.add(new Point(FigureKind.DISTRIBUTION, g, State.of(st) + " simulated", horizonKind(r.c()), rounds[i],
                    (double) counts[i][st] / reached[i], Double.NaN, ci.lower(), ci.upper()));
            }
        }
        if (r.exact() != null) {
            long last = rounds[rounds.length - 1];
            for (long t = 1; t <= last; t++) {
                double[] v = r.exact().chain().roundStateDistributionAt(t);
                for (int st = 0; st < 4; st++) {
                    out.add(new Point(FigureKind.DISTRIBUTION, g, State.of(st) + " exact", horizonKind(r.c()), t, v[st],
                        Double.NaN, Double.NaN, Double.NaN));
                }
            }
        }
    }

    private static void heatmaps(List<Point> out, Experiment e, List<CaseResult> results, List<ResultRow> rows) {
        if (e.noise().size() < 2 || e.horizons().size() < 2) {
            return;
        }
        for (CaseResult r : results) {
            if (r.exact() == null || r.exact().prediction().stationary() == null) {
                continue;
            }
            double noise = ExperimentFile.pair(r.c().noise())[0];
            double h = r.c().horizon() instanceof Horizon.Rounds rr ? rr.count()
                : ((Horizon.Continuation) r.c().horizon()).probability();
            String group = group(r.c(), false);
            double[] u = r.c().match().game().payoffX();
            double bias = Math.abs(r.exact().value(u) - CaseAnalysis.dot(u, r.exact().prediction().stationary()));
            out.add(new Point(FigureKind.DEVIATION, group, DEVIATION_SERIES, horizonKind(r.c()), noise, h, bias,
                Double.NaN, Double.NaN));
            for (ResultRow row : rows) {
                if (row.caseIndex() == r.c().index() && row.subject() == BaseQuantity.PAYOFF_X
                    && row.comparisonKind() == ComparisonKind.STATIONARY) {
                    out.add(new Point(FigureKind.VERDICTS, group, "stationary payoff of X within tolerance",
                        horizonKind(r.c()), noise, h,
                        row.verdict() == Verdict.AGREES ? 0 : row.verdict() == Verdict.DISAGREES ? 2 : 1, Double.NaN,
                        Double.NaN));
                }
            }
        }
    }
}
