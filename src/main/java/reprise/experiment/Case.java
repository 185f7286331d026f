package reprise.experiment;

import java.util.Map;
import reprise.game.Horizon;
import reprise.game.Match;

/**
 * One point of an experiment's grid: a fully specified match and horizon.
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
}
