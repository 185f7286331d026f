package reprise.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
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

    /**
     * A checkpoint unit edited so that its counts still add up (two state counts swapped: the sum and every
     * count check still hold) once changed the resumed results; its checksum now refuses it, naming the
     * file. A file without a checksum (an older writer) is refused too.
     */
    @Test
    void anEditedUnitFailsItsChecksum() throws IOException {
        Simulator sim = simulator();
        WorkPlan.Unit u = new WorkPlan.Unit(0, 0, 0, 10, 200);
        Checkpoint cp = Checkpoint.of(tmp);
        cp.save(RUN, 1, 1, u, sim.simulateRange(0, 10, null));
        Path f = cp.folder().resolve(u.fileName());
        ObjectMapper mapper = new ObjectMapper();
        ObjectNode o = (ObjectNode) mapper.readTree(f.toFile());
        ArrayNode states = (ArrayNode) o.get("units").get(0).get("tally").get("states");
        long first = states.get(0).asLong();
        long second = states.get(1).asLong();
        assertTrue(first != second, "the swap must change something: " + states);
        states.set(0, second);
        states.set(1, first);
        Files.writeString(f, mapper.writeValueAsString(o));
        IllegalArgumentException ex = assertThrows(IllegalArgumentException.class, () -> cp.load(RUN, List.of(u)));
        assertEquals(f + ": checkpoint fails its sha256 checksum: its content was changed after it was written; "
            + "delete it to simulate that unit again", ex.getMessage());

        o.remove("sha256");
        Files.writeString(f, mapper.writeValueAsString(o));
        ex = assertThrows(IllegalArgumentException.class, () -> UnitFile.read(f, "shard file"));
        assertEquals(f + ": shard file without its sha256 checksum (written by an older version, or edited)",
            ex.getMessage());
    }

    /** A field of the wrong kind is named as such (a seed "one" was once read as seed 0). */
    @Test
    void aFieldOfTheWrongKindIsNamed() throws IOException {
        Simulator sim = simulator();
        WorkPlan.Unit u = new WorkPlan.Unit(0, 0, 0, 10, 200);
        Path f = tmp.resolve(new Part(1, 1).fileName());
        UnitFile.write(f, new UnitFile.Content(new UnitFile.Header(RUN, new Part(1, 1), 1, 1, 0.5),
            List.of(UnitFile.UnitTally.of(u, sim.simulateRange(0, 10, null)))));
        ObjectMapper mapper = new ObjectMapper();
        ObjectNode o = (ObjectNode) mapper.readTree(f.toFile());
        o.put("seed", "one");
        o.put("sha256", UnitFile.checksum(o));
        Files.writeString(f, mapper.writeValueAsString(o));
        IllegalArgumentException ex = assertThrows(IllegalArgumentException.class, () -> UnitFile.read(f, "shard file"));
        assertEquals(f + ": field seed must be a whole number: \"one\"", ex.getMessage());

        o.put("seed", 42);
        ((ObjectNode) o.get("units").get(0)).put("chunk", 0.5);
        o.put("sha256", UnitFile.checksum(o));
        Files.writeString(f, mapper.writeValueAsString(o));
        ex = assertThrows(IllegalArgumentException.class, () -> UnitFile.read(f, "shard file"));
        assertEquals(f + ": field chunk must be a whole number from 0 to 2147483647: 0.5", ex.getMessage());
    }
}
