package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;

/**
 * {@code simulate} prints standard errors, and its JSON carries the per-game sums of squares from which the
 * same standard error can be computed outside reprise.
 */
class SimulateStandardErrorTest {

    private static String run(String... args) {
        StringWriter out = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(new StringWriter()));
        assertEquals(Main.OK, code);
        return out.toString();
    }

    /**
     * ALLC against ALLD with execution error e = 0.1 and n = 50 rounds: rounds are independent, so X's per-game
     * mean payoff has variance Var(u)/n and the mean of G games the standard error sqrt(Var(u)/(n G)) (variance
     * of a mean of independent draws; common practice, no source). The estimated standard error has relative
     * error about 1/sqrt(2(G - 1)) = 3.5% at G = 400 (per-game means are close to normal), so the 15% margin is
     * over 4 of its standard errors: a false failure has probability below 1e-4 (normal tail), seed fixed at 3.
     * The same standard error recomputed from the JSON's per-game sums, by the ratio-estimator formula
     * se^2 = sum_g (w . N_g - r L_g)^2 / (G (G - 1) Lbar^2) (Cochran 1977, Sampling Techniques, 3rd ed., ch. 6),
     * must agree to rounding.
     */
    @Test
    void standardErrorsArePrintedAndCanBeRebuiltFromTheSums() throws Exception {
        String[] args = {"simulate", "--x", "allc", "--y", "alld", "--noise", "0.1", "--rounds", "50", "--replicates",
            "400", "--seed", "3", "--quiet", "--threads", "1"};
        String text = run(args);
        assertTrue(text.contains("standard error"), text);
        String[] json = java.util.Arrays.copyOf(args, args.length + 1);
        json[args.length] = "--json";
        JsonNode o = new ObjectMapper().readTree(run(json));
        double[] w = {3, 0, 5, 1};
        double g = o.get("replicates").asDouble();
        double sumL = o.get("game_lengths").get("sum").asDouble();
        double r = o.get("payoff_totals").get("x").asDouble() / sumL;
        JsonNode sums = o.get("per_game_sums");
        double wPw = 0;
        double wLN = 0;
        for (int a = 0; a < 4; a++) {
            wLN += w[a] * sums.get("length_times_state_counts").get(a).asDouble();
            for (int b = 0; b < 4; b++) {
                wPw += w[a] * w[b] * sums.get("state_count_products").get(a).get(b).asDouble();
            }
        }
        double squares = wPw - 2 * r * wLN + r * r * sums.get("length_squares").asDouble();
        double lbar = sumL / g;
        double rebuilt = Math.sqrt(squares / (g * (g - 1) * lbar * lbar));
        double printed = o.get("standard_errors").get("payoff_x").asDouble();
        assertEquals(rebuilt, printed, 1e-9 * printed);
        double e = 0.1;
        double[] p = {(1 - e) * e, (1 - e) * (1 - e), e * e, e * (1 - e)};
        double mean = 0;
        double square = 0;
        for (int s = 0; s < 4; s++) {
            mean += p[s] * w[s];
            square += p[s] * w[s] * w[s];
        }
        double exact = Math.sqrt((square - mean * mean) / (50 * 400.0));
        assertEquals(exact, printed, 0.15 * exact);
        assertTrue(text.contains(String.format(java.util.Locale.ROOT, "%.6f", printed)), text);
    }
}
