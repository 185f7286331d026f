package reprise.experiment;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.Strategies;

/** Expands an experiment's grid into cases. */
final class Grid {

    static final Pattern PLACEHOLDER = Pattern.compile("\\{([A-Za-z_][A-Za-z0-9_]*)}");

    private Grid() {
    }

    static List<Case> expand(Experiment e) {
        List<Case> out = new ArrayList<>();
        for (Experiment.Pair pair : e.pairs()) {
            for (Map<String, Double> params : parameterPoints(usedAxes(e.parameters(), pair))) {
                for (String noise : e.noise()) {
                    for (String mis : e.misperception()) {
                        for (Horizon h : e.horizons()) {
                            String xs = substitute(pair.x(), withHorizon(params, h));
                            String ys = substitute(pair.y(), withHorizon(params, h));
                            double[] ex = ExperimentFile.pair(noise);
                            double[] hx = ExperimentFile.pair(mis);
                            Match m = new Match(e.game(), Strategies.parse(xs, e.game(), Player.X),
                                Strategies.parse(ys, e.game(), Player.Y), new Noise(ex[0], ex[1], hx[0], hx[1]));
                            StringBuilder id = new StringBuilder(pair.name());
                            params.forEach((k, v) -> id.append('/').append(k).append('=').append(ExperimentFile.num(v)));
                            if (e.noise().size() > 1) {
                                id.append("/noise=").append(noise);
                            }
                            if (e.misperception().size() > 1) {
                                id.append("/misperception=").append(mis);
                            }
                            if (e.horizons().size() > 1) {
                                id.append('/').append(h.describe());
                            }
                            out.add(new Case(out.size(), id.toString(), pair.name(), xs, ys, noise, mis, h,
                                params, m));
                        }
                    }
                }
            }
        }
        return List.copyOf(out);
    }

    /**
     * The parameter axes a pair's strategies use, in the grid's order. Their points, first axis outermost,
     * are the pair's parameter points: the same, in the same order, as the distinct projections of the
     * points of all axes, without forming those (whose number is the product of every axis's size).
     */
    static Map<String, List<Double>> usedAxes(Map<String, List<Double>> axes, Experiment.Pair pair) {
        List<String> used = placeholders(pair.x() + " " + pair.y());
        Map<String, List<Double>> own = new LinkedHashMap<>();
        axes.forEach((k, v) -> {
            if (used.contains(k)) {
                own.put(k, v);
            }
        });
        return own;
    }

    /** The name under which a case's continuation probability can be written into a strategy spec. */
    static final String CONTINUATION = "continuation";

    static Map<String, Double> withHorizon(Map<String, Double> params, Horizon h) {
        if (!(h instanceof Horizon.Continuation c)) {
            return params;
        }
        Map<String, Double> m = new LinkedHashMap<>(params);
        m.put(CONTINUATION, c.probability());
        return m;
    }

    static List<String> placeholders(String text) {
        List<String> names = new ArrayList<>();
        Matcher m = PLACEHOLDER.matcher(text);
        while (m.find()) {
            if (!names.contains(m.group(1))) {
                names.add(m.group(1));
            }
        }
        return names;
    }

    static String substitute(String spec, Map<String, Double> params) {
        Matcher m = PLACEHOLDER.matcher(spec);
        StringBuilder sb = new StringBuilder();
        while (m.find()) {
            Double v = params.get(m.group(1));
            m.appendReplacement(sb, Matcher.quoteReplacement(v == null ? m.group() : ExperimentFile.num(v)));
        }
        m.appendTail(sb);
        return sb.toString();
    }

    static List<Map<String, Double>> parameterPoints(Map<String, List<Double>> axes) {
        List<Map<String, Double>> points = new ArrayList<>();
        points.add(new LinkedHashMap<>());
        for (Map.Entry<String, List<Double>> axis : axes.entrySet()) {
            List<Map<String, Double>> next = new ArrayList<>();
            for (Map<String, Double> p : points) {
                for (double v : axis.getValue()) {
                    Map<String, Double> q = new LinkedHashMap<>(p);
                    q.put(axis.getKey(), v);
                    next.add(q);
                }
            }
            points = next;
        }
        return points;
    }
}
