package reprise.output.figures;

import java.awt.Color;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.knowm.xchart.HeatMapChart;
import org.knowm.xchart.HeatMapSeries;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.style.HeatMapStyler;
import org.knowm.xchart.style.Styler;
import reprise.game.State;

/**
 * Draws the figures of a validation study and writes each in the chosen formats (PNG and SVG by
 * default) into a directory.
 *
 * <p>Every figure has labelled axes with units, a legend, 15 pt axis titles and 13 pt tick labels in
 * the JVM's logical sans-serif font (present on every headless JVM), a white background without plot
 * border or grid, and the same size (800 x 560 points by default; PNG at 144 dpi, i.e. 1600 x 1120
 * pixels). Line styles carry meaning so a greyscale print still reads: a solid line is an exact value,
 * markers with vertical bars are simulated estimates with their intervals, a dashed line is a reference
 * (stationary value, sampling slope, diagonal). Colours come from the Okabe-Ito palette; the state order
 * CC, CD, DC, DD always maps to blue, orange, bluish green, vermillion and circle, square, diamond,
 * triangle.
 *
 * <p>Data that cannot be drawn (NaN or infinite values, non-positive values on a log axis) is left out
 * and reported in {@link FigureResult#notes()}, so a caption can say so. Data with nothing drawable at
 * all is an error. The JVM is switched to headless mode when this class loads unless the
 * {@code java.awt.headless} property was already set.
 *
 * <p>Instances are immutable: start from {@link #withDefaults()} and change size, resolution or formats
 * with the {@code with...} methods.
 *
 * <p>References:
 * <ul>
 *   <li>Okabe, M. and Ito, K. (2008). Color Universal Design (CUD): How to make figures and presentations
 *       that are friendly to colorblind people. J*Fly, online publication.</li>
 *   <li>van der Walt, S. and Smith, N. (2015). A better default colormap for Matplotlib (viridis).
 *       SciPy 2015 conference talk.</li>
 *   <li>David, H. A. and Nagaraja, H. N. (2003). Order Statistics, 3rd ed. Wiley (the i-th of K uniform
 *       order statistics has the Beta(i, K + 1 - i) distribution).</li>
 * </ul>
 */
public final class Figures {

    static {
        if (System.getProperty("java.awt.headless") == null) {
            System.setProperty("java.awt.headless", "true");
        }
    }

    private static final String[] STATE_NAMES = {State.CC.name(), State.CD.name(), State.DC.name(), State.DD.name()};

    private final FigureStyle style;
    private final Set<FigureFormat> formats;

    private Figures(FigureStyle style, Set<FigureFormat> formats) {
        this.style = style;
        this.formats = formats;
    }

    /** @return figures of 800 x 560 points, PNG at 144 dpi, written as PNG and SVG */
    public static Figures withDefaults() {
        return new Figures(new FigureStyle(800, 560, 144), EnumSet.of(FigureFormat.PNG, FigureFormat.SVG));
    }

    /**
     * The same settings at another size.
     *
     * @param width in points (200 to 10000)
     * @param height in points (150 to 10000)
     * @return a new instance
     */
    public Figures withSize(int width, int height) {
        return new Figures(new FigureStyle(width, height, style.dpi()), formats);
    }

    /**
     * The same settings at another PNG resolution.
     *
     * @param dpi 72 (one pixel per point) to 1200
     * @return a new instance
     */
    public Figures withDpi(int dpi) {
        return new Figures(new FigureStyle(style.width(), style.height(), dpi), formats);
    }

    /**
     * The same settings with other output formats.
     *
     * @param first a format
     * @param more further formats
     * @return a new instance; files are written in the enum's order PNG, SVG, PDF
     */
    public Figures withFormats(FigureFormat first, FigureFormat... more) {
        if (first == null || Arrays.asList(more).contains(null)) {
            throw new IllegalArgumentException("figure formats must not be null: " + first + ", "
                + Arrays.toString(more));
        }
        return new Figures(style, EnumSet.of(first, more));
    }

    /**
     * Convergence of the state frequencies with game length, for one case.
     *
     * <p>x: game length n in rounds, log scale. y: fraction of rounds spent in each state. Per state, in
     * its own colour: the simulated mean frequencies as markers with their interval bars, the exact
     * finite-horizon expectation as a solid line, and the stationary probability as a dashed horizontal
     * line across the plotted range of n. The reader should see the markers scatter around the solid
     * line, their bars shrink as n grows, and both settle onto the dashed line; a systematic gap between
     * markers and the solid line is a disagreement between simulation and exact chain. The four states'
     * markers at the same n are shifted sideways by under 1% of the axis so that they do not hide each
     * other; the lines are not shifted.
     *
     * @param directory where to write (created if missing)
     * @param baseName the file name without extension, already safe (see {@link FileNames#safe})
     * @param data the data; see {@link ConvergenceData}
     * @return the files written and notes on data left out
     * @throws IllegalArgumentException if nothing at all can be drawn
     */
    public FigureResult convergence(Path directory, String baseName, ConvergenceData data) {
        check(directory, baseName, data);
        Plot plot = new Plot(style, data.title(), "game length n (rounds)", "frequency of state (fraction of rounds)",
            true, false);
        double[] range = xRange(data.simulated(), data.exact(), true);
        double span = range[0] > 0 && range[1] > range[0] ? Math.log10(range[1] / range[0]) : 0;
        double[] stationary = data.stationary();
        for (int s = 0; s < State.COUNT; s++) {
            Curve c = data.exact().get(s);
            plot.curve(null, STATE_NAMES[s] + " exact expectation", c.x(), c.y(), Palette.STATES[s], Plot.SOLID);
            if (Double.isFinite(stationary[s]) && range[0] > 0) {
                plot.curve(null, STATE_NAMES[s] + " stationary value", new double[] {range[0], range[1]},
                    new double[] {stationary[s], stationary[s]}, Palette.STATES[s], Plot.DASHED);
            } else if (!Double.isFinite(stationary[s])) {
                plot.note(STATE_NAMES[s] + " stationary value: not drawn (" + stationary[s] + ")");
            }
        }
        for (int s = 0; s < State.COUNT; s++) {
            double dodge = Math.pow(10, (s - 1.5) * 0.006 * span);
            plot.estimates(STATE_NAMES[s] + " simulated", STATE_NAMES[s] + " simulated frequency",
                data.simulated().get(s), Palette.STATES[s], Plot.MARKERS[s], dodge);
        }
        addLineKeys(plot, "exact expectation", "stationary value");
        return finish(plot, directory, baseName);
    }

    /**
     * Absolute error against game length on log-log axes, for one case.
     *
     * <p>x: game length n in rounds, log scale. y: |observed - stationary| of the chosen quantity, log
     * scale. Markers joined by a thin line show the observed error; a dashed black line of slope -1/2,
     * anchored at the first drawn point, shows how sampling error alone should shrink
     * (c / sqrt(n)); the optional solid line shows the exact bias |E f_n - pi|, which for an ergodic chain
     * falls like 1/n (slope -1). The reader should see the observed error follow the slope -1/2 line
     * once n is large, and stay above the bias line: observed errors that fall faster than sampling allows,
     * or level off, point to a problem. Zero or negative errors cannot go on a log axis; they are dropped
     * and the notes say how many.
     *
     * @param directory where to write (created if missing)
     * @param baseName the file name without extension, already safe (see {@link FileNames#safe})
     * @param data the data; see {@link ErrorScalingData}
     * @return the files written and notes on data left out
     * @throws IllegalArgumentException if nothing at all can be drawn
     */
    public FigureResult errorScaling(Path directory, String baseName, ErrorScalingData data) {
        check(directory, baseName, data);
        Plot plot = new Plot(style, data.title(), "game length n (rounds)",
            "absolute error |observed \u2212 stationary|, " + data.quantity(), true, true);
        double[][] observed = plot.drawable("observed error", data.gameLengths(), data.absoluteError());
        if (data.exactBias() != null) {
            plot.curve("exact bias |E f\u2099 \u2212 \u03c0| (slope \u22121)", "exact bias", data.exactBias().x(),
                data.exactBias().y(), Palette.VERMILLION, Plot.SOLID);
        }
        if (observed[0].length > 0) {
            double n0 = observed[0][0];
            double e0 = observed[1][0];
            double nMax = Arrays.stream(observed[0]).max().orElse(n0);
            if (nMax > n0) {
                int m = 50;
                double[] rx = new double[m];
                double[] ry = new double[m];
                for (int i = 0; i < m; i++) {
                    rx[i] = n0 * Math.pow(nMax / n0, i / (m - 1.0));
                    ry[i] = e0 * Math.sqrt(n0 / rx[i]);
                }
                plot.curve("slope \u22121/2 (sampling)", "sampling reference", rx, ry, Palette.BLACK, Plot.DASHED);
            } else {
                plot.note("sampling reference line not drawn: the first drawable game length is the largest");
            }
            plot.markedLine("observed error", observed[0], observed[1], Palette.BLUE, Plot.MARKERS[0], Plot.THIN);
        } else {
            plot.note("observed error: nothing drawn, no usable points");
        }
        return finish(plot, directory, baseName);
    }

    /**
     * Payoffs of both players against the continuation probability delta, for one case.
     *
     * <p>x: continuation probability delta. y: the payoff described by the data. Solid lines are the
     * exact payoffs of X (blue) and Y (orange); markers with bars are simulated payoffs and their
     * intervals (circles X, squares Y, shifted sideways by under 1% of the axis so that they do not hide
     * each other). The reader should see each player's markers straddle that player's line.
     *
     * @param directory where to write (created if missing)
     * @param baseName the file name without extension, already safe (see {@link FileNames#safe})
     * @param data the data; see {@link PayoffData}
     * @return the files written and notes on data left out
     * @throws IllegalArgumentException if nothing at all can be drawn
     */
    public FigureResult payoffByContinuation(Path directory, String baseName, PayoffData data) {
        check(directory, baseName, data);
        Plot plot = new Plot(style, data.title(), "continuation probability \u03b4", data.payoffDescription(),
            false, false);
        List<Estimates> simulated = new ArrayList<>();
        if (data.simulatedX() != null) {
            simulated.add(data.simulatedX());
        }
        if (data.simulatedY() != null) {
            simulated.add(data.simulatedY());
        }
        double[] range = xRange(simulated, List.of(data.exactX(), data.exactY()), false);
        double offset = 0.004 * (range[1] > range[0] ? range[1] - range[0] : 0);
        plot.curve("X exact", "X exact payoff", data.exactX().x(), data.exactX().y(), Palette.BLUE, Plot.SOLID);
        plot.curve("Y exact", "Y exact payoff", data.exactY().x(), data.exactY().y(), Palette.ORANGE, Plot.SOLID);
        if (data.simulatedX() != null) {
            plot.estimates("X simulated", "X simulated payoff", data.simulatedX(), Palette.BLUE, Plot.MARKERS[0],
                -offset);
        }
        if (data.simulatedY() != null) {
            plot.estimates("Y simulated", "Y simulated payoff", data.simulatedY(), Palette.ORANGE, Plot.MARKERS[1],
                offset);
        }
        return finish(plot, directory, baseName);
    }

    /**
     * The distribution over states round by round, for one case.
     *
     * <p>x: round t (counted from 1). y: probability of each state in round t. Solid lines are the exact
     * probabilities (v_1 M^(t-1))_s; markers with bars are the fractions of simulated games in each state
     * at the snapshot rounds, with their intervals (shifted sideways by under 1% of the axis per state).
     * The reader should see the markers follow the exact transient from the first-round distribution
     * towards the stationary one.
     *
     * @param directory where to write (created if missing)
     * @param baseName the file name without extension, already safe (see {@link FileNames#safe})
     * @param data the data; see {@link StateDistributionData}
     * @return the files written and notes on data left out
     * @throws IllegalArgumentException if nothing at all can be drawn
     */
    public FigureResult stateDistribution(Path directory, String baseName, StateDistributionData data) {
        check(directory, baseName, data);
        Plot plot = new Plot(style, data.title(), "round t", "probability of state in round t", false, false);
        double[] range = xRange(data.simulated(), data.exact(), false);
        double span = range[1] > range[0] ? range[1] - range[0] : 0;
        for (int s = 0; s < State.COUNT; s++) {
            Curve c = data.exact().get(s);
            plot.curve(null, STATE_NAMES[s] + " exact probability", c.x(), c.y(), Palette.STATES[s], Plot.SOLID);
        }
        for (int s = 0; s < State.COUNT; s++) {
            plot.estimates(STATE_NAMES[s] + " simulated", STATE_NAMES[s] + " simulated proportion",
                data.simulated().get(s), Palette.STATES[s], Plot.MARKERS[s], (s - 1.5) * 0.004 * span);
        }
        addLineKeys(plot, "exact probability", null);
        return finish(plot, directory, baseName);
    }

    /**
     * Calibration of p-values: a QQ plot against the uniform distribution, one series per test.
     *
     * <p>x: the expected uniform order statistic i/(K+1), i = 1..K. y: the i-th smallest of the test's
     * K p-values. The dashed diagonal is perfect calibration; the grey band is the pointwise 95% range
     * of the i-th order statistic of K independent uniforms, whose distribution is Beta(i, K + 1 - i)
     * (quantiles 0.025 and 0.975). The reader should see a valid test's points stay close to the
     * diagonal, mostly inside the band; points below the band at small x mean too many small p-values
     * (an anti-conservative test), points above it mean a conservative one. The band is pointwise, so
     * about 5% of points may leave it by chance. Tests with different numbers of usable p-values each
     * get their own band. NaN p-values are skipped with a note.
     *
     * @param directory where to write (created if missing)
     * @param baseName the file name without extension, already safe (see {@link FileNames#safe})
     * @param data the data; see {@link CalibrationData}
     * @return the files written and notes on data left out
     * @throws IllegalArgumentException if nothing at all can be drawn
     */
    public FigureResult pValueCalibration(Path directory, String baseName, CalibrationData data) {
        check(directory, baseName, data);
        Plot plot = new Plot(style, data.title(), "uniform quantile i/(K+1)", "ordered p-value", false, false);
        Map<String, double[]> sorted = new LinkedHashMap<>();
        for (PValueSample sample : data.samples()) {
            double[] p = Arrays.stream(sample.pValues()).filter(v -> !Double.isNaN(v)).sorted().toArray();
            int skipped = sample.pValues().length - p.length;
            if (skipped > 0) {
                plot.note(sample.testName() + ": " + skipped + " of " + sample.pValues().length
                    + " p-values skipped (NaN)");
            }
            if (p.length == 0) {
                plot.note(sample.testName() + ": nothing drawn, no usable p-values");
            } else {
                sorted.put(sample.testName(), p);
            }
        }
        int[] sizes = sorted.values().stream().mapToInt(p -> p.length).distinct().sorted().toArray();
        for (int k : sizes) {
            double[][] band = QqBand.pointwise(k, 0.95);
            double[] px = new double[2 * k];
            double[] py = new double[2 * k];
            for (int i = 0; i < k; i++) {
                px[i] = (i + 1.0) / (k + 1);
                py[i] = band[1][i];
                px[2 * k - 1 - i] = px[i];
                py[2 * k - 1 - i] = band[0][i];
            }
            plot.polygon(null, px, py, Palette.withAlpha(Palette.BAND_GREY, sizes.length == 1 ? 255 : 140));
        }
        if (!sorted.isEmpty()) {
            // a thick grey legend key stands for the band (a box entry would make XChart misjudge the
            // legend width for the line entries)
            plot.key(sizes.length == 1 ? "pointwise 95% band" : "pointwise 95% bands (K = "
                + Arrays.toString(sizes).replaceAll("[\\[\\]]", "") + ")", Palette.BAND_GREY,
                new java.awt.BasicStroke(11f), 0.5, 0.5);
        }
        if (!sorted.isEmpty()) {
            plot.curve("uniform (y = x)", "diagonal", new double[] {0, 1}, new double[] {0, 1}, Palette.BLACK,
                Plot.DASHED);
        }
        int j = 0;
        for (Map.Entry<String, double[]> e : sorted.entrySet()) {
            double[] p = e.getValue();
            int k = p.length;
            double[] x = new double[k];
            for (int i = 0; i < k; i++) {
                x[i] = (i + 1.0) / (k + 1);
            }
            Color color = Palette.SERIES[j % Palette.SERIES.length];
            var s = plot.chart().addSeries(e.getKey() + " (K = " + k + ")", x, p);
            s.setLineColor(color);
            s.setMarkerColor(color);
            s.setLineStyle(QQ_STROKES[j % QQ_STROKES.length]);
            s.setMarker(k <= 60 ? Plot.MARKERS[j % Plot.MARKERS.length] : org.knowm.xchart.style.markers.SeriesMarkers.NONE);
            j++;
        }
        return finish(plot, directory, baseName, !sorted.isEmpty());
    }

    private static final java.awt.BasicStroke[] QQ_STROKES = {Plot.SOLID, Plot.DOTTED, Plot.DASH_DOT};

    /**
     * A heatmap of a number over a two-axis grid (for example noise level against game length).
     *
     * <p>Each cell is coloured by its value on the viridis ramp, from dark purple (the smallest value
     * in the grid) to yellow (the largest); the colour bar at the right shows the range and the title
     * names the quantity. NaN cells are left white. The reader should see where in the grid the value
     * is large. The ramp is sequential: it shows magnitude, so pass magnitudes (or standardised
     * deviations) rather than signed values whose zero matters.
     *
     * @param directory where to write (created if missing)
     * @param baseName the file name without extension, already safe (see {@link FileNames#safe})
     * @param data the data; see {@link GridValues}
     * @return the files written and notes on data left out
     * @throws IllegalArgumentException if no cell has a finite value
     */
    public FigureResult valueHeatmap(Path directory, String baseName, GridValues data) {
        check(directory, baseName, data);
        List<String> notes = new ArrayList<>();
        double[][] values = data.values();
        List<Number[]> cells = new ArrayList<>();
        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        int missing = 0;
        for (int r = 0; r < values.length; r++) {
            for (int c = 0; c < values[r].length; c++) {
                double v = values[r][c];
                if (Double.isFinite(v)) {
                    cells.add(new Number[] {c, r, v});
                    min = Math.min(min, v);
                    max = Math.max(max, v);
                } else {
                    missing++;
                }
            }
        }
        if (cells.isEmpty()) {
            throw new IllegalArgumentException("value heatmap has no finite value to draw: all "
                + data.axes().rows() * data.axes().columns() + " cells are NaN or infinite");
        }
        if (missing > 0) {
            notes.add(missing + " of " + data.axes().rows() * data.axes().columns()
                + " cells left white (NaN or infinite value)");
        }
        double[] scale = ColourScale.niceRange(min, max);
        String title = data.title().isEmpty() ? "colour: " + data.valueDescription()
            : data.title() + " \u2014 colour: " + data.valueDescription();
        HeatMapChart chart = heatmap(title, data.axes());
        HeatMapStyler s = chart.getStyler();
        s.setRangeColors(Palette.VIRIDIS);
        s.setPiecewise(false);
        HeatMapSeries series = chart.addSeries(FileNames.safe(data.valueDescription()), data.axes().xLabels(),
            data.axes().yLabels(), cells);
        series.setMin(scale[0]);
        series.setMax(scale[1]);
        s.setMin(scale[0]);
        s.setMax(scale[1]);
        return new FigureResult(FigureFiles.write(chart, directory, baseName, formats, style.dpi()), notes);
    }

    /**
     * A heatmap of categorical verdicts over a two-axis grid.
     *
     * <p>Each cell is coloured by its verdict: the first name blue, the second yellow, the third
     * vermillion (Okabe-Ito colours that also differ in greyscale lightness); the legend at the right
     * names them. Cells without a verdict (-1) are left white. The reader should see in which region of
     * the grid simulation and exact results agree.
     *
     * @param directory where to write (created if missing)
     * @param baseName the file name without extension, already safe (see {@link FileNames#safe})
     * @param data the data; see {@link GridVerdicts}
     * @return the files written and notes on data left out
     * @throws IllegalArgumentException if no cell has a verdict
     */
    public FigureResult verdictHeatmap(Path directory, String baseName, GridVerdicts data) {
        check(directory, baseName, data);
        List<String> notes = new ArrayList<>();
        int[][] verdicts = data.verdicts();
        List<Number[]> cells = new ArrayList<>();
        int missing = 0;
        for (int r = 0; r < verdicts.length; r++) {
            for (int c = 0; c < verdicts[r].length; c++) {
                if (verdicts[r][c] >= 0) {
                    cells.add(new Number[] {c, r, verdicts[r][c]});
                } else {
                    missing++;
                }
            }
        }
        if (cells.isEmpty()) {
            throw new IllegalArgumentException("verdict heatmap has no verdict to draw: all "
                + data.axes().rows() * data.axes().columns() + " cells are -1");
        }
        if (missing > 0) {
            notes.add(missing + " of " + data.axes().rows() * data.axes().columns() + " cells left white (no verdict)");
        }
        List<String> names = data.verdictNames();
        int k = names.size();
        HeatMapChart chart = heatmap(data.title(), data.axes());
        HeatMapStyler s = chart.getStyler();
        // XChart's piecewise legend: k equal bins over [-0.5, k - 0.5], bin i coloured rangeColors[i] and
        // labelled with the formatted lower bin edge i - 0.5, which the formatter maps back to name i
        s.setRangeColors(Arrays.copyOf(Palette.VERDICTS, k));
        s.setPiecewise(true);
        s.setPiecewiseRanged(false);
        s.setSplitNumber(k);
        s.setHeatMapDecimalValueFormatter(v -> names.get(Math.max(0, Math.min(k - 1, (int) Math.round(v + 0.5)))));
        HeatMapSeries series = chart.addSeries("verdicts", data.axes().xLabels(), data.axes().yLabels(), cells);
        series.setMin(-0.5);
        series.setMax(k - 0.5);
        s.setMin(-0.5);
        s.setMax(k - 0.5);
        return new FigureResult(FigureFiles.write(chart, directory, baseName, formats, style.dpi()), notes);
    }

    private HeatMapChart heatmap(String title, GridAxes axes) {
        // the plain (width, height) constructor leaves the heatmap styler uninitialised in XChart 3.8.8
        HeatMapChart chart = new HeatMapChart(style.width(), style.height(), Styler.ChartTheme.XChart);
        chart.setTitle(title);
        chart.setXAxisTitle(axes.xTitle());
        chart.setYAxisTitle(axes.yTitle());
        HeatMapStyler s = chart.getStyler();
        style.apply(s, !title.isEmpty());
        s.setLegendPosition(Styler.LegendPosition.OutsideE);
        s.setDrawBorder(true);
        s.setShowValue(false);
        s.setPlotContentSize(1.0);
        s.setGradientColorColumnHeight(Math.max(120, style.height() / 2));
        s.setGradientColorColumnWeight(18);
        return chart;
    }

    private static void addLineKeys(Plot plot, String solidLabel, String dashedLabel) {
        if (!plot.hasSeries()) {
            return;
        }
        XYChart chart = plot.chart();
        var first = chart.getSeriesMap().values().iterator().next();
        double ax = first.getXMin();
        double ay = first.getYMin();
        plot.key(solidLabel, Palette.BLACK, Plot.SOLID, ax, ay);
        if (dashedLabel != null) {
            plot.key(dashedLabel, Palette.BLACK, Plot.DASHED, ax, ay);
        }
    }

    private FigureResult finish(Plot plot, Path directory, String baseName) {
        return finish(plot, directory, baseName, plot.hasSeries());
    }

    private FigureResult finish(Plot plot, Path directory, String baseName, boolean drawable) {
        if (!drawable) {
            throw new IllegalArgumentException("figure " + baseName + " has nothing to draw: " + plot.notes());
        }
        plot.finishAxes();
        return new FigureResult(FigureFiles.write(plot.chart(), directory, baseName, formats, style.dpi()),
            plot.notes());
    }

    private static void check(Path directory, String baseName, Object data) {
        FigureFiles.directory(directory);
        FigureFiles.baseName(baseName);
        if (data == null) {
            throw new IllegalArgumentException("figure data must be given: null");
        }
    }

    /** The smallest and largest finite x over all series (positive only when {@code positive}). */
    private static double[] xRange(List<Estimates> simulated, List<Curve> exact, boolean positive) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        List<double[]> xs = new ArrayList<>();
        simulated.forEach(e -> xs.add(e.x()));
        exact.forEach(c -> xs.add(c.x()));
        for (double[] x : xs) {
            for (double v : x) {
                if (Double.isFinite(v) && (!positive || v > 0)) {
                    lo = Math.min(lo, v);
                    hi = Math.max(hi, v);
                }
            }
        }
        return lo <= hi ? new double[] {lo, hi} : new double[] {Double.NaN, Double.NaN};
    }
}
