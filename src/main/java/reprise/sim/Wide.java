package reprise.sim;

import java.math.BigInteger;

/**
 * Exact 128-bit non-negative accumulators, stored as (high, low) pairs in a long array: slot i uses
 * elements 2i (high, signed) and 2i + 1 (low, unsigned). Sums of products of two longs cannot overflow
 * 128 bits before 2^62 additions; overflow of the high word is detected all the same.
 */
final class Wide {
    private Wide() {
    }

    static void add(long[] acc, int slot, long high, long low) {
        int h = 2 * slot;
        long lo = acc[h + 1] + low;
        long carry = Long.compareUnsigned(lo, low) < 0 ? 1 : 0;
        acc[h] = Math.addExact(Math.addExact(acc[h], high), carry);
        acc[h + 1] = lo;
    }

    /** Adds a * b for non-negative a and b. */
    static void addProduct(long[] acc, int slot, long a, long b) {
        add(acc, slot, Math.multiplyHigh(a, b), a * b);
    }

    static void addAll(long[] acc, long[] other) {
        for (int i = 0; i < acc.length / 2; i++) {
            add(acc, i, other[2 * i], other[2 * i + 1]);
        }
    }

    static BigInteger value(long[] acc, int slot) {
        BigInteger hi = BigInteger.valueOf(acc[2 * slot]).shiftLeft(64);
        BigInteger lo = new BigInteger(Long.toUnsignedString(acc[2 * slot + 1]));
        return hi.add(lo);
    }
}
