package reprise.experiment;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
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
     * @param x the x value (for heatmaps: the column's label value)
     * @param y the y value (for heatmaps: the row's label value)
     * @param value the cell value of a heatmap, NaN otherwise
     * @param lower the lower end of an interval, or NaN
     * @param upper the upper end, or NaN
     */
    public record Point(FigureKind figure, String group, String series, double x, double y, double value,
        double lower, double upper) {
        /**
         * Validates the labels.
         *
         * @param figure not null
         * @param group not null
         * @param series not null
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
        }
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
                payoff(out, g.getKey(), list, confidence);
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
        for (CaseResult r : list) {
            GameSummary s = CaseAnalysis.summary(r.simulation());
            long n = ((Horizon.Rounds) r.c().horizon()).count();
            lengths.add(n);
            if (s.games() < 2) {
                continue;
            }
            for (int st = 0; st < 4; st++) {
                Estimate est = ReplicateInference.stateFrequency(s, st);
                Interval ci = est.interval(confidence);
                out.add(new Point(FigureKind.CONVERGENCE, group, State.of(st) + " simulated", n, est.value(), Double.NaN,
                    ci.lower(), ci.upper()));
            }
            if (r.exact() != null && r.exact().prediction().stationary() != null) {
                double[] pi = r.exact().prediction().stationary();
                double[] u = r.c().match().game().payoffX();
                Estimate est = ReplicateInference.payoff(s, u);
                out.add(new Point(FigureKind.ERROR, group, "simulated", n, Math.abs(est.value() - CaseAnalysis.dot(u, pi)),
                    Double.NaN, Double.NaN, Double.NaN));
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
        for (long n : dense) {
            if (n <= burnIn) {
                continue;
            }
            double[] f = Frequencies.rounds(last.exact().chain(), burnIn + 1, n);
            for (int st = 0; st < 4; st++) {
                out.add(new Point(FigureKind.CONVERGENCE, group, State.of(st) + " exact", n, f[st], Double.NaN, Double.NaN,
                    Double.NaN));
            }
            if (pi != null) {
                out.add(new Point(FigureKind.ERROR, group, "exact bias", n,
                    Math.abs(CaseAnalysis.dot(u, f) - CaseAnalysis.dot(u, pi)), Double.NaN, Double.NaN, Double.NaN));
            }
        }
        if (pi != null) {
            for (int st = 0; st < 4; st++) {
                out.add(new Point(FigureKind.CONVERGENCE, group, State.of(st) + " stationary", Double.NaN, pi[st], Double.NaN,
                    Double.NaN, Double.NaN));
            }
        }
    }

    private static void payoff(List<Point> out, String group, List<CaseResult> list, double confidence) {
        for (CaseResult r : list) {
            double delta = ((Horizon.Continuation) r.c().horizon()).probability();
            GameSummary s = CaseAnalysis.summary(r.simulation());
            if (r.exact() != null) {
                double[] f = r.exact().frequencies();
                out.add(new Point(FigureKind.PAYOFF, group, "X exact", delta, CaseAnalysis.dot(r.c().match().game().payoffX(), f),
                    Double.NaN, Double.NaN, Double.NaN));
                out.add(new Point(FigureKind.PAYOFF, group, "Y exact", delta, CaseAnalysis.dot(r.c().match().game().payoffY(), f),
                    Double.NaN, Double.NaN, Double.NaN));
            }
            if (s.games() >= 2 && s.sumLength() > 0) {
                Estimate x = ReplicateInference.payoff(s, r.c().match().game().payoffX());
                Estimate y = ReplicateInference.payoff(s, r.c().match().game().payoffY());
                Interval cx = x.interval(confidence);
                Interval cy = y.interval(confidence);
                out.add(new Point(FigureKind.PAYOFF, group, "X simulated", delta, x.value(), Double.NaN, cx.lower(), cx.upper()));
                out.add(new Point(FigureKind.PAYOFF, group, "Y simulated", delta, y.value(), Double.NaN, cy.lower(), cy.upper()));
            }
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
                out.add(new Point(FigureKind.DISTRIBUTION, g, State.of(st) + " simulated", rounds[i],
                    (double) counts[i][st] / reached[i], Double.NaN, ci.lower(), ci.upper()));
            }
        }
        if (r.exact() != null) {
            long last = rounds[rounds.length - 1];
            for (long t = 1; t <= last; t++) {
                double[] v = r.exact().chain().roundStateDistributionAt(t);
                for (int st = 0; st < 4; st++) {
                    out.add(new Point(FigureKind.DISTRIBUTION, g, State.of(st) + " exact", t, v[st], Double.NaN, Double.NaN,
                        Double.NaN));
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
            for (ResultRow row : rows) {
                if (row.caseIndex() == r.c().index() && row.subject() == BaseQuantity.PAYOFF_X
                    && row.comparisonKind() == ComparisonKind.STATIONARY) {
                    out.add(new Point(FigureKind.DEVIATION, group, "|observed - stationary| payoff of X", noise, h,
                        Math.abs(row.observed() - row.predicted()), Double.NaN, Double.NaN));
                    out.add(new Point(FigureKind.VERDICTS, group, "stationary payoff of X within tolerance", noise, h,
                        row.verdict() == Verdict.AGREES ? 0 : row.verdict() == Verdict.DISAGREES ? 2 : 1, Double.NaN,
                        Double.NaN));
                }
            }
        }
    }
}
