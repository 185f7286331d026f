package reprise.output;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeSet;
import reprise.experiment.Curves;
import reprise.experiment.FigureKind;
import reprise.experiment.TestId;
import reprise.game.State;
import reprise.output.figures.CalibrationData;
import reprise.output.figures.ContinuationAxis;
import reprise.output.figures.ConvergenceData;
import reprise.output.figures.Curve;
import reprise.output.figures.ErrorScalingData;
import reprise.output.figures.Estimates;
import reprise.output.figures.FigureManifest;
import reprise.output.figures.FigureResult;
import reprise.output.figures.Figures;
import reprise.output.figures.FileNames;
import reprise.output.figures.GridAxes;
import reprise.output.figures.GridValues;
import reprise.output.figures.GridVerdicts;
import reprise.output.figures.PValueSample;
import reprise.output.figures.PayoffData;
import reprise.output.figures.StateDistributionData;

/** Draws every figure from the tidy points of {@code curves.csv}. */
public final class Plotter {

    /**
     * A figure written, with what it shows.
     *
     * @param kind the figure kind
     * @param group the group it shows
     * @param result the files and notes (no files when the figure had nothing to draw; a note says why)
     */
    public record Drawn(FigureKind kind, String group, FigureResult result) {
    }

    private Plotter() {
    }

    /** What {@code Figures} says when no point of a figure can be drawn (e.g. only zeros on a log axis). */
    private static final String NOTHING_TO_DRAW = "has nothing to draw";

    /**
     * Draws all figures. A figure with no drawable point (for example an error figure of a deterministic
     * pair, whose errors are all 0 on a log axis) is not an error of the run: it is returned with no files
     * and a note starting "not drawn:", so that the results and the report are still written.
     *
     * @param points the points
     * @param directory where the figures go
     * @return what was drawn (or not drawn, with no files), in order
     */
    public static List<Drawn> draw(List<Curves.Point> points, Path directory) {
        return draw(points, directory, Figures.withDefaults());
    }

    /**
     * Draws all figures with the given size, resolution and formats; see {@link #draw(List, Path)}.
     *
     * @param points the points
     * @param directory where the figures go
     * @param figures the figure settings
     * @return what was drawn (or not drawn, with no files), in order
     */
    public static List<Drawn> draw(List<Curves.Point> points, Path directory, Figures figures) {
        return draw(points, directory, figures, ContinuationAxis.PROBABILITY, List.of());
    }

    /**
     * Draws all figures; see {@link #draw(List, Path)}.
     *
     * @param points the points
     * @param directory where the figures go
     * @param figures the figure settings
     * @param axis what the x-axis of payoff-against-continuation figures shows
     * @param more figures drawn elsewhere (for example the calibration figure) to list in the manifest too
     * @return what was drawn (or not drawn, with no files), in order, without {@code more}
     */
    public static List<Drawn> draw(List<Curves.Point> points, Path directory, Figures figures, ContinuationAxis axis,
        List<Drawn> more) {
        return draw(points, directory, figures, axis, Panels.SEPARATE, more);
    }

    /** Whether the figures of several pairs are also combined into one file per figure kind. */
    public enum Panels {
        /** One file per figure and group. */
        SEPARATE,
        /**
         * Also one file per figure kind with two or more groups (up to 12), the groups as panels (a), (b), ...
         * in the order of the separate files, named {@code KIND-panels}.
         */
        ALSO_COMBINED
    }

    /**
     * Draws all figures, optionally also combined into panels; see {@link #draw(List, Path)}.
     *
     * @param points the points
     * @param directory where the figures go
     * @param figures the figure settings
     * @param axis what the x-axis of payoff-against-continuation figures shows
     * @param panels whether to combine the groups of each figure kind into panels too
     * @param more figures drawn elsewhere (for example the calibration figure) to list in the manifest too
     * @return what was drawn (or not drawn, with no files), in order, without {@code more}
     */
    public static List<Drawn> draw(List<Curves.Point> points, Path directory, Figures figures, ContinuationAxis axis,
        Panels panels, List<Drawn> more) {
        Map<FigureKind, Map<String, List<Curves.Point>>> byFigure = new LinkedHashMap<>();
        for (Curves.Point p : points) {
            byFigure.computeIfAbsent(p.figure(), k -> new LinkedHashMap<>())
                .computeIfAbsent(p.group(), k -> new ArrayList<>()).add(p);
        }
        java.util.Set<String> taken = new java.util.HashSet<>();
        Figures shared = sharedColourRange(figures, points);
        List<Job> jobs = new ArrayList<>();
        byFigure.forEach((figure, groups) -> groups.forEach((group, pts) -> jobs.add(new Job(figure, group,
            FileNames.unique(FileNames.readable(figure.label() + "-" + group), taken), pts))));
        // figures are independent and Figures is thread-safe: draw them in parallel, keep their order
        List<Drawn> out = jobs.parallelStream().map(job -> {
            FigureKind figure = job.figure();
            String group = job.group();
            String base = job.base();
            List<Curves.Point> pts = job.points();
            FigureResult r;
            try {
                r = switch (figure) {
                    case CONVERGENCE -> convergence(figures, directory, base, pts);
                    case ERROR -> error(figures, directory, base, pts);
                    case PAYOFF -> payoff(figures, directory, base, pts, axis);
                    case DISTRIBUTION -> distribution(figures, directory, base, pts);
                    case DEVIATION -> deviation(shared, directory, base, pts);
                    case VERDICTS -> verdicts(figures, directory, base, pts);
                    case CALIBRATION -> null;
                };
            } catch (IllegalArgumentException ex) {
                if (!String.valueOf(ex.getMessage()).contains(NOTHING_TO_DRAW)) {
                    throw ex;
                }
                r = new FigureResult(List.of(), List.of("not drawn: " + ex.getMessage()));
            }
            return r == null ? null : new Drawn(figure, group, r);
        }).filter(java.util.Objects::nonNull).collect(java.util.stream.Collectors.toCollection(ArrayList::new));
        if (panels == Panels.ALSO_COMBINED) {
            out.addAll(combined(jobs, out, directory, figures, shared, axis, taken));
        }
        List<Drawn> all = new ArrayList<>(out);
        all.addAll(more);
        manifest(directory, figures, all);
        return out;
    }

    /**
     * Writes figures/manifest.csv for the given figures.
     *
     * @param directory the figures' folder
     * @param figures the settings they were drawn with
     * @param drawn the figures
     * @return the manifest's path
     */
    public static Path manifest(Path directory, Figures figures, List<Drawn> drawn) {
        return FigureManifest.write(directory, figures, drawn.stream()
            .map(d -> new FigureManifest.Entry(d.kind().label(), d.group(), d.result())).toList());
    }

    /** One file per figure kind whose separately drawn groups number 2 to 12, the groups as lettered panels. */
    private static List<Drawn> combined(List<Job> jobs, List<Drawn> drawn, Path directory, Figures figures,
        Figures shared, ContinuationAxis axis, java.util.Set<String> taken) {
        List<Drawn> out = new ArrayList<>();
        for (FigureKind kind : FigureKind.values()) {
            List<Job> ok = jobs.stream().filter(j -> j.figure() == kind && drawn.stream().anyMatch(d -> d.kind() == kind
                && d.group().equals(j.group()) && !d.result().files().isEmpty())).toList();
            if (ok.size() < 2 || ok.size() > 12) {
                continue;
            }
            List<java.util.function.Function<Figures, FigureResult>> cells = new ArrayList<>();
            for (Job j : ok) {
                cells.add(f -> switch (kind) {
                    case CONVERGENCE -> convergence(f, directory, j.base(), j.points());
                    case ERROR -> error(f, directory, j.base(), j.points());
                    case PAYOFF -> payoff(f, directory, j.base(), j.points(), axis);
                    case DISTRIBUTION -> distribution(f, directory, j.base(), j.points());
                    case DEVIATION -> deviation(f, directory, j.base(), j.points());
                    case VERDICTS -> verdicts(f, directory, j.base(), j.points());
                    case CALIBRATION -> throw new IllegalStateException("calibration has no groups");
                });
            }
            Figures f = kind == FigureKind.DEVIATION ? shared : figures;
            int columns = Math.min(f.size().widthCm() >= 15 ? 3 : 2, (int) Math.ceil(Math.sqrt(ok.size())));
            String base = FileNames.unique(FileNames.readable(kind.label() + "-panels"), taken);
            String groups = String.join("; ", ok.stream().map(Job::group).toList());
            try {
                out.add(new Drawn(kind, "panels: " + groups, f.panels(directory, base, columns, cells)));
            } catch (IllegalArgumentException ex) {
                out.add(new Drawn(kind, "panels: " + groups, new FigureResult(List.of(),
                    List.of("not drawn: " + ex.getMessage()))));
            }
        }
        return out;
    }

    /** One figure to draw, named before drawing so that names do not depend on timing. */
    private record Job(FigureKind figure, String group, String base, List<Curves.Point> points) {
    }

    /** One colour range for every deviation heatmap, so that pairs can be compared. */
    private static Figures sharedColourRange(Figures figures, List<Curves.Point> points) {
        double[] range = {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
        points.stream().filter(p -> p.figure() == FigureKind.DEVIATION && Double.isFinite(p.value())).forEach(p -> {
            range[0] = Math.min(range[0], p.value());
            range[1] = Math.max(range[1], p.value());
        });
        return range[0] <= range[1] ? figures.withColourRange(range[0], range[1]) : figures;
    }

    /**
     * Draws the p-value calibration figure (QQ plot against the uniform distribution) from a
     * {@code calibration.csv} written by {@code calibrate} (columns test, repetition, p_value). The per-quantity
     * z tests are left out to keep the figure readable; the pooled-rounds illustration stays in, labelled.
     *
     * @param calibrationCsv the file
     * @param directory where the figure goes
     * @return what was drawn
     */
    public static Drawn drawCalibration(Path calibrationCsv, Path directory) {
        return drawCalibration(calibrationCsv, directory, Figures.withDefaults());
    }

    /**
     * Draws the p-value calibration figure with the given settings; see {@link #drawCalibration(Path, Path)}.
     * The caller lists it in the manifest ({@link #manifest}).
     *
     * @param calibrationCsv the file
     * @param directory where the figure goes
     * @param figures the figure settings
     * @return what was drawn
     */
    public static Drawn drawCalibration(Path calibrationCsv, Path directory, Figures figures) {
        Map<String, List<Double>> byTest = new LinkedHashMap<>();
        try (java.io.Reader r = java.nio.file.Files.newBufferedReader(calibrationCsv);
             org.apache.commons.csv.CSVParser p = org.apache.commons.csv.CSVFormat.DEFAULT.builder().setHeader()
                 .setSkipHeaderRecord(true).build().parse(r)) {
            if (!p.getHeaderNames().equals(List.of("test", "repetition", "p_value"))) {
                throw new IllegalArgumentException(calibrationCsv + ": not a calibration file (header "
                    + p.getHeaderNames() + ")");
            }
            for (org.apache.commons.csv.CSVRecord rec : p) {
                String name = rec.get(0);
                Optional<TestId> test = TestId.ofLabel(name);
                if (test.isPresent() && test.get() instanceof TestId.ZScore) {
                    continue;
                }
                String label = test.isPresent() && test.get().illustration() ? "pooled rounds chi-square (invalid)"
                    : name;
                byTest.computeIfAbsent(label, k -> new ArrayList<>()).add(Double.parseDouble(rec.get(2)));
            }
        } catch (java.io.IOException | NumberFormatException e) {
            throw new IllegalArgumentException(calibrationCsv + ": cannot be read: " + e.getMessage(), e);
        }
        List<PValueSample> samples = new ArrayList<>();
        byTest.forEach((name, ps) -> samples.add(new PValueSample(name, ps.stream().mapToDouble(Double::doubleValue)
            .toArray())));
        FigureResult result = figures.pValueCalibration(directory, "calibration-qq",
            new CalibrationData("", samples));
        return new Drawn(FigureKind.CALIBRATION, "p-values against uniform quantiles", result);
    }

    private static List<Curves.Point> series(List<Curves.Point> pts, String name) {
        return pts.stream().filter(p -> p.series().equals(name)).toList();
    }

    private static double[] xs(List<Curves.Point> pts) {
        return pts.stream().mapToDouble(Curves.Point::x).toArray();
    }

    private static double[] ys(List<Curves.Point> pts) {
        return pts.stream().mapToDouble(Curves.Point::y).toArray();
    }

    private static Estimates estimates(List<Curves.Point> pts) {
        return new Estimates(xs(pts), ys(pts), pts.stream().mapToDouble(Curves.Point::lower).toArray(),
            pts.stream().mapToDouble(Curves.Point::upper).toArray());
    }

    private static FigureResult convergence(Figures f, Path dir, String base, List<Curves.Point> pts) {
        List<Estimates> sim = new ArrayList<>();
        List<Curve> exact = new ArrayList<>();
        double[] stationary = new double[4];
        for (int s = 0; s < 4; s++) {
            String name = State.of(s).name();
            List<Curves.Point> e = series(pts, name + " exact");
            List<Curves.Point> st = series(pts, name + " stationary");
            if (e.isEmpty()) {
                return null;
            }
            sim.add(estimates(series(pts, name + " simulated")));
            exact.add(new Curve(xs(e), ys(e)));
            stationary[s] = st.isEmpty() ? Double.NaN : st.get(0).y();
        }
        return f.convergence(dir, base, new ConvergenceData("", sim, exact, stationary, pts.get(0).group()));
    }

    private static FigureResult error(Figures f, Path dir, String base, List<Curves.Point> pts) {
        List<Curves.Point> sim = series(pts, "simulated");
        List<Curves.Point> bias = series(pts, "exact bias");
        if (sim.isEmpty()) {
            return null;
        }
        List<Curves.Point> se = series(pts, "exact standard error");
        return f.errorScaling(dir, base, new ErrorScalingData("", sim.get(0).group(), "payoff of X",
            estimates(sim), bias.isEmpty() ? null : new Curve(xs(bias), ys(bias)),
            se.isEmpty() ? null : new Curve(xs(se), ys(se))));
    }

    /** A payoff series name: the player ("X" or "Y"), its strategy in brackets if known, and what it is. */
    private static final java.util.regex.Pattern PAYOFF_SERIES = java.util.regex.Pattern.compile(
        "([XY])(?: \\((.*)\\))? (exact|simulated|stationary|claimed)");

    private static FigureResult payoff(Figures f, Path dir, String base, List<Curves.Point> pts,
        ContinuationAxis axis) {
        Map<String, List<Curves.Point>> by = new LinkedHashMap<>();
        String[] names = {"X", "Y"};
        for (Curves.Point p : pts) {
            java.util.regex.Matcher m = PAYOFF_SERIES.matcher(p.series());
            if (!m.matches()) {
                continue;
            }
            by.computeIfAbsent(m.group(1) + " " + m.group(3), k -> new ArrayList<>()).add(p);
            if (m.group(2) != null) {
                names[m.group(1).equals("X") ? 0 : 1] = m.group(1) + " = " + m.group(2);
            }
        }
        List<Curves.Point> ex = by.getOrDefault("X exact", List.of());
        List<Curves.Point> ey = by.getOrDefault("Y exact", List.of());
        if (ex.isEmpty() || ey.isEmpty()) {
            return null;
        }
        List<Curves.Point> sx = by.getOrDefault("X simulated", List.of());
        List<Curves.Point> sy = by.getOrDefault("Y simulated", List.of());
        List<Curves.Point> stx = by.getOrDefault("X stationary", List.of());
        List<Curves.Point> sty = by.getOrDefault("Y stationary", List.of());
        List<Curves.Point> cx = by.getOrDefault("X claimed", List.of());
        List<Curves.Point> cy = by.getOrDefault("Y claimed", List.of());
        PayoffData data = new PayoffData("", "payoff per round, E[total] / E[length]",
            new Curve(xs(ex), ys(ex)), new Curve(xs(ey), ys(ey)), sx.isEmpty() ? null : estimates(sx),
            sy.isEmpty() ? null : estimates(sy)).withNames(ex.get(0).group(), names[0], names[1])
            .withStationary(stx.isEmpty() ? Double.NaN : stx.get(0).y(), sty.isEmpty() ? Double.NaN : sty.get(0).y())
            .withClaims(cx.isEmpty() ? null : new Curve(xs(cx), ys(cx)), cy.isEmpty() ? null : new Curve(xs(cy), ys(cy)))
            .withAxis(axis);
        return f.payoffByContinuation(dir, base, data);
    }

    private static FigureResult distribution(Figures f, Path dir, String base, List<Curves.Point> pts) {
        List<Curve> exact = new ArrayList<>();
        List<Estimates> sim = new ArrayList<>();
        for (int s = 0; s < 4; s++) {
            String name = State.of(s).name();
            List<Curves.Point> e = series(pts, name + " exact");
            List<Curves.Point> m = series(pts, name + " simulated");
            if (e.isEmpty() || m.isEmpty()) {
                return null;
            }
            exact.add(new Curve(xs(e), ys(e)));
            sim.add(estimates(m));
        }
        return f.stateDistribution(dir, base, new StateDistributionData("", exact, sim, pts.get(0).group()));
    }

    private record Grid(List<String> xLabels, List<String> yLabels, List<Double> xs, List<Double> ys) {
    }

    private static Grid grid(List<Curves.Point> pts) {
        TreeSet<Double> x = new TreeSet<>();
        TreeSet<Double> y = new TreeSet<>();
        for (Curves.Point p : pts) {
            x.add(p.x());
            y.add(p.y());
        }
        List<String> xl = x.stream().map(ResultsCsv::label).toList();
        List<String> yl = y.stream().map(ResultsCsv::label).toList();
        return new Grid(xl, yl, List.copyOf(x), List.copyOf(y));
    }

    private static FigureResult deviation(Figures f, Path dir, String base, List<Curves.Point> pts) {
        Grid g = grid(pts);
        double[][] v = new double[g.ys().size()][g.xs().size()];
        for (double[] row : v) {
            java.util.Arrays.fill(row, Double.NaN);
        }
        for (Curves.Point p : pts) {
            v[g.ys().indexOf(p.y())][g.xs().indexOf(p.x())] = p.value();
        }
        return f.valueHeatmap(dir, base, new GridValues("", new GridAxes("execution error", g.xLabels(),
            horizonTitle(g, pts), g.yLabels()), pts.get(0).series(), v));
    }

    private static FigureResult verdicts(Figures f, Path dir, String base, List<Curves.Point> pts) {
        Grid g = grid(pts);
        int[][] v = new int[g.ys().size()][g.xs().size()];
        for (int[] row : v) {
            java.util.Arrays.fill(row, -1);
        }
        for (Curves.Point p : pts) {
            v[g.ys().indexOf(p.y())][g.xs().indexOf(p.x())] = (int) p.value();
        }
        return f.verdictHeatmap(dir, base, new GridVerdicts("", new GridAxes("execution error", g.xLabels(),
            horizonTitle(g, pts), g.yLabels()), List.of("agrees", "inconclusive", "disagrees"), v));
    }

    /**
     * The heatmaps' y-axis, from the points' horizon kind; files without it (blank) fall back to the values:
     * game lengths are whole numbers of rounds, continuation probabilities lie below 1.
     */
    private static String horizonTitle(Grid g, List<Curves.Point> pts) {
        String kind = pts.get(0).horizon();
        boolean continuation = kind.isEmpty() ? g.ys().stream().allMatch(y -> y < 1) : kind.equals(Curves.CONTINUATION);
        return continuation ? "continuation probability \u03b4" : "game length (rounds)";
    }
}
