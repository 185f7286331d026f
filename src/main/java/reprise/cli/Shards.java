package reprise.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;
import java.util.stream.Stream;
import reprise.experiment.Case;
import reprise.experiment.CaseResult;
import reprise.experiment.Claims;
import reprise.experiment.Experiment;
import reprise.experiment.ExperimentFile;
import reprise.experiment.InvalidExperimentException;
import reprise.experiment.Runner;
import reprise.experiment.WorkPlan;
import reprise.output.ShardFile;
import reprise.sim.SimulationResult;
import reprise.sim.Simulator;

/**
 * Sharded runs: {@code check FILE --shard I/N} simulates shard I of N of the experiment's units
 * ({@link WorkPlan#shard}) and writes {@code DIR/shards/shard-I-of-N.json}; {@code merge DIR} (or
 * {@code check FILE --merge DIR}) checks that shards 1..N are all there and belong to one run, adds the
 * tallies unit by unit and writes exactly the files of an unsharded {@code check}.
 *
 * <p>Shard numbers from Slurm: without an explicit I/N, shard I is the array task id and N the array's
 * task count, for an array submitted as {@code --array=1-N}. Any other array (ids from 0, a subset such
 * as {@code --array=3,7} when re-running failed tasks, a step) is refused, because I/N could not be
 * inferred without guessing; the job scripts of {@code slurm-script} therefore pass
 * {@code --shard $SLURM_ARRAY_TASK_ID/N} explicitly.
 */
final class Shards {

    /** The {@code --shard} value (also the value of a bare {@code --shard}) that takes I/N from Slurm. */
    static final String FROM_SLURM = "slurm";

    private Shards() {
    }

    /**
     * Shard I and N from a {@code --shard} value.
     *
     * @param value "I/N", or {@value #FROM_SLURM}
     * @param env the environment (for the Slurm variables)
     * @return {I, N}
     * @throws IllegalArgumentException with a one-line reason
     */
    static int[] parse(String value, Map<String, String> env) {
        if (FROM_SLURM.equals(value)) {
            String id = env.get("SLURM_ARRAY_TASK_ID");
            if (id == null) {
                throw new IllegalArgumentException("--shard without I/N takes them from a Slurm array task, but "
                    + "SLURM_ARRAY_TASK_ID is not set; give --shard I/N");
            }
            String count = env.get("SLURM_ARRAY_TASK_COUNT");
            String min = env.get("SLURM_ARRAY_TASK_MIN");
            String max = env.get("SLURM_ARRAY_TASK_MAX");
            if (!"1".equals(min) || count == null || !count.equals(max)) {
                throw new IllegalArgumentException("--shard from Slurm needs an array submitted as --array=1-N, but "
                    + "this one has task ids " + min + " to " + max + " (" + count + " tasks); give --shard "
                    + "$SLURM_ARRAY_TASK_ID/N explicitly");
            }
            return parse(id + "/" + count, Map.of());
        }
        String[] parts = value.split("/", -1);
        try {
            if (parts.length == 2) {
                int i = Integer.parseInt(parts[0].trim());
                int n = Integer.parseInt(parts[1].trim());
                if (n >= 1 && i >= 1 && i <= n) {
                    return new int[] {i, n};
                }
            }
        } catch (NumberFormatException ignored) {
            // reported below with the value
        }
        throw new IllegalArgumentException("--shard must be I/N with 1 <= I <= N (or 'slurm'): " + value);
    }

    /** {@code check} with {@code --shard} or {@code --merge}. */
    static int fromCheck(CheckCommand cmd) {
        if (cmd.shard != null && cmd.merge != null) {
            throw new IllegalArgumentException("--shard and --merge cannot be combined: run the shards first, then "
                + "merge them");
        }
        if (cmd.resume) {
            throw new IllegalArgumentException("--resume cannot be combined with " + (cmd.shard != null ? "--shard"
                : "--merge") + ": a shard re-run replaces its own file");
        }
        List<String> args = cmd.spec.commandLine().getParseResult().originalArgs();
        if (cmd.merge != null) {
            return merge(cmd.merge, cmd.file, cmd.out, cmd.force, args, cmd.spec.commandLine().getOut(),
                cmd.spec.commandLine().getErr(), "check");
        }
        int[] in = parse(cmd.shard, System.getenv());
        return runShard(cmd, in[0], in[1]);
    }

    /** The experiment, its cases and claims, read and validated as {@code check} does. */
    private record Loaded(Experiment e, List<Case> cases, Map<Integer, Map<String, Claims.Claim>> claims) {
    }

    private static Loaded load(Path file, PrintWriter err, String command) {
        try {
            Experiment e = ExperimentFile.read(file);
            List<Case> cases = e.cases();
            Map<Integer, Map<String, Claims.Claim>> claims = e.claims() == null ? Map.of()
                : Claims.read(e.claims(), e, cases);
            Runner.preflight(e, cases, 1);
            return new Loaded(e, cases, claims);
        } catch (InvalidExperimentException ex) {
            ex.problems().forEach(line -> err.println("reprise " + command + ": " + line));
            return null;
        }
    }

    private static int runShard(CheckCommand cmd, int shard, int shards) {
        PrintWriter err = cmd.spec.commandLine().getErr();
        Loaded l = load(cmd.file, err, "check");
        if (l == null) {
            return Main.BAD_INPUT;
        }
        Experiment e = l.e();
        int nThreads = cmd.threads == null ? Runtime.getRuntime().availableProcessors() : cmd.threads;
        if (nThreads < 1) {
            throw new IllegalArgumentException("--threads must be at least 1: " + nThreads);
        }
        Path dir = cmd.out != null ? cmd.out : e.output();
        if (Files.exists(dir) && !Files.isDirectory(dir)) {
            throw new IllegalArgumentException("--out: " + dir + " is a file, not a folder");
        }
        List<WorkPlan.Unit> units = WorkPlan.units(e, l.cases());
        List<WorkPlan.Unit> mine = WorkPlan.shard(units, shard, shards);
        Map<Integer, Case> byIndex = new HashMap<>();
        l.cases().forEach(c -> byIndex.put(c.index(), c));
        double expected = mine.stream().mapToDouble(WorkPlan.Unit::expectedRounds).sum();
        CheckCommand.RunProgress progress = new CheckCommand.RunProgress(err, !cmd.quiet, l.cases().size(), expected);
        long t0 = System.nanoTime();
        List<ShardFile.UnitTally> tallies = new ArrayList<>();
        long rounds = 0;
        for (WorkPlan.Unit u : mine) {
            Case c = byIndex.get(u.caseIndex());
            progress.startCase(c, u.caseIndex());
            SimulationResult r = Runner.runUnit(e, c, u, nThreads, progress);
            progress.endUnit(u.expectedRounds());
            tallies.add(new ShardFile.UnitTally(u.caseIndex(), u.chunk(), u.from(), u.to(), r));
            rounds += r.roundsTotal();
        }
        progress.finish();
        double seconds = (System.nanoTime() - t0) / 1e9;
        Path target = dir.resolve(ShardFile.FOLDER).resolve(ShardFile.fileName(shard, shards));
        ShardFile.write(target, new ShardFile.Shard(new ShardFile.Header(cmd.file.toAbsolutePath().normalize(),
            e.sha256(), e.claims() == null ? null : e.claims().toAbsolutePath().normalize(),
            e.claims() == null ? null : RunOutputs.sha256(e.claims()), e.seed(), Main.version(), shard, shards,
            units.size(), nThreads, seconds), tallies));
        cmd.spec.commandLine().getOut().printf(Locale.ROOT, "%s: shard %d of %d, %d of %d units, %d rounds in %.1f s; "
            + "wrote %s%n", e.name(), shard, shards, mine.size(), units.size(), rounds, seconds, target);
        return Main.OK;
    }

    /**
     * Merges the shards in {@code dir/shards} and writes the outputs of an unsharded run.
     *
     * @param dir the folder holding shards/
     * @param file the experiment file, or null for the path recorded in the shards
     * @param out the output folder, or null for {@code dir}
     * @param force whether to replace a finished run in the output folder
     * @param args the command line, for run.json
     * @param stdout data
     * @param err messages
     * @param command the command name for messages
     * @return the exit code
     */
    static int merge(Path dir, Path file, Path out, boolean force, List<String> args, PrintWriter stdout,
        PrintWriter err, String command) {
        Instant start = Instant.now();
        Path folder = dir.resolve(ShardFile.FOLDER);
        Map<Integer, List<ShardFile.Shard>> byShard = new TreeMap<>();
        Map<Integer, List<String>> names = new HashMap<>();
        List<ShardFile.Shard> shards = readAll(folder, byShard, names);
        ShardFile.Header first = shards.get(0).header();
        String firstName = ShardFile.fileName(first.shard(), first.shards());
        for (ShardFile.Shard s : shards) {
            ShardFile.Header h = s.header();
            String name = ShardFile.fileName(h.shard(), h.shards());
            if (h.shards() != first.shards()) {
                throw new IllegalArgumentException(folder + " mixes runs cut into " + first.shards() + " and "
                    + h.shards() + " shards (" + firstName + ", " + name + "); delete the stale files");
            }
            mismatch(folder, "experiment file SHA-256", first.experimentSha256(), h.experimentSha256(), firstName, name);
            mismatch(folder, "seed", Long.toString(first.seed()), Long.toString(h.seed()), firstName, name);
            mismatch(folder, "tool version", first.toolVersion(), h.toolVersion(), firstName, name);
            mismatch(folder, "claims file SHA-256", String.valueOf(first.claimsSha256()),
                String.valueOf(h.claimsSha256()), firstName, name);
        }
        for (Map.Entry<Integer, List<String>> en : names.entrySet()) {
            if (en.getValue().size() > 1) {
                throw new IllegalArgumentException(folder + ": shard " + en.getKey() + " of " + first.shards()
                    + " is there more than once: " + String.join(", ", en.getValue()));
            }
        }
        List<Integer> missing = new ArrayList<>();
        for (int i = 1; i <= first.shards(); i++) {
            if (!byShard.containsKey(i)) {
                missing.add(i);
            }
        }
        if (!missing.isEmpty()) {
            throw new IllegalArgumentException(folder + ": missing shard" + (missing.size() > 1 ? "s " : " ")
                + String.join(", ", missing.stream().map(String::valueOf).toList()) + " of " + first.shards()
                + " (run them with check FILE --shard I/" + first.shards() + ")");
        }
        if (!Main.version().equals(first.toolVersion())) {
            throw new IllegalArgumentException(folder + ": the shards were simulated by tool version "
                + first.toolVersion() + ", this is " + Main.version() + "; merge with the same version");
        }
        Path experimentFile = file != null ? file : first.experimentFile();
        Loaded l = load(experimentFile, err, command);
        if (l == null) {
            return Main.BAD_INPUT;
        }
        Experiment e = l.e();
        if (!e.sha256().equals(first.experimentSha256())) {
            throw new IllegalArgumentException(experimentFile + " is not the experiment file the shards ran (its "
                + "SHA-256 is " + e.sha256() + ", the shards' " + first.experimentSha256() + ")");
        }
        if (e.seed() != first.seed()) {
            throw new IllegalArgumentException(experimentFile + ": seed " + e.seed() + ", the shards ran seed "
                + first.seed());
        }
        String claimsHash = e.claims() == null ? null : RunOutputs.sha256(e.claims());
        if (!Objects.equals(claimsHash, first.claimsSha256())) {
            throw new IllegalArgumentException("the claims file " + e.claims() + " has changed since the shards ran "
                + "(SHA-256 " + claimsHash + ", the shards' " + first.claimsSha256() + ")");
        }
        List<WorkPlan.Unit> units = WorkPlan.units(e, l.cases());
        Map<WorkPlan.Unit, SimulationResult> tallies = new LinkedHashMap<>();
        for (int i = 1; i <= first.shards(); i++) {
            ShardFile.Shard s = byShard.get(i).get(0);
            List<WorkPlan.Unit> expected = WorkPlan.shard(units, i, first.shards());
            String name = ShardFile.fileName(i, first.shards());
            if (s.header().unitsTotal() != units.size() || s.units().size() != expected.size()) {
                throw new IllegalArgumentException(folder.resolve(name) + " holds " + s.units().size() + " units of "
                    + s.header().unitsTotal() + ", but shard " + i + " of this experiment has " + expected.size()
                    + " of " + units.size());
            }
            for (int k = 0; k < expected.size(); k++) {
                WorkPlan.Unit u = expected.get(k);
                ShardFile.UnitTally t = s.units().get(k);
                List<SimulationResult.ReplicateRange> ranges = t.tally().replicateRanges();
                if (!t.is(u) || ranges.size() != 1 || ranges.get(0).from() != u.from() || ranges.get(0).to() != u.to()) {
                    throw new IllegalArgumentException(folder.resolve(name) + ": unit " + (k + 1) + " is case "
                        + t.caseIndex() + " chunk " + t.chunk() + " games [" + t.from() + ", " + t.to()
                        + "), but this experiment's shard " + i + " has case " + u.caseIndex() + " chunk " + u.chunk()
                        + " games [" + u.from() + ", " + u.to() + ") there");
                }
                tallies.put(u, t.tally());
            }
        }
        Path target = out != null ? out : dir;
        CheckCommand.checkOutputFolder((out != null ? "--out" : "merge"), target, force, false);
        CheckCommand.prepareOutputFolder(target, force);
        CheckCommand.RunProgress progress = new CheckCommand.RunProgress(err, false, l.cases().size(), 0);
        List<CaseResult> results = RunOutputs.byCase(e, l.cases(), units, (c, u) -> tallies.get(u), progress);
        Runner.Outcome outcome = Runner.analyse(e, results, l.claims());
        int code = outcome.disagrees() ? Main.DISAGREES : Main.OK;
        int threads = shards.stream().mapToInt(s -> s.header().threads()).max().orElse(1);
        RunOutputs.write(target, experimentFile, args, e, results, outcome, start, code, threads);
        RunOutputs.summary(stdout, e, l.cases().size(), outcome, target);
        return code;
    }

    private static void mismatch(Path folder, String what, String a, String b, String nameA, String nameB) {
        if (!a.equals(b)) {
            throw new IllegalArgumentException(folder + ": shards from different runs: " + nameA + " has " + what + " "
                + a + ", " + nameB + " has " + b);
        }
    }

    private static List<ShardFile.Shard> readAll(Path folder, Map<Integer, List<ShardFile.Shard>> byShard,
        Map<Integer, List<String>> names) {
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
        List<ShardFile.Shard> all = new ArrayList<>();
        for (Path f : files) {
            ShardFile.Shard s = ShardFile.read(f);
            ShardFile.Header h = s.header();
            if (!(h.shards() >= 1 && h.shard() >= 1 && h.shard() <= h.shards())) {
                throw new IllegalArgumentException(f + ": shard " + h.shard() + " of " + h.shards() + " is not I/N with "
                    + "1 <= I <= N");
            }
            all.add(s);
            byShard.computeIfAbsent(h.shard(), k -> new ArrayList<>()).add(s);
            names.computeIfAbsent(h.shard(), k -> new ArrayList<>()).add(f.getFileName().toString());
        }
        return all;
    }
}
