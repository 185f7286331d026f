package reprise.game;

import java.util.Arrays;

/**
 * A strategy that cooperates with a probability looked up from the last {@code memory} rounds.
 *
 * <p><b>Table layout.</b> A round is coded from the player's own view as
 * {@code s = 2 * ownDefected + coPlayerDefected} (CC = 0, CD = 1, DC = 2, DD = 3, own move first). The
 * table has 4^n entries; the entry for the history (s_{t-n+1}, ..., s_t) sits at index
 * {@code s_t + 4 s_{t-1} + 16 s_{t-2}}: the most recent round in the lowest two bits. Read in index order,
 * a memory-two table therefore lists (previous round, last round) as CC,CC; CC,CD; CC,DC; ...; DD,DD.
 *
 * <p><b>Start of the game.</b> In round 1 the player cooperates with probability {@code initial}. In rounds
 * 2 to n of a memory-n strategy the rounds before the first are taken to be mutual cooperation (CC), so
 * for example tit-for-two-tats cooperates in round 2 whatever happened in round 1, unless it is the
 * second consecutive defection. The table entry is the probability of intending to cooperate; execution
 * and perception errors are applied by the engines on top.
 *
 * @param label the spec that produced the strategy
 * @param memory the number of past rounds the strategy reads (1 to 3)
 * @param table 4^memory cooperation probabilities in the layout above
 * @param initial the probability of cooperating in round 1
 */
public record MemoryStrategy(String label, int memory, double[] table, double initial) implements Strategy {

    /** The largest memory supported. */
    public static final int MAX_MEMORY = 3;

    /**
     * Validates and copies the table.
     *
     * @param label the spec
     * @param memory 1 to 3
     * @param table 4^memory probabilities
     * @param initial a probability
     */
    public MemoryStrategy {
        if (!(memory >= 1 && memory <= MAX_MEMORY)) {
            throw new IllegalArgumentException("memory must be 1, 2 or 3 rounds: " + memory);
        }
        table = Checks.probabilities("cooperation probability", table, 1 << (2 * memory));
        Checks.probability("first-round cooperation probability", initial);
    }

    /**
     * A reactive strategy: cooperate with probability p after the co-player cooperated, q after it defected.
     *
     * @param label the spec
     * @param p cooperation probability after the co-player's C
     * @param q cooperation probability after the co-player's D
     * @param initial first-round cooperation probability
     * @return the strategy as a memory-one table (p, q, p, q)
     */
    public static MemoryStrategy reactive(String label, double p, double q, double initial) {
        Checks.probability("reactive p", p);
        Checks.probability("reactive q", q);
        return new MemoryStrategy(label, 1, new double[] {p, q, p, q}, initial);
    }

    /**
     * A memory-one strategy.
     *
     * @param label the spec
     * @param p cooperation probabilities after CC, CD, DC, DD (own move first)
     * @param initial first-round cooperation probability
     * @return the strategy
     */
    public static MemoryStrategy memoryOne(String label, double[] p, double initial) {
        return new MemoryStrategy(label, 1, p, initial);
    }

    /** @return the table (a copy) */
    @Override
    public double[] table() {
        return table.clone();
    }

    /**
     * The cooperation probability for a history index, without copying.
     *
     * @param history index into the table (see the class description)
     * @return the probability of intending to cooperate
     */
    public double cooperation(int history) {
        return table[history];
    }

    /** @return the number of table entries, 4^memory */
    public int size() {
        return table.length;
    }

    /**
     * Whether the strategy is reactive: memory one and the entry depends only on the co-player's move.
     *
     * @return true for tables of the form (p, q, p, q)
     */
    public boolean isReactive() {
        return memory == 1 && table[0] == table[2] && table[1] == table[3];
    }

    /**
     * The same rule read with a longer memory: the extra rounds are ignored. Useful to put two players
     * of different memories on one joint history.
     *
     * @param longer the memory to extend to, at least {@link #memory()}
     * @return an equivalent strategy with 4^longer entries
     */
    public MemoryStrategy extendTo(int longer) {
        if (longer < memory || longer > MAX_MEMORY) {
            throw new IllegalArgumentException("cannot extend memory " + memory + " to " + longer);
        }
        if (longer == memory) {
            return this;
        }
        int mask = table.length - 1;
        double[] t = new double[1 << (2 * longer)];
        for (int i = 0; i < t.length; i++) {
            t[i] = table[i & mask];
        }
        return new MemoryStrategy(label, longer, t, initial);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof MemoryStrategy m && memory == m.memory && Arrays.equals(table, m.table)
            && Double.compare(initial, m.initial) == 0;
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(table) * 31 + Double.hashCode(initial) + memory;
    }

    @Override
    public String toString() {
        return label;
    }
}
