package reprise.output.figures;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.geom.Line2D;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.knowm.xchart.internal.chartpart.Annotation;

/**
 * Labelled tick marks at chosen values of a log x-axis (for example the game lengths of a grid), added to
 * the decades XChart labels by itself.
 *
 * <p>Implementation note: XChart 3.8.8 labels a log axis at decades only, and a tick-label formatting
 * function makes it compute linear ticks instead. So the extra ticks are painted as an annotation, after
 * the plot, at the screen position of each value, in the tick labels' font, colour and position below the
 * axis. A label that would touch a decade label or an earlier extra label is left out (its tick mark
 * stays), so labels never overlap.
 */
final class GridTicks extends Annotation {

    private final double[] values;

    /**
     * @param values positive x values to mark, in any order
     */
    GridTicks(double[] values) {
        super(false);
        this.values = values.clone();
        java.util.Arrays.sort(this.values);
    }

    @Override
    public void paint(Graphics2D g) {
        if (!isVisible) {
            return;
        }
        var styler = (org.knowm.xchart.style.AxesChartStyler) this.styler;
        double bottom = Math.max(getYAxisScreenValueForMin(), getYAxisScreenValueForMax());
        double left = Math.min(getXAxisScreenValueForMin(), getXAxisScreenValueForMax());
        double right = Math.max(getXAxisScreenValueForMin(), getXAxisScreenValueForMax());
        java.awt.Font font = styler.getAxisTickLabelsFont();
        FontMetrics fm = g.getFontMetrics(font);
        int mark = styler.getAxisTickMarkLength();
        float baseline = (float) (bottom + mark + styler.getAxisTickPadding() + fm.getAscent() + fm.getDescent() / 2.0);
        // what is taken: the decade labels XChart draws (inside the axis range)
        List<double[]> taken = new ArrayList<>();
        for (double v : values) {
            for (int k = (int) Math.floor(Math.log10(v)) - 1; k <= (int) Math.ceil(Math.log10(v)) + 1; k++) {
                double d = Math.pow(10, k);
                double x = getXAxisScreenValue(d);
                if (x >= left - 0.5 && x <= right + 0.5) {
                    double w = fm.stringWidth(label(d));
                    taken.add(new double[] {x - w / 2, x + w / 2});
                }
            }
        }
        Color saved = g.getColor();
        java.awt.Stroke savedStroke = g.getStroke();
        g.setColor(styler.getAxisTickMarksColor());
        g.setStroke(styler.getAxisTickMarksStroke() == null ? new BasicStroke(1f) : styler.getAxisTickMarksStroke());
        double gap = fm.stringWidth(" ");
        for (double v : values) {
            if (!(v > 0) || isDecade(v)) {
                continue;
            }
            double x = getXAxisScreenValue(v);
            if (x < left - 0.5 || x > right + 0.5) {
                continue;
            }
            g.draw(new Line2D.Double(x, bottom, x, bottom + mark));
            String text = label(v);
            double w = fm.stringWidth(text);
            double a = x - w / 2;
            double b = x + w / 2;
            boolean free = taken.stream().noneMatch(t -> a < t[1] + gap && b > t[0] - gap);
            if (free) {
                g.setColor(styler.getXAxisTickLabelsColor() == null ? Color.BLACK : styler.getXAxisTickLabelsColor());
                g.setFont(font);
                g.drawString(text, (float) a, baseline);
                g.setColor(styler.getAxisTickMarksColor());
                taken.add(new double[] {a, b});
            }
        }
        g.setStroke(savedStroke);
        g.setColor(saved);
    }

    private static boolean isDecade(double v) {
        double k = Math.log10(v);
        return Math.abs(k - Math.rint(k)) < 1e-9;
    }

    /** Whole numbers without a decimal point, others with up to 4 significant digits. */
    static String label(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return Long.toString((long) v);
        }
        return String.format(Locale.ROOT, "%.4g", v).replaceFirst("(\\.\\d*?)0+$", "$1").replaceFirst("\\.$", "");
    }
}
