package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * A named list of strategies and the ordered pairs of them an experiment plays: every ordered pair (self-play
 * included) or a listed subset. Each match becomes an ordinary {@link Experiment.Pair} named
 * {@code ROW-vs-COLUMN} (row strategy as X, column strategy as Y), so shards, resumed runs and results.csv
 * treat its cases like any other; the matrix outputs find a case's cell through {@link #cellOf(String)}.
 *
 * @param strategies the strategies, in file order, names unique
 * @param cells the matches, in run order (row-major for "all")
 * @param exactContinuation continuation probabilities for which only the exact matrix is computed
 * @param line the line of the section in the file (for messages)
 */
public record StrategySet(List<Entry> strategies, List<Cell> cells, List<Double> exactContinuation, int line) {

    /** The word between the two strategy names in a match's pair name. */
    static final String VERSUS = "-vs-";

    /**
     * Copies the lists and checks that every cell names strategies of the set.
     *
     * @throws IllegalArgumentException if a list is empty or a cell names an unknown strategy
     */
    public StrategySet {
        strategies = List.copyOf(strategies);
        cells = List.copyOf(cells);
        exactContinuation = List.copyOf(exactContinuation);
        if (strategies.isEmpty() || cells.isEmpty()) {
            throw new IllegalArgumentException("a strategy set needs at least one strategy and one match");
        }
        for (Cell c : cells) {
            if (c.row() < 0 || c.row() >= strategies.size() || c.column() < 0 || c.column() >= strategies.size()) {
                throw new IllegalArgumentException("strategy set match outside the set: " + c);
            }
        }
    }

    /**
     * One strategy of the set.
     *
     * @param name the name used in pair names, matrix.csv and the figures
     * @param spec the strategy spec (may hold {param} placeholders)
     * @param line its line in the file
     */
    public record Entry(String name, String spec, int line) {
        /** Checks that the name and spec are present. */
        public Entry {
            Objects.requireNonNull(name, "name");
            Objects.requireNonNull(spec, "spec");
        }
    }

    /**
     * One ordered pair of the set.
     *
     * @param row the index of the row strategy (playing X)
     * @param column the index of the column strategy (playing Y)
     * @param pairName the name of the experiment pair that plays it
     * @param line the line that asked for it (the section's line for "all")
     */
    public record Cell(int row, int column, String pairName, int line) {
        /** Checks the indices and name. */
        public Cell {
            Objects.requireNonNull(pairName, "pairName");
        }
    }

    /**
     * The pair name of a match.
     *
     * @param row the row strategy's name
     * @param column the column strategy's name
     * @return {@code ROW-vs-COLUMN}
     */
    static String pairName(String row, String column) {
        return row + VERSUS + column;
    }

    /** @return the strategies' names, in set order */
    public List<String> names() {
        return strategies.stream().map(Entry::name).toList();
    }

    /** @return one experiment pair per cell, in cell order */
    List<Experiment.Pair> pairs() {
        List<Experiment.Pair> out = new ArrayList<>();
        for (Cell c : cells) {
            out.add(new Experiment.Pair(c.pairName(), strategies.get(c.row()).spec(),
                strategies.get(c.column()).spec(), c.line()));
        }
        return out;
    }

    /**
     * The cell a pair plays.
     *
     * @param pairName an experiment pair's name
     * @return its cell, or empty for a pair that is not part of the set
     */
    public Optional<Cell> cellOf(String pairName) {
        return cells.stream().filter(c -> c.pairName().equals(pairName)).findFirst();
    }
}
