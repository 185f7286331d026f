package reprise.experiment;

import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import reprise.game.Horizon;
import reprise.game.Noise;
import reprise.game.StageGame;

/**
 * An exact-only sweep: a family of swept strategies (a dense grid of reactive or memory-one parameters, or
 * N seeded random strategies) plays X against each of a fixed list of co-players (Y), for each requested
 * game length; every match is solved exactly (no simulation).
 *
 * @param game the stage game
 * @param noise the errors (X's errors apply to the swept strategy)
 * @param family the swept strategies
 * @param firstMove the swept strategies' first-round cooperation probability
 * @param coPlayers the co-players' specs, parsed for Y (at least one)
 * @param lengths the game lengths, each a {@link Horizon} or {@link #LONG_RUN} (null) for the long run; at
 *     least one
 * @param relations named linear combinations of the two payoffs to report beside them (may be empty)
 */
public record SweepDefinition(StageGame game, Noise noise, Family family, double firstMove, List<String> coPlayers,
    List<Horizon> lengths, List<Relation> relations) {

    /** The long run (stationary, or time-average limit when not unique) in {@link #lengths()}. */
    public static final Horizon LONG_RUN = null;

    /**
     * Validates the definition.
     *
     * @param game game
     * @param noise noise
     * @param family family
     * @param firstMove p0
     * @param coPlayers specs
     * @param lengths lengths
     * @param relations relations
     */
    public SweepDefinition {
        Objects.requireNonNull(game, "game");
        Objects.requireNonNull(noise, "noise");
        Objects.requireNonNull(family, "family");
        if (!(firstMove >= 0 && firstMove <= 1)) {
            throw new IllegalArgumentException("first-move probability of the swept strategies must be in [0, 1]: "
                + firstMove);
        }
        if (coPlayers.isEmpty()) {
            throw new IllegalArgumentException("a sweep needs at least one co-player");
        }
        if (lengths.isEmpty()) {
            throw new IllegalArgumentException("a sweep needs at least one game length (or the long run)");
        }
        coPlayers = List.copyOf(coPlayers);
        lengths = java.util.Collections.unmodifiableList(new java.util.ArrayList<>(lengths));
        relations = List.copyOf(relations);
        long total = (long) family.size() * coPlayers.size() * lengths.size();
        if (total > MAX_MATCHES) {
            throw new IllegalArgumentException("a sweep may solve at most " + MAX_MATCHES + " matches: " + total);
        }
    }

    /** The largest number of matches one sweep may hold in memory. */
    public static final long MAX_MATCHES = 50_000_000L;

    /** @return the number of matches, strategies x co-players x lengths */
    public long matches() {
        return (long) family.size() * coPlayers.size() * lengths.size();
    }

    /** The swept strategies. */
    public sealed interface Family permits ReactiveGrid, MemoryOneGrid, RandomStrategies {
        /** @return the number of swept strategies */
        int size();

        /** @return true when the strategies are reactive (tables (p, q, p, q)) */
        boolean reactive();
    }

    /**
     * The grid p x q of reactive strategies (cooperate with p after the co-player's C, q after its D);
     * strategy index = i_p * |q| + i_q.
     *
     * @param p the values of p
     * @param q the values of q
     */
    public record ReactiveGrid(double[] p, double[] q) implements Family {
        /**
         * Validates and copies.
         *
         * @param p probabilities
         * @param q probabilities
         */
        public ReactiveGrid {
            p = axis("p", p);
            q = axis("q", q);
        }

        @Override
        public int size() {
            return Math.multiplyExact(p.length, q.length);
        }

        @Override
        public boolean reactive() {
            return true;
        }

        /** @return the values of p (a copy) */
        @Override
        public double[] p() {
            return p.clone();
        }

        /** @return the values of q (a copy) */
        @Override
        public double[] q() {
            return q.clone();
        }
    }

    /**
     * The product grid of memory-one strategies, one axis per entry (after CC, CD, DC, DD, own view); an
     * axis of one value holds that entry fixed. Strategy index: the DD entry varies fastest.
     *
     * @param axes four arrays of probabilities
     */
    public record MemoryOneGrid(double[][] axes) implements Family {
        /**
         * Validates and copies.
         *
         * @param axes four axes
         */
        public MemoryOneGrid {
            if (axes.length != 4) {
                throw new IllegalArgumentException("a memory-one grid needs 4 axes (CC, CD, DC, DD): " + axes.length);
            }
            String[] names = {"p_cc", "p_cd", "p_dc", "p_dd"};
            double[][] copy = new double[4][];
            for (int i = 0; i < 4; i++) {
                copy[i] = axis(names[i], axes[i]);
            }
            axes = copy;
            long n = 1;
            for (double[] a : axes) {
                n *= a.length;
            }
            if (n > Integer.MAX_VALUE) {
                throw new IllegalArgumentException("memory-one grid too large: " + n + " strategies");
            }
        }

        @Override
        public int size() {
            return axes[0].length * axes[1].length * axes[2].length * axes[3].length;
        }

        @Override
        public boolean reactive() {
            return false;
        }

        /** @return the axes (copies) */
        @Override
        public double[][] axes() {
            return Arrays.stream(axes).map(double[]::clone).toArray(double[][]::new);
        }
    }

    /**
     * N strategies drawn uniformly on [0, 1]^2 (reactive) or [0, 1]^4 (memory one) from a seeded
     * generator: the same seed gives the same strategies in the same order.
     *
     * @param count the number of strategies, at least 1
     * @param seed the seed
     * @param reactive true for reactive strategies, false for memory-one
     */
    public record RandomStrategies(int count, long seed, boolean reactive) implements Family {
        /**
         * Validates the count.
         *
         * @param count at least 1
         * @param seed seed
         * @param reactive kind
         */
        public RandomStrategies {
            if (count < 1) {
                throw new IllegalArgumentException("number of random strategies must be at least 1: " + count);
            }
        }

        @Override
        public int size() {
            return count;
        }
    }

    /**
     * A named linear combination of the payoffs, value = payoffX * pi_X + payoffY * pi_Y + constant; for
     * example the extortion relation pi_X - 1 - 3 (pi_Y - 1) is (1, -3, 2).
     *
     * @param name the column name
     * @param payoffX the coefficient of X's payoff
     * @param payoffY the coefficient of Y's payoff
     * @param constant the constant
     */
    public record Relation(String name, double payoffX, double payoffY, double constant) {
        /**
         * Validates.
         *
         * @param name a name of letters, digits and underscores
         * @param payoffX finite
         * @param payoffY finite
         * @param constant finite
         */
        public Relation {
            if (name == null || !name.matches("[A-Za-z][A-Za-z0-9_]*")) {
                throw new IllegalArgumentException("relation name must be letters, digits and underscores: " + name);
            }
            if (!Double.isFinite(payoffX) || !Double.isFinite(payoffY) || !Double.isFinite(constant)) {
                throw new IllegalArgumentException("relation '" + name + "' needs finite coefficients");
            }
        }

        /**
         * @param x X's payoff
         * @param y Y's payoff
         * @return the value of the combination
         */
        public double value(double x, double y) {
            return payoffX * x + payoffY * y + constant;
        }
    }

    /**
     * Evenly spaced values lo, ..., hi.
     *
     * @param lo the first value
     * @param hi the last value
     * @param points the number of values, at least 1 (1 gives lo)
     * @return the values; the ends are exact
     */
    public static double[] steps(double lo, double hi, int points) {
        if (points < 1) {
            throw new IllegalArgumentException("a grid axis needs at least 1 point: " + points);
        }
        double[] v = new double[points];
        for (int i = 0; i < points; i++) {
            v[i] = points == 1 ? lo : i == points - 1 ? hi : lo + (hi - lo) * i / (points - 1);
        }
        return v;
    }

    private static double[] axis(String name, double[] v) {
        if (v == null || v.length == 0) {
            throw new IllegalArgumentException("grid axis " + name + " needs at least one value");
        }
        for (double d : v) {
            if (!(d >= 0 && d <= 1)) {
                throw new IllegalArgumentException("grid axis " + name + " must hold probabilities in [0, 1]: " + d);
            }
        }
        return v.clone();
    }
}
