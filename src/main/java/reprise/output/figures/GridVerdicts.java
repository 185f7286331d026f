package reprise.output.figures;

import java.util.Arrays;
import java.util.List;

/**
 * A categorical verdict per cell of a grid, for the verdict heatmap.
 *
 * @param title a title drawn above the plot, or blank for none
 * @param axes the grid's axes
 * @param verdictNames one to three verdict names, in order of index, e.g. "consistent", "inconclusive",
 *     "deviates"; shown in the legend
 * @param verdicts {@code verdicts[row][column]}: an index into {@code verdictNames}, or -1 for a cell
 *     with no verdict (left white and counted in a note); row 0 at the bottom, column 0 at the left
 */
public record GridVerdicts(String title, GridAxes axes, List<String> verdictNames, int[][] verdicts) {

    /** The most verdict categories the figure distinguishes (one colour each). */
    public static final int MAX_VERDICTS = 3;

    /**
     * Validates the shape and the indices and deep-copies the verdicts.
     *
     * @param title the title, may be blank
     * @param axes not null
     * @param verdictNames 1 to 3 distinct names
     * @param verdicts rows x columns, each in [-1, verdictNames.size())
     */
    public GridVerdicts {
        title = Validation.label("title", title);
        if (axes == null) {
            throw new IllegalArgumentException("grid axes must be given: null");
        }
        verdictNames = Validation.nonEmpty("verdict names", verdictNames);
        if (verdictNames.size() > MAX_VERDICTS) {
            throw new IllegalArgumentException("at most " + MAX_VERDICTS + " verdict names can be coloured apart: "
                + verdictNames);
        }
        if (verdictNames.stream().distinct().count() != verdictNames.size()) {
            throw new IllegalArgumentException("verdict names must be distinct: " + verdictNames);
        }
        if (verdicts == null || verdicts.length != axes.rows()) {
            throw new IllegalArgumentException("verdicts must have one row per y label (" + axes.rows() + "): "
                + (verdicts == null ? "none given" : verdicts.length));
        }
        int[][] copy = new int[verdicts.length][];
        for (int r = 0; r < verdicts.length; r++) {
            if (verdicts[r] == null || verdicts[r].length != axes.columns()) {
                throw new IllegalArgumentException("verdict row " + r + " must have " + axes.columns() + " entries: "
                    + (verdicts[r] == null ? "none given" : verdicts[r].length));
            }
            for (int c = 0; c < verdicts[r].length; c++) {
                int v = verdicts[r][c];
                if (v < -1 || v >= verdictNames.size()) {
                    throw new IllegalArgumentException("verdict at row " + r + ", column " + c
                        + " must be -1 or an index below " + verdictNames.size() + ": " + v);
                }
            }
            copy[r] = verdicts[r].clone();
        }
        verdicts = copy;
    }

    /** @return the verdicts (a copy) */
    @Override
    public int[][] verdicts() {
        int[][] copy = new int[verdicts.length][];
        for (int r = 0; r < verdicts.length; r++) {
            copy[r] = verdicts[r].clone();
        }
        return copy;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof GridVerdicts g && title.equals(g.title) && axes.equals(g.axes)
            && verdictNames.equals(g.verdictNames) && Arrays.deepEquals(verdicts, g.verdicts);
    }

    @Override
    public int hashCode() {
        return java.util.Objects.hash(title, axes, verdictNames, Arrays.deepHashCode(verdicts));
    }
}
