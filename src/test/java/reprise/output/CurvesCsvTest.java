package reprise.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reprise.experiment.Curves;
import reprise.experiment.FigureKind;

/** curves.csv round trip with the horizon column, and files of earlier versions without it. */
class CurvesCsvTest {

    @TempDir
    Path dir;

    @Test
    void pointsComeBackWithTheirHorizon() {
        List<Curves.Point> points = List.of(
            new Curves.Point(FigureKind.ERROR, "p, noise=0.1", "exact standard error", Curves.ROUNDS, 10, 0.004,
                Double.NaN, Double.NaN, Double.NaN),
            new Curves.Point(FigureKind.PAYOFF, "q, noise=0", "X (tft) exact", Curves.CONTINUATION, 0.9, 2.5,
                Double.NaN, Double.NaN, Double.NaN));
        Path file = dir.resolve("curves.csv");
        CurvesCsv.write(file, points);
        assertEquals(points, CurvesCsv.read(file));
    }

    @Test
    void filesWithoutTheHorizonColumnAreStillRead() throws IOException {
        Path file = Files.writeString(dir.resolve("old.csv"), "figure,group,series,x,y,value,lower,upper\n"
            + "verdicts,p,stationary payoff of X within tolerance,0.01,0.9,0,,\n");
        List<Curves.Point> points = CurvesCsv.read(file);
        assertEquals(1, points.size());
        assertEquals("", points.get(0).horizon());
        assertEquals(0.9, points.get(0).y());
    }

    @Test
    void anUnknownHorizonIsRefused() throws IOException {
        Path file = Files.writeString(dir.resolve("bad.csv"), "figure,group,series,horizon,x,y,value,lower,upper\n"
            + "error,p,simulated,weeks,10,0.01,,,\n");
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> CurvesCsv.read(file));
        assertEquals(file + ":2: horizon must be rounds, continuation or blank: weeks", e.getMessage());
    }
}
