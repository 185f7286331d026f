package reprise.output.figures;

/** The file formats a figure can be written in. */
public enum FigureFormat {
    /** Portable Network Graphics bitmap, rendered at the writer's resolution. */
    PNG("png"),
    /** Scalable Vector Graphics, with text as text elements. */
    SVG("svg"),
    /** Portable Document Format (vector), with text as text. */
    PDF("pdf"),
    /** Encapsulated PostScript (vector), with text as text. */
    EPS("eps");

    private final String extension;

    FigureFormat(String extension) {
        this.extension = extension;
    }

    /** @return the file-name extension, without the dot */
    public String extension() {
        return extension;
    }

    /**
     * Reads a format by its extension, in any case.
     *
     * @param text "png", "svg", "pdf" or "eps"
     * @return the format
     * @throws IllegalArgumentException naming the text otherwise
     */
    public static FigureFormat parse(String text) {
        for (FigureFormat f : values()) {
            if (f.extension.equalsIgnoreCase(text == null ? "" : text.trim())) {
                return f;
            }
        }
        throw new IllegalArgumentException("figure format must be png, svg, pdf or eps: " + text);
    }
}
