package reprise.output.figures;

import java.util.List;
import reprise.game.State;

/**
 * Data for the time-resolved state distribution of one case: the probability of each state in round t.
 *
 * <p>Both lists are in the state order CC, CD, DC, DD of {@link State}. Rounds are counted from 1.
 *
 * @param title a title drawn above the plot, or blank for none
 * @param subject what the figure is about (pair, settings), shown as the first legend line, or blank
 * @param exact per state: x = round t, y = the exact probability (v_1 M^(t-1))_s of being in state s in
 *     round t
 * @param simulated per state: x = the snapshot rounds, estimate = the fraction of simulated games in
 *     state s in that round, with its interval
 */
public record StateDistributionData(String title, List<Curve> exact, List<Estimates> simulated, String subject) {

    /**
     * The data without a subject line.
     *
     * @param title the title, may be blank
     * @param exact see the record description
     * @param simulated see the record description
     */
    public StateDistributionData(String title, List<Curve> exact, List<Estimates> simulated) {
        this(title, exact, simulated, "");
    }

    /**
     * Validates that both lists have one entry per state.
     *
     * @param title the title, may be blank
     * @param exact four curves
     * @param simulated four estimates
     */
    public StateDistributionData {
        title = Validation.label("title", title);
        subject = Validation.label("subject", subject);
        exact = Validation.exactly("exact state probabilities (one per state CC, CD, DC, DD)", exact, State.COUNT);
        simulated = Validation.exactly("simulated state proportions (one per state CC, CD, DC, DD)", simulated,
            State.COUNT);
    }
}
