package reprise.experiment;

import java.util.Optional;

/**
 * The figures, as named in {@code curves.csv}'s figure column and in the figure files.
 *
 * <p>Extension point: a new figure is a new constant; {@link Curves} adds its points, the plotter draws
 * it and the report captions it, each in a switch over this enum that the compiler checks for
 * completeness.
 */
public enum FigureKind {
    /** State frequencies against game length, with the exact finite-horizon curve and the stationary value. */
    CONVERGENCE("convergence"),
    /** |observed - stationary| payoff of X against game length, with the exact bias. */
    ERROR("error"),
    /** Payoffs against the continuation probability. */
    PAYOFF("payoff"),
    /** The state at round t: exact v_1 M^(t-1) and simulated snapshots. */
    DISTRIBUTION("distribution"),
    /** Heatmap of |observed - stationary| payoff of X over noise and game length. */
    DEVIATION("deviation"),
    /** Heatmap of the stationary comparison's verdicts over noise and game length. */
    VERDICTS("verdicts"),
    /** The p-value calibration QQ plot, drawn from {@code calibration.csv} (never in {@code curves.csv}). */
    CALIBRATION("calibration");

    private final String label;

    FigureKind(String label) {
        this.label = label;
    }

    /** @return the name in files, e.g. "convergence" */
    public String label() {
        return label;
    }

    /**
     * The figure a file names (the inverse of {@link #label()}, for readers of files).
     *
     * @param label the name
     * @return the figure, or empty if no figure has that name
     */
    public static Optional<FigureKind> ofLabel(String label) {
        for (FigureKind k : values()) {
            if (k.label.equals(label)) {
                return Optional.of(k);
            }
        }
        return Optional.empty();
    }
}
