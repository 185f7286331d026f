package reprise.run;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.InetAddress;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.OverlappingFileLockException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Stream;
import reprise.experiment.InputFiles;
import reprise.output.AtomicFiles;

/**
 * The output folder of a run: checked before anything is simulated or written, then locked and prepared
 * once every check has passed.
 *
 * <p>The lock: a run (and a merge) holds an operating-system lock ({@link FileChannel#tryLock}) on the
 * file {@value #LOCK} in the folder from before it prepares the folder until it has written its last
 * file, so two runs never share a folder; a second run is refused in one line that says who holds the
 * lock (process id, host and start time, which the holder writes into the file). The operating system
 * releases the lock when its process ends however it ends (kill -9 included), so a lock file left by a
 * process that is gone is simply taken over. The file itself stays (deleting it would let a third run
 * lock a new file while a second still holds the old one). Shard runs write only their own shard file
 * and take no folder lock. On a file system that offers no locks at all, the run goes on unlocked.
 */
public final class OutputFolder {

    /** The files a finished run writes into the output folder (besides figures/). */
    public static final List<String> OUTPUTS = List.of("results.csv", "cases.csv", "curves.csv", "report.md",
        "run.json");
    /** The folder of shard files inside the output folder. */
    public static final String SHARDS = "shards";
    /** The longest name of one folder that common file systems (ext4, XFS, NTFS, APFS) allow, in bytes. */
    static final int MOST_NAME_BYTES = 255;
    /** The lock file in the output folder. */
    public static final String LOCK = ".reprise.lock";

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
        if (Files.exists(dir.resolve(LOCK), LinkOption.NOFOLLOW_LINKS) && !Files.isRegularFile(dir.resolve(LOCK),
            LinkOption.NOFOLLOW_LINKS)) {
            throw new IllegalArgumentException(where + ": " + dir.resolve(LOCK) + " is not a regular file; the run keeps "
                + "its lock in a file of that name");
        }
        for (String name : List.of("figures", Checkpoint.FOLDER)) {
            if (Files.exists(dir.resolve(name)) && !Files.isDirectory(dir.resolve(name))) {
                throw new IllegalArgumentException(where + ": " + dir.resolve(name) + " is a file; the run needs a "
                    + "folder of that name");
            }
        }
    }

    /**
     * Checks the folder, creates it, takes its lock, checks it again under the lock (another run may have
     * finished in it meanwhile) and prepares it ({@link #prepare}). The caller closes the lock when its last
     * file is written.
     *
     * @param where what to name in messages (the option or file field)
     * @param dir the folder
     * @param force whether a finished run may be replaced
     * @param resume whether the run resumes
     * @param more further checks to make under the lock before anything is changed (may be null)
     * @return the held lock
     * @throws IllegalArgumentException one line, if the folder does not allow the run or another run holds it
     */
    public static Lock open(String where, Path dir, boolean force, boolean resume, Runnable more) {
        check(where, dir, force, resume);
        Lock lock = Lock.take(where, dir);
        try {
            check(where, dir, force, resume);
            if (more != null) {
                more.run();
            }
            lock.record();
            prepare(dir, force);
            return lock;
        } catch (RuntimeException ex) {
            lock.close();
            throw ex;
        }
    }

    /**
     * Creates the output folder once every check has passed. With {@code force} the previous run's
     * results are removed first, so the folder never mixes two runs: the files its run.json lists (the
     * fixed output names and its figures), nothing else; a user's own file inside figures/ stays.
     * Temporary files of a write that was killed are removed too.
     *
     * @param dir the folder
     * @param force whether to remove a previous run's results
     * @throws IllegalArgumentException if the folder cannot be written
     */
    public static void prepare(Path dir, boolean force) {
        try {
            AtomicFiles.createFolders(dir);
            if (force) {
                for (Path p : previousOutputs(dir)) {
                    Files.deleteIfExists(p);
                }
            }
            for (Path folder : List.of(dir, dir.resolve("figures"))) {
                if (!Files.isDirectory(folder)) {
                    continue;
                }
                try (Stream<Path> old = Files.list(folder)) {
                    for (Path p : (Iterable<Path>) old::iterator) {
                        String name = p.getFileName().toString();
                        if (name.startsWith(".") && name.endsWith(".partial") && Files.isRegularFile(p)) {
                            Files.deleteIfExists(p);
                        }
                    }
                }
            }
        } catch (IOException | UnsupportedOperationException ex) {
            throw new IllegalArgumentException("--out: cannot write into " + dir + ": " + ex.getMessage(), ex);
        }
    }

    /**
     * The files of the previous run in a folder: those its run.json lists, if each is one of the fixed
     * output names or a file directly inside figures/ (a listed path that leads elsewhere is ignored);
     * without a readable run.json, the fixed output names only.
     */
    static List<Path> previousOutputs(Path dir) {
        Set<Path> out = new LinkedHashSet<>();
        OUTPUTS.forEach(n -> out.add(dir.resolve(n)));
        Path runJson = dir.resolve("run.json");
        if (Files.isRegularFile(runJson)) {
            try {
                JsonNode listed = new ObjectMapper().readTree(InputFiles.text(runJson, "run.json")).path("outputs");
                for (JsonNode n : listed) {
                    Path rel = Path.of(n.asText()).normalize();
                    boolean fixed = rel.getNameCount() == 1 && OUTPUTS.contains(rel.toString());
                    boolean figure = rel.getNameCount() == 2 && rel.getName(0).toString().equals("figures")
                        && !rel.isAbsolute();
                    if (n.isTextual() && (fixed || figure) && Files.isRegularFile(dir.resolve(rel),
                        LinkOption.NOFOLLOW_LINKS)) {
                        out.add(dir.resolve(rel));
                    }
                }
            } catch (IOException | RuntimeException ex) {
                // an unreadable run.json: only the fixed names are removed
            }
        }
        return List.copyOf(out);
    }

    /** The held lock on an output folder; closing it releases the lock (the file stays). */
    public static final class Lock implements AutoCloseable {

        private final Path file;
        private final FileChannel channel;
        private final FileLock lock;

        private Lock(Path file, FileChannel channel, FileLock lock) {
            this.file = file;
            this.channel = channel;
            this.lock = lock;
        }

        /** Creates the folder and takes its lock, or refuses naming the holder. */
        static Lock take(String where, Path dir) {
            Path file = dir.resolve(LOCK);
            FileChannel ch = null;
            try {
                AtomicFiles.createFolders(dir);
                ch = FileChannel.open(file, StandardOpenOption.CREATE, StandardOpenOption.READ,
                    StandardOpenOption.WRITE);
                FileLock l;
                boolean held;
                try {
                    l = ch.tryLock();
                    held = l == null;
                } catch (OverlappingFileLockException ex) {
                    l = null;
                    held = true;
                } catch (IOException ex) {
                    // a file system without locks (Lustre without flock, NFS without a lock service):
                    // refusing every run there would be worse than running unlocked
                    l = null;
                    held = false;
                }
                if (held) {
                    ch.close();
                    throw new IllegalArgumentException(where + ": " + dir + " is in use by another run (" + holder(file)
                        + "); wait for it to end, or use another folder");
                }
                return new Lock(file, ch, l);
            } catch (java.nio.file.AccessDeniedException | UnsupportedOperationException ex) {
                closeQuietly(ch);
                throw new IllegalArgumentException(where + ": cannot lock " + file + ": " + (ex instanceof IOException
                    ? "permission denied" : ex.getMessage()), ex);
            } catch (IOException ex) {
                closeQuietly(ch);
                String m = String.valueOf(ex.getMessage());
                throw new UncheckedIOException("cannot write " + file + ": " + (m.contains("No space left on device")
                    ? "no space left on device" : m), ex);
            }
        }

        /** Writes who holds the lock into the lock file: process id, host and start time. */
        void record() {
            String host = hostName();
            String text = "pid " + ProcessHandle.current().pid() + "\nhost " + host + "\nstarted "
                + Instant.now().truncatedTo(ChronoUnit.SECONDS) + "\n";
            try {
                channel.truncate(0);
                channel.write(ByteBuffer.wrap(text.getBytes(StandardCharsets.UTF_8)), 0);
                channel.force(false);
            } catch (IOException ex) {
                String m = String.valueOf(ex.getMessage());
                throw new UncheckedIOException("cannot write " + file + ": " + (m.contains("No space left on device")
                    ? "no space left on device" : m), ex);
            }
        }

        /** The host name, without a network look-up where the system names itself (Linux, or $HOSTNAME). */
        private static String hostName() {
            try {
                String h = Files.readString(Path.of("/proc/sys/kernel/hostname"), StandardCharsets.UTF_8).strip();
                if (!h.isEmpty()) {
                    return h;
                }
            } catch (IOException | RuntimeException ex) {
                // not Linux: fall through
            }
            String env = System.getenv("HOSTNAME");
            if (env != null && !env.isBlank()) {
                return env.strip();
            }
            try {
                return InetAddress.getLocalHost().getHostName();
            } catch (IOException ex) {
                return "unknown";
            }
        }

        /** @return e.g. "pid 4242 on host node7, started 2026-12-02T14:55:00Z", from the lock file */
        static String holder(Path file) {
            Map<String, String> f = new HashMap<>();
            try (java.io.InputStream in = Files.newInputStream(file)) {
                String text = new String(in.readNBytes(4096), StandardCharsets.UTF_8);
                for (String line : text.split("\n")) {
                    int sp = line.indexOf(' ');
                    if (sp > 0 && line.length() < 200) {
                        f.put(line.substring(0, sp), line.substring(sp + 1).strip().replaceAll("\\p{Cntrl}", "?"));
                    }
                }
            } catch (IOException | RuntimeException ex) {
                return "its lock file " + file + " cannot be read";
            }
            if (!f.containsKey("pid")) {
                return "its lock file " + file + " does not say which yet";
            }
            return "pid " + f.get("pid") + " on host " + f.getOrDefault("host", "unknown") + ", started "
                + f.getOrDefault("started", "at an unknown time");
        }

        @Override
        public void close() {
            try {
                if (lock != null) {
                    lock.release();
                }
            } catch (IOException ex) {
                // the lock goes with the channel below in any case
            }
            closeQuietly(channel);
        }

        private static void closeQuietly(FileChannel ch) {
            if (ch != null) {
                try {
                    ch.close();
                } catch (IOException ex) {
                    // nothing more can be done; the process's end releases the lock
                }
            }
        }
    }
}
