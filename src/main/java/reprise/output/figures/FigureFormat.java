package reprise.output.figures;

/** The file formats a figure can be written in. */
public enum FigureFormat {
    /** Portable Network Graphics bitmap, rendered at the writer's resolution. */
    PNG("png"),
    /** Scalable Vector Graphics. */
    SVG("svg"),
    /** Portable Document Format (vector). */
    PDF("pdf");

    private final String extension;

    FigureFormat(String extension) {
        this.extension = extension;
    }

    /** @return the file-name extension, without the dot */
    public String extension() {
        return extension;
    }
}
