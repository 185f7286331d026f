package reprise.sim;

import java.math.BigInteger;

/**
 * Exact integer tallies of independent invasions of one mutant among residents: how many fixed, and
 * the sum and sum of squares of their times to fixation (in updates). Tallies of disjoint invasion
 * ranges add exactly, in any order.
 *
 * @param invasions the number of invasions played
 * @param fixations how many ended with the mutant fixed
 * @param fixationTimeSum sum of the updates to fixation over the fixed invasions
 * @param fixationTimeSquares sum of their squares
 * @param updates all updates played (fixed and lost invasions)
 * @param rounds all game rounds played
 */
public record InvasionTally(long invasions, long fixations, long fixationTimeSum, BigInteger fixationTimeSquares,
    long updates, long rounds) {

    /** No invasions. */
    public static final InvasionTally EMPTY = new InvasionTally(0, 0, 0, BigInteger.ZERO, 0, 0);

    /**
     * Validates the counts.
     *
     * @param invasions at least 0
     * @param fixations 0 to invasions
     * @param fixationTimeSum at least 0
     * @param fixationTimeSquares at least 0
     * @param updates at least 0
     * @param rounds at least 0
     */
    public InvasionTally {
        if (invasions < 0 || fixations < 0 || fixations > invasions || fixationTimeSum < 0 || updates < 0 || rounds < 0
            || fixationTimeSquares == null || fixationTimeSquares.signum() < 0) {
            throw new IllegalArgumentException("invalid invasion tally: " + invasions + " invasions, " + fixations
                + " fixations");
        }
    }

    /**
     * The exact sum of two tallies.
     *
     * @param other another tally of the same mutant and resident
     * @return the sum
     */
    public InvasionTally plus(InvasionTally other) {
        return new InvasionTally(Math.addExact(invasions, other.invasions), Math.addExact(fixations, other.fixations),
            Math.addExact(fixationTimeSum, other.fixationTimeSum), fixationTimeSquares.add(other.fixationTimeSquares),
            Math.addExact(updates, other.updates), Math.addExact(rounds, other.rounds));
    }

    /** @return fixations / invasions (NaN for none) */
    public double fixationFrequency() {
        return invasions == 0 ? Double.NaN : (double) fixations / invasions;
    }

    /** @return the mean time to fixation of the fixed invasions (NaN for none) */
    public double meanFixationTime() {
        return fixations == 0 ? Double.NaN : (double) fixationTimeSum / fixations;
    }
}
