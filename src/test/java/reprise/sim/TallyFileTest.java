package reprise.sim;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.junit.jupiter.api.Test;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;

/** Tallies written as JSON read back exactly and merge into the same numbers as one run (no external source). */
class TallyFileTest {

    private static SimulationSpec spec() {
        StageGame g = StageGame.DEFAULT;
        Match m = new Match(g, Strategies.parse("tf2t", g, Player.X), Strategies.parse("wsls", g, Player.Y),
            Noise.symmetric(0.03, 0.02));
        return SimulationSpec.of(m, Horizon.continuation(0.95), 300, 11).withSnapshots(1, 3).withThreads(1);
    }

    @Test
    void roundTripIsExactAndMergesLikeOneRun() throws Exception {
        Simulator sim = new Simulator(spec());
        SimulationResult whole = sim.run();
        SimulationResult a = sim.simulateRange(0, 120, null);
        SimulationResult b = sim.simulateRange(120, 300, null);
        ObjectMapper mapper = new ObjectMapper();
        SimulationResult a2 = TallyFile.fromJson(mapper.readTree(mapper.writeValueAsString(TallyFile.toJson(a))));
        SimulationResult b2 = TallyFile.fromJson(mapper.readTree(mapper.writeValueAsString(TallyFile.toJson(b))));
        assertEquals(a, a2);
        assertEquals(whole, b2.merge(a2));
    }

    @Test
    void corruptedTalliesAreRefused() {
        ObjectNode o = TallyFile.toJson(new Simulator(spec()).simulateRange(0, 10, null));
        ((com.fasterxml.jackson.databind.node.ArrayNode) o.get("states")).set(0, 999_999);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> TallyFile.fromJson(o));
        assertTrue(e.getMessage().contains("state counts add up to"), e.getMessage());
        o.put("format", "something-else");
        e = assertThrows(IllegalArgumentException.class, () -> TallyFile.fromJson(o));
        assertTrue(e.getMessage().contains("not a reprise-tally-1 tally"), e.getMessage());
    }
}
