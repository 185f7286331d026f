package reprise.stats;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;

/**
 * Exact integer sufficient statistics of G independent games, from which every replicate-level mean,
 * variance and covariance of state counts is computed.
 *
 * <p>For game g let N_g = (N_CC, N_CD, N_DC, N_DD) be its tallied rounds in each state (index order
 * CC, CD, DC, DD = 0..3, states from X's view) and L_g = N_CC + N_CD + N_DC + N_DD its tallied length
 * (L_g = n for games of fixed length n). The record holds
 * <ul>
 *   <li>{@code sumCounts[s]} = sum_g N_{g,s} (4 entries);</li>
 *   <li>{@code sumCountProducts[s][r]} = sum_g N_{g,s} N_{g,r} (4 x 4, symmetric);</li>
 *   <li>{@code sumLengthCounts[s]} = sum_g L_g N_{g,s} (4);</li>
 *   <li>{@code sumLength} = sum_g L_g and {@code sumLengthSquared} = sum_g L_g^2.</li>
 * </ul>
 * The last three are implied by the first two because L = sum_s N_s; they are checked against them, which
 * catches mis-wired inputs (a length that is not the sum of the state counts is rejected).
 *
 * <p>Any per-game linear quantity Y_g = w . N_g (a payoff for a payoff vector w = u, X's cooperation count
 * for w = (1, 1, 0, 0), Y's for w = (1, 0, 1, 0), the count of one state for an indicator) then has
 * sum_g Y_g = w . sumCounts, sum_g Y_g^2 = w' sumCountProducts w and sum_g L_g Y_g = w . sumLengthCounts.
 *
 * @param games the number of independent games G, at least 1
 * @param sumCounts sum over games of the state counts (CC, CD, DC, DD)
 * @param sumCountProducts sum over games of N_s N_r (4 x 4)
 * @param sumLengthCounts sum over games of L N_s (4)
 * @param sumLength sum over games of L
 * @param sumLengthSquared sum over games of L^2
 */
public record GameSummary(long games, long[] sumCounts, long[][] sumCountProducts, long[] sumLengthCounts,
                          long sumLength, long sumLengthSquared) {

    /**
     * Validates and copies the sums and checks their mutual consistency.
     *
     * @param games at least 1
     * @param sumCounts 4 counts &ge; 0
     * @param sumCountProducts 4 x 4 symmetric, &ge; 0
     * @param sumLengthCounts 4 counts, sumLengthCounts[s] = sum_r sumCountProducts[s][r]
     * @param sumLength = sum_s sumCounts[s], at least 1
     * @param sumLengthSquared = sum_{s,r} sumCountProducts[s][r]
     */
    public GameSummary {
        if (games < 1) {
            throw new IllegalArgumentException("number of games must be at least 1: " + games);
        }
        sumCounts = Checks.counts("sum of state counts", sumCounts, 4);
        sumLengthCounts = Checks.counts("sum of length times state counts", sumLengthCounts, 4);
        if (sumCountProducts == null || sumCountProducts.length != 4) {
            throw new IllegalArgumentException("sum of count products must be 4 x 4: "
                + (sumCountProducts == null ? "none" : sumCountProducts.length + " rows"));
        }
        long[][] copy = new long[4][];
        for (int s = 0; s < 4; s++) {
            copy[s] = Checks.counts("sum of count products row " + s, sumCountProducts[s], 4);
        }
        sumCountProducts = copy;
        long total = 0;
        long totalSquared = 0;
        for (int s = 0; s < 4; s++) {
            total += sumCounts[s];
            long row = 0;
            for (int r = 0; r < 4; r++) {
                if (copy[s][r] != copy[r][s]) {
                    throw new IllegalArgumentException("sum of count products must be symmetric: [" + s + "][" + r
                        + "] = " + copy[s][r] + " but [" + r + "][" + s + "] = " + copy[r][s]);
                }
                row += copy[s][r];
            }
            if (row != sumLengthCounts[s]) {
                throw new IllegalArgumentException("sum of L N_s must equal the row sum of the count products for state "
                    + s + " (L is the sum of the state counts): " + sumLengthCounts[s] + " vs " + row);
            }
            totalSquared += row;
        }
        if (sumLength != total || sumLength < 1) {
            throw new IllegalArgumentException("sum of lengths must equal the sum of state counts and be at least 1: "
                + sumLength + " vs " + total);
        }
        if (sumLengthSquared != totalSquared) {
            throw new IllegalArgumentException("sum of squared lengths must equal the sum of all count products: "
                + sumLengthSquared + " vs " + totalSquared);
        }
    }

    /**
     * Builds the sums from per-game counts (convenient for tests and small studies).
     *
     * @param perGameCounts one row per game: its counts of CC, CD, DC, DD
     * @return the summary
     */
    public static GameSummary of(long[][] perGameCounts) {
        if (perGameCounts == null || perGameCounts.length == 0) {
            throw new IllegalArgumentException("per-game counts must have at least one game: none");
        }
        long[] n = new long[4];
        long[][] nn = new long[4][4];
        long[] ln = new long[4];
        long l = 0;
        long ll = 0;
        for (int g = 0; g < perGameCounts.length; g++) {
            long[] c = Checks.counts("counts of game " + g, perGameCounts[g], 4);
            long len = c[0] + c[1] + c[2] + c[3];
            l += len;
            ll += len * len;
            for (int s = 0; s < 4; s++) {
                n[s] += c[s];
                ln[s] += len * c[s];
                for (int r = 0; r < 4; r++) {
                    nn[s][r] += c[s] * c[r];
                }
            }
        }
        return new GameSummary(perGameCounts.length, n, nn, ln, l, ll);
    }

    /** @return sum over games of N_s, per state CC, CD, DC, DD (a copy) */
    @Override
    public long[] sumCounts() {
        return sumCounts.clone();
    }

    /** @return sum over games of N_s N_r, 4 x 4 (a copy) */
    @Override
    public long[][] sumCountProducts() {
        long[][] c = new long[4][];
        for (int s = 0; s < 4; s++) {
            c[s] = sumCountProducts[s].clone();
        }
        return c;
    }

    /** @return sum over games of L N_s, per state (a copy) */
    @Override
    public long[] sumLengthCounts() {
        return sumLengthCounts.clone();
    }

    /** @return whether all games had the same tallied length (G sum L^2 = (sum L)^2, tested exactly) */
    public boolean fixedLength() {
        return BigInteger.valueOf(games).multiply(BigInteger.valueOf(sumLengthSquared))
            .equals(BigInteger.valueOf(sumLength).pow(2));
    }

    /** @return the mean tallied length sum L / G */
    public double meanLength() {
        return (double) sumLength / games;
    }

    /** @return the mean counts per game, sum N_s / G, in the order CC, CD, DC, DD */
    public double[] meanCounts() {
        double[] m = new double[4];
        for (int s = 0; s < 4; s++) {
            m[s] = (double) sumCounts[s] / games;
        }
        return m;
    }

    /** @return the pooled state frequencies sum N_s / sum L (the ratio estimator), order CC, CD, DC, DD */
    public double[] pooledFrequencies() {
        double[] m = new double[4];
        for (int s = 0; s < 4; s++) {
            m[s] = (double) sumCounts[s] / sumLength;
        }
        return m;
    }

    /**
     * The sample covariance of per-game counts, (sum N_s N_r - sum N_s sum N_r / G) / (G - 1), computed
     * from the exact integer sums in exact arithmetic and rounded once.
     *
     * @return the 4 x 4 covariance (order CC, CD, DC, DD)
     * @throws IllegalStateException if G &lt; 2
     */
    public double[][] sampleCovarianceOfCounts() {
        if (games < 2) {
            throw new IllegalStateException("a sample covariance needs at least 2 games: " + games);
        }
        double[][] c = new double[4][4];
        BigInteger g = BigInteger.valueOf(games);
        BigInteger denominator = g.multiply(g.subtract(BigInteger.ONE));
        for (int s = 0; s < 4; s++) {
            for (int r = 0; r < 4; r++) {
                BigInteger numerator = g.multiply(BigInteger.valueOf(sumCountProducts[s][r]))
                    .subtract(BigInteger.valueOf(sumCounts[s]).multiply(BigInteger.valueOf(sumCounts[r])));
                c[s][r] = new BigDecimal(numerator).divide(new BigDecimal(denominator), MathContext.DECIMAL64)
                    .doubleValue();
            }
        }
        return c;
    }

    /** Exact sums of a linear quantity Y = w . N, as BigDecimal: {sum Y, sum Y^2, sum L Y}. */
    BigDecimal[] linearSums(double[] w) {
        BigDecimal sy = BigDecimal.ZERO;
        BigDecimal syy = BigDecimal.ZERO;
        BigDecimal syl = BigDecimal.ZERO;
        for (int s = 0; s < 4; s++) {
            BigDecimal ws = new BigDecimal(w[s]);
            sy = sy.add(ws.multiply(BigDecimal.valueOf(sumCounts[s])));
            syl = syl.add(ws.multiply(BigDecimal.valueOf(sumLengthCounts[s])));
            for (int r = 0; r < 4; r++) {
                syy = syy.add(ws.multiply(new BigDecimal(w[r])).multiply(BigDecimal.valueOf(sumCountProducts[s][r])));
            }
        }
        return new BigDecimal[] {sy, syy, syl};
    }
}
