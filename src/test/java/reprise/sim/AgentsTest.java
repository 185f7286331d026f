package reprise.sim;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ServiceLoader;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.api.Test;
import reprise.game.Horizon;
import reprise.game.Noise;

/** The agent plug-in mechanism and the example agent's rule (noise-free games, checked by hand). */
class AgentsTest {

    /** States of rounds 1..n of replicate 0. */
    static String play(String x, String y, int n) {
        SimulationSpec spec = SimulationSpec.of(DeterminismTest.match(x, y, Noise.NONE), Horizon.rounds(n), 1, 3)
            .withTimeResolved(n).withThreads(1);
        StringBuilder sb = new StringBuilder();
        for (long[] row : new Simulator(spec).run().timeResolvedCounts()) {
            for (int s = 0; s < 4; s++) {
                if (row[s] == 1) {
                    sb.append(sb.length() == 0 ? "" : " ").append(reprise.game.State.of(s));
                }
            }
        }
        return sb.toString();
    }

    static Stream<Arguments> rules() {
        return Stream.of(
            // runcap retaliates for at most K rounds in a row, then cooperates once (by hand from the rule)
            Arguments.of("agent:runcap", "alld", "CD DD DD CD DD DD CD DD DD"),
            Arguments.of("agent:runcap,1", "alld", "CD DD CD DD CD DD"),
            Arguments.of("agent:runcap,3,0", "alld", "CD DD DD DD CD DD DD DD"),
            Arguments.of("agent:runcap,2,1", "alld", "CD CD CD CD"),
            Arguments.of("agent:RUNCAP,2", "tft", "CC CC CC CC"),
            Arguments.of("agent:runcap,1", "stft", "CD DC CD DC"));
    }

    @ParameterizedTest(name = "{0} vs {1}")
    @MethodSource("rules")
    void runCapFollowsItsRule(String x, String y, String expected) {
        assertEquals(expected, play(x, y, expected.split(" ").length));
    }

    static Stream<Arguments> badSpecs() {
        return Stream.of(
            Arguments.of("agent:nosuch", "unknown agent 'nosuch'; known agents: runcap (add one through "
                + "META-INF/services/reprise.sim.AgentFactory)"),
            Arguments.of("agent:runcap,0", "agent runcap: K must be a whole number of at least 1: 0"),
            Arguments.of("agent:runcap,two", "agent runcap: K must be a whole number of at least 1: 'two'"),
            Arguments.of("agent:runcap,2,1.5", "agent runcap: G must be a probability in [0, 1]: 1.5"),
            Arguments.of("agent:runcap,2,x", "agent runcap: G must be a probability in [0, 1]: 'x'"),
            Arguments.of("agent:runcap,1,0,3", "agent runcap takes at most 2 arguments (K, G), got 3: 1,0,3; "
                + "usage: " + new RunCapAgentFactory().usage()));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("badSpecs")
    void badAgentSpecsAreRefusedBeforeAnyWork(String spec, String message) {
        SimulationSpec s = SimulationSpec.of(DeterminismTest.match(spec, "tft", Noise.NONE), Horizon.rounds(5), 1, 1);
        assertEquals(message, assertThrows(IllegalArgumentException.class, () -> new Simulator(s)).getMessage());
    }

    @Test
    void theExampleAgentIsRegisteredForTheServiceLoader() {
        assertTrue(ServiceLoader.load(AgentFactory.class).stream()
            .anyMatch(p -> p.type() == RunCapAgentFactory.class), "META-INF/services lists the runcap factory");
        assertEquals(java.util.List.of("runcap"), Agents.knownNames());
        assertArrayEquals(new String[] {"runcap"}, new String[] {Agents.factory("RunCap").name()});
    }
}
