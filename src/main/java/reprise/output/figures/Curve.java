package reprise.output.figures;

import java.util.Arrays;

/**
 * An exact curve: y as a function of x, drawn as a solid line.
 *
 * <p>Points whose x or y is NaN or infinite are skipped when drawing, and the figure's notes say how
 * many were skipped. The x values need not be sorted; they are drawn in the order given.
 *
 * @param x the abscissae
 * @param y the ordinates, {@code y[i]} belongs to {@code x[i]}
 */
public record Curve(double[] x, double[] y) {

    /**
     * Validates the arrays and copies them.
     *
     * @param x at least one value
     * @param y as many values as {@code x}
     */
    public Curve {
        x = Validation.nonEmpty("curve x values", x);
        y = Validation.sameLength("curve y values", y, x.length);
    }

    /** @return the number of points */
    public int size() {
        return x.length;
    }

    /** @return the x values (a copy) */
    @Override
    public double[] x() {
        return x.clone();
    }

    /** @return the y values (a copy) */
    @Override
    public double[] y() {
        return y.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Curve c && Arrays.equals(x, c.x) && Arrays.equals(y, c.y);
    }

    @Override
    public int hashCode() {
        return 31 * Arrays.hashCode(x) + Arrays.hashCode(y);
    }

    @Override
    public String toString() {
        return "Curve[" + x.length + " points]";
    }
}
