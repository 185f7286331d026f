package reprise.output.figures;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Font;
import java.awt.font.FontRenderContext;
import java.awt.font.TextLayout;
import java.awt.geom.AffineTransform;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** Readable figure names, the manifest, and the recognition of glyph outlines as text. */
class FigureNamesTest {

    @TempDir
    Path dir;

    /** Expected names worked out by hand from the rule in FileNames.readable. */
    static Stream<Arguments> readableNames() {
        return Stream.of(
            Arguments.of("convergence-harbour-watch, noise=0.05", "convergence-harbour-watch-noise-0.05"),
            Arguments.of("payoff-TFT vs ALLD, e=0.1, misperception=0.01", "payoff-TFT-vs-ALLD-e-0.1-misperception-0.01"),
            Arguments.of("error-Müller vs Gödel", "error-Muller-vs-Godel"),
            Arguments.of("...", "figure"),
            Arguments.of("nul", "nul-x"),
            Arguments.of("a".repeat(120), "a".repeat(FileNames.MAX_LENGTH)));
    }

    @ParameterizedTest
    @MethodSource("readableNames")
    void readableNamesHaveNoChecksum(String text, String expected) {
        assertEquals(expected, FileNames.readable(text));
        assertEquals(expected, FileNames.safe(expected), "a readable name passes the safe-name check unchanged");
    }

    @Test
    void namesThatCollideGetNumbers() {
        Set<String> taken = new HashSet<>();
        assertEquals("a-b", FileNames.unique(FileNames.readable("a b"), taken));
        assertEquals("a-b-2", FileNames.unique(FileNames.readable("a=b"), taken));
        assertEquals("A-B-3", FileNames.unique(FileNames.readable("A,B"), taken), "case is ignored");
    }

    @Test
    void manifestListsEveryFileWithKindSubjectAndSize() throws IOException {
        Figures f = Figures.withDefaults().withFormats(FigureFormat.PNG, FigureFormat.PDF);
        FigureResult r = f.errorScaling(dir, "error-a", SampleData.errorScaling(2));
        Path manifest = FigureManifest.write(dir, f, List.of(new FigureManifest.Entry("error", "TFT vs ALLD, e=0.1", r),
            new FigureManifest.Entry("payoff", "none drawn", new FigureResult(List.of(), List.of("not drawn")))));
        assertEquals(List.of(
            "file,kind,subject,format,size,width_cm,height_cm,dpi",
            "error-a.png,error,\"TFT vs ALLD, e=0.1\",png,single,8.5,6.4,300",
            "error-a.pdf,error,\"TFT vs ALLD, e=0.1\",pdf,single,8.5,6.4,"), Files.readAllLines(manifest));
    }

    @Test
    void outlinesAreRecognisedUnderTranslationAndRotation() {
        FontRenderContext frc = new FontRenderContext(null, true, true);
        Font font = TextFont.of(7.5f).plain();
        TextCatalog catalog = new TextCatalog();
        catalog.laidOut("frequency (rounds)", font, frc);
        catalog.laidOut("0.25", font, frc);
        TextLayout layout = new TextLayout("frequency (rounds)", font, frc);
        AffineTransform rotate = AffineTransform.getRotateInstance(-Math.PI / 2, 12.5, 40);
        TextCatalog.Match m = catalog.match(layout.getOutline(rotate));
        assertEquals("frequency (rounds)", m.text());
        assertEquals(rotate.getShearY(), m.transform().getShearY(), 1e-6);
        assertEquals(rotate.getTranslateX(), m.transform().getTranslateX(), 1e-4);
        assertEquals("0.25", catalog.match(new TextLayout("0.25", font, frc)
            .getOutline(AffineTransform.getTranslateInstance(3, 4))).text());
        assertNull(catalog.match(new TextLayout("0.26", font, frc).getOutline(null)), "a string never laid out");
        assertNull(catalog.match(new java.awt.Rectangle(0, 0, 5, 5)));
    }

    @Test
    void writesThroughATemporaryFileAndLeavesOnlyTheFinalOne() throws IOException {
        Path file = dir.resolve("x.svg");
        Files.writeString(file, "old");
        FigureFiles.writeAtomically(file, "new".getBytes(java.nio.charset.StandardCharsets.UTF_8));
        assertEquals("new", Files.readString(file));
        try (Stream<Path> s = Files.list(dir)) {
            assertTrue(s.allMatch(p -> p.equals(file)), "only the final file remains");
        }
    }

    @Test
    void figuresDrawnInParallelThreadsAreTheSameBytes() throws Exception {
        Figures f = Figures.withDefaults().withDpi(72);
        FigureResult sequential = f.convergence(dir.resolve("one"), "c", SampleData.convergence(1));
        java.util.concurrent.ExecutorService pool = java.util.concurrent.Executors.newFixedThreadPool(4);
        try {
            List<java.util.concurrent.Future<FigureResult>> runs = new java.util.ArrayList<>();
            for (int t = 0; t < 4; t++) {
                Path d = dir.resolve("parallel" + t);
                runs.add(pool.submit(() -> f.convergence(d, "c", SampleData.convergence(1))));
            }
            for (java.util.concurrent.Future<FigureResult> run : runs) {
                List<Path> files = run.get().files();
                for (int i = 0; i < files.size(); i++) {
                    org.junit.jupiter.api.Assertions.assertArrayEquals(Files.readAllBytes(sequential.files().get(i)),
                        Files.readAllBytes(files.get(i)), files.get(i).toString());
                }
            }
        } finally {
            pool.shutdown();
        }
    }
}
