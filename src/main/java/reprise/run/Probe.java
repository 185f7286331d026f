package reprise.run;

import java.util.ArrayList;
import java.util.List;
import reprise.experiment.Case;
import reprise.experiment.Runner;
import reprise.sim.SimulationResult;
import reprise.sim.Simulator;

/**
 * A short measurement on this machine for a batch system's resource requests: the simulation rate on one
 * thread, the seconds a merge spends on one case (exact side, simulation summary and statistics), and the
 * largest heap of one tally.
 *
 * <p>Implementation note. The rate depends on the strategies and strongly on the game length (short games
 * pay a per-game cost), so it is measured on the experiment's own mix: up to {@value #CASES} cases evenly
 * spread over the case list each simulate the same games [0, k), with k doubling from 1 until one pass
 * over them takes a third of the budget (or every game has been played, or the budget is spent). Since
 * every case has the same number of games, the pooled rate of the last pass, sum of rounds over sum of
 * seconds, is the rate at which the sampled cases' rounds would be simulated in full. The first passes
 * run in the interpreter and are not counted, but a short probe still under-estimates a warmed-up
 * simulator (the JIT compiler keeps improving for seconds), which errs on the safe side of a time limit;
 * a shard holding mostly the slowest cases can still run slower than the mix, which the safety factor
 * of the time estimate covers. The per-case merge cost is the time of {@link Runner#fromSimulation} on the last batch of the
 * first probed case (its exact side does not depend on the games).
 *
 * @param roundsPerSecond simulated rounds per second on one thread
 * @param caseSeconds seconds to join and analyse one case in a merge
 * @param tallyBytes the largest heap bytes of one unit's tallies over the experiment's cases
 */
public record Probe(double roundsPerSecond, double caseSeconds, long tallyBytes) {

    /** The most cases probed. */
    public static final int CASES = 16;

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
        long tallyBytes = tallyBytes(job);
        List<Case> all = job.cases();
        List<Case> probed = new ArrayList<>();
        int step = (all.size() + CASES - 1) / CASES;
        for (int i = 0; i < all.size(); i += step) {
            probed.add(all.get(i));
        }
        List<Simulator> sims = new ArrayList<>();
        probed.forEach(c -> sims.add(new Simulator(Runner.spec(job.experiment(), c, 1))));
        long games = job.experiment().replicates();
        double rounds = 0;
        double time = 0;
        double spent = 0;
        SimulationResult firstResult = null;
        for (long k = 1;; k = Math.min(games, 2 * k)) {
            rounds = 0;
            time = 0;
            for (int i = 0; i < sims.size(); i++) {
                long t0 = System.nanoTime();
                SimulationResult r = sims.get(i).simulateRange(0, k, null);
                time += (System.nanoTime() - t0) / 1e9;
                rounds += r.roundsTotal();
                if (i == 0) {
                    firstResult = r;
                }
            }
            spent += time;
            if (time >= seconds / 3 || k == games || spent >= seconds) {
                break;
            }
        }
        double rate = time > 0 && rounds > 0 ? rounds / time : Double.NaN;
        long t0 = System.nanoTime();
        Runner.fromSimulation(job.experiment(), probed.get(0), firstResult);
        double caseSeconds = (System.nanoTime() - t0) / 1e9;
        return new Probe(rate, caseSeconds, tallyBytes);
    }
}
