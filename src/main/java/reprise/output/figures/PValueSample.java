package reprise.output.figures;

import java.util.Arrays;

/**
 * The p-values one test produced over K independent replications.
 *
 * @param testName the test's name, shown in the legend
 * @param pValues the p-values, each in [0, 1] (NaN allowed: skipped with a note); any order
 */
public record PValueSample(String testName, double[] pValues) {

    /**
     * Validates the name and the values and copies the array.
     *
     * @param testName non-blank
     * @param pValues at least one value, each in [0, 1] or NaN
     */
    public PValueSample {
        testName = Validation.label("test name", testName);
        if (testName.isEmpty()) {
            throw new IllegalArgumentException("test name must not be blank");
        }
        pValues = Validation.nonEmpty("p-values of " + testName, pValues);
        for (int i = 0; i < pValues.length; i++) {
            double p = pValues[i];
            if (!Double.isNaN(p) && !(p >= 0 && p <= 1)) {
                throw new IllegalArgumentException("p-value " + i + " of " + testName
                    + " must be in [0, 1]: " + p);
            }
        }
    }

    /** @return the p values (a copy) */
    @Override
    public double[] pValues() {
        return pValues.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof PValueSample s && testName.equals(s.testName) && Arrays.equals(pValues, s.pValues);
    }

    @Override
    public int hashCode() {
        return testName.hashCode() * 31 + Arrays.hashCode(pValues);
    }

    @Override
    public String toString() {
        return "PValueSample[" + testName + ", K = " + pValues.length + "]";
    }
}
