package reprise.cli;

import java.io.File;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.concurrent.Callable;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.run.ShardStatus;

/**
 * {@code status}: the state of a sharded run from its files ({@link ShardStatus}) and, when the folder
 * records a submission by a {@code slurm-script} script ({@code DIR/slurm/jobs}) and Slurm answers, from
 * {@code sacct} (or {@code squeue} where accounting is off), followed by the next command to run.
 */
@Command(name = "status", mixinStandardHelpOptions = true,
    description = {"Shows which shards of a sharded run in DIR are done (shard file written), started but "
        + "unfinished (a checkpoint: killed, out of time or memory, or still running) or missing, whether the merge "
        + "has run, and the Slurm states of the last submission when sacct or squeue answers; then the next command.",
        "Exit 0 when the run is merged, 1 when it is not yet, 2 for bad input."})
final class StatusCommand implements Callable<Integer> {

    private static final Pattern JOBS = Pattern.compile("array (\\S+) merge (\\S+) tasks (\\d+) script (.*) submitted "
        + "(\\S+).*");

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "DIR", description = "The output folder of the sharded run.")
    Path dir;

    @Option(names = "--tasks", paramLabel = "N", description = "The run's number of shards (default: from the "
        + "submission record or the files).")
    Integer tasks;

    /** The last submission recorded by a slurm-script script. */
    record Submission(String array, String merge, int tasks, String script) {
    }

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        if (!Files.isDirectory(dir)) {
            throw new IllegalArgumentException(dir + " is not a folder (give the --out folder of the sharded run)");
        }
        if (tasks != null && tasks < 1) {
            throw new IllegalArgumentException("--tasks must be at least 1: " + tasks);
        }
        Submission sub = lastSubmission(dir.resolve("slurm").resolve("jobs"));
        int n = tasks != null ? tasks : sub != null ? sub.tasks() : 0;
        ShardStatus st = ShardStatus.read(dir, n);
        if (st.shards() == 0) {
            throw new IllegalArgumentException(dir + " holds no shard files, checkpoints or submission record; give "
                + "--tasks N, or run the shards first");
        }
        out.printf("%s: %d shards: %d done, %d started but unfinished, %d not started; %s%n", dir, st.shards(),
            st.done().size(), st.partial().size(), st.missing().size(), st.merged() ? "merged (run.json written)"
                : "not merged");
        if (!st.partial().isEmpty()) {
            List<String> p = new ArrayList<>();
            st.partial().forEach((i, k) -> p.add(i + " (" + k + " units saved)"));
            out.println("  unfinished (a re-run resumes from the checkpoint): " + String.join(", ", p));
        }
        if (!st.missing().isEmpty()) {
            out.println("  not started or lost before a unit was saved: " + ShardStatus.ranges(st.missing()));
        }
        if (!st.otherCuts().isEmpty()) {
            out.println("  stale shard files of another N (a merge refuses them; delete them): "
                + String.join(", ", st.otherCuts()));
        }
        Map<String, String> states = sub == null ? Map.of() : slurmStates(sub);
        if (sub != null) {
            out.println("  slurm: array job " + sub.array() + ", merge job " + sub.merge() + " (" + dir.resolve("slurm")
                .resolve("jobs") + ")" + (states.isEmpty() ? "; sacct and squeue did not answer" : ""));
            Map<String, List<Integer>> byState = new TreeMap<>();
            states.forEach((id, s) -> {
                if (id.startsWith(sub.array() + "_")) {
                    try {
                        byState.computeIfAbsent(s, k -> new ArrayList<>()).add(Integer.parseInt(id.substring(
                            sub.array().length() + 1)));
                    } catch (NumberFormatException ignored) {
                        // a pending range such as 123_[4-9] is summarised by squeue's own line
                        byState.computeIfAbsent(s, k -> new ArrayList<>());
                    }
                }
            });
            byState.forEach((s, ids) -> {
                ids.sort(null);
                out.println("    tasks " + s + ": " + (ids.isEmpty() ? "(a pending range)" : ShardStatus.ranges(ids)));
            });
            if (states.containsKey(sub.merge())) {
                out.println("    merge job: " + states.get(sub.merge()));
            }
        }
        out.println("next: " + next(st, sub, states));
        return st.merged() ? Main.OK : Main.DISAGREES;
    }

    private String next(ShardStatus st, Submission sub, Map<String, String> states) {
        List<Integer> todo = new ArrayList<>(new TreeSet<>(st.partial().keySet()));
        todo.addAll(st.missing());
        todo.sort(null);
        String mergeState = sub == null ? null : states.get(sub.merge());
        boolean mergePending = mergeState != null && (mergeState.startsWith("PENDING") || mergeState.startsWith("RUNNING"));
        boolean neverStarts = mergeState != null && mergeState.contains("DependencyNeverSatisfied");
        List<String> running = new ArrayList<>();
        states.forEach((id, s) -> {
            if (sub != null && id.startsWith(sub.array() + "_") && (s.startsWith("RUNNING") || s.startsWith("PENDING"))) {
                running.add(id);
            }
        });
        if (st.merged()) {
            return "nothing: the results are in " + st.dir();
        }
        if (todo.isEmpty()) {
            return mergePending && !neverStarts ? "wait for merge job " + sub.merge() + " (" + mergeState + "), or run: "
                + "reprise merge " + st.dir() : "reprise merge " + st.dir();
        }
        if (!running.isEmpty()) {
            return "wait: " + running.size() + " task(s) still pending or running; then run reprise status " + st.dir()
                + " again";
        }
        String rerun = sub != null ? "bash " + sub.script() + " --array=" + ShardStatus.ranges(todo)
            : "for each shard I in " + ShardStatus.ranges(todo) + ": reprise check FILE --shard I/" + st.shards()
                + " --out " + st.dir() + "; then reprise merge " + st.dir();
        return (mergePending ? "scancel " + sub.merge() + "; " : "") + rerun;
    }

    static Submission lastSubmission(Path jobs) throws IOException {
        if (!Files.isRegularFile(jobs)) {
            return null;
        }
        Submission last = null;
        for (String line : Files.readAllLines(jobs, StandardCharsets.UTF_8)) {
            Matcher m = JOBS.matcher(line.strip());
            if (m.matches()) {
                last = new Submission(m.group(1), m.group(2), Integer.parseInt(m.group(3)), m.group(4));
            }
        }
        return last;
    }

    /** Job id (e.g. 123_4) to state (with squeue's reason), from sacct, then squeue for what is still queued. */
    static Map<String, String> slurmStates(Submission sub) {
        Map<String, String> states = new LinkedHashMap<>();
        String out = exec("sacct", "-n", "-P", "-X", "-j", sub.array() + "," + sub.merge(), "-o", "JobID,State,ExitCode");
        if (out != null) {
            for (String line : out.strip().split("\\R")) {
                String[] f = line.split("\\|");
                if (f.length >= 2 && !f[0].isBlank()) {
                    states.put(f[0], f[1] + (f.length > 2 && !f[2].equals("0:0") ? " exit " + f[2] : ""));
                }
            }
        }
        out = exec("squeue", "-h", "-r", "-t", "all", "-j", sub.array() + "," + sub.merge(), "-o", "%i|%T|%r");
        if (out != null) {
            for (String line : out.strip().split("\\R")) {
                String[] f = line.split("\\|");
                if (f.length >= 2 && !f[0].isBlank()) {
                    boolean why = f.length > 2 && f[1].equals("PENDING") && !f[2].equals("None");
                    states.put(f[0], f[1] + (why ? " (" + f[2] + ")" : ""));
                }
            }
        }
        return states;
    }

    private static String exec(String... command) {
        try {
            Process p = new ProcessBuilder(command).redirectError(ProcessBuilder.Redirect.DISCARD)
                .redirectInput(ProcessBuilder.Redirect.from(new File("/dev/null"))).start();
            String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
            if (!p.waitFor(20, TimeUnit.SECONDS)) {
                p.destroyForcibly();
                return null;
            }
            return p.exitValue() == 0 ? text : null;
        } catch (IOException ex) {
            return null;
        } catch (InterruptedException ex) {
            Thread.currentThread().interrupt();
            return null;
        }
    }
}
