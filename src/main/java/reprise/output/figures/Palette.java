package reprise.output.figures;

import java.awt.Color;

/**
 * The colours of every figure.
 *
 * <p>Series colours are the eight colours of Okabe and Ito (2008), chosen so that the common forms of
 * colour-vision deficiency still tell them apart; figures also vary line style and marker shape so that
 * a greyscale print stays readable. The continuous ramp is viridis (van der Walt and Smith 2015), whose
 * lightness increases monotonically, so it reads in order and survives greyscale printing; its ten
 * stops below are the evenly spaced samples of the published map (hex values from memory).
 *
 * <p>References:
 * <ul>
 *   <li>Okabe, M. and Ito, K. (2008). Color Universal Design (CUD): How to make figures and presentations
 *       that are friendly to colorblind people. J*Fly, online publication.</li>
 *   <li>van der Walt, S. and Smith, N. (2015). A better default colormap for Matplotlib (viridis).
 *       SciPy 2015 conference talk.</li>
 * </ul>
 */
final class Palette {
    private Palette() {
    }

    static final Color ORANGE = new Color(0xE69F00);
    static final Color SKY_BLUE = new Color(0x56B4E9);
    static final Color BLUISH_GREEN = new Color(0x009E73);
    static final Color YELLOW = new Color(0xF0E442);
    static final Color BLUE = new Color(0x0072B2);
    static final Color VERMILLION = new Color(0xD55E00);
    static final Color REDDISH_PURPLE = new Color(0xCC79A7);
    static final Color BLACK = new Color(0x000000);

    /** Neutral grey for reference bands, not a data colour. */
    static final Color BAND_GREY = new Color(0xD9D9D9);

    /** Colours of the states CC, CD, DC, DD, in that order: dark, light, mid, dark-warm in greyscale. */
    static final Color[] STATES = {BLUE, ORANGE, BLUISH_GREEN, VERMILLION};

    /** Colours for up to eight series in order; black last so it stays free for reference lines. */
    static final Color[] SERIES = {BLUE, VERMILLION, BLUISH_GREEN, ORANGE, REDDISH_PURPLE, SKY_BLUE, YELLOW, BLACK};

    /**
     * Verdict colours in order of index: blue (dark), yellow (light), vermillion (mid), so the three also
     * differ in greyscale lightness.
     */
    static final Color[] VERDICTS = {BLUE, YELLOW, VERMILLION};

    /** Viridis, ten evenly spaced stops from low to high. */
    static final Color[] VIRIDIS = {
        new Color(0x440154), new Color(0x482878), new Color(0x3E4A89), new Color(0x31688E), new Color(0x26828E),
        new Color(0x1F9E89), new Color(0x35B779), new Color(0x6DCD59), new Color(0xB4DE2C), new Color(0xFDE725),
    };

    /**
     * The same colour with an alpha channel, for translucent fills.
     *
     * @param c the colour
     * @param alpha 0 to 255
     * @return the colour with that alpha
     */
    static Color withAlpha(Color c, int alpha) {
        return new Color(c.getRed(), c.getGreen(), c.getBlue(), alpha);
    }
}
