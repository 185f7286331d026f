package reprise.output;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.geom.AffineTransform;
import java.awt.geom.Path2D;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import javax.imageio.ImageIO;
import reprise.experiment.PopulationAnalysis;
import reprise.experiment.PopulationExperiment;

/**
 * The invasion graph of the rare-mutation chain at one grid point: strategies as nodes on a circle
 * (labelled with their abundance), an arrow from resident R to mutant M wherever M is favoured to take over,
 * rho_MR N &gt; 1, labelled with rho_MR N (its fixation probability relative to neutral 1/N) and drawn
 * thicker for larger values. Two panels side by side: (a) stationary payoffs and (c) realised payoffs, so
 * the reader sees where the infinite-game analysis changes the flow of the population. Drawn for
 * experiments with {@code mutation: rare}, one file per grid point.
 */
public final class InvasionGraph {

    private static final int PANEL = 520;
    private static final int HEIGHT = 600;

    private InvasionGraph() {
    }

    /**
     * Draws every grid point's graph.
     *
     * @param e the experiment
     * @param result the analysis
     * @param folder the figures folder
     * @return the files written (none unless mutation is rare)
     */
    public static List<Path> draw(PopulationExperiment e, PopulationAnalysis.Result result, Path folder) {
        List<Path> out = new ArrayList<>();
        if (e.mutation() != PopulationExperiment.Mutation.RARE) {
            return out;
        }
        for (PopulationAnalysis.PointExact px : result.exact()) {
            String name = ("invasions-" + px.point().name().replace('/', '-')).replaceAll("[^A-Za-z0-9._=-]", "_")
                + ".png";
            out.add(write(image(e, px), folder.resolve(name)));
        }
        return out;
    }

    /**
     * One point's image.
     *
     * @param e the experiment
     * @param px the point's exact side
     * @return the image
     */
    static BufferedImage image(PopulationExperiment e, PopulationAnalysis.PointExact px) {
        BufferedImage img = new BufferedImage(2 * PANEL, HEIGHT, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
        g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, img.getWidth(), img.getHeight());
        g.setColor(Color.BLACK);
        g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 15));
        String title = "Invasion graph, " + px.point().name() + " (arrows: resident -> favoured mutant, rho N)";
        g.drawString(title, (img.getWidth() - g.getFontMetrics().stringWidth(title)) / 2, 24);
        panel(g, e, px, PopulationAnalysis.Basis.STATIONARY, 0, "(a) stationary payoffs");
        panel(g, e, px, PopulationAnalysis.Basis.REALISED, PANEL, "(c) realised payoffs (exact)");
        g.dispose();
        return img;
    }

    private static void panel(Graphics2D g, PopulationExperiment e, PopulationAnalysis.PointExact px,
        PopulationAnalysis.Basis basis, int left, String title) {
        int k = e.strategies().size();
        double cx = left + PANEL / 2.0;
        double cy = HEIGHT / 2.0 + 20;
        double radius = PANEL * 0.32;
        double[] x = new double[k];
        double[] y = new double[k];
        for (int i = 0; i < k; i++) {
            double angle = -Math.PI / 2 + 2 * Math.PI * i / k;
            x[i] = cx + radius * Math.cos(angle);
            y[i] = cy + radius * Math.sin(angle);
        }
        g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 14));
        g.setColor(Color.BLACK);
        g.drawString(title, (float) (cx - g.getFontMetrics().stringWidth(title) / 2.0), 56);
        double[][] f = px.fixation()[basis.ordinal()];
        double[] ab = px.abundance()[basis.ordinal()];
        if (ab == null) {
            String none = "no unique stationary payoffs: no prediction";
            g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 13));
            g.drawString(none, (float) (cx - g.getFontMetrics().stringWidth(none) / 2.0), (float) cy);
            return;
        }
        int n = px.point().population().size();
        double node = 34;
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 12));
        for (int m = 0; m < k; m++) {
            for (int r = 0; r < k; r++) {
                double rel = m == r ? 0 : f[m][r] * n;
                if (!(rel > 1)) {
                    continue;
                }
                double dx = x[m] - x[r];
                double dy = y[m] - y[r];
                double len = Math.hypot(dx, dy);
                double ux = dx / len;
                double uy = dy / len;
                double off = 7;
                double sx = x[r] + ux * node - uy * off;
                double sy = y[r] + uy * node + ux * off;
                double ex = x[m] - ux * node - uy * off;
                double ey = y[m] - uy * node + ux * off;
                float width = (float) Math.min(7, 1 + 1.5 * Math.log(rel));
                g.setColor(new Color(0x0072B2));
                g.setStroke(new BasicStroke(width));
                g.drawLine((int) sx, (int) sy, (int) (ex - ux * 8), (int) (ey - uy * 8));
                Path2D head = new Path2D.Double();
                head.moveTo(0, 0);
                head.lineTo(-14, -6);
                head.lineTo(-14, 6);
                head.closePath();
                AffineTransform t = new AffineTransform();
                t.translate(ex, ey);
                t.rotate(Math.atan2(uy, ux));
                g.fill(t.createTransformedShape(head));
                String label = String.format(Locale.ROOT, "%.3g", rel);
                double lx = (sx + ex) / 2 - uy * 12;
                double ly = (sy + ey) / 2 + ux * 12;
                g.setColor(Color.DARK_GRAY);
                FontMetrics fm = g.getFontMetrics();
                g.drawString(label, (float) (lx - fm.stringWidth(label) / 2.0), (float) (ly + fm.getAscent() / 2.0));
            }
        }
        g.setStroke(new BasicStroke(2f));
        for (int i = 0; i < k; i++) {
            g.setColor(new Color(0xF0F0F0));
            g.fillOval((int) (x[i] - node), (int) (y[i] - node), (int) (2 * node), (int) (2 * node));
            g.setColor(Color.BLACK);
            g.drawOval((int) (x[i] - node), (int) (y[i] - node), (int) (2 * node), (int) (2 * node));
            g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 13));
            FontMetrics fm = g.getFontMetrics();
            String s = e.strategyNames().get(i);
            g.drawString(s, (float) (x[i] - fm.stringWidth(s) / 2.0), (float) y[i]);
            g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 12));
            fm = g.getFontMetrics();
            String a = String.format(Locale.ROOT, "%.3f", ab[i]);
            g.drawString(a, (float) (x[i] - fm.stringWidth(a) / 2.0), (float) (y[i] + 15));
        }
    }

    private static Path write(BufferedImage img, Path file) {
        try {
            Files.createDirectories(file.toAbsolutePath().getParent());
            ImageIO.write(img, "png", file.toFile());
        } catch (IOException ex) {
            throw new UncheckedIOException("could not write " + file, ex);
        }
        return file;
    }
}
