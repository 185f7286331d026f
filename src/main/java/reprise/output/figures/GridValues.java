package reprise.output.figures;

import java.util.Arrays;

/**
 * A number per cell of a grid, for the value heatmap.
 *
 * @param title a title drawn above the plot, or blank for none
 * @param axes the grid's axes
 * @param valueDescription what the colour shows, e.g. "|observed - exact| / standard error"; drawn as the
 *     colour bar's title
 * @param values {@code values[row][column]}, row 0 at the bottom (matching {@code axes.yLabels()}),
 *     column 0 at the left; NaN or infinite cells are left white and counted in a note
 */
public record GridValues(String title, GridAxes axes, String valueDescription, double[][] values) {

    /**
     * Validates the shape and deep-copies the values.
     *
     * @param title the title, may be blank
     * @param axes not null
     * @param valueDescription non-blank
     * @param values rows x columns
     */
    public GridValues {
        title = Validation.label("title", title);
        if (axes == null) {
            throw new IllegalArgumentException("grid axes must be given: null");
        }
        valueDescription = Validation.label("value description", valueDescription);
        if (valueDescription.isEmpty()) {
            throw new IllegalArgumentException("value description (what the colour shows) must not be blank");
        }
        if (values == null || values.length != axes.rows()) {
            throw new IllegalArgumentException("grid values must have one row per y label (" + axes.rows() + "): "
                + (values == null ? "none given" : values.length));
        }
        double[][] copy = new double[values.length][];
        for (int r = 0; r < values.length; r++) {
            copy[r] = Validation.sameLength("grid row " + r, values[r], axes.columns());
        }
        values = copy;
    }

    /** @return the values (a copy) */
    @Override
    public double[][] values() {
        double[][] copy = new double[values.length][];
        for (int r = 0; r < values.length; r++) {
            copy[r] = values[r].clone();
        }
        return copy;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof GridValues g && title.equals(g.title) && axes.equals(g.axes)
            && valueDescription.equals(g.valueDescription) && Arrays.deepEquals(values, g.values);
    }

    @Override
    public int hashCode() {
        return java.util.Objects.hash(title, axes, valueDescription, Arrays.deepHashCode(values));
    }

    /**
     * The smallest and largest finite value over several grids, for one colour range shared by all
     * (see {@link Figures#withColourRange}).
     *
     * @param grids the grids
     * @return {min, max}, or {NaN, NaN} when no cell is finite
     */
    public static double[] range(java.util.Collection<GridValues> grids) {
        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        for (GridValues g : grids) {
            for (double[] row : g.values) {
                for (double v : row) {
                    if (Double.isFinite(v)) {
                        min = Math.min(min, v);
                        max = Math.max(max, v);
                    }
                }
            }
        }
        return min <= max ? new double[] {min, max} : new double[] {Double.NaN, Double.NaN};
    }
}
