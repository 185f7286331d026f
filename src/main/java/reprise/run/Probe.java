package reprise.run;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import reprise.experiment.Case;
import reprise.experiment.Runner;
import reprise.sim.SimulationResult;
import reprise.sim.Simulator;

/**
 * A short measurement on this machine for a batch system's resource requests: the simulation rate on one
 * thread, the seconds a merge spends on one case (exact side, simulation summary and statistics), and the
 * largest heap of one tally.
 *
 * <p>Implementation note. The rate is measured on the cases with the most expected rounds (up to
 * {@value #CASES}), because they dominate a task's time: for each, games [0, k) are simulated with k
 * doubling from 1 until one batch takes a quarter of the case's share of the budget or every game has been
 * played; the rate is the pooled rounds over the pooled seconds of each case's last (warmest) batch. The
 * first batches run in the interpreter and are not counted, but a short probe still under-estimates a
 * warmed-up simulator (the JIT compiler keeps improving for seconds), which errs on the safe side of a time
 * limit. The per-case merge cost is the time of {@link Runner#fromSimulation} on the last batch of the
 * first probed case (its exact side does not depend on the games).
 *
 * @param roundsPerSecond simulated rounds per second on one thread
 * @param caseSeconds seconds to join and analyse one case in a merge
 * @param tallyBytes the largest heap bytes of one unit's tallies over the experiment's cases
 */
public record Probe(double roundsPerSecond, double caseSeconds, long tallyBytes) {

    /** The most cases probed. */
    public static final int CASES = 4;

    /**
     * @param job the job
     * @return the largest heap bytes of one unit's tallies over its cases (computed, not measured)
     */
    public static long tallyBytes(Job job) {
        long tallyBytes = 0;
        for (Case c : job.cases()) {
            tallyBytes = Math.max(tallyBytes, new Simulator(Runner.spec(job.experiment(), c, 1)).tallyBytes());
        }
        return tallyBytes;
    }

    /**
     * Measures.
     *
     * @param job the job
     * @param seconds the budget, e.g. 1
     * @return the measurement
     */
    public static Probe measure(Job job, double seconds) {
        Map<Integer, Double> roundsByCase = new HashMap<>();
        for (WorkPlan.Unit u : job.units()) {
            roundsByCase.merge(u.caseIndex(), u.expectedRounds(), Double::sum);
        }
        long tallyBytes = tallyBytes(job);
        List<Case> probed = new ArrayList<>(job.cases());
        probed.sort(Comparator.<Case>comparingDouble(c -> -roundsByCase.getOrDefault(c.index(), 0.0))
            .thenComparingInt(Case::index));
        probed = probed.subList(0, Math.min(CASES, probed.size()));
        double share = seconds / probed.size();
        double rounds = 0;
        double time = 0;
        SimulationResult firstResult = null;
        for (Case c : probed) {
            Simulator sim = new Simulator(Runner.spec(job.experiment(), c, 1));
            long games = job.experiment().replicates();
            double spent = 0;
            for (long k = 1;; k = Math.min(games, 2 * k)) {
                long t0 = System.nanoTime();
                SimulationResult r = sim.simulateRange(0, k, null);
                double dt = (System.nanoTime() - t0) / 1e9;
                spent += dt;
                if (dt >= share / 4 || k == games || spent >= share) {
                    rounds += r.roundsTotal();
                    time += dt;
                    if (firstResult == null) {
                        firstResult = r;
                    }
                    break;
                }
            }
        }
        double rate = time > 0 && rounds > 0 ? rounds / time : Double.NaN;
        long t0 = System.nanoTime();
        Runner.fromSimulation(job.experiment(), probed.get(0), firstResult);
        double caseSeconds = (System.nanoTime() - t0) / 1e9;
        return new Probe(rate, caseSeconds, tallyBytes);
    }
}
