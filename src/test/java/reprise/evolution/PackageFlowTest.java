package reprise.evolution;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The one-way flow of DEVELOPERS.md for the population code: the exact side ({@code evolution}) never
 * imports the simulator, and the simulator imports neither the exact engine nor the exact population side
 * (common practice, no source: a source scan of the import lines).
 */
class PackageFlowTest {

    private static List<String> violations(String pkg, String... forbidden) throws IOException {
        List<String> out = new ArrayList<>();
        try (Stream<Path> files = Files.walk(Path.of("src/main/java/reprise", pkg))) {
            for (Path f : (Iterable<Path>) files.filter(p -> p.toString().endsWith(".java"))::iterator) {
                for (String line : Files.readAllLines(f)) {
                    for (String bad : forbidden) {
                        if (line.startsWith("import " + bad + ".") || line.startsWith("import static " + bad + ".")) {
                            out.add(f + ": " + line);
                        }
                    }
                }
            }
        }
        return out;
    }

    @Test
    void exactAndSimulatedPopulationSidesStayApart() throws IOException {
        List<String> v = violations("evolution", "reprise.sim", "reprise.stats", "reprise.experiment", "reprise.output",
            "reprise.run", "reprise.cli");
        assertTrue(v.isEmpty(), String.join("\n", v));
        List<String> w = violations("sim", "reprise.chain", "reprise.evolution", "reprise.stats");
        assertTrue(w.isEmpty(), String.join("\n", w));
    }
}
