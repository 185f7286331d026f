package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.Arrays;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The simulation options shared by simulate, calibrate and plan: each command's checks and messages, each
 * command's own help wording, and the options reaching the simulation.
 */
class SimulationOptionsTest {

    record Run(int code, String out, String err) {
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Run(code, out.toString(), err.toString());
    }

    private static String[] command(String name, String... more) {
        String[] base = {name, "--x", "tft", "--y", "alld", "--rounds", "10", "--quiet"};
        if (name.equals("plan")) {
            base = new String[] {name, "--x", "tft", "--y", "alld", "--rounds", "10", "--half-width", "0.1"};
        }
        String[] all = Arrays.copyOf(base, base.length + more.length);
        System.arraycopy(more, 0, all, base.length, more.length);
        return all;
    }

    static Stream<Arguments> badInput() {
        return Stream.of(
            Arguments.of("simulate", new String[] {"--replicates", "0"}, "--replicates must be at least 1: 0"),
            Arguments.of("simulate", new String[] {"--threads", "0"}, "--threads must be between 1 and 1024: 0"),
            Arguments.of("simulate", new String[] {"--burn-in", "-1"}, "--burn-in must be at least 0: -1"),
            Arguments.of("simulate", new String[] {"--burn-in", "10"},
                "burn-in must be shorter than the game (10 rounds): 10"),
            Arguments.of("simulate", new String[] {"--snapshots", "0"}, "snapshot rounds must be at least 1: 0"),
            Arguments.of("calibrate", new String[] {"--replicates", "0"},
                "--replicates must be at least 2 (the z tests estimate a standard error): 0"),
            Arguments.of("calibrate", new String[] {"--threads", "0"}, "--threads must be between 1 and 1024: 0"),
            Arguments.of("calibrate", new String[] {"--burn-in", "-1"}, "--burn-in must be at least 0: -1"),
            Arguments.of("calibrate", new String[] {"--burn-in", "10"},
                "--burn-in must be shorter than the predicted game (10 rounds): 10"),
            Arguments.of("calibrate", new String[] {"--snapshots", "11"},
                "snapshot round is beyond the game's 10 rounds: 11"),
            Arguments.of("plan", new String[] {"--burn-in", "-1"}, "--burn-in must be at least 0: -1"));
    }

    @ParameterizedTest
    @MethodSource("badInput")
    void badValueIsOneLineNamingTheValue(String name, String[] extra, String message) {
        Run r = run(command(name, extra));
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals("", r.out());
        assertEquals("reprise " + name + ": " + message, r.err().strip());
    }

    @Test
    void simulateNeedsAHorizon() {
        Run r = run("simulate", "--x", "tft", "--y", "alld");
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals("reprise simulate: simulate needs --rounds N or --continuation DELTA", r.err().strip());
    }

    @Test
    void eachCommandWordsTheSharedOptionsItsOwnWay() {
        String simulate = help("simulate");
        String calibrate = help("calibrate");
        assertTrue(simulate.contains("Number of independent games. Default: 1000."), simulate);
        assertTrue(simulate.contains("Worker threads. Default: all cores."), simulate);
        assertTrue(simulate.contains("Count the state at these rounds across games."), simulate);
        assertTrue(calibrate.contains("Independent games per repetition (at least 2). Default: 1000."), calibrate);
        assertTrue(calibrate.contains("Repetitions run at once. Default: all cores."), calibrate);
        assertTrue(calibrate.contains("Also test the state at these rounds across games."), calibrate);
        assertTrue(calibrate.contains("Master seed; repetition k uses the seed SplitMix64"), calibrate);
        assertFalse(calibrate.contains("Worker threads"), calibrate);
        for (String help : new String[] {simulate, calibrate, help("plan")}) {
            assertTrue(help.contains("Rounds at the start of each game left out of the tallies. Default: 0."), help);
        }
    }

    /** The command's help with line breaks and indentation folded to single spaces. */
    private static String help(String name) {
        return run(name, "--help").out().replaceAll("\\s+", " ");
    }

    @Test
    void optionsReachTheSimulation() throws Exception {
        Run r = run(command("simulate", "--replicates", "20", "--seed", "9", "--threads", "2", "--burn-in", "3", "--snapshots", "4,6",
            "--json"));
        assertEquals(Main.OK, r.code(), r.err());
        assertEquals("", r.err(), "--quiet leaves stderr empty");
        JsonNode j = Json.MAPPER.readTree(r.out());
        assertEquals(20, j.get("replicates").asLong());
        assertEquals(9, j.get("seed").asLong());
        assertEquals(2, j.get("threads").asInt());
        assertEquals(20 * (10 - 3), j.get("rounds_total").asLong(), "20 games of 10 rounds, 3 burnt in");
        assertEquals(4, j.get("snapshots").get(0).get("round").asLong());
        assertEquals(6, j.get("snapshots").get(1).get("round").asLong());
    }
}
