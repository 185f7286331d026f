package reprise.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import reprise.experiment.Case;
import reprise.run.RunListener;

/**
 * Progress over a whole run on stderr (cases done, rounds per second, time left), the resume notice, and
 * the notice printed if the run is interrupted after it started (how many units are saved, and how to
 * continue).
 */
final class RunProgress implements RunListener {
    private final ProgressLine line;
    private final int cases;
    private final double expectedTotal;
    private final long start = System.nanoTime();
    private final PrintWriter err;
    private final boolean enabled;
    private double doneBefore;
    private int index;
    private String id = "";
    private long lastDraw;
    private volatile int saved;
    private Thread hook;
    private String howToContinue = "run the same command with --resume to continue";

    RunProgress(PrintWriter err, boolean enabled, int cases, double expectedTotal) {
        this.err = err;
        this.enabled = enabled;
        this.line = new ProgressLine(err, false, "");
        this.cases = cases;
        this.expectedTotal = expectedTotal;
    }

    /**
     * For a shard: a re-run of the same command continues it (shards take back their checkpoint by themselves).
     *
     * @return this
     */
    RunProgress forShard() {
        howToContinue = "run the same command again to continue from them";
        return this;
    }

    @Override
    public void started(int unitsDone, int unitsTotal, boolean resumed, Path checkpoint) {
        if (resumed && enabled) {
            err.printf(Locale.ROOT, "reprise check: resuming, %d of %d units already done%n", unitsDone, unitsTotal);
            err.flush();
        }
        saved = unitsDone;
        String how = howToContinue;
        hook = new Thread(() -> err.printf(Locale.ROOT, "%nreprise check: interrupted; %d of %d units are saved in %s; "
            + "%s%n", saved, unitsTotal, checkpoint, how));
        Runtime.getRuntime().addShutdownHook(hook);
    }

    @Override
    public void unitSaved(int savedNow, int unitsTotal) {
        saved = savedNow;
    }

    @Override
    public void startCase(Case c, int i) {
        index = i;
        id = c.id();
    }

    @Override
    public void endUnit(double expected) {
        doneBefore += expected;
    }

    @Override
    public synchronized void progress(long replicatesDone, long replicates, long roundsDone, long roundsExpected) {
        if (!enabled) {
            return;
        }
        long now = System.nanoTime();
        if (now - start < 2_000_000_000L || now - lastDraw < 500_000_000L) {
            return;
        }
        lastDraw = now;
        double done = doneBefore + roundsDone;
        double seconds = (now - start) / 1e9;
        double rate = done / seconds;
        double left = rate > 0 ? (expectedTotal - done) / rate : 0;
        err.print(String.format(Locale.ROOT, "\rcase %d/%d %s: %.3g rounds/s, about %s left        ", index + 1,
            cases, id, rate, ProgressLine.duration(left)));
        err.flush();
    }

    /** Ends the run's progress: removes the interruption notice, ends the progress line. */
    void finish() {
        if (hook != null) {
            Runtime.getRuntime().removeShutdownHook(hook);
            hook = null;
        }
        if (enabled && lastDraw != 0) {
            err.println();
            err.flush();
        }
        line.finish();
    }
}
