package reprise.experiment;

import java.util.Locale;

/**
 * The plain-words outcome of one comparison.
 *
 * <p>For a comparison with an equivalence margin h (each quantity against the exact value, a claim, a
 * stationary value): {@link #AGREES} when |d| &lt; h is shown (two one-sided tests, after the
 * multiple-testing correction); {@link #DISAGREES} when |d| &gt; h is shown (the non-equivalence test,
 * after the correction); {@link #INCONCLUSIVE} otherwise (more games are needed). For a test without
 * a margin (Wald, transitions, snapshots): {@link #CONSISTENT} when it does not reject after correction,
 * {@link #DISAGREES} when it does. {@link #NO_PREDICTION} when the exact engine has nothing to compare
 * with (user-written agents).
 */
public enum Verdict {
    /** Equivalent within the tolerance. */
    AGREES,
    /** No significant difference (a test without a margin). */
    CONSISTENT,
    /** Shown to differ: |d| &gt; h where a tolerance applies, any difference otherwise. */
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
