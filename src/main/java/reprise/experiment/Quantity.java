package reprise.experiment;

import reprise.game.StageGame;

/**
 * A scalar quantity reported per case: a linear function w . N / L of one game's state counts N over its
 * tallied length L. The exact value is w . E[N] / E[L]; the estimate and its standard error follow from
 * the weights alone (see {@link CaseAnalysis}).
 *
 * <p>Two kinds: the constants of {@link BaseQuantity}, and an experiment's {@link DerivedQuantity}s. A
 * derived combination of base quantities computes its weights from the stage game and names itself;
 * every analysis reads only {@link #weights}, {@link #label()} and {@link #group()}. A derived ratio is
 * not of the form w . N / L: it is analysed by {@link RatioRows} with its own (delta-method) estimate.
 */
public sealed interface Quantity extends Subject permits BaseQuantity, DerivedQuantity {

    /**
     * The weights w over the states CC, CD, DC, DD.
     *
     * @param game the stage game (for payoffs)
     * @return w, a new array
     */
    double[] weights(StageGame game);

    /** @return the group of the experiment's {@code quantities:} setting that reports this quantity */
    Experiment.Quantity group();
}
