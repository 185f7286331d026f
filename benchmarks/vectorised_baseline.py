"""A vectorised array-library baseline for the simulator's speed claim (see README, "Performance").

Plays games of n rounds between two memory-one players with execution error, many games at once, the
way a careful NumPy programmer would: the games are taken in chunks that stay in cache, and each round
is a few whole-array operations on a chunk (one 64-bit draw per game read as two 32-bit words, a table
lookup of both players' integer thresholds by the last state, two comparisons, the new states, a
bincount of the transitions). The decision rule is the simulator's: X cooperates iff the high 32 bits of
the round's draw are below round(c 2^32), Y iff the low 32 bits are. It tallies what `simulate` prints
(state and transition counts) but not the per-game statistics the simulator also keeps for
replicate-level inference, so the comparison favours this script.

    python3 benchmarks/vectorised_baseline.py [games] [rounds] [--plain]

prints rounds per second; benchmarks/compare.sh runs it and `simulate` alternately on the same machine.
--plain runs the textbook version instead (all games in one array, uniform doubles, fancy indexing,
states only), which is about half as fast: it is kept to show what the tuning above is worth.
"""
import sys
import time

import numpy as np

CHUNK = 1 << 13


def thresholds(c):
    """round(c 2^32) as uint32, so that a 32-bit word u cooperates iff u < threshold. Kept in 32 bits for
    speed, so c = 1 becomes 2^32 - 1 (an error of 2^-32 that the simulator does not make)."""
    return np.minimum(np.round(np.asarray(c, dtype=np.float64) * 2.0**32), 2.0**32 - 1).astype(np.uint32)


def simulate(p, q, e, games, rounds, seed=1):
    """Returns the state counts (CC, CD, DC, DD from X's view) over all games and rounds, and the 4 x 4
    transition counts (row: the state of round t - 1), the two tallies `simulate` prints."""
    p = np.asarray(p, dtype=np.float64)
    q = np.asarray(q, dtype=np.float64)
    # execution error folded into the cooperation probabilities, Y's table moved to X's view of the state
    cx = (1 - e) * p + e * (1 - p)
    cy = ((1 - e) * q + e * (1 - q))[[0, 2, 1, 3]]
    # column 0 is compared with the low word (Y), column 1 with the high word (X): little-endian layout
    table = np.stack([thresholds(cy), thresholds(cx)], axis=1)
    first = np.array([[thresholds(1 - e), thresholds(1 - e)]], dtype=np.uint32)
    bits = np.random.default_rng(seed).bit_generator
    states = np.zeros(4, dtype=np.int64)
    transitions = np.zeros(16, dtype=np.int64)
    for start in range(0, games, CHUNK):
        g = min(CHUNK, games - start)
        words = bits.random_raw(g).view(np.uint32).reshape(g, 2)
        d = (words >= first).view(np.uint8)
        state = d[:, 1] * np.uint8(2) + d[:, 0]
        states += np.bincount(state, minlength=4)
        steps = np.zeros(16, dtype=np.int64)
        for _ in range(rounds - 1):
            words = bits.random_raw(g).view(np.uint32).reshape(g, 2)
            d = (words >= np.take(table, state, axis=0)).view(np.uint8)
            new = d[:, 1] * np.uint8(2) + d[:, 0]
            steps += np.bincount(state * np.uint8(4) + new, minlength=16)
            state = new
        transitions += steps
    # every round after the first is the current state of one transition
    return states + transitions.reshape(4, 4).sum(axis=0), transitions.reshape(4, 4)


def simulate_plain(p, q, e, games, rounds, seed=1):
    """The textbook version: returns the state counts over all games and rounds, and None."""
    rng = np.random.default_rng(seed)
    p = np.asarray(p, dtype=np.float64)
    q = np.asarray(q, dtype=np.float64)
    px = (1 - e) * p + e * (1 - p)
    qy = ((1 - e) * q + e * (1 - q))[[0, 2, 1, 3]]
    u = rng.random((2, games))
    state = 2 * (u[0] >= 1 - e).astype(np.int8) + (u[1] >= 1 - e)
    counts = np.bincount(state, minlength=4)
    for _ in range(rounds - 1):
        u = rng.random((2, games))
        state = 2 * (u[0] >= px[state]).astype(np.int8) + (u[1] >= qy[state])
        counts += np.bincount(state, minlength=4)
    return counts, None


def main():
    args = [a for a in sys.argv[1:] if a != "--plain"]
    run = simulate_plain if "--plain" in sys.argv[1:] else simulate
    games = int(args[0]) if len(args) > 0 else 1_000_000
    rounds = int(args[1]) if len(args) > 1 else 200
    wsls = [1, 0, 0, 1]
    tft = [1, 0, 1, 0]
    run(wsls, tft, 0.01, 10_000, 10)  # warm-up
    t0 = time.perf_counter()
    counts, _ = run(wsls, tft, 0.01, games, rounds)
    seconds = time.perf_counter() - t0
    total = games * rounds
    print(f"numpy {np.__version__}{' (plain)' if run is simulate_plain else ''}: {total} rounds in {seconds:.2f} s = {total / seconds:.3e} rounds/s; "
          f"state shares {np.round(counts / total, 4).tolist()}")


if __name__ == "__main__":
    main()
