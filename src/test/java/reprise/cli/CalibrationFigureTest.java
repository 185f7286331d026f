package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code calibrate --out} draws the p-value QQ figure, and {@code plot} redraws it from calibration.csv. */
class CalibrationFigureTest {

    @TempDir
    Path dir;

    private static int run(String... args) {
        return Main.run(args, new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter()));
    }

    @Test
    void calibrateDrawsTheQqFigureAndPlotRedrawsIt() throws Exception {
        Path out = dir.resolve("cal");
        assertEquals(0, run("calibrate", "--x", "wsls", "--y", "tft", "--noise", "0.05", "--rounds", "30",
            "--replicates", "100", "--repetitions", "30", "--quiet", "--out", out.toString()));
        Path svg = out.resolve("figures/calibration-qq.svg");
        Path png = out.resolve("figures/calibration-qq.png");
        assertTrue(Files.size(png) > 1000 && Files.size(svg) > 1000);
        assertTrue(Files.readString(svg).contains("<svg"));
        byte[] before = Files.readAllBytes(svg);
        Files.delete(svg);
        Files.delete(png);
        assertEquals(0, run("plot", out.toString()));
        assertArrayEquals(before, Files.readAllBytes(svg), "plot redraws the same figure from calibration.csv");
        assertTrue(Files.exists(png));
    }

    @Test
    void plotRefusesAFolderWithNeitherFile() {
        StringWriter err = new StringWriter();
        int code = Main.run(new String[] {"plot", dir.toString()}, new PrintWriter(new StringWriter()),
            new PrintWriter(err));
        assertEquals(2, code);
        assertTrue(err.toString().contains("no curves.csv (from check) or calibration.csv"), err.toString());
    }
}
