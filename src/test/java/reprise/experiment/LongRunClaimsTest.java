package reprise.experiment;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Claims of long-run values, claims on derived quantities and per-quantity tolerances, through the
 * experiment path. Tit-for-tat against itself with 5% execution error visits the four states equally
 * often in the long run, so each player's long-run payoff is (3 + 0 + 5 + 1) / 4 = 9/4 (team reference
 * list, item 3), while short games start at CC and pay more.
 */
class LongRunClaimsTest {

    @TempDir
    Path dir;

    private List<ResultRow> rows(String claims) throws IOException {
        Files.writeString(dir.resolve("claims.csv"), claims);
        Path file = dir.resolve("e.yaml");
        Files.writeString(file, String.join("\n",
            "experiment: long-run",
            "pairs:",
            "  - {name: tfts, x: tft, y: tft}",
            "grid:",
            "  noise: [0.05]",
            "  rounds: [10, 2000]",
            "derived:",
            "  gap: payoff_x - payoff_y",
            "tolerances:",
            "  payoffs: 10%",
            "  gap: 0.05",
            "claims: claims.csv",
            "replicates: 200",
            "seed: 3",
            ""));
        Experiment e = ExperimentFile.read(file);
        List<CaseResult> results = e.cases().stream().map(c -> Runner.runCase(e, c, 1, null)).toList();
        return Runner.analyse(e, results, Claims.readAll(e.claims(), e, e.cases())).rows();
    }

    private static ResultRow row(List<ResultRow> rows, String caseId, String quantity, ComparisonKind kind) {
        return rows.stream().filter(r -> r.caseId().equals(caseId) && r.subject().label().equals(quantity)
            && r.comparisonKind() == kind).findFirst().orElseThrow(() -> new AssertionError(caseId + " " + quantity
            + " " + kind));
    }

    @Test
    void aLongRunClaimIsCheckedExactlyAndItsBiasReportedPerLength() throws IOException {
        List<ResultRow> rows = rows(String.join("\n",
            "pair,rounds,payoff_x,payoff_y,gap,value_is,tolerance",
            "tfts,,2.25,,,long-run,1e-9",
            "tfts,,,2.6,,long-run,",
            "tfts,,,,0,long-run,",
            ""));
        for (String id : List.of("tfts/rounds=10", "tfts/rounds=2000")) {
            ResultRow exact = row(rows, id, "payoff_x", ComparisonKind.CLAIM_VS_EXACT);
            assertEquals(Verdict.AGREES, exact.verdict(), exact.note());
            assertEquals(2.25, exact.observed(), 1e-12);
            assertEquals(Verdict.DISAGREES, row(rows, id, "payoff_y", ComparisonKind.CLAIM_VS_EXACT).verdict(),
                "2.6 is not the long-run payoff");
            assertEquals(Verdict.AGREES, row(rows, id, "gap", ComparisonKind.CLAIM_VS_EXACT).verdict(),
                "a symmetric pair: the long-run gap is 0");
        }
        ResultRow shortGames = row(rows, "tfts/rounds=10", "payoff_x", ComparisonKind.LONG_RUN_CLAIM_VS_SIMULATION);
        assertTrue(shortGames.note().contains("exact finite-horizon bias (value for rounds=10 minus the claim) = 0."),
            shortGames.note());
        assertTrue(!shortGames.comparisonKind().countsTowardsExit());
        assertEquals(Verdict.DISAGREES, shortGames.verdict(), "10-round games pay clearly more than 9/4: "
            + shortGames.note());
    }

    @Test
    void tolerancesPerQuantityAndPerClaimRow() throws IOException {
        List<ResultRow> rows = rows(String.join("\n",
            "pair,rounds,payoff_x,payoff_y,tolerance",
            "tfts,2000,2.25,,1%",
            ""));
        ResultRow payoff = row(rows, "tfts/rounds=2000", "payoff_x", ComparisonKind.EXACT);
        double h = 0.1 * Math.abs(payoff.predicted());
        assertTrue(payoff.note().contains("within +-" + Comparisons.fmt(h)), payoff.note());
        ResultRow gap = row(rows, "tfts/rounds=2000", "gap", ComparisonKind.EXACT);
        assertTrue(gap.note().contains("within +-0.05000"), gap.note());
        ResultRow cc = row(rows, "tfts/rounds=2000", "CC", ComparisonKind.EXACT);
        assertTrue(cc.note().contains("within +-0.01000"), "the experiment's default: " + cc.note());
        ResultRow claim = row(rows, "tfts/rounds=2000", "payoff_x", ComparisonKind.CLAIM_VS_SIMULATION);
        assertTrue(claim.note().contains("within +-0.02250"), claim.note());
    }
}
