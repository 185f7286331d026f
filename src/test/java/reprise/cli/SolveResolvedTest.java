package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class SolveResolvedTest {

    private static JsonNode solveJson(String... args) throws Exception {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        String[] all = new String[args.length + 2];
        all[0] = "solve";
        all[1] = "--json";
        System.arraycopy(args, 0, all, 2, args.length);
        assertEquals(0, Main.run(all, new PrintWriter(out), new PrintWriter(err)), err.toString());
        return new ObjectMapper().readTree(out.toString());
    }

    /**
     * The determinant formula of Press &amp; Dyson (2012), PNAS 109(26), 10409-10413, printed beside the chain's
     * stationary payoffs, agrees with them to 1e-12 (noise enters through effective vectors, as in ClosedForms).
     */
    @ParameterizedTest
    @CsvSource({"extort:chi=3,allc,0,0", "extort:chi=3,'memory1:0.9,0.5,0.2,0.1',0.01,0.02", "wsls,gtft,0.05,0",
        "'reactive:0.9,0.2','reactive:0.7,0.4',0,0.01", "equalizer:score=2,wsls,0,0"})
    void closedFormAgreesWithTheChain(String x, String y, String e, String h) throws Exception {
        JsonNode j = solveJson("--x", x, "--y", y, "--noise", e, "--misperception", h);
        assertEquals(j.get("stationary_payoffs").get("x").asDouble(), j.get("closed_form_payoffs").get("x").asDouble(),
            1e-12);
        assertEquals(j.get("stationary_payoffs").get("y").asDouble(), j.get("closed_form_payoffs").get("y").asDouble(),
            1e-12);
    }

    @Test
    void noClosedFormWithoutAUniqueStationaryDistributionOrForMemoryTwo() throws Exception {
        assertTrue(solveJson("--x", "tft", "--y", "tft").get("closed_form_payoffs").isNull());
        assertTrue(solveJson("--x", "tf2t", "--y", "tft", "--noise", "0.01").get("closed_form_payoffs").isNull());
    }

    /** The resolved extortioner: table (11/13, 1/2, 7/26, 0), first move D, phi 1/26 of (0, 1/13] (Press & Dyson 2012). */
    @Test
    void resolvedStrategyInJson() throws Exception {
        JsonNode x = solveJson("--x", "extort:chi=3", "--y", "allc").get("x_strategy");
        assertEquals("zero-determinant", x.get("kind").asText());
        assertEquals(0.0, x.get("first_move").asDouble());
        assertEquals(11 / 13.0, x.get("table").get(0).asDouble(), 1e-15);
        assertEquals(1 / 26.0, x.get("zero_determinant").get("phi").asDouble(), 1e-15);
        assertEquals(1 / 13.0, x.get("zero_determinant").get("phi_high").asDouble(), 1e-15);
        assertTrue(x.get("zero_determinant").get("score").isNull());
    }
}
