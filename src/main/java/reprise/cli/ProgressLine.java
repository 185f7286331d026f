package reprise.cli;

import java.io.PrintWriter;
import java.util.Locale;
import reprise.sim.ProgressListener;

/**
 * A progress line on stderr for runs longer than about two seconds: rounds done, rate and time left.
 * Redrawn in place at most twice a second; never writes to stdout.
 */
final class ProgressLine implements ProgressListener {
    private static final long QUIET_NANOS = 2_000_000_000L;
    private static final long EVERY_NANOS = 500_000_000L;

    private final PrintWriter err;
    private final boolean enabled;
    private final String prefix;
    private final long start = System.nanoTime();
    private long lastDraw;
    private boolean drawn;

    ProgressLine(PrintWriter err, boolean enabled, String prefix) {
        this.err = err;
        this.enabled = enabled;
        this.prefix = prefix;
    }

    @Override
    public synchronized void progress(long replicatesDone, long replicates, long roundsDone, long roundsExpected) {
        if (!enabled) {
            return;
        }
        long now = System.nanoTime();
        if (now - start < QUIET_NANOS || (drawn && now - lastDraw < EVERY_NANOS)) {
            return;
        }
        lastDraw = now;
        drawn = true;
        double seconds = (now - start) / 1e9;
        double rate = roundsDone / seconds;
        double left = roundsExpected > roundsDone && rate > 0 ? (roundsExpected - roundsDone) / rate : 0;
        err.print(String.format(Locale.ROOT, "\r%s%d/%d games, %.3g rounds, %.3g rounds/s, about %s left   ", prefix,
            replicatesDone, replicates, (double) roundsDone, rate, duration(left)));
        err.flush();
    }

    /** Ends the line if anything was drawn. */
    synchronized void finish() {
        if (drawn) {
            err.println();
            err.flush();
        }
    }

    static String duration(double seconds) {
        if (seconds < 90) {
            return String.format(Locale.ROOT, "%.0f s", seconds);
        }
        if (seconds < 5400) {
            return String.format(Locale.ROOT, "%.0f min", seconds / 60);
        }
        return String.format(Locale.ROOT, "%.1f h", seconds / 3600);
    }
}
