package reprise.cli;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.experiment.Curves;
import reprise.experiment.InputFiles;
import reprise.output.CurvesCsv;
import reprise.output.Plotter;
import reprise.output.figures.FigureFormat;
import reprise.output.figures.FigureSize;
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

    @Option(names = "--figure-size", paramLabel = "SIZE", defaultValue = "single",
        description = "Printed size: single (8.5 cm wide), double (17.5 cm) or WIDTHxHEIGHT in cm, e.g. 12x8 "
            + "(default: ${DEFAULT-VALUE}).")
    String figureSize;

    @Option(names = "--figure-format", paramLabel = "FORMAT", split = ",", defaultValue = "png,svg,pdf",
        description = "File formats, comma-separated: png, svg, pdf, eps (default: ${DEFAULT-VALUE}).")
    List<String> figureFormats;

    @Option(names = "--dpi", paramLabel = "DPI", defaultValue = "300",
        description = "PNG resolution in dots per inch, 72 to 1200 (default: ${DEFAULT-VALUE}).")
    int dpi;

    @Override
    public Integer call() {
        Path curves = dir.resolve("curves.csv");
        Path calibration = dir.resolve("calibration.csv");
        if (!Files.isRegularFile(curves) && !Files.isRegularFile(calibration)) {
            throw new IllegalArgumentException(dir + " is not a results folder: no curves.csv (from check) or "
                + "calibration.csv (from calibrate --out) in it");
        }
        List<Plotter.Drawn> drawn = new java.util.ArrayList<>();
        if (Files.isRegularFile(curves)) {
            drawn.addAll(Plotter.draw(readCurves(curves), dir.resolve("figures"), figures()));
        }
        if (Files.isRegularFile(calibration)) {
            text(calibration, "calibration file");
            drawn.add(Plotter.drawCalibration(calibration, dir.resolve("figures")));
        }
        for (Plotter.Drawn d : drawn) {
            d.result().files().forEach(f -> spec.commandLine().getOut().println(f));
            d.result().notes().forEach(n -> spec.commandLine().getErr().println("plot: " + d.kind().label() + " (" + d.group()
                + "): " + n));
        }
        return Main.OK;
    }

    private Figures figures() {
        List<FigureFormat> formats = figureFormats.stream().map(FigureFormat::parse).toList();
        return Figures.withDefaults().withSize(FigureSize.parse(figureSize)).withDpi(dpi)
            .withFormats(formats.get(0), formats.subList(1, formats.size()).toArray(FigureFormat[]::new));
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
