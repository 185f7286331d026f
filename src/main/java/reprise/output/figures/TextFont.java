package reprise.output.figures;

import java.awt.Font;
import java.awt.font.FontRenderContext;
import java.awt.font.LineMetrics;
import java.awt.font.TextAttribute;
import java.util.Map;

/**
 * The figures' sans-serif font, which tells the {@link TextCatalog} of the current thread (if any)
 * every string laid out in it; see {@link TextKeepingGraphics} for why.
 */
final class TextFont extends Font {
    private static final long serialVersionUID = 1L;

    /** The same face and size without the reporting, for measuring outlines. */
    private final transient Font plain;

    private TextFont(Map<TextAttribute, Object> attributes) {
        super(attributes);
        plain = new Font(attributes);
    }

    static TextFont of(float size) {
        return new TextFont(Map.of(TextAttribute.FAMILY, Font.SANS_SERIF, TextAttribute.SIZE, size));
    }

    Font plain() {
        return plain;
    }

    @Override
    public LineMetrics getLineMetrics(char[] chars, int beginIndex, int limit, FontRenderContext frc) {
        TextCatalog catalog = TextCatalog.current();
        if (catalog != null) {
            catalog.laidOut(new String(chars, beginIndex, limit - beginIndex), plain, frc);
        }
        return super.getLineMetrics(chars, beginIndex, limit, frc);
    }
}
