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
 * <p>Every figure has labelled axes with units, a legend, and is laid out at its printed size
 * ({@link FigureSize}: single column 8.5 cm by default, double column 17.5 cm, or any other) with every
 * text at least 7.5 pt on paper, in the JVM's logical sans-serif font (present on every headless JVM),
 * on a white background without plot border or grid. PNG files are rendered at 300 dpi by default;
 * SVG, PDF and EPS files keep text as text. Line styles carry meaning so a greyscale print still reads: a solid line is an exact value,
 * markers with vertical bars are simulated estimates with their intervals, a dashed line is a reference
 * (stationary value, exact standard error, diagonal). Colours come from the Okabe-Ito palette; the state order
 * CC, CD, DC, DD always maps to blue, orange, bluish green, vermillion and circle, square, diamond,
 * triangle.
 *
 * <p>Data that cannot be drawn (NaN or infinite values, non-positive values on a log axis) is left out
 * and reported in {@link FigureResult#notes()}, so a caption can say so. Data with nothing drawable at
 * all is an error. The JVM is switched to headless mode when this class loads unless the
 * {@code java.awt.headless} property was already set.
 *
 * <p>Instances are immutable: start from {@link #withDefaults()} and change size, resolution, formats
 * or colour range with the {@code with...} methods. Drawing is thread-safe: several figures may be
 * written at once from different threads.
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
    private final double[] colourRange;

    private Figures(FigureStyle style, Set<FigureFormat> formats, double[] colourRange) {
        this.style = style;
        this.formats = formats;
        this.colourRange = colourRange;
    }

    /** @return single-column figures (8.5 x 6.4 cm), PNG at 300 dpi, written as PNG, SVG and PDF */
    public static Figures withDefaults() {
        return new Figures(new FigureStyle(FigureSize.SINGLE_COLUMN, 300),
            EnumSet.of(FigureFormat.PNG, FigureFormat.SVG, FigureFormat.PDF), null);
    }

    /**
     * The same settings at another printed size.
     *
     * @param size {@link FigureSize#SINGLE_COLUMN}, {@link FigureSize#DOUBLE_COLUMN} or a custom size
     * @return a new instance
     */
    public Figures withSize(FigureSize size) {
        return new Figures(new FigureStyle(size, style.dpi()), formats, colourRange);
    }

    /** @return the printed size */
    public FigureSize size() {
        return style.size();
    }

    /** @return the formats written, in the enum's order */
    public Set<FigureFormat> formats() {
        return EnumSet.copyOf(formats);
    }

    /**
     * The same settings at another PNG resolution.
     *
     * @param dpi 72 (one pixel per point) to 1200
     * @return a new instance
     */
    public Figures withDpi(int dpi) {
        return new Figures(new FigureStyle(style.size(), dpi), formats, colourRange);
    }

    /** @return the PNG resolution in dots per inch */
    public int dpi() {
        return style.dpi();
    }

    /**
     * The same settings with other output formats.
     *
     * @param first a format
     * @param more further formats
     * @return a new instance; files are written in the enum's order PNG, SVG, PDF, EPS
     */
    public Figures withFormats(FigureFormat first, FigureFormat... more) {
        if (first == null || Arrays.asList(more).contains(null)) {
            throw new IllegalArgumentException("figure formats must not be null: " + first + ", "
                + Arrays.toString(more));
        }
        return new Figures(style, EnumSet.of(first, more), colourRange);
    }

    /**
     * The same settings with one colour range for every value heatmap, so that heatmaps of several pairs
     * can be compared cell by cell (see {@link GridValues#range}).
     *
     * @param min the value at the dark end of the ramp, finite
     * @param max the value at the light end, finite and at least {@code min}
     * @return a new instance
     */
    public Figures withColourRange(double min, double max) {
        if (!(Double.isFinite(min) && Double.isFinite(max) && min <= max)) {
            throw new IllegalArgumentException("colour range must be finite with min <= max: " + min + ", " + max);
        }
        return new Figures(style, formats, new double[] {min, max});
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
            AxisScale.LOG, AxisScale.LINEAR);
        plot.legend(Styler.LegendPosition.OutsideE);
        plot.heading(data.subject());
        double[] range = xRange(data.simulated(), data.exact(), true);
        double[] stationary = data.stationary();
        for (int s = 0; s < State.COUNT; s++) {
            Curve c = data.exact().get(s);
            plot.curve(null, STATE_NAMES[s] + " exact expectation", c.x(), c.y(), Palette.STATES[s], Plot.SOLID);
            if (!Double.isFinite(stationary[s])) {
                plot.note(STATE_NAMES[s] + " stationary value: not drawn (" + stationary[s] + ")");
            }
        }
        if (range[0] > 0) {
            stationaryLines(plot, stationary, range);
        }
        double[][] anchors = new double[State.COUNT][];
        for (int s = 0; s < State.COUNT; s++) {
            anchors[s] = plot.estimates(null, STATE_NAMES[s] + " simulated frequency", data.simulated().get(s),
                Palette.STATES[s], Plot.MARKERS[s]);
        }
        addKeys(plot, anchors, "exact", "stationary");
        plot.xTicksAt(data.simulated().stream().flatMapToDouble(e -> java.util.Arrays.stream(e.x())).distinct()
            .toArray());
        return finish(plot, directory, baseName);
    }

    /**
     * The states' stationary values as dashed horizontal lines. States whose values coincide (within
     * 1e-9, e.g. CD and DC of a symmetric pair) share one line of interleaved dashes, one colour after the
     * other, so that no colour hides another.
     */
    private static void stationaryLines(Plot plot, double[] stationary, double[] range) {
        boolean[] done = new boolean[stationary.length];
        for (int s = 0; s < stationary.length; s++) {
            if (done[s] || !Double.isFinite(stationary[s])) {
                continue;
            }
            List<Integer> same = new ArrayList<>();
            for (int t = s; t < stationary.length; t++) {
                if (!done[t] && Double.isFinite(stationary[t]) && Math.abs(stationary[t] - stationary[s]) <= 1e-9) {
                    same.add(t);
                    done[t] = true;
                }
            }
            int m = same.size();
            float dash = Plot.DASHED.getDashArray()[0];
            float gap = Plot.DASHED.getDashArray()[1];
            for (int i = 0; i < m; i++) {
                java.awt.BasicStroke stroke = m == 1 ? Plot.DASHED : new java.awt.BasicStroke(
                    Plot.DASHED.getLineWidth(), java.awt.BasicStroke.CAP_BUTT, java.awt.BasicStroke.JOIN_MITER, 10f,
                    new float[] {dash, m * (dash + gap) - dash}, (m - i) * (dash + gap));
                int st = same.get(i);
                plot.curve(null, STATE_NAMES[st] + " stationary value", new double[] {range[0], range[1]},
                    new double[] {stationary[st], stationary[st]}, Palette.STATES[st], stroke);
            }
        }
    }

    /**
     * Absolute error against game length on log-log axes, for one case.
     *
     * <p>x: game length n in rounds, log scale. y: |observed - stationary| of the chosen quantity, log
     * scale. Markers with bars show the observed error and its interval; the optional dashed black line
     * is the exact standard error of the observed mean (what sampling alone makes the error, falling like
     * 1/sqrt(n)); the optional solid line is the exact bias |E f_n - pi|, which for an ergodic chain falls
     * like 1/n (slope -1). The reader should see the observed errors scatter at about the height of the
     * larger of the two lines: observed errors far above both, or levelling off, point to a problem. Zero or negative errors cannot go on a log axis; they are dropped
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
            "|observed \u2212 stationary|, " + data.quantity(), AxisScale.LOG, AxisScale.LOG);
        // below the axes, stacked: inside, the legend would hide markers or error bars wherever it went
        plot.legend(Styler.LegendPosition.OutsideS);
        plot.chart().getStyler().setLegendLayout(Styler.LegendLayout.Vertical);
        plot.heading(data.subject());
        if (data.exactStandardError() != null) {
            plot.curve("exact standard error", "exact standard error",
                data.exactStandardError().x(), data.exactStandardError().y(), Palette.BLACK, Plot.DASHED);
        }
        if (data.exactBias() != null) {
            plot.curve("exact bias |E f\u2099 \u2212 \u03c0|", "exact bias", data.exactBias().x(),
                data.exactBias().y(), Palette.VERMILLION, Plot.SOLID);
        }
        plot.estimates("observed error", "observed error", data.observed(), Palette.BLUE, Plot.MARKERS[0]);
        plot.xTicksAt(data.observed().x());
        return finish(plot, directory, baseName);
    }

    /**
     * Payoffs of both players against the continuation probability delta, for one case.
     *
     * <p>x: continuation probability delta. y: the payoff described by the data. Solid lines are the
     * exact payoffs of X (blue) and Y (orange); markers with bars are simulated payoffs and their
     * intervals (circles X, squares Y, shifted sideways by under 1% of the axis so that they do not hide
     * each other). Dashed horizontal lines are the stationary (delta to 1) payoffs, crosses the claimed
     * values when given. The reader should see each player's markers straddle that player's line.
     *
     * @param directory where to write (created if missing)
     * @param baseName the file name without extension, already safe (see {@link FileNames#safe})
     * @param data the data; see {@link PayoffData}
     * @return the files written and notes on data left out
     * @throws IllegalArgumentException if nothing at all can be drawn
     */
    public FigureResult payoffByContinuation(Path directory, String baseName, PayoffData data) {
        check(directory, baseName, data);
        boolean lengths = data.axis() == ContinuationAxis.EXPECTED_LENGTH;
        Plot plot = new Plot(style, data.title(), lengths ? "expected game length 1/(1 \u2212 \u03b4) (rounds)"
            : "continuation probability \u03b4", data.payoffDescription(), lengths ? AxisScale.LOG : AxisScale.LINEAR,
            AxisScale.LINEAR);
        // long strategy names would squeeze the axes from the side; below the axes they take height instead
        if (Math.max(data.playerX().length(), data.playerY().length()) > 12) {
            plot.legend(Styler.LegendPosition.OutsideS);
            plot.chart().getStyler().setLegendLayout(Styler.LegendLayout.Vertical);
        } else {
            plot.legend(Styler.LegendPosition.OutsideE);
        }
        plot.heading(data.subject());
        Curve ex = lengths ? toLengths(data.exactX()) : data.exactX();
        Curve ey = lengths ? toLengths(data.exactY()) : data.exactY();
        String x = data.playerX();
        String y = data.playerY();
        plot.curve(null, x + " exact payoff", ex.x(), ex.y(), Palette.BLUE, Plot.SOLID);
        plot.curve(null, y + " exact payoff", ey.x(), ey.y(), Palette.ORANGE, Plot.SOLID);
        double[] span = xRange(List.of(), List.of(ex, ey), lengths);
        boolean stationary = false;
        if (Double.isFinite(span[0])) {
            if (Double.isFinite(data.stationaryX())) {
                stationary |= plot.curve(null, x + " stationary payoff", span,
                    new double[] {data.stationaryX(), data.stationaryX()}, Palette.BLUE, Plot.DASHED);
            }
            if (Double.isFinite(data.stationaryY())) {
                stationary |= plot.curve(null, y + " stationary payoff", span,
                    new double[] {data.stationaryY(), data.stationaryY()}, Palette.ORANGE, Plot.DASHED);
            }
        }
        double[] ax = data.simulatedX() == null ? null : plot.estimates(null, x + " simulated payoff",
            lengths ? toLengths(data.simulatedX()) : data.simulatedX(), Palette.BLUE, Plot.MARKERS[0]);
        double[] ay = data.simulatedY() == null ? null : plot.estimates(null, y + " simulated payoff",
            lengths ? toLengths(data.simulatedY()) : data.simulatedY(), Palette.ORANGE, Plot.MARKERS[1]);
        double[] claimX = claims(plot, x, data.claimedX(), lengths, Palette.BLUE);
        double[] claimY = claims(plot, y, data.claimedY(), lengths, Palette.ORANGE);
        if (plot.hasSeries()) {
            var first = plot.chart().getSeriesMap().values().iterator().next();
            double kx = first.getXMin();
            double ky = first.getYMin();
            if (ax != null) {
                plot.markerKey(x, Palette.BLUE, Plot.MARKERS[0], ax[0], ax[1]);
            } else {
                plot.key(x, Palette.BLUE, Plot.SOLID, kx, ky);
            }
            if (ay != null) {
                plot.markerKey(y, Palette.ORANGE, Plot.MARKERS[1], ay[0], ay[1]);
            } else {
                plot.key(y, Palette.ORANGE, Plot.SOLID, kx, ky);
            }
            plot.key("exact", Palette.BLACK, Plot.SOLID, kx, ky);
            if (stationary) {
                plot.key("\u03b4 \u2192 1", Palette.BLACK, Plot.DASHED, kx, ky);
            }
            if (lengths && data.simulatedX() != null) {
                plot.xTicksAt(expectedLengths(data.simulatedX().x()));
            }
            if (claimX != null || claimY != null) {
                double[] at = claimX != null ? claimX : claimY;
                plot.markerKey("claimed value", claimX != null ? Palette.BLUE : Palette.ORANGE,
                    org.knowm.xchart.style.markers.SeriesMarkers.CROSS, at[0], at[1]);
            }
        }
        return finish(plot, directory, baseName);
    }

    /** Claimed values as crosses in the player's colour; returns the first cross, or null when none was drawn. */
    private static double[] claims(Plot plot, String player, Curve c, boolean lengths, Color color) {
        if (c == null) {
            return null;
        }
        Curve cc = lengths ? toLengths(c) : c;
        double[][] p = plot.drawable(player + " claimed payoff", cc.x(), cc.y());
        if (p[0].length == 0) {
            return null;
        }
        var s = plot.chart().addSeries("\u200bclaimed " + player, p[0], p[1]);
        s.setXYSeriesRenderStyle(org.knowm.xchart.XYSeries.XYSeriesRenderStyle.Scatter);
        s.setMarker(org.knowm.xchart.style.markers.SeriesMarkers.CROSS);
        s.setMarkerColor(color);
        s.setShowInLegend(false);
        return new double[] {p[0][0], p[1][0]};
    }

    /** x = delta becomes x = 1/(1 - delta), the expected number of rounds. */
    private static Curve toLengths(Curve c) {
        return new Curve(expectedLengths(c.x()), c.y());
    }

    private static Estimates toLengths(Estimates e) {
        return new Estimates(expectedLengths(e.x()), e.estimate(), e.lower(), e.upper());
    }

    private static double[] expectedLengths(double[] delta) {
        double[] n = new double[delta.length];
        for (int i = 0; i < n.length; i++) {
            n[i] = 1 / (1 - delta[i]);
        }
        return n;
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
        Plot plot = new Plot(style, data.title(), "round t", "probability of state in round t", AxisScale.LINEAR,
            AxisScale.LINEAR);
        plot.legend(Styler.LegendPosition.OutsideE);
        plot.heading(data.subject());
        for (int s = 0; s < State.COUNT; s++) {
            Curve c = data.exact().get(s);
            plot.curve(null, STATE_NAMES[s] + " exact probability", c.x(), c.y(), Palette.STATES[s], Plot.SOLID);
        }
        double[][] anchors = new double[State.COUNT][];
        for (int s = 0; s < State.COUNT; s++) {
            anchors[s] = plot.estimates(null, STATE_NAMES[s] + " simulated proportion", data.simulated().get(s),
                Palette.STATES[s], Plot.MARKERS[s]);
        }
        addKeys(plot, anchors, "exact", null);
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
        Plot plot = new Plot(style, data.title(), "uniform quantile i/(K+1)", "ordered p-value", AxisScale.LINEAR,
            AxisScale.LINEAR);
        plot.legend(Styler.LegendPosition.InsideNW);
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
            plot.key(sizes.length == 1 ? "pointwise 95% band (K = " + sizes[0] + ")" : "pointwise 95% bands (K = "
                + Arrays.toString(sizes).replaceAll("[\\[\\]]", "") + ")", Palette.BAND_GREY,
                new java.awt.BasicStroke(5f), 0.5, 0.5);
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
            var s = plot.chart().addSeries(sizes.length == 1 ? e.getKey() : e.getKey() + " (K = " + k + ")", x, p);
            s.setLineColor(color);
            s.setMarkerColor(color);
            s.setLineStyle(plot.stroke(QQ_STROKES[j % QQ_STROKES.length]));
            s.setMarker(k <= 60 ? Plot.MARKERS[j % Plot.MARKERS.length] : org.knowm.xchart.style.markers.SeriesMarkers.NONE);
            j++;
        }
        return finish(plot, directory, baseName, !sorted.isEmpty());
    }

    private static final java.awt.BasicStroke[] QQ_STROKES = {Plot.SOLID, Plot.DOTTED, Plot.DASH_DOT};

    /**
     * A heatmap of a number over a two-axis grid (for example noise level against game length).
     *
     * <p>Each cell is coloured by its value on a stepped viridis ramp, from dark purple (small) to yellow
     * (large), over the colour range set with {@link #withColourRange} (the same for every pair) or else
     * the grid's own range; the colour bar at the right labels every step. NaN cells are left white. The
     * ramp is sequential: it shows magnitude, so pass magnitudes (or standardised deviations) rather than
     * signed values whose zero matters.
     *
     * @param directory where to write (created if missing)
     * @param baseName the file name without extension, already safe (see {@link FileNames#safe})
     * @param data the data; see {@link GridValues}
     * @return the files written and notes on data left out
     * @throws IllegalArgumentException if no cell has a finite value
     */
    public FigureResult valueHeatmap(Path directory, String baseName, GridValues data) {
        check(directory, baseName, data);
        return Heatmaps.values(style, formats, colourRange, directory, baseName, data);
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
        return Heatmaps.verdicts(style, formats, directory, baseName, data);
    }

    /**
     * Several figures side by side in one file, each with a panel letter "(a)", "(b)", ... at its top
     * left, for example the same figure kind for several pairs.
     *
     * <p>The figure keeps this instance's printed size; each panel gets an equal cell of it (columns
     * across, as many rows as needed) and is laid out at that cell's size, so its text keeps the same
     * minimum point size. Each panel is drawn by one call of a figure method on the {@code Figures} it
     * is given (its directory and base name are ignored: nothing is written for the panel itself).
     * The notes of each panel are returned prefixed with its letter.
     *
     * @param directory where to write (created if missing)
     * @param baseName the file name without extension, already safe (see {@link FileNames#readable})
     * @param columns panels per row, 1 to 4
     * @param panels 1 to 12 panels, in reading order
     * @return the files written and the panels' notes
     * @throws IllegalArgumentException if a panel has nothing to draw, or the cells would be smaller
     *     than 4 x 3 cm
     */
    public FigureResult panels(Path directory, String baseName, int columns,
        List<java.util.function.Function<Figures, FigureResult>> panels) {
        check(directory, baseName, panels);
        if (panels.isEmpty() || panels.size() > 12 || !(columns >= 1 && columns <= 4)) {
            throw new IllegalArgumentException("panel figure needs 1 to 12 panels and 1 to 4 columns: "
                + panels.size() + " panels, " + columns + " columns");
        }
        int cols = Math.min(columns, panels.size());
        int rows = (panels.size() + cols - 1) / cols;
        FigureSize cell = FigureSize.custom(style.size().widthCm() / cols, style.size().heightCm() / rows);
        Figures inner = new Figures(new FigureStyle(cell, style.dpi()), formats, colourRange);
        List<org.knowm.xchart.internal.chartpart.Chart<?, ?>> charts = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        for (int i = 0; i < panels.size(); i++) {
            java.util.function.Function<Figures, FigureResult> panel = panels.get(i);
            String letter = "(" + (char) ('a' + i) + ")";
            List<FigureResult> result = new ArrayList<>();
            List<org.knowm.xchart.internal.chartpart.Chart<?, ?>> drawn = FigureFiles.capture(() ->
                result.add(panel.apply(inner)));
            result.get(0).notes().forEach(n -> notes.add(letter + " " + n));
            if (drawn.size() != 1) {
                throw new IllegalArgumentException("panel " + letter + " must draw exactly one figure: " + drawn.size());
            }
            charts.add(drawn.get(0));
        }
        int cw = cell.widthPoints();
        int ch = cell.heightPoints();
        java.awt.Font letterFont = TextFont.of(style.axisTitleSize()).plain().deriveFont(java.awt.Font.BOLD);
        FigureFiles.Drawing drawing = new FigureFiles.Drawing() {
            @Override
            public int width() {
                return cw * cols;
            }

            @Override
            public int height() {
                return ch * rows;
            }

            @Override
            public void paint(java.awt.Graphics2D g) {
                for (int i = 0; i < charts.size(); i++) {
                    java.awt.geom.AffineTransform saved = g.getTransform();
                    g.translate((i % cols) * cw, (i / cols) * ch);
                    charts.get(i).paint(g, cw, ch);
                    g.setTransform(saved);
                    g.setColor(Color.BLACK);
                    g.setFont(letterFont);
                    g.drawString("(" + (char) ('a' + i) + ")", (i % cols) * cw + 2f,
                        (i / cols) * ch + 2f + letterFont.getSize2D());
                }
            }
        };
        return new FigureResult(FigureFiles.write(drawing, directory, baseName, formats, style), notes);
    }

    /**
     * Legend entries: one per state (its colour and marker; the markers with bars are the simulated
     * values), then what a solid and a dashed line mean.
     */
    private static void addKeys(Plot plot, double[][] anchors, String solidLabel, String dashedLabel) {
        if (!plot.hasSeries()) {
            return;
        }
        XYChart chart = plot.chart();
        var first = chart.getSeriesMap().values().iterator().next();
        double ax = first.getXMin();
        double ay = first.getYMin();
        for (int s = 0; s < State.COUNT; s++) {
            if (anchors[s] != null) {
                plot.markerKey(STATE_NAMES[s], Palette.STATES[s], Plot.MARKERS[s], anchors[s][0], anchors[s][1]);
            } else {
                plot.key(STATE_NAMES[s], Palette.STATES[s], Plot.SOLID, ax, ay);
            }
        }
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
        return new FigureResult(FigureFiles.write(plot.chart(), directory, baseName, formats, style),
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
