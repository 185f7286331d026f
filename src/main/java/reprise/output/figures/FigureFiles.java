package reprise.output.figures;

import de.erichseifert.vectorgraphics2d.Processor;
import de.erichseifert.vectorgraphics2d.eps.EPSProcessor;
import de.erichseifert.vectorgraphics2d.pdf.PDFProcessor;
import de.erichseifert.vectorgraphics2d.svg.SVGProcessor;
import de.erichseifert.vectorgraphics2d.util.PageSize;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.internal.chartpart.Chart;

/**
 * Writes a finished chart in each requested format.
 *
 * <p>Every file is first written in full to a temporary file in the same directory and then moved onto
 * its name (atomically where the file system allows), so a run that is killed leaves either the old
 * figure or the new one, never a cut one. Vector formats keep their text as text (see
 * {@link TextKeepingGraphics}) and state their printed size: SVG in centimetres over a view box in points,
 * PDF and EPS pages in points.
 */
final class FigureFiles {
    private static final double MILLIMETRES_PER_POINT = 25.4 / 72;

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
                + "(use FileNames.readable or FileNames.safe): " + baseName);
        }
        return baseName;
    }

    /** While a panel figure collects its panels, the charts drawn on this thread go here instead of to files. */
    private static final ThreadLocal<List<Chart<?, ?>>> CAPTURE = new ThreadLocal<>();

    /**
     * Runs {@code draw} with every chart it would write collected instead.
     *
     * @param draw draws one or more figures
     * @return the charts, in order
     */
    static List<Chart<?, ?>> capture(Runnable draw) {
        List<Chart<?, ?>> charts = new ArrayList<>();
        CAPTURE.set(charts);
        try {
            draw.run();
        } finally {
            CAPTURE.remove();
        }
        return charts;
    }

    /** Something to paint at a size in points. */
    interface Drawing {
        int width();

        int height();

        void paint(java.awt.Graphics2D g);
    }

    static List<Path> write(Chart<?, ?> chart, Path directory, String baseName, Set<FigureFormat> formats,
        FigureStyle style) {
        List<Chart<?, ?>> capture = CAPTURE.get();
        if (capture != null) {
            capture.add(chart);
            return List.of();
        }
        List<Path> written = new ArrayList<>();
        try {
            Files.createDirectories(directory);
            for (FigureFormat format : formats) {
                Path file = directory.resolve(baseName + "." + format.extension());
                writeAtomically(file, encode(chart, format, style));
                written.add(file);
            }
        } catch (IOException e) {
            throw new UncheckedIOException("could not write figure " + baseName + " to " + directory, e);
        }
        return written;
    }

    static List<Path> write(Drawing drawing, Path directory, String baseName, Set<FigureFormat> formats,
        FigureStyle style) {
        List<Path> written = new ArrayList<>();
        try {
            Files.createDirectories(directory);
            for (FigureFormat format : formats) {
                Path file = directory.resolve(baseName + "." + format.extension());
                writeAtomically(file, format == FigureFormat.PNG ? png(drawing, style.dpi())
                    : vector(drawing, format, style));
                written.add(file);
            }
        } catch (IOException e) {
            throw new UncheckedIOException("could not write figure " + baseName + " to " + directory, e);
        }
        return written;
    }

    private static byte[] png(Drawing drawing, int dpi) throws IOException {
        double scale = dpi / 72.0;
        java.awt.image.BufferedImage image = new java.awt.image.BufferedImage((int) (drawing.width() * scale),
            (int) (drawing.height() * scale), java.awt.image.BufferedImage.TYPE_INT_RGB);
        java.awt.Graphics2D g = image.createGraphics();
        try {
            g.setRenderingHint(java.awt.RenderingHints.KEY_ANTIALIASING, java.awt.RenderingHints.VALUE_ANTIALIAS_ON);
            g.setColor(java.awt.Color.WHITE);
            g.fillRect(0, 0, image.getWidth(), image.getHeight());
            g.scale(scale, scale);
            drawing.paint(g);
        } finally {
            g.dispose();
        }
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        javax.imageio.ImageIO.write(image, "png", out);
        return out.toByteArray();
    }

    static byte[] encode(Chart<?, ?> chart, FigureFormat format, FigureStyle style) throws IOException {
        if (format == FigureFormat.PNG) {
            return png(chart, style.dpi());
        }
        return vector(new Drawing() {
            @Override
            public int width() {
                return chart.getWidth();
            }

            @Override
            public int height() {
                return chart.getHeight();
            }

            @Override
            public void paint(java.awt.Graphics2D g) {
                chart.paint(g, chart.getWidth(), chart.getHeight());
            }
        }, format, style);
    }

    private static byte[] vector(Drawing drawing, FigureFormat format, FigureStyle style) throws IOException {
        TextCatalog catalog = new TextCatalog().open();
        TextKeepingGraphics g = new TextKeepingGraphics(catalog, format == FigureFormat.SVG ? null
            : StandardCharsets.ISO_8859_1);
        // VectorGraphics2D takes PDF and EPS page sizes in millimetres and scales user units as
        // millimetres; the chart is laid out in points, so it is drawn scaled by 25.4 / 72
        double unit = format == FigureFormat.SVG ? 1 : MILLIMETRES_PER_POINT;
        g.scale(unit, unit);
        try {
            drawing.paint(g);
        } finally {
            catalog.close();
        }
        Processor processor = switch (format) {
            case SVG -> new SVGProcessor();
            case PDF -> new PDFProcessor(true);
            default -> new EPSProcessor();
        };
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        processor.getDocument(g.getCommands(), new PageSize(0, 0, drawing.width() * unit, drawing.height() * unit))
            .writeTo(out);
        byte[] bytes = out.toByteArray();
        return format == FigureFormat.SVG ? svgInPrintUnits(bytes, style) : bytes;
    }

    /** PNG bytes at {@code dpi}, scaled from the chart's points as {@code BitmapEncoder.saveBitmapWithDPI} does. */
    private static byte[] png(Chart<?, ?> chart, int dpi) throws IOException {
        Path temp = Files.createTempFile("reprise-figure", ".png");
        try {
            BitmapEncoder.saveBitmapWithDPI(chart, temp.toString(), BitmapEncoder.BitmapFormat.PNG, dpi);
            return Files.readAllBytes(temp);
        } finally {
            Files.deleteIfExists(temp);
        }
    }

    /**
     * States the SVG's size in centimetres (one view-box unit is one point) and adds generic fallbacks
     * to the font family, for viewers without the face the layout used.
     */
    private static byte[] svgInPrintUnits(byte[] bytes, FigureStyle style) {
        String svg = new String(bytes, StandardCharsets.UTF_8);
        String w = String.format(Locale.ROOT, "width=\"%scm\"", trim(style.size().widthCm()));
        String h = String.format(Locale.ROOT, "height=\"%scm\"", trim(style.size().heightCm()));
        int end = svg.indexOf('>', svg.indexOf("<svg"));
        String head = svg.substring(0, end).replaceFirst("width=\"[0-9.]+px\"", w)
            .replaceFirst("height=\"[0-9.]+px\"", h);
        String body = svg.substring(end).replaceAll("font-family:&quot;([^&;]*)&quot;;",
            "font-family:&quot;$1&quot;, Arial, Helvetica, sans-serif;");
        return (head + body).getBytes(StandardCharsets.UTF_8);
    }

    private static String trim(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
    }

    /**
     * Writes {@code bytes} through {@link reprise.output.AtomicFiles}: a temporary file beside {@code file}
     * (created with the process's default permissions, so the umask applies) moved onto {@code file}, so
     * that a crash or a full disk never leaves a cut figure under its final name.
     *
     * @param file the final name
     * @param bytes the whole content
     * @throws java.io.UncheckedIOException if writing or moving fails; the temporary file is then removed
     */
    static void writeAtomically(Path file, byte[] bytes) {
        reprise.output.AtomicFiles.write(file, temporary -> Files.write(temporary, bytes));
    }
}
