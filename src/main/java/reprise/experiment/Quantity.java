package reprise.experiment;

import reprise.game.StageGame;

/**
 * A scalar quantity reported per case: a linear function w . N / L of one game's state counts N over its
 * tallied length L. The exact value is w . E[N] / E[L]; the estimate and its standard error follow from
 * the weights alone (see {@link CaseAnalysis}).
 *
 * <p>Extension point: today's quantities are the constants of {@link BaseQuantity}. A derived quantity
 * (a named combination of base quantities) is added as another permitted implementation that computes
 * its weights from the stage game and names itself; every analysis reads only {@link #weights},
 * {@link #label()} and {@link #group()}, so none of them changes. A ratio of two quantities is not of the
 * form w . N / L and would add its own estimate (delta method) to this interface.
 */
public sealed interface Quantity extends Subject permits BaseQuantity {

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
