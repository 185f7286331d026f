#!/usr/bin/env bash
# Rounds per second of `simulate --threads 2` against benchmarks/vectorised_baseline.py on the same game
# (wsls against tft, 1% execution error, 200-round games), measured alternately in one run on this
# machine. Usage: benchmarks/compare.sh [repeats]   (needs target/reprise.jar and python3 with numpy)
set -euo pipefail
cd "$(dirname "$0")/.."
repeats="${1:-3}"
jar=target/reprise.jar
[ -f "$jar" ] || { echo "compare.sh: $jar is missing; build it with: mvn -B -q -DskipTests package" >&2; exit 2; }
numpy_rates=()
java_rates=()
for i in $(seq 1 "$repeats"); do
  n=$(python3 benchmarks/vectorised_baseline.py 1000000 200 | sed -E 's/.*= ([0-9.e+]+) rounds\/s.*/\1/')
  j=$(java -jar "$jar" simulate --x wsls --y tft --noise 0.01 --rounds 200 --replicates 50000000 \
        --threads 2 --seed "$i" 2>&1 >/dev/null | tr '\r' '\n' | grep 'rounds/s) on' | sed -E 's/.*\(([0-9.e+]+) rounds\/s\).*/\1/')
  printf 'run %d: numpy %s rounds/s, simulate --threads 2 %s rounds/s, ratio %.1f\n' "$i" "$n" "$j" \
    "$(python3 -c "print($j / $n)")"
  numpy_rates+=("$n")
  java_rates+=("$j")
done
python3 - "${numpy_rates[*]}" "${java_rates[*]}" <<'PY'
import statistics, sys
n = [float(v) for v in sys.argv[1].split()]
j = [float(v) for v in sys.argv[2].split()]
print(f"median: numpy {statistics.median(n):.3e}, simulate {statistics.median(j):.3e} rounds/s, "
      f"ratio of medians {statistics.median(j) / statistics.median(n):.1f}, "
      f"lowest simulate / highest numpy {min(j) / max(n):.1f}")
PY
