package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reprise.run.Checkpoint;

/**
 * Interrupts a real {@code check} run in a child JVM (kill -9 and SIGTERM) after exactly one of its three
 * units is checkpointed, resumes it, and compares the data files byte for byte with an uninterrupted run.
 * The child runs with the run layer's test hold ({@code -Dreprise.run.holdAfterUnits=1}): once it has
 * saved one unit it stops making progress and waits, so the kill always lands between units 1 and 2
 * however fast the machine is. The experiment has two cases and three units (the second case's 3e8
 * rounds are cut into two units of 1.5e8).
 */
class KillAndResumeTest {

    static final String EXPERIMENT = String.join("\n",
        "experiment: kill-me",
        "pairs:",
        "  - {name: keepers, x: tft, y: gtft}",
        "grid:",
        "  noise: [0.01]",
        "  rounds: [100, 3000]",
        "replicates: 100000",
        "seed: 11",
        // the reference and resumed runs assert exit 0: at alpha = 1e-4 with Holm's correction a true model
        // gives a false alarm with probability at most 1e-4 (stated false-failure budget)
        "alpha: 0.0001",
        "snapshots: [1, 10]",
        "");
    static final List<String> DATA = List.of("results.csv", "cases.csv", "curves.csv");
    /** The run layer's test hold (reprise.run.TestHold): stop after this many units saved. */
    static final String HOLD = "reprise.run.holdAfterUnits";

    @TempDir
    static Path tmp;
    static Path file;
    static Path reference;

    @BeforeAll
    static void uninterruptedRun() throws IOException {
        file = tmp.resolve("kill-me.yaml");
        Files.writeString(file, EXPERIMENT);
        reference = tmp.resolve("reference");
        assertEquals(Main.OK, run("check", file.toString(), "--out", reference.toString(), "--threads", "2", "--quiet"));
    }

    private static int run(String... args) {
        return run(new StringWriter(), args);
    }

    private static int run(StringWriter err, String... args) {
        return Main.run(args, new PrintWriter(new StringWriter()), new PrintWriter(err));
    }

    /** Starts the run in a child JVM held after one unit, kills it there; returns the child's exit code. */
    private static int startAndInterrupt(Path out, boolean forcibly) throws IOException, InterruptedException {
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        Process p = new ProcessBuilder(java, "-D" + HOLD + "=1", "-cp", System.getProperty("java.class.path"),
            "reprise.cli.Main", "check", file.toString(), "--out", out.toString(), "--threads", "2", "--quiet")
            .redirectOutput(ProcessBuilder.Redirect.DISCARD).redirectError(ProcessBuilder.Redirect.DISCARD).start();
        Path units = out.resolve(Checkpoint.FOLDER);
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
        while (Checkpoint.of(out).size() == 0) {
            if (!p.isAlive()) {
                fail("the run ended (exit " + p.exitValue() + ") before a unit was saved in " + units);
            }
            if (System.nanoTime() > deadline) {
                p.destroyForcibly();
                fail("no unit was saved within 60 s");
            }
            Thread.sleep(10);
        }
        assertTrue(p.isAlive(), "the run did not wait after its first unit");
        if (forcibly) {
            p.destroyForcibly();
        } else {
            p.destroy();
        }
        assertTrue(p.waitFor(30, TimeUnit.SECONDS));
        return p.exitValue();
    }

    private static void assertInterruptedAndResumes(Path out, int exit) throws IOException {
        assertTrue(exit != 0, "the run was not interrupted (exit " + exit + ")");
        assertFalse(Files.exists(out.resolve("run.json")), "an interrupted run looks finished");
        int saved = Checkpoint.of(out).size();
        assertEquals(1, saved, "units saved");
        for (String name : DATA) {
            assertFalse(Files.exists(out.resolve(name)), name + " written before the run finished");
        }
        assertEquals(Main.OK, run("check", file.toString(), "--out", out.toString(), "--resume", "--threads", "2",
            "--quiet"));
        for (String name : DATA) {
            assertArrayEquals(Files.readAllBytes(reference.resolve(name)), Files.readAllBytes(out.resolve(name)), name);
        }
        assertFalse(Files.exists(out.resolve(Checkpoint.FOLDER)), "checkpoint left after the resumed run");
        try (Stream<Path> s = Files.list(out)) {
            assertFalse(s.anyMatch(p -> p.getFileName().toString().endsWith(".partial")), "temporary file left");
        }
    }

    @Test
    void killMinusNineThenResumeGivesIdenticalFiles() throws Exception {
        Path out = tmp.resolve("killed");
        int exit = startAndInterrupt(out, true);
        Path copy = tmp.resolve("killed-copy");
        copyTree(out, copy);
        assertInterruptedAndResumes(out, exit);
        refusals(copy);
    }

    @Test
    void sigtermThenResumeGivesIdenticalFiles() throws Exception {
        Path out = tmp.resolve("terminated");
        assertInterruptedAndResumes(out, startAndInterrupt(out, false));
    }

    /** A checkpoint is only continued with --resume, and only by the same experiment file and seed. */
    private static void refusals(Path out) throws IOException {
        byte[] before = listing(out);
        StringWriter err = new StringWriter();
        assertEquals(Main.BAD_INPUT, run(err, "check", file.toString(), "--out", out.toString(), "--quiet"));
        assertTrue(err.toString().contains("holds an interrupted run") && err.toString().contains("use --resume")
            && err.toString().contains("--force"), err.toString());

        Path otherSeed = tmp.resolve("other-seed.yaml");
        Files.writeString(otherSeed, EXPERIMENT.replace("seed: 11", "seed: 12"));
        err = new StringWriter();
        assertEquals(Main.BAD_INPUT, run(err, "check", otherSeed.toString(), "--out", out.toString(), "--resume",
            "--quiet"));
        assertTrue(err.toString().contains("was written by a different run (seed 11, now 12)"), err.toString());

        Path edited = tmp.resolve("edited.yaml");
        Files.writeString(edited, EXPERIMENT.replace("noise: [0.01]", "noise: [0.02]"));
        err = new StringWriter();
        assertEquals(Main.BAD_INPUT, run(err, "check", edited.toString(), "--out", out.toString(), "--resume",
            "--quiet"));
        assertTrue(err.toString().contains("the experiment file has changed since"), err.toString());
        assertArrayEquals(before, listing(out), "a refused run changed the folder");
    }

    private static byte[] listing(Path dir) throws IOException {
        try (Stream<Path> s = Files.walk(dir)) {
            StringBuilder sb = new StringBuilder();
            for (Path p : (Iterable<Path>) s.sorted()::iterator) {
                sb.append(dir.relativize(p)).append(' ').append(Files.isRegularFile(p) ? Files.size(p) : -1).append('\n');
            }
            return sb.toString().getBytes();
        }
    }

    private static void copyTree(Path from, Path to) throws IOException {
        try (Stream<Path> s = Files.walk(from)) {
            for (Path p : (Iterable<Path>) s.sorted()::iterator) {
                Path q = to.resolve(from.relativize(p).toString());
                if (Files.isDirectory(p)) {
                    Files.createDirectories(q);
                } else {
                    Files.copy(p, q);
                }
            }
        }
    }
}
