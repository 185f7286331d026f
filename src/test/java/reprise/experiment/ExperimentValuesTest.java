package reprise.experiment;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reprise.game.Horizon;

/** Experiment and Case are immutable, validated values (no external source: properties of the types). */
class ExperimentValuesTest {

    @TempDir
    Path dir;

    private Experiment read(String text) throws IOException {
        Path p = dir.resolve("e.yaml");
        Files.writeString(p, text);
        return ExperimentFile.read(p);
    }

    private static final String TWO_AXES = String.join("\n",
        "experiment: axes",
        "pairs:",
        "  - {name: p, x: 'reactive:{zeta},{alpha0}', y: tft}",
        "grid:",
        "  rounds: [10]",
        "  parameters:",
        "    zeta: [0.9]",
        "    alpha0: [0.1, 0.2]",
        "");

    @Test
    void collectionsAreUnmodifiableAndKeepFileOrder() throws IOException {
        Experiment e = read(TWO_AXES);
        assertEquals(List.of("zeta", "alpha0"), List.copyOf(e.parameters().keySet()));
        assertThrows(UnsupportedOperationException.class, () -> e.parameters().put("x", List.of(1.0)));
        assertThrows(UnsupportedOperationException.class, () -> e.parameters().get("zeta").add(2.0));
        assertThrows(UnsupportedOperationException.class, () -> e.pairs().clear());
        assertThrows(UnsupportedOperationException.class, () -> e.tests().clear());
        assertThrows(UnsupportedOperationException.class, () -> e.quantities().clear());
        assertThrows(UnsupportedOperationException.class, () -> e.snapshots().clear());
        Case c = e.cases().get(0);
        assertEquals(List.of("zeta", "alpha0"), List.copyOf(c.parameters().keySet()));
        assertThrows(UnsupportedOperationException.class, () -> c.parameters().clear());
    }

    @Test
    void theConstructorCopiesAndValidates() throws IOException {
        Experiment e = read(TWO_AXES);
        Map<String, List<Double>> axes = new LinkedHashMap<>(e.parameters());
        List<Horizon> horizons = new ArrayList<>(e.horizons());
        Experiment copy = new Experiment(e.name(), e.description(), e.file(), e.sha256(), e.gameText(), e.game(),
            e.pairs(), e.noise(), e.misperception(), horizons, axes, e.replicates(), e.seed(), e.alpha(), e.tolerance(),
            e.burnIn(), e.snapshots(), e.quantities(), e.tests(), e.correction(), e.claims(), e.output());
        axes.clear();
        horizons.add(Horizon.rounds(99));
        assertEquals(e, copy);
        IllegalArgumentException bad = assertThrows(IllegalArgumentException.class, () -> new Experiment(e.name(),
            e.description(), e.file(), e.sha256(), e.gameText(), e.game(), e.pairs(), e.noise(), e.misperception(),
            e.horizons(), e.parameters(), e.replicates(), e.seed(), 0.5, e.tolerance(), e.burnIn(), e.snapshots(),
            e.quantities(), e.tests(), e.correction(), e.claims(), e.output()));
        assertEquals("alpha must be in (0, 0.5): 0.5", bad.getMessage());
        bad = assertThrows(IllegalArgumentException.class, () -> new Experiment(e.name(), e.description(), e.file(),
            e.sha256(), e.gameText(), e.game(), List.of(), e.noise(), e.misperception(), e.horizons(), e.parameters(),
            e.replicates(), e.seed(), e.alpha(), e.tolerance(), e.burnIn(), e.snapshots(), e.quantities(), e.tests(),
            e.correction(), e.claims(), e.output()));
        assertEquals("pairs must not be empty", bad.getMessage());
        Case c = e.cases().get(0);
        bad = assertThrows(IllegalArgumentException.class, () -> new Case(-1, c.id(), c.pair(), c.xSpec(), c.ySpec(),
            c.noise(), c.misperception(), c.horizon(), c.parameters(), c.match()));
        assertEquals("case index must be at least 0: -1", bad.getMessage());
    }

    @Test
    void aNumberThatOverflowsIsNotFinite() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> ExperimentFile.pair("1e400"));
        assertEquals("must be a finite probability: '1e400'", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> ExperimentFile.pair("0.1,x"));
        assertEquals("is not a number: 'x'", e.getMessage());
    }
}
