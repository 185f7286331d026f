package reprise.output;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVPrinter;
import org.apache.commons.csv.CSVRecord;
import reprise.experiment.Curves;
import reprise.experiment.FigureKind;

/**
 * {@code curves.csv}: the tidy points every figure is drawn from (columns figure, group, series, horizon,
 * x, y, value, lower, upper; see {@link Curves}). Files of earlier versions, without the horizon column, are
 * still read (their points have a blank horizon).
 */
public final class CurvesCsv {
    private static final String[] HEADER = {"figure", "group", "series", "horizon", "x", "y", "value", "lower",
        "upper"};
    private static final List<String> HEADER_WITHOUT_HORIZON = List.of("figure", "group", "series", "x", "y", "value",
        "lower", "upper");

    private CurvesCsv() {
    }

    /**
     * Writes the points atomically.
     *
     * @param file the target
     * @param points the points
     */
    public static void write(Path file, List<Curves.Point> points) {
        AtomicFiles.writeText(file, w -> {
            try (CSVPrinter out = new CSVPrinter(w, CSVFormat.DEFAULT.builder().setHeader(HEADER)
                .setRecordSeparator('\n').build())) {
                for (Curves.Point p : points) {
                    out.printRecord(p.figure().label(), p.group(), p.series(), p.horizon(), ResultsCsv.num(p.x()), ResultsCsv.num(p.y()),
                        ResultsCsv.num(p.value()), ResultsCsv.num(p.lower()), ResultsCsv.num(p.upper()));
                }
            }
        });
    }

    /**
     * Reads points back.
     *
     * @param file the file
     * @return the points in file order
     */
    public static List<Curves.Point> read(Path file) {
        List<Curves.Point> out = new ArrayList<>();
        try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8);
             CSVParser p = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).build().parse(r)) {
            boolean withHorizon = p.getHeaderNames().equals(List.of(HEADER));
            if (!withHorizon && !p.getHeaderNames().equals(HEADER_WITHOUT_HORIZON)) {
                throw new IllegalArgumentException(file + ": not a curves file (header " + p.getHeaderNames() + ")");
            }
            for (CSVRecord rec : p) {
                Optional<FigureKind> figure = FigureKind.ofLabel(rec.get(0));
                if (figure.isEmpty()) {
                    continue;
                }
                int k = withHorizon ? 4 : 3;
                if (withHorizon && !List.of(Curves.ROUNDS, Curves.CONTINUATION, "").contains(rec.get(3))) {
                    throw new IllegalArgumentException(file + ":" + (rec.getRecordNumber() + 1)
                        + ": horizon must be rounds, continuation or blank: " + rec.get(3));
                }
                out.add(new Curves.Point(figure.get(), rec.get(1), rec.get(2), withHorizon ? rec.get(3) : "",
                    ResultsCsv.parse(rec.get(k)), ResultsCsv.parse(rec.get(k + 1)), ResultsCsv.parse(rec.get(k + 2)),
                    ResultsCsv.parse(rec.get(k + 3)), ResultsCsv.parse(rec.get(k + 4))));
            }
        } catch (IOException e) {
            throw new IllegalArgumentException(file + ": cannot be read: " + e.getMessage(), e);
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(file + ": a number cannot be read: " + e.getMessage(), e);
        }
        return out;
    }
}
