package reprise.experiment;

import java.util.Locale;

/**
 * The plain-words outcome of one comparison.
 *
 * <p>For a comparison with an equivalence margin h (each quantity against the exact value, a claim, a
 * stationary value): {@link #AGREES} when two one-sided tests show the difference lies within +-h;
 * {@link #DISAGREES} when the difference test rejects after the multiple-testing correction and the
 * estimate lies outside +-h; {@link #INCONCLUSIVE} otherwise (more games are needed). For a test without
 * a margin (Wald, transitions, snapshots): {@link #CONSISTENT} when it does not reject after correction,
 * {@link #DISAGREES} when it does. {@link #NO_PREDICTION} when the exact engine has nothing to compare
 * with (user-written agents).
 */
public enum Verdict {
    /** Equivalent within the tolerance. */
    AGREES,
    /** No significant difference (a test without a margin). */
    CONSISTENT,
    /** A significant difference (larger than the tolerance where one applies). */
    DISAGREES,
    /** Neither shown: more data needed. */
    INCONCLUSIVE,
    /** The exact engine has no prediction for this case. */
    NO_PREDICTION;

    /** @return the word used in files and reports, e.g. "agrees", "no-prediction" */
    public String word() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    /**
     * Parses a word written by {@link #word()}.
     *
     * @param word the word
     * @return the verdict
     */
    public static Verdict ofWord(String word) {
        return valueOf(word.trim().toUpperCase(Locale.ROOT).replace('-', '_'));
    }
}
