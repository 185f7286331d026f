package reprise.run;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.math.BigInteger;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import reprise.experiment.InputFiles;
import reprise.experiment.PopulationExperiment;
import reprise.output.AtomicFiles;
import reprise.sim.InvasionTally;

/**
 * The checkpoint of a population run: one small JSON file per finished question (its invasion tally),
 * written atomically into {@value #FOLDER} inside the output folder as soon as the question is done, so an
 * interrupted run continues with {@code --resume} and gives results identical to an uninterrupted one.
 *
 * <p>A unit file ({@value #FORMAT}) holds the experiment's SHA-256, seed and tool version, the question
 * index, the number of invasions and the exact tally, and last {@code sha256}: the checksum of the compact
 * JSON text of the object without that field (as {@link UnitFile#checksum}). A file of another experiment,
 * seed, version or invasion count, or with a changed content, is refused naming it.
 */
final class PopulationCheckpoint {

    /** The folder inside the output folder. */
    static final String FOLDER = ".population-units";
    /** The format name of a unit file. */
    static final String FORMAT = "reprise-population-unit-1";
    private static final ObjectMapper MAPPER = new ObjectMapper();

    private final Path folder;

    private PopulationCheckpoint(Path folder) {
        this.folder = folder;
    }

    /**
     * The checkpoint of an output folder.
     *
     * @param dir the output folder
     * @return its checkpoint (not created until a unit is saved)
     */
    static PopulationCheckpoint of(Path dir) {
        return new PopulationCheckpoint(dir.resolve(FOLDER));
    }

    /** @return the number of unit files in the checkpoint */
    int size() {
        if (!Files.isDirectory(folder)) {
            return 0;
        }
        try (Stream<Path> s = Files.list(folder)) {
            return (int) s.filter(p -> p.getFileName().toString().endsWith(".json")).count();
        } catch (IOException ex) {
            throw new UncheckedIOException(ex);
        }
    }

    /**
     * Saves one question's tally.
     *
     * @param e the experiment
     * @param toolVersion the tool's version
     * @param question the question index q
     * @param tally its invasions
     */
    void save(PopulationExperiment e, String toolVersion, int question, InvasionTally tally) {
        ObjectNode o = MAPPER.createObjectNode();
        o.put("format", FORMAT);
        o.put("experiment_sha256", e.sha256());
        o.put("seed", e.seed());
        o.put("tool_version", toolVersion);
        o.put("question", question);
        o.put("invasions", tally.invasions());
        o.put("fixations", tally.fixations());
        o.put("fixation_time_sum", tally.fixationTimeSum());
        o.put("fixation_time_squares", tally.fixationTimeSquares().toString());
        o.put("updates", tally.updates());
        o.put("rounds", tally.rounds());
        o.put("sha256", UnitFile.checksum(o));
        try {
            AtomicFiles.createFolders(folder);
        } catch (IOException ex) {
            throw new UncheckedIOException(ex);
        }
        AtomicFiles.writeText(folder.resolve("q-" + question + ".json"), w -> w.write(MAPPER.writeValueAsString(o)
            + "\n"));
    }

    /**
     * Loads every unit file, checking that each belongs to this run.
     *
     * @param e the experiment
     * @param toolVersion the tool's version
     * @return the tallies by question index
     * @throws IllegalArgumentException one line naming the file, for a file of another run or an edited one
     */
    Map<Integer, InvasionTally> load(PopulationExperiment e, String toolVersion) {
        Map<Integer, InvasionTally> out = new HashMap<>();
        if (!Files.isDirectory(folder)) {
            return out;
        }
        List<Path> files;
        try (Stream<Path> s = Files.list(folder)) {
            files = s.filter(p -> p.getFileName().toString().endsWith(".json")).sorted().toList();
        } catch (IOException ex) {
            throw new UncheckedIOException(ex);
        }
        for (Path f : files) {
            JsonNode o;
            try {
                o = MAPPER.readTree(InputFiles.text(f, "population unit file"));
            } catch (IOException | RuntimeException ex) {
                throw new IllegalArgumentException(f + ": not a population unit file: " + ex.getMessage(), ex);
            }
            if (!(o instanceof ObjectNode obj) || !FORMAT.equals(o.path("format").asText())) {
                throw new IllegalArgumentException(f + ": not a population unit file (" + FORMAT + ")");
            }
            if (!obj.path("sha256").isTextual() || !obj.path("sha256").asText().equals(UnitFile.checksum(obj))) {
                throw new IllegalArgumentException(f + ": fails its sha256 checksum: its content was changed");
            }
            if (!e.sha256().equals(o.path("experiment_sha256").asText()) || o.path("seed").asLong() != e.seed()
                || !toolVersion.equals(o.path("tool_version").asText())) {
                throw new IllegalArgumentException(f + ": belongs to another run (experiment file, seed or tool "
                    + "version differ); use --force to start over");
            }
            if (o.path("invasions").asLong() != e.invasions()) {
                throw new IllegalArgumentException(f + ": holds " + o.path("invasions").asLong() + " invasions, the "
                    + "experiment asks for " + e.invasions());
            }
            out.put(o.path("question").asInt(), new InvasionTally(o.path("invasions").asLong(),
                o.path("fixations").asLong(), o.path("fixation_time_sum").asLong(),
                new BigInteger(o.path("fixation_time_squares").asText()), o.path("updates").asLong(),
                o.path("rounds").asLong()));
        }
        return out;
    }

    /** Deletes the checkpoint's files and folder. */
    void delete() {
        if (!Files.isDirectory(folder)) {
            return;
        }
        try (Stream<Path> s = Files.list(folder)) {
            for (Path p : (Iterable<Path>) s::iterator) {
                Files.deleteIfExists(p);
            }
            Files.deleteIfExists(folder);
        } catch (IOException ex) {
            throw new UncheckedIOException(ex);
        }
    }

    /** @return the folder */
    Path folder() {
        return folder;
    }

}
