package reprise.output.figures;

import java.awt.Color;
import org.knowm.xchart.style.AxesChartStyler;
import org.knowm.xchart.style.Styler;

/**
 * The look shared by every figure: white background, no plot border or grid, no coloured title box,
 * a sans-serif font at sizes readable in a one-column paper figure.
 *
 * @param width the figure's width in points (pixels at 72 dpi)
 * @param height the figure's height in points
 * @param dpi the PNG resolution; 144 renders at twice the nominal size
 */
record FigureStyle(int width, int height, int dpi) {

    static final int TITLE_SIZE = 16;
    static final int AXIS_TITLE_SIZE = 15;
    static final int TICK_LABEL_SIZE = 13;
    static final int LEGEND_SIZE = 13;

    FigureStyle {
        if (!(width >= 200 && width <= 10_000) || !(height >= 150 && height <= 10_000)) {
            throw new IllegalArgumentException("figure size must be between 200 x 150 and 10000 x 10000 points: "
                + width + " x " + height);
        }
        if (!(dpi >= 72 && dpi <= 1200)) {
            throw new IllegalArgumentException("PNG resolution must be between 72 and 1200 dpi: " + dpi);
        }
    }

    void apply(AxesChartStyler s, boolean titleVisible) {
        s.setBaseFont(Plot.font(TICK_LABEL_SIZE));
        s.setChartBackgroundColor(Color.WHITE);
        s.setPlotBackgroundColor(Color.WHITE);
        s.setChartFontColor(Color.BLACK);
        s.setChartTitleVisible(titleVisible);
        s.setChartTitleFont(Plot.font(TITLE_SIZE));
        s.setChartTitleBoxVisible(false);
        s.setChartTitlePadding(8);
        s.setChartPadding(12);
        s.setPlotBorderVisible(false);
        s.setPlotGridLinesVisible(false);
        s.setPlotTicksMarksVisible(false);
        s.setPlotMargin(0);
        s.setAxisTitleFont(Plot.font(AXIS_TITLE_SIZE));
        s.setAxisTickLabelsFont(Plot.font(TICK_LABEL_SIZE));
        s.setAxisTickLabelsColor(Color.BLACK);
        s.setAxisTickMarksColor(Color.BLACK);
        s.setAxisTitlePadding(8);
        s.setAxisTickPadding(5);
        s.setAxisTickMarkLength(5);
        s.setXAxisTickMarkSpacingHint(110);
        s.setYAxisTickMarkSpacingHint(90);
        s.setLegendFont(Plot.font(LEGEND_SIZE));
        s.setLegendBackgroundColor(Color.WHITE);
        s.setLegendBorderColor(Color.WHITE);
        s.setLegendPadding(6);
        s.setLegendSeriesLineLength(36);
        s.setMarkerSize(9);
        s.setAntiAlias(true);
        s.setToolTipsEnabled(false);
        s.setLocale(java.util.Locale.ROOT);
        s.setLegendPosition(Styler.LegendPosition.OutsideE);
        s.setYAxisLabelAlignment(AxesChartStyler.TextAlignment.Right);
    }
}
