package reprise.output.figures;

import java.util.Locale;

/**
 * The printed size of a figure, in centimetres.
 *
 * <p>Figures are laid out in points (1/72 inch) at exactly this size, so a font of 8 units is 8 pt on
 * paper when the figure is printed at its stated width; PNG files are rendered at a chosen resolution,
 * SVG, PDF and EPS files carry the size itself. The two journal widths are the common single-column
 * width of 8.5 cm and double-column (full page) width of 17.5 cm (common practice across publishers'
 * author guidelines, no single source).
 *
 * @param name a short name for file names and the manifest ("single", "double" or "custom-WxH")
 * @param widthCm printed width, 4 to 60 cm
 * @param heightCm printed height, 3 to 60 cm
 */
public record FigureSize(String name, double widthCm, double heightCm) {

    /** Points per centimetre: 72 per inch, 2.54 cm per inch. */
    static final double POINTS_PER_CM = 72 / 2.54;

    /** One journal column: 8.5 cm wide, 6.4 cm high. */
    public static final FigureSize SINGLE_COLUMN = new FigureSize("single", 8.5, 6.4);

    /** A full page width (two columns): 17.5 cm wide, 10 cm high. */
    public static final FigureSize DOUBLE_COLUMN = new FigureSize("double", 17.5, 10);

    /**
     * Checks the size.
     *
     * @param name not blank, letters, digits, '.', '_' and '-' only
     * @param widthCm 4 to 60
     * @param heightCm 3 to 60
     */
    public FigureSize {
        if (name == null || !name.matches("[A-Za-z0-9._-]+")) {
            throw new IllegalArgumentException("figure size name must be letters, digits, '.', '_' or '-': " + name);
        }
        if (!(widthCm >= 4 && widthCm <= 60) || !(heightCm >= 3 && heightCm <= 60)) {
            throw new IllegalArgumentException("figure size must be between 4 x 3 cm and 60 x 60 cm: "
                + widthCm + " x " + heightCm + " cm");
        }
    }

    /**
     * A size other than the two journal widths.
     *
     * @param widthCm printed width, 4 to 60 cm
     * @param heightCm printed height, 3 to 60 cm
     * @return the size, named "custom-WxH" with the centimetres
     */
    public static FigureSize custom(double widthCm, double heightCm) {
        return new FigureSize(String.format(Locale.ROOT, "custom-%sx%s", trim(widthCm), trim(heightCm)), widthCm,
            heightCm);
    }

    /**
     * Reads "single", "double" or "WxH" (centimetres, e.g. "12x8").
     *
     * @param text the text
     * @return the size
     * @throws IllegalArgumentException naming the text if it is none of these
     */
    public static FigureSize parse(String text) {
        String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
        if (t.equals("single")) {
            return SINGLE_COLUMN;
        }
        if (t.equals("double")) {
            return DOUBLE_COLUMN;
        }
        String[] parts = t.split("x", -1);
        if (parts.length == 2) {
            try {
                return custom(Double.parseDouble(parts[0]), Double.parseDouble(parts[1]));
            } catch (NumberFormatException e) {
                // fall through to the message below
            }
        }
        throw new IllegalArgumentException("figure size must be single, double or WIDTHxHEIGHT in cm (e.g. 12x8): "
            + text);
    }

    /** @return the width in points, rounded to whole points */
    public int widthPoints() {
        return (int) Math.round(widthCm * POINTS_PER_CM);
    }

    /** @return the height in points, rounded to whole points */
    public int heightPoints() {
        return (int) Math.round(heightCm * POINTS_PER_CM);
    }

    private static String trim(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
    }
}
