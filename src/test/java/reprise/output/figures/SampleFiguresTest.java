package reprise.output.figures;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;

/**
 * Renders every figure with sample data into target/figure-samples, for looking at by eye; the checks
 * on the files themselves are in {@link FiguresTest}.
 */
class SampleFiguresTest {
    private static final Path DIR = Path.of("target", "figure-samples");

    @Test
    void rendersAllSamples() {
        Figures f = Figures.withDefaults();
        assertEquals(2, f.convergence(DIR, "a_convergence", SampleData.convergence(11)).files().size());
        assertEquals(2, f.errorScaling(DIR, "b_error", SampleData.errorScaling(12)).files().size());
        assertEquals(2, f.payoffByContinuation(DIR, "c_payoff", SampleData.payoff(13)).files().size());
        assertEquals(2, f.stateDistribution(DIR, "d_states", SampleData.stateDistribution(14)).files().size());
        assertEquals(2, f.pValueCalibration(DIR, "e_qq", SampleData.calibration(15)).files().size());
        assertEquals(2, f.valueHeatmap(DIR, "f_values", SampleData.gridValues()).files().size());
        assertEquals(2, f.verdictHeatmap(DIR, "f_verdicts", SampleData.gridVerdicts()).files().size());
        FiguresTest.everyFigureWithOnePoint().forEach(a -> {
            @SuppressWarnings("unchecked")
            var draw = (java.util.function.BiFunction<Path, String, FigureResult>) a.get()[1];
            assertEquals(2, draw.apply(DIR, "single_" + a.get()[0]).files().size());
        });
    }
}
