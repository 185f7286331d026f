package reprise.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.knowm.xchart.XYChart;
import reprise.experiment.BaseQuantity;
import reprise.experiment.Case;
import reprise.experiment.SetMatrix;
import reprise.experiment.Verdict;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;

/**
 * The matrix figure's own rules (common practice, no source): one colour scale for the whole game (its
 * lowest to highest stage payoff in equal bands), a cross only where a match's simulation disagrees, blank
 * squares for matches not played, and a file name per grid point.
 */
class MatrixFigureTest {

    @TempDir
    Path dir;

    private static SetMatrix.Cell cell(int row, int column, double payoff, boolean disagrees) {
        StageGame g = StageGame.DEFAULT;
        Match m = new Match(g, Strategies.parse("tft", g, Player.X), Strategies.parse("tft", g, Player.Y),
            Noise.NONE);
        Case c = new Case(row * 2 + column, "c" + row + column, "p" + row + column, "tft", "tft", "0.01", "0",
            Horizon.rounds(10), Map.of(), m);
        SetMatrix.Value v = new SetMatrix.Value(BaseQuantity.PAYOFF_X, payoff, payoff, true, payoff, payoff - 0.1,
            payoff + 0.1, disagrees ? Verdict.DISAGREES : Verdict.AGREES);
        return new SetMatrix.Cell(row, column, c, List.of(v), disagrees);
    }

    @Test
    void oneSharedScaleAndACrossWhereTheSimulationDisagrees() throws IOException {
        assertEquals(0, MatrixFigure.band(0, 0, 5));
        assertEquals(MatrixFigure.BINS.length - 1, MatrixFigure.band(5, 0, 5), "the top payoff is in the top band");
        assertEquals(4, MatrixFigure.band(2.5, 0, 5));
        assertEquals(0, MatrixFigure.band(-1, 0, 5), "values below the scale clamp to the lowest band");
        SetMatrix m = new SetMatrix(List.of("a", "b"), Map.of(), "0.01", "0", Horizon.rounds(10),
            List.of(cell(0, 0, 3, false), cell(0, 1, 0.5, true), cell(1, 1, 1, false)));
        XYChart chart = MatrixFigure.chart(m, StageGame.DEFAULT);
        assertTrue(chart.getSeriesMap().containsKey("simulation disagrees"));
        assertEquals(3 + MatrixFigure.BINS.length + 1, chart.getSeriesMap().size(),
            "a square per played match, one legend entry per band, the crosses");
        assertEquals("0 to 0.625", chart.getSeriesMap().keySet().stream().filter(k -> k.contains(" to "))
            .findFirst().orElseThrow());
        SetMatrix clean = new SetMatrix(List.of("a", "b"), Map.of(), "0.01", "0", Horizon.rounds(10),
            List.of(cell(0, 0, 3, false)));
        assertFalse(MatrixFigure.chart(clean, StageGame.DEFAULT).getSeriesMap().containsKey("simulation disagrees"));
        assertEquals("matrix_noise-0.01_rounds-10.png", MatrixFigure.fileName(m));
        Path png = MatrixFigure.write(m, StageGame.DEFAULT, dir.resolve("figures").resolve(MatrixFigure.fileName(m)));
        byte[] head = Files.readAllBytes(png);
        assertTrue(head.length > 2000 && head[1] == 'P' && head[2] == 'N' && head[3] == 'G');
    }
}
