package reprise.output;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import reprise.experiment.SweepDefinition;
import reprise.experiment.SweepTable;
import reprise.game.Horizon;

/**
 * Writes a sweep as tidy CSV: one row per match (swept strategy, co-player, game length), one column per
 * variable.
 *
 * <p>Columns: {@code strategy} (index), the swept strategy's parameters ({@code p,q} for reactive
 * families, {@code p_cc,p_cd,p_dc,p_dd} for memory-one), {@code co_player}, {@code length}
 * ({@code long_run}, {@code rounds=N} or {@code continuation=D}), {@code freq_cc, freq_cd, freq_dc,
 * freq_dd}, {@code cooperation_x, cooperation_y, payoff_x, payoff_y}, {@code enforced_residual} (the relation
 * a zero-determinant co-player enforces, written to be zero when it holds; empty for other co-players),
 * one column per user relation, and {@code unique} (false for a long-run value that is the time-average
 * limit of a chain without a unique stationary distribution). Numbers have 15 significant digits (see
 * {@code Decimal15}): they read back within a relative 1e-14 of the computed doubles.
 *
 * <p>Implementation note. Rows are formatted in blocks on the worker threads and written in order, so the
 * bytes do not depend on the thread count.
 */
public final class SweepCsv {
    private static final int BLOCK = 8192;

    private SweepCsv() {
    }

    /**
     * The header line's column names.
     *
     * @param d the definition
     * @return the names
     */
    public static List<String> header(SweepDefinition d) {
        List<String> h = new ArrayList<>(List.of("strategy"));
        h.addAll(d.family().reactive() ? List.of("p", "q") : List.of("p_cc", "p_cd", "p_dc", "p_dd"));
        h.addAll(List.of("co_player", "length", "freq_cc", "freq_cd", "freq_dc", "freq_dd", "cooperation_x",
            "cooperation_y", "payoff_x", "payoff_y", "enforced_residual"));
        for (SweepDefinition.Relation r : d.relations()) {
            h.add(r.name());
        }
        h.add("unique");
        return h;
    }

    /**
     * Writes the table.
     *
     * @param t the table
     * @param out where to write (not closed)
     * @param threads formatting threads, at least 1
     * @throws UncheckedIOException when writing fails
     */
    public static void write(SweepTable t, Writer out, int threads) {
        write(t, threads, text -> out.write(text.toString()), out::flush);
    }

    /**
     * Writes the table as ASCII bytes (faster than through a {@link Writer} for large sweeps).
     *
     * @param t the table
     * @param out where to write (not closed)
     * @param threads formatting threads, at least 1
     * @throws UncheckedIOException when writing fails
     */
    public static void write(SweepTable t, OutputStream out, int threads) {
        write(t, threads, text -> out.write(text.toByteArray()), out::flush);
    }

    /** A sink of text blocks. */
    private interface Sink {
        void accept(AsciiBuffer text) throws IOException;
    }

    /** A flush action. */
    private interface Flush {
        void run() throws IOException;
    }

    private static void write(SweepTable t, int threads, Sink out, Flush flush) {
        SweepDefinition d = t.definition();
        List<String> co = t.coPlayers().stream().map(SweepCsv::quote).toList();
        List<String> lengths = new ArrayList<>();
        for (Horizon h : d.lengths()) {
            lengths.add(h == null ? "long_run" : h.describe());
        }
        int rows = t.rows();
        int blocks = (rows + BLOCK - 1) / BLOCK;
        ExecutorService pool = threads > 1 ? Executors.newFixedThreadPool(threads, r -> {
            Thread th = new Thread(r, "sweep-csv");
            th.setDaemon(true);
            return th;
        }) : null;
        try {
            AsciiBuffer head = new AsciiBuffer(256);
            head.put(String.join(",", header(d)) + "\n");
            out.accept(head);
            List<Future<AsciiBuffer>> pending = new ArrayList<>();
            for (int b = 0; b < blocks; b++) {
                int from = b * BLOCK;
                int to = Math.min(rows, from + BLOCK);
                if (pool == null) {
                    out.accept(block(t, co, lengths, from, to));
                } else {
                    pending.add(pool.submit(() -> block(t, co, lengths, from, to)));
                    if (pending.size() >= 2 * threads) {
                        out.accept(pending.remove(0).get());
                    }
                }
            }
            for (Future<AsciiBuffer> f : pending) {
                out.accept(f.get());
            }
            flush.run();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted", e);
        } catch (ExecutionException e) {
            throw new IllegalStateException(e.getCause());
        } finally {
            if (pool != null) {
                pool.shutdownNow();
            }
        }
    }

    private static AsciiBuffer block(SweepTable t, List<String> co, List<String> lengths, int from, int to) {
        AsciiBuffer sb = new AsciiBuffer((to - from) * 200);
        boolean reactive = t.definition().family().reactive();
        int relations = t.definition().relations().size();
        int last = -1;
        AsciiBuffer entries = new AsciiBuffer(80);
        for (int r = from; r < to; r++) {
            int s = t.strategy(r);
            if (s != last) {
                AsciiBuffer e = new AsciiBuffer(80);
                e.put(s);
                e.put(',');
                if (reactive) {
                    number(e, t.entry(s, 0));
                    number(e, t.entry(s, 1));
                } else {
                    for (int k = 0; k < 4; k++) {
                        number(e, t.entry(s, k));
                    }
                }
                entries = e;
                last = s;
            }
            sb.put(entries);
            sb.put(co.get(t.coPlayer(r)));
            sb.put(',');
            sb.put(lengths.get(t.length(r)));
            sb.put(',');
            for (int k = 0; k < 4; k++) {
                number(sb, t.frequency(r, k));
            }
            number(sb, t.cooperationX(r));
            number(sb, t.cooperationY(r));
            number(sb, t.payoffX(r));
            number(sb, t.payoffY(r));
            double z = t.enforcedResidual(r);
            if (!Double.isNaN(z)) {
                Decimal15.append(sb, z);
            }
            for (int k = 0; k < relations; k++) {
                sb.put(',');
                Decimal15.append(sb, t.relation(r, k));
            }
            sb.put(t.unique(r) ? ",true\n" : ",false\n");
        }
        return sb;
    }

    private static void number(AsciiBuffer sb, double v) {
        Decimal15.append(sb, v);
        sb.put(',');
    }

    private static String quote(String s) {
        if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0) {
            return s;
        }
        return '"' + s.replace("\"", "\"\"") + '"';
    }
}
