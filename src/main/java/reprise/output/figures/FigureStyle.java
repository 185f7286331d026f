package reprise.output.figures;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import org.knowm.xchart.style.AxesChartStyler;

/**
 * The look shared by every figure: white background, no plot border or grid, no coloured title box,
 * a sans-serif font at sizes readable in print, line widths and paddings in proportion.
 *
 * <p>Implementation note: the chart is laid out in points at its printed size (see {@link FigureSize}),
 * so the font sizes below are point sizes on paper. At single-column width (241 pt) tick labels and
 * legend entries are {@value #BASE_TEXT} pt and axis titles {@value #BASE_AXIS_TITLE} pt, at or above the
 * 7 pt minimum most journals ask for (common practice, no single source); wider figures scale every size
 * by sqrt(width / 241), capped at {@value #MAX_SCALE}x, so a full-page figure is not lost in small text.
 *
 * @param size the printed size
 * @param dpi the PNG resolution, 72 to 1200
 */
record FigureStyle(FigureSize size, int dpi) {

    static final float BASE_TEXT = 7.5f;
    static final float BASE_AXIS_TITLE = 8f;
    static final float BASE_TITLE = 9f;
    static final double MAX_SCALE = 1.8;
    private static final double SINGLE_COLUMN_POINTS = 241;

    FigureStyle {
        if (size == null) {
            throw new IllegalArgumentException("figure size must be given: null");
        }
        if (!(dpi >= 72 && dpi <= 1200)) {
            throw new IllegalArgumentException("PNG resolution must be between 72 and 1200 dpi: " + dpi);
        }
    }

    int width() {
        return size.widthPoints();
    }

    int height() {
        return size.heightPoints();
    }

    /** @return the factor applied to every size, 1 at single-column width */
    double scale() {
        return Math.max(1, Math.min(MAX_SCALE, Math.sqrt(width() / SINGLE_COLUMN_POINTS)));
    }

    float textSize() {
        return (float) (BASE_TEXT * scale());
    }

    float axisTitleSize() {
        return (float) (BASE_AXIS_TITLE * scale());
    }

    float titleSize() {
        return (float) (BASE_TITLE * scale());
    }

    int px(double points) {
        return (int) Math.round(points * scale());
    }

    /** The stroke with its width and dash pattern scaled by {@link #scale()}. */
    BasicStroke scaled(BasicStroke stroke) {
        float f = (float) scale();
        float[] dash = stroke.getDashArray();
        if (dash != null) {
            dash = dash.clone();
            for (int i = 0; i < dash.length; i++) {
                dash[i] *= f;
            }
        }
        return new BasicStroke(stroke.getLineWidth() * f, stroke.getEndCap(), stroke.getLineJoin(),
            stroke.getMiterLimit(), dash, stroke.getDashPhase() * f);
    }

    static Font font(float size) {
        return TextFont.of(size);
    }

    void apply(AxesChartStyler s, boolean titleVisible) {
        s.setBaseFont(font(textSize()));
        s.setChartBackgroundColor(Color.WHITE);
        s.setPlotBackgroundColor(Color.WHITE);
        s.setChartFontColor(Color.BLACK);
        s.setChartTitleVisible(titleVisible);
        s.setChartTitleFont(font(titleSize()));
        s.setChartTitleBoxVisible(false);
        s.setChartTitlePadding(px(4));
        s.setChartPadding(px(5));
        s.setPlotBorderVisible(false);
        s.setPlotGridLinesVisible(false);
        s.setPlotTicksMarksVisible(false);
        s.setPlotMargin(0);
        s.setAxisTitleFont(font(axisTitleSize()));
        s.setAxisTickLabelsFont(font(textSize()));
        s.setAxisTickLabelsColor(Color.BLACK);
        s.setAxisTickMarksColor(Color.BLACK);
        s.setAxisTickMarksStroke(new BasicStroke((float) (0.6 * scale())));
        s.setAxisTitlePadding(px(3));
        s.setAxisTickPadding(px(2));
        s.setAxisTickMarkLength(px(3));
        s.setXAxisTickMarkSpacingHint(px(45));
        s.setYAxisTickMarkSpacingHint(px(30));
        s.setLegendFont(font(textSize()));
        s.setLegendBackgroundColor(Palette.withAlpha(Color.WHITE, 220));
        s.setLegendBorderColor(Palette.withAlpha(Color.WHITE, 0));
        s.setLegendPadding(px(3));
        s.setLegendSeriesLineLength(px(16));
        s.setMarkerSize(px(5));
        s.setAntiAlias(true);
        s.setToolTipsEnabled(false);
        s.setLocale(java.util.Locale.ROOT);
        s.setYAxisLabelAlignment(AxesChartStyler.TextAlignment.Right);
    }
}
