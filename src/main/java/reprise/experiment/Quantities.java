package reprise.experiment;

import java.util.List;
import reprise.game.StageGame;

/**
 * The scalar quantities reported per case, each a linear function w . N of one game's state counts
 * divided by its length: state frequencies, cooperation rates and payoffs per round.
 */
public final class Quantities {

    /** The quantity names, in report order. */
    public static final List<String> NAMES = List.of("CC", "CD", "DC", "DD", "coop_x", "coop_y", "payoff_x",
        "payoff_y");

    private Quantities() {
    }

    /**
     * The weights w over the states CC, CD, DC, DD of a quantity.
     *
     * @param name one of {@link #NAMES}
     * @param game the stage game (for payoffs)
     * @return w
     */
    public static double[] weights(String name, StageGame game) {
        switch (name) {
            case "CC":
                return new double[] {1, 0, 0, 0};
            case "CD":
                return new double[] {0, 1, 0, 0};
            case "DC":
                return new double[] {0, 0, 1, 0};
            case "DD":
                return new double[] {0, 0, 0, 1};
            case "coop_x":
                return new double[] {1, 1, 0, 0};
            case "coop_y":
                return new double[] {1, 0, 1, 0};
            case "payoff_x":
                return game.payoffX();
            case "payoff_y":
                return game.payoffY();
            default:
                throw new IllegalArgumentException("unknown quantity '" + name + "'; known: " + String.join(", ", NAMES));
        }
    }

    /**
     * Whether a quantity belongs to a reported group.
     *
     * @param name the quantity
     * @param wanted the groups the experiment asks for
     * @return true if reported
     */
    static boolean reported(String name, java.util.Set<Experiment.Quantity> wanted) {
        if (name.startsWith("coop_")) {
            return wanted.contains(Experiment.Quantity.COOPERATION);
        }
        if (name.startsWith("payoff_")) {
            return wanted.contains(Experiment.Quantity.PAYOFFS);
        }
        return wanted.contains(Experiment.Quantity.STATES);
    }

    static double dot(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            s += a[i] * b[i];
        }
        return s;
    }
}
