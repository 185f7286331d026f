package reprise.chain;

import java.util.List;
import java.util.OptionalLong;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.State;

/**
 * Everything the exact engine predicts for one match, in one value: the long-run (stationary or
 * time-average) frequencies, payoffs and cooperation rates, the expected values for a requested horizon,
 * and how fast the chain mixes. All 4-vectors are in the state order {@link #states()} = CC, CD, DC, DD
 * from X's view; matrices use that order for rows and columns.
 *
 * @param states the state names, always ["CC", "CD", "DC", "DD"]
 * @param chainKind the layout of the underlying chain
 * @param chainSize the number of chain states (4, 4^n or 16^n)
 * @param stationary the unique stationary frequencies (4), or null when there are several closed classes
 * @param stationaryNote null when {@code stationary} is given, else why it is not, naming the closed classes
 * @param stationaryPayoffs payoffs under {@code stationary}, or null
 * @param stationaryCooperation cooperation rates under {@code stationary}, or null
 * @param limitFrequencies the time-average limit lim (1/n) sum v_t from the actual first round (4), always
 *     defined; equals {@code stationary} when that is unique
 * @param limitPayoffs payoffs under {@code limitFrequencies}
 * @param horizon the expected values for the requested horizon, or null if none was requested
 * @param secondEigenvalueModulus |lambda_2| of the chain's transition matrix (1 when not ergodic)
 * @param asymptoticCovariance lim (1/n) Cov of the 4 round-state counts (4x4), or null when not unique
 * @param payoffCovariance lim (1/n) Cov of (total payoff X, total payoff Y) (2x2), or null
 * @param mixingTime smallest t with max_i TV(M^t(i, .), pi) &le; 1/4, or empty (see {@link Spectrum})
 * @param closedClasses the closed classes of the chain in readable form, e.g. "{CC}", "CD -> DC"
 */
public record Prediction(List<String> states, MarkovChain.Kind chainKind, int chainSize, double[] stationary,
    String stationaryNote, Payoffs stationaryPayoffs, CooperationRates stationaryCooperation,
    double[] limitFrequencies, Payoffs limitPayoffs, HorizonResult horizon, double secondEigenvalueModulus,
    double[][] asymptoticCovariance, double[][] payoffCovariance, OptionalLong mixingTime,
    List<String> closedClasses) {

    /** The state names in index order. */
    public static final List<String> STATE_NAMES = List.of(State.CC.name(), State.CD.name(), State.DC.name(),
        State.DD.name());

    /**
     * Expected values over a finite or random horizon.
     *
     * @param kind "rounds" or "continuation"
     * @param value the number of rounds or the continuation probability
     * @param frequencies expected frequencies CC, CD, DC, DD (see {@link Frequencies})
     * @param payoffs expected per-round payoffs
     * @param cooperation expected cooperation rates
     */
    public record HorizonResult(String kind, double value, double[] frequencies, Payoffs payoffs,
        CooperationRates cooperation) {
        /**
         * Copies the array.
         *
         * @param kind kind
         * @param value value
         * @param frequencies 4 numbers
         * @param payoffs payoffs
         * @param cooperation cooperation
         */
        public HorizonResult {
            frequencies = frequencies.clone();
        }

        /** @return the frequencies (a copy) */
        @Override
        public double[] frequencies() {
            return frequencies.clone();
        }
    }

    /**
     * Copies the arrays.
     *
     * @param states names
     * @param chainKind kind
     * @param chainSize size
     * @param stationary or null
     * @param stationaryNote or null
     * @param stationaryPayoffs or null
     * @param stationaryCooperation or null
     * @param limitFrequencies 4
     * @param limitPayoffs payoffs
     * @param horizon or null
     * @param secondEigenvalueModulus modulus
     * @param asymptoticCovariance or null
     * @param payoffCovariance or null
     * @param mixingTime mixing time
     * @param closedClasses descriptions
     */
    public Prediction {
        states = List.copyOf(states);
        stationary = stationary == null ? null : stationary.clone();
        limitFrequencies = limitFrequencies.clone();
        asymptoticCovariance = asymptoticCovariance == null ? null : Dense.copy(asymptoticCovariance);
        payoffCovariance = payoffCovariance == null ? null : Dense.copy(payoffCovariance);
        closedClasses = List.copyOf(closedClasses);
    }

    /**
     * Computes the prediction for a match.
     *
     * @param match the match
     * @param horizon the horizon to report expected values for, or null for long-run values only
     * @return the prediction
     * @throws NoPredictionException when the match has no exact chain (user-written agents, memory three with
     *     perception errors)
     */
    public static Prediction of(Match match, Horizon horizon) {
        MarkovChain chain = MarkovChain.of(match);
        ChainStructure structure = chain.structure();
        double[] stationary = structure.stationary() == null ? null : chain.project(structure.stationary());
        double[] limit = chain.project(structure.limitDistribution());
        HorizonResult h = null;
        if (horizon != null) {
            double[] f = Frequencies.of(chain, horizon);
            String kind = horizon instanceof Horizon.Rounds ? "rounds" : "continuation";
            double value = horizon instanceof Horizon.Rounds r ? r.count()
                : ((Horizon.Continuation) horizon).probability();
            h = new HorizonResult(kind, value, f, Payoffs.of(match.game(), f), CooperationRates.of(f));
        }
        return new Prediction(STATE_NAMES, chain.kind(), chain.size(), stationary, structure.note(),
            stationary == null ? null : Payoffs.of(match.game(), stationary),
            stationary == null ? null : CooperationRates.of(stationary), limit, Payoffs.of(match.game(), limit), h,
            Spectrum.secondEigenvalueModulus(chain), FundamentalMatrix.roundStateCovariance(chain),
            FundamentalMatrix.payoffCovariance(chain, match.game()), Spectrum.mixingTime(chain),
            structure.classDescriptions());
    }

    /** @return the stationary frequencies (a copy) or null */
    @Override
    public double[] stationary() {
        return stationary == null ? null : stationary.clone();
    }

    /** @return the time-average limit (a copy) */
    @Override
    public double[] limitFrequencies() {
        return limitFrequencies.clone();
    }

    /** @return the asymptotic covariance (a copy) or null */
    @Override
    public double[][] asymptoticCovariance() {
        return asymptoticCovariance == null ? null : Dense.copy(asymptoticCovariance);
    }

    /** @return the payoff covariance (a copy) or null */
    @Override
    public double[][] payoffCovariance() {
        return payoffCovariance == null ? null : Dense.copy(payoffCovariance);
    }
}
