package reprise.output.figures;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.BiFunction;
import java.util.stream.Stream;
import javax.imageio.ImageIO;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.w3c.dom.Document;

class FiguresTest {
    private static final byte[] PNG_SIGNATURE = {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1a, '\n'};
    private static final Figures FIGURES = Figures.withDefaults().withDpi(72).withFormats(FigureFormat.PNG,
        FigureFormat.SVG);

    @TempDir
    Path dir;

    /** One drawing call per figure kind, with the sample data. */
    static Stream<Arguments> everyFigure() {
        return Stream.of(
            Arguments.of("convergence", (BiFunction<Path, String, FigureResult>) (d, n) ->
                FIGURES.convergence(d, n, SampleData.convergence(1))),
            Arguments.of("error", (BiFunction<Path, String, FigureResult>) (d, n) ->
                FIGURES.errorScaling(d, n, SampleData.errorScaling(2))),
            Arguments.of("payoff", (BiFunction<Path, String, FigureResult>) (d, n) ->
                FIGURES.payoffByContinuation(d, n, SampleData.payoff(3))),
            Arguments.of("states", (BiFunction<Path, String, FigureResult>) (d, n) ->
                FIGURES.stateDistribution(d, n, SampleData.stateDistribution(4))),
            Arguments.of("qq", (BiFunction<Path, String, FigureResult>) (d, n) ->
                FIGURES.pValueCalibration(d, n, SampleData.calibration(5))),
            Arguments.of("values", (BiFunction<Path, String, FigureResult>) (d, n) ->
                FIGURES.valueHeatmap(d, n, SampleData.gridValues())),
            Arguments.of("verdicts", (BiFunction<Path, String, FigureResult>) (d, n) ->
                FIGURES.verdictHeatmap(d, n, SampleData.gridVerdicts())));
    }

    /** Every figure kind reduced to a single data point (one cell for the heatmaps). */
    static Stream<Arguments> everyFigureWithOnePoint() {
        double[] one = {100};
        Estimates e = new Estimates(one, new double[] {0.25}, new double[] {0.2}, new double[] {0.3});
        Curve c = new Curve(one, new double[] {0.25});
        GridAxes axes = new GridAxes("noise", List.of("0.01"), "rounds", List.of("100"));
        return Stream.of(
            Arguments.of("convergence", (BiFunction<Path, String, FigureResult>) (d, n) ->
                FIGURES.convergence(d, n, new ConvergenceData("", List.of(e, e, e, e), List.of(c, c, c, c),
                    new double[] {0.25, 0.25, 0.25, 0.25}))),
            Arguments.of("error", (BiFunction<Path, String, FigureResult>) (d, n) ->
                FIGURES.errorScaling(d, n, new ErrorScalingData("", "CC", one, new double[] {0.01}, null))),
            Arguments.of("payoff", (BiFunction<Path, String, FigureResult>) (d, n) ->
                FIGURES.payoffByContinuation(d, n, new PayoffData("", "payoff", new Curve(new double[] {0.5},
                    new double[] {2}), new Curve(new double[] {0.5}, new double[] {3}), null, null))),
            Arguments.of("states", (BiFunction<Path, String, FigureResult>) (d, n) ->
                FIGURES.stateDistribution(d, n, new StateDistributionData("", List.of(c, c, c, c),
                    List.of(e, e, e, e)))),
            Arguments.of("qq", (BiFunction<Path, String, FigureResult>) (d, n) ->
                FIGURES.pValueCalibration(d, n, new CalibrationData("", List.of(new PValueSample("t",
                    new double[] {0.3}))))),
            Arguments.of("values", (BiFunction<Path, String, FigureResult>) (d, n) ->
                FIGURES.valueHeatmap(d, n, new GridValues("", axes, "z", new double[][] {{1.5}}))),
            Arguments.of("verdicts", (BiFunction<Path, String, FigureResult>) (d, n) ->
                FIGURES.verdictHeatmap(d, n, new GridVerdicts("", axes, List.of("ok"), new int[][] {{0}}))));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("everyFigure")
    void writesPngAndSvg(String name, BiFunction<Path, String, FigureResult> draw) throws Exception {
        FigureResult r = draw.apply(dir, name);
        assertEquals(List.of(dir.resolve(name + ".png"), dir.resolve(name + ".svg")), r.files());
        assertValidPng(r.files().get(0));
        assertValidSvg(r.files().get(1));
        assertEquals(List.of(), r.notes(), "sample data is complete, so nothing should be left out");
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("everyFigureWithOnePoint")
    void drawsASinglePoint(String name, BiFunction<Path, String, FigureResult> draw) throws Exception {
        FigureResult r = draw.apply(dir, name);
        assertValidPng(r.files().get(0));
        assertValidSvg(r.files().get(1));
    }

    @Test
    void pngHasTheNominalSizeTimesTheResolution() throws IOException {
        // 8.5 x 6.4 cm is 241 x 181 points (72 / 2.54 points per cm, rounded); at 300 dpi BitmapEncoder
        // scales by 300 / 72 and truncates: 1004 x 754 pixels
        Path png = Figures.withDefaults().withFormats(FigureFormat.PNG)
            .payoffByContinuation(dir, "size", SampleData.payoff(3)).files().get(0);
        BufferedImage image = ImageIO.read(png.toFile());
        assertEquals(1004, image.getWidth());
        assertEquals(754, image.getHeight());
    }

    @Test
    void writesPdfWhenAsked() throws IOException {
        FigureResult r = FIGURES.withFormats(FigureFormat.PDF).payoffByContinuation(dir, "p", SampleData.payoff(3));
        assertEquals(List.of(dir.resolve("p.pdf")), r.files());
        byte[] head = Arrays.copyOf(Files.readAllBytes(r.files().get(0)), 5);
        assertEquals("%PDF-", new String(head, java.nio.charset.StandardCharsets.US_ASCII));
    }

    @Test
    void skipsNaNPointsAndSaysSo() throws Exception {
        ConvergenceData full = SampleData.convergence(1);
        Estimates cc = full.simulated().get(0);
        double[] est = cc.estimate();
        double[] lo = cc.lower();
        double[] hi = cc.upper();
        est[2] = Double.NaN;
        est[5] = Double.NaN;
        lo[7] = Double.NaN;
        Estimates broken = new Estimates(cc.x(), est, lo, hi);
        ConvergenceData data = new ConvergenceData("", List.of(broken, full.simulated().get(1),
            full.simulated().get(2), full.simulated().get(3)), full.exact(),
            new double[] {Double.NaN, 0.18, 0.15, 0.25});
        FigureResult r = FIGURES.convergence(dir, "nan", data);
        assertValidPng(r.files().get(0));
        assertEquals(List.of(
            "CC stationary value: not drawn (NaN)",
            "CC simulated frequency: 2 of 10 points skipped (NaN or infinite)",
            "CC simulated frequency: 1 of 8 drawn points have no usable interval, so no error bar"), r.notes());
    }

    @Test
    void dropsNonPositiveErrorsFromLogAxesAndSaysSo() throws Exception {
        double[] n = {10, 100, 1000, 10000};
        ErrorScalingData data = new ErrorScalingData("", "CC frequency", n, new double[] {0.1, 0.0, -1e-3, 0.001},
            new Curve(n, new double[] {0.05, 0.005, 0.0, Double.NaN}));
        FigureResult r = FIGURES.errorScaling(dir, "err", data);
        assertValidSvg(r.files().get(1));
        assertEquals(List.of(
            "exact bias: 1 of 4 points skipped (NaN or infinite)",
            "exact bias: 1 of 4 points dropped (zero or negative values cannot be shown on a log axis)",
            "observed error: 2 of 4 points dropped (zero or negative values cannot be shown on a log axis)"), r.notes());
    }

    @Test
    void notesNaNPValuesAndWhiteCells() {
        FigureResult qq = FIGURES.pValueCalibration(dir, "qq", new CalibrationData("", List.of(
            new PValueSample("a", new double[] {0.1, Double.NaN, 0.5, 0.9}))));
        assertEquals(List.of("a: 1 of 4 p-values skipped (NaN)"), qq.notes());
        GridAxes axes = new GridAxes("x", List.of("1", "2"), "y", List.of("a"));
        FigureResult grid = FIGURES.valueHeatmap(dir, "g", new GridValues("", axes, "z",
            new double[][] {{1, Double.NaN}}));
        assertEquals(List.of("1 of 2 cells left white (NaN or infinite value)"), grid.notes());
        FigureResult verdicts = FIGURES.verdictHeatmap(dir, "v", new GridVerdicts("", axes, List.of("ok"),
            new int[][] {{-1, 0}}));
        assertEquals(List.of("1 of 2 cells left white (no verdict)"), verdicts.notes());
    }

    static Stream<Arguments> emptyOrUndrawableData() {
        double[] none = {};
        double[] nan = {Double.NaN};
        return Stream.of(
            Arguments.of("empty curve", (Runnable) () -> new Curve(none, none), "curve x values must have at least one point: empty array"),
            Arguments.of("null estimates", (Runnable) () -> new Estimates(null, none, none, none),
                "estimate x values must have at least one point: none given"),
            Arguments.of("short estimates", (Runnable) () -> new Estimates(new double[] {1, 2}, new double[] {1},
                new double[] {1}, new double[] {1}), "estimates must have 2 entries: 1"),
            Arguments.of("bounds out of order", (Runnable) () -> new Estimates(new double[] {1}, new double[] {0.5},
                new double[] {0.6}, new double[] {0.7}), "interval 0 must satisfy lower <= estimate <= upper: 0.6, 0.5, 0.7"),
            Arguments.of("three states", (Runnable) () -> new StateDistributionData("", List.of(), List.of()),
                "exact state probabilities (one per state CC, CD, DC, DD) must have 4 entries: 0"),
            Arguments.of("no p-values", (Runnable) () -> new PValueSample("t", none),
                "p-values of t must have at least one point: empty array"),
            Arguments.of("p-value above 1", (Runnable) () -> new PValueSample("t", new double[] {1.5}),
                "p-value 0 of t must be in [0, 1]: 1.5"),
            Arguments.of("no samples", (Runnable) () -> new CalibrationData("", List.of()),
                "p-value samples must have at least one entry: empty list"),
            Arguments.of("no grid labels", (Runnable) () -> new GridAxes("x", List.of(), "y", List.of("a")),
                "x-axis labels must have at least one entry: empty list"),
            Arguments.of("four verdicts", (Runnable) () -> new GridVerdicts("", new GridAxes("x", List.of("1"), "y",
                List.of("a")), List.of("a", "b", "c", "d"), new int[][] {{0}}),
                "at most 3 verdict names can be coloured apart: [a, b, c, d]"),
            Arguments.of("verdict index", (Runnable) () -> new GridVerdicts("", new GridAxes("x", List.of("1"), "y",
                List.of("a")), List.of("a"), new int[][] {{1}}),
                "verdict at row 0, column 0 must be -1 or an index below 1: 1"),
            Arguments.of("all NaN payoffs", (Runnable) () -> FIGURES.payoffByContinuation(Path.of("unused"), "x",
                new PayoffData("", "payoff", new Curve(nan, nan), new Curve(nan, nan), null, null)),
                "figure x has nothing to draw: [X exact payoff: 1 of 1 points skipped (NaN or infinite), "
                    + "X exact payoff: nothing drawn, no usable points, Y exact payoff: 1 of 1 points skipped "
                    + "(NaN or infinite), Y exact payoff: nothing drawn, no usable points]"),
            Arguments.of("all NaN grid", (Runnable) () -> FIGURES.valueHeatmap(Path.of("unused"), "x",
                new GridValues("", new GridAxes("x", List.of("1"), "y", List.of("a")), "z", new double[][] {nan})),
                "value heatmap has no finite value to draw: all 1 cells are NaN or infinite"),
            Arguments.of("unsafe base name", (Runnable) () -> FIGURES.payoffByContinuation(Path.of("unused"), "a/b",
                SampleData.payoff(3)), "figure base name must be a safe file name without extension "
                    + "(use FileNames.readable or FileNames.safe): a/b"),
            Arguments.of("tiny figure", (Runnable) () -> Figures.withDefaults().withSize(FigureSize.custom(1, 1)),
                "figure size must be between 4 x 3 cm and 60 x 60 cm: 1.0 x 1.0 cm"),
            Arguments.of("unknown size", (Runnable) () -> FigureSize.parse("quarter"),
                "figure size must be single, double or WIDTHxHEIGHT in cm (e.g. 12x8): quarter"),
            Arguments.of("zero dpi", (Runnable) () -> Figures.withDefaults().withDpi(0),
                "PNG resolution must be between 72 and 1200 dpi: 0"));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("emptyOrUndrawableData")
    void rejectsWithAClearMessage(String name, Runnable action, String message) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, action::run);
        assertEquals(message, e.getMessage());
    }

    @Test
    void writesNothingWhenThereIsNothingToDraw() throws IOException {
        double[] nan = {Double.NaN};
        assertThrows(IllegalArgumentException.class, () -> FIGURES.payoffByContinuation(dir, "x",
            new PayoffData("", "payoff", new Curve(nan, nan), new Curve(nan, nan), null, null)));
        try (Stream<Path> files = Files.list(dir)) {
            assertEquals(0, files.count());
        }
    }

    /**
     * The verdict heatmap colours each cell by its verdict's index (blue, yellow, vermillion). With every
     * cell on one verdict, that verdict's colour must cover far more pixels than the other two (which
     * appear only as small legend boxes).
     */
    @ParameterizedTest
    @MethodSource("verdictIndices")
    void coloursCellsByVerdict(int verdict) throws IOException {
        GridAxes axes = new GridAxes("x", List.of("1", "2", "3"), "y", List.of("a", "b"));
        int[][] cells = {{verdict, verdict, verdict}, {verdict, verdict, verdict}};
        Path png = FIGURES.withFormats(FigureFormat.PNG).verdictHeatmap(dir, "v" + verdict,
            new GridVerdicts("", axes, List.of("consistent", "inconclusive", "deviates"), cells)).files().get(0);
        Map<Integer, Integer> counts = colourCounts(ImageIO.read(png.toFile()));
        int[] palette = {0x0072B2, 0xF0E442, 0xD55E00};
        int mine = counts.getOrDefault(palette[verdict], 0);
        for (int other = 0; other < palette.length; other++) {
            if (other != verdict) {
                assertTrue(mine > 20 * counts.getOrDefault(palette[other], 0),
                    "verdict " + verdict + ": " + Integer.toHexString(palette[other]) + " too common");
            }
        }
    }

    static Stream<Integer> verdictIndices() {
        return Stream.of(0, 1, 2);
    }

    @Test
    void switchesToHeadlessMode() {
        assertTrue(Figures.withDefaults() != null && "true".equals(System.getProperty("java.awt.headless")));
    }

    private static Map<Integer, Integer> colourCounts(BufferedImage image) {
        Map<Integer, Integer> counts = new HashMap<>();
        for (int y = 0; y < image.getHeight(); y++) {
            for (int x = 0; x < image.getWidth(); x++) {
                counts.merge(image.getRGB(x, y) & 0xFFFFFF, 1, Integer::sum);
            }
        }
        return counts;
    }

    static void assertValidPng(Path png) throws IOException {
        byte[] bytes = Files.readAllBytes(png);
        assertTrue(bytes.length > 1000, "PNG too small: " + bytes.length);
        assertArrayEquals(PNG_SIGNATURE, Arrays.copyOf(bytes, 8));
        BufferedImage image = ImageIO.read(png.toFile());
        assertFalse(colourCounts(image).size() < 3, "PNG is blank");
    }

    static void assertValidSvg(Path svg) throws Exception {
        String text = Files.readString(svg);
        assertTrue(text.contains("<svg"), "no <svg element");
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setFeature("http://apache.org/xml/features/nonvalidating/load-external-dtd", false);
        Document doc = f.newDocumentBuilder().parse(svg.toFile());
        assertEquals("svg", doc.getDocumentElement().getLocalName() == null
            ? doc.getDocumentElement().getTagName() : doc.getDocumentElement().getLocalName());
        assertTrue(text.contains("<path") || text.contains("<polyline") || text.contains("<line"),
            "SVG draws nothing");
        assertTrue(text.contains("<text"), "SVG has no text elements");
    }
}
