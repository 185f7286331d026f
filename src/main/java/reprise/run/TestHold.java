package reprise.run;

/**
 * A hook for tests of interrupted runs, read only here: with the system property {@value #PROPERTY} set to
 * k, a run stops making progress once it has saved k units in this process, and waits to be killed. A
 * test that kills a child process then catches it at a known point (k units saved, none being
 * written) instead of racing it. Without the property (the normal case) nothing happens.
 */
final class TestHold {

    /** The system property. */
    static final String PROPERTY = "reprise.run.holdAfterUnits";
    private static final long HOLD_AFTER = Long.getLong(PROPERTY, -1);

    private TestHold() {
    }

    /**
     * Holds the calling thread for good if this is the k-th unit saved.
     *
     * @param savedHere units saved by this process so far
     */
    static void afterUnitSaved(int savedHere) {
        if (savedHere != HOLD_AFTER) {
            return;
        }
        while (true) {
            try {
                Thread.sleep(60_000);
            } catch (InterruptedException ex) {
                Thread.currentThread().interrupt();
                return;
            }
        }
    }
}
