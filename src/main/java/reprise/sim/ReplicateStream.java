package reprise.sim;

import org.apache.commons.rng.UniformRandomProvider;

/**
 * The random stream of one replicate: the XoRoShiRo128++ generator, re-seeded in place per game.
 *
 * <p>Seed derivation for replicate i under master seed m: with the SplitMix64 output function
 * mix64(z) (Stafford's variant 13) and the golden-ratio increment G = 0x9E3779B97F4A7C15,
 * base = mix64(m), state0 = mix64(base + (2i + 1) G), state1 = mix64(base + (2i + 2) G); that is, the
 * outputs 2i + 1 and 2i + 2 of a SplitMix64 generator started at state base. If both words are 0
 * (probability 2^-128) state0 is set to G. The stream's {@code nextLong()} values are then those of
 * Commons RNG's {@code XO_RO_SHI_RO_128_PP} built with {@code new long[] {state0, state1}}; the other
 * methods are the client API's defaults derived from {@code nextLong()}.
 *
 * <p>Hand-written rather than Commons' class because Commons generators cannot be re-seeded in place
 * (one allocation per game) and the hot loops copy the two state words into locals.
 */
final class ReplicateStream implements UniformRandomProvider {
    static final long GOLDEN = 0x9E3779B97F4A7C15L;

    long state0;
    long state1;

    static long mix64(long z) {
        z = (z ^ (z >>> 30)) * 0xbf58476d1ce4e5b9L;
        z = (z ^ (z >>> 27)) * 0x94d049bb133111ebL;
        return z ^ (z >>> 31);
    }

    void seed(long masterSeed, long replicate) {
        seedFromBase(mix64(masterSeed), replicate);
    }

    /** As {@link #seed}, given base = mix64(masterSeed). */
    void seedFromBase(long base, long replicate) {
        state0 = mix64(base + (2 * replicate + 1) * GOLDEN);
        state1 = mix64(base + (2 * replicate + 2) * GOLDEN);
        if ((state0 | state1) == 0) {
            state0 = GOLDEN;
        }
    }

    @Override
    public long nextLong() {
        final long s0 = state0;
        long s1 = state1;
        final long result = Long.rotateLeft(s0 + s1, 17) + s0;
        s1 ^= s0;
        state0 = Long.rotateLeft(s0, 49) ^ s1 ^ (s1 << 21);
        state1 = Long.rotateLeft(s1, 28);
        return result;
    }

    @Override
    public double nextDouble() {
        return (nextLong() >>> 11) * 0x1.0p-53;
    }

    /**
     * A geometric game length: P(N &gt; t) = delta^t, by inversion of one draw,
     * N = 1 + floor(ln U / ln delta) with U = (k + 1) 2^-53 in (0, 1] from the top 53 bits k of one
     * {@code nextLong()}. delta = 0 gives N = 1 without a draw.
     */
    long geometricLength(double delta) {
        if (delta == 0) {
            return 1;
        }
        double u = ((nextLong() >>> 11) + 1) * 0x1.0p-53;
        double k = Math.floor(Math.log(u) / Math.log(delta));
        return 1 + (long) k;
    }
}
