package reprise.output.figures;

/** How an axis maps values to positions. */
enum AxisScale {
    /** Equal steps for equal differences. */
    LINEAR,
    /** Equal steps for equal ratios (positive values only). */
    LOG;

    boolean log() {
        return this == LOG;
    }
}
