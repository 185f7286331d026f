package reprise.output.figures;

import java.nio.file.Path;
import java.util.List;

/**
 * What drawing one figure produced.
 *
 * @param files the files written, one per requested format, in the order of the formats
 * @param notes plain-language remarks about the data that a caption may need, e.g. how many points were
 *     skipped because they were NaN or could not go on a log axis; empty when nothing was left out
 */
public record FigureResult(List<Path> files, List<String> notes) {

    /**
     * Copies the lists.
     *
     * @param files not null
     * @param notes not null
     */
    public FigureResult {
        files = List.copyOf(files);
        notes = List.copyOf(notes);
    }
}
