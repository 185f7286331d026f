package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Claims files of population experiments through {@code check}: a claim of the exact fixation probability is
 * consistent, a claim far off disagrees (exit 1), bad rows are named with file, line and column.
 *
 * <p>The population: ALLC and ALLD without errors under pairwise comparison, N = 7, beta = 0.3, games of 4
 * rounds. Every game is the stage game (R, S, T, P) = (3, 0, 5, 1) every round, so the payoffs are deterministic
 * and the exact fixation probability is the closed form of Traulsen, Nowak &amp; Pacheco (2006), "Stochastic
 * dynamics of invasion and fixation", Phys. Rev. E 74, 011909, Eq. (4), computed here independently of reprise.
 *
 * <p>False-failure budget: alpha = 0.001 and the exact binomial test has size at most alpha, so a right claim
 * (or a right (c) row) is rejected by the fixed-seed invasions with probability at most 0.001 each, at most
 * 0.003 for the three tests of the consistent run (Holm's correction only lowers it).
 */
class PopulationClaimsCheckTest {

    @TempDir
    Path tmp;

    private record Result(int code, String out, String err) {
    }

    private static Result run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Result(code, out.toString(), err.toString());
    }

    /** Traulsen et al. 2006, Eq. (4), for a mutant with payoffs (a, b) against (mutant, resident), resident (c, d). */
    private static double traulsen(double a, double b, double c, double d, int n, double beta) {
        double sum = 0;
        double prod = 1;
        for (int k = 1; k <= n - 1; k++) {
            double piA = ((k - 1) * a + (n - k) * b) / (n - 1);
            double piB = (k * c + (n - k - 1) * d) / (n - 1);
            prod *= Math.exp(-beta * (piA - piB));
            sum += prod;
        }
        return 1 / (1 + sum);
    }

    private Path experiment(String csv) throws Exception {
        Files.writeString(tmp.resolve("claims.csv"), csv);
        Path f = tmp.resolve("p.yaml");
        Files.writeString(f, String.join("\n", "experiment: claimed", "population:", "  strategies: [allc, alld]",
            "  invasions: 300", "  claims: claims.csv", "grid:", "  size: [7]", "  selection: [0.3]", "  rounds: [4]",
            "seed: 11", "alpha: 0.001", "output: " + tmp.resolve("out"), ""));
        return f;
    }

    @Test
    void theExactFixationProbabilityIsConsistent() throws Exception {
        double alldInAllc = traulsen(1, 5, 0, 3, 7, 0.3);
        double allcInAlld = traulsen(3, 0, 5, 1, 7, 0.3);
        Path f = experiment("N,mutant,resident,fixation\n7,alld,allc," + alldInAllc + "\n"
            + ",allc,alld," + allcInAlld + "\n");
        Result r = run("check", f.toString(), "--quiet");
        assertEquals(0, r.code(), r.out() + r.err());
        assertTrue(r.out().contains("claims: 0 of 2 disagree"), r.out());
        List<String> csv = Files.readAllLines(tmp.resolve("out/population.csv"));
        List<String> claims = csv.stream().filter(l -> l.contains(",claim,")).toList();
        assertEquals(2, claims.size(), String.join("\n", csv));
        assertTrue(claims.get(0).contains(",line 2,") && claims.get(0).contains(",consistent,"), claims.get(0));
        String report = Files.readString(tmp.resolve("out/report.md"));
        assertTrue(report.contains("## Claims") && report.contains("2 of 2 claims consistent"), report);
    }

    @Test
    void aClaimFarOffDisagreesAndExitsOne() throws Exception {
        double allcInAlld = traulsen(3, 0, 5, 1, 7, 0.3);
        assertTrue(allcInAlld < 0.05, "the claim below must be far off: " + allcInAlld);
        Path f = experiment("mutant,resident,fixation,tolerance\nallc,alld,0.5,0.01\n");
        Result r = run("check", f.toString(), "--quiet");
        assertEquals(1, r.code(), r.out() + r.err());
        assertTrue(r.out().contains("claims: 1 of 1 disagree"), r.out());
        String row = Files.readAllLines(tmp.resolve("out/population.csv")).stream().filter(l -> l.contains(",claim,"))
            .findFirst().orElseThrow();
        assertTrue(row.contains(",disagrees,") && row.endsWith(",true"), row);
        assertTrue(Files.readString(tmp.resolve("out/report.md")).contains("**1 disagree**"));
    }

    @Test
    void badRowsAreNamedWithLineAndColumnBeforeAnythingRuns() throws Exception {
        Path f = experiment("mutant,resident,fixation,abundance,colour\n");
        Result r = run("check", f.toString());
        assertEquals(2, r.code());
        assertTrue(r.err().contains("claims.csv:1: colour: unknown column"), r.err());
        f = experiment("# a comment\nmutant,resident,strategy,fixation,abundance,tolerance\n"
            + "allc,allc,,0.1,,\n" + "allc,alld,,x,,\n" + ",,allc,,0.5,\n" + "alld,allc,,0.2,,-3\n"
            + "alld,allc,allc,0.2,,\n" + "allc,alld,,0.1,,\n" + "allc,alld,,0.2,,\n");
        r = run("check", f.toString());
        assertEquals(2, r.code());
        String err = r.err();
        assertTrue(err.contains("claims.csv:3: resident: is the mutant"), err);
        assertTrue(err.contains("claims.csv:4: fixation: is a probability"), err);
        assertTrue(err.contains("claims.csv:5: abundance: needs mutation"), err);
        assertTrue(err.contains("claims.csv:6: tolerance:"), err);
        assertTrue(err.contains("claims.csv:7: strategy: keys abundance claims"), err);
        assertTrue(err.contains("claims.csv:9: fixation: N=7/selection=0.3/noise=0/rounds=4 already has a claim "
            + "for the fixation of allc in alld from line 8"), err);
        assertFalse(Files.exists(tmp.resolve("out")));
    }

    @Test
    void aByteOrderMarkIsReadAndBinaryIsRefused() throws Exception {
        double alldInAllc = traulsen(1, 5, 0, 3, 7, 0.3);
        Path f = experiment("\uFEFFmutant,resident,fixation\nalld,allc," + alldInAllc + "\n");
        assertEquals(0, run("check", f.toString(), "--quiet").code());
        Files.write(tmp.resolve("claims.csv"), new byte[] {'a', ',', (byte) 0xC3, 0x28, '\n'});
        Result r = run("check", f.toString(), "--force");
        assertEquals(2, r.code());
        assertTrue(r.err().contains("claims.csv: file:"), r.err());
    }

    /**
     * Rare-mutation abundances of two strategies: the embedded chain of Fudenberg &amp; Imhof (2006), "Imitation
     * processes with small mutations", J. Econ. Theory 131, 251-262, has for two strategies the stationary
     * abundance of ALLD rho(ALLD in ALLC) / (rho(ALLD in ALLC) + rho(ALLC in ALLD)), with rho from Traulsen et
     * al. (2006) as above. Exact side only (no invasions), so nothing random.
     */
    @Test
    void rareMutationAbundanceClaimsAreCheckedAgainstTheExactValue() throws Exception {
        double up = traulsen(1, 5, 0, 3, 7, 0.3);
        double down = traulsen(3, 0, 5, 1, 7, 0.3);
        double alld = up / (up + down);
        Files.writeString(tmp.resolve("claims.csv"), "strategy,abundance,tolerance\nalld," + alld + ",1e-9\n"
            + "allc," + (1 - alld) + ",1e-9\n");
        Path f = tmp.resolve("p.yaml");
        Files.writeString(f, String.join("\n", "experiment: claimed", "population:", "  strategies: [allc, alld]",
            "  mutation: rare", "  invasions: 0", "  claims: claims.csv", "grid:", "  size: [7]", "  selection: [0.3]",
            "  rounds: [4]", "output: " + tmp.resolve("out"), ""));
        Result r = run("check", f.toString(), "--quiet");
        assertEquals(0, r.code(), r.out() + r.err());
        assertTrue(r.out().contains("claims: 0 of 2 disagree"), r.out());
        Files.writeString(tmp.resolve("claims.csv"), "strategy,abundance\nalld,0.5\n");
        r = run("check", f.toString(), "--quiet", "--force");
        assertEquals(1, r.code(), r.out() + r.err());
        String row = Files.readAllLines(tmp.resolve("out/abundance.csv")).stream().filter(l -> l.contains(",claim,"))
            .findFirst().orElseThrow();
        assertTrue(row.contains(",claim,alld,0.5,") && row.contains(",disagrees,"), row);
    }
}
