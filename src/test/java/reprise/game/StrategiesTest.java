package reprise.game;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class StrategiesTest {

    private static final StageGame PD = StageGame.DEFAULT;

    private static MemoryStrategy parse(String spec) {
        return (MemoryStrategy) Strategies.parse(spec, PD, Player.X);
    }

    static Stream<Arguments> named() {
        // Definitions of the classics (common practice, no source), except gtft: q = 1/3 for 3,0,5,1
        // (Nowak & Sigmund 1992, Tit for tat in heterogeneous populations; REFERENCES item 2).
        return Stream.of(
            Arguments.of("allc", new double[] {1, 1, 1, 1}, 1.0),
            Arguments.of("alld", new double[] {0, 0, 0, 0}, 0.0),
            Arguments.of("tft", new double[] {1, 0, 1, 0}, 1.0),
            Arguments.of("stft", new double[] {1, 0, 1, 0}, 0.0),
            Arguments.of("gtft", new double[] {1, 1.0 / 3, 1, 1.0 / 3}, 1.0),
            Arguments.of("wsls", new double[] {1, 0, 0, 1}, 1.0),
            Arguments.of("grim", new double[] {1, 0, 0, 0}, 1.0),
            Arguments.of("reactive:0.9,0.2", new double[] {0.9, 0.2, 0.9, 0.2}, 1.0),
            Arguments.of("reactive:1,1/3@0.5", new double[] {1, 1.0 / 3, 1, 1.0 / 3}, 0.5),
            Arguments.of("memory1:0.9,0.2,0.7,0.1@0", new double[] {0.9, 0.2, 0.7, 0.1}, 0.0),
            Arguments.of("TFT @ 0.25", new double[] {1, 0, 1, 0}, 0.25));
    }

    @ParameterizedTest
    @MethodSource("named")
    void memoryOneSpecsGiveTheirTables(String spec, double[] table, double initial) {
        MemoryStrategy m = parse(spec);
        assertEquals(1, m.memory());
        assertArrayEquals(table, m.table(), 1e-15);
        assertEquals(initial, m.initial());
    }

    @Test
    void titForTwoTatsDefectsOnlyAfterTwoDefectionsInARow() {
        MemoryStrategy m = parse("tf2t");
        assertEquals(2, m.memory());
        for (int prev = 0; prev < 4; prev++) {
            for (int last = 0; last < 4; last++) {
                boolean twoDefections = (prev & 1) == 1 && (last & 1) == 1;
                assertEquals(twoDefections ? 0.0 : 1.0, m.cooperation(last + 4 * prev), "prev " + prev + " last " + last);
            }
        }
    }

    @Test
    void memoryTwoTableIsReadInIndexOrder() {
        StringBuilder sb = new StringBuilder("memory2:");
        for (int i = 0; i < 16; i++) {
            sb.append(i == 0 ? "" : ",").append(i / 16.0);
        }
        MemoryStrategy m = parse(sb.toString());
        assertEquals(5 / 16.0, m.cooperation(5));
    }

    @Test
    void extendingMemoryIgnoresTheOlderRounds() {
        MemoryStrategy m = parse("memory1:0.9,0.2,0.7,0.1").extendTo(2);
        assertEquals(16, m.size());
        for (int i = 0; i < 16; i++) {
            assertEquals(new double[] {0.9, 0.2, 0.7, 0.1}[i & 3], m.cooperation(i));
        }
    }

    @Test
    void reactiveStrategiesAreRecognised() {
        assertTrue(parse("reactive:0.3,0.6").isReactive());
        assertTrue(parse("tft").isReactive());
        assertEquals(false, parse("wsls").isReactive());
    }

    static Stream<Arguments> generosity() {
        // Molander (1985), The optimal level of generosity in a selfish, uncertain environment; Nowak & Sigmund
        // (1992), Tit for tat in heterogeneous populations: q* = min{1 - (T-R)/(R-S), (R-P)/(T-P)}.
        // Values from REFERENCES item 2, games given there as (T,R,P,S).
        return Stream.of(
            Arguments.of(new double[] {3, 0, 5, 1}, 1.0 / 3),
            Arguments.of(new double[] {3, 0, 4, 1}, 2.0 / 3),
            Arguments.of(new double[] {4, 0, 5, 1}, 3.0 / 4),
            Arguments.of(new double[] {3, 0, 6, 2}, 0.0));
    }

    @ParameterizedTest
    @MethodSource("generosity")
    void generosityOfGenerousTitForTat(double[] rstp, double expected) {
        assertEquals(expected, Strategies.generosity(rstp), 1e-15);
    }

    @Test
    void customAgentsKeepNameAndArguments() {
        Strategy s = Strategies.parse("agent:runcap, 3", PD, Player.Y);
        CustomStrategy c = assertInstanceOf(CustomStrategy.class, s);
        assertEquals("runcap", c.name());
        assertEquals(List.of("3"), c.arguments());
        assertEquals("agent:runcap,3", c.label());
    }

    static Stream<Arguments> badSpecs() {
        return Stream.of(
            Arguments.of("titfortat", "unknown strategy 'titfortat'; known: allc"),
            Arguments.of("reactive:0.5", "needs 2 numbers"),
            Arguments.of("reactive:1.2,0.1", "entry 1 must be a probability in [0, 1]: 1.2"),
            Arguments.of("memory1:0.5,0.5,NaN,0.5", "finite"),
            Arguments.of("memory1:0.5,0.5,0.5", "needs 4 numbers"),
            Arguments.of("memory2:0.5", "needs 16 numbers"),
            Arguments.of("tft@1.5", "must be a probability in [0, 1]"),
            Arguments.of("tft:1", "takes no parameters"),
            Arguments.of("extort:phi=0.1", "needs chi"),
            Arguments.of("extort:chi=3,psi=2", "unknown parameter 'psi'"),
            Arguments.of("extort:3,0.1", "key=value"),
            Arguments.of("extort:chi=0.5", "chi must be"),
            Arguments.of("extort:chi=3,phi=0.2", "phi must be in (0, 0.0769"),
            Arguments.of("extort:chi=2,delta=0.5", "no valid extortionate strategy"),
            Arguments.of("extort:chi=2,delta=1.5", "delta"),
            Arguments.of("generous:chi=2@0", "sets its own first move"),
            Arguments.of("equalizer:score=4", "no valid equalizer"),
            Arguments.of("agent:", "agent name is empty"),
            Arguments.of("", "strategy is empty"));
    }

    @ParameterizedTest
    @MethodSource("badSpecs")
    void badSpecsAreRefusedWithAMessageNamingTheProblem(String spec, String fragment) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Strategies.parse(spec, PD,
            Player.X));
        assertTrue(e.getMessage().contains(fragment), e.getMessage());
        assertEquals(-1, e.getMessage().indexOf('\n'), "one line");
    }
}
