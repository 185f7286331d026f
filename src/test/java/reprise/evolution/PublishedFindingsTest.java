package reprise.evolution;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import reprise.chain.MemoryOneStationary;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.Population;
import reprise.game.StageGame;
import reprise.game.ZeroDeterminant;

/** Published qualitative findings on finite populations, reproduced from payoff matrices. */
class PublishedFindingsTest {

    private static final StageGame PD = StageGame.DEFAULT;
    /** A small execution error so that every stationary distribution is unique. */
    private static final Noise NOISE = Noise.symmetric(1e-3, 0);

    private static PayoffBasis.Matrix stationary(MemoryStrategy... s) {
        double[][] m = new double[s.length][s.length];
        for (int x = 0; x < s.length; x++) {
            for (int y = 0; y < s.length; y++) {
                m[x][y] = MemoryOneStationary.payoffs(PD, s[x].table(), s[y].table(), NOISE).x();
            }
        }
        return new PayoffBasis.Matrix(m);
    }

    /**
     * Hilbe, Nowak &amp; Sigmund (2013), Evolution of extortion in Iterated Prisoner's Dilemma games, PNAS 110,
     * 6913-6918: extortion is favoured in small populations but not in large ones. Here: an extortioner
     * (chi = 3) invading tit-for-tat under pairwise comparison (beta = 1) is favoured at N = 2 (it always
     * earns more than its co-player) and disfavoured at N = 100 (it earns less against tit-for-tat than
     * tit-for-tat earns against itself). The resident was chosen by us; the direction is the paper's.
     */
    @Test
    void extortionFavouredInSmallNotLargePopulations() {
        MemoryStrategy extortion = ZeroDeterminant.extortionate(PD, Player.X, 3, Double.NaN, 1);
        MemoryStrategy tft = MemoryStrategy.memoryOne("tft", new double[] {1, 0, 1, 0}, 1);
        PayoffBasis.Matrix m = stationary(extortion, tft);
        assertTrue(Fixation.probability(m, Population.pairwise(2, 1), 0, 1).relativeToNeutral() > 1);
        assertTrue(Fixation.probability(m, Population.pairwise(100, 1), 0, 1).relativeToNeutral() < 1);
    }

    /**
     * Stewart &amp; Plotkin (2013), From extortion to generosity, evolution in the Iterated Prisoner's Dilemma,
     * PNAS 110, 15348-15353: in large populations generous strategies are favoured and extortionate ones
     * are not. At N = 100 (Moran, linear fitness, w = 0.1), a generous mutant (chi = 2) fixes among
     * extortioners (chi = 2) with probability above 1/N and an extortioner among generous residents below
     * 1/N; at N = 2 the extortioner wins the comparison instead.
     */
    @Test
    void generosityFavouredInLargePopulations() {
        MemoryStrategy generous = ZeroDeterminant.generous(PD, Player.X, 2, Double.NaN, 1);
        MemoryStrategy extortion = ZeroDeterminant.extortionate(PD, Player.X, 2, Double.NaN, 1);
        PayoffBasis.Matrix m = stationary(generous, extortion);
        Population large = Population.moran(100, 0.1, Population.Fitness.LINEAR);
        assertTrue(Fixation.probability(m, large, 0, 1).relativeToNeutral() > 1);
        assertTrue(Fixation.probability(m, large, 1, 0).relativeToNeutral() < 1);
        Population pair = Population.moran(2, 0.1, Population.Fitness.LINEAR);
        assertTrue(Fixation.probability(m, pair, 1, 0).relativeToNeutral() > 1);
    }

    /**
     * Imhof, Fudenberg &amp; Nowak (2005), Evolutionary cycles of cooperation and defection, PNAS 102,
     * 10797-10800: with ALLC, ALLD and TFT in an m-round game where TFT pays a small complexity cost c, the
     * rare-mutation dynamics cycle ALLD -&gt; TFT -&gt; ALLC -&gt; ALLD, and in large populations most time is
     * spent near TFT. Matrix of the paper's form (m rounds; R, S, T, P = 3, 0.1, 5, 1; m = 10; c = 0.8: the
     * numbers from memory), Moran process, w = 0.1, N = 100.
     */
    @Test
    void allcAlldTftCycle() {
        double r = 3;
        double s = 0.1;
        double t = 5;
        double p = 1;
        double rounds = 10;
        double c = 0.8;
        // Order: ALLC, ALLD, TFT; total payoffs over the game, divided by rounds for payoff per round.
        double[][] total = {
            {r * rounds, s * rounds, r * rounds},
            {t * rounds, p * rounds, t + p * (rounds - 1)},
            {r * rounds - c, s + p * (rounds - 1) - c, r * rounds - c}};
        double[][] perRound = new double[3][3];
        for (int x = 0; x < 3; x++) {
            for (int y = 0; y < 3; y++) {
                perRound[x][y] = total[x][y] / rounds;
            }
        }
        PayoffBasis.Matrix m = new PayoffBasis.Matrix(perRound);
        Population pop = Population.moran(100, 0.1, Population.Fitness.LINEAR);
        int allc = 0;
        int alld = 1;
        int tft = 2;
        assertTrue(Fixation.probability(m, pop, tft, alld).relativeToNeutral() > 1, "TFT invades ALLD");
        assertTrue(Fixation.probability(m, pop, allc, tft).relativeToNeutral() > 1, "ALLC invades TFT");
        assertTrue(Fixation.probability(m, pop, alld, allc).relativeToNeutral() > 1, "ALLD invades ALLC");
        assertTrue(Fixation.probability(m, pop, alld, tft).relativeToNeutral() < 1, "ALLD does not invade TFT");
        double[] abundance = Abundance.rareMutation(m, pop);
        assertTrue(abundance[tft] > abundance[allc] && abundance[tft] > abundance[alld], "most time near TFT");
    }
}
