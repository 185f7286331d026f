package reprise.experiment;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Calibration profile for issue 12 (about 2-4 minutes on 2 cores; {@code mvn -B verify -Pcalibration}):
 * near-deterministic and rare-state cases run through the whole runner, 100 experiment seeds each, every
 * prediction true (the exact model is the simulated one). Measured per case: the coverage of every
 * reported 95% interval of the {@code exact} rows (does it contain the exact value?) and the share of seeds
 * in which the experiment would exit 1.
 *
 * <p>Budgets. Coverage: a finite-sample interval covers at least 0.95 by construction (measured 1.000 on
 * these cases: it over-covers, see README); the effective-size interval is an approximation (measured
 * 0.915-0.955). A case fails if an interval's coverage over 100 runs is below 0.88 (finite-sample and t)
 * or 0.85 (effective-size): at true coverage 0.95, P(Binomial(100, 0.95) &lt; 88) = 0.0015, and at the
 * lowest measured 0.915, P(Binomial(100, 0.915) &lt; 85) is about 0.01. Exit 1: at most alpha = 0.05 per
 * seed under Holm when every test is valid; fail above 11 of 100, P(Binomial(100, 0.05) &gt; 11) = 0.004.
 * The seeds are 1 to 100 and are in the messages.
 */
@Tag("calibration")
class NearDeterministicCalibrationTest {

    @TempDir
    Path dir;

    static Stream<Arguments> cases() {
        return Stream.of(
            Arguments.of("wsls-wsls-0.005-r5-g10", "  - {name: w, x: wsls, y: wsls}\n", "  noise: [0.005]\n  rounds: [5]\n",
                10),
            Arguments.of("tft-gtft-0.003-r20-g12", "  - {name: w, x: tft, y: gtft}\n", "  noise: [0.003]\n  rounds: [20]\n",
                12),
            Arguments.of("wsls-tft-0.002-r60-g20", "  - {name: w, x: wsls, y: tft}\n", "  noise: [0.002]\n  rounds: [60]\n",
                20),
            Arguments.of("tf2t-stft-0.03-r20-g200", "  - {name: w, x: tf2t, y: stft}\n",
                "  noise: [0.03]\n  rounds: [20]\n", 200),
            Arguments.of("tft-tft-perception-0.01-delta-0.9-g30", "  - {name: w, x: tft, y: tft}\n",
                "  noise: [0]\n  misperception: [0.01]\n  continuation: [0.9]\n", 30));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    void intervalsCoverAndTrueModelsRarelyExitOne(String name, String pair, String grid, int games) {
        Map<String, int[]> coverage = new TreeMap<>();
        int exitOne = 0;
        List<Integer> failing = new ArrayList<>();
        for (int seed = 1; seed <= 100; seed++) {
            Runner.Outcome o = Runs.run(dir.resolve("s" + seed), Runs.experiment(pair, grid, games, seed, 0.02,
                "tests: [frequencies, transitions]\n"), null);
            if (o.disagrees()) {
                exitOne++;
                failing.add(seed);
            }
            for (ResultRow r : o.rows()) {
                if (r.comparisonKind() == ComparisonKind.EXACT && Double.isFinite(r.lower())) {
                    int[] c = coverage.computeIfAbsent(r.subject().label() + "/" + r.diagnosis().intervalMethod(),
                        k -> new int[2]);
                    c[1]++;
                    c[0] += r.lower() <= r.predicted() && r.predicted() <= r.upper() ? 1 : 0;
                }
            }
        }
        StringBuilder summary = new StringBuilder(name + ": exit 1 in " + exitOne + " of 100 seeds " + failing + ";");
        coverage.forEach((k, c) -> summary.append(String.format(Locale.ROOT, " %s %d/%d", k, c[0], c[1])));
        System.out.println(summary);
        assertTrue(exitOne <= 11, summary.toString());
        coverage.forEach((k, c) -> {
            double floor = k.endsWith("/effective-size") ? 0.85 : 0.88;
            assertTrue(c[0] >= floor * c[1], k + " covered " + c[0] + " of " + c[1] + "; " + summary);
        });
    }

    /**
     * Issue 12 item 3 and 6: a mixed experiment of 12 cases (four near-deterministic or rare-state pairs at
     * 0.2%, 0.5% and 3% error, 20 rounds, 20 games) in which every prediction is true exited 1 in 8 of 40
     * seeds before. Now at most alpha = 0.05 of seeds: 40 seeds, fail above 6,
     * P(Binomial(40, 0.05) &gt; 6) = 0.0034 (exact binomial tail).
     */
    @Test
    void allTrueMixedExperimentRarelyExitsOne() {
        String pairs = "  - {name: a, x: wsls, y: wsls}\n  - {name: b, x: tft, y: gtft}\n"
            + "  - {name: c, x: tf2t, y: stft}\n  - {name: d, x: wsls, y: tft}\n";
        int exitOne = 0;
        List<Integer> failing = new ArrayList<>();
        for (int seed = 1; seed <= 40; seed++) {
            Runner.Outcome o = Runs.run(dir.resolve("m" + seed), Runs.experiment(pairs,
                "  noise: [0.002, 0.005, 0.03]\n  rounds: [20]\n", 20, seed, 0.02, "snapshots: [1, 5]\n"), null);
            if (o.disagrees()) {
                exitOne++;
                failing.add(seed);
            }
        }
        System.out.println("mixed all-true experiment: exit 1 in " + exitOne + " of 40 seeds " + failing);
        assertTrue(exitOne <= 6, exitOne + " of 40 seeds exited 1: " + failing);
    }

    /**
     * Issue 12 item 3: the Wald test of tf2t vs stft at 0.5% error, 40 rounds, 300 games rejects about 5%
     * of the time at 0.05, but its asymptotic p-value falls below 0.001 in about 2% of repetitions
     * (calibrate, 1000 repetitions, README). Through check, where its tail is not trusted the p-value is a
     * Monte Carlo p-value under the exact model, valid at every level: P(p &lt; 0.001) &le; 0.001. 200 seeds,
     * fail at 3 or more such p-values, P(Binomial(200, 0.001) &ge; 3) = 0.0011 (with the asymptotic tail,
     * about 4 are expected and 3 or more has probability about 0.8).
     */
    @Test
    void waldTailIsValidWhereTheNormalApproximationIsNot() {
        int small = 0;
        List<String> methods = new ArrayList<>();
        for (int seed = 1; seed <= 200; seed++) {
            Runner.Outcome o = Runs.run(dir.resolve("w" + seed), Runs.experiment("  - {name: w, x: tf2t, y: stft}\n",
                "  noise: [0.005]\n  rounds: [40]\n", 300, seed, 0.02, "tests: [frequencies]\n"), null);
            ResultRow wald = o.rows().stream().filter(r -> r.subject() == Subject.Joint.STATES).findFirst().orElseThrow();
            if (wald.pValue() < 0.001) {
                small++;
                methods.add(seed + ":" + wald.diagnosis().pMethod() + ":" + wald.pValue());
            }
        }
        System.out.println("Wald p < 0.001 through check: " + small + " of 200 " + methods);
        assertTrue(small < 3, small + " of 200 Wald p-values below 0.001: " + methods);
    }
}
