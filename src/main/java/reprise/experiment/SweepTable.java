package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import reprise.game.Horizon;

/**
 * The exact values of a sweep, one row per match: row = (strategy * coPlayers + coPlayer) * lengths + length.
 */
public final class SweepTable {
    private final SweepDefinition definition;
    private final double[] tables;
    private final List<String> coPlayers;
    private final List<SweepDefinition.Relation> enforced;
    private final double[] frequencies;
    private final boolean[] unique;
    private final double[] ux;
    private final double[] uy;

    SweepTable(SweepDefinition definition, double[] tables, List<String> coPlayers,
        List<SweepDefinition.Relation> enforced, double[] frequencies, boolean[] unique) {
        this.definition = definition;
        this.tables = tables;
        this.coPlayers = coPlayers;
        this.enforced = java.util.Collections.unmodifiableList(new ArrayList<>(enforced));
        this.frequencies = frequencies;
        this.unique = unique;
        this.ux = definition.game().payoffX();
        this.uy = definition.game().payoffY();
    }

    /** @return the definition */
    public SweepDefinition definition() {
        return definition;
    }

    /** @return the number of rows (matches) */
    public int rows() {
        return unique.length;
    }

    /**
     * @param row a row
     * @return the swept strategy's index
     */
    public int strategy(int row) {
        return row / (coPlayers.size() * definition.lengths().size());
    }

    /**
     * @param row a row
     * @return the co-player's index
     */
    public int coPlayer(int row) {
        return (row / definition.lengths().size()) % coPlayers.size();
    }

    /**
     * @param row a row
     * @return the game length's index in {@link SweepDefinition#lengths()}
     */
    public int length(int row) {
        return row % definition.lengths().size();
    }

    /**
     * The row of a strategy, co-player and length.
     *
     * @param strategy strategy index
     * @param coPlayer co-player index
     * @param length length index
     * @return the row
     */
    public int row(int strategy, int coPlayer, int length) {
        return (strategy * coPlayers.size() + coPlayer) * definition.lengths().size() + length;
    }

    /**
     * One entry of a swept strategy's table.
     *
     * @param strategy strategy index
     * @param entry 0 to 3 (after CC, CD, DC, DD, own view)
     * @return the cooperation probability
     */
    public double entry(int strategy, int entry) {
        return tables[4 * strategy + entry];
    }

    /** @return the co-players' labels */
    public List<String> coPlayers() {
        return coPlayers;
    }

    /**
     * @param coPlayer co-player index
     * @return the relation a zero-determinant co-player enforces, or null
     */
    public SweepDefinition.Relation enforced(int coPlayer) {
        return enforced.get(coPlayer);
    }

    /**
     * @param length length index
     * @return the horizon, or null for the long run
     */
    public Horizon horizon(int length) {
        return definition.lengths().get(length);
    }

    /**
     * @param row a row
     * @param state 0 to 3
     * @return the expected frequency of the state
     */
    public double frequency(int row, int state) {
        return frequencies[4 * row + state];
    }

    /**
     * @param row a row
     * @return false for a long-run value that is the time-average limit of a chain without a unique
     *     stationary distribution
     */
    public boolean unique(int row) {
        return unique[row];
    }

    /**
     * @param row a row
     * @return X's (the swept strategy's) payoff
     */
    public double payoffX(int row) {
        int b = 4 * row;
        return frequencies[b] * ux[0] + frequencies[b + 1] * ux[1] + frequencies[b + 2] * ux[2]
            + frequencies[b + 3] * ux[3];
    }

    /**
     * @param row a row
     * @return Y's (the co-player's) payoff
     */
    public double payoffY(int row) {
        int b = 4 * row;
        return frequencies[b] * uy[0] + frequencies[b + 1] * uy[1] + frequencies[b + 2] * uy[2]
            + frequencies[b + 3] * uy[3];
    }

    /**
     * @param row a row
     * @return X's cooperation rate
     */
    public double cooperationX(int row) {
        return frequencies[4 * row] + frequencies[4 * row + 1];
    }

    /**
     * @param row a row
     * @return Y's cooperation rate
     */
    public double cooperationY(int row) {
        return frequencies[4 * row] + frequencies[4 * row + 2];
    }

    /**
     * @param row a row
     * @return the co-player's enforced relation at this row, NaN when the co-player is not zero-determinant
     */
    public double enforcedResidual(int row) {
        SweepDefinition.Relation r = enforced.get(coPlayer(row));
        return r == null ? Double.NaN : r.value(payoffX(row), payoffY(row));
    }

    /**
     * @param row a row
     * @param relation index into {@link SweepDefinition#relations()}
     * @return its value
     */
    public double relation(int row, int relation) {
        return definition.relations().get(relation).value(payoffX(row), payoffY(row));
    }
}
