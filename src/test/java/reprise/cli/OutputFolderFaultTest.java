package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermission;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reprise.run.Checkpoint;
import reprise.run.OutputFolder;

/**
 * Faults around the output folder, through the real entry point: a full disk, two runs into one folder, a
 * stale lock, {@code --force} beside a user's own file, and the umask. No external source: these are the
 * tool's own promises (README, "Reliability").
 */
class OutputFolderFaultTest {

    static final Path TINY = Path.of("src/test/resources/reprise/ok/tiny.yaml");
    /** The run layer's test hold (reprise.run.TestHold): stop after this many units saved. */
    static final String HOLD = "reprise.run.holdAfterUnits";
    /** The output layer's fault hook (reprise.output.AtomicFiles): writing this file fails as on a full disk. */
    static final String FAIL = "reprise.output.failWriting";

    @TempDir
    Path tmp;

    record Run(int code, String out, String err) {
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Run(code, out.toString(), err.toString());
    }

    static String java() {
        return Path.of(System.getProperty("java.home"), "bin", "java").toString();
    }

    /**
     * A disk that fills up while results.csv is written (after curves.csv and the figures): exit 3 in one
     * line naming the file, no results.csv (nor a part of it) under its final name, no temporary file
     * left, and no run.json (the run does not look finished).
     */
    @Test
    void aFullDiskFailsInOneLineAndTruncatesNothing() throws IOException {
        Path out = tmp.resolve("full");
        System.setProperty(FAIL, "results.csv");
        Run r;
        try {
            r = run("check", TINY.toString(), "--out", out.toString(), "--quiet");
        } finally {
            System.clearProperty(FAIL);
        }
        assertEquals(Main.INTERNAL, r.code(), r.err());
        assertEquals("reprise check: cannot write " + out.resolve("results.csv") + ": no space left on device",
            r.err().strip());
        assertFalse(Files.exists(out.resolve("results.csv")));
        assertFalse(Files.exists(out.resolve("run.json")));
        assertTrue(Files.size(out.resolve("curves.csv")) > 0);
        try (Stream<Path> s = Files.walk(out)) {
            assertFalse(s.anyMatch(p -> p.getFileName().toString().endsWith(".partial")), "temporary file left");
        }
        // the units are kept: the run resumes to a finished folder once there is room again
        assertTrue(Checkpoint.of(out).size() > 0);
        Run again = run("check", TINY.toString(), "--out", out.toString(), "--quiet", "--resume");
        assertEquals(Main.OK, again.code(), again.err());
        assertTrue(Files.exists(out.resolve("run.json")));
    }

    /**
     * Two runs into one folder: the first (a child process, held after its only unit by the test hold)
     * holds the lock; the second is refused in one line naming the holder's process id, host and start
     * time, and changes nothing. Then the holder is killed with SIGKILL: its lock file stays, but the
     * operating system has released its lock, so the next run takes it over and finishes.
     */
    @Test
    void aSecondRunIsRefusedAndAStaleLockIsTakenOver() throws Exception {
        Path out = tmp.resolve("shared");
        Process first = new ProcessBuilder(java(), "-D" + HOLD + "=1", "-cp", System.getProperty("java.class.path"),
            "reprise.cli.Main", "check", TINY.toString(), "--out", out.toString(), "--threads", "1", "--quiet")
            .redirectOutput(ProcessBuilder.Redirect.DISCARD).redirectError(ProcessBuilder.Redirect.DISCARD).start();
        try {
            long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
            while (Checkpoint.of(out).size() == 0) {
                if (!first.isAlive()) {
                    fail("the first run ended (exit " + first.exitValue() + ") before it saved a unit");
                }
                if (System.nanoTime() > deadline) {
                    fail("no unit was saved within 60 s");
                }
                Thread.sleep(10);
            }
            List<String> before = listing(out);
            Run second = run("check", TINY.toString(), "--out", out.toString(), "--quiet", "--force");
            assertEquals(Main.BAD_INPUT, second.code(), second.err());
            assertEquals(1, second.err().strip().lines().count(), second.err());
            assertTrue(second.err().startsWith("reprise check: " + TINY + ": --out: " + out + " is in use by another "
                + "run (pid " + first.pid() + " on host "), second.err());
            assertTrue(second.err().contains(", started 20"), second.err());
            assertEquals(before, listing(out), "the refused run changed the folder");
        } finally {
            first.destroyForcibly();
            assertTrue(first.waitFor(30, TimeUnit.SECONDS));
        }
        assertTrue(Files.exists(out.resolve(OutputFolder.LOCK)), "the stale lock file");
        assertTrue(Files.readString(out.resolve(OutputFolder.LOCK)).contains("pid " + first.pid() + "\n"));
        Run third = run("check", TINY.toString(), "--out", out.toString(), "--quiet", "--resume");
        assertEquals(Main.OK, third.code(), third.err());
        assertTrue(Files.exists(out.resolve("run.json")));
        assertTrue(Files.readString(out.resolve(OutputFolder.LOCK)).contains("pid " + ProcessHandle.current().pid()
            + "\n"));
    }

    /**
     * {@code --force} removes the previous run's files, those its run.json lists, and nothing else: a
     * user's own file inside figures/ (and beside the results) stays; figures of the old run that the new
     * run does not draw are gone, so the folder never mixes two runs.
     */
    @Test
    void forceRemovesOnlyWhatTheOldRunListed() throws IOException {
        Path out = tmp.resolve("forced");
        assertEquals(Main.OK, run("check", TINY.toString(), "--out", out.toString(), "--quiet").code());
        List<String> oldFigures = names(out.resolve("figures"));
        assertFalse(oldFigures.isEmpty());
        Files.writeString(out.resolve("figures").resolve("my-notes.txt"), "mine\n");
        Files.writeString(out.resolve("notes.md"), "also mine\n");
        Path other = tmp.resolve("other.yaml");
        Files.writeString(other, Files.readString(TINY).replace("name: p,", "name: q,"));
        Run r = run("check", other.toString(), "--out", out.toString(), "--quiet", "--force");
        assertEquals(Main.OK, r.code(), r.err());
        assertEquals("mine\n", Files.readString(out.resolve("figures").resolve("my-notes.txt")));
        assertEquals("also mine\n", Files.readString(out.resolve("notes.md")));
        List<String> now = names(out.resolve("figures"));
        for (String f : oldFigures) {
            // the manifest is rewritten by the new run under the same name; every old figure must be gone
            assertFalse(now.contains(f) && !f.equals("manifest.csv"), "old figure left: " + f);
        }
        String manifest = Files.readString(out.resolve("figures").resolve("manifest.csv"));
        for (String f : oldFigures) {
            assertTrue(f.equals("manifest.csv") || !manifest.contains(f), "the new manifest lists an old figure: " + f);
        }
        assertTrue(now.size() > 1, now.toString());
    }

    /**
     * With umask 002 (a group-shared folder) every file the run writes is group-writable and readable:
     * results, report, run.json, figures and the lock file. Run in a child shell, where the umask can be
     * set; skipped where there is no POSIX shell.
     */
    @Test
    void resultFilesHonourTheUmask() throws Exception {
        Path sh = Path.of("/bin/sh");
        if (!Files.isExecutable(sh)) {
            return;
        }
        Path out = tmp.resolve("shared-group");
        Process p = new ProcessBuilder(sh.toString(), "-c", "umask 002 && exec \"$0\" -cp \"$1\" reprise.cli.Main check "
            + "\"$2\" --out \"$3\" --quiet", java(), System.getProperty("java.class.path"), TINY.toString(),
            out.toString()).redirectOutput(ProcessBuilder.Redirect.DISCARD).redirectErrorStream(true).start();
        assertTrue(p.waitFor(120, TimeUnit.SECONDS));
        assertEquals(Main.OK, p.exitValue());
        List<Path> files = new ArrayList<>();
        try (Stream<Path> s = Files.walk(out)) {
            s.filter(Files::isRegularFile).forEach(files::add);
        }
        assertTrue(files.contains(out.resolve(OutputFolder.LOCK)));
        assertTrue(files.stream().anyMatch(f -> f.getParent().endsWith("figures")), files.toString());
        for (Path f : files) {
            Set<PosixFilePermission> perms = Files.getPosixFilePermissions(f);
            assertTrue(perms.contains(PosixFilePermission.GROUP_READ) && perms.contains(PosixFilePermission.GROUP_WRITE)
                && perms.contains(PosixFilePermission.OTHERS_READ), f + " is " + perms);
        }
    }

    private static List<String> names(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    private static List<String> listing(Path dir) throws IOException {
        List<String> names = new ArrayList<>();
        try (Stream<Path> s = Files.walk(dir)) {
            s.forEach(p -> {
                try {
                    names.add(dir.relativize(p) + (Files.isRegularFile(p) ? " " + Files.size(p) : ""));
                } catch (IOException ex) {
                    throw new java.io.UncheckedIOException(ex);
                }
            });
        }
        names.sort(null);
        return names;
    }
}
