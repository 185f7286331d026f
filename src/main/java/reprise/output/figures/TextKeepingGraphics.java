package reprise.output.figures;

import de.erichseifert.vectorgraphics2d.VectorGraphics2D;
import de.erichseifert.vectorgraphics2d.util.GraphicsUtils;
import java.awt.Font;
import java.awt.Shape;
import java.awt.geom.AffineTransform;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/**
 * A vector-graphics canvas that writes text as text.
 *
 * <p>Implementation note: XChart 3.8.8 never calls {@code drawString}; it paints every label by filling
 * the glyph outline of a {@code TextLayout}, so its {@code VectorGraphicsEncoder} writes SVG and PDF
 * files in which no text can be selected, searched or edited. The figures' fonts ({@link TextFont})
 * report every string laid out while the chart paints to the thread's {@link TextCatalog}; when the
 * chart then fills a shape that is the outline of one of those strings (up to the translation or
 * rotation the chart applied), this canvas draws the string instead, with the same font, colour and
 * placement. Any other shape, and text in a font that did not report (none in these figures), is
 * filled as before, so nothing is ever lost, at worst drawn as outlines. The viewer then sets the text
 * in its own sans-serif face, whose widths may differ slightly from the face used for the layout.
 */
final class TextKeepingGraphics extends VectorGraphics2D {
    /**
     * The physical face behind each logical font size: the PDF writer otherwise searches all installed
     * fonts for it on every string, which took seconds per figure.
     */
    private static final Map<Font, Font> PHYSICAL = new ConcurrentHashMap<>();

    private final TextCatalog catalog;
    private final java.nio.charset.Charset encodable;

    /**
     * @param catalog the strings laid out while painting
     * @param encodable the characters the output format can write as text (PDF and EPS: the standard
     *     fonts' Latin-1), or null for any; strings with other characters (the Greek delta, the minus
     *     sign) stay outlines there
     */
    TextKeepingGraphics(TextCatalog catalog, java.nio.charset.Charset encodable) {
        this.catalog = catalog;
        this.encodable = encodable;
    }

    @Override
    public void setFont(Font font) {
        super.setFont(font == null ? null : PHYSICAL.computeIfAbsent(font, GraphicsUtils::getPhysicalFont));
    }

    @Override
    public void fill(Shape s) {
        TextCatalog.Match m = catalog.match(s);
        if (m == null || (encodable != null && !encodable.newEncoder().canEncode(m.text()))) {
            super.fill(s);
            return;
        }
        AffineTransform saved = getTransform();
        Font savedFont = getFont();
        transform(m.transform());
        setFont(m.font());
        drawString(m.text(), 0f, 0f);
        setFont(savedFont);
        setTransform(saved);
    }
}
