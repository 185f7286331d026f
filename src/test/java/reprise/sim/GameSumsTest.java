package reprise.sim;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;

/**
 * The batched per-game statistics of whole games equal the game-by-game ones of
 * {@link Accumulator#recordGame} (an identity of integer sums): batches of up to 256 games, a partial
 * batch, and games longer than 2^27 rounds, which are recorded on their own. Game counts are random
 * splits of the length into four states (fixed seed; any split is a valid game).
 */
class GameSumsTest {
    @Test
    void batchedStatisticsEqualGameByGame() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(20261203L);
        Accumulator batched = new Accumulator(1, new long[0], 0);
        Accumulator direct = new Accumulator(1, new long[0], 0);
        GameSums sums = new GameSums(batched);
        for (int g = 0; g < 1000; g++) {
            long length = g % 97 == 5 ? (1L << 27) + rng.nextInt(1 << 20) : 1 + rng.nextInt(g % 3 == 0 ? 5 : 3000);
            long[] n = new long[4];
            long rest = length;
            for (int s = 0; s < 3; s++) {
                n[s] = rest == 0 ? 0 : rng.nextLong(rest + 1);
                rest -= n[s];
            }
            n[3] = rest;
            sums.add(length, n[0], n[1], n[2], n[3]);
            for (int s = 0; s < 4; s++) {
                direct.states[s] += n[s];
            }
            direct.recordGame(length, n);
        }
        sums.flush();
        assertEquals(direct.games, batched.games);
        assertEquals(direct.gamesTallied, batched.gamesTallied);
        assertEquals(direct.lengthSum, batched.lengthSum);
        assertEquals(direct.lengthMin, batched.lengthMin);
        assertEquals(direct.lengthMax, batched.lengthMax);
        assertEquals(direct.talliedSum, batched.talliedSum);
        assertArrayEquals(direct.states, batched.states);
        assertArrayEquals(direct.lengthSquares, batched.lengthSquares);
        assertArrayEquals(direct.talliedSquares, batched.talliedSquares);
        assertArrayEquals(direct.productSums, batched.productSums);
        assertArrayEquals(direct.lengthStateSums, batched.lengthStateSums);
    }
}
