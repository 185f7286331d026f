package reprise.output.figures;

import java.awt.Color;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.knowm.xchart.HeatMapChart;
import org.knowm.xchart.HeatMapSeries;
import org.knowm.xchart.style.HeatMapStyler;
import org.knowm.xchart.style.Styler;

/**
 * The two heatmaps of {@link Figures}: values on a stepped viridis ramp and categorical verdicts.
 *
 * <p>Implementation note: XChart's continuous heatmap legend labels only the two ends of the ramp, so
 * the value map uses its piecewise legend instead: about {@value #STEPS} equal steps of a round size
 * (1, 2, 2.5 or 5 times a power of ten), each labelled with its bounds and coloured by evenly spaced
 * samples of viridis.
 * Values outside a shared colour range are drawn in the end colours and counted in a note.
 */
final class Heatmaps {
    static final int STEPS = 5;

    private Heatmaps() {
    }

    static FigureResult values(FigureStyle style, Set<FigureFormat> formats, double[] colourRange, Path directory,
        String baseName, GridValues data) {
        List<String> notes = new ArrayList<>();
        double[][] values = data.values();
        double[] own = GridValues.range(List.of(data));
        if (!Double.isFinite(own[0])) {
            throw new IllegalArgumentException("value heatmap has no finite value to draw: all "
                + data.axes().rows() * data.axes().columns() + " cells are NaN or infinite");
        }
        double lo = colourRange == null ? own[0] : colourRange[0];
        double hi = colourRange == null ? own[1] : colourRange[1];
        double step = ColourScale.niceStep(hi > lo ? (hi - lo) / STEPS : Math.max(Math.abs(lo), 1) / STEPS);
        int steps = (int) Math.max(1, Math.ceil(hi / step - Math.floor(lo / step) - 1e-9));
        double[] scale = {Math.floor(lo / step) * step, (Math.floor(lo / step) + steps) * step};
        List<Number[]> cells = new ArrayList<>();
        int missing = 0;
        int clipped = 0;
        for (int r = 0; r < values.length; r++) {
            for (int c = 0; c < values[r].length; c++) {
                double v = values[r][c];
                if (Double.isFinite(v)) {
                    double w = Math.max(scale[0], Math.min(scale[1], v));
                    clipped += w == v ? 0 : 1;
                    cells.add(new Number[] {c, r, w});
                } else {
                    missing++;
                }
            }
        }
        if (missing > 0) {
            notes.add(missing + " of " + data.axes().rows() * data.axes().columns()
                + " cells left white (NaN or infinite value)");
        }
        if (clipped > 0) {
            notes.add(clipped + " cells outside the shared colour range " + scale[0] + " to " + scale[1]
                + " drawn in the end colours");
        }
        String title = data.title().isEmpty() ? "colour: " + data.valueDescription()
            : data.title() + " \u2014 colour: " + data.valueDescription();
        HeatMapChart chart = chart(style, title, data.axes());
        HeatMapStyler s = chart.getStyler();
        s.setRangeColors(steps(Math.max(2, steps)));
        s.setPiecewise(true);
        s.setPiecewiseRanged(true);
        s.setSplitNumber(steps);
        int digits = (int) Math.max(0, Math.min(6, Math.ceil(-Math.log10(step)) + 1));
        s.setHeatMapDecimalValueFormatter(v -> format(v, digits));
        HeatMapSeries series = chart.addSeries(FileNames.safe(data.valueDescription()), data.axes().xLabels(),
            data.axes().yLabels(), cells);
        series.setMin(scale[0]);
        series.setMax(scale[1]);
        s.setMin(scale[0]);
        s.setMax(scale[1]);
        return new FigureResult(FigureFiles.write(chart, directory, baseName, formats, style), notes);
    }

    private static String format(double v, int digits) {
        String t = String.format(Locale.ROOT, "%." + digits + "f", v);
        return t.contains(".") ? t.replaceAll("0+$", "").replaceAll("\\.$", "") : t;
    }

    /** {@code n} colours evenly spaced along the viridis stops, from the darkest to the lightest. */
    static Color[] steps(int n) {
        Color[] out = new Color[n];
        int last = Palette.VIRIDIS.length - 1;
        for (int i = 0; i < n; i++) {
            out[i] = Palette.VIRIDIS[(int) Math.round(i * (double) last / (n - 1))];
        }
        return out;
    }

    static FigureResult verdicts(FigureStyle style, Set<FigureFormat> formats, Path directory, String baseName,
        GridVerdicts data) {
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
        HeatMapChart chart = chart(style, data.title(), data.axes());
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
        return new FigureResult(FigureFiles.write(chart, directory, baseName, formats, style), notes);
    }

    private static HeatMapChart chart(FigureStyle style, String title, GridAxes axes) {
        // the plain (width, height) constructor leaves the heatmap styler uninitialised in XChart 3.8.8
        HeatMapChart chart = new HeatMapChart(style.width(), style.height(), Styler.ChartTheme.XChart);
        chart.setTitle(title);
        chart.setXAxisTitle(axes.xTitle());
        chart.setYAxisTitle(axes.yTitle());
        HeatMapStyler s = chart.getStyler();
        style.apply(s, !title.isEmpty());
        s.setChartTitleFont(FigureStyle.font(style.axisTitleSize()));
        s.setLegendPosition(Styler.LegendPosition.OutsideE);
        s.setDrawBorder(true);
        s.setShowValue(false);
        s.setPlotContentSize(1.0);
        s.setGradientColorColumnHeight(Math.max(40, style.height() / 2));
        s.setGradientColorColumnWeight(style.px(8));
        int characters = axes.xLabels().stream().mapToInt(String::length).sum() + axes.columns();
        if (characters * 0.6 * style.textSize() > 0.55 * style.width()) {
            s.setXAxisLabelRotation(45);
        }
        return chart;
    }
}
