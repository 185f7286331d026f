package reprise.run;

import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import reprise.experiment.PopulationAnalysis;
import reprise.experiment.PopulationExperiment;
import reprise.experiment.Runner;
import reprise.output.InvasionGraph;
import reprise.output.PopulationCsv;
import reprise.output.PopulationFigures;
import reprise.output.PopulationReport;
import reprise.output.Provenance;
import reprise.sim.InvasionTally;
import reprise.sim.MutationRun;
import reprise.sim.PopulationSimulator;
import reprise.sim.Simulator;

/**
 * A population experiment run on this machine, the entry point beside {@link LocalRun} for files with a
 * {@code population:} section: checks and locks the output folder ({@link OutputFolder}), computes the
 * exact side of every grid point, plays the invasions of every question (grid point and ordered (mutant,
 * resident) pair), analyses, and writes population.csv, abundance.csv, report.md, figures/ (fixation against
 * selection strength; the invasion graph with rare mutations) and run.json.
 *
 * <p>Units: a question's invasions [0, n) are one unit, played by
 * {@link PopulationSimulator#invasions(int, int, long, long, int)} from the question's seed; each
 * invasion's stream derives from (question seed, invasion index), so the tallies are identical for any
 * number of threads. With an explicit mutation rate each grid point also plays one run of {@code updates}
 * updates from all-b (seed of the unused diagonal question (p k + 0) k + 0, stream index 0), recorded every
 * update for batch means (not checkpointed: replayed, identically, on resume). Each finished question is
 * saved at once in {@link PopulationCheckpoint}; {@code --resume} continues an interrupted run with results
 * identical to an uninterrupted one. Shards and merge are not yet available for population runs.
 */
public final class PopulationRun {

    private PopulationRun() {
    }

    /**
     * A finished population run.
     *
     * @param result the analysis
     * @param folder the output folder
     */
    public record Done(PopulationAnalysis.Result result, Path folder) {
        /** @return 1 when any (c) comparison disagrees, else 0 */
        public int exitCode() {
            return result.exitCode();
        }
    }

    /** Progress of a population run. */
    public interface Listener {
        /**
         * One question's invasions are finished.
         *
         * @param done questions finished
         * @param total questions
         */
        void questionDone(int done, int total);
    }

    /**
     * The seed of question q (grid point p, mutant m, resident r, q = (p k + m) k + r for k strategies):
     * {@link Runner#caseSeed} of the experiment's seed and q, so questions play independent streams.
     *
     * @param seed the experiment's seed
     * @param question q
     * @return the question's master seed
     */
    static long questionSeed(long seed, int question) {
        return Runner.caseSeed(seed, question);
    }

    /**
     * Runs a population experiment.
     *
     * @param e the experiment
     * @param settings where and how (with {@code resume}, finished questions come from the checkpoint)
     * @param listener progress
     * @return the finished run
     * @throws IllegalArgumentException one line, if the folder does not allow the run
     */
    public static Done run(PopulationExperiment e, RunSettings settings, Listener listener) {
        Instant start = Instant.now();
        String where = e.file() + ": " + (settings.out() != null ? "--out" : "output");
        Path dir = settings.out() != null ? settings.out() : e.output();
        PopulationCheckpoint checkpoint = PopulationCheckpoint.of(dir);
        Map<Integer, InvasionTally> done = new HashMap<>();
        OutputFolder.Lock lock = OutputFolder.open(where, dir, settings.force(), settings.resume(), () -> {
            if (checkpoint.size() > 0 && !settings.resume() && !settings.force()) {
                throw new IllegalArgumentException(where + ": " + dir + " holds an interrupted population run ("
                    + checkpoint.size() + " finished questions in " + PopulationCheckpoint.FOLDER + "); use --resume to "
                    + "continue it or --force to start over");
            }
            if (settings.resume()) {
                try {
                    done.putAll(checkpoint.load(e, settings.toolVersion()));
                } catch (IllegalArgumentException ex) {
                    throw new IllegalArgumentException(e.file() + ": --resume: " + ex.getMessage(), ex);
                }
            }
        });
        try {
            if (!settings.resume()) {
                checkpoint.delete();
            }
            int[] saved = {0};
            PopulationAnalysis.Result result = compute(e, settings.threads(), listener, done, (q, t) -> {
                checkpoint.save(e, settings.toolVersion(), q, t);
                TestHold.afterUnitSaved(++saved[0]);
            });
            write(dir, e, settings, result, start);
            checkpoint.delete();
            return new Done(result, dir);
        } finally {
            lock.close();
        }
    }

    /**
     * The exact side and the invasions of every question, analysed (writes nothing).
     *
     * @param e the experiment
     * @param threads worker threads for the invasions
     * @param listener progress
     * @return the analysis
     */
    public static PopulationAnalysis.Result compute(PopulationExperiment e, int threads, Listener listener) {
        return compute(e, threads, listener, Map.of(), (q, t) -> { });
    }

    /**
     * As {@link #compute(PopulationExperiment, int, Listener)}, taking finished questions from a checkpoint and
     * handing each newly finished one to {@code saved}.
     *
     * @param e the experiment
     * @param threads worker threads
     * @param listener progress
     * @param done tallies of finished questions by question index q
     * @param saved told of each question played here (q and its tally)
     * @return the analysis
     */
    static PopulationAnalysis.Result compute(PopulationExperiment e, int threads, Listener listener,
        Map<Integer, InvasionTally> done, java.util.function.BiConsumer<Integer, InvasionTally> saved) {
        List<PopulationExperiment.Point> points = e.points();
        int k = e.strategies().size();
        List<PopulationAnalysis.PointExact> exact = new ArrayList<>();
        Map<PopulationAnalysis.Key, InvasionTally> tallies = new LinkedHashMap<>();
        int total = points.size() * k * (k - 1);
        int finished = 0;
        for (PopulationExperiment.Point p : points) {
            exact.add(PopulationAnalysis.exact(e, p));
            for (int m = 0; m < k; m++) {
                for (int r = 0; r < k; r++) {
                    if (m == r) {
                        continue;
                    }
                    if (e.invasions() > 0) {
                        int q = (p.index() * k + m) * k + r;
                        PopulationSimulator sim = new PopulationSimulator(e.game(), e.strategies(), p.noise(),
                            p.horizon(), p.population(), questionSeed(e.seed(), q));
                        InvasionTally t = done.get(q);
                        if (t == null) {
                            t = sim.invasions(m, r, 0, e.invasions(), threads);
                            saved.accept(q, t);
                        }
                        tallies.put(new PopulationAnalysis.Key(p.index(), m, r), t);
                    }
                    listener.questionDone(++finished, total);
                }
            }
        }
        Map<Integer, MutationRun> runs = new LinkedHashMap<>();
        if (e.mutation() == PopulationExperiment.Mutation.RATE && e.updates() > 0) {
            for (PopulationExperiment.Point p : points) {
                PopulationSimulator sim = new PopulationSimulator(e.game(), e.strategies(), p.noise(), p.horizon(),
                    p.population(), questionSeed(e.seed(), p.index() * k * k));
                runs.put(p.index(), sim.mutationRun(0, 1, e.mu(), 0, e.updates(), 1, 0));
            }
        }
        return PopulationAnalysis.analyse(e, exact, tallies, runs);
    }

    private static void write(Path dir, PopulationExperiment e, RunSettings settings, PopulationAnalysis.Result result,
        Instant start) {
        PopulationCsv.writeFixation(dir.resolve("population.csv"), e, result);
        PopulationCsv.writeAbundance(dir.resolve("abundance.csv"), e, result);
        List<Path> figures = new ArrayList<>(PopulationFigures.draw(e, result, dir.resolve("figures")));
        figures.addAll(PopulationFigures.drawAbundance(e, result, dir.resolve("figures")));
        figures.addAll(InvasionGraph.draw(e, result, dir.resolve("figures")));
        List<String> outputs = new ArrayList<>(List.of("population.csv", "abundance.csv", "report.md", "run.json"));
        List<String> figureNames = new ArrayList<>();
        for (Path f : figures) {
            String rel = dir.toAbsolutePath().relativize(f.toAbsolutePath()).toString();
            outputs.add(rel);
            figureNames.add(rel);
        }
        Instant end = Instant.now();
        PopulationReport.write(dir.resolve("report.md"), new PopulationReport.Content(e, result, figureNames,
            settings.toolVersion(), start, end));
        long rounds = result.rows().stream().filter(r -> r.basis() == PopulationAnalysis.Basis.REALISED
            && r.tally() != null).mapToLong(r -> r.tally().rounds()).sum();
        Provenance.write(dir.resolve("run.json"), new Provenance.Run(settings.toolVersion(), settings.commandLine(),
            e.file(), e.sha256(), null, null, e.seed(), Simulator.GENERATOR, "question q = (point * k + mutant) * k + "
                + "resident: SplitMix64(seed + (q+1) * 0x9E3779B97F4A7C15); invasion i of a question: the population "
                + "simulator's stream for (question seed, i)", settings.threads(), result.rows().size() / 3, rounds,
            start, end, result.exitCode(), outputs));
    }
}
