package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reprise.experiment.Curves;
import reprise.experiment.FigureKind;
import reprise.output.CurvesCsv;

/**
 * What {@code check} writes to curves.csv for the figures: the exact standard error and error bars of the
 * error figure, the horizon of every point, the dense exact payoff curve with its stationary reference and
 * the strategies' names, and the exact bias in the deviation heatmap.
 */
class FigureDataTest {

    @TempDir
    Path dir;

    private int run(String... args) {
        return Main.run(args, new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter()));
    }

    private List<Curves.Point> check(String name, String yaml, String... options) throws IOException {
        Path file = dir.resolve(name + ".yaml");
        Files.writeString(file, yaml);
        List<String> args = new java.util.ArrayList<>(List.of("check", file.toString(), "--out",
            dir.resolve(name).toString(), "--quiet", "--threads", "1"));
        args.addAll(List.of(options));
        int code = run(args.toArray(String[]::new));
        assertTrue(code == 0 || code == 1, "check ran: exit " + code);
        return CurvesCsv.read(dir.resolve(name).resolve("curves.csv"));
    }

    /**
     * ALLC against ALLD with execution error e: both ignore the past, so rounds are independent and each
     * round's state has probabilities P(CC) = (1-e)e, P(CD) = (1-e)^2, P(DC) = e^2, P(DD) = e(1-e). The
     * per-game mean payoff over n rounds then has variance Var(u)/n and the mean of G games standard error
     * sqrt(Var(u)/(n G)) (variance of a mean of independent draws; common practice, no source).
     */
    @Test
    void errorFigureHasTheExactStandardErrorAndErrorBars() throws IOException {
        List<Curves.Point> pts = check("iid", String.join("\n",
            "experiment: iid", "game: 3,0,5,1", "pairs:", "  - {name: givers, x: allc, y: alld}",
            "grid:", "  noise: [0.1, 0.2]", "  rounds: [10, 100]", "replicates: 300", "seed: 11", ""));
        double[] u = {3, 0, 5, 1};
        for (double e : new double[] {0.1, 0.2}) {
            double[] p = {(1 - e) * e, (1 - e) * (1 - e), e * e, e * (1 - e)};
            double mean = 0;
            double square = 0;
            for (int s = 0; s < 4; s++) {
                mean += p[s] * u[s];
                square += p[s] * u[s] * u[s];
            }
            double variance = square - mean * mean;
            String group = "givers, noise=" + e;
            for (long n : new long[] {10, 100}) {
                List<Curves.Point> se = pts.stream().filter(q -> q.figure() == FigureKind.ERROR && q.group().equals(group)
                    && q.series().equals("exact standard error") && q.x() == n).toList();
                assertEquals(1, se.size(), group + ", n = " + n);
                // relative 1e-9: the exact covariance is accurate to about 1e-12 at these lengths
                assertEquals(Math.sqrt(variance / (n * 300.0)), se.get(0).y(), 1e-9 * se.get(0).y(), group + ", n = " + n);
            }
            long dense = pts.stream().filter(q -> q.group().equals(group) && q.series().equals("exact standard error"))
                .count();
            assertTrue(dense > 20, "the standard error is drawn densely between the lengths: " + dense);
        }
        List<Curves.Point> simulated = pts.stream().filter(q -> q.figure() == FigureKind.ERROR
            && q.series().equals("simulated")).toList();
        assertEquals(4, simulated.size());
        for (Curves.Point q : simulated) {
            assertTrue(q.lower() >= 0 && q.lower() <= q.y() && q.y() <= q.upper(), "error bar around " + q);
        }
        assertTrue(pts.stream().allMatch(q -> q.horizon().equals(Curves.ROUNDS)), "every point says rounds");
        assertTrue(Files.readString(dir.resolve("iid").resolve("run.json")).contains("figures/manifest.csv"),
            "run.json lists the manifest");
    }

    @Test
    void payoffFigureIsDenseNamedWithStationaryReferenceAndHeatmapShowsTheExactBias() throws IOException {
        List<Curves.Point> pts = check("geo", String.join("\n",
            "experiment: geo", "game: 3,0,5,1", "pairs:", "  - {name: mixed, x: tft, y: wsls}",
            "grid:", "  noise: [0.05, 0.1]", "  continuation: [0.5, 0.9]", "replicates: 200", "seed: 12", ""),
            "--figure-size", "double", "--figure-format", "svg");
        String group = "mixed, noise=0.05";
        List<Curves.Point> exact = pts.stream().filter(q -> q.figure() == FigureKind.PAYOFF && q.group().equals(group)
            && q.series().equals("X (tft) exact")).toList();
        assertTrue(exact.size() >= 30, "dense in delta: " + exact.size());
        assertTrue(exact.stream().allMatch(q -> q.x() >= 0.5 && q.x() <= 0.9), "between the grid's values");
        assertEquals(1, pts.stream().filter(q -> q.group().equals(group) && q.series().equals("Y (wsls) stationary"))
            .count());
        assertTrue(pts.stream().allMatch(q -> q.horizon().equals(Curves.CONTINUATION)), "every point says continuation");
        // the heatmap cell is the exact bias: |exact - stationary| of X's payoff, both in results.csv
        List<String> rows = Files.readAllLines(dir.resolve("geo").resolve("results.csv"));
        for (double delta : new double[] {0.5, 0.9}) {
            String id = "mixed/noise=0.05/continuation=" + delta + ",";
            double exactValue = Double.NaN;
            double stationary = Double.NaN;
            for (String r : rows) {
                String[] f = r.split(",");
                if (r.startsWith(id) && f[8].equals("payoff_x")) {
                    if (f[9].equals("exact")) {
                        exactValue = Double.parseDouble(f[10]);
                    } else if (f[9].equals("stationary")) {
                        stationary = Double.parseDouble(f[10]);
                    }
                }
            }
            double want = Math.abs(exactValue - stationary);
            List<Curves.Point> cell = pts.stream().filter(q -> q.figure() == FigureKind.DEVIATION && q.x() == 0.05
                && q.y() == delta).toList();
            assertEquals(1, cell.size(), "delta " + delta);
            assertEquals(want, cell.get(0).value(), 1e-12, "delta " + delta);
        }
        Path figures = dir.resolve("geo").resolve("figures");
        String payoffSvg = Files.readString(figures.resolve("payoff-mixed-noise-0.05.svg"));
        assertTrue(payoffSvg.contains("X = tft") && payoffSvg.contains("Y = wsls"), "legend names the strategies");
        String verdictSvg = Files.readString(figures.resolve("verdicts-mixed.svg"));
        assertTrue(verdictSvg.contains("continuation probability"), "continuation grid labelled as such");
        assertFalse(verdictSvg.contains("game length"), "no game-length axis for a continuation grid");
        // check's figure options: SVG only, at double-column size, as the manifest says
        try (java.util.stream.Stream<Path> files = Files.list(figures)) {
            assertTrue(files.map(p -> p.getFileName().toString()).allMatch(n -> n.endsWith(".svg")
                || n.equals("manifest.csv")), "only SVG files");
        }
        assertTrue(payoffSvg.contains("width=\"17.5cm\""), "double-column width");
        List<String> manifest = Files.readAllLines(figures.resolve("manifest.csv"));
        assertTrue(manifest.size() > 1 && manifest.stream().skip(1).allMatch(l -> l.contains(",svg,double,17.5,")),
            String.join("\n", manifest));
    }

    /** plot --panels combines the pairs of each figure kind into one lettered file and lists it in the manifest. */
    @Test
    void plotCombinesPairsIntoPanels() throws IOException {
        check("two", String.join("\n",
            "experiment: two", "game: 3,0,5,1", "pairs:", "  - {name: first, x: tft, y: wsls}",
            "  - {name: second, x: wsls, y: wsls}", "grid:", "  noise: [0.05]", "  rounds: [10, 100]",
            "replicates: 200", "seed: 13", ""));
        Path folder = dir.resolve("two");
        assertEquals(0, run("plot", folder.toString(), "--panels", "--figure-format", "svg"));
        Path figures = folder.resolve("figures");
        String svg = Files.readString(figures.resolve("convergence-panels.svg"));
        assertTrue(svg.contains(">(a)<") && svg.contains(">(b)<"), "panel letters");
        assertTrue(svg.contains("first, noise=0.05") && svg.contains("second, noise=0.05"), "both pairs");
        assertTrue(Files.readString(figures.resolve("manifest.csv")).contains("convergence-panels.svg,convergence,"),
            "in the manifest");
    }
}
