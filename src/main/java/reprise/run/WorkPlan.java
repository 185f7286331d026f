package reprise.run;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.PriorityQueue;
import reprise.experiment.Case;
import reprise.experiment.Experiment;

/**
 * How an experiment's simulation work is cut into units: each case's replicates are split into chunks of
 * consecutive game indexes. The cut depends only on the experiment (never on threads or machines), and
 * since every game's random stream depends only on (case seed, game index), any set of units can be run
 * anywhere, in any order, and merged into exactly the numbers of one uninterrupted run.
 *
 * <p>A case gets ceil(G E[L] / {@value #ROUNDS_PER_UNIT}) chunks (at least 1, at most G), so one unit is
 * at most about a second of simulation on one core; games are spread evenly over the chunks.
 */
public final class WorkPlan {

    /** The largest expected number of rounds in one unit. */
    public static final double ROUNDS_PER_UNIT = 2e8;

    private WorkPlan() {
    }

    /**
     * One unit of work.
     *
     * @param caseIndex the case
     * @param chunk the chunk number within the case, from 0
     * @param from first game index
     * @param to one past the last game index
     * @param expectedRounds expected rounds played in the unit
     */
    public record Unit(int caseIndex, int chunk, long from, long to, double expectedRounds) {
        /** @return a file name for the unit's tally, e.g. {@code case-00007-chunk-00003.json} */
        public String fileName() {
            return String.format(Locale.ROOT, "case-%05d-chunk-%05d.json", caseIndex, chunk);
        }
    }

    /**
     * All units of an experiment, case by case, chunk by chunk, in the cut of an unsharded run.
     *
     * @param e the experiment
     * @param cases its cases
     * @return the units
     */
    public static List<Unit> units(Experiment e, List<Case> cases) {
        return units(e, cases, 1);
    }

    /**
     * All units of an experiment cut for a run of n shards. With n no larger than the units of the
     * unsharded cut ({@link #units(Experiment, List)}) and no unit of that cut above the mean shard R / n,
     * that cut; otherwise (too few units, or one so large that its shard would be the run's bottleneck)
     * the cap on a unit's rounds becomes R / (2n), R the experiment's expected rounds, so that there are at least 2n units (unless a
     * case has fewer games than its share, or 2n exceeds {@link #MOST_UNITS}) and every shard gets work, with the largest shard at most
     * about 1.5 times the mean (the bound of largest-first assignment when no unit exceeds half the mean).
     * Any cut gives bit-identical merged numbers, since a unit is only a range of game indexes.
     *
     * @param e the experiment
     * @param cases its cases
     * @param shards n, at least 1
     * @return the units
     */
    public static List<Unit> units(Experiment e, List<Case> cases, int shards) {
        List<Unit> base = cut(e, cases, ROUNDS_PER_UNIT);
        double total = base.stream().mapToDouble(Unit::expectedRounds).sum();
        double largest = base.stream().mapToDouble(Unit::expectedRounds).max().orElse(0);
        if (shards <= base.size() && largest <= total / shards || base.size() >= MOST_UNITS) {
            return base;
        }
        double cap = total / (2.0 * Math.min(shards, MOST_UNITS / 2));
        return cut(e, cases, Math.min(ROUNDS_PER_UNIT, cap));
    }

    /**
     * The most units a finer cut aims at (it may exceed this by at most one unit per case), since a merge
     * holds every unit's tallies in memory: a run of more than half this many shards is cut into about this
     * many units, and shards beyond the units get no work.
     */
    public static final int MOST_UNITS = 100_000;

    private static List<Unit> cut(Experiment e, List<Case> cases, double roundsPerUnit) {
        List<Unit> out = new ArrayList<>();
        long g = e.replicates();
        for (Case c : cases) {
            double perGame = c.horizon().expectedLength();
            long chunks = (long) Math.min(g, Math.max(1, Math.ceil(g * perGame / roundsPerUnit)));
            for (int k = 0; k < chunks; k++) {
                long from = g * k / chunks;
                long to = g * (k + 1) / chunks;
                out.add(new Unit(c.index(), k, from, to, (to - from) * perGame));
            }
        }
        return List.copyOf(out);
    }

    /**
     * The most shards a run may be cut into: Slurm's largest possible MaxArraySize is 4000001, so no
     * job array has more tasks than this (slurm.conf documentation, MaxArraySize; from memory).
     */
    public static final int MOST_SHARDS = 4_000_000;

    /**
     * The shard (from 0) of every unit, by the rule of {@link #shard}. Only the first min(units, n) shards
     * can receive work (all start empty, ties go to the lowest shard), so a heap over those finds the
     * least-loaded shard in O(log) time and the cost does not grow with n.
     *
     * @param units all units
     * @param shards n, at least 1
     * @return owner[u], the 0-based shard of unit u
     */
    public static int[] owners(List<Unit> units, int shards) {
        List<Integer> order = new ArrayList<>();
        for (int i = 0; i < units.size(); i++) {
            order.add(i);
        }
        order.sort(Comparator.<Integer>comparingDouble(i -> -units.get(i).expectedRounds()).thenComparing(i -> i));
        int open = Math.min(units.size(), shards);
        double[] load = new double[open];
        PriorityQueue<Integer> leastLoaded = new PriorityQueue<>(Math.max(1, open),
            Comparator.<Integer>comparingDouble(s -> load[s]).thenComparing(s -> s));
        for (int s = 0; s < open; s++) {
            leastLoaded.add(s);
        }
        int[] owner = new int[units.size()];
        for (int i : order) {
            int best = leastLoaded.poll();
            owner[i] = best;
            load[best] += units.get(i).expectedRounds();
            leastLoaded.add(best);
        }
        return owner;
    }

    /**
     * The units of shard i of n, balanced by expected rounds: units are taken largest first (ties by
     * position) and each goes to the shard with the least work so far (ties to the lowest shard). Every
     * unit belongs to exactly one shard.
     *
     * @param units all units
     * @param shard i, from 1 to n
     * @param shards n, at least 1
     * @return shard i's units, in plan order
     */
    public static List<Unit> shard(List<Unit> units, int shard, int shards) {
        if (shards < 1 || shards > MOST_SHARDS || shard < 1 || shard > shards) {
            throw new IllegalArgumentException("shard must be I/N with 1 <= I <= N <= " + MOST_SHARDS + ": " + shard
                + "/" + shards);
        }
        int[] owner = owners(units, shards);
        List<Unit> mine = new ArrayList<>();
        for (int i = 0; i < units.size(); i++) {
            if (owner[i] == shard - 1) {
                mine.add(units.get(i));
            }
        }
        return List.copyOf(mine);
    }
}
