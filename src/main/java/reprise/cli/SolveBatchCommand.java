package reprise.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.PrintWriter;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.Callable;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVPrinter;
import org.apache.commons.csv.CSVRecord;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.chain.Prediction;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;
import reprise.game.StrategyDescription;

/**
 * {@code solve-batch}: many {@code solve}s in one process, one match per input row.
 *
 * <p>Input: CSV with a header naming some of the columns {@code x, y} (required), {@code game},
 * {@code noise}, {@code misperception} (one probability, or X's,Y's in a quoted field), {@code rounds},
 * {@code continuation}; blank fields take {@code solve}'s defaults. Output: one JSON object per line
 * ({@code --format jsonl}: the object of {@code solve --json}, compact, with {@code line} first) or CSV. A
 * row that cannot be solved gives one line on stderr naming its line number and field, and an output row
 * with only {@code line} and {@code error}; the other rows are unaffected.
 */
@Command(name = "solve-batch", mixinStandardHelpOptions = true,
    description = {"Solves many matches exactly in one process: one match per row of a CSV file (or stdin), with a "
        + "header naming the columns x, y (required), game, noise, misperception, rounds, continuation; blank "
        + "fields take solve's defaults. Writes JSON Lines (the solve --json object of each row, with 'line') or "
        + "CSV to stdout. A bad row gives one line on stderr naming its line and field; the other rows are "
        + "solved as usual."},
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {"0:every row solved", "2:bad input: some row failed (each named on stderr), or the file is unreadable",
        "3:internal error"})
final class SolveBatchCommand implements Callable<Integer> {

    private static final Set<String> COLUMNS = Set.of("x", "y", "game", "noise", "misperception", "rounds",
        "continuation");
    private static final ObjectMapper COMPACT = new ObjectMapper();

    /** Output formats. */
    enum Format { JSONL, CSV }

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "FILE", defaultValue = "-", description = "The input CSV, or - for stdin (default).")
    String file;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "jsonl",
        description = "jsonl or csv. Default: ${DEFAULT-VALUE}.")
    Format format;

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        int failed = 0;
        try (Reader in = file.equals("-") ? new InputStreamReader(System.in, StandardCharsets.UTF_8)
            : Files.newBufferedReader(Path.of(file), StandardCharsets.UTF_8);
             CSVParser parser = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true)
                 .setIgnoreSurroundingSpaces(true).setIgnoreEmptyLines(true).build().parse(in)) {
            Map<String, Integer> header = parser.getHeaderMap();
            for (String name : header.keySet()) {
                if (!COLUMNS.contains(name.trim().toLowerCase(Locale.ROOT))) {
                    throw new IllegalArgumentException(where() + "line 1: unknown column '" + name
                        + "'; known: x, y, game, noise, misperception, rounds, continuation");
                }
            }
            if (!header.containsKey("x") || !header.containsKey("y")) {
                throw new IllegalArgumentException(where() + "line 1: the header must name the columns x and y");
            }
            CSVPrinter csv = format == Format.CSV ? new CSVPrinter(out, CSVFormat.DEFAULT) : null;
            if (csv != null) {
                csv.printRecord(CsvRow.HEADER);
            }
            for (CSVRecord r : parser) {
                long line = r.getRecordNumber() + 1;
                String x = field(r, "x");
                String y = field(r, "y");
                Row row;
                try {
                    row = solve(r);
                } catch (FieldException e) {
                    failed++;
                    err.println("reprise solve-batch: " + where() + "line " + line + ", field '" + e.field + "': "
                        + e.getMessage());
                    writeError(out, csv, line, x, y, "field '" + e.field + "': " + e.getMessage());
                    continue;
                } catch (IllegalArgumentException e) {
                    failed++;
                    err.println("reprise solve-batch: " + where() + "line " + line + ": " + e.getMessage());
                    writeError(out, csv, line, x, y, e.getMessage());
                    continue;
                }
                if (csv != null) {
                    csv.printRecord(CsvRow.values(line, row.match, row.horizon, row.prediction, row.x, row.y));
                } else {
                    ObjectNode o = Json.object();
                    o.put("line", line);
                    o.setAll(SolveCommand.fullJson(row.prediction, row.match, row.horizon, row.x, row.y));
                    out.println(COMPACT.writeValueAsString(o));
                }
            }
            if (csv != null) {
                csv.flush();
            }
        } catch (java.io.UncheckedIOException e) {
            throw new IllegalArgumentException(where() + e.getCause().getMessage(), e);
        } catch (java.nio.file.NoSuchFileException e) {
            throw new IllegalArgumentException("cannot read " + file + ": no such file", e);
        }
        out.flush();
        if (failed > 0) {
            err.println("reprise solve-batch: " + failed + " row(s) failed; the other rows were solved");
            return Main.BAD_INPUT;
        }
        return Main.OK;
    }

    private String where() {
        return file.equals("-") ? "" : file + ": ";
    }

    private void writeError(PrintWriter out, CSVPrinter csv, long line, String x, String y, String message)
        throws IOException {
        if (csv != null) {
            csv.printRecord(CsvRow.error(line, x, y, message));
        } else {
            ObjectNode o = Json.object();
            o.put("line", line);
            o.put("x", x);
            o.put("y", y);
            o.put("error", message);
            out.println(COMPACT.writeValueAsString(o));
        }
    }

    /** A solved row. */
    record Row(Match match, Horizon horizon, Prediction prediction, StrategyDescription x, StrategyDescription y) {
    }

    /** A problem with one field of a row. */
    static final class FieldException extends IllegalArgumentException {
        private static final long serialVersionUID = 1L;
        final String field;

        FieldException(String field, String message, Throwable cause) {
            super(message, cause);
            this.field = field;
        }
    }

    private static String field(CSVRecord r, String name) {
        return r.isMapped(name) && r.isSet(name) ? r.get(name).trim() : "";
    }

    /** Builds the match exactly as {@code solve}'s options do, so that the prediction is the same. */
    static Row solve(CSVRecord r) {
        String gameText = field(r, "game");
        StageGame game;
        try {
            game = StageGame.parse(gameText.isEmpty() ? "3,0,5,1" : gameText);
        } catch (IllegalArgumentException e) {
            throw new FieldException("game", e.getMessage(), e);
        }
        double[] e = pair(r, "noise");
        double[] h = pair(r, "misperception");
        String xs = field(r, "x");
        String ys = field(r, "y");
        StrategyDescription dx = description("x", xs, game, Player.X);
        StrategyDescription dy = description("y", ys, game, Player.Y);
        Match match = new Match(game, Strategies.parse(xs, game, Player.X), Strategies.parse(ys, game, Player.Y),
            new Noise(e[0], e[1], h[0], h[1]));
        Horizon horizon = horizon(r);
        Prediction p;
        try {
            p = Prediction.of(match, horizon);
        } catch (reprise.chain.NoPredictionException ex) {
            throw new IllegalArgumentException(ex.getMessage(), ex);
        }
        return new Row(match, horizon, p, dx, dy);
    }

    private static StrategyDescription description(String field, String spec, StageGame game, Player player) {
        try {
            return StrategyDescription.of(spec, game, player);
        } catch (IllegalArgumentException e) {
            throw new FieldException(field, e.getMessage(), e);
        }
    }

    private static double[] pair(CSVRecord r, String name) {
        String text = field(r, name);
        try {
            return MatchOptions.pair("--" + name, text.isEmpty() ? "0" : text);
        } catch (IllegalArgumentException e) {
            throw new FieldException(name, e.getMessage().replaceFirst("^--" + name + " ", ""), e);
        }
    }

    private static Horizon horizon(CSVRecord r) {
        String rounds = field(r, "rounds");
        String cont = field(r, "continuation");
        if (!rounds.isEmpty() && !cont.isEmpty()) {
            throw new FieldException("rounds", "give rounds or continuation, not both", null);
        }
        if (!rounds.isEmpty()) {
            long n;
            try {
                n = Long.parseLong(rounds);
            } catch (NumberFormatException e) {
                throw new FieldException("rounds", "not a whole number: '" + rounds + "'", e);
            }
            if (n < 1) {
                throw new FieldException("rounds", "must be at least 1: " + n, null);
            }
            return Horizon.rounds(n);
        }
        if (!cont.isEmpty()) {
            double d;
            try {
                d = Double.parseDouble(cont);
            } catch (NumberFormatException e) {
                throw new FieldException("continuation", "not a number: '" + cont + "'", e);
            }
            if (!(d >= 0 && d < 1)) {
                throw new FieldException("continuation", "must be a probability in [0, 1): " + cont, null);
            }
            return Horizon.continuation(d);
        }
        return null;
    }

    /** The CSV output layout. */
    static final class CsvRow {
        static final List<String> HEADER = List.of("line", "x", "y", "game", "execution_x", "execution_y",
            "perception_x", "perception_y", "horizon", "stationary_cc", "stationary_cd", "stationary_dc",
            "stationary_dd", "limit_cc", "limit_cd", "limit_dc", "limit_dd", "long_run_payoff_x", "long_run_payoff_y",
            "horizon_cc", "horizon_cd", "horizon_dc", "horizon_dd", "horizon_payoff_x", "horizon_payoff_y",
            "horizon_cooperation_x", "horizon_cooperation_y", "second_eigenvalue_modulus", "mixing_time",
            "x_first_move", "x_table", "y_first_move", "y_table", "error");

        private CsvRow() {
        }

        static List<Object> values(long line, Match m, Horizon h, Prediction p, StrategyDescription x,
            StrategyDescription y) {
            List<Object> v = new ArrayList<>(List.of(line, m.x().label(), m.y().label(), m.game().label(),
                num(m.noise().executionX()), num(m.noise().executionY()), num(m.noise().perceptionX()),
                num(m.noise().perceptionY()), h == null ? "" : h.describe()));
            double[] st = p.stationary();
            for (int s = 0; s < 4; s++) {
                v.add(st == null ? "" : num(st[s]));
            }
            double[] lim = p.limitFrequencies();
            for (int s = 0; s < 4; s++) {
                v.add(num(lim[s]));
            }
            v.add(num(p.limitPayoffs().x()));
            v.add(num(p.limitPayoffs().y()));
            Prediction.HorizonResult hr = p.horizon();
            double[] hf = hr == null ? null : hr.frequencies();
            for (int s = 0; s < 4; s++) {
                v.add(hf == null ? "" : num(hf[s]));
            }
            v.add(hr == null ? "" : num(hr.payoffs().x()));
            v.add(hr == null ? "" : num(hr.payoffs().y()));
            v.add(hr == null ? "" : num(hr.cooperation().x()));
            v.add(hr == null ? "" : num(hr.cooperation().y()));
            v.add(num(p.secondEigenvalueModulus()));
            v.add(p.mixingTime().isPresent() ? String.valueOf(p.mixingTime().getAsLong()) : "");
            v.add(num(x.firstMove()));
            v.add(table(x));
            v.add(num(y.firstMove()));
            v.add(table(y));
            v.add("");
            return v;
        }

        static List<Object> error(long line, String x, String y, String message) {
            List<Object> v = new ArrayList<>();
            v.add(line);
            v.add(x);
            v.add(y);
            while (v.size() < HEADER.size() - 1) {
                v.add("");
            }
            v.add(message);
            return v;
        }

        private static String table(StrategyDescription d) {
            StringBuilder sb = new StringBuilder();
            for (double t : d.table()) {
                sb.append(sb.length() == 0 ? "" : " ").append(t);
            }
            return sb.toString();
        }

        private static String num(double v) {
            return Double.isFinite(v) ? Double.toString(v) : "";
        }
    }
}
