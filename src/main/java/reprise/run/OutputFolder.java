package reprise.run;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

/**
 * The output folder of a run: checked before anything is simulated or written, then prepared once every
 * check has passed. A lock held for the whole run (so that two runs never share a folder) would be taken
 * in {@link #prepare} and released when the run ends.
 */
public final class OutputFolder {

    /** The files a finished run writes into the output folder (besides figures/). */
    public static final List<String> OUTPUTS = List.of("results.csv", "cases.csv", "curves.csv", "report.md",
        "run.json");
    /** The folder of shard files inside the output folder. */
    public static final String SHARDS = "shards";
    /** The longest name of one folder that common file systems (ext4, XFS, NTFS, APFS) allow, in bytes. */
    static final int MOST_NAME_BYTES = 255;

    private OutputFolder() {
    }

    /**
     * Checks the output folder without creating or writing anything: it is a folder or can be created
     * (its nearest existing ancestor is a writable folder), it holds no finished run unless {@code force},
     * and no output name in it is taken by something of the wrong kind.
     *
     * @param where what to name in messages (the option or file field)
     * @param dir the folder
     * @param force whether a finished run may be replaced
     * @param resume whether the run resumes (for the message)
     * @throws IllegalArgumentException one line, naming {@code where}
     */
    public static void check(String where, Path dir, boolean force, boolean resume) {
        if (dir.toString().isBlank()) {
            throw new IllegalArgumentException(where + ": must name a folder, not be empty");
        }
        Path target = dir.toAbsolutePath().normalize();
        Path existing = target;
        while (existing != null && !Files.exists(existing)) {
            String name = existing.getFileName() == null ? "" : existing.getFileName().toString();
            int bytes = name.getBytes(StandardCharsets.UTF_8).length;
            if (bytes > MOST_NAME_BYTES) {
                throw new IllegalArgumentException(where + ": " + dir + " cannot be created: a folder name of " + bytes
                    + " bytes is longer than file systems allow (" + MOST_NAME_BYTES + ")");
            }
            existing = existing.getParent();
        }
        if (existing == null) {
            throw new IllegalArgumentException(where + ": " + dir + " cannot be created: no part of the path exists");
        }
        boolean exists = existing.equals(target);
        if (!Files.isDirectory(existing)) {
            throw new IllegalArgumentException(where + ": " + dir + (exists ? " is a file, not a folder"
                : " cannot be created: " + existing + " is a file, not a folder"));
        }
        if (!Files.isWritable(existing) || !Files.isExecutable(existing)) {
            throw new IllegalArgumentException(where + ": cannot write into " + (exists ? dir.toString()
                : existing + " (to create " + dir + ")") + ": not writable (permissions or a read-only file system)");
        }
        if (exists) {
            checkContents(where, dir, force, resume);
        }
    }

    private static void checkContents(String where, Path dir, boolean force, boolean resume) {
        if (Files.exists(dir.resolve("run.json")) && !force) {
            throw new IllegalArgumentException(where + ": " + dir + " holds a finished run (run.json)"
                + (resume ? ", there is nothing to resume" : "") + "; use --force to replace it, or another --out");
        }
        for (String name : OUTPUTS) {
            if (Files.isDirectory(dir.resolve(name))) {
                throw new IllegalArgumentException(where + ": " + dir.resolve(name) + " is a folder; the run writes a "
                    + "file of that name");
            }
        }
        for (String name : List.of("figures", Checkpoint.FOLDER)) {
            if (Files.exists(dir.resolve(name)) && !Files.isDirectory(dir.resolve(name))) {
                throw new IllegalArgumentException(where + ": " + dir.resolve(name) + " is a file; the run needs a "
                    + "folder of that name");
            }
        }
    }

    /**
     * Creates the output folder once every check has passed. With {@code force} the previous run's
     * results are removed first, so the folder never mixes two runs; temporary files of a write that was
     * killed are removed too.
     *
     * @param dir the folder
     * @param force whether to remove a previous run's results
     * @throws IllegalArgumentException if the folder cannot be written
     */
    public static void prepare(Path dir, boolean force) {
        try {
            Files.createDirectories(dir);
            try (Stream<Path> old = Files.list(dir)) {
                for (Path p : (Iterable<Path>) old::iterator) {
                    String name = p.getFileName().toString();
                    boolean stale = name.startsWith(".") && name.endsWith(".partial");
                    if (stale || force && OUTPUTS.contains(name)) {
                        Files.deleteIfExists(p);
                    }
                }
            }
            if (force && Files.isDirectory(dir.resolve("figures"))) {
                try (Stream<Path> old = Files.list(dir.resolve("figures"))) {
                    for (Path p : (Iterable<Path>) old::iterator) {
                        Files.deleteIfExists(p);
                    }
                }
            }
        } catch (IOException | UnsupportedOperationException ex) {
            throw new IllegalArgumentException("--out: cannot write into " + dir + ": " + ex.getMessage(), ex);
        }
    }
}
