package reprise.output;

import java.awt.BasicStroke;
import java.awt.Color;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.IntToDoubleFunction;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import reprise.experiment.SweepDefinition;
import reprise.experiment.SweepTable;

/**
 * Value maps of a sweep over a two-axis grid: for each co-player, game length and quantity (X's payoff, X's
 * cooperation rate, and the enforced residual when the co-player is zero-determinant) a heatmap (cells
 * coloured in ten equal bins between the smallest and largest value, viridis colours) and a contour plot
 * (nine levels, by marching squares on the grid), both PNG, drawn with XChart.
 *
 * <p>Implementation note. The heatmap is an XY chart whose cells are square markers, one series per colour
 * bin, so the axes stay numeric; the contour lines are the marching-squares segments of each level, one
 * series per level, separated by NaN gaps. Saddle cells (two opposite corners above the level) are split
 * by the cell's mean value. Files are named {@code map-QUANTITY-cJ-lK-heatmap.png} and
 * {@code map-QUANTITY-cJ-lK-contour.png} with J the co-player index and K the length index (both from 0).
 *
 * <p>References:
 * Lorensen, W.E. &amp; Cline, H.E. (1987). Marching cubes: a high resolution 3D surface construction
 * algorithm. Computer Graphics 21(4), 163-169 (the two-dimensional case).
 */
public final class SweepMaps {
    private static final Color[] VIRIDIS = {
        new Color(0x440154), new Color(0x482878), new Color(0x3E4A89), new Color(0x31688E), new Color(0x26828E),
        new Color(0x1F9E89), new Color(0x35B779), new Color(0x6DCD59), new Color(0xB4DE2C), new Color(0xFDE725),
    };
    private static final String[] ENTRY = {"p_cc", "p_cd", "p_dc", "p_dd"};
    private static final int SIZE = 720;

    private SweepMaps() {
    }

    /** The two varying axes of a grid: names, values and index strides. */
    record Axes(String xName, double[] x, int xStride, String yName, double[] y, int yStride) {
    }

    /**
     * Checks that the sweep can be mapped: a grid with exactly two axes of more than one value.
     *
     * @param d the definition
     * @return the two axes
     * @throws IllegalArgumentException otherwise
     */
    public static Axes check(SweepDefinition d) {
        if (d.family() instanceof SweepDefinition.ReactiveGrid g) {
            if (g.p().length < 2 || g.q().length < 2) {
                throw new IllegalArgumentException("value maps need both reactive axes to have at least 2 points");
            }
            return new Axes("p (after C)", g.p(), g.q().length, "q (after D)", g.q(), 1);
        }
        if (d.family() instanceof SweepDefinition.MemoryOneGrid g) {
            double[][] ax = g.axes();
            List<Integer> varying = new ArrayList<>();
            for (int i = 0; i < 4; i++) {
                if (ax[i].length > 1) {
                    varying.add(i);
                }
            }
            if (varying.size() != 2) {
                throw new IllegalArgumentException("value maps need a memory-one grid with exactly two axes of more "
                    + "than one value: " + varying.size() + " vary");
            }
            int[] stride = new int[4];
            int s = 1;
            for (int i = 3; i >= 0; i--) {
                stride[i] = s;
                s *= ax[i].length;
            }
            int a = varying.get(0);
            int b = varying.get(1);
            return new Axes(ENTRY[a], ax[a], stride[a], ENTRY[b], ax[b], stride[b]);
        }
        throw new IllegalArgumentException("value maps need a grid (--reactive or --memory-one), not random strategies");
    }

    /**
     * Writes the maps.
     *
     * @param t the table
     * @param directory the folder (created if missing)
     * @return the files written
     * @throws UncheckedIOException when writing fails
     */
    public static List<Path> write(SweepTable t, Path directory) {
        Axes axes = check(t.definition());
        List<Path> written = new ArrayList<>();
        try {
            Files.createDirectories(directory);
        } catch (IOException e) {
            throw new UncheckedIOException("could not create " + directory, e);
        }
        int lengths = t.definition().lengths().size();
        for (int j = 0; j < t.coPlayers().size(); j++) {
            for (int k = 0; k < lengths; k++) {
                String length = t.horizon(k) == null ? "long run" : t.horizon(k).describe();
                String where = "vs " + t.coPlayers().get(j) + ", " + length;
                int jj = j;
                int kk = k;
                written.addAll(map(t, axes, directory, "payoff_x", "X's payoff " + where, jj, kk, t::payoffX));
                written.addAll(map(t, axes, directory, "cooperation_x", "X's cooperation " + where, jj, kk,
                    t::cooperationX));
                if (t.enforced(j) != null) {
                    written.addAll(map(t, axes, directory, "enforced_residual", "enforced residual " + where, jj, kk,
                        t::enforcedResidual));
                }
            }
        }
        return written;
    }

    private static List<Path> map(SweepTable t, Axes a, Path dir, String quantity, String title, int coPlayer,
        int length, IntToDoubleFunction value) {
        int nx = a.x().length;
        int ny = a.y().length;
        double[][] z = new double[nx][ny];
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < nx; i++) {
            for (int j = 0; j < ny; j++) {
                z[i][j] = value.applyAsDouble(t.row(i * a.xStride() + j * a.yStride(), coPlayer, length));
                lo = Math.min(lo, z[i][j]);
                hi = Math.max(hi, z[i][j]);
            }
        }
        String base = String.format(Locale.ROOT, "map-%s-c%d-l%d", quantity, coPlayer, length);
        Path heat = dir.resolve(base + "-heatmap.png");
        Path contour = dir.resolve(base + "-contour.png");
        save(heatmap(a, z, lo, hi, title), heat);
        save(contour(a, z, lo, hi, title), contour);
        return List.of(heat, contour);
    }

    static XYChart heatmap(Axes a, double[][] z, double lo, double hi, String title) {
        XYChart chart = base(a, title);
        int bins = VIRIDIS.length;
        double width = hi - lo;
        List<List<double[]>> cells = new ArrayList<>();
        for (int b = 0; b < bins; b++) {
            cells.add(new ArrayList<>());
        }
        for (int i = 0; i < z.length; i++) {
            for (int j = 0; j < z[i].length; j++) {
                int b = width > 0 ? (int) Math.min(bins - 1, Math.floor((z[i][j] - lo) / width * bins)) : 0;
                cells.get(b).add(new double[] {a.x()[i], a.y()[j]});
            }
        }
        int marker = Math.max(2, (int) Math.ceil(0.95 * SIZE / Math.max(z.length, z[0].length)) + 1);
        for (int b = 0; b < bins; b++) {
            List<double[]> c = cells.get(b);
            if (c.isEmpty()) {
                continue;
            }
            double[] xs = c.stream().mapToDouble(v -> v[0]).toArray();
            double[] ys = c.stream().mapToDouble(v -> v[1]).toArray();
            String name = width > 0 ? String.format(Locale.ROOT, "%.4g to %.4g", lo + width * b / bins,
                lo + width * (b + 1) / bins) : String.format(Locale.ROOT, "%.4g", lo);
            XYSeries s = chart.addSeries(name, xs, ys);
            s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
            s.setMarker(SeriesMarkers.SQUARE);
            s.setMarkerColor(VIRIDIS[b]);
        }
        chart.getStyler().setMarkerSize(marker);
        return chart;
    }

    static XYChart contour(Axes a, double[][] z, double lo, double hi, String title) {
        XYChart chart = base(a, title);
        int levels = 9;
        for (int l = 1; l <= levels; l++) {
            double level = lo + (hi - lo) * l / (levels + 1);
            List<Double> xs = new ArrayList<>();
            List<Double> ys = new ArrayList<>();
            segments(a.x(), a.y(), z, level, xs, ys);
            if (xs.isEmpty()) {
                continue;
            }
            XYSeries s = chart.addSeries(String.format(Locale.ROOT, "%.4g", level),
                xs.stream().mapToDouble(Double::doubleValue).toArray(), ys.stream().mapToDouble(Double::doubleValue).toArray());
            s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
            s.setMarker(SeriesMarkers.NONE);
            s.setLineColor(VIRIDIS[Math.min(VIRIDIS.length - 1, l)]);
            s.setLineStyle(new BasicStroke(2f));
        }
        return chart;
    }

    /**
     * Marching squares: appends the segments where the bilinear surface crosses the level, each segment as
     * two points followed by a NaN gap.
     */
    static void segments(double[] x, double[] y, double[][] z, double level, List<Double> xs, List<Double> ys) {
        for (int i = 0; i + 1 < x.length; i++) {
            for (int j = 0; j + 1 < y.length; j++) {
                double z00 = z[i][j];
                double z10 = z[i + 1][j];
                double z11 = z[i + 1][j + 1];
                double z01 = z[i][j + 1];
                // corners counter-clockwise from (x_i, y_j); edges 0 bottom, 1 right, 2 top, 3 left
                int code = (z00 > level ? 1 : 0) | (z10 > level ? 2 : 0) | (z11 > level ? 4 : 0) | (z01 > level ? 8 : 0);
                if (code == 0 || code == 15) {
                    continue;
                }
                double[][] p = new double[4][];
                p[0] = cross(x[i], y[j], z00, x[i + 1], y[j], z10, level);
                p[1] = cross(x[i + 1], y[j], z10, x[i + 1], y[j + 1], z11, level);
                p[2] = cross(x[i + 1], y[j + 1], z11, x[i], y[j + 1], z01, level);
                p[3] = cross(x[i], y[j + 1], z01, x[i], y[j], z00, level);
                List<Integer> edges = new ArrayList<>();
                for (int e = 0; e < 4; e++) {
                    if (p[e] != null) {
                        edges.add(e);
                    }
                }
                if (edges.size() == 2) {
                    add(p[edges.get(0)], p[edges.get(1)], xs, ys);
                } else if (edges.size() == 4) {
                    boolean centreAbove = (z00 + z10 + z11 + z01) / 4 > level;
                    boolean corner0Above = z00 > level;
                    if (centreAbove == corner0Above) {
                        add(p[0], p[1], xs, ys);
                        add(p[2], p[3], xs, ys);
                    } else {
                        add(p[0], p[3], xs, ys);
                        add(p[1], p[2], xs, ys);
                    }
                }
            }
        }
    }

    private static double[] cross(double xa, double ya, double za, double xb, double yb, double zb, double level) {
        if ((za > level) == (zb > level)) {
            return null;
        }
        double f = (level - za) / (zb - za);
        return new double[] {xa + f * (xb - xa), ya + f * (yb - ya)};
    }

    private static void add(double[] a, double[] b, List<Double> xs, List<Double> ys) {
        xs.add(a[0]);
        ys.add(a[1]);
        xs.add(b[0]);
        ys.add(b[1]);
        xs.add(Double.NaN);
        ys.add(Double.NaN);
    }

    private static XYChart base(Axes a, String title) {
        XYChart chart = new XYChartBuilder().width(SIZE + 220).height(SIZE).title(title).xAxisTitle(a.xName())
            .yAxisTitle(a.yName()).build();
        org.knowm.xchart.style.XYStyler s = chart.getStyler();
        s.setLegendPosition(Styler.LegendPosition.OutsideE);
        s.setChartBackgroundColor(Color.WHITE);
        s.setPlotGridLinesVisible(false);
        s.setXAxisTickMarkSpacingHint(90);
        s.setYAxisTickMarkSpacingHint(90);
        s.setXAxisDecimalPattern("0.###");
        s.setYAxisDecimalPattern("0.###");
        chart.getStyler().setXAxisMin(a.x()[0]);
        chart.getStyler().setXAxisMax(a.x()[a.x().length - 1]);
        chart.getStyler().setYAxisMin(a.y()[0]);
        chart.getStyler().setYAxisMax(a.y()[a.y().length - 1]);
        return chart;
    }

    private static void save(XYChart chart, Path file) {
        try {
            BitmapEncoder.saveBitmap(chart, file.toString(), BitmapEncoder.BitmapFormat.PNG);
        } catch (IOException e) {
            throw new UncheckedIOException("could not write " + file, e);
        }
    }
}
