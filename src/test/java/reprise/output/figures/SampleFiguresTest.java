package reprise.output.figures;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Renders every figure with sample data into target/figure-samples, for looking at by eye; the checks
 * on the files themselves are in {@link FiguresTest}.
 */
class SampleFiguresTest {
    private static final Path DIR = Path.of("target", "figure-samples");

    @Test
    void rendersAllSamplesAtBothColumnWidths() {
        render(Figures.withDefaults(), DIR.resolve("single"));
        render(Figures.withDefaults().withSize(FigureSize.DOUBLE_COLUMN), DIR.resolve("double"));
        Path dir = DIR.resolve("double");
        assertEquals(3, Figures.withDefaults().withSize(FigureSize.DOUBLE_COLUMN).panels(dir, "g_panels", 2,
            List.<java.util.function.Function<Figures, FigureResult>>of(
                f -> f.convergence(dir, "x", SampleData.convergence(11)),
                f -> f.errorScaling(dir, "x", SampleData.errorScaling(12)))).files().size());
    }

    private static void render(Figures f, Path dir) {
        assertEquals(3, f.convergence(dir, "a_convergence", SampleData.convergence(11)).files().size());
        assertEquals(3, f.errorScaling(dir, "b_error", SampleData.errorScaling(12)).files().size());
        assertEquals(3, f.payoffByContinuation(dir, "c_payoff", SampleData.payoff(13)).files().size());
        assertEquals(3, f.stateDistribution(dir, "d_states", SampleData.stateDistribution(14)).files().size());
        assertEquals(3, f.pValueCalibration(dir, "e_qq", SampleData.calibration(15)).files().size());
        assertEquals(3, f.valueHeatmap(dir, "f_values", SampleData.gridValues()).files().size());
        assertEquals(3, f.verdictHeatmap(dir, "f_verdicts", SampleData.gridVerdicts()).files().size());
        FiguresTest.everyFigureWithOnePoint().forEach(a -> {
            @SuppressWarnings("unchecked")
            var draw = (java.util.function.BiFunction<Path, String, FigureResult>) a.get()[1];
            assertEquals(2, draw.apply(dir, "single_" + a.get()[0]).files().size());
        });
    }
}
