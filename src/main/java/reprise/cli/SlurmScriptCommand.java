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
import java.util.Locale;
import java.util.Map;
import java.util.OptionalLong;
import java.util.concurrent.Callable;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.experiment.Experiment;
import reprise.output.AtomicFiles;
import reprise.run.Job;
import reprise.run.Probe;
import reprise.run.WorkPlan;

/**
 * {@code slurm-script}: writes a ready-to-submit batch script that runs an experiment as a Slurm job
 * array of N shards plus a merge job that waits for the whole array ({@code --dependency=afterok}).
 *
 * <p>Implementation note (the resource estimate). The units are cut for N shards
 * ({@link WorkPlan#units(Experiment, List, int)}). Let R be the expected rounds of the largest shard, u its
 * units, b the largest heap of one unit's tallies ({@link Probe#tallyBytes()}), U the experiment's units and
 * C its cases. The rate r (rounds per second per core) is {@code --rate}, or measured by a probe of about
 * {@code --probe} seconds on this machine ({@link Probe}); s = {@value #SAFETY} is the safety factor on
 * every time (nodes slower than the submitting machine, a busy file system, a cold JIT compiler). A task gets
 * <ul>
 * <li>cpus = min({@value #MAX_CPUS}, max(1, ceil(R / (r * 3600)))), so a task's simulation is about an
 * hour at most before the cap;</li>
 * <li>time = max(5 min, s * R / (r * cpus) + 60 s for the JVM start and the files), rounded up to a
 * minute;</li>
 * <li>heap = 128 MB + 16 MB per cpu + (cpus + 1 + 3u) b, and at least 2 (cpus + 1) b (the simulator
 * refuses tallies above half the heap), rounded up to 64 MB; mem = heap + {@value #NON_HEAP_MB} MB for
 * the JVM outside the heap (metaspace, code cache, thread stacks), rounded up to 64 MB. The task's
 * {@code -Xmx} is the memory Slurm grants ({@code SLURM_MEM_PER_NODE}) minus {@value #NON_HEAP_MB} MB, so a
 * re-run with a larger {@code --mem} raises the heap too.</li>
 * </ul>
 * The merge job gets M = {@code --merge-cpus}, by default min({@value #MERGE_CPUS}, C), cpus (it joins and analyses cases and draws figures in
 * parallel), heap 256 MB + 64 MB per cpu + 3 U b, and time max(5 min, 60 s + s (C t / M + U * 1 ms)), t the
 * probe's seconds per case (2 s with {@code --rate}), 1 ms per unit for reading the shard files.
 */
@Command(name = "slurm-script", mixinStandardHelpOptions = true,
    description = {"Writes a batch script that runs FILE on a Slurm cluster: a job array of N tasks, task I "
        + "running check FILE --shard I/N --out DIR, and a merge job that starts when every task has succeeded "
        + "(--dependency=afterok) and writes the same results as an unsharded check into DIR.",
        "Submit with: bash SCRIPT (it calls sbatch for the array and the merge job). Re-run failed tasks only "
        + "with: bash SCRIPT --array=3,7 (options go to the array's sbatch; a new merge job follows them).",
        "With more tasks than units, units are cut finer so that every task works. Time, memory and CPUs "
        + "per task come from a short measured probe (or --rate) and the plan; see the comment in the script."})
final class SlurmScriptCommand implements Callable<Integer> {

    /** Rate assumed when a probe cannot measure one, rounds per second per core. */
    static final double FALLBACK_RATE = 5e6;
    /** Safety factor on the estimated times. */
    static final double SAFETY = 3;
    /** The most CPUs asked for one task or the merge. */
    static final int MAX_CPUS = 8;
    /** The default CPUs of the merge job, at most. */
    static final int MERGE_CPUS = 4;
    /** Memory the JVM uses outside the heap, MB. */
    static final int NON_HEAP_MB = 192;
    /** Seconds per case of a merge assumed with {@code --rate} (no probe). */
    static final double DEFAULT_CASE_SECONDS = 2;
    /** The MaxArraySize of Slurm's default configuration (slurm.conf documentation; from memory). */
    static final long DEFAULT_MAX_ARRAY_SIZE = 1001;
    private static final String SITE_VALUE = "[A-Za-z0-9_.,:|&*!()\\[\\]@+=/-]+";

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "FILE", description = "The experiment file (YAML).")
    Path file;

    @Option(names = "--tasks", required = true, paramLabel = "N", description = "Array tasks (shards), at least 1.")
    int tasks;

    @Option(names = "--throttle", paramLabel = "K", description = "Run at most K tasks at once (--array=1-N%%K).")
    Integer throttle;

    @Option(names = "--out", paramLabel = "DIR", description = "Output folder of the run (default: the file's "
        + "output:, or results/NAME).")
    Path out;

    @Option(names = "--partition", paramLabel = "P", description = "Slurm partition, for the array and the merge job.")
    String partition;

    @Option(names = "--account", paramLabel = "A", description = "Slurm account, for the array and the merge job.")
    String account;

    @Option(names = "--qos", paramLabel = "Q", description = "Slurm quality of service, for both jobs.")
    String qos;

    @Option(names = "--constraint", paramLabel = "C", description = "Slurm node features (--constraint), for both jobs.")
    String constraint;

    @Option(names = "--clusters", paramLabel = "C", description = "Slurm cluster(s) (--clusters), for both jobs.")
    String clusters;

    @Option(names = "--reservation", paramLabel = "R", description = "Slurm reservation, for both jobs.")
    String reservation;

    @Option(names = "--sbatch", paramLabel = "OPTION", description = "Any other sbatch option for both jobs, as "
        + "one word, e.g. --sbatch=--mail-type=FAIL (repeatable).")
    List<String> sbatch = new ArrayList<>();

    @Option(names = "--setup", paramLabel = "LINE", description = "A shell line run on the nodes before java, in "
        + "every task and the merge job, e.g. --setup 'module load java/17' (repeatable).")
    List<String> setup = new ArrayList<>();

    @Option(names = "--jar", paramLabel = "PATH", description = "The reprise jar on the cluster (default: the jar "
        + "this command runs from).")
    Path jar;

    @Option(names = "--rate", paramLabel = "R", description = "Rounds per second per core for the time estimate, "
        + "as measured on the nodes (default: measured by a short probe on this machine).")
    Double rate;

    @Option(names = "--probe", paramLabel = "SECONDS", description = "Seconds of the probe that measures the rate "
        + "(default: ${DEFAULT-VALUE}).", defaultValue = "1")
    double probeSeconds;

    @Option(names = "--merge-cpus", paramLabel = "M", description = "CPUs of the merge job (default: min(4, cases)).")
    Integer mergeCpus;

    @Option(names = "--script", paramLabel = "OUTFILE", description = "Write the script to OUTFILE (default: stdout).")
    Path script;

    /**
     * The estimate of one job.
     *
     * @param cpus cpus per task
     * @param seconds time limit
     * @param heapMb the JVM's maximum heap
     * @param memMb the memory asked of Slurm
     */
    record Estimate(int cpus, long seconds, int heapMb, int memMb) {
    }

    @Override
    public Integer call() {
        PrintWriter err = spec.commandLine().getErr();
        if (tasks < 1 || tasks > WorkPlan.MOST_SHARDS) {
            throw new IllegalArgumentException("--tasks must be between 1 and " + WorkPlan.MOST_SHARDS
                + " (the most tasks a Slurm job array can have): " + tasks);
        }
        if (mergeCpus != null && (mergeCpus < 1 || mergeCpus > 1024)) {
            throw new IllegalArgumentException("--merge-cpus must be between 1 and 1024: " + mergeCpus);
        }
        if (throttle != null && throttle < 1) {
            throw new IllegalArgumentException("--throttle must be at least 1: " + throttle);
        }
        if (rate != null && (!(rate > 0) || Double.isInfinite(rate))) {
            throw new IllegalArgumentException("--rate must be a positive number of rounds per second: " + rate);
        }
        if (!(probeSeconds > 0 && probeSeconds <= 600)) {
            throw new IllegalArgumentException("--probe must be between 0 and 600 seconds: " + probeSeconds);
        }
        Map<String, String> site = siteOptions();
        for (String line : setup) {
            if (line.contains("\n") || line.contains("\r")) {
                throw new IllegalArgumentException("--setup must be one line: " + line.replaceAll("\\R", "\\\\n"));
            }
        }
        Job job = CheckCommand.load(file, 1, err, "slurm-script");
        if (job == null) {
            return Main.BAD_INPUT;
        }
        Experiment e = job.experiment();
        Path jarPath = jar != null ? jar : runningJar();
        if (jarPath == null) {
            throw new IllegalArgumentException("--jar: this command does not run from a jar; give --jar PATH of the "
                + "reprise jar on the cluster");
        }
        List<WorkPlan.Unit> units = job.units(tasks);
        int[] owner = WorkPlan.owners(units, tasks);
        int open = Math.min(units.size(), tasks);
        double[] load = new double[open];
        int[] count = new int[open];
        for (int u = 0; u < units.size(); u++) {
            load[owner[u]] += units.get(u).expectedRounds();
            count[owner[u]]++;
        }
        int largest = 0;
        double total = 0;
        for (int s = 0; s < open; s++) {
            largest = load[s] > load[largest] ? s : largest;
            total += load[s];
        }
        double maxRounds = open == 0 ? 0 : load[largest];
        int unitsOfLargest = open == 0 ? 0 : java.util.Arrays.stream(count).max().orElse(0);

        Probe probe = rate != null ? new Probe(rate, DEFAULT_CASE_SECONDS, Probe.tallyBytes(job))
            : Probe.measure(job, probeSeconds);
        double r = probe.roundsPerSecond();
        String rateSource = rate != null ? "--rate" : "measured by a "
            + new java.math.BigDecimal(probeSeconds).stripTrailingZeros().toPlainString() + " s probe on this machine";
        if (!(r > 0) || Double.isInfinite(r)) {
            r = FALLBACK_RATE;
            rateSource = "assumed (the probe measured no rate)";
        }
        double caseSeconds = probe.caseSeconds();
        Estimate task = estimate(maxRounds, r, probe.tallyBytes(), unitsOfLargest);
        int m = mergeCpus != null ? mergeCpus : Math.min(MERGE_CPUS, e.cases().size());
        Estimate merge = mergeEstimate(e.cases().size(), units.size(), caseSeconds, probe.tallyBytes(), m);

        List<String> warnings = new ArrayList<>();
        if (tasks > units.size()) {
            warnings.add(String.format(Locale.ROOT, "%d tasks but only %d units (the experiment has %d games in "
                + "all%s): tasks %d to %d will do no work; ask for --tasks %d at most", tasks, units.size(),
                e.replicates() * e.cases().size(), units.size() >= WorkPlan.MOST_UNITS ? ", and a run is cut into at "
                    + "most about " + WorkPlan.MOST_UNITS + " units" : "", units.size() + 1, tasks, units.size()));
        }
        OptionalLong maxArray = maxArraySize(err);
        long limit = maxArray.orElse(DEFAULT_MAX_ARRAY_SIZE);
        if (tasks > limit - 1) {
            warnings.add(String.format(Locale.ROOT, "%d tasks exceed this cluster's array limit (MaxArraySize=%d%s: "
                + "task ids must be below it); sbatch will refuse the array. Ask for --tasks %d at most", tasks, limit,
                maxArray.isPresent() ? ", from scontrol show config" : ", Slurm's default; scontrol did not answer",
                limit - 1));
        }
        if (throttle == null && tasks > 1000) {
            warnings.add("a " + tasks + "-task array with no --throttle: consider --throttle K to leave room for "
                + "other users");
        }
        warnings.forEach(w -> err.println("reprise slurm-script: warning: " + w));

        Path dir = (out != null ? out : e.output()).toAbsolutePath().normalize();
        String text = render(e, units.size(), total, maxRounds, task, merge, r, rateSource, caseSeconds, site, dir,
            jarPath.toAbsolutePath().normalize(), warnings);
        if (script == null) {
            spec.commandLine().getOut().print(text);
        } else {
            AtomicFiles.writeText(script, w -> w.write(text));
            script.toFile().setExecutable(true);
            spec.commandLine().getOut().printf(Locale.ROOT, "wrote %s: %d tasks of up to %.3g rounds, %d cpus, %s, "
                + "%d MB each (rate %.3g rounds/s, %s); merge job %d cpus, %s, %d MB; submit with: bash %s%n", script,
                tasks, maxRounds, task.cpus(), hms(task.seconds()), task.memMb(), r, rateSource, merge.cpus(),
                hms(merge.seconds()), merge.memMb(), script);
        }
        return Main.OK;
    }

    /** The site options given, by sbatch option name, each checked to be one plain word. */
    private Map<String, String> siteOptions() {
        Map<String, String> site = new LinkedHashMap<>();
        Map<String, String> given = new LinkedHashMap<>();
        given.put("partition", partition);
        given.put("account", account);
        given.put("qos", qos);
        given.put("constraint", constraint);
        given.put("clusters", clusters);
        given.put("reservation", reservation);
        given.forEach((name, value) -> {
            if (value != null) {
                if (!value.matches(SITE_VALUE)) {
                    throw new IllegalArgumentException("--" + name + " must be a Slurm " + name + " (letters, digits "
                        + "and _.,:|&*!()[]@+=/-): " + value);
                }
                site.put("--" + name, value);
            }
        });
        for (String o : sbatch) {
            if (!o.matches("--[a-z][a-z-]*(=\\S+)?") || o.contains("'")) {
                throw new IllegalArgumentException("--sbatch must be one sbatch option --NAME or --NAME=VALUE, with no "
                    + "spaces or quotes: " + o);
            }
            if (o.startsWith("--array") || o.startsWith("--dependency") || o.startsWith("--wrap")) {
                throw new IllegalArgumentException("--sbatch: the script sets " + o.replaceAll("=.*", "") + " itself: "
                    + o);
            }
            site.put(o, null);
        }
        return site;
    }

    /** The sbatch words of the site options. */
    private static List<String> siteWords(Map<String, String> site) {
        List<String> words = new ArrayList<>();
        site.forEach((k, v) -> words.add(v == null ? k : k + "=" + v));
        return words;
    }

    /**
     * The resources of a task (see the class's implementation note).
     *
     * @param rounds expected rounds of the largest shard
     * @param rate rounds per second per core
     * @param tallyBytes heap bytes of one unit's tallies
     * @param units units of the shard with the most units
     * @return cpus, time limit in seconds, heap and memory in MB
     */
    static Estimate estimate(double rounds, double rate, long tallyBytes, int units) {
        int cpus = (int) Math.min(MAX_CPUS, Math.max(1, Math.ceil(rounds / (rate * 3600))));
        long seconds = roundUp((long) Math.ceil(Math.max(300, SAFETY * rounds / (rate * cpus) + 60)), 60);
        double mib = 1024.0 * 1024.0;
        int heap = (int) Math.ceil(Math.max(128 + 16.0 * cpus + (cpus + 1 + 3.0 * units) * tallyBytes / mib,
            2.0 * (cpus + 1) * tallyBytes / mib));
        heap = roundUp(heap, 64);
        return new Estimate(cpus, seconds, heap, roundUp(heap + NON_HEAP_MB, 64));
    }

    /**
     * The resources of the merge job (see the class's implementation note).
     *
     * @param cases the experiment's cases
     * @param units the experiment's units
     * @param caseSeconds seconds to join and analyse one case
     * @param tallyBytes heap bytes of one unit's tallies
     * @param cpus the merge job's cpus
     * @return cpus, time limit in seconds, heap and memory in MB
     */
    static Estimate mergeEstimate(int cases, int units, double caseSeconds, long tallyBytes, int cpus) {
        long seconds = roundUp((long) Math.ceil(Math.max(300, 60 + SAFETY * (cases * caseSeconds / cpus
            + units * 1e-3))), 60);
        int heap = roundUp((int) Math.ceil(256 + 64.0 * cpus + 3.0 * units * tallyBytes / (1024.0 * 1024.0)), 64);
        return new Estimate(cpus, seconds, heap, roundUp(heap + NON_HEAP_MB, 64));
    }

    /**
     * The cluster's MaxArraySize from {@code scontrol show config}, if scontrol answers within 10 seconds.
     *
     * @param err unused (scontrol's own messages are dropped)
     * @return the value, or empty
     */
    static OptionalLong maxArraySize(PrintWriter err) {
        try {
            Process p = new ProcessBuilder("scontrol", "show", "config").redirectErrorStream(true)
                .redirectInput(ProcessBuilder.Redirect.from(new File("/dev/null"))).start();
            if (!p.waitFor(10, TimeUnit.SECONDS)) {
                p.destroyForcibly();
                return OptionalLong.empty();
            }
            String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
            return p.exitValue() == 0 ? parseMaxArraySize(text) : OptionalLong.empty();
        } catch (IOException ex) {
            return OptionalLong.empty();
        } catch (InterruptedException ex) {
            Thread.currentThread().interrupt();
            return OptionalLong.empty();
        }
    }

    /**
     * @param config the output of {@code scontrol show config}
     * @return its MaxArraySize, or empty
     */
    static OptionalLong parseMaxArraySize(String config) {
        Matcher m = Pattern.compile("(?m)^\\s*MaxArraySize\\s*=\\s*(\\d+)\\s*$").matcher(config);
        return m.find() ? OptionalLong.of(Long.parseLong(m.group(1))) : OptionalLong.empty();
    }

    private static int roundUp(int v, int step) {
        return (v + step - 1) / step * step;
    }

    private static long roundUp(long v, long step) {
        return (v + step - 1) / step * step;
    }

    static String hms(long seconds) {
        return String.format(Locale.ROOT, "%d:%02d:%02d", seconds / 3600, seconds / 60 % 60, seconds % 60);
    }

    private static Path runningJar() {
        try {
            Path p = Path.of(Main.class.getProtectionDomain().getCodeSource().getLocation().toURI());
            return Files.isRegularFile(p) && p.toString().endsWith(".jar") ? p : null;
        } catch (java.net.URISyntaxException | SecurityException | NullPointerException ex) {
            return null;
        }
    }

    /** Quotes a word for bash. */
    static String q(Object word) {
        return "'" + word.toString().replace("'", "'\\''") + "'";
    }

    private String render(Experiment e, int units, double total, double maxRounds, Estimate t, Estimate m, double r,
        String rateSource, double caseSeconds, Map<String, String> site, Path dir, Path jarPath, List<String> warnings) {
        String name = e.name().replaceAll("[^A-Za-z0-9_.-]", "_");
        Path experiment = file.toAbsolutePath().normalize();
        Path logs = dir.resolve("slurm");
        String self = script == null ? "THIS_SCRIPT" : script.toString();
        List<String> siteWords = siteWords(site);
        List<String> l = new ArrayList<>();
        l.add("#!/bin/bash");
        l.add("# Sharded run of experiment " + e.name() + " on Slurm, written by reprise slurm-script " + Main.version()
            + ".");
        l.add("#   experiment file " + experiment + " (SHA-256 " + e.sha256() + ", seed " + e.seed() + ")");
        l.add(String.format(Locale.ROOT, "#   %d units, %.4g expected rounds in all; %d tasks, the largest %.4g rounds",
            units, total, tasks, maxRounds));
        l.add(String.format(Locale.ROOT, "#   rate %.3g rounds/s per core (%s), safety factor %.0f on times", r,
            rateSource, SAFETY));
        l.add(String.format(Locale.ROOT, "#   each task: %d cpus, %s, heap %d MB, mem %d MB", t.cpus(), hms(t.seconds()),
            t.heapMb(), t.memMb()));
        l.add(String.format(Locale.ROOT, "#   merge job: %d cpus, %s (%.2g s per case), heap %d MB, mem %d MB", m.cpus(),
            hms(m.seconds()), caseSeconds, m.heapMb(), m.memMb()));
        warnings.forEach(w -> l.add("#   WARNING: " + w));
        l.add("#");
        l.add("# Submit the array and the merge job:       bash " + self);
        l.add("# See which shards are done or missing:     java -jar " + jarPath + " status " + dir);
        l.add("# Re-run only failed tasks, then merge:     bash " + self + " --array=3,7");
        l.add("#   (options after the script name go to the array's sbatch; a re-run task resumes from its checkpoint;");
        l.add("#   scancel the old merge job if it is still pending with reason DependencyNeverSatisfied)");
        l.add("# Results: " + dir + " (shard files in " + dir.resolve("shards") + ", job logs in " + logs + ").");
        l.add("# REPRISE_COMMAND, if set when submitting, replaces 'java -Xmx... -jar JAR' (words split on spaces).");
        l.add("#SBATCH --job-name=reprise-" + name);
        l.add("#SBATCH --array=1-" + tasks + (throttle != null ? "%" + throttle : ""));
        l.add("#SBATCH --ntasks=1");
        l.add("#SBATCH --cpus-per-task=" + t.cpus());
        l.add("#SBATCH --mem=" + t.memMb() + "M");
        l.add("#SBATCH --time=" + hms(t.seconds()));
        l.add("#SBATCH --output=" + logs.resolve("shard-%a-job-%A.out"));
        siteWords.forEach(w -> l.add("#SBATCH " + w));
        l.add("set -euo pipefail");
        l.add("command_words() {");
        l.add("  if [[ -n ${REPRISE_COMMAND:-} ]]; then");
        l.add("    read -r -a cmd <<<\"$REPRISE_COMMAND\"");
        l.add("  else");
        l.add("    cmd=(java \"-Xmx$1\" -jar " + q(jarPath) + ")");
        l.add("  fi");
        l.add("}");
        l.add("if [[ -n ${SLURM_ARRAY_TASK_ID:-} ]]; then");
        setup.forEach(s -> l.add("  " + s));
        l.add("  # the heap follows the memory Slurm granted (a re-run with --mem=... raises both)");
        l.add("  command_words \"$(( ${SLURM_MEM_PER_NODE:-" + t.memMb() + "} - " + NON_HEAP_MB + " ))m\"");
        l.add("  exec \"${cmd[@]}\" check " + q(experiment) + " --shard \"$SLURM_ARRAY_TASK_ID/" + tasks
            + "\" --out " + q(dir) + " --threads " + t.cpus() + " --quiet");
        l.add("fi");
        l.add("self=$(realpath \"$0\")");
        l.add("mkdir -p " + q(logs));
        l.add("site=(" + String.join(" ", siteWords.stream().map(SlurmScriptCommand::q).toList()) + ")");
        l.add("# The merge job is its own file, written now and copied by sbatch at submission: moving or");
        l.add("# regenerating this script later does not change what a pending merge job runs.");
        l.add("merge_script=" + q(logs) + "/merge-$(date -u +%Y%m%dT%H%M%S)-$$.sh");
        l.add("command_words " + m.heapMb() + "m");
        l.add("{");
        l.add("  echo '#!/bin/bash'");
        l.add("  echo 'set -euo pipefail'");
        if (!setup.isEmpty()) {
            l.add("  cat <<'REPRISE_SETUP'");
            l.addAll(setup);
            l.add("REPRISE_SETUP");
        }
        l.add("  printf 'exec'");
        l.add("  printf ' %q' \"${cmd[@]}\" merge " + q(dir) + " --force --threads " + m.cpus());
        l.add("  echo");
        l.add("} >\"$merge_script\"");
        l.add("# Ask Slurm whether it would take the merge job before queueing the array, so that a merge job the");
        l.add("# site refuses (account, partition, too many cpus) fails now and not after the array is queued.");
        l.add("if ! why=$(sbatch --test-only " + "--ntasks=1 --cpus-per-task=" + m.cpus() + " --mem=" + m.memMb() + "M --time=" + hms(m.seconds())
            + " \"${site[@]}\"" + " \"$merge_script\" 2>&1 </dev/null); then");
        l.add("  echo \"the merge job would be refused, nothing submitted: $why\" >&2");
        l.add("  exit 1");
        l.add("fi");
        l.add("array=$(sbatch --parsable \"${site[@]}\" \"$@\" \"$self\" </dev/null)");
        l.add("array=${array%%;*}");
        l.add("merge=$(sbatch --parsable --dependency=afterok:\"$array\" --job-name=reprise-" + name + "-merge "
            + "--ntasks=1 --cpus-per-task=" + m.cpus() + " --mem=" + m.memMb() + "M --time=" + hms(m.seconds())
            + " \"${site[@]}\" --output=" + q(logs.resolve("merge-job-%j.out")) + " \"$merge_script\" </dev/null)");
        l.add("merge=${merge%%;*}");
        l.add("echo \"array $array merge $merge tasks " + tasks + " script $self submitted $(date -u +%Y-%m-%dT%H:%M:%SZ) "
            + "$*\" >>"
            + q(logs.resolve("jobs")));
        l.add("echo \"submitted array job $array and merge job $merge (after the array succeeds)\"");
        return String.join("\n", l) + "\n";
    }
}
