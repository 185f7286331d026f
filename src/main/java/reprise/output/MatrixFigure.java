package reprise.output;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import javax.imageio.ImageIO;
import org.knowm.xchart.AnnotationText;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import reprise.experiment.BaseQuantity;
import reprise.experiment.SetMatrix;
import reprise.game.Horizon;
import reprise.game.StageGame;

/**
 * The payoff-matrix figure of a strategy set at one grid point: one square per played match (row
 * strategy as X, top to bottom; column strategy as Y, left to right), coloured by the row player's exact
 * payoff per round on a scale shared by every matrix of the game (its lowest to its highest stage
 * payoff, in {@link #BINS} equal bands, listed in the legend), with the exact value printed in the
 * square and a cross where a comparison of that match's simulation with the exact values disagrees.
 * Matches that were not played are left blank.
 */
public final class MatrixFigure {

    /** The colour bands of the payoff scale, light (low) to dark (high). */
    static final Color[] BINS = {new Color(0xffffcc), new Color(0xffeda0), new Color(0xfed976),
        new Color(0xfeb24c), new Color(0xfd8d3c), new Color(0xfc4e2a), new Color(0xe31a1c), new Color(0xb10026)};
    private static final int CELL = 96;

    private MatrixFigure() {
    }

    /**
     * The chart.
     *
     * @param m the matrix
     * @param game the stage game (for the shared scale)
     * @return the chart
     */
    static XYChart chart(SetMatrix m, StageGame game) {
        int n = m.strategies().size();
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double u : game.payoffX()) {
            lo = Math.min(lo, u);
            hi = Math.max(hi, u);
        }
        XYChart chart = new XYChartBuilder().width(260 + CELL * n + 220).height(170 + CELL * n)
            .title("Row player's payoff per round, " + title(m)).xAxisTitle("column strategy (Y)")
            .yAxisTitle("row strategy (X)").build();
        Styler s = chart.getStyler();
        chart.getStyler().setChartBackgroundColor(Color.WHITE);
        chart.getStyler().setPlotGridLinesVisible(false);
        chart.getStyler().setLegendPosition(Styler.LegendPosition.OutsideE);
        chart.getStyler().setXAxisMin(-1.6);
        chart.getStyler().setXAxisMax(n - 0.5);
        chart.getStyler().setYAxisMin(-0.5);
        chart.getStyler().setYAxisMax(n + 0.1);
        chart.getStyler().setAxisTicksVisible(false);
        for (int i = 0; i < n; i++) {
            chart.addAnnotation(new AnnotationText(m.strategies().get(i), -1.05, n - 1 - i, false));
            chart.addAnnotation(new AnnotationText(m.strategies().get(i), i, n - 0.2, false));
        }
        chart.getStyler().setMarkerSize(14);
        chart.getStyler().setAnnotationTextFont(new Font(Font.SANS_SERIF, Font.BOLD, 13));
        chart.getStyler().setAnnotationTextFontColor(Color.BLACK);
        s.setToolTipsEnabled(false);
        double width = hi - lo;
        List<double[]> crosses = new ArrayList<>();
        int k = 0;
        for (SetMatrix.Cell c : m.cells()) {
            double x = c.column();
            double y = n - 1 - c.row();
            double v = c.value(BaseQuantity.PAYOFF_X).map(SetMatrix.Value::exact).orElse(Double.NaN);
            Color fill = Color.LIGHT_GRAY;
            if (Double.isFinite(v)) {
                fill = BINS[band(v, lo, width)];
                chart.addAnnotation(new AnnotationText(String.format(Locale.ROOT, "%.4f", v), x, y, false));
            } else {
                chart.addAnnotation(new AnnotationText("no exact value", x, y, false));
            }
            XYSeries square = chart.addSeries("cell " + k++, new double[] {x - 0.48, x + 0.48, x + 0.48, x - 0.48,
                x - 0.48}, new double[] {y - 0.48, y - 0.48, y + 0.48, y + 0.48, y - 0.48});
            square.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.PolygonArea);
            square.setMarker(SeriesMarkers.NONE);
            square.setFillColor(fill);
            square.setLineColor(fill);
            square.setShowInLegend(false);
            if (c.disagrees()) {
                crosses.add(new double[] {x + 0.34, y + 0.34});
            }
        }
        for (int b = 0; b < BINS.length; b++) {
            XYSeries band = chart.addSeries(legend(lo + width * b / BINS.length) + " to "
                + legend(lo + width * (b + 1) / BINS.length), new double[] {0, 0, 0}, new double[] {0, 0, 0});
            band.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.PolygonArea);
            band.setMarker(SeriesMarkers.NONE);
            band.setFillColor(BINS[b]);
            band.setLineColor(BINS[b]);
        }
        if (!crosses.isEmpty()) {
            XYSeries x = chart.addSeries("simulation disagrees", crosses.stream().mapToDouble(p -> p[0]).toArray(),
                crosses.stream().mapToDouble(p -> p[1]).toArray());
            x.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
            x.setMarker(SeriesMarkers.CROSS);
            x.setMarkerColor(new Color(0x1f3a93));
            x.setLineStyle(new BasicStroke(3f));
        }
        return chart;
    }

    /** Three significant digits without trailing zeros, e.g. 0, 0.625, 1.88. */
    private static String legend(double v) {
        return new java.math.BigDecimal(String.format(Locale.ROOT, "%.3g", v)).stripTrailingZeros().toPlainString();
    }

    /** The colour band of a payoff on the scale [lo, lo + width]. */
    static int band(double v, double lo, double width) {
        return width > 0 ? (int) Math.max(0, Math.min(BINS.length - 1, Math.floor((v - lo) / width * BINS.length)))
            : 0;
    }

    /**
     * The grid point in words, e.g. "noise 0.01, rounds=100".
     *
     * @param m the matrix
     * @return the title's tail
     */
    static String title(SetMatrix m) {
        StringBuilder sb = new StringBuilder();
        m.parameters().forEach((k, v) -> sb.append(k).append('=').append(ResultsCsv.label(v)).append(", "));
        sb.append("noise ").append(m.noise());
        if (!m.misperception().equals("0")) {
            sb.append(", misperception ").append(m.misperception());
        }
        sb.append(", ").append(m.horizon().describe());
        return sb.toString();
    }

    /**
     * A file name for a matrix: {@code matrix_} and the grid point with characters safe in file names.
     *
     * @param m the matrix
     * @return e.g. {@code matrix_noise-0.01_rounds-100.png}
     */
    public static String fileName(SetMatrix m) {
        StringBuilder sb = new StringBuilder("matrix");
        m.parameters().forEach((k, v) -> sb.append('_').append(k).append('-').append(ResultsCsv.label(v)));
        sb.append("_noise-").append(m.noise());
        if (!m.misperception().equals("0")) {
            sb.append("_misperception-").append(m.misperception());
        }
        Horizon h = m.horizon();
        sb.append(h instanceof Horizon.Rounds r ? "_rounds-" + r.count()
            : "_continuation-" + ResultsCsv.label(((Horizon.Continuation) h).probability()));
        return sb.toString().replace(',', '+') + ".png";
    }

    /**
     * Writes the figure as PNG, atomically.
     *
     * @param m the matrix
     * @param game the stage game
     * @param file the target
     * @return the file
     */
    public static Path write(SetMatrix m, StageGame game, Path file) {
        BufferedImage image = BitmapEncoder.getBufferedImage(chart(m, game));
        AtomicFiles.write(file, tmp -> {
            if (!ImageIO.write(image, "png", tmp.toFile())) {
                throw new IOException("no PNG writer in this Java runtime");
            }
        });
        return file;
    }
}
