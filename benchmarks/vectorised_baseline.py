"""A vectorised array-library baseline for the simulator's speed claim (see README, "Performance").

Plays G independent games of n rounds between two memory-one players with execution error, all games
at once: each round is a handful of whole-array operations (table lookups, one uniform draw per player
and game, comparisons, a bincount of the new states). This is the usual way to make such a simulation
fast in NumPy. It prints rounds per second, so it can be compared with

    java -jar target/reprise.jar simulate --x wsls --y tft --noise 0.01 --rounds 200 --replicates 1000000

run on the same machine.

Usage: python3 benchmarks/vectorised_baseline.py [games] [rounds]
"""
import sys
import time

import numpy as np


def simulate(p, q, e, games, rounds, seed=1):
    """Returns the state counts (CC, CD, DC, DD from X's view) over all games and rounds."""
    rng = np.random.default_rng(seed)
    p = np.asarray(p, dtype=np.float64)
    q = np.asarray(q, dtype=np.float64)
    # execution error folded into the cooperation probabilities
    px = (1 - e) * p + e * (1 - p)
    # Y's table is in its own view: X-view state s = 2 xD + yD is Y-view state 2 yD + xD
    mirror = np.array([0, 2, 1, 3])
    qy = ((1 - e) * q + e * (1 - q))[mirror]
    counts = np.zeros(4, dtype=np.int64)
    # round 1: both open with cooperation (p0 = 1), then execution error
    first_x = 1 - e
    first_y = 1 - e
    u = rng.random((2, games))
    xd = (u[0] >= first_x).astype(np.int8)
    yd = (u[1] >= first_y).astype(np.int8)
    state = 2 * xd + yd
    counts += np.bincount(state, minlength=4)
    for _ in range(rounds - 1):
        u = rng.random((2, games))
        xd = u[0] >= px[state]
        yd = u[1] >= qy[state]
        state = 2 * xd.astype(np.int8) + yd
        counts += np.bincount(state, minlength=4)
    return counts


def main():
    games = int(sys.argv[1]) if len(sys.argv) > 1 else 1_000_000
    rounds = int(sys.argv[2]) if len(sys.argv) > 2 else 200
    wsls = [1, 0, 0, 1]
    tft = [1, 0, 1, 0]
    simulate(wsls, tft, 0.01, 10_000, 10)  # warm-up
    t0 = time.perf_counter()
    counts = simulate(wsls, tft, 0.01, games, rounds)
    seconds = time.perf_counter() - t0
    total = games * rounds
    print(f"numpy {np.__version__}: {total} rounds in {seconds:.2f} s = {total / seconds:.3e} rounds/s; "
          f"state shares {np.round(counts / total, 4).tolist()}")


if __name__ == "__main__":
    main()
