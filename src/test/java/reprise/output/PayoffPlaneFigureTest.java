package reprise.output;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reprise.experiment.PayoffPlane;
import reprise.game.Horizon;
import reprise.game.Noise;
import reprise.game.StageGame;

class PayoffPlaneFigureTest {

    /**
     * Press &amp; Dyson (2012), PNAS 109(26), 10409-10413: the long-run payoffs of error-free play against any
     * co-player lie on the line the strategy enforces (extortion chi = 3: pi_Y = 1 + (pi_X - 1)/3; the
     * equalizer fixing pi_Y = 2); values against ALLC 41/11 and 21/11 from the team's reference list.
     */
    @Test
    void longRunPointsLieOnTheLine(@TempDir Path dir) throws Exception {
        List<String> co = List.of("allc", "wsls", "random", "memory1:0.9,0.5,0.2,0.1", "gtft");
        for (String zd : List.of("extort:chi=3", "generous:chi=2", "equalizer:score=2")) {
            PayoffPlane p = PayoffPlane.of(StageGame.DEFAULT, zd, co, Noise.NONE,
                Arrays.asList(null, Horizon.rounds(5)));
            for (int j = 0; j < co.size(); j++) {
                assertEquals(p.lineY(p.payoffX()[0][j]), p.payoffY()[0][j], 1e-12, zd + " vs " + co.get(j));
            }
            Path png = PayoffPlaneFigure.write(p, dir.resolve("sub/" + zd.replace(':', '_') + ".png"));
            byte[] head = Arrays.copyOf(Files.readAllBytes(png), 4);
            assertArrayEquals(new byte[] {(byte) 0x89, 'P', 'N', 'G'}, head);
        }
        PayoffPlane e = PayoffPlane.of(StageGame.DEFAULT, "extort:chi=3", co, Noise.NONE, Arrays.asList((Horizon) null));
        assertEquals(41 / 11.0, e.payoffX()[0][0], 1e-12);
        assertEquals(21 / 11.0, e.lineY(41 / 11.0), 1e-12);
        assertThrows(IllegalArgumentException.class,
            () -> PayoffPlane.of(StageGame.DEFAULT, "tft", co, Noise.NONE, Arrays.asList((Horizon) null)));
    }

    /** The feasible region of 3,0,5,1 is the quadrilateral (1,1), (5,0), (3,3), (0,5) (common practice, no source). */
    @Test
    void hullOfThePrisonersDilemma() {
        StageGame g = StageGame.DEFAULT;
        double[][] h = PayoffPlaneFigure.hull(g.payoffX(), g.payoffY());
        assertArrayEquals(new double[] {0, 1, 5, 3, 0}, h[0]);
        assertArrayEquals(new double[] {5, 1, 0, 3, 5}, h[1]);
        double[][] t = PayoffPlaneFigure.hull(new double[] {0, 0, 1, 0.5}, new double[] {0, 1, 0, 0.2});
        assertEquals(4, t[0].length, "an interior point is dropped");
        assertTrue(Arrays.stream(t[0]).noneMatch(v -> v == 0.5));
    }
}
