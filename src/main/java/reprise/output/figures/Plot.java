package reprise.output.figures;

import java.awt.BasicStroke;
import java.awt.Color;
import java.util.ArrayList;
import java.util.List;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.XYSeries.XYSeriesRenderStyle;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.XYStyler;
import org.knowm.xchart.style.markers.Marker;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * One XY figure under construction: a styled XChart plus the notes collected while filtering the data.
 *
 * <p>Implementation note: XChart cannot draw asymmetric error bars, so each interval is its own
 * two-point line series, hidden from the legend. A legend "key" entry that explains a line style is a
 * one-point line series placed on an existing data point: a line needs two points, so it draws nothing
 * on the plot and cannot change the axis ranges, but it shows its stroke in the legend.
 */
final class Plot {
    /** Line styles at single-column size, in points; {@link FigureStyle#scaled} widens them for larger figures. */
    static final BasicStroke SOLID = new BasicStroke(1.1f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND);
    static final BasicStroke DASHED = new BasicStroke(0.9f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
        new float[] {4f, 2.5f}, 0f);
    static final BasicStroke DOTTED = new BasicStroke(1.1f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND, 10f,
        new float[] {0.5f, 2.2f}, 0f);
    static final BasicStroke DASH_DOT = new BasicStroke(0.9f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
        new float[] {5f, 2f, 1f, 2f}, 0f);
    static final BasicStroke THIN = new BasicStroke(0.5f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND);
    static final BasicStroke ERROR_BAR = new BasicStroke(0.7f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER);
    static final BasicStroke[] LINE_STYLES = {SOLID, DASHED, DOTTED, DASH_DOT};

    /** Marker shapes, one per state CC, CD, DC, DD (or per series), distinguishable without colour. */
    static final Marker[] MARKERS = {SeriesMarkers.CIRCLE, SeriesMarkers.SQUARE, SeriesMarkers.DIAMOND,
        SeriesMarkers.TRIANGLE_UP, SeriesMarkers.TRIANGLE_DOWN, SeriesMarkers.CROSS, SeriesMarkers.PLUS,
        SeriesMarkers.OVAL};

    private final XYChart chart;
    private final FigureStyle style;
    private final boolean logX;
    private final boolean logY;
    private final List<String> notes = new ArrayList<>();
    private int hiddenSeries;
    private int visibleSeries;

    Plot(FigureStyle style, String title, String xTitle, String yTitle, AxisScale x, AxisScale y) {
        this.style = style;
        this.logX = x.log();
        this.logY = y.log();
        chart = new XYChart(style.width(), style.height());
        chart.setTitle(title);
        chart.setXAxisTitle(xTitle);
        chart.setYAxisTitle(yTitle);
        XYStyler s = chart.getStyler();
        style.apply(s, !title.isEmpty());
        s.setDefaultSeriesRenderStyle(XYSeriesRenderStyle.Line);
        s.setXAxisLogarithmic(logX);
        s.setYAxisLogarithmic(logY);
        legend(Styler.LegendPosition.InsideNE);
    }

    FigureStyle style() {
        return style;
    }

    /** The stroke scaled to this figure's size. */
    BasicStroke stroke(BasicStroke unit) {
        return style.scaled(unit);
    }

    /** Puts the legend in a place; below the axes it runs in rows, so it takes height, not width. */
    void legend(Styler.LegendPosition position) {
        chart.getStyler().setLegendPosition(position);
        chart.getStyler().setLegendLayout(position == Styler.LegendPosition.OutsideS
            ? Styler.LegendLayout.Horizontal : Styler.LegendLayout.Vertical);
    }

    /**
     * Final axis settings once all series are in. A degenerate range (every x, or every y, the same,
     * as with a single point) gets a symmetric margin, since XChart would otherwise zoom in on
     * floating-point noise. Log axes get plain decimal tick labels ("10000", "0.001") instead of
     * XChart's "1E4" and "1E-3" when every value lies where a six-decimal pattern is exact; a tick-label
     * formatting function is not an option, as XChart then computes linear ticks, which never finishes
     * on a log axis spanning decades.
     */
    void finishAxes() {
        double[] xr = {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
        double[] yr = {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (XYSeries s : chart.getSeriesMap().values()) {
            xr[0] = Math.min(xr[0], s.getXMin());
            xr[1] = Math.max(xr[1], s.getXMax());
            yr[0] = Math.min(yr[0], s.getYMin());
            yr[1] = Math.max(yr[1], s.getYMax());
        }
        XYStyler st = chart.getStyler();
        if (xr[0] == xr[1]) {
            double[] m = margin(xr[0], logX);
            st.setXAxisMin(m[0]);
            st.setXAxisMax(m[1]);
        }
        if (yr[0] == yr[1]) {
            double[] m = margin(yr[0], logY);
            st.setYAxisMin(m[0]);
            st.setYAxisMax(m[1]);
        }
        if (logX && xr[0] >= 1e-6 && xr[1] <= 1e7) {
            st.setXAxisDecimalPattern("0.######");
        }
        if (logY && yr[0] >= 1e-6 && yr[1] <= 1e7) {
            st.setYAxisDecimalPattern("0.######");
        }
        // XChart's default linear pattern can drop the leading zero (".05"); keep it where the range allows.
        if (!logX && Math.abs(xr[0]) <= 1e7 && Math.abs(xr[1]) <= 1e7 && xr[1] - xr[0] >= 1e-2) {
            st.setXAxisDecimalPattern("0.###");
        }
        if (!logY && Math.abs(yr[0]) <= 1e7 && Math.abs(yr[1]) <= 1e7 && yr[1] - yr[0] >= 1e-2) {
            st.setYAxisDecimalPattern("0.###");
        }
    }

    private static double[] margin(double v, boolean log) {
        if (log) {
            return new double[] {v / 3, v * 3};
        }
        double pad = v == 0 ? 1 : Math.abs(v) / 2;
        return new double[] {v - pad, v + pad};
    }

    XYChart chart() {
        return chart;
    }

    /**
     * Labels these values on a log x-axis besides the decades (for example a grid's game lengths).
     * Nothing on a linear axis, whose ticks XChart chooses well.
     */
    void xTicksAt(double[] values) {
        if (logX && values.length > 0) {
            chart.addAnnotation(new GridTicks(values));
        }
    }

    List<String> notes() {
        return notes;
    }

    void note(String note) {
        notes.add(note);
    }

    boolean hasSeries() {
        return visibleSeries > 0;
    }

    /**
     * Keeps the points that can be drawn and notes the others.
     *
     * @return {x, y} of the kept points
     */
    double[][] drawable(String what, double[] x, double[] y) {
        int n = x.length;
        double[] kx = new double[n];
        double[] ky = new double[n];
        int k = 0;
        int notFinite = 0;
        int notPositive = 0;
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(x[i]) || !Double.isFinite(y[i])) {
                notFinite++;
            } else if ((logX && !(x[i] > 0)) || (logY && !(y[i] > 0))) {
                notPositive++;
            } else {
                kx[k] = x[i];
                ky[k] = y[i];
                k++;
            }
        }
        if (notFinite > 0) {
            notes.add(what + ": " + notFinite + " of " + n + " points skipped (NaN or infinite)");
        }
        if (notPositive > 0) {
            notes.add(what + ": " + notPositive + " of " + n
                + " points dropped (zero or negative values cannot be shown on a log axis)");
        }
        return new double[][] {java.util.Arrays.copyOf(kx, k), java.util.Arrays.copyOf(ky, k)};
    }

    /** A line through the drawable points; returns false (with a note) when none was drawable. */
    boolean curve(String legendName, String what, double[] x, double[] y, Color color, BasicStroke stroke) {
        double[][] p = drawable(what, x, y);
        if (p[0].length == 0) {
            notes.add(what + ": nothing drawn, no usable points");
            return false;
        }
        XYSeries s = chart.addSeries(name(legendName), p[0], p[1]);
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.Line);
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(color);
        s.setLineStyle(stroke(stroke));
        s.setShowInLegend(legendName != null);
        if (p[0].length == 1 && legendName == null) {
            // a single point of a line would be invisible; show it as a small mark instead
            s.setMarker(SeriesMarkers.CIRCLE);
            s.setMarkerColor(color);
        }
        visibleSeries++;
        return true;
    }

    /**
     * Markers at the drawable estimates, at their true x, with their interval bars. A bar whose lower
     * end cannot go on a log axis (zero or negative) is cut at the axis minimum of the markers / 10.
     *
     * @return the first marker drawn {x, y}, where a legend key of the same look can hide, or null if none
     */
    double[] estimates(String legendName, String what, Estimates e, Color color, Marker marker) {
        double[] x = e.x();
        double[] est = e.estimate();
        double[] lo = e.lower();
        double[] hi = e.upper();
        int n = x.length;
        double[] kx = new double[n];
        double[] ky = new double[n];
        int k = 0;
        int notFinite = 0;
        int notPositive = 0;
        int noBar = 0;
        List<double[]> bars = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(x[i]) || !Double.isFinite(est[i])) {
                notFinite++;
                continue;
            }
            if ((logX && !(x[i] > 0)) || (logY && !(est[i] > 0))) {
                notPositive++;
                continue;
            }
            double xd = x[i];
            kx[k] = xd;
            ky[k] = est[i];
            k++;
            if (Double.isFinite(lo[i]) && Double.isFinite(hi[i]) && (!logY || hi[i] > 0)) {
                if (hi[i] > lo[i]) {
                    bars.add(new double[] {xd, logY && !(lo[i] > 0) ? Double.NaN : lo[i], hi[i]});
                }
            } else {
                noBar++;
            }
        }
        if (notFinite > 0) {
            notes.add(what + ": " + notFinite + " of " + n + " points skipped (NaN or infinite)");
        }
        if (notPositive > 0) {
            notes.add(what + ": " + notPositive + " of " + n
                + " points dropped (zero or negative values cannot be shown on a log axis)");
        }
        if (noBar > 0 && noBar < k) {
            notes.add(what + ": " + noBar + " of " + k + " drawn points have no usable interval, so no error bar");
        }
        if (k == 0) {
            notes.add(what + ": nothing drawn, no usable points");
            return null;
        }
        double floor = Double.POSITIVE_INFINITY;
        for (int i = 0; i < k; i++) {
            floor = Math.min(floor, ky[i] / 10);
        }
        for (double[] b : bars) {
            if (Double.isNaN(b[1])) {
                b[1] = Math.min(floor, b[2] / 10);
            }
            XYSeries bar = chart.addSeries(name(null), new double[] {b[0], b[0]}, new double[] {b[1], b[2]});
            bar.setXYSeriesRenderStyle(XYSeriesRenderStyle.Line);
            bar.setMarker(SeriesMarkers.NONE);
            bar.setLineColor(color);
            bar.setLineStyle(stroke(ERROR_BAR));
            bar.setShowInLegend(false);
        }
        XYSeries s = chart.addSeries(name(legendName), java.util.Arrays.copyOf(kx, k), java.util.Arrays.copyOf(ky, k));
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.Scatter);
        s.setMarker(marker);
        s.setMarkerColor(color);
        s.setShowInLegend(legendName != null);
        visibleSeries++;
        return new double[] {kx[0], ky[0]};
    }

    /** Markers joined by a line, for points already filtered with {@link #drawable}. */
    void markedLine(String legendName, double[] x, double[] y, Color color, Marker marker, BasicStroke stroke) {
        XYSeries s = chart.addSeries(name(legendName), x, y);
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.Line);
        s.setMarker(marker);
        s.setMarkerColor(color);
        s.setLineColor(color);
        s.setLineStyle(stroke(stroke));
        s.setShowInLegend(legendName != null);
        visibleSeries++;
    }

    /**
     * Names what the figure shows (pair, settings) in a line above the plot, in the axis-title size,
     * unless the figure already has a title; nothing when {@code subject} is blank.
     */
    void heading(String subject) {
        if (!subject.isEmpty() && chart.getTitle().isEmpty()) {
            chart.setTitle(subject);
            chart.getStyler().setChartTitleVisible(true);
            chart.getStyler().setChartTitleFont(FigureStyle.font(style.axisTitleSize()));
        }
    }

    /**
     * A legend-only entry for a colour and marker (what a state or player looks like). Its one marker is
     * drawn at {@code at}, which must be a marker of the same colour and shape already drawn, so that
     * it adds nothing visible to the plot.
     */
    void markerKey(String legendName, Color color, Marker marker, double anchorX, double anchorY) {
        XYSeries s = chart.addSeries(name(legendName), new double[] {anchorX}, new double[] {anchorY});
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.Scatter);
        s.setMarker(marker);
        s.setMarkerColor(color);
    }

    /** A legend-only entry explaining a line style; see the implementation note. */
    void key(String legendName, Color color, BasicStroke stroke, double anchorX, double anchorY) {
        XYSeries s = chart.addSeries(name(legendName), new double[] {anchorX}, new double[] {anchorY});
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.Line);
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(color);
        s.setLineStyle(stroke(stroke));
    }

    /** A filled polygon (x[0], y[0]) ... (x[m-1], y[m-1]), closed back to the start. */
    void polygon(String legendName, double[] x, double[] y, Color fill) {
        XYSeries s = chart.addSeries(name(legendName), x, y);
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.PolygonArea);
        s.setMarker(SeriesMarkers.NONE);
        s.setFillColor(fill);
        s.setLineColor(fill);
        s.setShowInLegend(legendName != null);
    }

    private String name(String legendName) {
        if (legendName != null) {
            return legendName;
        }
        // XChart needs unique series names; these never reach the legend
        return "\u200b" + (hiddenSeries++);
    }

}
