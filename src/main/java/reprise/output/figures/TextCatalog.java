package reprise.output.figures;

import java.awt.Font;
import java.awt.Shape;
import java.awt.font.FontRenderContext;
import java.awt.font.TextLayout;
import java.awt.geom.AffineTransform;
import java.awt.geom.PathIterator;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The strings laid out while one chart is painted, with their glyph outlines, so that a filled shape
 * can be recognised as the outline of one of them (see {@link TextKeepingGraphics}).
 *
 * <p>Implementation note: an outline is recognised when it has the same sequence of path segments as a
 * laid-out string's outline and every one of its points is the image of that outline's point under one
 * affine map (fitted by least squares, accepted when no point is off by more than 1e-3 of the text
 * size, room for the single-precision rounding of rotated outlines). The map is the translation and rotation the chart applied, and is reused to place the text.
 */
class TextCatalog {
    private static final ThreadLocal<TextCatalog> CURRENT = new ThreadLocal<>();

    /** A recognised outline: the text, its font, and where it was drawn. */
    record Match(String text, Font font, AffineTransform transform) {
    }

    private record Candidate(String text, Font font, double[] coordinates) {
    }

    private record Path(String segments, double[] coordinates) {
    }

    /** A string laid out in a font with a rendering context; outlines differ between contexts. */
    private record Seen(String text, Font font, FontRenderContext context) {
    }

    private final Set<Seen> seen = new HashSet<>();
    private final Map<String, List<Candidate>> bySegments = new HashMap<>();

    static TextCatalog current() {
        return CURRENT.get();
    }

    /** Makes this the catalog of the calling thread until {@link #close()}. */
    TextCatalog open() {
        CURRENT.set(this);
        return this;
    }

    void close() {
        CURRENT.remove();
    }

    void laidOut(String text, Font font, FontRenderContext frc) {
        if (text.isBlank() || !seen.add(new Seen(text, font, frc))) {
            return;
        }
        Path p = path(new TextLayout(text, font, frc).getOutline(null));
        if (p.coordinates.length >= 6) {
            bySegments.computeIfAbsent(p.segments, k -> new ArrayList<>()).add(new Candidate(text, font,
                p.coordinates));
        }
    }

    /** @return the string whose outline {@code shape} is, or null */
    Match match(Shape shape) {
        if (bySegments.isEmpty()) {
            return null;
        }
        Path p = path(shape);
        List<Candidate> candidates = bySegments.get(p.segments);
        if (candidates == null) {
            return null;
        }
        for (Candidate c : candidates) {
            AffineTransform t = fit(c.coordinates, p.coordinates, 1e-3 * c.font.getSize2D());
            if (t != null) {
                return new Match(c.text, c.font, t);
            }
        }
        return null;
    }

    private static Path path(Shape shape) {
        StringBuilder segments = new StringBuilder();
        double[] coordinates = new double[64];
        int n = 0;
        double[] buffer = new double[6];
        for (PathIterator it = shape.getPathIterator(null); !it.isDone(); it.next()) {
            int type = it.currentSegment(buffer);
            segments.append((char) ('0' + type));
            int count = switch (type) {
                case PathIterator.SEG_MOVETO, PathIterator.SEG_LINETO -> 2;
                case PathIterator.SEG_QUADTO -> 4;
                case PathIterator.SEG_CUBICTO -> 6;
                default -> 0;
            };
            if (n + count > coordinates.length) {
                coordinates = Arrays.copyOf(coordinates, 2 * coordinates.length + count);
            }
            System.arraycopy(buffer, 0, coordinates, n, count);
            n += count;
        }
        return new Path(segments.toString(), Arrays.copyOf(coordinates, n));
    }

    /**
     * The affine map x' = a x + b y + c, y' = d x + e y + f taking every point of {@code from} to the
     * same point of {@code to} within {@code tolerance}, or null.
     */
    private static AffineTransform fit(double[] from, double[] to, double tolerance) {
        int m = from.length / 2;
        double sx = 0;
        double sy = 0;
        double sxx = 0;
        double sxy = 0;
        double syy = 0;
        double[] rx = new double[3];
        double[] ry = new double[3];
        for (int i = 0; i < m; i++) {
            double x = from[2 * i];
            double y = from[2 * i + 1];
            sx += x;
            sy += y;
            sxx += x * x;
            sxy += x * y;
            syy += y * y;
            rx[0] += x * to[2 * i];
            rx[1] += y * to[2 * i];
            rx[2] += to[2 * i];
            ry[0] += x * to[2 * i + 1];
            ry[1] += y * to[2 * i + 1];
            ry[2] += to[2 * i + 1];
        }
        double[][] a = {{sxx, sxy, sx}, {sxy, syy, sy}, {sx, sy, m}};
        double[] u = solve(a, rx);
        double[] v = solve(a, ry);
        if (u == null || v == null) {
            return null;
        }
        for (int i = 0; i < m; i++) {
            double x = from[2 * i];
            double y = from[2 * i + 1];
            if (!(Math.abs(u[0] * x + u[1] * y + u[2] - to[2 * i]) <= tolerance)
                || !(Math.abs(v[0] * x + v[1] * y + v[2] - to[2 * i + 1]) <= tolerance)) {
                return null;
            }
        }
        return new AffineTransform(u[0], v[0], u[1], v[1], u[2], v[2]);
    }

    /** Cramer's rule for a 3 x 3 system; null when it is (nearly) singular. */
    private static double[] solve(double[][] a, double[] b) {
        double det = det(a[0][0], a[0][1], a[0][2], a[1][0], a[1][1], a[1][2], a[2][0], a[2][1], a[2][2]);
        double scale = Math.abs(a[0][0] * a[1][1] * a[2][2]) + 1e-300;
        if (!(Math.abs(det) > 1e-12 * scale)) {
            return null;
        }
        return new double[] {
            det(b[0], a[0][1], a[0][2], b[1], a[1][1], a[1][2], b[2], a[2][1], a[2][2]) / det,
            det(a[0][0], b[0], a[0][2], a[1][0], b[1], a[1][2], a[2][0], b[2], a[2][2]) / det,
            det(a[0][0], a[0][1], b[0], a[1][0], a[1][1], b[1], a[2][0], a[2][1], b[2]) / det,
        };
    }

    private static double det(double a, double b, double c, double d, double e, double f, double g, double h,
        double i) {
        return a * (e * i - f * h) - b * (d * i - f * g) + c * (d * h - e * g);
    }
}
