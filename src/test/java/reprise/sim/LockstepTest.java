package reprise.sim;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Locale;
import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;

/**
 * The lockstep kernel is the per-game fused kernel played in another order: for every spec it must give
 * exactly the same tallies (an identity of integer sums, not a statistical agreement). The cases cover
 * random memory-one and reactive players with probabilities 0 and 1 among them, both noise kinds, game
 * lengths on either side of the 15- and 255-round counter spills, burn-in from none to all rounds but the last,
 * snapshots, time-resolved rounds, replicate counts that leave a partial block, and both ways of
 * selecting the limits (packed when every limit fits in 32 bits, and not). The per-game fused
 * kernel is itself checked against the exact engine and the literal path elsewhere.
 */
class LockstepTest {
    private static final long[] LENGTHS = {1, 2, 14, 15, 16, 17, 30, 254, 255, 256, 257, 271, 530};

    static Stream<Arguments> cases() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(20261201L);
        Stream.Builder<Arguments> b = Stream.builder();
        for (int c = 0; c < 26; c++) {
            long n = LENGTHS[c % LENGTHS.length];
            long burnIn = switch (c % 5) {
                case 0 -> 0;
                case 1 -> 1;
                case 2 -> Math.max(0, n - 1);
                case 3 -> n / 2;
                default -> n / 3;
            };
            Noise noise = new Noise(pick(rng, 0.1), pick(rng, 0.1), pick(rng, 0.2), pick(rng, 0.2));
            int replicates = 1 + rng.nextInt(700);
            b.add(Arguments.of(c, strategy(rng), strategy(rng), noise, n, burnIn, replicates));
        }
        // one case for each way of selecting the limits: packed (every limit >= 0) and not
        b.add(Arguments.of(26, "wsls", "tft", Noise.symmetric(0.01, 0), 200L, 0L, 600));
        b.add(Arguments.of(27, "tft", "grim", Noise.symmetric(0, 0.05), 90L, 2L, 300));
        return b.build();
    }

    private static double pick(UniformRandomProvider rng, double max) {
        return rng.nextInt(3) == 0 ? 0 : rng.nextDouble() * max;
    }

    private static String strategy(UniformRandomProvider rng) {
        String[] named = {"wsls", "tft", "grim", "alld", "allc", "gtft", "random"};
        if (rng.nextInt(3) == 0) {
            return named[rng.nextInt(named.length)];
        }
        StringBuilder sb = new StringBuilder(rng.nextBoolean() ? "memory1:" : "reactive:");
        int k = sb.charAt(0) == 'm' ? 4 : 2;
        for (int i = 0; i < k; i++) {
            int kind = rng.nextInt(4);
            double p = kind == 0 ? 0 : kind == 1 ? 1 : rng.nextDouble();
            sb.append(i > 0 ? "," : "").append(String.format(Locale.ROOT, "%.6f", p));
        }
        if (sb.charAt(0) == 'r') {
            sb.append(String.format(Locale.ROOT, "@%.6f", rng.nextDouble()));
        }
        return sb.toString();
    }

    @ParameterizedTest(name = "case {0}: {1} vs {2}, n = {4}, burn-in {5}, {6} games")
    @MethodSource("cases")
    void lockstepEqualsPerGameFusedKernel(int c, String x, String y, Noise noise, long n, long burnIn,
        int replicates) {
        long[] snaps = n >= 3 ? new long[] {1, (n + 1) / 2, n} : new long[] {n};
        SimulationSpec spec = SimulationSpec.of(DeterminismTest.match(x, y, noise), Horizon.rounds(n), replicates,
            700 + c).withBurnIn(burnIn).withSnapshots(snaps).withTimeResolved((int) Math.min(n, 40));
        SimulationResult perGame = new Simulator(spec).simulatePerGame(0, replicates);
        Simulator lockstep = new Simulator(spec.withThreads(2), 97);
        assertTrue(lockstep.playsInLockstep());
        assertEquals(perGame, lockstep.run(), "lockstep on 2 threads, chunks of 97 games");
        assertEquals(perGame, new Simulator(spec.withThreads(1)).run(), "default chunks, 1 thread");
        assertEquals(perGame, lockstep.simulateLockstep(0, replicates, 0), "per-game statistics branch");
        assertEquals(perGame, lockstep.simulateLockstep(0, replicates, LaneCounters.BLOCK_STATISTICS_LENGTH),
            "auto-vectorised lockstep kernel, whatever the VM offers");

        // the vector API kernel takes only plans without burn-in, snapshots and time-resolved rounds
        SimulationSpec plain = SimulationSpec.of(DeterminismTest.match(x, y, noise), Horizon.rounds(n), replicates,
            700 + c);
        Simulator simd = new Simulator(plain, 97, 0);
        if (simd.simdApplies()) {
            SimulationResult expected = new Simulator(plain).simulatePerGame(0, replicates);
            assertEquals(expected, simd.simulateSimd(0, replicates), "vector API kernel");
            assertEquals(expected, new Simulator(plain.withThreads(2), 97, 0).run(), "2 threads, chunks of 97 games");
            assertEquals("lockstep-simd", simd.kernel());
        }
    }

    static Stream<Arguments> randomLengthCases() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(20261202L);
        double[] continuation = {0, 0.3, 0.9, 0.97, 0.995, 0.999};
        Stream.Builder<Arguments> b = Stream.builder();
        for (int c = 0; c < 12; c++) {
            Noise noise = new Noise(0.001 + pick(rng, 0.1), 0.001 + pick(rng, 0.1), pick(rng, 0.2), pick(rng, 0.2));
            int replicates = 1 + rng.nextInt(c < 6 ? 300 : 3000);
            b.add(Arguments.of(c, strategy(rng), strategy(rng), noise, continuation[c % continuation.length],
                replicates));
        }
        b.add(Arguments.of(12, "wsls", "tft", Noise.symmetric(0.01, 0), 0.995, 2000));
        return b.build();
    }

    /**
     * Random lengths in lockstep: a lane whose game ends takes the next game of the chunk, so lanes play
     * games of different lengths side by side; the tallies (and every per-game statistic) must be those
     * of playing the games one by one. Continuation probabilities from 0 (one-round games, played at the
     * start) to 0.999 (games past the 255-round spill of the 8-bit counters), every player with some
     * execution error so that the vector kernel applies.
     */
    @ParameterizedTest(name = "random lengths {0}: {1} vs {2}, delta = {4}, {5} games")
    @MethodSource("randomLengthCases")
    void randomLengthsInLockstepEqualPerGame(int c, String x, String y, Noise noise, double delta, int replicates) {
        SimulationSpec spec = SimulationSpec.of(DeterminismTest.match(x, y, noise), Horizon.continuation(delta),
            replicates, 900 + c);
        Simulator simd = new Simulator(spec.withThreads(2), 97, 0);
        org.junit.jupiter.api.Assumptions.assumeTrue(simd.simdApplies(), "vector kernel not available");
        SimulationResult perGame = new Simulator(spec).simulatePerGame(0, replicates);
        assertEquals(perGame, simd.simulateSimd(0, replicates), "one call over all games");
        assertEquals(perGame, simd.run(), "2 threads, chunks of 97 games");
        assertEquals("lockstep-simd", new Simulator(spec, 0, 0).kernel());
    }

    /**
     * The build runs the tests with the export that lets the vector API be loaded, as the jar's manifest
     * does; so unless it is turned off, the vector kernel must be in use (and compared above).
     */
    @Test
    void vectorKernelIsAvailableUnderTest() {
        org.junit.jupiter.api.Assumptions.assumeFalse("off".equals(System.getProperty("reprise.simd")),
            "vector kernel turned off");
        assertEquals("available", Simulator.vectorStatus());
        SimulationSpec spec = SimulationSpec.of(DeterminismTest.match("wsls", "tft", Noise.symmetric(0.01, 0)),
            Horizon.rounds(200), 10_000_000, 1);
        assertEquals("lockstep-simd", new Simulator(spec).kernel(), "2e9 rounds");
        assertEquals("lockstep", new Simulator(spec.withReplicates(1000), 0, 1e300).kernel(),
            "before the VM's fused runs reach the least number of rounds");
        assertEquals("lockstep", new Simulator(spec.withBurnIn(5)).kernel(), "burn-in: the auto-vectorised kernel");
        SimulationSpec random = SimulationSpec.of(spec.match(), Horizon.continuation(0.995), 10_000_000, 1);
        assertEquals("lockstep-simd", new Simulator(random).kernel(), "random lengths");
        assertEquals("per-game", new Simulator(random.withReplicates(1000), 0, 1e300).kernel(),
            "random lengths, before the VM's fused runs reach the least number of rounds");
        assertTrue(new Simulator(spec).simdApplies());
    }

    @Test
    void limitsArePackedExactlyWhenEveryLimitFitsIn32Bits() {
        assertTrue(kernel("wsls", "tft", Noise.symmetric(0.01, 0)).packs(), "execution error: no limit is -1");
        assertFalse(kernel("tft", "grim", Noise.symmetric(0, 0.05)).packs(),
            "without execution error grim never cooperates after mutual defection");
        assertFalse(kernel("allc", "alld", Noise.symmetric(0, 0)).packs());
    }

    private static LockstepKernel kernel(String x, String y, Noise noise) {
        Match m = DeterminismTest.match(x, y, noise);
        Plan plan = new Plan(1, 10, 0, 0, new long[0], 0);
        return new LockstepKernel(plan, new Accumulator(1, new long[0], 0), FusedTables.of(
            (MemoryStrategy) m.x(), (MemoryStrategy) m.y(), noise));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("notLockstep")
    void otherSpecsKeepTheirKernels(String name, SimulationSpec spec, long chunk) {
        assertFalse(new Simulator(spec, chunk).playsInLockstep(), name);
    }

    static Stream<Arguments> notLockstep() {
        return Stream.of(
            Arguments.of("geometric horizon", SimulationSpec.of(DeterminismTest.match("wsls", "tft", Noise.symmetric(0.01,
                0)), Horizon.continuation(0.9), 1000, 1), 0L),
            Arguments.of("memory-two player", SimulationSpec.of(DeterminismTest.match("tf2t", "tft", Noise.symmetric(0.01,
                0)), Horizon.rounds(20), 1000, 1), 0L),
            Arguments.of("literal enactment", SimulationSpec.of(DeterminismTest.match("wsls", "tft", Noise.symmetric(0.01,
                0)), Horizon.rounds(20), 1000, 1).withEnactment(Enactment.LITERAL), 0L),
            Arguments.of("chunks of few long games", SimulationSpec.of(DeterminismTest.match("wsls", "tft",
                Noise.symmetric(0.01, 0)), Horizon.rounds(1_000_000), 100, 1), 0L),
            Arguments.of("small test chunks", SimulationSpec.of(DeterminismTest.match("wsls", "tft",
                Noise.symmetric(0.01, 0)), Horizon.rounds(20), 1000, 1), 31L));
    }
}
