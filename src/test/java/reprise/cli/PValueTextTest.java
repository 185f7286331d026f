package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import reprise.experiment.BaseQuantity;
import reprise.experiment.ComparisonKind;
import reprise.experiment.ResultRow;
import reprise.experiment.Subject;
import reprise.experiment.Verdict;
import reprise.output.Report;
import reprise.stats.TestResult;

/**
 * p-values for people (report.md, stdout): an underflowed 0 or a subnormal value is not a p-value anyone
 * can read, so both print as "&lt; 1e-300"; results.csv keeps the number. A disagreeing joint test (no single
 * predicted or observed value) prints its statistic and p-value, not "predicted -, observed -".
 */
class PValueTextTest {

    @Test
    void tinyPValuesPrintAsBelowTheShownLimit() {
        assertEquals("< 1e-300", Report.pValue(0));
        assertEquals("< 1e-300", Report.pValue(5.94e-308));
        assertEquals("1.00e-299", Report.pValue(1e-299));
        assertEquals("0.0123", Report.pValue(0.0123));
        assertEquals("", Report.pValue(Double.NaN));
    }

    @Test
    void aDisagreeingWaldTestPrintsItsStatisticAndP() {
        ResultRow wald = new ResultRow(0, "pair/noise=0.1/rounds=10", Subject.Joint.STATES, ComparisonKind.EXACT,
            Double.NaN, Double.NaN, Double.NaN, Double.NaN, 1432.5, 3, 0, 0, Verdict.DISAGREES,
            "Wald test, exact covariance", TestResult.SmallSample.NONE, ResultRow.Diagnosis.NONE);
        assertEquals("statistic 1432.50 on 3 df, adjusted p < 1e-300", RunSummary.disagreement(wald));
        ResultRow z = new ResultRow(0, "pair/noise=0.1/rounds=10", BaseQuantity.PAYOFF_X, ComparisonKind.EXACT,
            2.25, 2.5, 2.4, 2.6, 4.1, Double.NaN, 4e-5, 2e-3, Verdict.DISAGREES, "z-test", TestResult.SmallSample.NONE,
            ResultRow.Diagnosis.NONE);
        assertEquals("predicted 2.25000, observed 2.50000, adjusted p = 0.002", RunSummary.disagreement(z));
    }
}
