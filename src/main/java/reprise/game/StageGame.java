package reprise.game;

import java.util.Arrays;
import java.util.Locale;

/**
 * A two-player 2x2 stage game: each player's payoff in each of the four states.
 *
 * <p>Both payoff vectors are stored in X's state order CC, CD, DC, DD. A symmetric game given by the
 * row player's payoffs (R, S, T, P) therefore has X's vector (R, S, T, P) and Y's vector (R, T, S, P).
 * Accessors {@link #ownView(Player)} return a player's payoffs in that player's own view (own move
 * first), which is what strategy constructors need.
 *
 * <p>Text forms accepted by {@link #parse(String)}:
 * <ul>
 *   <li>{@code R,S,T,P}: a symmetric game (four numbers, the row player's payoffs for CC, CD, DC, DD);</li>
 *   <li>eight numbers: X's four, then Y's four, each from its own view (own move first);</li>
 *   <li>{@code pd} or {@code pd:R,S,T,P}: a prisoner's dilemma, checked for T &gt; R &gt; P &gt; S and
 *       2R &gt; T + S; {@code pd} alone is 3,0,5,1;</li>
 *   <li>{@code donation:b,c}: R = b - c, S = -c, T = b, P = 0, with b &gt; c &gt; 0;</li>
 *   <li>{@code snowdrift:b,c}: R = b - c/2, S = b - c, T = b, P = 0, with b &gt; c &gt; 0;</li>
 *   <li>{@code staghunt:R,S,T,P}: checked for R &gt; T &ge; P &gt; S.</li>
 * </ul>
 *
 * @param label a short description for reports
 * @param payoffX X's payoffs in states CC, CD, DC, DD
 * @param payoffY Y's payoffs in states CC, CD, DC, DD (X's order)
 */
public record StageGame(String label, double[] payoffX, double[] payoffY) {

    /** The conventional prisoner's dilemma payoffs R, S, T, P = 3, 0, 5, 1. */
    public static final StageGame DEFAULT = symmetric(3, 0, 5, 1);

    /**
     * The largest payoff magnitude accepted, 1e100; a non-zero payoff must also be at least 1e-100 in
     * magnitude. Payoffs enter squares and products: the exact side forms variances of per-game payoff
     * totals, (L max|u|)^2 summed over states, and the simulated side the sums over games of squared
     * totals, G (L max|u|)^2, whose decimal value becomes a double. The run layer keeps G L^2 below
     * about 2.3e18, so a magnitude of 1e100 keeps every such square below about 1e219 (and every
     * non-zero one above 1e-200), far inside the range of a double (about 1.8e308 down to 4.9e-324),
     * with room for the differences, sums and constant factors of the tests. Larger or tinier payoffs
     * would overflow or underflow partway and turn standard errors into infinity or zero; rescale them.
     */
    public static final double MOST_PAYOFF_MAGNITUDE = 1e100;

    /**
     * Validates and copies the payoffs.
     *
     * @param label a short description
     * @param payoffX X's payoffs (4)
     * @param payoffY Y's payoffs in X's order (4)
     */
    public StageGame {
        payoffX = finiteCopy("payoff of X", payoffX);
        payoffY = finiteCopy("payoff of Y", payoffY);
    }

    private static double[] finiteCopy(String name, double[] v) {
        if (v == null || v.length != 4) {
            throw new IllegalArgumentException(name + " needs 4 numbers (CC, CD, DC, DD): "
                + (v == null ? "none" : v.length));
        }
        for (double d : v) {
            Checks.finite(name, d);
            if (Math.abs(d) > MOST_PAYOFF_MAGNITUDE || d != 0 && Math.abs(d) < 1 / MOST_PAYOFF_MAGNITUDE) {
                throw new IllegalArgumentException(name + " must be 0 or of magnitude between 1e-100 and 1e100 (its "
                    + "squares and products must stay within the range of a double; rescale the payoffs): " + d);
            }
        }
        return v.clone();
    }

    /**
     * A symmetric game from the row player's payoffs.
     *
     * @param r reward for mutual cooperation
     * @param s sucker's payoff
     * @param t temptation
     * @param p punishment for mutual defection
     * @return the game
     */
    public static StageGame symmetric(double r, double s, double t, double p) {
        return new StageGame(String.format(Locale.ROOT, "R,S,T,P = %s,%s,%s,%s", num(r), num(s), num(t), num(p)),
            new double[] {r, s, t, p}, new double[] {r, t, s, p});
    }

    /**
     * An asymmetric game from each player's payoffs in its own view (own move first).
     *
     * @param xOwn X's payoffs for (own, co-player's) CC, CD, DC, DD
     * @param yOwn Y's payoffs for (own, co-player's) CC, CD, DC, DD
     * @return the game
     */
    public static StageGame asymmetric(double[] xOwn, double[] yOwn) {
        double[] y = finiteCopy("payoff of Y", yOwn);
        return new StageGame("X: " + join(xOwn) + "; Y: " + join(y), xOwn,
            new double[] {y[0], y[2], y[1], y[3]});
    }

    /**
     * A prisoner's dilemma, checked for T &gt; R &gt; P &gt; S and 2R &gt; T + S.
     *
     * @param r reward
     * @param s sucker's payoff
     * @param t temptation
     * @param p punishment
     * @return the game
     * @throws IllegalArgumentException if the payoffs do not make a prisoner's dilemma
     */
    public static StageGame prisonersDilemma(double r, double s, double t, double p) {
        StageGame g = symmetric(r, s, t, p);
        if (!(t > r && r > p && p > s)) {
            throw new IllegalArgumentException("a prisoner's dilemma needs T > R > P > S: got R,S,T,P = "
                + num(r) + "," + num(s) + "," + num(t) + "," + num(p));
        }
        if (!(2 * r > t + s)) {
            throw new IllegalArgumentException("a prisoner's dilemma needs 2R > T + S: got 2R = " + num(2 * r)
                + ", T + S = " + num(t + s));
        }
        return g;
    }

    /**
     * The donation game: cooperating costs c and gives b to the co-player.
     *
     * @param b benefit, b &gt; c
     * @param c cost, c &gt; 0
     * @return the game with R = b - c, S = -c, T = b, P = 0
     */
    public static StageGame donation(double b, double c) {
        if (!(c > 0 && b > c)) {
            throw new IllegalArgumentException("the donation game needs b > c > 0: got b = " + num(b) + ", c = "
                + num(c));
        }
        return relabel(symmetric(b - c, -c, b, 0), "donation game b = " + num(b) + ", c = " + num(c));
    }

    /**
     * The snowdrift game: a task worth b to both costs c, shared when both cooperate.
     *
     * @param b benefit, b &gt; c
     * @param c cost, c &gt; 0
     * @return the game with R = b - c/2, S = b - c, T = b, P = 0
     */
    public static StageGame snowdrift(double b, double c) {
        if (!(c > 0 && b > c)) {
            throw new IllegalArgumentException("the snowdrift game needs b > c > 0: got b = " + num(b) + ", c = "
                + num(c));
        }
        return relabel(symmetric(b - c / 2, b - c, b, 0), "snowdrift game b = " + num(b) + ", c = " + num(c));
    }

    /**
     * A stag hunt, checked for R &gt; T &ge; P &gt; S.
     *
     * @param r reward for hunting stag together
     * @param s payoff for hunting stag alone
     * @param t payoff for hunting hare while the co-player hunts stag
     * @param p payoff for both hunting hare
     * @return the game
     */
    public static StageGame stagHunt(double r, double s, double t, double p) {
        if (!(r > t && t >= p && p > s)) {
            throw new IllegalArgumentException("a stag hunt needs R > T >= P > S: got R,S,T,P = " + num(r) + ","
                + num(s) + "," + num(t) + "," + num(p));
        }
        return relabel(symmetric(r, s, t, p), "stag hunt R,S,T,P = " + num(r) + "," + num(s) + "," + num(t)
            + "," + num(p));
    }

    private static StageGame relabel(StageGame g, String label) {
        return new StageGame(label, g.payoffX, g.payoffY);
    }

    /**
     * Parses a game from its text form (see the class description).
     *
     * @param text the text
     * @return the game
     * @throws IllegalArgumentException with a one-line message if the text is malformed or the payoffs
     *     violate the preset's conditions
     */
    public static StageGame parse(String text) {
        String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
        if (t.isEmpty()) {
            throw new IllegalArgumentException("game is empty; give R,S,T,P or a preset (pd, donation:b,c, "
                + "snowdrift:b,c, staghunt:R,S,T,P)");
        }
        int colon = t.indexOf(':');
        String head = colon < 0 ? t : t.substring(0, colon);
        String body = colon < 0 ? "" : t.substring(colon + 1);
        if (Character.isDigit(head.charAt(0)) || head.charAt(0) == '-' || head.charAt(0) == '.'
            || head.charAt(0) == '+') {
            double[] v = Numbers.parseList("game", t);
            if (v.length == 4) {
                return symmetric(v[0], v[1], v[2], v[3]);
            }
            if (v.length == 8) {
                return asymmetric(Arrays.copyOfRange(v, 0, 4), Arrays.copyOfRange(v, 4, 8));
            }
            throw new IllegalArgumentException("game needs 4 numbers (R,S,T,P) or 8 (X's four, then Y's four): got "
                + v.length + " in '" + text + "'");
        }
        switch (head) {
            case "pd": {
                if (body.isEmpty()) {
                    return prisonersDilemma(3, 0, 5, 1);
                }
                double[] v = Numbers.parseList("game pd", body, 4);
                return prisonersDilemma(v[0], v[1], v[2], v[3]);
            }
            case "donation": {
                double[] v = Numbers.parseList("game donation", body, 2);
                return donation(v[0], v[1]);
            }
            case "snowdrift": {
                double[] v = Numbers.parseList("game snowdrift", body, 2);
                return snowdrift(v[0], v[1]);
            }
            case "staghunt": {
                double[] v = Numbers.parseList("game staghunt", body, 4);
                return stagHunt(v[0], v[1], v[2], v[3]);
            }
            default:
                throw new IllegalArgumentException("unknown game '" + text + "'; known: R,S,T,P, 8 numbers, pd, "
                    + "pd:R,S,T,P, donation:b,c, snowdrift:b,c, staghunt:R,S,T,P");
        }
    }

    /**
     * A player's payoffs in its own view: own move first, in the order CC, CD, DC, DD.
     *
     * @param player the player
     * @return a fresh array (R, S, T, P) for that player
     */
    public double[] ownView(Player player) {
        return player == Player.X ? payoffX.clone() : new double[] {payoffY[0], payoffY[2], payoffY[1], payoffY[3]};
    }

    /**
     * The co-player's payoffs written in {@code player}'s own view.
     *
     * @param player the player whose view is used
     * @return a fresh array
     */
    public double[] coPlayerInView(Player player) {
        return player == Player.X ? payoffY.clone() : new double[] {payoffX[0], payoffX[2], payoffX[1], payoffX[3]};
    }

    /** @return X's payoffs in X's order (a copy) */
    @Override
    public double[] payoffX() {
        return payoffX.clone();
    }

    /** @return Y's payoffs in X's order (a copy) */
    @Override
    public double[] payoffY() {
        return payoffY.clone();
    }

    /**
     * X's payoff in a state, without copying.
     *
     * @param state state index 0 to 3
     * @return the payoff
     */
    public double payoffX(int state) {
        return payoffX[state];
    }

    /**
     * Y's payoff in a state given in X's order, without copying.
     *
     * @param state state index 0 to 3
     * @return the payoff
     */
    public double payoffY(int state) {
        return payoffY[state];
    }

    /** @return whether both players' payoffs are mirror images */
    public boolean isSymmetric() {
        return payoffX[0] == payoffY[0] && payoffX[3] == payoffY[3] && payoffX[1] == payoffY[2]
            && payoffX[2] == payoffY[1];
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof StageGame g && Arrays.equals(payoffX, g.payoffX) && Arrays.equals(payoffY, g.payoffY);
    }

    @Override
    public int hashCode() {
        return 31 * Arrays.hashCode(payoffX) + Arrays.hashCode(payoffY);
    }

    @Override
    public String toString() {
        return label;
    }

    private static String join(double[] v) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < v.length; i++) {
            sb.append(i == 0 ? "" : ",").append(num(v[i]));
        }
        return sb.toString();
    }

    static String num(double v) {
        return Numbers.format(v);
    }
}
