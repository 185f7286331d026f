package reprise.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;
import reprise.sim.SimulationResult;
import reprise.sim.SimulationSpec;
import reprise.sim.Simulator;

/**
 * The one format for saved tallies: a unit file reads back exactly what was written, and a checkpoint
 * takes back only units of its own run, part and games (round trips and refusals; no external source).
 */
class UnitFileTest {

    @TempDir
    Path tmp;

    private static final RunIdentity RUN = new RunIdentity(Path.of("/x/exp.yaml"), "ab".repeat(32), null, null, 42,
        "test-version");

    private static Simulator simulator() {
        StageGame g = StageGame.DEFAULT;
        Match m = new Match(g, Strategies.parse("tft", g, Player.X), Strategies.parse("wsls", g, Player.Y),
            Noise.symmetric(0.05, 0.0));
        return new Simulator(SimulationSpec.of(m, Horizon.rounds(20), 50, 7).withThreads(1));
    }

    @Test
    void roundTripKeepsHeaderAndTallies() {
        Simulator sim = simulator();
        WorkPlan.Unit a = new WorkPlan.Unit(3, 0, 0, 20, 400);
        WorkPlan.Unit b = new WorkPlan.Unit(3, 1, 20, 50, 600);
        UnitFile.Content written = new UnitFile.Content(new UnitFile.Header(RUN, new Part(2, 5), 9, 2, 1.5),
            List.of(UnitFile.UnitTally.of(a, sim.simulateRange(0, 20, null)),
                UnitFile.UnitTally.of(b, sim.simulateRange(20, 50, null))));
        Path f = tmp.resolve("shards").resolve(new Part(2, 5).fileName());
        UnitFile.write(f, written);
        UnitFile.Content read = UnitFile.read(f, "shard file");
        assertEquals(written, read);
        assertTrue(read.units().get(0).is(a) && read.units().get(1).is(b));
        assertEquals(sim.run(), read.units().get(0).tally().merge(read.units().get(1).tally()));
    }

    @Test
    void otherFormatsAreRefusedNamingTheFile() throws IOException {
        Path f = tmp.resolve("old.json");
        Files.writeString(f, "{\"format\": \"reprise-shard-1\"}");
        IllegalArgumentException ex = assertThrows(IllegalArgumentException.class, () -> UnitFile.read(f, "shard file"));
        assertEquals(f + ": not a shard file of format reprise-units-1 (format: reprise-shard-1)", ex.getMessage());
    }

    @Test
    void checkpointTakesBackOnlyItsOwnUnits() {
        Simulator sim = simulator();
        WorkPlan.Unit u = new WorkPlan.Unit(0, 0, 0, 10, 200);
        SimulationResult r = sim.simulateRange(0, 10, null);
        Checkpoint whole = Checkpoint.of(tmp);
        whole.save(RUN, 1, 1, u, r);
        assertEquals(Map.of(u, r), whole.load(RUN, List.of(u)));

        WorkPlan.Unit wider = new WorkPlan.Unit(0, 0, 0, 12, 240);
        IllegalArgumentException ex = assertThrows(IllegalArgumentException.class, () -> whole.load(RUN, List.of(wider)));
        assertTrue(ex.getMessage().contains("covers other games than this unit"), ex.getMessage());

        RunIdentity otherVersion = new RunIdentity(RUN.experimentFile(), RUN.experimentSha256(), null, null, 42, "0.1");
        ex = assertThrows(IllegalArgumentException.class, () -> whole.load(otherVersion, List.of(u)));
        assertTrue(ex.getMessage().contains("different run (tool version test-version, now 0.1)"), ex.getMessage());

        whole.delete();
        Checkpoint.of(tmp, new Part(1, 2)).save(RUN, 1, 1, u, r);
        ex = assertThrows(IllegalArgumentException.class, () -> whole.load(RUN, List.of(u)));
        assertTrue(ex.getMessage().contains("different run (shard 1 of 2, now 1 of 1)"), ex.getMessage());
    }
}
