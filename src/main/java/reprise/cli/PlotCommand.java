package reprise.cli;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.experiment.Curves;
import reprise.experiment.InputFiles;
import reprise.output.CurvesCsv;
import reprise.output.Plotter;
import reprise.output.figures.Figures;

/** {@code plot}: redraws the figures of a results folder from its curves.csv, without simulating again. */
@Command(name = "plot", mixinStandardHelpOptions = true,
    description = "Redraws the figures of a results folder from its curves.csv (written by check) and "
        + "calibration.csv (written by calibrate --out) into its figures/ folder, without simulating again.")
final class PlotCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "RESULTS_DIR", description = "A folder written by check.")
    Path dir;

    @picocli.CommandLine.Mixin
    FigureOptions figureOptions = new FigureOptions();

    @picocli.CommandLine.Option(names = "--panels", description = "Also combine the pairs of each figure kind into "
        + "one file with lettered panels (KIND-panels.png and so on; 2 to 12 panels).")
    boolean panels;

    @Override
    public Integer call() {
        Path curves = dir.resolve("curves.csv");
        Path calibration = dir.resolve("calibration.csv");
        if (!Files.isRegularFile(curves) && !Files.isRegularFile(calibration)) {
            throw new IllegalArgumentException(dir + " is not a results folder: no curves.csv (from check) or "
                + "calibration.csv (from calibrate --out) in it");
        }
        Figures figures = figureOptions.figures();
        List<Plotter.Drawn> drawn = new java.util.ArrayList<>();
        if (Files.isRegularFile(calibration)) {
            text(calibration, "calibration file");
            drawn.add(Plotter.drawCalibration(calibration, dir.resolve("figures"), figures));
        }
        if (Files.isRegularFile(curves)) {
            drawn.addAll(0, Plotter.draw(readCurves(curves), dir.resolve("figures"), figures, figureOptions.axis(),
                panels ? Plotter.Panels.ALSO_COMBINED : Plotter.Panels.SEPARATE, drawn));
        } else {
            Plotter.manifest(dir.resolve("figures"), figures, drawn);
        }
        for (Plotter.Drawn d : drawn) {
            d.result().files().forEach(f -> spec.commandLine().getOut().println(f));
            d.result().notes().forEach(n -> spec.commandLine().getErr().println("plot: " + d.kind().label() + " (" + d.group()
                + "): " + n));
        }
        return Main.OK;
    }
    /**
     * Reads curves.csv, refusing in one line a file that is not one: binary or not UTF-8, too large, or
     * text that does not parse as the curves table.
     */
    private static List<Curves.Point> readCurves(Path curves) {
        text(curves, "curves file");
        try {
            return CurvesCsv.read(curves);
        } catch (IllegalArgumentException e) {
            throw e;
        } catch (RuntimeException e) {
            throw new IllegalArgumentException(curves + ": not a curves file written by check: "
                + String.valueOf(e.getMessage()).replaceAll("\\s+", " "), e);
        }
    }

    /** Checks that an input file is a regular UTF-8 text file of sensible size, naming it otherwise. */
    private static void text(Path file, String what) {
        try {
            InputFiles.text(file, what);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException(file + ": " + e.getMessage(), e);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + file + ": " + e.getMessage(), e);
        }
    }
}
