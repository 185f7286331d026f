package reprise.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.MathContext;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class Decimal15Test {

    private static String text(double v) {
        StringBuilder sb = new StringBuilder();
        Decimal15.append(sb, v);
        return sb.toString();
    }

    @ParameterizedTest
    @CsvSource({"0,0", "-0.0,0", "1,1", "0.5,0.5", "2.25,2.25", "-3,-3", "100,100", "0.001,0.001",
        "0.00001,0.00001", "0.000001,1E-6", "1e15,1E15", "123456789012345,123456789012345",
        "0.1,0.1", "0.3333333333333333,0.333333333333333", "0.6666666666666666,0.666666666666667",
        "9.999999999999999,10", "1e-300,1E-300", "3.7272727272727275,3.72727272727273"})
    void knownTexts(double v, String expected) {
        assertEquals(expected, text(v));
    }

    /**
     * Every printed value equals the value rounded to 15 significant digits by BigDecimal (exact decimal
     * arithmetic, HALF_EVEN), within one unit in the 15th digit as the implementation note states; and it
     * reads back within a relative 1e-14. Random values over 40 decades, seed fixed.
     */
    @Test
    void agreesWithExactRounding() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(15L);
        for (int i = 0; i < 200_000; i++) {
            double v = (rng.nextDouble() - 0.5) * Math.pow(10, rng.nextInt(40) - 20);
            String s = text(v);
            BigDecimal printed = new BigDecimal(s);
            BigDecimal exact = new BigDecimal(v).round(new MathContext(15));
            BigDecimal unit = exact.ulp();
            assertTrue(printed.subtract(exact).abs().compareTo(unit) <= 0, v + " printed " + s);
            double back = Double.parseDouble(s);
            assertEquals(v, back, Math.abs(v) * 1e-14, s);
        }
    }

    /**
     * The byte writer prints exactly the text of the StringBuilder writer (the one checked above), for the
     * known texts, random values over 44 decades (beyond the fast range at both ends), special values and
     * several numbers in one buffer. Common practice, no source: two routes through the same algorithm.
     */
    @Test
    void bytesEqualTheText() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(16L);
        AsciiBuffer all = new AsciiBuffer(16);
        StringBuilder expected = new StringBuilder();
        double[] special = {0, -0.0, 1, -1, 1e20, 1e-20, 9.999999999999999e19, Double.NaN, Double.POSITIVE_INFINITY,
            Double.NEGATIVE_INFINITY, Double.MIN_VALUE, Double.MAX_VALUE, 123456789012345.0, 0.000001, 1e15};
        for (int i = 0; i < 100_000 + special.length; i++) {
            double v = i < special.length ? special[i]
                : (rng.nextDouble() - 0.5) * Math.pow(10, rng.nextInt(44) - 22);
            AsciiBuffer one = new AsciiBuffer(1);
            Decimal15.append(one, v);
            assertEquals(text(v), one.toString(), Double.toString(v));
            Decimal15.append(all, v);
            all.put(',');
            expected.append(text(v)).append(',');
        }
        assertEquals(expected.toString(), all.toString());
    }
}
