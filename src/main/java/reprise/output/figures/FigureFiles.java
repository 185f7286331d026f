package reprise.output.figures;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.VectorGraphicsEncoder;
import org.knowm.xchart.internal.chartpart.Chart;

/** Writes a finished chart in each requested format. */
final class FigureFiles {
    private FigureFiles() {
    }

    static Path directory(Path directory) {
        if (directory == null) {
            throw new IllegalArgumentException("output directory must be given: null");
        }
        if (Files.exists(directory) && !Files.isDirectory(directory)) {
            throw new IllegalArgumentException("output directory is an existing file: " + directory);
        }
        return directory;
    }

    static String baseName(String baseName) {
        if (baseName == null || baseName.isBlank() || !baseName.equals(FileNames.safe(baseName))) {
            throw new IllegalArgumentException("figure base name must be a safe file name without extension "
                + "(use FileNames.safe): " + baseName);
        }
        return baseName;
    }

    static List<Path> write(Chart<?, ?> chart, Path directory, String baseName, Set<FigureFormat> formats, int dpi) {
        List<Path> written = new ArrayList<>();
        try {
            Files.createDirectories(directory);
            for (FigureFormat format : formats) {
                Path file = directory.resolve(baseName + "." + format.extension());
                if (format == FigureFormat.PNG) {
                    BitmapEncoder.saveBitmapWithDPI(chart, file.toString(), BitmapEncoder.BitmapFormat.PNG, dpi);
                } else {
                    try (OutputStream out = Files.newOutputStream(file)) {
                        VectorGraphicsEncoder.saveVectorGraphic(chart, out, format == FigureFormat.SVG
                            ? VectorGraphicsEncoder.VectorGraphicsFormat.SVG
                            : VectorGraphicsEncoder.VectorGraphicsFormat.PDF);
                    }
                }
                written.add(file);
            }
        } catch (IOException e) {
            throw new UncheckedIOException("could not write figure " + baseName + " to " + directory, e);
        }
        return written;
    }
}
