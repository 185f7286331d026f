package reprise.run;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * What the files of a sharded run say about it, without reading any tallies' numbers: which shards of N
 * have written their file, which have only a checkpoint (started, then killed, out of time or memory, or
 * still running), which have nothing, and whether the merge has written its results.
 *
 * @param dir the output folder
 * @param shards N (0 when no file names it)
 * @param done shards with a shard file of this N, in order
 * @param partial shards with a checkpoint but no file, and the units saved there
 * @param missing shards with neither
 * @param otherCuts shard files of another N (stale files a merge would refuse)
 * @param merged whether the output folder holds a finished run (run.json)
 */
public record ShardStatus(Path dir, int shards, List<Integer> done, Map<Integer, Integer> partial,
    List<Integer> missing, List<String> otherCuts, boolean merged) {

    private static final Pattern FILE = Pattern.compile("shard-(\\d+)-of-(\\d+)\\.json");
    private static final Pattern CHECKPOINT = Pattern.compile("\\.checkpoint-(\\d+)-of-(\\d+)");

    /** Copies the collections. */
    public ShardStatus {
        done = List.copyOf(done);
        partial = Map.copyOf(partial);
        missing = List.copyOf(missing);
        otherCuts = List.copyOf(otherCuts);
    }

    /**
     * Reads the state of a sharded run from its folder.
     *
     * @param dir the output folder (holding shards/)
     * @param shards N, or 0 to take it from the files (the largest N among shard files, else checkpoints)
     * @return the state
     */
    public static ShardStatus read(Path dir, int shards) {
        Path folder = dir.resolve(OutputFolder.SHARDS);
        Map<Integer, List<Integer>> files = new TreeMap<>();
        Map<Integer, Map<Integer, Integer>> checkpoints = new TreeMap<>();
        if (Files.isDirectory(folder)) {
            try (Stream<Path> s = Files.list(folder)) {
                for (Path p : (Iterable<Path>) s.sorted()::iterator) {
                    String name = p.getFileName().toString();
                    Matcher f = FILE.matcher(name);
                    Matcher c = CHECKPOINT.matcher(name);
                    if (f.matches() && Files.isRegularFile(p)) {
                        files.computeIfAbsent(Integer.parseInt(f.group(2)), k -> new ArrayList<>())
                            .add(Integer.parseInt(f.group(1)));
                    } else if (c.matches() && Files.isDirectory(p)) {
                        int n = Integer.parseInt(c.group(2));
                        checkpoints.computeIfAbsent(n, k -> new TreeMap<>()).put(Integer.parseInt(c.group(1)),
                            Checkpoint.in(p, new Part(1, 1)).size());
                    }
                }
            } catch (IOException ex) {
                throw new UncheckedIOException(ex);
            }
        }
        int n = shards;
        if (n == 0) {
            n = !files.isEmpty() ? ((TreeMap<Integer, List<Integer>>) files).lastKey()
                : !checkpoints.isEmpty() ? ((TreeMap<Integer, Map<Integer, Integer>>) checkpoints).lastKey() : 0;
        }
        List<Integer> done = new ArrayList<>(files.getOrDefault(n, List.of()));
        done.sort(null);
        Map<Integer, Integer> partial = new TreeMap<>(checkpoints.getOrDefault(n, Map.of()));
        partial.keySet().removeAll(done);
        List<Integer> missing = new ArrayList<>();
        for (int i = 1; i <= n; i++) {
            if (!done.contains(i) && !partial.containsKey(i)) {
                missing.add(i);
            }
        }
        List<String> other = new ArrayList<>();
        int cut = n;
        files.forEach((k, v) -> {
            if (k != cut) {
                v.forEach(i -> other.add("shard-" + i + "-of-" + k + ".json"));
            }
        });
        return new ShardStatus(dir, n, done, partial, missing, other, Files.isRegularFile(dir.resolve("run.json")));
    }

    /**
     * @param shards shard numbers, e.g. [1, 2, 3, 7]
     * @return them as a Slurm array list, e.g. {@code 1-3,7}
     */
    public static String ranges(List<Integer> shards) {
        List<String> parts = new ArrayList<>();
        for (int i = 0; i < shards.size();) {
            int j = i;
            while (j + 1 < shards.size() && shards.get(j + 1) == shards.get(j) + 1) {
                j++;
            }
            parts.add(j == i ? Integer.toString(shards.get(i)) : shards.get(i) + "-" + shards.get(j));
            i = j + 1;
        }
        return String.join(",", parts);
    }
}
