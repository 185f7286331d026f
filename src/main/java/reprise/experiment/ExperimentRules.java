package reprise.experiment;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import reprise.game.Horizon;
import reprise.game.Player;
import reprise.game.Strategies;

/**
 * The rules of an experiment file that join several fields, and the limits that follow from them: burn-in
 * and snapshots against the shortest game, the per-case sums of squared counts against the range of a
 * long, the snapshot comparison against the snapshot list, strategy placeholders against the grid's
 * parameters, and every strategy spec of every grid point against the stage game. Each rule reports at
 * the line of the field a user would change.
 */
final class ExperimentRules {

    /**
     * The per-case sums of squared counts are kept in longs (at most 9.22e18); for games of random length
     * the expected sum must stay below a quarter of that, so that a long tail does not reach it.
     */
    static final double SUM_OF_SQUARES_LIMIT = Long.MAX_VALUE / 4.0;
    /**
     * The most cases one experiment may expand into. The count is the product of the grid's axis sizes,
     * taken before anything is expanded, so that a short file describing a huge grid is refused at once
     * (each case costs an exact chain, a simulation and rows in every output file).
     */
    static final long MOST_CASES = 100_000;

    private ExperimentRules() {
    }

    /**
     * Applies every cross-field rule to the fields read so far (fields that failed their own checks hold
     * defaults, so a rule may add a second message about the same mistake only where it says more).
     *
     * @param schema the fields read, with the lines of the top-level keys
     * @param problems where problems go
     */
    static void check(ExperimentSchema schema, Problems problems) {
        Experiment.Builder b = schema.builder();
        lengths(b, schema, problems);
        if (b.tests.contains(Experiment.Comparison.SNAPSHOTS) && b.snapshots.isEmpty() && schema.given("tests")) {
            problems.add(schema.line("tests"), "tests", "'snapshots' needs a snapshots: list of rounds");
        }
        if (!schema.given("tests") && b.snapshots.isEmpty()) {
            b.tests.remove(Experiment.Comparison.SNAPSHOTS);
        }
        if (b.parameters.containsKey(Grid.CONTINUATION)) {
            problems.add(schema.line("grid"), "grid.parameters.continuation", "is a reserved name: {continuation} "
                + "stands for each case's continuation probability");
        }
        List<String> setPlaceholders = strategySet(b, problems);
        placeholders(b.pairs, b.parameters, b.continuation(), schema.line("grid"), setPlaceholders, problems);
        double cases = caseCount(b);
        if (cases > MOST_CASES) {
            problems.add(schema.line("grid"), "grid", String.format(Locale.ROOT, "expands into %s cases (pairs x "
                + "values of the parameters each pair uses x noise x misperception x game lengths); at most %d cases "
                + "in one experiment: use fewer values, or split the grid over several files",
                cases < 1e15 ? Long.toString((long) cases) : String.format(Locale.ROOT, "%.3g", cases), MOST_CASES));
        } else if (b.game != null) {
            strategies(b, problems);
        }
    }

    /**
     * The number of cases the grid expands into, from the axis sizes alone (nothing is expanded): for each
     * pair, the product of the sizes of the parameters it uses, times noise, misperception and game-length
     * values. A double, so that no product overflows; exact up to 2^53.
     */
    static double caseCount(Experiment.Builder b) {
        double perPair = (double) Math.max(1, b.noise.size()) * Math.max(1, b.misperception.size())
            * Math.max(1, b.horizons.size());
        double total = 0;
        for (Experiment.Pair p : b.pairs) {
            double points = perPair;
            for (String ph : Grid.placeholders(p.x() + " " + p.y())) {
                List<Double> axis = b.parameters.get(ph);
                if (axis != null) {
                    points *= Math.max(1, axis.size());
                }
            }
            total += points;
        }
        return total;
    }

    /** Burn-in, snapshots and the sums of squared counts against the game lengths. */
    private static void lengths(Experiment.Builder b, ExperimentSchema schema, Problems problems) {
        long shortest = b.horizons.stream().filter(h -> h instanceof Horizon.Rounds)
            .mapToLong(h -> ((Horizon.Rounds) h).count()).min().orElse(Long.MAX_VALUE);
        if (b.burnIn > 0 && b.burnIn >= shortest) {
            problems.add(schema.line("burn_in"), "burn_in", "must be shorter than the shortest game (" + shortest
                + " rounds): " + b.burnIn);
        }
        long longest = b.horizons.stream().filter(h -> h instanceof Horizon.Rounds)
            .mapToLong(h -> ((Horizon.Rounds) h).count()).max().orElse(0);
        double secondMoment = b.horizons.stream().filter(h -> h instanceof Horizon.Continuation)
            .mapToDouble(h -> geometricSecondMoment(((Horizon.Continuation) h).probability())).max().orElse(0);
        double squares = (double) b.replicates * Math.max((double) longest * longest, secondMoment);
        if (squares > SUM_OF_SQUARES_LIMIT) {
            problems.add(schema.line("replicates"), "replicates", String.format(Locale.ROOT, "%d games of up to %s "
                + "rounds would overflow the per-case sums of squared counts (about %.3g, the limit is %.3g): use "
                + "fewer replicates or shorter games", b.replicates, longest > 0 ? Long.toString(longest)
                : "E[L^2] = " + ExperimentFile.num(secondMoment) + " squared", squares, SUM_OF_SQUARES_LIMIT));
        }
        for (long t : b.snapshots) {
            if (t > shortest) {
                problems.add(schema.line("snapshots"), "snapshots", "round " + t + " is past the end of the shortest "
                    + "game (" + shortest + " rounds)");
            }
        }
    }

    /** E[L^2] for a game length L with P(L = k) = (1 - delta) delta^(k-1): (1 + delta) / (1 - delta)^2. */
    private static double geometricSecondMoment(double delta) {
        return (1 + delta) / ((1 - delta) * (1 - delta));
    }

    private static void placeholders(List<Experiment.Pair> pairs, Map<String, List<Double>> parameters,
        boolean continuation, int gridLine, List<String> alsoUsed, Problems problems) {
        List<String> used = new ArrayList<>(alsoUsed);
        for (Experiment.Pair p : pairs) {
            for (String ph : Grid.placeholders(p.x() + " " + p.y())) {
                // the line of the field that uses the placeholder (x: when both do)
                int line = Grid.placeholders(p.x()).contains(ph) ? p.xLine() : p.yLine();
                if (ph.equals(Grid.CONTINUATION) && !continuation) {
                    problems.add(line, "pairs." + p.name(), "uses {continuation} but the grid has no "
                        + "continuation: axis");
                } else if (!parameters.containsKey(ph) && !ph.equals(Grid.CONTINUATION)) {
                    problems.add(line, "pairs." + p.name(), "uses {" + ph + "} but grid.parameters has no '" + ph
                        + "'" + Problems.didYouMean(ph, List.copyOf(parameters.keySet())));
                }
                used.add(ph);
            }
        }
        for (String k : parameters.keySet()) {
            if (!used.contains(k)) {
                problems.add(gridLine, "grid.parameters." + k, "is used by no pair (write {" + k + "} in a strategy)");
            }
        }
    }

    /**
     * The strategy set's rules: its match names must not clash with the pairs' names, its placeholders
     * must be grid parameters, and each of its specs must parse for both players at every grid point
     * (reported once per strategy, at its line).
     *
     * @return the placeholders the set's specs use
     */
    private static List<String> strategySet(Experiment.Builder b, Problems problems) {
        StrategySet set = b.strategySet;
        List<String> used = new ArrayList<>();
        if (set == null) {
            return used;
        }
        for (StrategySet.Cell c : set.cells()) {
            if (b.pairs.stream().anyMatch(p -> p.name().equals(c.pairName()))) {
                problems.add(c.line(), "strategy_set.matches", "match " + c.pairName() + " has the name of a pair "
                    + "in pairs: (duplicate case name '" + c.pairName() + "')");
            }
        }
        List<Map<String, Double>> points = Grid.parameterPoints(b.parameters);
        List<Horizon> hs = b.horizons.isEmpty() ? Collections.singletonList(null) : b.horizons;
        for (StrategySet.Entry s : set.strategies()) {
            String field = "strategy_set.strategies." + s.name();
            boolean defined = true;
            for (String ph : Grid.placeholders(s.spec())) {
                used.add(ph);
                if (ph.equals(Grid.CONTINUATION) && !b.continuation()) {
                    problems.add(s.line(), field, "uses {continuation} but the grid has no continuation: axis");
                    defined = false;
                } else if (!b.parameters.containsKey(ph) && !ph.equals(Grid.CONTINUATION)) {
                    problems.add(s.line(), field, "uses {" + ph + "} but grid.parameters has no '" + ph + "'"
                        + Problems.didYouMean(ph, List.copyOf(b.parameters.keySet())));
                    defined = false;
                }
            }
            if (!defined || b.game == null) {
                continue;
            }
            List<String> seen = new ArrayList<>();
            List<Horizon> all = new ArrayList<>(hs);
            set.exactContinuation().forEach(d -> all.add(Horizon.continuation(d)));
            for (Map<String, Double> point : points) {
                for (Horizon h : all) {
                    String spec = Grid.substitute(s.spec(), Grid.withHorizon(point, h));
                    if (!Grid.placeholders(spec).isEmpty()) {
                        continue;
                    }
                    for (Player player : Player.values()) {
                        try {
                            Strategies.parse(spec, b.game, player);
                        } catch (IllegalArgumentException ex) {
                            if (!seen.contains(ex.getMessage())) {
                                seen.add(ex.getMessage());
                                boolean extra = h instanceof Horizon.Continuation c && !hs.contains(h)
                                    && set.exactContinuation().contains(c.probability());
                                problems.add(s.line(), field, ex.getMessage() + (extra ? " (for exact_continuation "
                                    + ExperimentFile.num(((Horizon.Continuation) h).probability()) + ")" : ""));
                            }
                        }
                    }
                }
            }
        }
        return used;
    }

    /**
     * Parses every strategy spec of every grid point, so that a bad spec is reported with the other
     * problems of the file; pairs whose placeholders lack a parameter are left to placeholders.
     */
    private static void strategies(Experiment.Builder b, Problems problems) {
        List<Horizon> hs = b.horizons.isEmpty() ? Collections.singletonList(null) : b.horizons;
        for (Experiment.Pair p : b.pairs) {
            List<String> used = Grid.placeholders(p.x() + " " + p.y());
            boolean defined = used.stream()
                .allMatch(ph -> b.parameters.containsKey(ph) || ph.equals(Grid.CONTINUATION) && b.continuation());
            if (!defined) {
                continue;
            }
            Set<String> seen = new HashSet<>();
            for (Map<String, Double> point : Grid.parameterPoints(Grid.usedAxes(b.parameters, p))) {
                for (Horizon h : hs) {
                    Map<String, Double> values = Grid.withHorizon(point, h);
                    spec(Grid.substitute(p.x(), values), b, Player.X, seen, p, "x", problems);
                    spec(Grid.substitute(p.y(), values), b, Player.Y, seen, p, "y", problems);
                }
            }
        }
    }

    private static void spec(String spec, Experiment.Builder b, Player player, Set<String> seen, Experiment.Pair p,
        String field, Problems problems) {
        if (!seen.add(field + spec)) {
            return;
        }
        try {
            Strategies.parse(spec, b.game, player);
        } catch (IllegalArgumentException ex) {
            problems.add(p.lineOf(field), "pairs." + p.name() + "." + field, ex.getMessage());
        }
    }
}
