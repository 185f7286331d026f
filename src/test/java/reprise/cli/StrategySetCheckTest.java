package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reprise.run.Checkpoint;

/**
 * Strategy sets through {@code check}: the bundled example (6 strategies x 3 lengths x 2 noise levels,
 * with derived quantities and long-run claims) writes matrix.csv, matrix-exact.csv and the matrix figures,
 * and a set's outputs are bit-identical whether the run is whole, sharded and merged, or interrupted and
 * resumed.
 */
class StrategySetCheckTest {

    @TempDir
    Path dir;

    static final String TINY = String.join("\n",
        "experiment: tiny-set",
        "strategy_set:",
        "  strategies: {tft: tft, alld: alld, wsls: wsls}",
        "  exact_continuation: [0.95]",
        "grid:",
        "  noise: [0.05]",
        "  rounds: [30]",
        "derived:",
        "  gap: payoff_x - payoff_y",
        "  mutual: ratio(CC, CC + DD)",
        "replicates: 60",
        "seed: 7",
        "alpha: 0.0001",
        "");

    private record Result(int code, String out, String err) {
    }

    private static Result run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Result(code, out.toString(), err.toString());
    }

    /**
     * The bundled example at 30 games per case (the file's 2000 would take minutes), so its outcome is fixed
     * by the seed; alpha 1e-4 keeps the family-wise chance that a right model fails below 1e-4 (Holm), the
     * false-failure budget of this test.
     */
    @Test
    void theBundledExampleWritesTheMatrixOutputs() throws IOException {
        String text = Files.readString(Path.of("experiments/strategy-matrix.yaml"))
            .replace("replicates: 2000", "replicates: 30").replace("alpha: 0.05", "alpha: 0.0001")
            .replace("claims: strategy-matrix-claims.csv", "claims: "
                + Path.of("experiments/strategy-matrix-claims.csv").toAbsolutePath());
        assertTrue(text.contains("replicates: 30") && text.contains("alpha: 0.0001"));
        Path file = dir.resolve("example.yaml");
        Files.writeString(file, text);
        Path out = dir.resolve("out");
        Result r = run("check", file.toString(), "--out", out.toString(), "--quiet", "--threads", "2");
        assertEquals(0, r.code(), r.out() + r.err());
        assertTrue(r.out().startsWith("strategy-matrix: 216 cases"), r.out());
        List<String> matrix = Files.readAllLines(out.resolve("matrix.csv"));
        // 36 matches x 2 noise levels x 3 lengths x (8 base + 3 derived quantities), and the header
        assertEquals(1 + 36 * 6 * 11, matrix.size());
        assertTrue(matrix.get(0).startsWith("row,column,case,noise,misperception,horizon,horizon_value,quantity,exact,"
            + "long_run,long_run_unique,simulated,ci_lower,ci_upper,verdict"), matrix.get(0));
        assertTrue(matrix.stream().anyMatch(l -> l.startsWith("extort3,allc,") && l.contains(",zd_residual,")));
        assertTrue(matrix.stream().anyMatch(l -> l.startsWith("tft,tft,") && l.contains(",false,")),
            "error-free tit-for-tat has no unique stationary distribution");
        List<String> exact = Files.readAllLines(out.resolve("matrix-exact.csv"));
        // every ordered pair x 2 noise levels x (3 lengths, the long run, 2 continuation probabilities)
        assertEquals(1 + 36 * 2 * 6, exact.size());
        // Press & Dyson (2012): extortioner vs ALLC, error-free long run: 41/11 and 21/11 (reference list sec. 4)
        String pressDyson = exact.stream().filter(l -> l.startsWith("extort3,allc,0,0,long-run,")).findFirst()
            .orElseThrow();
        String[] cells = pressDyson.split(",");
        assertEquals(41 / 11.0, Double.parseDouble(cells[12]), 1e-12);
        assertEquals(21 / 11.0, Double.parseDouble(cells[13]), 1e-12);
        try (Stream<Path> s = Files.list(out.resolve("figures"))) {
            assertEquals(6, s.filter(p -> p.getFileName().toString().startsWith("matrix_")).count());
        }
        assertTrue(Files.size(out.resolve("figures/matrix_noise-0.01_rounds-100.png")) > 5000);
        String results = Files.readString(out.resolve("results.csv"));
        assertTrue(results.contains("extort3-vs-tft/noise=0/rounds=1000,extort3-vs-tft,extort:chi=3,tft,0,0,rounds,"
            + "1000,zd_residual,claim-vs-exact,0.0,0.0,"), "the long-run residual claim is checked exactly");
        assertTrue(results.contains(",zd_residual,long-run-claim-vs-simulation,"));
        String cases = Files.readAllLines(out.resolve("cases.csv")).get(0);
        assertTrue(cases.endsWith(",x_kind,x_first_move,x_table,x_zd_chi,x_zd_score,x_zd_phi,x_zd_phi_low,"
            + "x_zd_phi_high,x_zd_delta,y_kind,y_first_move,y_table,y_zd_chi,y_zd_score,y_zd_phi,y_zd_phi_low,"
            + "y_zd_phi_high,y_zd_delta"), cases);
        assertTrue(Files.readString(out.resolve("cases.csv")).contains(",zero-determinant,0.0,"),
            "the extortioner's first move (D) is shown");
    }

    @Test
    void shardedAndMergedSetEqualsTheWholeRun() throws IOException {
        Path file = dir.resolve("tiny.yaml");
        Files.writeString(file, TINY);
        Path whole = dir.resolve("whole");
        assertEquals(0, run("check", file.toString(), "--out", whole.toString(), "--quiet", "--threads", "2").code());
        Path sharded = dir.resolve("sharded");
        for (int i = 1; i <= 3; i++) {
            Result r = run("check", file.toString(), "--shard", i + "/3", "--out", sharded.toString(), "--quiet",
                "--threads", "1");
            assertEquals(0, r.code(), r.err());
        }
        Result m = run("merge", sharded.toString());
        assertEquals(0, m.code(), m.err());
        for (String f : List.of("matrix.csv", "matrix-exact.csv", "results.csv", "cases.csv")) {
            assertArrayEquals(Files.readAllBytes(whole.resolve(f)), Files.readAllBytes(sharded.resolve(f)), f);
        }
        assertEquals(1 + 9 * (8 + 2), Files.readAllLines(whole.resolve("matrix.csv")).size());
        assertTrue(Files.isRegularFile(whole.resolve("figures/matrix_noise-0.05_rounds-30.png")));
    }

    /** A run held after its first saved unit (the run layer's test hold), killed, then resumed. */
    @Test
    void interruptedSetResumesToTheSameMatrix() throws IOException, InterruptedException {
        Path file = dir.resolve("tiny.yaml");
        Files.writeString(file, TINY);
        Path whole = dir.resolve("whole");
        assertEquals(0, run("check", file.toString(), "--out", whole.toString(), "--quiet", "--threads", "2").code());
        Path out = dir.resolve("resumed");
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        Process p = new ProcessBuilder(java, "-D" + KillAndResumeTest.HOLD + "=1", "-cp",
            System.getProperty("java.class.path"), "reprise.cli.Main", "check", file.toString(), "--out",
            out.toString(), "--threads", "2", "--quiet").redirectOutput(ProcessBuilder.Redirect.DISCARD)
            .redirectError(ProcessBuilder.Redirect.DISCARD).start();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
        while (Checkpoint.of(out).size() == 0 && p.isAlive() && System.nanoTime() < deadline) {
            Thread.sleep(10);
        }
        assertTrue(p.isAlive(), "the run did not wait after its first unit");
        p.destroyForcibly();
        assertTrue(p.waitFor(30, TimeUnit.SECONDS));
        assertTrue(Files.notExists(out.resolve("matrix.csv")));
        Result r = run("check", file.toString(), "--out", out.toString(), "--resume", "--threads", "2", "--quiet");
        assertEquals(0, r.code(), r.err());
        for (String f : List.of("matrix.csv", "matrix-exact.csv", "results.csv")) {
            assertArrayEquals(Files.readAllBytes(whole.resolve(f)), Files.readAllBytes(out.resolve(f)), f);
        }
    }
}
