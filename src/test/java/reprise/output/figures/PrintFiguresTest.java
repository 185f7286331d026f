package reprise.output.figures;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.BiFunction;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import javax.imageio.ImageIO;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.common.PDRectangle;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Every figure kind at both journal widths, written as PNG, SVG and PDF, checked as a journal would:
 * the printed size, every text at least 7 pt on paper, text kept as text, and legends that say what is
 * drawn. The 7 pt minimum is common practice in publishers' artwork guidelines (no single source).
 */
class PrintFiguresTest {
    private static final double MINIMUM_POINTS = 7;
    private static final Pattern TEXT = Pattern.compile("<text[^>]*font-size:([0-9.]+)px;[^>]*>([^<]*)</text>");
    private static final Pattern VIEW_BOX = Pattern.compile("viewBox=\"0 0 ([0-9.]+) ([0-9.]+)\"");

    @TempDir
    Path dir;

    /** Each figure kind with the words its legend (or axis) must show. */
    static Stream<Arguments> figures() {
        List<Arguments> out = new ArrayList<>();
        for (FigureSize size : List.of(FigureSize.SINGLE_COLUMN, FigureSize.DOUBLE_COLUMN)) {
            out.add(Arguments.of(size, "convergence", List.of("CC", "CD", "DC", "DD", "exact", "stationary",
                "TFT vs WSLS, noise=0.05"), (BiFunction<Figures, Path, FigureResult>) (f, d) ->
                f.convergence(d, "convergence", withSubject(SampleData.convergence(1)))));
            out.add(Arguments.of(size, "error", List.of("observed error", "exact standard error"),
                (BiFunction<Figures, Path, FigureResult>) (f, d) -> f.errorScaling(d, "error", errorWithSe())));
            out.add(Arguments.of(size, "payoff", List.of("TFT", "ALLD", "exact"),
                (BiFunction<Figures, Path, FigureResult>) (f, d) -> f.payoffByContinuation(d, "payoff",
                    SampleData.payoff(3).withNames("", "TFT", "ALLD").withStationary(2.3, 2.4))));
            out.add(Arguments.of(size, "states", List.of("CC", "DD", "exact"),
                (BiFunction<Figures, Path, FigureResult>) (f, d) -> f.stateDistribution(d, "states",
                    SampleData.stateDistribution(4))));
            out.add(Arguments.of(size, "qq", List.of("pointwise 95% band"),
                (BiFunction<Figures, Path, FigureResult>) (f, d) -> f.pValueCalibration(d, "qq",
                    SampleData.calibration(5))));
            out.add(Arguments.of(size, "values", List.of("game length"),
                (BiFunction<Figures, Path, FigureResult>) (f, d) -> f.valueHeatmap(d, "values",
                    SampleData.gridValues())));
            out.add(Arguments.of(size, "verdicts", List.of("game length"),
                (BiFunction<Figures, Path, FigureResult>) (f, d) -> f.verdictHeatmap(d, "verdicts",
                    SampleData.gridVerdicts())));
        }
        return out.stream();
    }

    /**
     * A log axis over game lengths labels the grid's lengths, not only the decades (XChart labels decades
     * only; the lengths here are 10, 20, 50, ..., 10000; 5000 would touch the wider "10000" and is left unlabelled).
     */
    @org.junit.jupiter.api.Test
    void logAxesLabelTheGridLengths() throws IOException {
        FigureResult r = Figures.withDefaults().withSize(FigureSize.DOUBLE_COLUMN).withFormats(FigureFormat.SVG)
            .convergence(dir, "lengths", SampleData.convergence(1));
        String svg = Files.readString(r.files().get(0));
        List<String> texts = new ArrayList<>();
        Matcher m = TEXT.matcher(svg);
        while (m.find()) {
            texts.add(m.group(2));
        }
        for (String length : List.of("10", "20", "50", "100", "200", "500", "1000", "2000", "10000")) {
            assertTrue(texts.contains(length), "tick label " + length + " missing: " + texts);
        }
    }

    /** Claimed payoffs are drawn as crosses with a legend entry; the stationary lines with theirs. */
    @org.junit.jupiter.api.Test
    void payoffFigureOverlaysClaimedValues() throws IOException {
        FigureResult r = Figures.withDefaults().withFormats(FigureFormat.SVG).payoffByContinuation(dir, "claims",
            SampleData.payoff(3).withNames("", "X = tft", "Y = wsls").withStationary(2.3, 2.4)
                .withClaims(new Curve(new double[] {0.5, 0.9}, new double[] {2.2, 2.3}), null));
        String svg = Files.readString(r.files().get(0));
        assertTrue(svg.contains(">claimed value<"), "legend names the claimed values");
        assertTrue(svg.contains(">X = tft<") && svg.contains(">Y = wsls<"), "legend names the strategies");
        assertTrue(svg.contains("\u03b4 \u2192 1"), "legend names the stationary reference");
    }

    /** Two pairs' payoff figures side by side, with panel letters, at double-column width. */
    @org.junit.jupiter.api.Test
    void panelsCarryLettersAndKeepTheMinimumTextSize() throws IOException {
        Figures figures = Figures.withDefaults().withSize(FigureSize.DOUBLE_COLUMN);
        FigureResult r = figures.panels(dir, "payoff-panels", 2, List.of(
            f -> f.payoffByContinuation(dir, "unused", SampleData.payoff(3).withNames("", "TFT", "ALLD")),
            f -> f.payoffByContinuation(dir, "unused", SampleData.payoff(4).withNames("", "WSLS", "GTFT"))));
        assertEquals(List.of(dir.resolve("payoff-panels.png"), dir.resolve("payoff-panels.svg"),
            dir.resolve("payoff-panels.pdf")), r.files());
        assertFalse(Files.exists(dir.resolve("unused.png")), "panels are not written on their own");
        BufferedImage png = ImageIO.read(r.files().get(0).toFile());
        // two cells of 8.75 cm = 248 points each (rounded), at 300 / 72 pixels per point
        assertEquals((int) (2 * 248 * 300 / 72.0), png.getWidth());
        String svg = Files.readString(r.files().get(1));
        double pointsPerUnit = 17.5 / 2.54 * 72 / 496;
        Matcher m = TEXT.matcher(svg);
        StringBuilder all = new StringBuilder();
        while (m.find()) {
            assertTrue(Double.parseDouble(m.group(1)) * pointsPerUnit >= MINIMUM_POINTS, m.group(2));
            all.append(m.group(2)).append('\n');
        }
        for (String w : List.of("(a)", "(b)", "TFT", "ALLD", "WSLS", "GTFT")) {
            assertTrue(all.toString().contains(w), "panel figure lacks \"" + w + "\": " + all);
        }
        try (PDDocument doc = Loader.loadPDF(Files.readAllBytes(r.files().get(2)))) {
            assertEquals(496, doc.getPage(0).getMediaBox().getWidth(), 0.5);
        }
    }

    private static ConvergenceData withSubject(ConvergenceData d) {
        return new ConvergenceData(d.title(), d.simulated(), d.exact(), d.stationary(), "TFT vs WSLS, noise=0.05");
    }

    private static ErrorScalingData errorWithSe() {
        ErrorScalingData d = SampleData.errorScaling(2);
        double[] n = d.gameLengths();
        double[] se = new double[n.length];
        for (int i = 0; i < n.length; i++) {
            se[i] = 0.4 / Math.sqrt(n[i]);
        }
        return new ErrorScalingData("", "", d.quantity(), d.observed(), d.exactBias(), new Curve(n, se));
    }

    @ParameterizedTest(name = "{1} at {0}")
    @MethodSource("figures")
    void printReady(FigureSize size, String kind, List<String> words, BiFunction<Figures, Path, FigureResult> draw)
        throws IOException {
        Figures figures = Figures.withDefaults().withSize(size);
        FigureResult r = draw.apply(figures, dir);
        assertEquals(List.of(dir.resolve(kind + ".png"), dir.resolve(kind + ".svg"), dir.resolve(kind + ".pdf")),
            r.files());
        try (Stream<Path> files = Files.list(dir)) {
            assertFalse(files.anyMatch(p -> p.getFileName().toString().endsWith(".part")), "temporary file left");
        }

        // PNG: the printed size in points times 300 / 72 (BitmapEncoder truncates)
        BufferedImage png = ImageIO.read(r.files().get(0).toFile());
        assertEquals((int) (size.widthPoints() * 300 / 72.0), png.getWidth());
        assertEquals((int) (size.heightPoints() * 300 / 72.0), png.getHeight());

        // SVG: real text elements, each at least 7 pt when the SVG is printed at its stated width
        String svg = Files.readString(r.files().get(1));
        assertTrue(svg.contains("width=\"" + trim(size.widthCm()) + "cm\""), "SVG states its printed width");
        Matcher box = VIEW_BOX.matcher(svg);
        assertTrue(box.find(), "SVG has a view box");
        double pointsPerUnit = size.widthCm() / 2.54 * 72 / Double.parseDouble(box.group(1));
        Matcher m = TEXT.matcher(svg);
        StringBuilder allText = new StringBuilder();
        int texts = 0;
        while (m.find()) {
            double printed = Double.parseDouble(m.group(1)) * pointsPerUnit;
            assertTrue(printed >= MINIMUM_POINTS, "text \"" + m.group(2) + "\" is " + printed + " pt");
            allText.append(m.group(2)).append('\n');
            texts++;
        }
        assertTrue(texts >= 5, "SVG has " + texts + " text elements");
        for (String w : words) {
            assertTrue(allText.toString().contains(w), "SVG text lacks \"" + w + "\": " + allText);
        }

        // the fonts the chart was laid out with, at the printed size
        FigureStyle style = new FigureStyle(size, 300);
        assertTrue(style.textSize() * size.widthPoints() / style.width() >= MINIMUM_POINTS);
        assertTrue(style.axisTitleSize() >= MINIMUM_POINTS && style.titleSize() >= MINIMUM_POINTS);

        // PDF: a valid document PDFBox can parse, one page of the printed size, with extractable text
        byte[] pdf = Files.readAllBytes(r.files().get(2));
        assertEquals("%PDF-", new String(pdf, 0, 5, StandardCharsets.US_ASCII));
        try (PDDocument doc = Loader.loadPDF(pdf)) {
            assertEquals(1, doc.getNumberOfPages());
            PDRectangle page = doc.getPage(0).getMediaBox();
            // VectorGraphics2D writes the page in points; 0.5 pt covers rounding to whole points
            assertEquals(size.widthPoints(), page.getWidth(), 0.5);
            assertEquals(size.heightPoints(), page.getHeight(), 0.5);
            // the text stripper breaks rotated text into lines, so compare without white space
            String text = new PDFTextStripper().getText(doc).replaceAll("\\s+", "");
            for (String w : words) {
                if (w.chars().allMatch(c -> c < 128)) {
                    assertTrue(text.contains(w.replaceAll("\\s+", "")), "PDF text lacks \"" + w + "\": " + text);
                }
            }
        }
    }

    private static String trim(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
    }
}
