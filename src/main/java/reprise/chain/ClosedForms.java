package reprise.chain;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import reprise.game.Noise;
import reprise.game.StageGame;

/**
 * Published closed forms for long-run play, as checks independent of the chain machinery.
 *
 * <p>Noise enters through effective vectors: a memory-one vector c in the player's own view becomes
 * c'(x, y) = (1 - h) c(x, y) + h c(x, not y) under perception error h (the last co-player move is misread),
 * then (1 - e) c' + e (1 - c') under execution error e.
 *
 * <p>References:
 * Nowak, M. &amp; Sigmund, K. (1990). The evolution of stochastic strategies in the Prisoner's Dilemma.
 * Acta Applicandae Mathematicae 20, 247-265.
 * Press, W.H. &amp; Dyson, F.J. (2012). Iterated Prisoner's Dilemma contains strategies that dominate any
 * evolutionary opponent. PNAS 109(26), 10409-10413.
 */
public final class ClosedForms {
    private ClosedForms() {
    }

    /**
     * Long-run play of two reactive strategies.
     *
     * @param cooperationX s1, X's long-run cooperation rate
     * @param cooperationY s2, Y's long-run cooperation rate
     * @param stationary (s1 s2, s1 (1 - s2), (1 - s1) s2, (1 - s1)(1 - s2)) in the order CC, CD, DC, DD
     * @param payoffs the long-run payoffs
     */
    public record Reactive(double cooperationX, double cooperationY, double[] stationary, Payoffs payoffs) {
        /**
         * Copies the array.
         *
         * @param cooperationX s1
         * @param cooperationY s2
         * @param stationary 4 numbers
         * @param payoffs payoffs
         */
        public Reactive {
            stationary = stationary.clone();
        }

        /** @return the stationary distribution (a copy) */
        @Override
        public double[] stationary() {
            return stationary.clone();
        }
    }

    /**
     * Nowak &amp; Sigmund's formula for reactive strategies X = (p1, q1), Y = (p2, q2) (cooperation after the
     * co-player's C, after its D), with r_i = p_i - q_i after noise:
     * s1 = (q1 + r1 q2) / (1 - r1 r2), s2 = (q2 + r2 q1) / (1 - r1 r2).
     *
     * @param game the stage game
     * @param px X's p
     * @param qx X's q
     * @param py Y's p
     * @param qy Y's q
     * @param noise errors (a reactive player with perception error stays reactive)
     * @return the long-run play
     * @throws NoPredictionException when r1 r2 = 1 (for example noise-free tit-for-tat against itself): the
     *     chain is not ergodic and the formula is undefined
     */
    public static Reactive reactive(StageGame game, double px, double qx, double py, double qy, Noise noise) {
        double[] x = effectiveVector(new double[] {px, qx, px, qx}, noise.executionX(), noise.perceptionX());
        double[] y = effectiveVector(new double[] {py, qy, py, qy}, noise.executionY(), noise.perceptionY());
        double r1 = x[0] - x[1];
        double r2 = y[0] - y[1];
        double d = 1 - r1 * r2;
        if (!(Math.abs(d) > 0)) {
            throw new NoPredictionException("no exact prediction from the reactive formula: r1 r2 = 1, the chain is "
                + "not ergodic and the long-run rates depend on the first round");
        }
        double s1 = (x[1] + r1 * y[1]) / d;
        double s2 = (y[1] + r2 * x[1]) / d;
        double[] pi = {s1 * s2, s1 * (1 - s2), (1 - s1) * s2, (1 - s1) * (1 - s2)};
        return new Reactive(s1, s2, pi, Payoffs.of(game, pi));
    }

    /**
     * A memory-one vector after perception and execution errors (see the class description).
     *
     * @param c cooperation probabilities after CC, CD, DC, DD in the player's own view
     * @param execution e
     * @param perception h
     * @return the effective vector, same order
     */
    public static double[] effectiveVector(double[] c, double execution, double perception) {
        Payoffs.checkFour(c);
        double[] out = new double[4];
        for (int s = 0; s < 4; s++) {
            double coop = (1 - perception) * c[s] + perception * c[s ^ 1];
            double defect = (1 - perception) * (1 - c[s]) + perception * (1 - c[s ^ 1]);
            out[s] = (1 - execution) * coop + execution * defect;
        }
        return out;
    }

    /**
     * Press &amp; Dyson's determinant D(p, q, f) =
     * det [[-1 + p1 q1, -1 + p1, -1 + q1, f1], [p2 q3, -1 + p2, q3, f2], [p3 q2, p3, -1 + q2, f3],
     * [p4 q4, p4, q4, f4]].
     *
     * @param p X's memory-one vector, X's own view
     * @param q Y's memory-one vector, Y's own view
     * @param f a vector over the states CC, CD, DC, DD in X's order
     * @return the determinant
     */
    public static double pressDysonDeterminant(double[] p, double[] q, double[] f) {
        Payoffs.checkFour(p);
        Payoffs.checkFour(q);
        Payoffs.checkFour(f);
        double[][] a = {
            {-1 + p[0] * q[0], -1 + p[0], -1 + q[0], f[0]},
            {p[1] * q[2], -1 + p[1], q[2], f[1]},
            {p[2] * q[1], p[2], -1 + q[1], f[2]},
            {p[3] * q[3], p[3], q[3], f[3]}};
        return new LUDecomposition(new Array2DRowRealMatrix(a, false)).getDeterminant();
    }

    /**
     * Long-run payoffs of two memory-one players by the determinant formula,
     * s_X = D(p, q, S_X) / D(p, q, 1) and s_Y = D(p, q, S_Y) / D(p, q, 1), after noise.
     *
     * @param game the stage game
     * @param p X's vector in X's own view
     * @param q Y's vector in Y's own view
     * @param noise errors
     * @return the payoffs
     * @throws NoPredictionException when D(p, q, 1) = 0
     */
    public static Payoffs pressDyson(StageGame game, double[] p, double[] q, Noise noise) {
        double[] pe = effectiveVector(p, noise.executionX(), noise.perceptionX());
        double[] qe = effectiveVector(q, noise.executionY(), noise.perceptionY());
        double d1 = pressDysonDeterminant(pe, qe, new double[] {1, 1, 1, 1});
        if (!(Math.abs(d1) > 0)) {
            throw new NoPredictionException("no exact prediction from the determinant formula: D(p, q, 1) = 0");
        }
        return new Payoffs(pressDysonDeterminant(pe, qe, game.payoffX()) / d1,
            pressDysonDeterminant(pe, qe, game.payoffY()) / d1);
    }
}
