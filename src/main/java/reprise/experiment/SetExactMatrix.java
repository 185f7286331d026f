package reprise.experiment;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import reprise.chain.StrategyMatrix;
import reprise.game.Horizon;
import reprise.game.Noise;

/**
 * The exact all-against-all matrix of a strategy set (every ordered pair, whatever the matches played)
 * at one grid point, for one horizon: each grid game length, the long run, and each of the set's
 * {@code exact_continuation:} probabilities (discounted games, which need no simulation).
 *
 * @param parameters the grid parameters of this point, in file order
 * @param noise the execution error as written
 * @param misperception the perception error as written
 * @param horizon the game length, or null for the long run
 * @param matrix the exact matrix (its labels are the strategies'; the set's names are {@link StrategySet#names()})
 */
public record SetExactMatrix(Map<String, Double> parameters, String noise, String misperception, Horizon horizon,
    StrategyMatrix matrix) {

    /** Copies the parameters. */
    public SetExactMatrix {
        parameters = Collections.unmodifiableMap(new LinkedHashMap<>(parameters));
        Objects.requireNonNull(noise, "noise");
        Objects.requireNonNull(misperception, "misperception");
        Objects.requireNonNull(matrix, "matrix");
    }

    /** @return "long-run" or the horizon's description */
    public String horizonLabel() {
        return horizon == null ? "long-run" : horizon.describe();
    }

    /**
     * The exact matrices of an experiment's strategy set. Grid points whose specs still hold a
     * placeholder (such as {continuation} for the long run), or whose strategies have no exact chain
     * (user-written agents), are left out.
     *
     * @param e the experiment
     * @return the matrices: per grid point, the grid's lengths, then the long run, then the extra
     *     continuation probabilities; empty without a strategy set
     */
    public static List<SetExactMatrix> of(Experiment e) {
        StrategySet set = e.strategySet();
        List<SetExactMatrix> out = new ArrayList<>();
        if (set == null) {
            return out;
        }
        Map<String, List<Double>> axes = new LinkedHashMap<>();
        for (StrategySet.Entry s : set.strategies()) {
            for (String ph : Grid.placeholders(s.spec())) {
                if (e.parameters().containsKey(ph)) {
                    axes.put(ph, e.parameters().get(ph));
                }
            }
        }
        Map<String, List<Double>> ordered = new LinkedHashMap<>();
        e.parameters().forEach((k, v) -> {
            if (axes.containsKey(k)) {
                ordered.put(k, v);
            }
        });
        List<Horizon> horizons = new ArrayList<>(e.horizons());
        horizons.add(null);
        set.exactContinuation().forEach(d -> horizons.add(Horizon.continuation(d)));
        for (Map<String, Double> point : Grid.parameterPoints(ordered)) {
            for (String noise : e.noise()) {
                for (String mis : e.misperception()) {
                    double[] ex = ExperimentFile.pair(noise);
                    double[] hx = ExperimentFile.pair(mis);
                    Noise n = new Noise(ex[0], ex[1], hx[0], hx[1]);
                    for (Horizon h : horizons) {
                        List<String> specs = set.strategies().stream()
                            .map(s -> Grid.substitute(s.spec(), Grid.withHorizon(point, h))).toList();
                        if (specs.stream().anyMatch(s -> !Grid.placeholders(s).isEmpty())) {
                            continue;
                        }
                        try {
                            out.add(new SetExactMatrix(point, noise, mis, h, StrategyMatrix.of(e.game(), specs, n,
                                h)));
                        } catch (IllegalArgumentException ex2) {
                            // NoPredictionException (a subclass) when a strategy of the set has no exact
                            // chain, or a spec the file check could not resolve: no exact matrix here
                        }
                    }
                }
            }
        }
        return out;
    }
}
