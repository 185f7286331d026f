package reprise.run;

import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.IntFunction;
import reprise.experiment.Case;
import reprise.experiment.CaseResult;
import reprise.experiment.Curves;
import reprise.experiment.Experiment;
import reprise.experiment.Runner;
import reprise.output.CasesCsv;
import reprise.output.CurvesCsv;
import reprise.output.Plotter;
import reprise.output.Provenance;
import reprise.output.Report;
import reprise.output.ResultsCsv;
import reprise.output.SetOutputs;
import reprise.sim.SimulationResult;
import reprise.sim.Simulator;

/**
 * What an unsharded run and a merge of shards share, so that both give the same files: the per-case join
 * of unit tallies (in plan order) and the output files.
 */
final class Outputs {

    private Outputs() {
    }

    /** Where a unit's tallies come from: simulated now, loaded from a checkpoint, or read from a shard. */
    @FunctionalInterface
    interface UnitSource {
        /**
         * @param c the case
         * @param u one of its units
         * @return the unit's tallies
         */
        SimulationResult tally(Case c, WorkPlan.Unit u);
    }

    /**
     * Joins the unit tallies of every case, in plan order, with the case's exact side.
     *
     * @param job the job
     * @param units all its units
     * @param source the tallies of each unit
     * @param listener told of every case and unit
     * @return the case results, in case order
     */
    static List<CaseResult> byCase(Job job, List<WorkPlan.Unit> units, UnitSource source, RunListener listener) {
        List<CaseResult> results = new ArrayList<>();
        for (Case c : job.cases()) {
            listener.startCase(c, results.size());
            SimulationResult merged = null;
            for (WorkPlan.Unit u : units) {
                if (u.caseIndex() != c.index()) {
                    continue;
                }
                SimulationResult r = source.tally(c, u);
                listener.endUnit(u.expectedRounds());
                merged = merged == null ? r : merged.merge(r);
            }
            results.add(Runner.fromSimulation(job.experiment(), c, merged));
        }
        return results;
    }

    /**
     * Joins the unit tallies of every case with the case's exact side on several threads, case by case
     * (the exact side, the simulation summary and the per-case statistics of one case do not depend on
     * another's), so a merge's cost is the work per case divided by the threads. The results are those of
     * {@link #byCase}, in case order.
     *
     * @param job the job
     * @param units all its units
     * @param source the tallies of each unit (read concurrently)
     * @param threads worker threads, at least 1
     * @return the case results, in case order
     */
    static List<CaseResult> byCaseInParallel(Job job, List<WorkPlan.Unit> units, UnitSource source, int threads) {
        Map<Integer, List<WorkPlan.Unit>> byCase = new HashMap<>();
        for (WorkPlan.Unit u : units) {
            byCase.computeIfAbsent(u.caseIndex(), k -> new ArrayList<>()).add(u);
        }
        List<Case> cases = job.cases();
        return inParallel(cases.size(), threads, i -> {
            Case c = cases.get(i);
            SimulationResult merged = null;
            for (WorkPlan.Unit u : byCase.getOrDefault(c.index(), List.of())) {
                SimulationResult r = source.tally(c, u);
                merged = merged == null ? r : merged.merge(r);
            }
            return Runner.fromSimulation(job.experiment(), c, merged);
        });
    }

    /**
     * Computes f(0), ..., f(n - 1) on up to {@code threads} threads and returns them in order; the first
     * exception thrown by f is rethrown (unchecked exceptions and errors as they are).
     */
    static <T> List<T> inParallel(int n, int threads, IntFunction<T> f) {
        int workers = Math.max(1, Math.min(threads, n));
        List<T> out = new ArrayList<>(Collections.nCopies(n, null));
        if (workers == 1) {
            for (int i = 0; i < n; i++) {
                out.set(i, f.apply(i));
            }
            return out;
        }
        ExecutorService pool = Executors.newFixedThreadPool(workers, r -> {
            Thread t = new Thread(r, "reprise-merge");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<T>> futures = new ArrayList<>();
            for (int i = 0; i < n; i++) {
                int k = i;
                futures.add(pool.submit(() -> f.apply(k)));
            }
            for (int i = 0; i < n; i++) {
                out.set(i, futures.get(i).get());
            }
            return out;
        } catch (InterruptedException ex) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted", ex);
        } catch (ExecutionException ex) {
            Throwable cause = ex.getCause();
            if (cause instanceof RuntimeException re) {
                throw re;
            }
            if (cause instanceof Error er) {
                throw er;
            }
            throw new IllegalStateException(cause);
        } finally {
            pool.shutdownNow();
        }
    }

    /**
     * Writes curves.csv, figures/, results.csv, cases.csv, report.md and run.json; {@link Plotter#draw}
     * draws independent figures in parallel itself (it needs all points at once: one colour range for the
     * heatmaps, unique names, one manifest).
     *
     * @param dir the output folder
     * @param job the job
     * @param settings the run's settings (command line, tool version)
     * @param finished the results
     * @param start when the run started
     * @param nThreads worker threads of the simulation (recorded in run.json)
     */
    static void write(Path dir, Job job, RunSettings settings, Finished finished, Instant start, int nThreads) {
        Experiment e = job.experiment();
        List<CaseResult> results = finished.results();
        Runner.Outcome outcome = finished.outcome();
        List<String> params = List.copyOf(e.parameters().keySet());
        List<Case> cases = results.stream().map(CaseResult::c).toList();
        List<Curves.Point> points = Curves.of(e, results, outcome.rows(), 1 - e.alpha());
        CurvesCsv.write(dir.resolve("curves.csv"), points);
        List<Plotter.Drawn> drawn = Plotter.draw(CurvesCsv.read(dir.resolve("curves.csv")), dir.resolve("figures"),
            settings.figures(), settings.continuationAxis(), List.of());
        ResultsCsv.write(dir.resolve("results.csv"), cases, params, outcome.rows());
        CasesCsv.write(dir.resolve("cases.csv"), params, results);
        Instant end = Instant.now();
        String version = settings.toolVersion();
        Report.write(dir.resolve("report.md"), new Report.Content(e, results, outcome, drawn, version,
            Simulator.GENERATOR, start, end));
        List<String> outputs = new ArrayList<>(OutputFolder.OUTPUTS);
        for (Plotter.Drawn d : drawn) {
            d.result().files().forEach(f -> outputs.add(dir.toAbsolutePath().relativize(f.toAbsolutePath()).toString()));
        }
        outputs.add("figures/" + reprise.output.figures.FigureManifest.FILE_NAME);
        SetOutputs.write(dir, e, results, outcome.rows())
            .forEach(f -> outputs.add(dir.toAbsolutePath().relativize(f.toAbsolutePath()).toString()));
        Provenance.write(dir.resolve("run.json"), new Provenance.Run(version, settings.commandLine(), job.file(),
            e.sha256(), e.claims(), e.claims() == null ? null : RunIdentity.sha256(e.claims()), e.seed(),
            Simulator.GENERATOR, "case i: SplitMix64(seed + (i+1) * 0x9E3779B97F4A7C15); game g of a case: the "
                + "simulator's stream for (case seed, g)", nThreads, results.size(),
            results.stream().mapToLong(r -> r.simulation().roundsTotal()).sum(), start, end, finished.exitCode(),
            outputs));
    }
}
