package reprise.sim;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import reprise.game.Horizon;
import reprise.game.Noise;
import reprise.game.State;

/**
 * The committed fixed-seed trace {@code trace.txt}: the states of the first rounds of a few games and
 * the tallies of a small run, for the fused path, the literal table path and the agent path. Any change
 * to the simulator's output fails here; if the change is deliberate, replace the resource with the file
 * this test writes to {@code target/sim-trace-actual.txt} and say so in the commit.
 */
class TraceTest {
    record TraceCase(String name, SimulationSpec spec) {
    }

    static List<TraceCase> cases() {
        return List.of(
            new TraceCase("fused", SimulationSpec.of(DeterminismTest.match("memory1:0.9,0.2,0.7,0.1", "gtft",
                Noise.symmetric(0.05, 0.05)), Horizon.rounds(12), 400, 20240601L)),
            new TraceCase("literal-table", SimulationSpec.of(DeterminismTest.match("tf2t", "wsls",
                Noise.symmetric(0.1, 0.1)), Horizon.continuation(0.9), 400, 20240602L).withBurnIn(2)),
            new TraceCase("agent", SimulationSpec.of(DeterminismTest.match("agent:runcap,2,0.25", "random",
                new Noise(0.05, 0, 0.1, 0)), Horizon.rounds(12), 400, 20240603L)));
    }

    static String render() {
        StringBuilder sb = new StringBuilder("# reprise sim fixed-seed trace (generator ").append(Simulator.GENERATOR)
            .append(")\n");
        for (TraceCase c : cases()) {
            SimulationSpec spec = c.spec().withThreads(1);
            sb.append("case ").append(c.name()).append(": ").append(spec).append('\n');
            Simulator sim = new Simulator(spec.withTimeResolved(12));
            for (int g = 0; g < 3; g++) {
                long[][] rounds = sim.simulateRange(g, g + 1, null).timeResolvedCounts();
                sb.append("  game ").append(g).append(':');
                for (long[] row : rounds) {
                    int s = -1;
                    for (int k = 0; k < 4; k++) {
                        if (row[k] == 1) {
                            s = k;
                        }
                    }
                    sb.append(' ').append(s < 0 ? "--" : State.of(s).name());
                }
                sb.append('\n');
            }
            SimulationResult r = new Simulator(spec).run();
            sb.append("  games ").append(r.replicates()).append(", played rounds ").append(r.lengthSum())
                .append(", tallied rounds ").append(r.roundsTotal()).append('\n');
            sb.append("  states ").append(Arrays.toString(r.stateCounts())).append('\n');
            sb.append("  transitions ").append(Arrays.deepToString(r.transitionCounts())).append('\n');
        }
        return sb.toString();
    }

    @Test
    void outputMatchesTheCommittedTrace() throws IOException {
        String actual = render();
        String expected = null;
        try (InputStream in = TraceTest.class.getResourceAsStream("trace.txt")) {
            if (in != null) {
                expected = new String(in.readAllBytes(), StandardCharsets.UTF_8);
            }
        }
        if (!actual.equals(expected)) {
            Path out = Path.of("target", "sim-trace-actual.txt");
            Files.createDirectories(out.getParent());
            Files.writeString(out, actual, StandardCharsets.UTF_8);
        }
        assertNotNull(expected, "missing resource reprise/sim/trace.txt; candidate written to target/sim-trace-actual.txt");
        assertEquals(expected, actual, "simulator output changed; new trace written to target/sim-trace-actual.txt");
    }
}
