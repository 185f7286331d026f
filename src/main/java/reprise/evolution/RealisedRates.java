package reprise.evolution;

import reprise.chain.Frequencies;
import reprise.chain.MarkovChain;
import reprise.chain.Payoffs;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.MemoryStrategy;
import reprise.game.Population;

/**
 * Update probabilities as expectations over the exact law of realised payoffs (basis c).
 *
 * <p><b>Pairwise comparison.</b> Let A be the model (a mutant) and B the learner (a resident), i mutants.
 * With every co-player, A plays i - 1 mutants and N - i - 1 other residents, B plays i - 1 mutants other
 * than A and N - i - 1 residents, and A and B play one game against each other. In lattice steps
 * D_int = S_A - S_B + (X - Y), where S_A and S_B are sums of independent game totals and (X - Y) is the
 * difference of the two totals of the shared game; P_A - P_B = unit D_int / ((N - 1) L), L the expected
 * length of a game. With m sampled co-players, A's and B's sums are mixtures over hypergeometric counts
 * and there is no shared game. Then E[F(beta D)] = sum_d P(D_int = d) F(beta unit d / (g L)), g the
 * number of co-players.
 *
 * <p>Implementation note. Each single-game law is exact (see {@link GameLaw}); the sum over independent
 * games is a convolution, done by the discrete Fourier transform of length L_F, a power of two above the
 * range of D_int (so the cyclic convolution does not wrap). Since only E[g(D)] is needed, Parseval's
 * identity sum_d p(d) g(d) = (1 / L_F) sum_w phat(w) conj(ghat(w)) is used directly, with phat a product of
 * powers of the single-game transforms computed in polar form (|z|^k e^{i k arg z}, exact for integer k;
 * with every co-player the phase is carried from i to i + 1 by one rotation, whose rounding grows by a few
 * units of 2^-53 per step); no inverse transform is needed and each i costs one pass over L_F / 2 + 1
 * frequencies (the spectra are Hermitian). Continuation games are truncated after T rounds with (number of games) delta^T &le;
 * {@link #TRUNCATION}, a bound on the total-variation error of D's law and hence on the absolute error of
 * each update probability. Rounding in the transforms adds an error of order eps sqrt(L_F) log2(L_F)
 * (reported as an estimate, not a bound). Payoffs that are not on a small lattice are rounded to one
 * ({@link Lattice}); each P then moves by at most unit / 2, D by at most unit, and each probability by
 * at most beta unit / 4 (F is 1/4-Lipschitz): the result is labelled {@link Fixation.Method#ROUNDED}.
 *
 * <p><b>Moran.</b> The reproducer is chosen with probability proportional to expected fitness (see
 * {@link Population}). Linear fitness: E[f(P)] = 1 - w + w E[P] with the exact expected payoffs (for
 * sampled co-players E[P] is the same, since E[K] = m (i - 1)/(N - 1)). Exponential fitness:
 * E[exp(w P)] is a product (or hypergeometric mixture of products) of single-game moment generating
 * functions E[exp(theta total)], theta = w / (g L), computed exactly from the tilted chain
 * (see {@link GameLaw#momentGenerating}); no lattice is needed.
 *
 * <p>References:
 * <ul>
 *   <li>Traulsen, A., Nowak, M.A. &amp; Pacheco, J.M. (2006). Stochastic dynamics of invasion and fixation.
 *       Physical Review E 74, 011909.</li>
 *   <li>Brigham, E.O. (1988). The Fast Fourier Transform and its Applications. Prentice Hall (Parseval's
 *       theorem for the DFT).</li>
 * </ul>
 */
final class RealisedRates {
    /** Total-variation budget for the truncation of continuation games. */
    static final double TRUNCATION = 1e-12;
    /** The largest transform. */
    static final int MAX_TRANSFORM = 1 << 22;
    private static final double FLOOR = -1e300;

    private RealisedRates() {
    }

    static MarkovChain chain(PayoffBasis.Realised basis, int x, int y) {
        MemoryStrategy sx = basis.strategies().get(x);
        MemoryStrategy sy = basis.strategies().get(y);
        return MarkovChain.of(new Match(basis.game(), sx, sy, basis.noise()));
    }

    /** The exact expected payoff per round of x against y (basis b). */
    static double meanPayoff(PayoffBasis.Realised basis, int x, int y) {
        MarkovChain c = chain(basis, x, y);
        return Payoffs.of(basis.game(), Frequencies.of(c, basis.horizon())).x();
    }

    static Rates of(PayoffBasis.Realised basis, Population population, int mutant, int resident) {
        if (population.update() == Population.Update.MORAN_BIRTH_DEATH) {
            return moran(basis, population, mutant, resident);
        }
        return pairwise(basis, population, mutant, resident);
    }

    private static Fixation.Method method(Horizon horizon, boolean rounded) {
        if (rounded) {
            return Fixation.Method.ROUNDED;
        }
        return horizon instanceof Horizon.Continuation c && c.probability() > 0 ? Fixation.Method.TRUNCATED
            : Fixation.Method.EXACT;
    }

    private static Rates moran(PayoffBasis.Realised basis, Population population, int a, int b) {
        int n = population.size();
        int m = population.coPlayers();
        double[] forward = new double[n + 1];
        double[] backward = new double[n + 1];
        Horizon horizon = basis.horizon();
        if (population.fitness() == Population.Fitness.LINEAR) {
            double min = Double.POSITIVE_INFINITY;
            for (double u : basis.game().payoffX()) {
                min = Math.min(min, u);
            }
            Rates.fitness(population, min);
            double aa = meanPayoff(basis, a, a);
            double ab = meanPayoff(basis, a, b);
            double ba = meanPayoff(basis, b, a);
            double bb = meanPayoff(basis, b, b);
            for (int i = 0; i <= n; i++) {
                if (i >= 1) {
                    forward[i] = Rates.fitness(population, ((i - 1) * aa + (n - i) * ab) / (n - 1));
                }
                if (i <= n - 1) {
                    backward[i] = Rates.fitness(population, (i * ba + (n - i - 1) * bb) / (n - 1));
                }
            }
            return new Rates(population, forward, backward, 1e-15, Fixation.Method.EXACT);
        }
        int g = population.gamesPerIndividual();
        double theta = population.selection() / (g * horizon.expectedLength());
        double[] u = basis.game().payoffX();
        double[] maa = GameLaw.momentGenerating(chain(basis, a, a), u, horizon, theta);
        double[] mab = GameLaw.momentGenerating(chain(basis, a, b), u, horizon, theta);
        double[] mba = GameLaw.momentGenerating(chain(basis, b, a), u, horizon, theta);
        double[] mbb = GameLaw.momentGenerating(chain(basis, b, b), u, horizon, theta);
        double laa = Math.log(maa[0]);
        double lab = Math.log(mab[0]);
        double lba = Math.log(mba[0]);
        double lbb = Math.log(mbb[0]);
        double tail = Math.max(Math.max(maa[1] / maa[0], mab[1] / mab[0]), Math.max(mba[1] / mba[0], mbb[1] / mbb[0]));
        for (int i = 0; i <= n; i++) {
            if (m == 0) {
                if (i >= 1) {
                    forward[i] = Math.exp((i - 1) * laa + (n - i) * lab);
                }
                if (i <= n - 1) {
                    backward[i] = Math.exp(i * lba + (n - i - 1) * lbb);
                }
            } else {
                if (i >= 1) {
                    double[] h = MatrixRates.hypergeometric(n - 1, i - 1, m);
                    double f = 0;
                    for (int k = 0; k <= m; k++) {
                        f += h[k] == 0 ? 0 : h[k] * Math.exp(k * laa + (m - k) * lab);
                    }
                    forward[i] = f;
                }
                if (i <= n - 1) {
                    double[] h = MatrixRates.hypergeometric(n - 1, i, m);
                    double f = 0;
                    for (int k = 0; k <= m; k++) {
                        f += h[k] == 0 ? 0 : h[k] * Math.exp(k * lba + (m - k) * lbb);
                    }
                    backward[i] = f;
                }
            }
        }
        double maxF = 0;
        for (double f : forward) {
            maxF = Math.max(maxF, f);
        }
        for (double f : backward) {
            maxF = Math.max(maxF, f);
        }
        double error = maxF * (g * tail + 1e-14);
        return new Rates(population, forward, backward, error, method(horizon, false));
    }

    /** A law placed cyclically on length l. */
    private static double[] placed(GameLaw law, int l) {
        double[] re = new double[l];
        if (law == null) {
            return re;
        }
        double[] p = law.probability();
        for (int j = 0; j < p.length; j++) {
            re[Math.floorMod(law.lowest() + j, l)] += p[j];
        }
        return re;
    }

    /** The transforms of two laws in polar form over frequencies 0..l/2: {log|X|, arg X, log|Y|, arg Y}. */
    private static double[][] polarPair(GameLaw x, GameLaw y, int l, double[][] twiddles) {
        double[][] t = Fourier.forwardPair(placed(x, l), placed(y, l), twiddles);
        int h = l / 2 + 1;
        double[][] out = new double[4][h];
        for (int k = 0; k < 2; k++) {
            double[] re = t[2 * k];
            double[] im = t[2 * k + 1];
            for (int w = 0; w < h; w++) {
                double r2 = re[w] * re[w] + im[w] * im[w];
                out[2 * k][w] = r2 > 0 ? 0.5 * Math.log(r2) : FLOOR;
                out[2 * k + 1][w] = Math.atan2(im[w], re[w]);
            }
        }
        return out;
    }

    private static Rates pairwise(PayoffBasis.Realised basis, Population population, int a, int b) {
        int n = population.size();
        int m = population.coPlayers();
        int g = population.gamesPerIndividual();
        Horizon horizon = basis.horizon();
        Lattice lattice = Lattice.of(basis.game().payoffX());
        int games = m == 0 ? 2 * n - 3 : 2 * m;
        long rounds = GameLaw.truncation(horizon, TRUNCATION / games);
        int[] own = GameLaw.focalSteps(lattice);
        GameLaw aa = GameLaw.of(chain(basis, a, a), own, horizon, rounds);
        GameLaw ab = GameLaw.of(chain(basis, a, b), own, horizon, rounds);
        GameLaw ba = GameLaw.of(chain(basis, b, a), own, horizon, rounds);
        GameLaw bb = GameLaw.of(chain(basis, b, b), own, horizon, rounds);
        GameLaw shared = m == 0 ? GameLaw.of(chain(basis, a, b), GameLaw.differenceSteps(lattice), horizon, rounds) : null;
        long lo = Math.min(lattice.min(), rounds * lattice.min());
        long hi = Math.max(lattice.max(), rounds * lattice.max());
        long games1 = m == 0 ? n - 2 : m;
        long minD = games1 * (lo - hi) + (shared == null ? 0 : shared.lowest());
        long maxD = games1 * (hi - lo) + (shared == null ? 0 : shared.highest());
        if (maxD - minD + 1 > MAX_TRANSFORM) {
            throw new IllegalArgumentException("the exact law of realised payoffs needs " + (maxD - minD + 1)
                + " lattice points, more than " + MAX_TRANSFORM + ": use fewer rounds, co-players or a coarser payoff lattice");
        }
        int l = Fourier.lengthFor(maxD - minD + 1);
        double scale = population.selection() * lattice.unit() / (g * horizon.expectedLength());
        double[] gpr = new double[l];
        double[] gmr = new double[l];
        double[] gpi;
        double[] gmi;
        for (long d = minD; d <= maxD; d++) {
            int k = (int) Math.floorMod(d, (long) l);
            gpr[k] = Rates.logistic(scale * d);
            gmr[k] = Rates.logistic(-scale * d);
        }
        double[][] twiddles = Fourier.twiddles(l);
        double[][] gt = Fourier.forwardPair(gpr, gmr, twiddles);
        gpr = gt[0];
        gpi = gt[1];
        gmr = gt[2];
        gmi = gt[3];
        double[][] first = polarPair(aa, ab, l, twiddles);
        double[][] second = polarPair(ba, bb, l, twiddles);
        double[][] paa = {first[0], first[1]};
        double[][] pab = {first[2], first[3]};
        double[][] pba = {second[0], second[1]};
        double[][] pbb = {second[2], second[3]};
        double[][] ps = null;
        if (shared != null) {
            double[][] third = polarPair(shared, null, l, twiddles);
            ps = new double[][] {third[0], third[1]};
        }
        int h = l / 2 + 1;
        double[] weight = new double[h];
        for (int w = 0; w < h; w++) {
            weight[w] = (w == 0 || 2 * w == l ? 1.0 : 2.0) / l;
        }
        double[] forward = new double[n + 1];
        double[] backward = new double[n + 1];
        if (m == 0) {
            double[] l1 = new double[h];
            double[] l2 = new double[h];
            double[] t1 = new double[h];
            double[] t2 = new double[h];
            for (int w = 0; w < h; w++) {
                l1[w] = paa[0][w] + pba[0][w];
                l2[w] = pab[0][w] + pbb[0][w];
                t1[w] = paa[1][w] - pba[1][w];
                t2[w] = pab[1][w] - pbb[1][w];
            }
            double[] ls = ps[0];
            double[] ts = ps[1];
            // The phase k1 t1 + k2 t2 + ts moves by t1 - t2 from i to i + 1: kept as a unit complex number and
            // rotated, so each i costs one exp per frequency and no sin or cos.
            // Frequencies whose exponent k1 l1 + k2 l2 + ls stays below -750 for every i (it is linear in i, so
            // the ends decide) contribute exactly 0 (exp underflows) and are left out.
            int[] active = new int[h];
            int count = 0;
            for (int w = 0; w < h; w++) {
                double end0 = (n - 2) * l2[w] + ls[w];
                double end1 = (n - 2) * l1[w] + ls[w];
                if (Math.max(end0, end1) >= -750) {
                    active[count++] = w;
                }
            }
            double[] pc = new double[count];
            double[] pss = new double[count];
            double[] rc = new double[count];
            double[] rs = new double[count];
            double[] al1 = new double[count];
            double[] al2 = new double[count];
            double[] als = new double[count];
            double[] aw = new double[count];
            double[] apr = new double[count];
            double[] api = new double[count];
            double[] amr = new double[count];
            double[] ami = new double[count];
            for (int j = 0; j < count; j++) {
                int w = active[j];
                double ang = (n - 2) * t2[w] + ts[w];
                pc[j] = Math.cos(ang);
                pss[j] = Math.sin(ang);
                rc[j] = Math.cos(t1[w] - t2[w]);
                rs[j] = Math.sin(t1[w] - t2[w]);
                al1[j] = l1[w];
                al2[j] = l2[w];
                als[j] = ls[w];
                aw[j] = weight[w];
                apr[j] = gpr[w];
                api[j] = gpi[w];
                amr[j] = gmr[w];
                ami[j] = gmi[w];
            }
            for (int i = 1; i < n; i++) {
                double k1 = i - 1;
                double k2 = n - i - 1;
                double f = 0;
                double r = 0;
                for (int j = 0; j < count; j++) {
                    double c = pc[j];
                    double sn = pss[j];
                    pc[j] = c * rc[j] - sn * rs[j];
                    pss[j] = c * rs[j] + sn * rc[j];
                    double mag = Math.exp(k1 * al1[j] + k2 * al2[j] + als[j]) * aw[j];
                    f += mag * (c * apr[j] + sn * api[j]);
                    r += mag * (c * amr[j] + sn * ami[j]);
                }
                forward[i] = clip(f);
                backward[i] = clip(r);
            }
        } else {
            for (int i = 1; i < n; i++) {
                double[] hm = MatrixRates.hypergeometric(n - 1, i - 1, m);
                double[] hl = MatrixRates.hypergeometric(n - 1, i, m);
                double f = 0;
                double r = 0;
                for (int w = 0; w < h; w++) {
                    double xr = 0;
                    double xi = 0;
                    double yr = 0;
                    double yi = 0;
                    for (int k = 0; k <= m; k++) {
                        if (hm[k] > 0) {
                            double mag = hm[k] * Math.exp(k * paa[0][w] + (m - k) * pab[0][w]);
                            if (mag > 0) {
                                double ang = k * paa[1][w] + (m - k) * pab[1][w];
                                xr += mag * Math.cos(ang);
                                xi += mag * Math.sin(ang);
                            }
                        }
                        if (hl[k] > 0) {
                            double mag = hl[k] * Math.exp(k * pba[0][w] + (m - k) * pbb[0][w]);
                            if (mag > 0) {
                                double ang = k * pba[1][w] + (m - k) * pbb[1][w];
                                yr += mag * Math.cos(ang);
                                yi += mag * Math.sin(ang);
                            }
                        }
                    }
                    double zr = (xr * yr + xi * yi) * weight[w];
                    double zi = (xi * yr - xr * yi) * weight[w];
                    f += zr * gpr[w] + zi * gpi[w];
                    r += zr * gmr[w] + zi * gmi[w];
                }
                forward[i] = clip(f);
                backward[i] = clip(r);
            }
        }
        double error = games * Math.pow(horizon instanceof Horizon.Continuation c ? c.probability() : 0, rounds)
            + 1e-15 * Math.sqrt(l) * (Math.log(l) / Math.log(2) + 1);
        if (lattice.rounded()) {
            error += population.selection() * lattice.unit() / 4;
        }
        return new Rates(population, forward, backward, error, method(horizon, lattice.rounded()));
    }

    private static double clip(double p) {
        return Math.max(0, Math.min(1, p));
    }
}
