package reprise.output.figures;

/** The numeric range of a colour bar, rounded outwards so its end labels are short. */
final class ColourScale {
    private ColourScale() {
    }

    /**
     * A range that contains [min, max] and whose ends have two significant digits.
     *
     * @param min the smallest value, finite
     * @param max the largest value, finite, at least {@code min}
     * @return {low, high} with low < high
     */
    static double[] niceRange(double min, double max) {
        if (min == max) {
            double pad = min == 0 ? 1 : Math.abs(min) * 0.1;
            min -= pad;
            max += pad;
        }
        double magnitude = Math.max(Math.abs(min), Math.abs(max));
        double unit = Math.pow(10, Math.floor(Math.log10(magnitude)) - 1);
        double low = Math.floor(min / unit) * unit;
        double high = Math.ceil(max / unit) * unit;
        return new double[] {round(low, unit), round(high, unit)};
    }

    private static double round(double v, double unit) {
        // strips binary noise such as 0.30000000000000004 so the legend prints "0.3"
        int digits = (int) Math.max(0, -Math.floor(Math.log10(unit)));
        return new java.math.BigDecimal(v).setScale(digits, java.math.RoundingMode.HALF_EVEN).doubleValue();
    }

    /**
     * The smallest of 1, 2, 2.5 and 5 times a power of ten that is at least {@code raw}.
     *
     * @param raw a positive step
     * @return the round step
     */
    static double niceStep(double raw) {
        if (!(raw > 0) || !Double.isFinite(raw)) {
            return 1;
        }
        double unit = Math.pow(10, Math.floor(Math.log10(raw)));
        for (double m : new double[] {1, 2, 2.5, 5, 10}) {
            if (m * unit >= raw * (1 - 1e-12)) {
                return round(m * unit, unit / 10);
            }
        }
        return 10 * unit;
    }
}
