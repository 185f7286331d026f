package reprise.cli;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;
import reprise.chain.NoPredictionException;
import reprise.chain.Prediction;
import reprise.experiment.BaseQuantity;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.sim.SimulationResult;
import reprise.stats.BatchMeans;
import reprise.stats.Estimate;
import reprise.stats.Interval;

/**
 * Intervals for one long game: batch means (Flegal &amp; Jones 2010, batch size floor(sqrt(n))) beside the
 * interval from the exact asymptotic variance (Kemeny &amp; Snell 1960), for each state frequency and payoff.
 * The state path comes from the simulator's time-resolved counts of a single game.
 */
final class LongChain {

    private LongChain() {
    }

    /** One quantity's two intervals. */
    record Row(String quantity, double mean, Interval batch, long batches, Interval exact, double stationary) {
    }

    static Row[] rows(SimulationResult r, Match match, Horizon horizon, double confidence) {
        long[][] time = r.timeResolvedCounts();
        int[] path = new int[time.length];
        for (int t = 0; t < time.length; t++) {
            for (int s = 0; s < 4; s++) {
                if (time[t][s] == 1) {
                    path[t] = s;
                }
            }
        }
        Prediction p;
        try {
            p = Prediction.of(match, horizon);
        } catch (NoPredictionException e) {
            p = null;
        }
        double[][] cov = p == null ? null : p.asymptoticCovariance();
        double[] pi = p == null ? null : p.stationary();
        List<BaseQuantity> quantities = List.of(BaseQuantity.CC, BaseQuantity.CD, BaseQuantity.DC, BaseQuantity.DD,
            BaseQuantity.PAYOFF_X, BaseQuantity.PAYOFF_Y);
        Row[] rows = new Row[quantities.size()];
        for (int q = 0; q < rows.length; q++) {
            double[] w = quantities.get(q).weights(match.game());
            Estimate bm = BatchMeans.estimate(path, w);
            Interval exact = null;
            if (cov != null) {
                double v = 0;
                for (int a = 0; a < 4; a++) {
                    for (int b = 0; b < 4; b++) {
                        v += w[a] * cov[a][b] * w[b];
                    }
                }
                exact = BatchMeans.fromAsymptoticVariance(bm.value(), Math.max(0, v), path.length).interval(confidence);
            }
            rows[q] = new Row(quantities.get(q).label(), bm.value(), bm.interval(confidence), bm.replicates(), exact,
                pi == null ? Double.NaN : dot(w, pi));
        }
        return rows;
    }

    private static double dot(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            s += a[i] * b[i];
        }
        return s;
    }

    static void table(PrintWriter out, Row[] rows, long rounds, double confidence) {
        out.println();
        out.printf(Locale.ROOT, "one game of %d rounds: %.0f%% intervals by batch means (batch size floor(sqrt(n)))"
            + " and from the exact asymptotic variance%n", rounds, 100 * confidence);
        out.println("quantity    mean          batch means                   exact asymptotic variance     stationary");
        for (Row r : rows) {
            out.printf(Locale.ROOT, "%-10s  %-12.6g  %-28s  %-28s  %s%n", r.quantity(), r.mean(),
                String.format(Locale.ROOT, "[%.6g, %.6g]", r.batch().lower(), r.batch().upper()),
                r.exact() == null ? "no exact prediction"
                    : String.format(Locale.ROOT, "[%.6g, %.6g]", r.exact().lower(), r.exact().upper()),
                Double.isNaN(r.stationary()) ? "-" : String.format(Locale.ROOT, "%.6g", r.stationary()));
        }
    }

    static ArrayNode json(Row[] rows) {
        ArrayNode a = Json.MAPPER.createArrayNode();
        for (Row r : rows) {
            ObjectNode o = a.addObject();
            o.put("quantity", r.quantity());
            Json.put(o, "mean", r.mean());
            ObjectNode b = o.putObject("batch_means");
            Json.put(b, "lower", r.batch().lower());
            Json.put(b, "upper", r.batch().upper());
            b.put("batches", r.batches());
            if (r.exact() == null) {
                o.putNull("exact");
            } else {
                ObjectNode e = o.putObject("exact");
                Json.put(e, "lower", r.exact().lower());
                Json.put(e, "upper", r.exact().upper());
            }
            Json.put(o, "stationary", r.stationary());
        }
        return a;
    }
}
