package reprise.validation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.experiment.CalibrationStudy;
import reprise.experiment.TestId;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.sim.SimulationSpec;

/**
 * The long calibration study (tag "calibration", run with {@code mvn -B verify -Pcalibration}): K = 200
 * repetitions at alpha = 0.05 on five true-model cases, and K = 100 repetitions with the noise misstated by
 * one percentage point on the same cases.
 *
 * <p>False-failure budget, size part: about 45 valid tests; under exact calibration a rejection count
 * falls outside the acceptance window [3, 19] of 200 (rate 0.015 to 0.095) with probability
 * P(Bin(200, 0.05) &le; 2) + P(Bin(200, 0.05) &ge; 20) = 0.0023 + 0.0027 = 0.0050 (binomial sums computed
 * independently); the study fails if 3 or more tests fall outside, probability about
 * C(45, 3) 0.005^3 = 0.0018 (treating tests as independent; tests of one case are positively dependent,
 * which concentrates failures in fewer cases but does not change the expected count 0.23). Power part:
 * the best frequency or transition test measured 1.00 in four cases and 0.96 in the memory-one pair (4000
 * games), so with K = 100 a rate below 0.8 by chance is negligible (P(Bin(100, 0.96) &lt; 80) &lt; 1e-9).
 * Run time on 2 shared cores: about 12 s (plus Maven start-up).
 */
@Tag("calibration")
class CalibrationStudyTest {
    private static final long SEED = 0xCA11_B8A7EL;

    /**
     * A case with its misstated noise.
     *
     * @param c the true case (its games are the replicates per repetition)
     * @param wrong the noise the power run predicts under
     */
    record Study(Cases.Case c, Noise wrong) {
        @Override
        public String toString() {
            return c.name();
        }
    }

    static List<Study> studies() {
        return List.of(
            new Study(new Cases.Case("tft vs tft, execution 0.05, 50 rounds", "tft", "tft",
                new Noise(0.05, 0.05, 0, 0), Horizon.rounds(50), 0, 500), new Noise(0.04, 0.04, 0, 0)),
            new Study(new Cases.Case("wsls vs tft, perception 0.05, delta 0.9", "wsls", "tft",
                new Noise(0, 0, 0.05, 0.05), Horizon.continuation(0.9), 0, 1000), new Noise(0, 0, 0.04, 0.04)),
            new Study(new Cases.Case("tf2t vs tft, execution 0.05, 50 rounds", "tf2t", "tft",
                new Noise(0.05, 0.05, 0, 0), Horizon.rounds(50), 0, 500), new Noise(0.04, 0.04, 0, 0)),
            new Study(new Cases.Case("grim vs tft, both noises 0.02, 200 rounds, burn-in 10", "grim", "tft",
                Noise.symmetric(0.02, 0.02), Horizon.rounds(200), 10, 300), Noise.symmetric(0.01, 0.02)),
            new Study(new Cases.Case("memory-one pair, execution 0.05, delta 0.95, burn-in 5",
                "memory1:0.9,0.2,0.7,0.1", "memory1:0.8,0.3,0.6,0.2", new Noise(0.05, 0.05, 0, 0),
                Horizon.continuation(0.95), 5, 4000), new Noise(0.04, 0.04, 0, 0)));
    }

    private static SimulationSpec spec(Cases.Case c, long seed) {
        return SimulationSpec.of(c.match(), c.horizon(), c.games(), seed).withBurnIn(c.burnIn()).withThreads(2);
    }

    @Test
    void falseAlarmRatesAreNearAlpha() {
        List<String> outside = new ArrayList<>();
        int valid = 0;
        List<Study> all = studies();
        for (int i = 0; i < all.size(); i++) {
            Cases.Case c = all.get(i).c();
            long seed = SEED + i;
            CalibrationStudy.Result r = CalibrationStudy.of(spec(c, seed)).withRepetitions(200).run(null);
            assertTrue(r.trueModel());
            System.out.println("size, " + c.name() + ", seed " + seed + ", K = 200, alpha = 0.05");
            for (CalibrationStudy.TestCalibration t : r.tests()) {
                assertEquals(200, t.summary().replications(), t.name());
                double rate = t.summary().rejectionRate().estimate();
                System.out.println(String.format(Locale.ROOT, "  %-50s %.3f  KS p %.3g", t.name(), rate,
                    t.summary().uniformityPValue()));
                if (t.illustration()) {
                    assertEquals(TestId.Standard.POOLED_ROUNDS_ILLUSTRATION, t.test(), t.name());
                    continue;
                }
                valid++;
                if (!(rate >= 0.015 && rate <= 0.095)) {
                    outside.add(c.name() + ": " + t.name() + " " + rate);
                }
            }
        }
        assertTrue(valid >= 40, "valid tests: " + valid);
        assertTrue(outside.size() <= 2, "rejection rates outside [0.015, 0.095]: " + outside);
    }

    static Stream<Arguments> powerCases() {
        return studies().stream().map(Arguments::of);
    }

    @ParameterizedTest
    @MethodSource("powerCases")
    void misstatedNoiseIsDetected(Study s) {
        Cases.Case c = s.c();
        Match wrong = new Match(c.match().game(), c.match().x(), c.match().y(), s.wrong());
        CalibrationStudy.Result r = CalibrationStudy.of(spec(c, SEED + 100)).withRepetitions(100)
            .withPrediction(wrong, c.horizon()).run(null);
        assertTrue(!r.trueModel());
        double best = 0;
        System.out.println("power, " + c.name() + ", predicted " + s.wrong() + ", K = 100");
        for (CalibrationStudy.TestCalibration t : r.tests()) {
            System.out.println(String.format(Locale.ROOT, "  %-50s %.3f", t.name(),
                t.summary().rejectionRate().estimate()));
            if (t.test() == TestId.Standard.FREQUENCIES_WALD || t.test() == TestId.Standard.TRANSITIONS_PEARSON
                || t.test() == TestId.Standard.TRANSITIONS_LR) {
                best = Math.max(best, t.summary().rejectionRate().estimate());
            }
        }
        assertTrue(best >= 0.8, "best frequency or transition test rejects in " + best + " of repetitions");
    }
}
