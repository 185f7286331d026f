package reprise.output;

import java.awt.BasicStroke;
import java.awt.Color;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.TreeSet;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import reprise.experiment.PopulationAnalysis;
import reprise.experiment.PopulationExperiment;
import reprise.game.Population;

/**
 * Figures of a population experiment: for every population size, error level, game length and ordered
 * (mutant, resident) pair whose grid has at least two selection strengths, the fixation probability
 * against selection strength - exact curves for the three payoff bases (computed at the grid's strengths
 * and {@value #EXTRA} more evenly spaced up to the largest), the simulated frequencies with their
 * intervals, and the neutral line 1/N. At most {@value #MOST_FIGURES} figures are drawn (the first in
 * grid order); population.csv holds every number.
 */
public final class PopulationFigures {

    /** Extra selection strengths on each exact curve. */
    static final int EXTRA = 6;
    /** The most figures one run draws. */
    static final int MOST_FIGURES = 60;
    private static final Color[] BASIS_COLOURS = {new Color(0xD55E00), new Color(0x0072B2), new Color(0x009E73)};

    private PopulationFigures() {
    }

    /**
     * Draws the figures.
     *
     * @param e the experiment
     * @param result the analysis
     * @param folder the figures folder (created when a figure is drawn)
     * @return the files written
     */
    public static List<Path> draw(PopulationExperiment e, PopulationAnalysis.Result result, Path folder) {
        List<Path> out = new ArrayList<>();
        if (e.selections().size() < 2) {
            return out;
        }
        int k = e.strategies().size();
        List<PopulationExperiment.Point> points = e.points();
        int perSelection = e.noise().size() * e.misperception().size() * e.horizons().size();
        int perSize = perSelection * e.selections().size();
        for (int n = 0; n < e.sizes().size(); n++) {
            for (int rest = 0; rest < perSelection; rest++) {
                List<PopulationExperiment.Point> line = new ArrayList<>();
                for (int s = 0; s < e.selections().size(); s++) {
                    line.add(points.get(n * perSize + s * perSelection + rest));
                }
                for (int m = 0; m < k; m++) {
                    for (int r = 0; r < k; r++) {
                        if (m == r || out.size() >= MOST_FIGURES) {
                            continue;
                        }
                        out.add(write(chart(e, result, line, m, r), folder.resolve(fileName(e, line.get(0), m, r))));
                    }
                }
            }
        }
        return out;
    }

    private static String fileName(PopulationExperiment e, PopulationExperiment.Point p, int m, int r) {
        String name = "fixation-" + e.strategyNames().get(m) + "-in-" + e.strategyNames().get(r) + "-N"
            + p.population().size() + "-noise" + p.noise().executionX() + (p.noise().perceptionX() > 0
            ? "-misperception" + p.noise().perceptionX() : "") + "-" + p.horizon().describe();
        return name.replaceAll("[^A-Za-z0-9._=-]", "_") + ".png";
    }

    /**
     * One figure's chart.
     *
     * @param e the experiment
     * @param result the analysis
     * @param line the grid points of one line, in order of selection strength
     * @param m the mutant
     * @param r the resident
     * @return the chart
     */
    static XYChart chart(PopulationExperiment e, PopulationAnalysis.Result result,
        List<PopulationExperiment.Point> line, int m, int r) {
        PopulationExperiment.Point first = line.get(0);
        int size = first.population().size();
        XYChart chart = new XYChartBuilder().width(900).height(640).title("Fixation of " + e.strategyNames().get(m)
            + " among " + e.strategyNames().get(r) + ", N = " + size + ", noise " + first.noise().executionX() + ", "
            + first.horizon().describe()).xAxisTitle(first.population().update() == Population.Update.PAIRWISE_COMPARISON
            ? "selection strength beta" : "selection intensity w").yAxisTitle("fixation probability").build();
        chart.getStyler().setChartBackgroundColor(Color.WHITE);
        chart.getStyler().setLegendPosition(Styler.LegendPosition.InsideNW);
        TreeSet<Double> xs = new TreeSet<>(e.selections());
        double max = xs.last();
        for (int i = 0; i <= EXTRA; i++) {
            xs.add(max * i / EXTRA);
        }
        double[] x = xs.stream().mapToDouble(Double::doubleValue).toArray();
        String[] names = {"(a) stationary payoffs", "(b) expected payoffs", "(c) realised payoffs (exact)"};
        for (PopulationAnalysis.Basis b : List.of(PopulationAnalysis.Basis.STATIONARY,
            PopulationAnalysis.Basis.REALISED, PopulationAnalysis.Basis.EXPECTED)) {
            double[] y = new double[x.length];
            boolean any = false;
            for (int i = 0; i < x.length; i++) {
                y[i] = PopulationAnalysis.fixation(e, first, x[i], b, m, r);
                any |= !Double.isNaN(y[i]);
            }
            if (!any) {
                continue;
            }
            XYSeries s = chart.addSeries(names[b.ordinal()], x, y);
            s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
            s.setMarker(SeriesMarkers.NONE);
            s.setLineColor(BASIS_COLOURS[b.ordinal()]);
            s.setLineStyle(b == PopulationAnalysis.Basis.EXPECTED ? new BasicStroke(2f, BasicStroke.CAP_BUTT,
                BasicStroke.JOIN_MITER, 10f, new float[] {9f, 6f}, 0f)
                : new BasicStroke(b == PopulationAnalysis.Basis.REALISED ? 2.5f : 1.5f));
        }
        XYSeries neutral = chart.addSeries("neutral 1/N", new double[] {0, max}, new double[] {1.0 / size, 1.0 / size});
        neutral.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        neutral.setMarker(SeriesMarkers.NONE);
        neutral.setLineColor(Color.GRAY);
        neutral.setLineStyle(new BasicStroke(1f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {6f, 4f},
            0f));
        List<Double> sx = new ArrayList<>();
        List<Double> sy = new ArrayList<>();
        for (PopulationExperiment.Point p : line) {
            for (PopulationAnalysis.Row row : result.rows()) {
                if (row.point().index() == p.index() && row.mutant() == m && row.resident() == r
                    && row.basis() == PopulationAnalysis.Basis.REALISED && row.interval() != null) {
                    double sel = p.population().selection();
                    sx.add(sel);
                    sy.add(row.tally().fixationFrequency());
                    XYSeries bar = chart.addSeries("interval " + p.index(), new double[] {sel, sel},
                        new double[] {row.interval().lower(), row.interval().upper()});
                    bar.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
                    bar.setMarker(SeriesMarkers.NONE);
                    bar.setLineColor(Color.BLACK);
                    bar.setShowInLegend(false);
                }
            }
        }
        if (!sx.isEmpty()) {
            XYSeries sim = chart.addSeries("simulated invasions (" + Math.round(100 * (1 - e.alpha())) + "% Wilson)", sx,
                sy);
            sim.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
            sim.setMarker(SeriesMarkers.CIRCLE);
            sim.setMarkerColor(Color.BLACK);
        }
        return chart;
    }

    /**
     * Abundance against game length: for every population size, selection strength and error level whose
     * grid has at least two lengths, and mutation rare or a rate, one figure with each strategy's exact
     * abundance for (c) realised payoffs (solid), (b) expected payoffs (markers) and (a) stationary payoffs
     * (dashed; the same for every length), and with a rate the simulated abundances with their intervals.
     *
     * @param e the experiment
     * @param result the analysis
     * @param folder the figures folder
     * @return the files written
     */
    public static List<Path> drawAbundance(PopulationExperiment e, PopulationAnalysis.Result result, Path folder) {
        List<Path> out = new ArrayList<>();
        if (e.mutation() == PopulationExperiment.Mutation.NONE || e.horizons().size() < 2) {
            return out;
        }
        List<PopulationExperiment.Point> points = e.points();
        int h = e.horizons().size();
        for (int start = 0; start < points.size() && out.size() < MOST_FIGURES; start += h) {
            List<PopulationAnalysis.PointExact> line = result.exact().subList(start, start + h);
            PopulationExperiment.Point first = points.get(start);
            String name = ("abundance-N" + first.population().size() + "-selection" + first.population().selection()
                + "-noise" + first.noise().executionX() + (first.noise().perceptionX() > 0 ? "-misperception"
                + first.noise().perceptionX() : "")).replaceAll("[^A-Za-z0-9._=-]", "_") + ".png";
            out.add(write(abundanceChart(e, result, line), folder.resolve(name)));
        }
        return out;
    }

    private static XYChart abundanceChart(PopulationExperiment e, PopulationAnalysis.Result result,
        List<PopulationAnalysis.PointExact> line) {
        PopulationExperiment.Point first = line.get(0).point();
        boolean rounds = first.horizon() instanceof reprise.game.Horizon.Rounds;
        XYChart chart = new XYChartBuilder().width(900).height(640).title("Abundance, N = " + first.population().size()
            + ", selection " + first.population().selection() + ", noise " + first.noise().executionX() + ", mutation "
            + (e.mutation() == PopulationExperiment.Mutation.RATE ? Double.toString(e.mu()) : "rare"))
            .xAxisTitle(rounds ? "rounds per game" : "continuation probability").yAxisTitle("abundance").build();
        chart.getStyler().setChartBackgroundColor(Color.WHITE);
        chart.getStyler().setLegendPosition(Styler.LegendPosition.OutsideE);
        chart.getStyler().setXAxisLogarithmic(rounds);
        double[] x = new double[line.size()];
        for (int i = 0; i < x.length; i++) {
            reprise.game.Horizon hz = line.get(i).point().horizon();
            x[i] = hz instanceof reprise.game.Horizon.Rounds r ? r.count()
                : ((reprise.game.Horizon.Continuation) hz).probability();
        }
        Color[] colours = {new Color(0x0072B2), new Color(0xD55E00), new Color(0x009E73), new Color(0xE69F00),
            new Color(0xCC79A7), new Color(0x56B4E9), Color.BLACK};
        int k = e.strategies().size();
        for (int sIdx = 0; sIdx < k; sIdx++) {
            Color colour = colours[sIdx % colours.length];
            for (PopulationAnalysis.Basis b : List.of(PopulationAnalysis.Basis.REALISED,
                PopulationAnalysis.Basis.EXPECTED, PopulationAnalysis.Basis.STATIONARY)) {
                double[] y = new double[x.length];
                boolean any = false;
                for (int i = 0; i < x.length; i++) {
                    double[] a = line.get(i).abundance()[b.ordinal()];
                    y[i] = a == null ? Double.NaN : a[sIdx];
                    any |= a != null;
                }
                if (!any) {
                    continue;
                }
                XYSeries s = chart.addSeries(e.strategyNames().get(sIdx) + " " + b.label(), x, y);
                s.setLineColor(colour);
                s.setMarkerColor(colour);
                if (b == PopulationAnalysis.Basis.REALISED) {
                    s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
                    s.setMarker(SeriesMarkers.NONE);
                    s.setLineStyle(new BasicStroke(2.5f));
                } else if (b == PopulationAnalysis.Basis.EXPECTED) {
                    s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
                    s.setMarker(SeriesMarkers.DIAMOND);
                } else {
                    s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
                    s.setMarker(SeriesMarkers.NONE);
                    s.setLineStyle(new BasicStroke(1.5f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                        new float[] {6f, 4f}, 0f));
                }
            }
            List<Double> sx = new ArrayList<>();
            List<Double> sy = new ArrayList<>();
            for (int i = 0; i < x.length; i++) {
                int idx = line.get(i).point().index();
                for (PopulationAnalysis.AbundanceRow r : result.abundances()) {
                    if (r.point().index() == idx && r.strategy() == sIdx && r.simulated() != null
                        && r.basis() == PopulationAnalysis.Basis.REALISED) {
                        sx.add(x[i]);
                        sy.add(r.simulated().value());
                        XYSeries bar = chart.addSeries("ci " + sIdx + " " + idx, new double[] {x[i], x[i]},
                            new double[] {r.interval().lower(), r.interval().upper()});
                        bar.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
                        bar.setMarker(SeriesMarkers.NONE);
                        bar.setLineColor(colour);
                        bar.setShowInLegend(false);
                    }
                }
            }
            if (!sx.isEmpty()) {
                XYSeries sim = chart.addSeries(e.strategyNames().get(sIdx) + " simulated", sx, sy);
                sim.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
                sim.setMarker(SeriesMarkers.CIRCLE);
                sim.setMarkerColor(colour);
            }
        }
        return chart;
    }

    private static Path write(XYChart chart, Path file) {
        try {
            Files.createDirectories(file.toAbsolutePath().getParent());
            BitmapEncoder.saveBitmap(chart, file.toString(), BitmapEncoder.BitmapFormat.PNG);
        } catch (IOException ex) {
            throw new UncheckedIOException("could not write " + file, ex);
        }
        return file;
    }
}
