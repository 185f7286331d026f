package reprise.evolution;

/**
 * The lattice on which a stage game's payoffs lie: payoff(s) = unit k(s) with integers k(s).
 *
 * <p>Implementation note. The smallest denominator d &le; {@link #MAX_DENOMINATOR} with every d payoff
 * within 1e-9 (relative) of an integer is taken, and the integers are divided by their greatest common
 * divisor. Payoffs with no such denominator are rounded to the grid of (max - min) / {@link #ROUNDED_STEPS}
 * (each round's payoff moves by at most unit / 2): {@link #rounded()} is then true and callers label their
 * results as approximations.
 *
 * @param unit the payoff of one lattice step
 * @param steps k(s) for the four states CC, CD, DC, DD (X's view, X's payoffs)
 * @param rounded whether the payoffs were rounded to the lattice
 */
record Lattice(double unit, int[] steps, boolean rounded) {

    /** Largest common denominator searched. */
    static final int MAX_DENOMINATOR = 1000;
    /** Grid steps across the payoff range when the payoffs are not on a small lattice. */
    static final int ROUNDED_STEPS = 1024;

    static Lattice of(double[] payoffs) {
        for (int d = 1; d <= MAX_DENOMINATOR; d++) {
            long[] k = new long[payoffs.length];
            boolean ok = true;
            for (int s = 0; s < payoffs.length && ok; s++) {
                double v = payoffs[s] * d;
                k[s] = Math.round(v);
                ok = Math.abs(v - k[s]) <= 1e-9 * Math.max(1, Math.abs(v)) && Math.abs(k[s]) < (1 << 20);
            }
            if (ok) {
                long g = 0;
                for (long x : k) {
                    g = gcd(g, Math.abs(x));
                }
                if (g == 0) {
                    g = 1;
                }
                int[] steps = new int[k.length];
                for (int s = 0; s < k.length; s++) {
                    steps[s] = (int) (k[s] / g);
                }
                return new Lattice((double) g / d, steps, false);
            }
        }
        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        for (double v : payoffs) {
            min = Math.min(min, v);
            max = Math.max(max, v);
        }
        double unit = (max - min) / ROUNDED_STEPS;
        int[] steps = new int[payoffs.length];
        for (int s = 0; s < payoffs.length; s++) {
            steps[s] = (int) Math.round(payoffs[s] / unit);
        }
        return new Lattice(unit, steps, true);
    }

    private static long gcd(long a, long b) {
        while (b != 0) {
            long t = a % b;
            a = b;
            b = t;
        }
        return a;
    }

    int min() {
        int m = Integer.MAX_VALUE;
        for (int k : steps) {
            m = Math.min(m, k);
        }
        return m;
    }

    int max() {
        int m = Integer.MIN_VALUE;
        for (int k : steps) {
            m = Math.max(m, k);
        }
        return m;
    }
}
