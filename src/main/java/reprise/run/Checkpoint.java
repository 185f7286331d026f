package reprise.run;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import reprise.sim.SimulationResult;

/**
 * The finished units of an interrupted run, kept in {@code OUT/.checkpoint/}: one {@link UnitFile} per
 * unit, holding that one unit, named by {@link WorkPlan.Unit#fileName()}. {@code check --resume} loads
 * them and simulates only the rest; since units merge exactly, the final numbers are bit-identical to an
 * uninterrupted run.
 *
 * <p>A checkpoint belongs to one part of a run ({@link Part#WHOLE} for an unsharded {@code check}); its
 * unit files record that part and the build, and are taken back only by the same part and build. A
 * shard's checkpoint lives in a folder of its own ({@link #in}, {@link ShardRun#checkpointFolder}).
 */
public final class Checkpoint {

    /** The folder name inside the output folder. */
    public static final String FOLDER = ".checkpoint";
    private static final String KIND = "checkpoint";

    private final Path dir;
    private final Part part;

    private Checkpoint(Path dir, Part part) {
        this.dir = dir;
        this.part = part;
    }

    /**
     * The checkpoint of an unsharded run in an output folder (it need not exist).
     *
     * @param outputFolder the output folder
     * @return the checkpoint
     */
    public static Checkpoint of(Path outputFolder) {
        return of(outputFolder, Part.WHOLE);
    }

    /**
     * The checkpoint of one part of a run in an output folder.
     *
     * @param outputFolder the output folder
     * @param part the part of the run
     * @return the checkpoint
     */
    static Checkpoint of(Path outputFolder, Part part) {
        return new Checkpoint(outputFolder.resolve(FOLDER), part);
    }

    /**
     * The checkpoint of one part of a run in a folder of its own (a shard's checkpoint).
     *
     * @param folder the checkpoint folder
     * @param part the part of the run
     * @return the checkpoint
     */
    static Checkpoint in(Path folder, Part part) {
        return new Checkpoint(folder, part);
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
     * @param run the run's identity
     * @param unitsTotal the number of units of the experiment
     * @param threads the worker threads that simulated the unit
     * @param unit the unit
     * @param result its tallies
     */
    void save(RunIdentity run, int unitsTotal, int threads, WorkPlan.Unit unit, SimulationResult result) {
        UnitFile.Header h = new UnitFile.Header(run, part, unitsTotal, threads, Double.NaN);
        UnitFile.write(dir.resolve(unit.fileName()), new UnitFile.Content(h, List.of(UnitFile.UnitTally.of(unit,
            result))));
    }

    /**
     * Loads every finished unit, checking that each belongs to this experiment, seed, tool version and build.
     *
     * @param run the run's identity
     * @param units the experiment's units
     * @return the tallies by unit
     * @throws IllegalArgumentException naming the first file that does not belong to this run
     */
    Map<WorkPlan.Unit, SimulationResult> load(RunIdentity run, List<WorkPlan.Unit> units) {
        Map<WorkPlan.Unit, SimulationResult> out = new LinkedHashMap<>();
        if (!Files.isDirectory(dir)) {
            return out;
        }
        Map<String, WorkPlan.Unit> byName = new LinkedHashMap<>();
        units.forEach(u -> byName.put(u.fileName(), u));
        for (Path f : files()) {
            String name = f.getFileName().toString();
            if (name.endsWith(".partial")) {
                continue;
            }
            WorkPlan.Unit u = byName.get(name);
            if (u == null) {
                throw new IllegalArgumentException("checkpoint " + f + " is not a unit of this experiment; use --force to "
                    + "start over");
            }
            UnitFile.Content c;
            try {
                c = UnitFile.read(f, KIND);
            } catch (IllegalArgumentException ex) {
                throw new IllegalArgumentException(ex.getMessage() + "; delete it to simulate that unit again", ex);
            }
            String why = mismatch(c.header(), run);
            if (why != null) {
                throw new IllegalArgumentException("checkpoint " + f + " was written by a different run (" + why
                    + "); use --force to start over");
            }
            if (c.units().size() != 1 || !c.units().get(0).is(u)) {
                throw new IllegalArgumentException("checkpoint " + f + " covers other games than this unit; use --force "
                    + "to start over");
            }
            out.put(u, c.units().get(0).tally());
        }
        return out;
    }

    private List<Path> files() {
        List<Path> files = new ArrayList<>();
        try (Stream<Path> s = Files.list(dir)) {
            s.sorted().forEach(files::add);
        } catch (IOException ex) {
            throw new UncheckedIOException(ex);
        }
        return files;
    }

    /** Why a unit file is not of this run and part, or null; the claims do not enter the tallies. */
    private String mismatch(UnitFile.Header h, RunIdentity run) {
        RunIdentity saved = h.run();
        if (saved.seed() != run.seed()) {
            return "seed " + saved.seed() + ", now " + run.seed();
        }
        if (!run.experimentSha256().equals(saved.experimentSha256())) {
            return "the experiment file has changed since";
        }
        if (!run.toolVersion().equals(saved.toolVersion())) {
            return "tool version " + saved.toolVersion() + ", now " + run.toolVersion();
        }
        if (h.build() != null && !h.build().equals(Build.current())) {
            return "build " + h.build() + ", now " + Build.current();
        }
        if (!h.part().equals(part)) {
            return "shard " + h.part().shard() + " of " + h.part().shards() + ", now " + part.shard() + " of "
                + part.shards();
        }
        return null;
    }

    /** Deletes the checkpoint folder and everything in it. */
    void delete() {
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
