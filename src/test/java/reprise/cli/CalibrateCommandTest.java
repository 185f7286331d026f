package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** The calibrate command: exit codes, JSON fields, the CSV, and one-line errors with nothing on stdout. */
class CalibrateCommandTest {

    record Run(int code, String out, String err) {
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Run(code, out.toString(), err.toString());
    }

    private static final String[] SMALL = {"calibrate", "--x", "tft", "--y", "wsls", "--noise", "0.05", "--rounds",
        "20", "--replicates", "200", "--repetitions", "20", "--quiet"};

    /** SMALL with more options; an option given in {@code more} replaces SMALL's value. */
    private static String[] with(String... more) {
        List<String> given = List.of(more);
        List<String> base = new java.util.ArrayList<>();
        for (int i = 0; i < SMALL.length; i++) {
            if (SMALL[i].startsWith("--") && given.contains(SMALL[i]) && i + 1 < SMALL.length
                && !SMALL[i + 1].startsWith("--")) {
                i++;
                continue;
            }
            base.add(SMALL[i]);
        }
        return Stream.concat(base.stream(), given.stream()).toArray(String[]::new);
    }

    /**
     * A true-model run at alpha = 1e-4, for the tests below that assert its exit code. It exits 1 only if a
     * valid test's rejection count over the 20 repetitions is inconsistent with alpha at
     * {@code CalibrateCommand.CHECK_LEVEL} = 0.001: one rejection has binomial tail
     * 1 - (1 - 1e-4)^20 = 2.0e-3 (consistent), two have C(20, 2) 1e-8 = 1.9e-6 (inconsistent). With at most
     * 12 valid tests a run falsely exits 1 with probability about 2.3e-5, three runs 7e-5 (union bound),
     * if the tests hold their level; so the exit code does not hinge on the seed.
     */
    private static String[] trueModelAtTinyAlpha(String... more) {
        return with(Stream.concat(Stream.of("--alpha", "0.0001"), Stream.of(more)).toArray(String[]::new));
    }

    @Test
    void jsonHasTheDocumentedFields() throws Exception {
        Run r = run(trueModelAtTinyAlpha("--json", "--snapshots", "1,5"));
        assertEquals(Main.OK, r.code(), r.err());
        JsonNode j = Json.MAPPER.readTree(r.out());
        assertEquals(20, j.get("repetitions").asInt());
        assertEquals(1e-4, j.get("alpha").asDouble());
        assertTrue(j.get("true_model").asBoolean());
        List<String> names = new java.util.ArrayList<>();
        for (JsonNode t : j.get("tests")) {
            names.add(t.get("name").asText());
            for (String f : List.of("rejections", "rejection_rate", "rejection_rate_interval", "uniformity_p",
                "binomial_p", "runs", "illustration", "note")) {
                assertTrue(t.has(f), f + " missing in " + t);
            }
            assertEquals(t.get("runs").asInt(), t.get("p_values").size());
            assertEquals(t.get("illustration").asBoolean(), t.get("name").asText().contains("ILLUSTRATION"));
        }
        assertTrue(names.containsAll(List.of("frequencies (Wald)", "transitions (Pearson)", "transitions (LR)",
            "snapshot t=1", "snapshot t=5", "z CC", "z CD", "z DC", "z DD", "z payoff_x", "z payoff_y",
            "pooled rounds chi-square (ILLUSTRATION, invalid)")), names.toString());
    }

    @Test
    void tableLabelsThePooledIllustration() {
        Run r = run(trueModelAtTinyAlpha());
        assertEquals(Main.OK, r.code(), r.err());
        assertTrue(r.out().contains("ILLUSTRATION"), r.out());
        assertTrue(r.out().contains("false-alarm rates"), r.out());
        assertEquals("", r.err());
    }

    /** A wrong noise level is a power run: exit 0, and the transition tests reject in most repetitions. */
    @Test
    void predictionOverridesMeasurePower() throws Exception {
        Run r = run(with("--json", "--predict-noise", "0.02", "--replicates", "500"));
        assertEquals(Main.OK, r.code(), r.err());
        JsonNode j = Json.MAPPER.readTree(r.out());
        assertFalse(j.get("true_model").asBoolean());
        for (JsonNode t : j.get("tests")) {
            if (t.get("name").asText().equals("transitions (Pearson)")) {
                assertTrue(t.get("rejection_rate").asDouble() >= 0.9, t.toString());
            }
        }
    }

    @Test
    void sameSeedSameResultForAnyThreadCount() {
        Run one = run(with("--json", "--threads", "1"));
        Run two = run(with("--json", "--threads", "2"));
        assertEquals(one.out(), two.out());
    }

    @Test
    void writesTidyCsv(@TempDir Path dir) throws Exception {
        Run r = run(trueModelAtTinyAlpha("--out", dir.toString()));
        assertEquals(Main.OK, r.code(), r.err());
        List<String> lines = Files.readAllLines(dir.resolve("calibration.csv"));
        assertEquals("test,repetition,p_value", lines.get(0));
        assertTrue(lines.get(1).startsWith("frequencies (Wald),0,"), lines.get(1));
        assertEquals(1 + 10 * 20, lines.size(), "10 tests x 20 repetitions plus the header");
    }

    static Stream<Arguments> badInput() {
        return Stream.of(
            Arguments.of(new String[] {"--repetitions", "0"}, "--repetitions must be between 1 and 100000 (each repetition's test results are kept in memory): 0"),
            Arguments.of(new String[] {"--alpha", "1"}, "--alpha must be in (0, 1): 1.0"),
            Arguments.of(new String[] {"--alpha", "NaN"}, "--alpha must be in (0, 1): NaN"),
            Arguments.of(new String[] {"--predict-noise", "1.5"}, "--predict-noise must be a probability in [0, 1]"),
            Arguments.of(new String[] {"--predict-misperception", "x"}, "--predict-misperception is not a number"),
            Arguments.of(new String[] {"--predict-rounds", "0"}, "--predict-rounds must be at least 1: 0"),
            Arguments.of(new String[] {"--predict-continuation", "1"}, "--predict-continuation must be a probability"),
            Arguments.of(new String[] {"--replicates", "1"}, "--replicates must be at least 2"),
            Arguments.of(new String[] {"--burn-in", "5", "--predict-rounds", "5"},
                "--burn-in must be shorter than the predicted game (5 rounds): 5"));
    }

    @ParameterizedTest
    @MethodSource("badInput")
    void badInputIsOneLineOnStderrAndNothingOnStdout(String[] extra, String message) {
        Run r = run(with(extra));
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals("", r.out());
        assertTrue(r.err().startsWith("reprise calibrate: "), r.err());
        assertTrue(r.err().contains(message), r.err());
        assertEquals(1, r.err().strip().lines().count(), r.err());
    }

    @Test
    void userWrittenAgentHasNothingToCalibrateAgainst(@TempDir Path dir) {
        Run r = run("calibrate", "--x", "agent:runcap", "--y", "tft", "--rounds", "10", "--out", dir.toString());
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals("", r.out());
        assertTrue(r.err().contains("nothing to calibrate against"), r.err());
        assertFalse(Files.exists(dir.resolve("calibration.csv")));
    }

    @Test
    void horizonIsRequired() {
        Run r = run("calibrate", "--x", "tft", "--y", "tft");
        assertEquals(Main.BAD_INPUT, r.code());
        assertEquals("", r.out());
        assertTrue(r.err().contains("calibrate needs --rounds N or --continuation DELTA"), r.err());
    }

    /**
     * Issue 12: calibrate sees the tails. tft vs gtft at 0.3% error, 20 rounds, 100 games (DD expected
     * 0.34 times per repetition): at alpha 0.05 the Wald test looks calibrated, but its p-values fall below
     * 0.001 in about 2% of repetitions (measured 20 of 1000, seed 11). With 500 repetitions the warning
     * needs at least 4 such p-values (one-sided binomial tail below 0.01 / 3 at rate 0.001); at the measured
     * rate 0.02, P(Binomial(500, 0.02) &lt; 4) = 4e-4, the false-failure budget. The JSON carries the rates
     * at 0.05, 0.01 and 0.001 with their intervals, and the table their columns.
     */
    @Test
    void reportsTheTailsAndWarnsWhenTheLowerTailDeparts() throws Exception {
        String[] args = {"calibrate", "--x", "tft", "--y", "gtft", "--noise", "0.003", "--rounds", "20",
            "--replicates", "100", "--repetitions", "500", "--seed", "11", "--quiet"};
        Run table = run(args);
        assertTrue(table.out().contains("p < 0.001: rate [95%]"), table.out());
        assertTrue(table.out().contains("warning: frequencies (Wald): p < 0.001 in "), table.out());
        assertTrue(table.out().contains("warning: state DD: expected 0.344 tallied rounds"), table.out());
        Run json = run(Stream.concat(Stream.of(args), Stream.of("--json")).toArray(String[]::new));
        JsonNode j = Json.MAPPER.readTree(json.out());
        JsonNode wald = j.get("tests").get(0);
        assertEquals("frequencies (Wald)", wald.get("name").asText());
        assertEquals(3, wald.get("tails").size());
        assertEquals(0.001, wald.get("tails").get(2).get("level").asDouble());
        assertTrue(wald.get("tails").get(2).get("lower").asDouble() > 0.001, wald.toString());
        assertTrue(wald.get("lower_tail_departs").asBoolean(), wald.toString());
    }
}
