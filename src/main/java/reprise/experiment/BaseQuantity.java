package reprise.experiment;

import java.util.List;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import reprise.game.StageGame;

/**
 * The quantities every case reports: the four state frequencies, the cooperation rates and the payoffs
 * per round of both players, in report order, each with the name written in the files.
 */
public enum BaseQuantity implements Quantity {
    /** Frequency of mutual cooperation. */
    CC("CC", Experiment.Quantity.STATES),
    /** Frequency of X cooperating while Y defects. */
    CD("CD", Experiment.Quantity.STATES),
    /** Frequency of X defecting while Y cooperates. */
    DC("DC", Experiment.Quantity.STATES),
    /** Frequency of mutual defection. */
    DD("DD", Experiment.Quantity.STATES),
    /** X's cooperation rate, CC + CD. */
    COOPERATION_X("coop_x", Experiment.Quantity.COOPERATION),
    /** Y's cooperation rate, CC + DC. */
    COOPERATION_Y("coop_y", Experiment.Quantity.COOPERATION),
    /** X's payoff per round. */
    PAYOFF_X("payoff_x", Experiment.Quantity.PAYOFFS),
    /** Y's payoff per round. */
    PAYOFF_Y("payoff_y", Experiment.Quantity.PAYOFFS);

    /** The four state frequencies, in state order CC, CD, DC, DD. */
    public static final List<BaseQuantity> STATES = List.of(CC, CD, DC, DD);

    private final String label;
    private final Experiment.Quantity group;

    BaseQuantity(String label, Experiment.Quantity group) {
        this.label = label;
        this.group = group;
    }

    @Override
    public String label() {
        return label;
    }

    @Override
    public Experiment.Quantity group() {
        return group;
    }

    @Override
    public double[] weights(StageGame game) {
        return switch (this) {
            case CC -> new double[] {1, 0, 0, 0};
            case CD -> new double[] {0, 1, 0, 0};
            case DC -> new double[] {0, 0, 1, 0};
            case DD -> new double[] {0, 0, 0, 1};
            case COOPERATION_X -> new double[] {1, 1, 0, 0};
            case COOPERATION_Y -> new double[] {1, 0, 1, 0};
            case PAYOFF_X -> game.payoffX();
            case PAYOFF_Y -> game.payoffY();
        };
    }

    /** @return whether the quantity is a frequency (its values lie in [0, 1]) rather than a payoff */
    public boolean isFrequency() {
        return group != Experiment.Quantity.PAYOFFS;
    }

    /**
     * The quantity a file names (the inverse of {@link #label()}, for readers of files).
     *
     * @param label e.g. "CC", "coop_x", "payoff_y"
     * @return the quantity
     * @throws IllegalArgumentException naming the known labels, if none matches
     */
    public static BaseQuantity ofLabel(String label) {
        for (BaseQuantity q : values()) {
            if (q.label.equals(label)) {
                return q;
            }
        }
        throw new IllegalArgumentException("unknown quantity '" + label + "'; known: "
            + Stream.of(values()).map(BaseQuantity::label).collect(Collectors.joining(", ")));
    }
}
