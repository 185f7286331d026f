package reprise.chain;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.game.CustomStrategy;
import reprise.game.Match;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.State;

class MarkovChainTest {

    static Stream<Arguments> matches() {
        return Stream.of(
            Arguments.of(Support.match("tft", "tft", Noise.symmetric(0.01, 0))),
            Arguments.of(Support.match("wsls", "gtft", new Noise(0.02, 0.001, 0.03, 0.0))),
            Arguments.of(Support.match("tf2t", "memory1:0.9,0.2,0.7,0.1", Noise.symmetric(0.05, 0))),
            Arguments.of(Support.match("tf2t", "memory1:0.9,0.2,0.7,0.1", new Noise(0.05, 0.01, 0, 0.1))),
            Arguments.of(Support.match("tf2t", "wsls", new Noise(0.05, 0.02, 0.1, 0.03))),
            Arguments.of(Support.match("tft", "tft", Noise.NONE)),
            Arguments.of(Support.match("extort:chi=3,phi=1/26", "alld", Noise.NONE)));
    }

    // Rows of a stochastic matrix sum to 1 (definition); tolerance: a few rounding errors of 16 additions.
    @ParameterizedTest
    @MethodSource("matches")
    void rowsSumToOneAndStationaryIsInvariant(Match match) {
        MarkovChain chain = MarkovChain.of(match);
        double[][] m = chain.transitionMatrix();
        for (double[] row : m) {
            double s = 0;
            for (double x : row) {
                assertTrue(x >= 0);
                s += x;
            }
            assertEquals(1, s, 1e-14);
        }
        assertEquals(1, sum(chain.initialDistribution()), 1e-15);
        double[] pi = chain.structure().limitDistribution();
        if (chain.structure().hasUniqueStationary()) {
            // pi M = pi (definition of stationarity), 1e-14: GTH is accurate to a few ulps per entry
            Support.assertVector(pi, Support.times(pi, m), 1e-14, "pi M");
        }
        assertEquals(1, sum(pi), 1e-14);
    }

    // Independent event-by-event enumeration of the rules (Support.enumerate), 5 or 6 rounds.
    // 1e-11: the enumeration adds up to 16^6 = 1.7e7 path probabilities one by one, whose rounding
    // accumulates to about 1e-12 (observed 7e-13); a modelling error would show at the noise level (>= 1e-3).
    @ParameterizedTest
    @MethodSource("matches")
    void roundDistributionsMatchBruteForceEnumeration(Match match) {
        MarkovChain chain = MarkovChain.of(match);
        int rounds = chain.kind() == MarkovChain.Kind.PLAYER_RECORDS ? 5 : 6;
        double[][] expected = Support.enumerate(match, rounds);
        for (int t = 1; t <= rounds; t++) {
            Support.assertVector(expected[t - 1], chain.roundStateDistributionAt(t), 1e-11, "round " + t);
        }
    }

    @Test
    void layoutsFollowMemoryAndPerception() {
        assertEquals(MarkovChain.Kind.ROUND_STATES,
            MarkovChain.of(Support.match("tft", "wsls", Noise.symmetric(0.1, 0.1))).kind());
        MarkovChain h = MarkovChain.of(Support.match("tf2t", "wsls", Noise.symmetric(0.1, 0)));
        assertEquals(MarkovChain.Kind.TRUE_HISTORIES, h.kind());
        assertEquals(16, h.size());
        assertEquals("CD DC", h.stateLabel(1 * 4 + 2));
        // the memory-two player does not misperceive, the memory-one player does: true histories stay exact
        MarkovChain mixed = MarkovChain.of(Support.match("tf2t", "wsls", new Noise(0.1, 0.1, 0, 0.2)));
        assertEquals(MarkovChain.Kind.TRUE_HISTORIES, mixed.kind());
        MarkovChain r = MarkovChain.of(Support.match("tf2t", "wsls", new Noise(0.1, 0.1, 0.2, 0)));
        assertEquals(MarkovChain.Kind.PLAYER_RECORDS, r.kind());
        assertEquals(256, r.size());
        assertEquals(3, r.roundState(2 + 16 * 2));
    }

    @Test
    void refusesWhatHasNoChain() {
        Match agent = Support.match(new CustomStrategy("runcap", List.of()),
            MemoryStrategy.memoryOne("tft", new double[] {1, 0, 1, 0}, 1), Noise.NONE);
        NoPredictionException e = assertThrows(NoPredictionException.class, () -> MarkovChain.of(agent));
        assertTrue(e.getMessage().startsWith("no exact prediction for agent:runcap: user-written agents have no "
            + "Markov chain"), e.getMessage());
        Match big = Support.match("memory3:" + "1,".repeat(63) + "0", "tft", Noise.symmetric(0, 0.01));
        NoPredictionException e3 = assertThrows(NoPredictionException.class, () -> MarkovChain.of(big));
        assertTrue(e3.getMessage().contains("4096 joint states, above the limit of 256"), e3.getMessage());
        assertTrue(e3 instanceof IllegalArgumentException);
        MarkovChain records = MarkovChain.of(Support.match("tf2t", "tft", Noise.symmetric(0, 0.01)));
        NoPredictionException e2 = assertThrows(NoPredictionException.class, records::observableTransitionMatrix);
        assertTrue(e2.getMessage().contains("not a Markov chain"), e2.getMessage());
        assertThrows(IllegalArgumentException.class, () -> records.distributionAt(0));
        assertThrows(IllegalArgumentException.class, () -> records.project(new double[4]));
    }

    @Test
    void observableMatrixIsTheTrueHistoryChain() {
        MarkovChain one = MarkovChain.of(Support.match("tft", "wsls", Noise.symmetric(0.1, 0.2)));
        assertArrayEquals(one.transitionMatrix()[2], one.observableTransitionMatrix()[2]);
        MarkovChain two = MarkovChain.of(Support.match("tf2t", "wsls", Noise.symmetric(0.1, 0)));
        assertEquals(16, two.observableTransitionMatrix().length);
    }

    // Memory-one example rows, Kemeny & Snell item of REFERENCES.md section 7 (rows of M given as fractions).
    @Test
    void memoryOneExampleRows() {
        MarkovChain chain = MarkovChain.of(Support.match(new double[] {0.9, 0.2, 0.7, 0.1},
            new double[] {0.8, 0.3, 0.6, 0.2}, Noise.NONE));
        double[][] expected = {
            {18 / 25.0, 9 / 50.0, 2 / 25.0, 1 / 50.0}, {3 / 25.0, 2 / 25.0, 12 / 25.0, 8 / 25.0},
            {21 / 100.0, 49 / 100.0, 9 / 100.0, 21 / 100.0}, {1 / 50.0, 2 / 25.0, 9 / 50.0, 18 / 25.0}};
        Support.assertMatrix(expected, chain.transitionMatrix(), 1e-15, "M");
    }

    // Swapping the players mirrors every state (CD <-> DC); property of the model, exact up to rounding.
    @ParameterizedTest
    @MethodSource("matches")
    void swappingPlayersMirrorsStates(Match match) {
        MarkovChain a = MarkovChain.of(match);
        MarkovChain b = MarkovChain.of(match.swapped());
        double[] fa = Frequencies.rounds(a, 1, 37);
        double[] fb = Frequencies.rounds(b, 1, 37);
        for (int s = 0; s < 4; s++) {
            assertEquals(fa[s], fb[State.mirror(s)], 1e-13);
        }
        double[] la = a.project(a.structure().limitDistribution());
        double[] lb = b.project(b.structure().limitDistribution());
        for (int s = 0; s < 4; s++) {
            assertEquals(la[s], lb[State.mirror(s)], 1e-12);
        }
    }

    // A reactive strategy equals its memory-one embedding (p, q, p, q): MemoryStrategy Javadoc; exact.
    @Test
    void reactiveAndItsEmbeddingAgree() {
        Noise n = new Noise(0.01, 0.02, 0.03, 0.04);
        Match r = Support.match("reactive:0.9,0.2", "reactive:0.7,0.4@0.5", n);
        Match m = Support.match("memory1:0.9,0.2,0.9,0.2", "memory1:0.7,0.4,0.7,0.4@0.5", n);
        Support.assertVector(MarkovChain.of(m).structure().stationary(),
            MarkovChain.of(r).structure().stationary(), 0, "stationary");
        Support.assertVector(Frequencies.rounds(MarkovChain.of(m), 1, 10), Frequencies.rounds(MarkovChain.of(r), 1, 10),
            0, "f_10");
    }

    // Noise-free TFT pair: not ergodic (Nowak & Sigmund 1990 edge case, REFERENCES.md section 1).
    @Test
    void noiseFreeTitForTatHasThreeClosedClasses() {
        MarkovChain chain = MarkovChain.of(Support.match("tft", "tft", Noise.NONE));
        ChainStructure s = chain.structure();
        assertNull(s.stationary());
        assertEquals(List.of("{CC}", "CD -> DC", "{DD}"), s.classDescriptions());
        assertEquals(2, s.periods()[1]);
        assertTrue(s.note().contains("{CC}, CD -> DC, {DD}"), s.note());
        assertArrayEquals(new double[] {1, 0, 0}, s.absorption());
        // STFT opens with D: play alternates CD -> DC forever, time average (0, 1/2, 1/2, 0)
        // (computed independently in exact arithmetic)
        MarkovChain alt = MarkovChain.of(Support.match("tft", "stft", Noise.NONE));
        Support.assertVector(new double[] {0, 0.5, 0.5, 0}, alt.project(alt.structure().limitDistribution()), 0,
            "limit");
        // mixed first moves: random opening for both, classes reached with 1/4, 1/2, 1/4
        MarkovChain mix = MarkovChain.of(Support.match("tft@0.5", "tft@0.5", Noise.NONE));
        Support.assertVector(new double[] {0.25, 0.5, 0.25}, mix.structure().absorption(), 1e-15, "absorption");
        Support.assertVector(new double[] {0.25, 0.25, 0.25, 0.25}, mix.project(mix.structure().limitDistribution()),
            1e-15, "limit");
    }

    // Extortioner chi=3 vs ALLD: DD absorbing (Press & Dyson 2012, REFERENCES.md section 4).
    @Test
    void extortionerAgainstAlldIsAbsorbedInDD() {
        MarkovChain chain = MarkovChain.of(Support.match("extort:chi=3,phi=1/26", "alld", Noise.NONE));
        ChainStructure s = chain.structure();
        assertNotNull(s.stationary());
        assertEquals(List.of("{DD}"), s.classDescriptions());
        Support.assertVector(new double[] {0, 0, 0, 1}, chain.project(s.stationary()), 0, "pi");
        assertArrayEquals(new int[] {0, 1, 2}, s.transientStates());
        assertNull(s.note());
    }

    private static double sum(double[] v) {
        double s = 0;
        for (double x : v) {
            s += x;
        }
        return s;
    }
}
