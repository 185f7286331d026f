package reprise.sim;

/**
 * One long population run with mutation: the number of individuals of the counted strategy after each
 * recorded update.
 *
 * @param size the population size N
 * @param counts counts[t], 0 to N, after update (t + 1) * thin
 * @param thin updates between records
 * @param rounds the game rounds played
 */
public record MutationRun(int size, int[] counts, int thin, long rounds) {

    /**
     * Copies the counts.
     *
     * @param size N
     * @param counts the records
     * @param thin at least 1
     * @param rounds at least 0
     */
    public MutationRun {
        counts = counts.clone();
    }

    /** @return the records (a copy) */
    @Override
    public int[] counts() {
        return counts.clone();
    }

    /** @return the fractions counts[t] / N in time order, for a batch-means estimate of the abundance */
    public double[] fractions() {
        double[] f = new double[counts.length];
        for (int t = 0; t < f.length; t++) {
            f[t] = (double) counts[t] / size;
        }
        return f;
    }
}
