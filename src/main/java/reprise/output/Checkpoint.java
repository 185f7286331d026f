package reprise.output;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import reprise.experiment.Experiment;
import reprise.experiment.WorkPlan;
import reprise.sim.SimulationResult;
import reprise.sim.TallyFile;

/**
 * The finished units of an interrupted run, kept in {@code OUT/.checkpoint/}: one JSON file per unit
 * (written atomically, so a unit file is either complete or absent), each stamped with the experiment
 * file's hash, the seed and the tool version. {@code check --resume} loads them and simulates only the
 * rest; since units merge exactly, the final numbers are bit-identical to an uninterrupted run.
 */
public final class Checkpoint {

    /** The folder name inside the output folder. */
    public static final String FOLDER = ".checkpoint";
    /** The format identifier of a unit file. */
    public static final String FORMAT = "reprise-unit-1";
    private static final ObjectMapper MAPPER = new ObjectMapper();

    private final Path dir;

    private Checkpoint(Path dir) {
        this.dir = dir;
    }

    /**
     * The checkpoint of an output folder (it need not exist).
     *
     * @param outputFolder the output folder
     * @return the checkpoint
     */
    public static Checkpoint of(Path outputFolder) {
        return new Checkpoint(outputFolder.resolve(FOLDER));
    }

    /** @return the folder */
    public Path folder() {
        return dir;
    }

    /** @return the number of unit files present */
    public int size() {
        if (!Files.isDirectory(dir)) {
            return 0;
        }
        try (Stream<Path> s = Files.list(dir)) {
            return (int) s.filter(p -> p.getFileName().toString().endsWith(".json")).count();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /**
     * Saves one finished unit.
     *
     * @param e the experiment
     * @param toolVersion the tool version
     * @param unit the unit
     * @param result its tallies
     */
    public void save(Experiment e, String toolVersion, WorkPlan.Unit unit, SimulationResult result) {
        ObjectNode o = header(e, toolVersion);
        o.put("case_index", unit.caseIndex());
        o.put("chunk", unit.chunk());
        o.put("from", unit.from());
        o.put("to", unit.to());
        o.set("tally", TallyFile.toJson(result));
        AtomicFiles.writeText(dir.resolve(unit.fileName()), w -> w.write(MAPPER.writeValueAsString(o)));
    }

    static ObjectNode header(Experiment e, String toolVersion) {
        ObjectNode o = MAPPER.createObjectNode();
        o.put("format", FORMAT);
        o.put("experiment_sha256", e.sha256());
        o.put("seed", e.seed());
        o.put("tool_version", toolVersion);
        return o;
    }

    /**
     * Loads every finished unit, checking that each belongs to this experiment, seed and tool version.
     *
     * @param e the experiment
     * @param toolVersion the tool version
     * @param units the experiment's units
     * @return the tallies by unit file name
     * @throws IllegalArgumentException naming the first file that does not belong to this run
     */
    public Map<String, SimulationResult> load(Experiment e, String toolVersion, List<WorkPlan.Unit> units) {
        Map<String, SimulationResult> out = new LinkedHashMap<>();
        if (!Files.isDirectory(dir)) {
            return out;
        }
        Map<String, WorkPlan.Unit> byName = new LinkedHashMap<>();
        units.forEach(u -> byName.put(u.fileName(), u));
        List<Path> files = new ArrayList<>();
        try (Stream<Path> s = Files.list(dir)) {
            s.sorted().forEach(files::add);
        } catch (IOException ex) {
            throw new UncheckedIOException(ex);
        }
        for (Path f : files) {
            String name = f.getFileName().toString();
            if (name.endsWith(".partial")) {
                continue;
            }
            WorkPlan.Unit u = byName.get(name);
            if (u == null) {
                throw new IllegalArgumentException("checkpoint " + f + " is not a unit of this experiment; use --force to "
                    + "start over");
            }
            JsonNode o;
            try {
                o = MAPPER.readTree(f.toFile());
            } catch (IOException ex) {
                throw new IllegalArgumentException("checkpoint " + f + " cannot be read (" + ex.getMessage()
                    + "); delete it to simulate that unit again", ex);
            }
            String why = mismatch(o, e, toolVersion);
            if (why != null) {
                throw new IllegalArgumentException("checkpoint " + f + " was written by a different run (" + why
                    + "); use --force to start over");
            }
            if (o.path("from").asLong(-1) != u.from() || o.path("to").asLong(-1) != u.to()) {
                throw new IllegalArgumentException("checkpoint " + f + " covers other games than this unit; use --force "
                    + "to start over");
            }
            out.put(name, TallyFile.fromJson(o.get("tally")));
        }
        return out;
    }

    static String mismatch(JsonNode o, Experiment e, String toolVersion) {
        if (!FORMAT.equals(o.path("format").asText())) {
            return "format " + o.path("format").asText("none") + ", expected " + FORMAT;
        }
        if (o.path("seed").asLong() != e.seed()) {
            return "seed " + o.path("seed").asLong() + ", now " + e.seed();
        }
        if (!e.sha256().equals(o.path("experiment_sha256").asText())) {
            return "the experiment file has changed since";
        }
        if (!toolVersion.equals(o.path("tool_version").asText())) {
            return "tool version " + o.path("tool_version").asText() + ", now " + toolVersion;
        }
        return null;
    }

    /** Deletes the checkpoint folder and everything in it. */
    public void delete() {
        if (!Files.isDirectory(dir)) {
            return;
        }
        try (Stream<Path> s = Files.list(dir)) {
            for (Path p : (Iterable<Path>) s::iterator) {
                Files.deleteIfExists(p);
            }
            Files.deleteIfExists(dir);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot delete " + dir + ": " + e.getMessage(), e);
        }
    }
}
