package reprise.chain;

import reprise.game.Horizon;

/**
 * Allocation-free exact expected frequencies of two memory-one players for every kind of game length:
 * the long run, a fixed number of rounds, and a continuation probability. The engine of sweeps and
 * strategy matrices; one instance per thread (it holds scratch space and is not thread-safe).
 *
 * <p>The model is that of {@link MarkovChain} for two memory-one players (round states CC, CD, DC, DD from
 * X's view; see {@link MemoryOneStationary} for how the errors enter); the round-1 distribution comes from
 * each player's first-move probability after execution error. The values are those of {@link Prediction}:
 * {@link #longRun} gives the stationary distribution when it is unique and otherwise the time-average
 * limit from the actual first round ({@link Prediction#limitFrequencies()}); {@link #rounds} gives
 * f_n = (1/n) sum_{t=1..n} v_t; {@link #continuation} gives (1 - delta) v_1 (I - delta M)^-1.
 *
 * <p>Implementation note. The long run uses {@link MemoryOneStationary} (GTH, unrolled). Fixed lengths use
 * doubling on sums of matrix powers over the binary digits of n, as {@link Frequencies} does, on 4 x 4
 * arrays in place: about 130 multiply-adds per binary digit (1,300 for n = 1000), no subtraction, each
 * squared matrix rescaled to unit row sums. The continuation case is the GTH stationary distribution of
 * the restart chain delta M + (1 - delta) 1 v_1, again without subtraction, so it stays accurate as delta
 * approaches 1; when a pivot vanishes (a state that cannot reach the states eliminated after it), the
 * general {@link Frequencies} routine takes over. Results agree with {@link Prediction} to rounding (the
 * order of operations differs; tests allow 1e-12), not bit for bit.
 *
 * <p>References:
 * Grassmann, W.K., Taksar, M.I. &amp; Heyman, D.P. (1985). Regenerative analysis and steady state
 * distributions for Markov chains. Operations Research 33(5), 1107-1116.
 */
public final class MemoryOnePair {
    private static final String[] LABELS = {"CC", "CD", "DC", "DD"};

    private final MemoryOneStationary stationary = new MemoryOneStationary();
    private final double[] m = new double[16];
    private final double[] power = new double[16];
    private final double[] sums = new double[16];
    private final double[] scratch = new double[16];
    private final double[] v1 = new double[4];
    private final double[] mu = new double[4];
    private final double[] tmp = new double[4];
    private final double[] f = new double[4];
    private boolean unique;

    /** Creates an engine with its scratch space. */
    public MemoryOnePair() {
        // scratch arrays only
    }

    /**
     * The long-run frequencies: stationary when unique, else the time-average limit from round 1.
     *
     * @param p X's cooperation probabilities after CC, CD, DC, DD, own view
     * @param p0 X's first-move cooperation probability
     * @param q Y's, own view
     * @param q0 Y's first-move cooperation probability
     * @param ex X's execution error
     * @param ey Y's execution error
     * @param hx X's perception error
     * @param hy Y's perception error
     */
    public void longRun(double[] p, double p0, double[] q, double q0, double ex, double ey, double hx, double hy) {
        unique = stationary.solve(p, q, ex, ey, hx, hy);
        if (unique) {
            for (int s = 0; s < 4; s++) {
                f[s] = stationary.frequency(s);
            }
            return;
        }
        MemoryOneStationary.transition(m, p, q, ex, ey, hx, hy);
        firstRound(p0, q0, ex, ey);
        double[] lim = ChainStructure.analyze(square(m), v1.clone(), LABELS).limitDistribution();
        System.arraycopy(lim, 0, f, 0, 4);
    }

    /**
     * The expected frequencies over the first n rounds, f_n = (1/n) sum_{t=1..n} v_t.
     *
     * @param n rounds, at least 1
     * @param p X's vector, own view
     * @param p0 X's first move
     * @param q Y's vector, own view
     * @param q0 Y's first move
     * @param ex X's execution error
     * @param ey Y's execution error
     * @param hx X's perception error
     * @param hy Y's perception error
     */
    public void rounds(long n, double[] p, double p0, double[] q, double q0, double ex, double ey, double hx,
        double hy) {
        if (n < 1) {
            throw new IllegalArgumentException("rounds must be at least 1: " + n);
        }
        unique = true;
        MemoryOneStationary.transition(m, p, q, ex, ey, hx, hy);
        firstRound(p0, q0, ex, ey);
        System.arraycopy(m, 0, power, 0, 16);
        java.util.Arrays.fill(sums, 0);
        for (int i = 0; i < 4; i++) {
            sums[5 * i] = 1;
            mu[i] = v1[i];
            f[i] = 0;
        }
        long rest = n;
        while (true) {
            if ((rest & 1) == 1) {
                for (int j = 0; j < 4; j++) {
                    f[j] += mu[0] * sums[j] + mu[1] * sums[4 + j] + mu[2] * sums[8 + j] + mu[3] * sums[12 + j];
                    tmp[j] = mu[0] * power[j] + mu[1] * power[4 + j] + mu[2] * power[8 + j] + mu[3] * power[12 + j];
                }
                System.arraycopy(tmp, 0, mu, 0, 4);
            }
            rest >>= 1;
            if (rest == 0) {
                break;
            }
            multiply(power, sums, scratch);
            for (int i = 0; i < 16; i++) {
                sums[i] += scratch[i];
            }
            multiply(power, power, scratch);
            for (int r = 0; r < 16; r += 4) {
                double s = scratch[r] + scratch[r + 1] + scratch[r + 2] + scratch[r + 3];
                for (int j = 0; j < 4; j++) {
                    power[r + j] = s > 0 ? scratch[r + j] / s : scratch[r + j];
                }
            }
        }
        double length = n;
        for (int s = 0; s < 4; s++) {
            f[s] /= length;
        }
    }

    /**
     * The normalised discounted frequencies (1 - delta) v_1 (I - delta M)^-1 of a game with continuation
     * probability delta.
     *
     * @param delta in [0, 1)
     * @param p X's vector, own view
     * @param p0 X's first move
     * @param q Y's vector, own view
     * @param q0 Y's first move
     * @param ex X's execution error
     * @param ey Y's execution error
     * @param hx X's perception error
     * @param hy Y's perception error
     */
    public void continuation(double delta, double[] p, double p0, double[] q, double q0, double ex, double ey,
        double hx, double hy) {
        Frequencies.checkDelta(delta);
        unique = true;
        MemoryOneStationary.transition(m, p, q, ex, ey, hx, hy);
        firstRound(p0, q0, ex, ey);
        double g = 1 - delta;
        for (int r = 0; r < 16; r += 4) {
            for (int j = 0; j < 4; j++) {
                scratch[r + j] = delta * m[r + j] + g * v1[j];
            }
        }
        if (!MemoryOneStationary.gth(scratch, f)) {
            double[] d = Frequencies.discounted(square(m), v1.clone(), delta);
            System.arraycopy(d, 0, f, 0, 4);
        }
    }

    /**
     * Solves for a horizon, or for the long run when it is null.
     *
     * @param horizon rounds, continuation, or null for the long run
     * @param p X's vector, own view
     * @param p0 X's first move
     * @param q Y's vector, own view
     * @param q0 Y's first move
     * @param ex X's execution error
     * @param ey Y's execution error
     * @param hx X's perception error
     * @param hy Y's perception error
     */
    public void solve(Horizon horizon, double[] p, double p0, double[] q, double q0, double ex, double ey, double hx,
        double hy) {
        if (horizon == null) {
            longRun(p, p0, q, q0, ex, ey, hx, hy);
        } else if (horizon instanceof Horizon.Rounds r) {
            rounds(r.count(), p, p0, q, q0, ex, ey, hx, hy);
        } else {
            continuation(((Horizon.Continuation) horizon).probability(), p, p0, q, q0, ex, ey, hx, hy);
        }
    }

    /**
     * The expected frequency of a round state after the last solve.
     *
     * @param state 0 to 3 (CC, CD, DC, DD)
     * @return the frequency
     */
    public double frequency(int state) {
        return f[state];
    }

    /**
     * Copies the 4 frequencies of the last solve.
     *
     * @param out an array of at least 4
     */
    public void frequencies(double[] out) {
        System.arraycopy(f, 0, out, 0, 4);
    }

    /**
     * Whether the last long-run solve found a unique stationary distribution (always true after
     * {@link #rounds} and {@link #continuation}).
     *
     * @return true when unique
     */
    public boolean unique() {
        return unique;
    }

    /**
     * The expected per-round payoff sum_s f_s u_s of the last solve.
     *
     * @param u payoffs in X's state order (for example {@code StageGame.payoffX()})
     * @return the payoff
     */
    public double payoff(double[] u) {
        return f[0] * u[0] + f[1] * u[1] + f[2] * u[2] + f[3] * u[3];
    }

    /** @return X's cooperation rate f_CC + f_CD after the last solve */
    public double cooperationX() {
        return f[0] + f[1];
    }

    /** @return Y's cooperation rate f_CC + f_DC after the last solve */
    public double cooperationY() {
        return f[0] + f[2];
    }

    private void firstRound(double p0, double q0, double ex, double ey) {
        double xc = (1 - ex) * p0 + ex * (1 - p0);
        double xd = (1 - ex) * (1 - p0) + ex * p0;
        double yc = (1 - ey) * q0 + ey * (1 - q0);
        double yd = (1 - ey) * (1 - q0) + ey * q0;
        v1[0] = xc * yc;
        v1[1] = xc * yd;
        v1[2] = xd * yc;
        v1[3] = xd * yd;
    }

    /** out = a b for row-major 4 x 4 arrays (out distinct from both). */
    private static void multiply(double[] a, double[] b, double[] out) {
        for (int r = 0; r < 16; r += 4) {
            for (int j = 0; j < 4; j++) {
                out[r + j] = a[r] * b[j] + a[r + 1] * b[4 + j] + a[r + 2] * b[8 + j] + a[r + 3] * b[12 + j];
            }
        }
    }

    private static double[][] square(double[] flat) {
        double[][] out = new double[4][4];
        for (int i = 0; i < 16; i++) {
            out[i >> 2][i & 3] = flat[i];
        }
        return out;
    }
}
