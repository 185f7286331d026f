package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A real job array on a real Slurm: the script of {@code slurm-script} is submitted with 64 tasks and the
 * dependent merge job, the test polls {@code squeue} until every job record is finished, checks the job
 * states and the shard files (exit codes alone prove nothing: a misconfigured node can report success for
 * steps that never ran), and compares the merged CSV files byte for byte with an unsharded check.
 *
 * <p>Runs when a local Slurm answers (SLURM_CONF set, or /tmp/reprise-slurm/env written by
 * {@code scripts/slurm-local.sh start}); otherwise it is skipped with the reason, unless
 * REPRISE_REQUIRE_SLURM=1 (set by {@code .ci/run}), where a missing Slurm is a failure.
 */
class SlurmIntegrationTest {

    static final Path ENV_FILE = Path.of("/tmp/reprise-slurm/env");
    static final long TIMEOUT_SECONDS = 180;
    static final Set<String> TERMINAL = Set.of("COMPLETED", "FAILED", "CANCELLED", "TIMEOUT", "NODE_FAIL",
        "OUT_OF_MEMORY", "PREEMPTED", "BOOT_FAIL", "DEADLINE");

    @TempDir
    Path tmp;

    static void unavailable(String why) {
        if ("1".equals(System.getenv("REPRISE_REQUIRE_SLURM"))) {
            fail("REPRISE_REQUIRE_SLURM=1 but " + why);
        }
        Assumptions.assumeTrue(false, "no local Slurm, skipped: " + why
            + " (start one with: bash scripts/slurm-local.sh start </dev/null)");
    }

    /** Why Slurm was found unavailable, once per class, so that every test does not wait for squeue again. */
    private static String unavailableBecause;

    static Map<String, String> slurmEnvironment() throws IOException {
        if (unavailableBecause != null) {
            unavailable(unavailableBecause);
        }
        String conf = System.getenv("SLURM_CONF");
        if (conf == null && Files.isRegularFile(ENV_FILE)) {
            for (String line : Files.readAllLines(ENV_FILE)) {
                if (line.startsWith("export SLURM_CONF=")) {
                    conf = line.substring("export SLURM_CONF=".length()).trim();
                }
            }
        }
        if (conf == null) {
            unavailable("SLURM_CONF is not set and " + ENV_FILE + " does not exist");
        }
        Map<String, String> env = new LinkedHashMap<>(System.getenv());
        env.keySet().removeIf(k -> k.startsWith("SLURM_"));
        env.put("SLURM_CONF", conf);
        env.put("PATH", "/usr/bin:/usr/sbin:/bin:/sbin:" + env.getOrDefault("PATH", ""));
        Result q = exec(env, 15, "squeue", "-h");
        if (q.code() != 0) {
            unavailableBecause = "squeue does not answer with SLURM_CONF=" + conf + ": " + q.out().strip();
            unavailable(unavailableBecause);
        }
        return env;
    }

    record Result(int code, String out) {
    }

    static Result exec(Map<String, String> env, long seconds, String... command) throws IOException {
        ProcessBuilder pb = new ProcessBuilder(command).redirectErrorStream(true)
            .redirectInput(ProcessBuilder.Redirect.from(new File("/dev/null")));
        pb.environment().clear();
        pb.environment().putAll(env);
        Process p;
        try {
            p = pb.start();
        } catch (IOException ex) {
            return new Result(127, ex.getMessage());
        }
        try {
            if (!p.waitFor(seconds, TimeUnit.SECONDS)) {
                p.destroyForcibly();
                return new Result(124, "timed out after " + seconds + " s: " + String.join(" ", command));
            }
        } catch (InterruptedException ex) {
            Thread.currentThread().interrupt();
            p.destroyForcibly();
            return new Result(130, "interrupted");
        }
        return new Result(p.exitValue(), new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8));
    }

    /** The command the jobs run: the CLI from this test's classes (the jar is built after the test phase). */
    static String command(String... properties) {
        String javaBin = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        String classpath = Path.of("target", "classes").toAbsolutePath() + File.pathSeparator
            + System.getProperty("java.class.path");
        // C1 only: tasks are a second or two, where JVM start-up and compilation dominate; results do not depend on it
        return javaBin + " -XX:TieredStopAtLevel=1 -XX:+UseSerialGC " + String.join(" ", properties) + " -cp " + classpath
            + " reprise.cli.Main";
    }

    static String[] submit(Map<String, String> env, Path script, String... sbatchOptions) throws IOException {
        List<String> cmd = new ArrayList<>(List.of("bash", script.toString()));
        cmd.addAll(List.of(sbatchOptions));
        Result submitted = exec(env, 30, cmd.toArray(String[]::new));
        Matcher m = Pattern.compile("submitted array job (\\d+) and merge job (\\d+)").matcher(submitted.out());
        assertTrue(submitted.code() == 0 && m.find(), "submission failed: " + submitted.out());
        return new String[] {m.group(1), m.group(2)};
    }

    /**
     * 64 tasks of a 4-case file whose unsharded cut has 4 units: the units are cut finer (at least 128), every
     * task writes a shard with work in it, and the merge job's files equal an unsharded check's byte for byte.
     */
    @Test
    void sixtyFourTasksAllWorkAndMergeToTheUnshardedResults() throws Exception {
        Map<String, String> env = slurmEnvironment();
        int tasks = 64;
        Path experiment = tmp.resolve("small.yaml");
        Files.writeString(experiment, ShardsTest.SMALL.replace("seed: 77", "seed: 4242"));
        Path reference = tmp.resolve("unsharded");
        ShardsTest.Run ref = ShardsTest.run("check", experiment.toString(), "--out", reference.toString(), "--quiet");
        assertEquals(0, ref.code(), ref.err());

        Path out = tmp.resolve("cluster");
        Path script = tmp.resolve("submit.sh");
        ShardsTest.Run made = ShardsTest.run("slurm-script", experiment.toString(), "--tasks", "" + tasks, "--out",
            out.toString(), "--jar", tmp.resolve("not-used.jar").toString(), "--rate", "5e7", "--merge-cpus", "2",
            "--setup", "echo setup-line-ran", "--script", script.toString());
        assertEquals(0, made.code(), made.err());
        env.put("REPRISE_COMMAND", command());

        long t0 = System.nanoTime();
        String[] ids = submit(env, script);
        Map<String, String[]> states = poll(env, ids[0], ids[1], out, tasks);
        double wall = (System.nanoTime() - t0) / 1e9;
        System.out.printf(Locale.ROOT, "slurm: %d-task array %s + merge %s finished in %.1f s%n", tasks, ids[0], ids[1],
            wall);

        List<String> problems = new ArrayList<>();
        for (int i = 1; i <= tasks; i++) {
            String[] s = states.get(ids[0] + "_" + i);
            if (s == null || !s[0].equals("COMPLETED")) {
                problems.add("task " + i + ": " + (s == null ? "no record" : s[0] + " " + s[1]));
            }
            Path shard = out.resolve("shards").resolve("shard-" + i + "-of-" + tasks + ".json");
            if (!Files.isRegularFile(shard)) {
                problems.add("no shard file " + i);
            } else if (Json.MAPPER.readTree(shard.toFile()).get("units").size() < 1) {
                problems.add("shard " + i + " did no work");
            }
        }
        String[] merge = states.get(ids[1]);
        if (merge == null || !merge[0].equals("COMPLETED")) {
            problems.add("merge job: " + (merge == null ? "no record" : merge[0] + " " + merge[1]));
        }
        if (!problems.isEmpty()) {
            fail(String.join("; ", problems) + "\n" + logs(out));
        }
        try (Stream<Path> s = Files.list(out.resolve("shards"))) {
            assertEquals(tasks, s.count(), "exactly the shard files, no checkpoint left");
        }
        for (String f : ShardsTest.COMPARED) {
            assertTrue(Files.isRegularFile(out.resolve(f)), f + " missing after the merge job\n" + logs(out));
            assertArrayEquals(Files.readAllBytes(reference.resolve(f)), Files.readAllBytes(out.resolve(f)), f);
        }
        for (String log : List.of("shard-64-job-" + ids[0] + ".out", "merge-job-" + ids[1] + ".out")) {
            assertTrue(Files.readString(out.resolve("slurm").resolve(log)).startsWith("setup-line-ran\n"), log);
        }
        ShardsTest.Run status = ShardsTest.run("status", out.toString());
        assertEquals(0, status.code(), status.out() + status.err());
        assertTrue(status.out().contains(tasks + " shards: " + tasks + " done") && status.out().contains("next: nothing"),
            status.out());

        // The tasks recorded their build; a shard from another build is refused by the merge in one line.
        Path seven = out.resolve("shards").resolve("shard-7-of-" + tasks + ".json");
        com.fasterxml.jackson.databind.node.ObjectNode o = (com.fasterxml.jackson.databind.node.ObjectNode)
            Json.MAPPER.readTree(seven.toFile());
        assertEquals(reprise.run.Build.current(), o.get("build").asText(), "the tasks ran this test's classes");
        o.put("build", "jar-sha256 " + "0".repeat(64));
        o.put("sha256", reprise.run.UnitFile.checksum(o)); // a shard of another build, not an edited one
        Files.writeString(seven, Json.MAPPER.writeValueAsString(o));
        ShardsTest.Run mixed = ShardsTest.run("merge", out.toString(), "--force");
        assertEquals(Main.BAD_INPUT, mixed.code(), mixed.err());
        assertEquals(1, mixed.err().strip().lines().count(), mixed.err());
        assertTrue(mixed.err().contains("shards from different builds: ") && mixed.err().contains("shard-7-of-64.json by "
            + "jar-sha256 " + "0".repeat(64)), mixed.err());
    }

    /**
     * Tasks killed mid-run (held after one saved unit by the run layer's test hold, then cancelled), the merge
     * job left waiting (afterok can never be satisfied), then the re-run the status view names: each task
     * takes back its checkpointed unit, and the merged files equal an unsharded check's.
     */
    @Test
    void killedTasksRerunResumeFromTheirCheckpoints() throws Exception {
        Map<String, String> env = slurmEnvironment();
        Path experiment = tmp.resolve("resume.yaml");
        Files.writeString(experiment, ShardsTest.SMALL.replace("seed: 77", "seed: 515"));
        Path reference = tmp.resolve("unsharded");
        assertEquals(0, ShardsTest.run("check", experiment.toString(), "--out", reference.toString(), "--quiet").code());
        Path out = tmp.resolve("cluster");
        Path script = tmp.resolve("submit.sh");
        assertEquals(0, ShardsTest.run("slurm-script", experiment.toString(), "--tasks", "2", "--out", out.toString(),
            "--jar", tmp.resolve("not-used.jar").toString(), "--rate", "5e7", "--merge-cpus", "1", "--script",
            script.toString()).code());

        env.put("REPRISE_COMMAND", command("-Dreprise.run.holdAfterUnits=1"));
        String[] first = submit(env, script);
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(TIMEOUT_SECONDS);
        for (int i = 1; i <= 2; i++) {
            Path checkpoint = out.resolve("shards").resolve(".checkpoint-" + i + "-of-2");
            while (!hasUnit(checkpoint)) {
                if (System.nanoTime() > deadline) {
                    exec(env, 10, "scancel", first[0], first[1]);
                    fail("no unit saved in " + checkpoint + "\n" + logs(out));
                }
                Thread.sleep(200);
            }
        }
        exec(env, 10, "scancel", first[0]);
        String mergeState = waitForMergeToBeStuck(env, first[1]);
        Path firstLog = out.resolve("slurm").resolve("shard-1-job-" + first[0] + ".out");
        long logDeadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(30);
        while (!(Files.isRegularFile(firstLog) && Files.readString(firstLog).contains("interrupted; 1 of 2 units are saved"))
            && System.nanoTime() < logDeadline) {
            Thread.sleep(200);
        }
        assertTrue(Files.readString(firstLog).contains("interrupted; 1 of 2 units are saved in "
            + out.resolve("shards").resolve(".checkpoint-1-of-2") + "; run the same command again"), logs(out));
        ShardsTest.Run status = ShardsTest.run("status", out.toString());
        assertTrue(status.out().contains("2 shards: 0 done, 2 started but unfinished"), status.out());
        assertTrue(mergeState.equals("PENDING") || mergeState.equals("CANCELLED"), mergeState);
        assertTrue(status.out().contains("bash " + script.toAbsolutePath() + " --array=1-2\n"), status.out());
        exec(env, 10, "scancel", first[1]);

        env.put("REPRISE_COMMAND", command());
        String[] again = submit(env, script, "--array=1-2");
        Map<String, String[]> states = poll(env, again[0], again[1], out, 2);
        String[] merge = states.get(again[1]);
        if (merge == null || !merge[0].equals("COMPLETED")) {
            fail("merge job after the re-run: " + (merge == null ? "no record" : merge[0]) + "\n" + logs(out));
        }
        for (int i = 1; i <= 2; i++) {
            String log = Files.readString(out.resolve("slurm").resolve("shard-" + i + "-job-" + again[0] + ".out"));
            assertTrue(log.contains("(1 taken back from the shard's checkpoint)"), log);
        }
        for (String f : ShardsTest.COMPARED) {
            assertArrayEquals(Files.readAllBytes(reference.resolve(f)), Files.readAllBytes(out.resolve(f)), f);
        }
    }

    /** A merge job the cluster cannot run (more cpus than the node has) is refused before the array is queued. */
    @Test
    void aMergeJobTheClusterRefusesQueuesNothing() throws Exception {
        Map<String, String> env = slurmEnvironment();
        Path experiment = tmp.resolve("small.yaml");
        Files.writeString(experiment, ShardsTest.SMALL);
        Path out = tmp.resolve("cluster");
        Path script = tmp.resolve("submit.sh");
        assertEquals(0, ShardsTest.run("slurm-script", experiment.toString(), "--tasks", "2", "--out", out.toString(),
            "--jar", tmp.resolve("not-used.jar").toString(), "--rate", "5e7", "--merge-cpus", "512", "--script",
            script.toString()).code());
        String before = exec(env, 15, "squeue", "-h", "-o", "%i").out();
        Result r = exec(env, 30, "bash", script.toString());
        assertEquals(1, r.code(), r.out());
        assertTrue(r.out().contains("the merge job would be refused, nothing submitted: "), r.out());
        assertEquals(before, exec(env, 15, "squeue", "-h", "-o", "%i").out(), "no job queued");
        assertFalse(Files.exists(out.resolve("slurm").resolve("jobs")), "no submission recorded");
    }

    static boolean hasUnit(Path checkpoint) throws IOException {
        if (!Files.isDirectory(checkpoint)) {
            return false;
        }
        try (Stream<Path> s = Files.list(checkpoint)) {
            return s.anyMatch(p -> p.getFileName().toString().endsWith(".json"));
        }
    }

    /**
     * Waits until the merge job of a cancelled array shows what a user sees: pending with reason
     * DependencyNeverSatisfied (afterok), or cancelled (kill_invalid_depend); returns PENDING or the end state.
     */
    static String waitForMergeToBeStuck(Map<String, String> env, String mergeId) throws Exception {
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
        while (System.nanoTime() < deadline) {
            Result q = exec(env, 15, "squeue", "-h", "-t", "all", "-j", mergeId, "-o", "%T %r");
            String s = q.out().strip();
            if (s.startsWith("PENDING") && s.contains("DependencyNeverSatisfied")) {
                return "PENDING";
            }
            if (TERMINAL.contains(s.split("\\s+")[0])) {
                return s.split("\\s+")[0];
            }
            Thread.sleep(250);
        }
        fail("merge job " + mergeId + " neither waits with DependencyNeverSatisfied nor ended within 60 s");
        return null;
    }

    /** Polls every half second until the task records and the merge job record are all finished. */
    static Map<String, String[]> poll(Map<String, String> env, String arrayId, String mergeId, Path out, int tasks)
        throws Exception {
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(TIMEOUT_SECONDS);
        while (true) {
            Result q = exec(env, 15, "squeue", "-h", "-r", "-t", "all", "-j", arrayId + "," + mergeId, "-o",
                "%i %T %r");
            Map<String, String[]> states = new LinkedHashMap<>();
            if (q.code() == 0) {
                for (String line : q.out().strip().split("\\R")) {
                    String[] f = line.trim().split("\\s+", 3);
                    if (f.length >= 2) {
                        states.put(f[0], new String[] {f[1], f.length > 2 ? f[2] : ""});
                    }
                }
            }
            boolean done = states.size() == tasks + 1 && states.values().stream().allMatch(s -> TERMINAL.contains(s[0]));
            if (done) {
                return states;
            }
            String[] merge = states.get(mergeId);
            if (merge != null && merge[1].contains("DependencyNeverSatisfied")) {
                exec(env, 10, "scancel", mergeId);
                fail("an array task failed, so merge job " + mergeId + " can never start: " + describe(states) + "\n"
                    + logs(out));
            }
            if (System.nanoTime() > deadline) {
                exec(env, 10, "scancel", arrayId, mergeId);
                fail("jobs not finished after " + TIMEOUT_SECONDS + " s: " + describe(states) + "\n" + logs(out));
            }
            Thread.sleep(500);
        }
    }

    static String describe(Map<String, String[]> states) {
        List<String> parts = new ArrayList<>();
        states.forEach((id, s) -> parts.add(id + " " + s[0] + " " + s[1]));
        return String.join(", ", parts);
    }

    static String logs(Path out) throws IOException {
        Path dir = out.resolve("slurm");
        if (!Files.isDirectory(dir)) {
            return "(no job logs in " + dir + ")";
        }
        StringBuilder sb = new StringBuilder();
        try (Stream<Path> s = Files.list(dir)) {
            for (Path p : (Iterable<Path>) s.sorted()::iterator) {
                sb.append("----- ").append(p).append('\n').append(Files.readString(p));
            }
        }
        return sb.toString();
    }
}
