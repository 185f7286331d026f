package reprise.output.figures;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

/**
 * {@code manifest.csv} beside the figures: one row per file written, saying which figure kind it is,
 * what it shows and at which size, so that a paper's figures can be traced to their cases without
 * reading file names.
 *
 * <p>Columns: {@code file} (name inside the directory), {@code kind} (e.g. convergence),
 * {@code subject} (the pair and settings it shows), {@code format} (png, svg, pdf, eps), {@code size}
 * (single, double or custom-WxH), {@code width_cm}, {@code height_cm}, {@code dpi} (PNG resolution;
 * empty for vector files).
 */
public final class FigureManifest {

    /** The manifest's file name. */
    public static final String FILE_NAME = "manifest.csv";

    private static final String[] HEADER = {"file", "kind", "subject", "format", "size", "width_cm", "height_cm", "dpi"};

    /**
     * One figure and what it shows.
     *
     * @param kind the figure kind
     * @param subject the pair and settings it shows
     * @param result the files written (no row when there are none)
     */
    public record Entry(String kind, String subject, FigureResult result) {
    }

    private FigureManifest() {
    }

    /**
     * Writes the manifest atomically into {@code directory}.
     *
     * @param directory where the figures are (created if missing)
     * @param figures the settings they were drawn with
     * @param entries the figures, in order
     * @return the manifest's path
     */
    public static Path write(Path directory, Figures figures, List<Entry> entries) {
        StringWriter text = new StringWriter();
        FigureSize size = figures.size();
        try (CSVPrinter csv = new CSVPrinter(text, CSVFormat.DEFAULT.builder().setHeader(HEADER)
            .setRecordSeparator("\n").build())) {
            for (Entry e : entries) {
                for (Path file : e.result().files()) {
                    String name = file.getFileName().toString();
                    String extension = name.substring(name.lastIndexOf('.') + 1);
                    csv.printRecord(name, e.kind(), e.subject(), extension, size.name(), number(size.widthCm()),
                        number(size.heightCm()), extension.equals(FigureFormat.PNG.extension())
                            ? Integer.toString(figures.dpi()) : "");
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        Path manifest = directory.resolve(FILE_NAME);
        try {
            Files.createDirectories(directory);
            FigureFiles.writeAtomically(manifest, text.toString().getBytes(StandardCharsets.UTF_8));
        } catch (IOException e) {
            throw new UncheckedIOException("could not write " + manifest, e);
        }
        return manifest;
    }

    private static String number(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : String.format(Locale.ROOT, "%s", v);
    }
}
