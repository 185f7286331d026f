package reprise.output.figures;

import java.util.Arrays;
import java.util.List;
import reprise.game.State;

/**
 * Data for the convergence figure of one case: how the empirical frequency of each state approaches its
 * stationary value as games get longer.
 *
 * <p>All three lists and the array are in the state order CC, CD, DC, DD of {@link State}.
 *
 * @param title a title drawn above the plot, or blank for none (a paper usually puts it in the caption)
 * @param subject what the figure is about (pair, settings), shown as the first legend line, or blank
 * @param simulated per state: x = game length n in rounds (positive), estimate = mean fraction of
 *     rounds spent in the state over the simulated games, with its interval
 * @param exact per state: x = game length n (dense), y = the exact finite-horizon expectation of the
 *     fraction of rounds in the state
 * @param stationary per state: the stationary probability, drawn as a horizontal dashed line (NaN: not
 *     drawn, for example when the chain has no unique stationary distribution)
 */
public record ConvergenceData(String title, List<Estimates> simulated, List<Curve> exact, double[] stationary,
    String subject) {

    /**
     * The data without a subject line.
     *
     * @param title the title, may be blank
     * @param simulated see the record description
     * @param exact see the record description
     * @param stationary see the record description
     */
    public ConvergenceData(String title, List<Estimates> simulated, List<Curve> exact, double[] stationary) {
        this(title, simulated, exact, stationary, "");
    }

    /**
     * Validates that every list has one entry per state and copies the data.
     *
     * @param title the title, may be blank
     * @param simulated four estimates
     * @param exact four curves
     * @param stationary four values
     */
    public ConvergenceData {
        title = Validation.label("title", title);
        subject = Validation.label("subject", subject);
        simulated = Validation.exactly("simulated frequencies (one per state CC, CD, DC, DD)", simulated,
            State.COUNT);
        exact = Validation.exactly("exact expectation curves (one per state CC, CD, DC, DD)", exact, State.COUNT);
        stationary = Validation.sameLength("stationary values (one per state CC, CD, DC, DD)", stationary,
            State.COUNT);
    }

    /** @return the stationary (a copy) */
    @Override
    public double[] stationary() {
        return stationary.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ConvergenceData d && title.equals(d.title) && simulated.equals(d.simulated)
            && exact.equals(d.exact) && Arrays.equals(stationary, d.stationary) && subject.equals(d.subject);
    }

    @Override
    public int hashCode() {
        return ((title.hashCode() * 31 + simulated.hashCode()) * 31 + exact.hashCode()) * 31
            + Arrays.hashCode(stationary);
    }
}
