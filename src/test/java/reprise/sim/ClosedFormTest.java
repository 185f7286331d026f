package reprise.sim;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.statistics.distribution.NormalDistribution;
import org.apache.commons.statistics.inference.BinomialTest;
import org.junit.jupiter.api.Test;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.StageGame;

/**
 * Simulated frequencies and payoffs against published closed forms, on both paths, using the per-game
 * sufficient statistics for replicate-level standard errors.
 *
 * <p>Failure budget: 42 tests in all (21 per path, listed per check below), each at alpha = 0.01 / 42, so by
 * Bonferroni the false-failure probability is at most 0.01. z-tests use the normal approximation to a
 * mean of at least 2000 independent games (common practice, no source).
 */
class ClosedFormTest {
    private static final int TESTS = 42;
    private static final double ALPHA = 0.01 / TESTS;
    private static final double Z = NormalDistribution.of(0, 1).inverseSurvivalProbability(ALPHA / 2);
    private static final Enactment[] PATHS = {Enactment.FASTEST, Enactment.LITERAL};

    private final List<String> rejected = new ArrayList<>();
    private int done;

    private void z(String what, double estimate, double standardError, double exact) {
        done++;
        double z = (estimate - exact) / standardError;
        if (!(Math.abs(z) <= Z)) {
            rejected.add(what + ": " + estimate + " vs " + exact + ", z = " + z);
        }
    }

    /**
     * The payoff per tallied round, sum_g P_g / sum_g L with P_g = sum_s u_s N_s, and its delta-method
     * standard error sqrt(sum_g (P_g - R L_g)^2) / sum_g L, all from the sufficient statistics.
     */
    static double[] ratio(SimulationResult r, double[] u) {
        BigInteger[][] nn = r.sumOfStateCountProducts();
        BigInteger[] ln = r.sumOfLengthTimesStateCounts();
        double sumL = r.sumOfTalliedLengths();
        double sumL2 = r.sumOfSquaredTalliedLengths().doubleValue();
        long[] n = r.stateCounts();
        double sumP = 0;
        double sumP2 = 0;
        double sumPL = 0;
        for (int s = 0; s < 4; s++) {
            sumP += u[s] * n[s];
            sumPL += u[s] * ln[s].doubleValue();
            for (int q = 0; q < 4; q++) {
                sumP2 += u[s] * u[q] * nn[s][q].doubleValue();
            }
        }
        double rr = sumP / sumL;
        double ss = sumP2 - 2 * rr * sumPL + rr * rr * sumL2;
        return new double[] {rr, Math.sqrt(Math.max(ss, 0)) / sumL};
    }

    static double[] indicator(int s) {
        double[] u = new double[4];
        u[s] = 1;
        return u;
    }

    @Test
    void publishedClosedFormsAreReproduced() {
        StageGame pd = StageGame.DEFAULT;
        for (Enactment e : PATHS) {
            // REFERENCES item 3 (derived independently, no published source; computed independently in
            // exact arithmetic): TFT vs TFT with execution error 0.01 from an error-free opening CC (their
            // round 0); each player then cooperates in round t = 1, 2, ... with probability
            // c_t = (1 + a^t)/2, a = 1 - 2 eps, independently, and the mean payoff over their first 10
            // rounds (round 0 included, payoff R = 3) is 2.954792513. Our round t is their round t (our
            // round 1 already has execution error), so (3 + E[total of our rounds 1..9]) / 10 must equal
            // 2.954792513, and P(CC in our round t) = c_t^2. Tests: 1 payoff + 10 rounds, per path.
            Match tft = DeterminismTest.match("tft", "tft", Noise.symmetric(0.01, 0));
            SimulationResult r = new Simulator(SimulationSpec.of(tft, Horizon.rounds(9), 20_000, 30).withThreads(2)
                .withEnactment(e)).run();
            double[] pay = ratio(r, pd.payoffX());
            z("TFT payoff [" + e + "]", (3 + 9 * pay[0]) / 10, 9 * pay[1] / 10, 2.954792513);
            r = new Simulator(SimulationSpec.of(tft, Horizon.rounds(10), 20_000, 31).withThreads(2)
                .withTimeResolved(10).withEnactment(e)).run();
            long[][] byRound = r.timeResolvedCounts();
            for (int t = 1; t <= 10; t++) {
                double c = (1 + Math.pow(1 - 2 * 0.01, t)) / 2;
                done++;
                double pv = BinomialTest.withDefaults().test(20_000, (int) byRound[t - 1][0], c * c).getPValue();
                if (!(pv > ALPHA)) {
                    rejected.add("TFT P(CC at round " + t + ") [" + e + "]: p = " + pv);
                }
            }
            // REFERENCES item 1c: Nowak & Sigmund (1990), reactive (0.9, 0.2) vs (0.7, 0.4): stationary
            // pi = (2208, 1584, 1426, 1023)/6241. 200 tallied rounds after a burn-in of 100 (the start's
            // influence decays like 0.21^(t/2) and is below 1e-30). Tests: 4 states per path.
            Match ns = DeterminismTest.match("reactive:0.9,0.2", "reactive:0.7,0.4", Noise.NONE);
            r = new Simulator(SimulationSpec.of(ns, Horizon.rounds(300), 4_000, 32).withBurnIn(100).withThreads(2)
                .withEnactment(e)).run();
            double[] pi = {2208 / 6241.0, 1584 / 6241.0, 1426 / 6241.0, 1023 / 6241.0};
            for (int s = 0; s < 4; s++) {
                double[] f = ratio(r, indicator(s));
                z("Nowak-Sigmund pi_" + s + " [" + e + "]", f[0], f[1], pi[s]);
            }
            // REFERENCES item 6: WSLS (Nowak & Sigmund 1993) vs itself with execution error 0.05:
            // pi_CC = 0.817, cooperation rate pi_CC + pi_CD = 0.8645 (closed form derived independently,
            // computed in exact arithmetic). Burn-in 200 rounds. Tests: 2 per path.
            Match wsls = DeterminismTest.match("wsls", "wsls", Noise.symmetric(0.05, 0));
            r = new Simulator(SimulationSpec.of(wsls, Horizon.rounds(1_200), 2_000, 33).withBurnIn(200).withThreads(2)
                .withEnactment(e)).run();
            double[] cc = ratio(r, indicator(0));
            z("WSLS pi_CC [" + e + "]", cc[0], cc[1], 0.817);
            double[] coop = ratio(r, new double[] {1, 1, 0, 0});
            z("WSLS cooperation [" + e + "]", coop[0], coop[1], 0.8645);
            // REFERENCES item 5 (Hilbe, Traulsen & Sigmund 2015 condition; values computed independently in
            // exact arithmetic): extortion chi = 2, phi = 0.1, p0 = 0 with continuation delta = 0.9 gives
            // E[total]/E[length] = (7/2, 9/4) against ALLC and (42/17, 59/34) against Random.
            // Tests: 2 opponents x 2 players per path.
            String[] opponents = {"allc", "random"};
            double[][] expected = {{7 / 2.0, 9 / 4.0}, {42 / 17.0, 59 / 34.0}};
            for (int k = 0; k < 2; k++) {
                Match zd = DeterminismTest.match("extort:chi=2,phi=0.1,delta=0.9", opponents[k], Noise.NONE);
                r = new Simulator(SimulationSpec.of(zd, Horizon.continuation(0.9), 100_000, 34 + k).withThreads(2)
                    .withEnactment(e)).run();
                double[] px = ratio(r, pd.payoffX());
                double[] py = ratio(r, pd.payoffY());
                z("ZD vs " + opponents[k] + " pi_X [" + e + "]", px[0], px[1], expected[k][0]);
                z("ZD vs " + opponents[k] + " pi_Y [" + e + "]", py[0], py[1], expected[k][1]);
            }
        }
        assertEquals(TESTS, done);
        assertTrue(rejected.isEmpty(), "z critical " + Z + ": " + rejected);
    }
}
