package reprise.experiment;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/** Test helper: runs an experiment file written on the fly through the runner, in memory, on one thread. */
final class Runs {

    private Runs() {
    }

    /**
     * Writes the experiment (and claims, if any) into {@code dir} and runs it.
     *
     * @param dir a temporary folder
     * @param yaml the experiment file's text
     * @param claims the claims file's text, or null
     * @return the outcome
     */
    static Runner.Outcome run(Path dir, String yaml, String claims) {
        try {
            Files.createDirectories(dir);
            if (claims != null) {
                Files.writeString(dir.resolve("claims.csv"), claims);
            }
            Path file = dir.resolve("e.yaml");
            Files.writeString(file, yaml + (claims != null ? "claims: claims.csv\n" : ""));
            Experiment e = ExperimentFile.read(file);
            List<Case> cases = e.cases();
            Map<Integer, Map<BaseQuantity, Claims.Claim>> c = e.claims() == null ? Map.of() : Claims.read(e.claims(), e,
                cases);
            List<CaseResult> results = new ArrayList<>();
            for (Case k : cases) {
                results.add(Runner.runCase(e, k, 1, null));
            }
            return Runner.analyse(e, results, c);
        } catch (IOException ex) {
            throw new UncheckedIOException(ex);
        }
    }

    /** @return the experiment header shared by the tests (game, alpha, tolerance) with these fields */
    static String experiment(String pairs, String grid, int games, long seed, double tolerance, String more) {
        return "experiment: t\ngame: 3,0,5,1\npairs:\n" + pairs + "grid:\n" + grid + "replicates: " + games + "\nseed: "
            + seed + "\nalpha: 0.05\ntolerance: " + tolerance + "\n" + more;
    }
}
