package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reprise.experiment.BaseQuantity;
import reprise.experiment.ComparisonKind;
import reprise.experiment.ResultRow;
import reprise.experiment.Subject;
import reprise.experiment.Verdict;
import reprise.output.ResultsCsv;

/**
 * End-to-end runs of {@code check} and {@code plot} on a small experiment: files written, their contents,
 * claims, exit codes, reproducibility.
 *
 * <p>Claimed values: generous tit-for-tat's generosity 1/3 for 3,0,5,1 and the long-run payoff 9/4 of two
 * noisy tit-for-tat players (REFERENCES items 2 and 3: Nowak &amp; Sigmund 1992; Molander 1985, from memory).
 *
 * <p>Exit codes: the experiment runs at alpha = 1e-4, so that its verdict does not hinge on the seed. Three
 * runs of it assert exit 0 under the true model (two in the first test, one in the warnings test); with
 * Holm's correction each falsely disagrees with probability at most 1e-4 (if the tests hold their level),
 * 3e-4 for the file by the union bound. The wrong claim (2.6 against 9/4) is rejected at any such level.
 */
class CheckEndToEndTest {

    @TempDir
    Path dir;

    static final String EXPERIMENT = String.join("\n",
        "experiment: small",
        "game: 3,0,5,1",
        "pairs:",
        "  - {name: tit-for-tats, x: tft, y: tft}",
        "  - {name: wsls-pair, x: wsls, y: wsls}",
        "grid:",
        "  noise: [0.05, 0.1]",
        "  rounds: [20, 400]",
        "replicates: 400",
        "seed: 5",
        "snapshots: [1, 3]",
        "alpha: 0.0001",
        "");

    private Result run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Result(code, out.toString(), err.toString());
    }

    private record Result(int code, String out, String err) {
    }

    private Path write(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text);
        return p;
    }

    @Test
    void checkWritesEveryOutputAndPlotRedrawsTheFigures() throws IOException {
        Path file = write("small.yaml", EXPERIMENT);
        Path out = dir.resolve("out");
        Result r = run("check", file.toString(), "--out", out.toString(), "--quiet", "--threads", "2");
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("small: 8 cases"), r.out());
        for (String f : List.of("results.csv", "cases.csv", "curves.csv", "report.md", "run.json")) {
            assertTrue(Files.size(out.resolve(f)) > 0, f);
        }
        List<ResultRow> rows = ResultsCsv.read(out.resolve("results.csv"));
        assertTrue(rows.stream().anyMatch(x -> x.subject() == Subject.Joint.STATES
            && x.comparisonKind() == ComparisonKind.EXACT));
        assertTrue(rows.stream().anyMatch(x -> x.subject() == Subject.Joint.TRANSITIONS));
        assertTrue(rows.stream().anyMatch(x -> x.subject().equals(new Subject.Snapshot(3))));
        assertTrue(rows.stream().noneMatch(x -> x.verdict() == Verdict.DISAGREES
            && x.comparisonKind() != ComparisonKind.STATIONARY));
        // TFT vs TFT with execution error: stationary payoff 9/4 (REFERENCES item 3).
        ResultRow stationary = rows.stream().filter(x -> x.caseId().equals("tit-for-tats/noise=0.05/rounds=400")
            && x.subject() == BaseQuantity.PAYOFF_X && x.comparisonKind() == ComparisonKind.STATIONARY).findFirst().orElseThrow();
        assertEquals(2.25, stationary.predicted(), 1e-12);

        JsonNode run = new ObjectMapper().readTree(out.resolve("run.json").toFile());
        assertEquals(5, run.get("seed").asLong());
        assertEquals("XO_RO_SHI_RO_128_PP", run.get("generator").asText());
        assertEquals(64, run.get("experiment_sha256").asText().length());
        String report = Files.readString(out.resolve("report.md"));
        assertTrue(report.contains("## What the verdicts assume"));
        assertTrue(report.contains("![") && report.contains("figures/"));

        List<Path> figures;
        try (Stream<Path> s = Files.list(out.resolve("figures"))) {
            figures = s.sorted().toList();
        }
        assertTrue(figures.stream().anyMatch(p -> p.toString().endsWith(".png")));
        assertTrue(figures.stream().anyMatch(p -> p.toString().endsWith(".svg")));
        for (Path p : figures) {
            assertTrue(Files.size(p) > 1000, p.toString());
        }
        byte[] svg = Files.readAllBytes(figures.stream().filter(p -> p.toString().endsWith(".svg")).findFirst()
            .orElseThrow());
        for (Path p : figures) {
            Files.delete(p);
        }
        Result plot = run("plot", out.toString());
        assertEquals(0, plot.code(), plot.err());
        try (Stream<Path> s = Files.list(out.resolve("figures"))) {
            assertEquals(figures, s.sorted().toList());
        }
        assertArrayEquals(svg, Files.readAllBytes(figures.stream().filter(p -> p.toString().endsWith(".svg"))
            .findFirst().orElseThrow()), "plot redraws the same SVG from curves.csv");

        Result again = run("check", file.toString(), "--out", out.toString(), "--quiet");
        assertEquals(2, again.code());
        assertTrue(again.err().contains("holds a finished run"), again.err());
        Path out2 = dir.resolve("out2");
        assertEquals(0, run("check", file.toString(), "--out", out2.toString(), "--quiet", "--threads", "1").code());
        assertArrayEquals(Files.readAllBytes(out.resolve("results.csv")), Files.readAllBytes(out2.resolve("results.csv")),
            "same file and seed, same numbers, whatever the thread count");
    }

    @Test
    void aWrongClaimMakesCheckExitOneAndNameTheCase() throws IOException {
        write("claims.csv", String.join("\n",
            "pair,noise,rounds,payoff_x,payoff_y",
            "# 9/4 is right for long games (REFERENCES item 3); 2.6 is deliberately wrong",
            "tit-for-tats,0.05,400,2.25,",
            "tit-for-tats,0.1,400,,2.6",
            ""));
        Path file = write("claimed.yaml", EXPERIMENT + "claims: claims.csv\ntolerance: 0.05\n");
        Path out = dir.resolve("claimed");
        Result r = run("check", file.toString(), "--out", out.toString(), "--quiet");
        assertEquals(1, r.code(), r.out() + r.err());
        assertTrue(r.out().contains("disagrees: tit-for-tats/noise=0.1/rounds=400 payoff_y"), r.out());
        List<ResultRow> rows = ResultsCsv.read(out.resolve("results.csv"));
        ResultRow good = rows.stream().filter(x -> x.caseId().equals("tit-for-tats/noise=0.05/rounds=400")
            && x.comparisonKind() == ComparisonKind.CLAIM_VS_EXACT).findFirst().orElseThrow();
        assertEquals(Verdict.AGREES, good.verdict());
        ResultRow bad = rows.stream().filter(x -> x.caseId().equals("tit-for-tats/noise=0.1/rounds=400")
            && x.comparisonKind() == ComparisonKind.CLAIM_VS_SIMULATION).findFirst().orElseThrow();
        assertEquals(Verdict.DISAGREES, bad.verdict());
        assertTrue(Files.readString(out.resolve("report.md")).contains("comparisons disagree"));
    }

    @Test
    void warningsAreCountedOnStderrUnlessQuiet() throws IOException {
        Path file = write("warn.yaml", EXPERIMENT);
        Result r = run("check", file.toString(), "--out", dir.resolve("warn").toString());
        assertEquals(0, r.code(), r.err());
        // noisy tit-for-tat pairs mix in several rounds, long against 20-round games: a guard-rail warning
        assertTrue(r.err().contains("cases have warnings (listed in report.md)"), r.err());
        assertTrue(Files.readString(dir.resolve("warn/report.md")).contains("mixing time"));
    }

    @Test
    void badInputExitsTwoAndWritesNothing() throws IOException {
        Path file = write("bad.yaml", EXPERIMENT.replace("noise: [0.05, 0.1]", "noise: [0.05, 1.1]"));
        Path out = dir.resolve("never");
        Result r = run("check", file.toString(), "--out", out.toString());
        assertEquals(2, r.code());
        assertTrue(r.err().contains("bad.yaml:7: grid.noise: must be a probability in [0, 1]: 1.1"), r.err());
        assertEquals("", r.out());
        assertTrue(Files.notExists(out));
    }
}
