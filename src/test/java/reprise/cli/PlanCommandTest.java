package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** The plan command: JSON fields, values against closed forms, and one-line errors with nothing on stdout. */
class PlanCommandTest {

    static String[] run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new String[] {Integer.toString(code), out.toString(), err.toString()};
    }

    @Test
    void jsonHasTheDocumentedFields() throws Exception {
        String[] r = run("plan", "--x", "tft", "--y", "wsls", "--noise", "0.05", "--continuation", "0.9",
            "--half-width", "0.01", "--detect", "0.02", "--json");
        assertEquals("0", r[0], r[2]);
        JsonNode j = Json.MAPPER.readTree(r[1]);
        for (String f : List.of("horizon", "burn_in", "expected_tallied_length", "confidence", "half_width", "detect",
            "quantities", "games_for_half_width_all", "games_to_detect_all")) {
            assertTrue(j.has(f), f);
        }
        assertEquals(6, j.get("quantities").size());
        for (JsonNode q : j.get("quantities")) {
            for (String f : List.of("name", "exact", "per_game_variance", "games_for_half_width", "games_to_detect",
                "asymptotic_variance", "rounds_for_half_width", "rounds_to_detect", "note")) {
                assertTrue(q.has(f), f + " in " + q);
            }
            assertTrue(q.get("games_for_half_width").asLong() >= 2, q.toString());
        }
    }

    /**
     * Random play: two random players (cooperate with probability 1/2 regardless) make every round an
     * independent uniform draw of the four states, so with n = 10 fixed rounds the per-game variance of a
     * state frequency is (1/4)(3/4)/10 = 0.01875, and the long-run variance per round is 3/16 (independent
     * rounds; derived by hand, common practice). The games for half-width 0.01 at 95% must be the
     * smallest G with t_{G-1, 0.975} sqrt(0.01875 / G) &le; 0.01 (checked here with the Commons Statistics
     * t quantile; the normal bound 1.96^2 * 0.01875 / 0.01^2 = 720.3 is a lower bound); the rounds are
     * ceil(1.959964^2 * 0.1875 / 0.0001) = 7203.
     */
    @Test
    void randomPlayMatchesTheBinomialVariance() throws Exception {
        String[] r = run("plan", "--x", "random", "--y", "random", "--rounds", "10", "--half-width", "0.01", "--json");
        assertEquals("0", r[0], r[2]);
        JsonNode cc = Json.MAPPER.readTree(r[1]).get("quantities").get(0);
        assertEquals("CC", cc.get("name").asText());
        assertEquals(0.25, cc.get("exact").asDouble(), 1e-12);
        assertEquals(0.01875, cc.get("per_game_variance").asDouble(), 1e-12);
        assertEquals(0.1875, cc.get("asymptotic_variance").asDouble(), 1e-12);
        long g = cc.get("games_for_half_width").asLong();
        assertTrue(g > 720, "games " + g);
        assertTrue(halfWidth(g) <= 0.01 && halfWidth(g - 1) > 0.01, "games " + g);
        assertEquals(7203, cc.get("rounds_for_half_width").asLong());
    }

    private static double halfWidth(long g) {
        return org.apache.commons.statistics.distribution.TDistribution.of(g - 1).inverseSurvivalProbability(0.025)
            * Math.sqrt(0.01875 / g);
    }

    @Test
    void tableIsPrinted() {
        String[] r = run("plan", "--x", "tft", "--y", "alld", "--rounds", "10", "--half-width", "0.01");
        assertEquals("0", r[0], r[2]);
        assertTrue(r[1].contains("games (W)"), r[1]);
        assertTrue(r[1].contains("no variation between games"), r[1]);
        assertEquals("", r[2]);
    }

    static Stream<Arguments> badInput() {
        return Stream.of(
            Arguments.of(new String[] {"--rounds", "10"}, "plan needs --half-width W, --detect D, or both"),
            Arguments.of(new String[] {"--half-width", "0.01"}, "plan needs --rounds N or --continuation DELTA"),
            Arguments.of(new String[] {"--rounds", "10", "--half-width", "0"}, "--half-width must be a finite number > 0"),
            Arguments.of(new String[] {"--rounds", "10", "--detect", "0"}, "--detect must be a finite non-zero number"),
            Arguments.of(new String[] {"--rounds", "10", "--detect", "0.1", "--power", "1"}, "--power must be in"),
            Arguments.of(new String[] {"--rounds", "10", "--detect", "0.1", "--alpha", "0"}, "--alpha must be in (0, 1)"),
            Arguments.of(new String[] {"--rounds", "10", "--half-width", "0.1", "--confidence", "2"},
                "--confidence must be in (0, 1): 2.0"),
            Arguments.of(new String[] {"--rounds", "10", "--half-width", "0.1", "--burn-in", "10"},
                "--burn-in must be shorter than the game (10 rounds): 10"));
    }

    @ParameterizedTest
    @MethodSource("badInput")
    void badInputIsOneLineOnStderrAndNothingOnStdout(String[] extra, String message) {
        String[] args = Stream.concat(Stream.of("plan", "--x", "tft", "--y", "tft"), Stream.of(extra))
            .toArray(String[]::new);
        String[] r = run(args);
        assertEquals("2", r[0], r[2]);
        assertEquals("", r[1]);
        assertTrue(r[2].startsWith("reprise plan: ") && r[2].contains(message), r[2]);
        assertEquals(1, r[2].strip().lines().count(), r[2]);
    }

    @Test
    void userWrittenAgentHasNothingToPlanFrom() {
        String[] r = run("plan", "--x", "agent:runcap", "--y", "tft", "--rounds", "10", "--half-width", "0.1");
        assertEquals("2", r[0]);
        assertEquals("", r[1]);
        assertTrue(r[2].contains("nothing to plan from"), r[2]);
    }
}
