package reprise.chain;

import java.util.List;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.State;
import reprise.game.Strategies;
import reprise.game.Strategy;

/**
 * The exact all-against-all matrix of a set of strategies: for every ordered pair (row strategy as X,
 * column strategy as Y, self-play included) the expected round-state frequencies, cooperation rates and
 * payoffs of one game length.
 *
 * <p>Game lengths: a fixed number of rounds (f_n = (1/n) sum_{t=1..n} v_t), a continuation probability
 * delta (the normalised discounted frequencies (1 - delta) v_1 (I - delta M)^-1), or the long run (null
 * horizon: the stationary distribution when it is unique, else the time-average limit from the actual
 * first round, as {@link Prediction#limitFrequencies()}; {@link #unique(int, int)} says which).
 *
 * <p>Implementation note. Pairs of memory-one players go through the allocation-free
 * {@link MemoryOnePair}; any other pair of table strategies builds its {@link MarkovChain} and uses
 * {@link Frequencies} and the class structure, exactly as {@code solve} does. Both routes agree to
 * rounding (tests allow 1e-12).
 */
public final class StrategyMatrix {
    private final StageGame game;
    private final List<String> rowLabels;
    private final List<String> columnLabels;
    private final Noise noise;
    private final Horizon horizon;
    private final double[][][] frequencies;
    private final boolean[][] unique;

    private StrategyMatrix(StageGame game, List<String> rowLabels, List<String> columnLabels, Noise noise,
        Horizon horizon, double[][][] frequencies, boolean[][] unique) {
        this.game = game;
        this.rowLabels = rowLabels;
        this.columnLabels = columnLabels;
        this.noise = noise;
        this.horizon = horizon;
        this.frequencies = frequencies;
        this.unique = unique;
    }

    /**
     * The matrix of a list of strategy specs against itself: each spec is parsed for X (rows) and for Y
     * (columns), so constructors that depend on the player's own payoffs (gtft, zero-determinant) are
     * right in asymmetric games too.
     *
     * @param game the stage game
     * @param specs the strategies, at least one
     * @param noise the errors (X's errors apply to the row strategy)
     * @param horizon rounds, continuation, or null for the long run
     * @return the matrix
     * @throws IllegalArgumentException for a bad spec
     * @throws NoPredictionException for a user-written agent or a pair without an exact chain
     */
    public static StrategyMatrix of(StageGame game, List<String> specs, Noise noise, Horizon horizon) {
        List<Strategy> rows = specs.stream().map(s -> Strategies.parse(s, game, Player.X)).toList();
        List<Strategy> columns = specs.stream().map(s -> Strategies.parse(s, game, Player.Y)).toList();
        return of(game, rows, columns, noise, horizon);
    }

    /**
     * The matrix of row strategies (playing X) against column strategies (playing Y).
     *
     * @param game the stage game
     * @param rows X's strategies, X's own view
     * @param columns Y's strategies, Y's own view
     * @param noise the errors
     * @param horizon rounds, continuation, or null for the long run
     * @return the matrix
     * @throws NoPredictionException for a user-written agent or a pair without an exact chain
     */
    public static StrategyMatrix of(StageGame game, List<? extends Strategy> rows, List<? extends Strategy> columns,
        Noise noise, Horizon horizon) {
        if (rows.isEmpty() || columns.isEmpty()) {
            throw new IllegalArgumentException("a strategy matrix needs at least one row and one column strategy");
        }
        int n = rows.size();
        int k = columns.size();
        double[][][] f = new double[n][k][];
        boolean[][] u = new boolean[n][k];
        MemoryOnePair pair = new MemoryOnePair();
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < k; j++) {
                Strategy x = rows.get(i);
                Strategy y = columns.get(j);
                if (x instanceof MemoryStrategy mx && y instanceof MemoryStrategy my && mx.memory() == 1
                    && my.memory() == 1) {
                    pair.solve(horizon, mx.table(), mx.initial(), my.table(), my.initial(), noise.executionX(),
                        noise.executionY(), noise.perceptionX(), noise.perceptionY());
                    f[i][j] = new double[4];
                    pair.frequencies(f[i][j]);
                    u[i][j] = pair.unique();
                } else {
                    MarkovChain chain = MarkovChain.of(new Match(game, x, y, noise));
                    if (horizon == null) {
                        ChainStructure s = chain.structure();
                        u[i][j] = s.stationary() != null;
                        f[i][j] = chain.project(u[i][j] ? s.stationary() : s.limitDistribution());
                    } else {
                        u[i][j] = true;
                        f[i][j] = Frequencies.of(chain, horizon);
                    }
                }
            }
        }
        return new StrategyMatrix(game, rows.stream().map(Strategy::label).toList(),
            columns.stream().map(Strategy::label).toList(), noise, horizon, f, u);
    }

    /** @return the number of row strategies */
    public int rows() {
        return rowLabels.size();
    }

    /** @return the number of column strategies */
    public int columns() {
        return columnLabels.size();
    }

    /** @return the row strategies' labels */
    public List<String> rowLabels() {
        return rowLabels;
    }

    /** @return the column strategies' labels */
    public List<String> columnLabels() {
        return columnLabels;
    }

    /** @return the stage game */
    public StageGame game() {
        return game;
    }

    /** @return the errors */
    public Noise noise() {
        return noise;
    }

    /** @return the horizon, or null for the long run */
    public Horizon horizon() {
        return horizon;
    }

    /**
     * The expected frequencies of one pair.
     *
     * @param row the row (X) strategy index
     * @param column the column (Y) strategy index
     * @return 4 frequencies CC, CD, DC, DD (a copy)
     */
    public double[] frequencies(int row, int column) {
        return frequencies[row][column].clone();
    }

    /**
     * One state's expected frequency.
     *
     * @param row the row index
     * @param column the column index
     * @param state the round state
     * @return its frequency
     */
    public double frequency(int row, int column, State state) {
        return frequencies[row][column][state.ordinal()];
    }

    /**
     * @param row the row index
     * @param column the column index
     * @return X's (the row strategy's) expected per-round payoff
     */
    public double payoffX(int row, int column) {
        return dot(frequencies[row][column], game.payoffX());
    }

    /**
     * @param row the row index
     * @param column the column index
     * @return Y's (the column strategy's) expected per-round payoff
     */
    public double payoffY(int row, int column) {
        return dot(frequencies[row][column], game.payoffY());
    }

    /**
     * @param row the row index
     * @param column the column index
     * @return X's cooperation rate f_CC + f_CD
     */
    public double cooperationX(int row, int column) {
        double[] f = frequencies[row][column];
        return f[0] + f[1];
    }

    /**
     * @param row the row index
     * @param column the column index
     * @return Y's cooperation rate f_CC + f_DC
     */
    public double cooperationY(int row, int column) {
        double[] f = frequencies[row][column];
        return f[0] + f[2];
    }

    /**
     * Whether the long-run value of a pair is a unique stationary distribution (always true for a finite
     * or random horizon).
     *
     * @param row the row index
     * @param column the column index
     * @return false when the value is the time-average limit from the first round of a non-ergodic chain
     */
    public boolean unique(int row, int column) {
        return unique[row][column];
    }

    /** @return the row player's payoff matrix, [row][column] */
    public double[][] payoffMatrixX() {
        double[][] out = new double[rows()][columns()];
        for (int i = 0; i < out.length; i++) {
            for (int j = 0; j < out[i].length; j++) {
                out[i][j] = payoffX(i, j);
            }
        }
        return out;
    }

    private static double dot(double[] f, double[] u) {
        return f[0] * u[0] + f[1] * u[1] + f[2] * u[2] + f[3] * u[3];
    }
}
