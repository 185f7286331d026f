package reprise.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import org.junit.jupiter.api.Test;
import reprise.stats.TestResult;

/**
 * The report's words for each small-sample remedy: they are the project's own wording (no outside
 * source) and appear in the warnings section of every report whose tests changed method, so they are
 * pinned here as well as end to end.
 */
class ReportTest {

    @Test
    void eachSmallSampleRemedyHasItsWords() {
        assertNull(Report.smallSampleRemedy(TestResult.SmallSample.NONE));
        assertEquals("exact multinomial test", Report.smallSampleRemedy(TestResult.SmallSample.EXACT));
        assertEquals("Monte Carlo multinomial test", Report.smallSampleRemedy(TestResult.SmallSample.MONTE_CARLO));
        assertEquals("1 sparse cells (expected count below 5) pooled within their rows",
            Report.smallSampleRemedy(TestResult.SmallSample.pooled(1)));
    }
}
