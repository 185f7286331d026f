package reprise.output.figures;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class QqBandTest {

    /**
     * The smallest of K uniforms has CDF 1 - (1 - x)^K (Beta(1, K)), so its p-quantile is
     * 1 - (1 - p)^(1/K); the largest has CDF x^K (Beta(K, 1)), quantile p^(1/K). Closed forms derived
     * by hand (David and Nagaraja 2003, Order Statistics, section 2.1). The small quantiles are written
     * as -expm1(log1p(-p) / K), which avoids the cancellation in 1 - (1 - p)^(1/K) (worth about 4e-12
     * relative at K = 1000). Tolerance 1e-12 relative: the Beta inverse should be near double precision.
     */
    @ParameterizedTest
    @ValueSource(ints = {1, 2, 10, 200, 1000})
    void extremeOrderStatisticsMatchClosedForms(int k) {
        double[][] band = QqBand.pointwise(k, 0.95);
        assertEquals(-Math.expm1(Math.log1p(-0.025) / k), band[0][0], 1e-12 * band[0][0]);
        assertEquals(-Math.expm1(Math.log1p(-0.975) / k), band[1][0], 1e-12 * band[1][0]);
        assertEquals(Math.pow(0.025, 1.0 / k), band[0][k - 1], 1e-12);
        assertEquals(Math.pow(0.975, 1.0 / k), band[1][k - 1], 1e-12);
    }

    /**
     * Beta(i, K + 1 - i) is the mirror of Beta(K + 1 - i, i), so the band is symmetric about the
     * diagonal: lower_i = 1 - upper_(K+1-i). Property from the definition, no source needed.
     * The median order statistic of K = 3 (Beta(2, 2), CDF 3x^2 - 2x^3) has its 0.025 quantile at the
     * root of 3x^2 - 2x^3 = 0.025, 0.0942993...; checked here by substituting into the CDF.
     */
    @ParameterizedTest
    @ValueSource(ints = {3, 7, 50})
    void bandIsSymmetricAndMiddleQuantileSolvesTheCdf(int k) {
        double[][] band = QqBand.pointwise(k, 0.95);
        for (int i = 0; i < k; i++) {
            assertEquals(band[0][i], 1 - band[1][k - 1 - i], 1e-12);
        }
        if (k == 3) {
            double x = band[0][1];
            assertEquals(0.025, 3 * x * x - 2 * x * x * x, 1e-13);
        }
    }

    @ParameterizedTest
    @ValueSource(doubles = {0, 1, Double.NaN})
    void rejectsBadLevels(double level) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> QqBand.pointwise(5, level));
        assertEquals("band level must be in (0, 1): " + level, e.getMessage());
    }
}
