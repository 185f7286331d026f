package reprise.cli;

import java.util.List;
import java.util.Locale;
import picocli.CommandLine.Option;
import reprise.output.figures.ContinuationAxis;
import reprise.output.figures.FigureFormat;
import reprise.output.figures.FigureSize;
import reprise.output.figures.Figures;

/** The figure options shared by {@code check} and {@code plot}: printed size, formats, resolution, axis. */
final class FigureOptions {

    @Option(names = "--figure-size", paramLabel = "SIZE", defaultValue = "single",
        description = "Printed size of the figures: single (8.5 cm wide), double (17.5 cm) or WIDTHxHEIGHT in cm, "
            + "for example 12x8 (default: ${DEFAULT-VALUE}).")
    String figureSize = "single";

    @Option(names = "--figure-format", paramLabel = "FORMAT", split = ",", defaultValue = "png,svg,pdf",
        description = "Figure file formats, comma-separated: png, svg, pdf, eps (default: ${DEFAULT-VALUE}).")
    List<String> figureFormats = List.of("png", "svg", "pdf");

    @Option(names = "--dpi", paramLabel = "DPI", defaultValue = "300",
        description = "PNG resolution in dots per inch, 72 to 1200 (default: ${DEFAULT-VALUE}).")
    int dpi = 300;

    @Option(names = "--continuation-axis", paramLabel = "AXIS", defaultValue = "probability",
        description = "x-axis of the payoff figures over continuation probabilities: probability (delta, linear) "
            + "or expected-length (1/(1 - delta) rounds, log scale) (default: ${DEFAULT-VALUE}).")
    String continuationAxis = "probability";

    /** @return the figure settings the options give */
    Figures figures() {
        List<FigureFormat> formats = figureFormats.stream().map(FigureFormat::parse).toList();
        return Figures.withDefaults().withSize(FigureSize.parse(figureSize)).withDpi(dpi)
            .withFormats(formats.get(0), formats.subList(1, formats.size()).toArray(FigureFormat[]::new));
    }

    /** @return the x-axis of payoff figures */
    ContinuationAxis axis() {
        String a = continuationAxis.trim().toLowerCase(Locale.ROOT);
        return switch (a) {
            case "probability" -> ContinuationAxis.PROBABILITY;
            case "expected-length" -> ContinuationAxis.EXPECTED_LENGTH;
            default -> throw new IllegalArgumentException("--continuation-axis must be probability or expected-length: "
                + continuationAxis);
        };
    }
}
