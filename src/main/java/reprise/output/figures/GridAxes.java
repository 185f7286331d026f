package reprise.output.figures;

import java.util.List;

/**
 * The two axes of a heatmap grid, each a list of category labels (for example noise levels and game
 * lengths, already formatted as the reader should see them).
 *
 * @param xTitle the x-axis title, e.g. "execution error ε"
 * @param xLabels the column labels, left to right
 * @param yTitle the y-axis title, e.g. "game length n (rounds)"
 * @param yLabels the row labels, bottom to top
 */
public record GridAxes(String xTitle, List<String> xLabels, String yTitle, List<String> yLabels) {

    /**
     * Validates the axes.
     *
     * @param xTitle not null
     * @param xLabels at least one label
     * @param yTitle not null
     * @param yLabels at least one label
     */
    public GridAxes {
        xTitle = Validation.label("x-axis title", xTitle);
        yTitle = Validation.label("y-axis title", yTitle);
        xLabels = Validation.nonEmpty("x-axis labels", xLabels);
        yLabels = Validation.nonEmpty("y-axis labels", yLabels);
    }

    /** @return the number of columns */
    public int columns() {
        return xLabels.size();
    }

    /** @return the number of rows */
    public int rows() {
        return yLabels.size();
    }
}
