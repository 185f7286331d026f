package reprise.output.figures;

import java.util.List;

/**
 * Data for the p-value calibration (QQ) figure: one sample of p-values per test.
 *
 * @param title a title drawn above the plot, or blank for none
 * @param samples one entry per test, drawn in this order
 */
public record CalibrationData(String title, List<PValueSample> samples) {

    /**
     * Validates the data.
     *
     * @param title the title, may be blank
     * @param samples at least one sample, test names distinct
     */
    public CalibrationData {
        title = Validation.label("title", title);
        samples = Validation.nonEmpty("p-value samples", samples);
        if (samples.stream().map(PValueSample::testName).distinct().count() != samples.size()) {
            throw new IllegalArgumentException("test names must be distinct: "
                + samples.stream().map(PValueSample::testName).toList());
        }
    }
}
