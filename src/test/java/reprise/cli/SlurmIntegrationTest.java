package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
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
 * A real job array on a real Slurm: the script of {@code slurm-script} is submitted with 4 tasks and the
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

    static Map<String, String> slurmEnvironment() throws IOException {
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
            unavailable("squeue does not answer with SLURM_CONF=" + conf + ": " + q.out().strip());
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

    @Test
    void jobArrayMergesToTheUnshardedResults() throws Exception {
        Map<String, String> env = slurmEnvironment();
        Path experiment = tmp.resolve("small.yaml");
        Files.writeString(experiment, ShardsTest.SMALL.replace("seed: 77", "seed: 4242"));
        Path reference = tmp.resolve("unsharded");
        ShardsTest.Run ref = ShardsTest.run("check", experiment.toString(), "--out", reference.toString(), "--quiet");
        assertEquals(0, ref.code(), ref.err());

        Path out = tmp.resolve("cluster");
        Path script = tmp.resolve("submit.sh");
        ShardsTest.Run made = ShardsTest.run("slurm-script", experiment.toString(), "--tasks", "4", "--out",
            out.toString(), "--jar", tmp.resolve("not-used.jar").toString(), "--script", script.toString());
        assertEquals(0, made.code(), made.err());
        // The jar is built after the test phase, so the jobs run the CLI from the classes on this test's classpath.
        String javaBin = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        String classpath = Path.of("target", "classes").toAbsolutePath() + File.pathSeparator
            + System.getProperty("java.class.path");
        env.put("REPRISE_COMMAND", javaBin + " -cp " + classpath + " reprise.cli.Main");

        long t0 = System.nanoTime();
        Result submitted = exec(env, 30, "bash", script.toString());
        Matcher m = Pattern.compile("submitted array job (\\d+) and merge job (\\d+)").matcher(submitted.out());
        assertTrue(submitted.code() == 0 && m.find(), "submission failed: " + submitted.out());
        String arrayId = m.group(1);
        String mergeId = m.group(2);

        Map<String, String[]> states = poll(env, arrayId, mergeId, out);
        double wall = (System.nanoTime() - t0) / 1e9;
        System.out.printf(Locale.ROOT, "slurm: 4-task array %s + merge %s finished in %.1f s%n", arrayId,
            mergeId, wall);

        List<String> problems = new ArrayList<>();
        for (int i = 1; i <= 4; i++) {
            String[] s = states.get(arrayId + "_" + i);
            if (s == null || !s[0].equals("COMPLETED")) {
                problems.add("task " + i + ": " + (s == null ? "no record" : s[0] + " " + s[1]));
            }
            if (!Files.isRegularFile(out.resolve("shards").resolve("shard-" + i + "-of-4.json"))) {
                problems.add("no shard file " + i);
            }
        }
        String[] merge = states.get(mergeId);
        if (merge == null || !merge[0].equals("COMPLETED")) {
            problems.add("merge job: " + (merge == null ? "no record" : merge[0] + " " + merge[1]));
        }
        if (!problems.isEmpty()) {
            fail(String.join("; ", problems) + "\n" + logs(out));
        }
        try (Stream<Path> s = Files.list(out.resolve("shards"))) {
            assertEquals(4, s.count(), "exactly the 4 shard files");
        }
        for (String f : ShardsTest.COMPARED) {
            assertTrue(Files.isRegularFile(out.resolve(f)), f + " missing after the merge job\n" + logs(out));
            assertArrayEquals(Files.readAllBytes(reference.resolve(f)), Files.readAllBytes(out.resolve(f)), f);
        }
    }

    /** Polls every half second until the 4 task records and the merge job record are all finished. */
    static Map<String, String[]> poll(Map<String, String> env, String arrayId, String mergeId, Path out)
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
            boolean done = states.size() == 5 && states.values().stream().allMatch(s -> TERMINAL.contains(s[0]));
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
