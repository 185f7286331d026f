package reprise.output;

import java.awt.BasicStroke;
import java.awt.Color;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.Marker;
import org.knowm.xchart.style.markers.SeriesMarkers;
import reprise.experiment.PayoffPlane;
import reprise.game.Horizon;

/**
 * The zero-determinant payoff plane: pi_Y against pi_X, the feasible region of the stage game (the convex
 * hull of the four payoff pairs, outlined in grey), the line X's strategy enforces (black), and X's exact
 * payoff pair against each co-player, one colour and marker per game length (Okabe-Ito colours). PNG,
 * drawn with XChart.
 *
 * <p>References:
 * Okabe, M. &amp; Ito, K. (2008). Color universal design (CUD): how to make figures and presentations that
 * are friendly to colorblind people. J*Fly, online publication.
 */
public final class PayoffPlaneFigure {
    private static final Color[] SERIES = {new Color(0x0072B2), new Color(0xD55E00), new Color(0x009E73),
        new Color(0xE69F00), new Color(0xCC79A7), new Color(0x56B4E9), new Color(0x000000)};
    private static final Marker[] MARKERS = {SeriesMarkers.CIRCLE, SeriesMarkers.SQUARE, SeriesMarkers.DIAMOND,
        SeriesMarkers.TRIANGLE_UP, SeriesMarkers.TRIANGLE_DOWN, SeriesMarkers.CROSS, SeriesMarkers.PLUS};

    private PayoffPlaneFigure() {
    }

    /**
     * Builds the chart.
     *
     * @param d the data
     * @return the chart
     */
    public static XYChart chart(PayoffPlane d) {
        return chart(d, null);
    }

    /**
     * Builds the chart with simulated per-game payoffs drawn as small translucent points under the exact
     * ones, in the colour of their game length.
     *
     * @param d the data
     * @param clouds the simulated games, or null for none
     * @return the chart
     */
    public static XYChart chart(PayoffPlane d, reprise.experiment.PayoffClouds clouds) {
        XYChart chart = new XYChartBuilder().width(900).height(760)
            .title("Payoff plane of " + d.strategy() + " (" + d.parameters().family() + ")")
            .xAxisTitle("payoff of X").yAxisTitle("payoff of Y").build();
        chart.getStyler().setChartBackgroundColor(Color.WHITE);
        chart.getStyler().setLegendPosition(Styler.LegendPosition.InsideNE);
        double[] ux = d.game().payoffX();
        double[] uy = d.game().payoffY();
        double[][] hull = hull(ux, uy);
        XYSeries region = chart.addSeries("feasible payoffs", hull[0], hull[1]);
        region.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        region.setLineColor(new Color(0x999999));
        region.setMarker(SeriesMarkers.NONE);
        region.setLineStyle(new BasicStroke(1.5f));
        double lo = Math.min(Math.min(ux[0], ux[1]), Math.min(ux[2], ux[3]));
        double hi = Math.max(Math.max(ux[0], ux[1]), Math.max(ux[2], ux[3]));
        int n = 101;
        double[] lx = new double[n];
        double[] ly = new double[n];
        for (int i = 0; i < n; i++) {
            lx[i] = lo + (hi - lo) * i / (n - 1);
            ly[i] = d.lineY(lx[i]);
        }
        XYSeries line = chart.addSeries("enforced line", lx, ly);
        line.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        line.setLineColor(Color.BLACK);
        line.setMarker(SeriesMarkers.NONE);
        line.setLineStyle(new BasicStroke(2f));
        if (clouds != null) {
            for (int k = 0; k < clouds.lengths().size(); k++) {
                int colour = d.lengths().indexOf(clouds.lengths().get(k));
                Color c = SERIES[Math.max(0, colour) % SERIES.length];
                for (int j = 0; j < clouds.coPlayers().size(); j++) {
                    String name = j == 0 ? "simulated games, " + clouds.lengths().get(k).describe()
                        : "games of " + clouds.lengths().get(k).describe() + " vs " + clouds.coPlayers().get(j);
                    XYSeries cloud = chart.addSeries(name, clouds.payoffX()[k][j], clouds.payoffY()[k][j]);
                    cloud.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
                    cloud.setMarker(SeriesMarkers.CIRCLE);
                    cloud.setMarkerColor(new Color(c.getRed(), c.getGreen(), c.getBlue(), 60));
                    cloud.setShowInLegend(j == 0);
                }
            }
        }
        for (int k = 0; k < d.lengths().size(); k++) {
            Horizon h = d.lengths().get(k);
            XYSeries s = chart.addSeries(h == null ? "long run" : h.describe(), d.payoffX()[k], d.payoffY()[k]);
            s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
            s.setMarker(MARKERS[k % MARKERS.length]);
            s.setMarkerColor(SERIES[k % SERIES.length]);
        }
        chart.getStyler().setMarkerSize(10);
        double ylo = Math.min(Math.min(uy[0], uy[1]), Math.min(uy[2], uy[3]));
        double yhi = Math.max(Math.max(uy[0], uy[1]), Math.max(uy[2], uy[3]));
        double padX = 0.04 * (hi - lo);
        double padY = 0.04 * (yhi - ylo);
        chart.getStyler().setXAxisMin(lo - padX);
        chart.getStyler().setXAxisMax(hi + padX);
        chart.getStyler().setYAxisMin(ylo - padY);
        chart.getStyler().setYAxisMax(yhi + padY);
        return chart;
    }

    /**
     * Writes the chart as PNG.
     *
     * @param d the data
     * @param file the file (its folder is created)
     * @return the file
     */
    public static Path write(PayoffPlane d, Path file) {
        return write(d, null, file);
    }

    /**
     * Writes the chart, with simulated games, as PNG, atomically ({@link AtomicFiles}).
     *
     * @param d the data
     * @param clouds the simulated games, or null
     * @param file the file (its folder is created)
     * @return the file
     */
    public static Path write(PayoffPlane d, reprise.experiment.PayoffClouds clouds, Path file) {
        XYChart chart = chart(d, clouds);
        AtomicFiles.write(file, temporary -> Files.write(temporary,
            BitmapEncoder.getBitmapBytes(chart, BitmapEncoder.BitmapFormat.PNG)));
        return file;
    }

    /** The closed convex hull of the four payoff pairs (gift wrapping by angle), as x and y arrays. */
    static double[][] hull(double[] ux, double[] uy) {
        List<double[]> pts = new ArrayList<>();
        for (int s = 0; s < 4; s++) {
            pts.add(new double[] {ux[s], uy[s]});
        }
        pts.sort(Comparator.<double[]>comparingDouble(p -> p[0]).thenComparingDouble(p -> p[1]));
        List<double[]> h = new ArrayList<>();
        for (int pass = 0; pass < 2; pass++) {
            int start = h.size();
            for (double[] p : pass == 0 ? pts : reversed(pts)) {
                while (h.size() >= start + 2 && cross(h.get(h.size() - 2), h.get(h.size() - 1), p) <= 0) {
                    h.remove(h.size() - 1);
                }
                h.add(p);
            }
            h.remove(h.size() - 1);
        }
        h.add(h.get(0));
        double[][] out = new double[2][h.size()];
        for (int i = 0; i < h.size(); i++) {
            out[0][i] = h.get(i)[0];
            out[1][i] = h.get(i)[1];
        }
        return out;
    }

    private static List<double[]> reversed(List<double[]> l) {
        List<double[]> r = new ArrayList<>(l);
        java.util.Collections.reverse(r);
        return r;
    }

    private static double cross(double[] o, double[] a, double[] b) {
        return (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
    }
}
