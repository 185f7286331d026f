package reprise.experiment;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;
import reprise.game.Horizon;
import reprise.game.Match;

/**
 * One point of an experiment's grid: a fully specified match and horizon. Immutable: the parameters are
 * copied in their order.
 *
 * @param index position in the expanded grid, from 0
 * @param id a unique readable identifier, e.g. {@code keepers/noise=0.01/rounds=200}
 * @param pair the pair's name
 * @param xSpec X's spec after parameter substitution
 * @param ySpec Y's spec after parameter substitution
 * @param noise the execution error as written ("E" or "EX,EY")
 * @param misperception the perception error as written
 * @param horizon the game length
 * @param parameters the strategy parameters of this point, in file order
 * @param match the match
 */
public record Case(int index, String id, String pair, String xSpec, String ySpec, String noise, String misperception,
    Horizon horizon, Map<String, Double> parameters, Match match) {

    /**
     * Copies the parameters (keeping their order) and checks the components.
     *
     * @throws IllegalArgumentException if the index is negative
     * @throws NullPointerException if a component is null
     */
    public Case {
        if (index < 0) {
            throw new IllegalArgumentException("case index must be at least 0: " + index);
        }
        Objects.requireNonNull(id, "id");
        Objects.requireNonNull(pair, "pair");
        Objects.requireNonNull(xSpec, "xSpec");
        Objects.requireNonNull(ySpec, "ySpec");
        Objects.requireNonNull(noise, "noise");
        Objects.requireNonNull(misperception, "misperception");
        Objects.requireNonNull(horizon, "horizon");
        Objects.requireNonNull(match, "match");
        Map<String, Double> copy = new LinkedHashMap<>();
        parameters.forEach((k, v) -> copy.put(Objects.requireNonNull(k, "parameter name"),
            Objects.requireNonNull(v, "parameter value")));
        parameters = Collections.unmodifiableMap(copy);
    }
}
