package reprise.run;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;
import java.util.stream.Stream;
import reprise.sim.SimulationResult;

/**
 * The shard files of one sharded run, read from {@code DIR/shards/} and checked to be complete and to
 * belong together: shards 1..N all present, each once, all cut into the same N, from the same experiment
 * file, seed, claims file, tool version and build ({@link Build}). Every refusal is one line naming the folder or file.
 *
 * <p>A set is read before the experiment file, whose path it records ({@link #identity()}); {@link Merge}
 * then checks the file against it.
 */
public final class ShardSet {

    private static final String KIND = "shard file";

    private final Path folder;
    private final Map<Integer, UnitFile.Content> byShard;
    private final UnitFile.Header first;

    private ShardSet(Path folder, Map<Integer, UnitFile.Content> byShard, UnitFile.Header first) {
        this.folder = folder;
        this.byShard = byShard;
        this.first = first;
    }

    /**
     * Reads and checks the shards of a folder.
     *
     * @param dir the folder holding shards/
     * @param toolVersion the version of this tool: shards of another version are refused
     * @return the shard set
     * @throws IllegalArgumentException one line, if the set is missing, mixed or damaged
     */
    public static ShardSet read(Path dir, String toolVersion) {
        Path folder = dir.resolve(OutputFolder.SHARDS);
        Map<Integer, List<String>> names = new TreeMap<>();
        Map<Integer, UnitFile.Content> byShard = new TreeMap<>();
        Map<String, UnitFile.Content> all = readAll(folder);
        for (Map.Entry<String, UnitFile.Content> en : all.entrySet()) {
            int i = en.getValue().header().part().shard();
            names.computeIfAbsent(i, k -> new ArrayList<>()).add(en.getKey());
            byShard.putIfAbsent(i, en.getValue());
        }
        UnitFile.Header first = all.values().iterator().next().header();
        String firstName = all.keySet().iterator().next();
        all.forEach((name, c) -> sameRun(folder, first, firstName, c.header(), name));
        for (Map.Entry<Integer, List<String>> en : names.entrySet()) {
            if (en.getValue().size() > 1) {
                throw new IllegalArgumentException(folder + ": shard " + en.getKey() + " of " + first.part().shards()
                    + " is there more than once: " + String.join(", ", en.getValue()));
            }
        }
        List<String> missing = new ArrayList<>();
        for (int i = 1; i <= first.part().shards(); i++) {
            if (!byShard.containsKey(i)) {
                missing.add(Integer.toString(i));
            }
        }
        if (!missing.isEmpty()) {
            throw new IllegalArgumentException(folder + ": missing shard" + (missing.size() > 1 ? "s " : " ")
                + String.join(", ", missing) + " of " + first.part().shards() + " (run them with check FILE --shard I/"
                + first.part().shards() + ")");
        }
        if (!toolVersion.equals(first.run().toolVersion())) {
            throw new IllegalArgumentException(folder + ": the shards were simulated by tool version "
                + first.run().toolVersion() + ", this is " + toolVersion + "; merge with the same version");
        }
        return new ShardSet(folder, byShard, first);
    }

    /** @return the identity of the run the shards belong to */
    public RunIdentity identity() {
        return first.run();
    }

    /** @return N, the number of shards of the run */
    public int shards() {
        return first.part().shards();
    }

    /** @return the build that simulated the shards, or null if their files do not say */
    public String build() {
        return first.build();
    }

    /** @return the largest number of threads a shard used */
    int threads() {
        return byShard.values().stream().mapToInt(c -> c.header().threads()).max().orElse(1);
    }

    /**
     * Checks that the shards hold exactly the units of this plan, shard by shard, and returns their tallies.
     *
     * @param units the experiment's units
     * @return the tallies by unit
     * @throws IllegalArgumentException naming the first shard file that does not fit the plan
     */
    Map<WorkPlan.Unit, SimulationResult> tallies(List<WorkPlan.Unit> units) {
        int n = first.part().shards();
        Map<WorkPlan.Unit, SimulationResult> tallies = new LinkedHashMap<>();
        for (int i = 1; i <= n; i++) {
            UnitFile.Content s = byShard.get(i);
            List<WorkPlan.Unit> expected = WorkPlan.shard(units, i, n);
            Path file = folder.resolve(new Part(i, n).fileName());
            if (s.header().unitsTotal() != units.size() || s.units().size() != expected.size()) {
                throw new IllegalArgumentException(file + " holds " + s.units().size() + " units of "
                    + s.header().unitsTotal() + ", but shard " + i + " of this experiment has " + expected.size()
                    + " of " + units.size());
            }
            for (int k = 0; k < expected.size(); k++) {
                WorkPlan.Unit u = expected.get(k);
                UnitFile.UnitTally t = s.units().get(k);
                if (!t.is(u)) {
                    throw new IllegalArgumentException(file + ": unit " + (k + 1) + " is " + t.describe()
                        + ", but this experiment's shard " + i + " has " + UnitFile.UnitTally.of(u, t.tally()).describe()
                        + " there");
                }
                tallies.put(u, t.tally());
            }
        }
        return tallies;
    }

    private static void sameRun(Path folder, UnitFile.Header first, String firstName, UnitFile.Header h, String name) {
        if (h.part().shards() != first.part().shards()) {
            throw new IllegalArgumentException(folder + " mixes runs cut into " + first.part().shards() + " and "
                + h.part().shards() + " shards (" + firstName + ", " + name + "); delete the stale files");
        }
        RunIdentity a = first.run();
        RunIdentity b = h.run();
        mismatch(folder, "experiment file SHA-256", a.experimentSha256(), b.experimentSha256(), firstName, name);
        mismatch(folder, "seed", Long.toString(a.seed()), Long.toString(b.seed()), firstName, name);
        mismatch(folder, "tool version", a.toolVersion(), b.toolVersion(), firstName, name);
        mismatch(folder, "claims file SHA-256", String.valueOf(a.claimsSha256()), String.valueOf(b.claimsSha256()),
            firstName, name);
        if (!Objects.equals(first.build(), h.build())) {
            throw new IllegalArgumentException(folder + ": shards from different builds: " + firstName + " was simulated "
                + "by build " + first.build() + ", " + name + " by " + h.build() + "; re-run the shards of one build "
                + "(check FILE --shard I/N with the same jar)");
        }
    }

    private static void mismatch(Path folder, String what, String a, String b, String nameA, String nameB) {
        if (!Objects.equals(a, b)) {
            throw new IllegalArgumentException(folder + ": shards from different runs: " + nameA + " has " + what + " "
                + a + ", " + nameB + " has " + b);
        }
    }

    /** The shard files by file name, in name order. */
    private static Map<String, UnitFile.Content> readAll(Path folder) {
        if (!Files.isDirectory(folder)) {
            throw new IllegalArgumentException(folder + " does not exist: no shards to merge (run check FILE --shard "
                + "I/N --out DIR first)");
        }
        List<Path> files = new ArrayList<>();
        try (Stream<Path> s = Files.list(folder)) {
            s.filter(p -> p.getFileName().toString().endsWith(".json")
                && !p.getFileName().toString().startsWith(".")).sorted().forEach(files::add);
        } catch (IOException ex) {
            throw new UncheckedIOException(ex);
        }
        if (files.isEmpty()) {
            throw new IllegalArgumentException(folder + " holds no shard files (shard-I-of-N.json)");
        }
        Map<String, UnitFile.Content> all = new LinkedHashMap<>();
        for (Path f : files) {
            all.put(f.getFileName().toString(), UnitFile.read(f, KIND));
        }
        return all;
    }
}
