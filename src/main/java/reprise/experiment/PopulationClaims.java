package reprise.experiment;

import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import reprise.game.Horizon;

/**
 * A researcher's claimed fixation probabilities and abundances for a population experiment, read from the CSV
 * file named by {@code population.claims} (README.md, "Population experiments", claims).
 *
 * <p>Format: a header row; key columns {@code N}, {@code selection}, {@code noise}, {@code misperception},
 * {@code rounds} or {@code continuation}, {@code mutant}, {@code resident} and {@code strategy} (a key column
 * left out, or an empty cell, means every value of that axis); value columns {@code fixation} (the mutant's
 * fixation probability in the resident population, keyed by mutant and resident) and {@code abundance} (the
 * strategy's long-run abundance, keyed by strategy; the experiment needs mutation); optional {@code tolerance}
 * (absolute such as 0.01 or relative such as 5%; default the experiment's relative tolerance). An empty value
 * cell claims nothing. Every row must match at least one question, and no question may be claimed twice.
 * The file is read through {@link InputFiles} (size, UTF-8, byte-order mark).
 */
public final class PopulationClaims {

    /** The key columns. */
    static final List<String> KEYS = List.of("N", "selection", "noise", "misperception", "rounds", "continuation",
        "mutant", "resident", "strategy");
    /** The value columns. */
    static final List<String> VALUES = List.of("fixation", "abundance");
    /** Every known column. */
    static final List<String> KNOWN;

    static {
        List<String> k = new ArrayList<>(KEYS);
        k.addAll(VALUES);
        k.add("tolerance");
        KNOWN = List.copyOf(k);
    }

    private PopulationClaims() {
    }

    /** What a claim is about. */
    public enum Kind {
        /** A fixation probability of one mutant. */
        FIXATION,
        /** A long-run abundance of one strategy. */
        ABUNDANCE
    }

    /**
     * One claimed value at one grid point.
     *
     * @param line the CSV line (header is line 1)
     * @param kind fixation or abundance
     * @param point the grid point's index
     * @param mutant the mutant (fixation; -1 for abundance)
     * @param resident the resident (fixation; -1 for abundance)
     * @param strategy the strategy (abundance; -1 for fixation)
     * @param value the claimed number, in [0, 1]
     * @param tolerance the row's margin, or the experiment's relative tolerance
     */
    public record Claim(long line, Kind kind, int point, int mutant, int resident, int strategy, double value,
        Tolerance tolerance) {
    }

    /**
     * Reads a claims file and matches it to the experiment's questions.
     *
     * @param file the CSV file
     * @param e the experiment (its grid and strategies)
     * @return the claims, row by row, then point by point
     * @throws InvalidExperimentException listing every problem with file, line and column
     */
    public static List<Claim> read(Path file, PopulationExperiment e) {
        Problems problems = new Problems(file.toString());
        String text;
        try {
            text = InputFiles.text(file, "claims file");
        } catch (IOException | IllegalArgumentException ex) {
            problems.add(0, "file", ex instanceof IOException ? "cannot be read: " + ex.getMessage() : ex.getMessage());
            problems.throwIfAny();
            throw new IllegalStateException(ex);
        }
        CSVFormat format = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).setTrim(true)
            .setIgnoreEmptyLines(true).setCommentMarker('#').setAllowDuplicateHeaderNames(false).build();
        List<Claim> out = new ArrayList<>();
        Map<String, Long> seen = new HashMap<>();
        List<PopulationExperiment.Point> points = e.points();
        try (CSVParser parser = format.parse(new StringReader(text))) {
            List<String> header = parser.getHeaderNames();
            int headerLine = (int) Math.max(1, parser.getCurrentLineNumber());
            for (String h : header) {
                if (!KNOWN.contains(h)) {
                    problems.add(headerLine, h, "unknown column" + Problems.didYouMean(h, KNOWN) + "; known: "
                        + String.join(", ", KNOWN));
                }
            }
            if (header.stream().noneMatch(VALUES::contains)) {
                problems.add(headerLine, "header", "no value column; give fixation or abundance (or both)");
            }
            problems.throwIfAny();
            for (CSVRecord rec : parser) {
                long line = physicalLine(parser, rec);
                if (!rec.isConsistent()) {
                    problems.add((int) line, "row", "has " + rec.size() + " cells, the header has " + header.size());
                    continue;
                }
                row(rec, header, line, e, points, out, seen, problems);
            }
        } catch (IOException | IllegalArgumentException | IllegalStateException ex) {
            if (ex instanceof InvalidExperimentException ie) {
                throw ie;
            }
            problems.add(0, "file", "cannot be read as CSV: " + ex.getMessage());
        }
        problems.throwIfAny();
        return List.copyOf(out);
    }

    /** The physical line (from 1) on which a record starts: the parser's count less the breaks in quoted cells. */
    private static long physicalLine(CSVParser parser, CSVRecord rec) {
        long breaks = 0;
        for (String cell : rec) {
            breaks += cell.chars().filter(ch -> ch == '\n').count();
        }
        return parser.getCurrentLineNumber() - breaks;
    }

    private static String cell(CSVRecord rec, List<String> header, String column) {
        return header.contains(column) ? rec.get(column) : "";
    }

    private static void row(CSVRecord rec, List<String> header, long line, PopulationExperiment e,
        List<PopulationExperiment.Point> points, List<Claim> out, Map<String, Long> seen, Problems problems) {
        int n = problems.size();
        Double fixation = value(rec, header, "fixation", line, problems);
        Double abundance = value(rec, header, "abundance", line, problems);
        Tolerance tolerance = new Tolerance(e.tolerance(), true);
        String t = cell(rec, header, "tolerance");
        if (!t.isEmpty()) {
            try {
                tolerance = Tolerance.parse(t);
            } catch (IllegalArgumentException ex) {
                problems.add((int) line, "tolerance", ex.getMessage());
            }
        }
        int mutant = strategy(rec, header, "mutant", e, line, problems);
        int resident = strategy(rec, header, "resident", e, line, problems);
        int strategy = strategy(rec, header, "strategy", e, line, problems);
        if (fixation != null && strategy >= 0) {
            problems.add((int) line, "strategy", "keys abundance claims; a fixation claim is keyed by mutant and "
                + "resident (leave strategy empty)");
        }
        if (abundance != null && (mutant >= 0 || resident >= 0)) {
            problems.add((int) line, mutant >= 0 ? "mutant" : "resident", "keys fixation claims; an abundance claim "
                + "is keyed by strategy (leave mutant and resident empty)");
        }
        if (fixation != null && mutant >= 0 && mutant == resident) {
            problems.add((int) line, "resident", "is the mutant; a fixation question needs two strategies");
        }
        if (abundance != null && e.mutation() == PopulationExperiment.Mutation.NONE) {
            problems.add((int) line, "abundance", "needs mutation (rare or a rate) in the population section");
        }
        for (String h : List.of("N", "selection", "noise", "misperception", "rounds", "continuation")) {
            String c = cell(rec, header, h);
            if (!c.isEmpty() && !isNumber(c)) {
                problems.add((int) line, h, "must be a number: '" + c + "'");
            }
        }
        if (problems.size() > n) {
            return;
        }
        if (fixation == null && abundance == null) {
            return;
        }
        int k = e.strategies().size();
        int matched = 0;
        for (PopulationExperiment.Point p : points) {
            if (!matches(p, rec, header)) {
                continue;
            }
            if (fixation != null) {
                for (int m = 0; m < k; m++) {
                    for (int r = 0; r < k; r++) {
                        if (m != r && (mutant < 0 || m == mutant) && (resident < 0 || r == resident)) {
                            matched++;
                            add(new Claim(line, Kind.FIXATION, p.index(), m, r, -1, fixation, tolerance), p, e, out,
                                seen, problems);
                        }
                    }
                }
            }
            if (abundance != null) {
                int kinds = e.mutation() == PopulationExperiment.Mutation.RATE ? 2 : k;
                for (int s = 0; s < kinds; s++) {
                    if (strategy < 0 || s == strategy) {
                        matched++;
                        add(new Claim(line, Kind.ABUNDANCE, p.index(), -1, -1, s, abundance, tolerance), p, e, out,
                            seen, problems);
                    }
                }
            }
        }
        if (matched == 0) {
            problems.add((int) line, "row", "matches no question of the experiment");
        }
    }

    private static void add(Claim c, PopulationExperiment.Point p, PopulationExperiment e, List<Claim> out,
        Map<String, Long> seen, Problems problems) {
        String what = c.kind() == Kind.FIXATION ? "fixation of " + e.strategyNames().get(c.mutant()) + " in "
            + e.strategyNames().get(c.resident()) : "abundance of " + e.strategyNames().get(c.strategy());
        String key = p.name() + " " + what;
        Long prev = seen.putIfAbsent(key, c.line());
        if (prev != null) {
            problems.add((int) c.line(), c.kind() == Kind.FIXATION ? "fixation" : "abundance", p.name() + " already "
                + "has a claim for the " + what + " from line " + prev);
            return;
        }
        out.add(c);
    }

    private static Double value(CSVRecord rec, List<String> header, String column, long line, Problems problems) {
        String c = cell(rec, header, column);
        if (c.isEmpty()) {
            return null;
        }
        double v;
        try {
            v = Double.parseDouble(c);
        } catch (NumberFormatException ex) {
            v = Double.NaN;
        }
        if (!(v >= 0 && v <= 1) || YamlReader.NumberText.of(c) != YamlReader.NumberText.FINITE) {
            problems.add((int) line, column, "is a probability and must be a number in [0, 1]: '" + c + "'");
            return null;
        }
        return v;
    }

    private static int strategy(CSVRecord rec, List<String> header, String column, PopulationExperiment e, long line,
        Problems problems) {
        String c = cell(rec, header, column);
        if (c.isEmpty()) {
            return -1;
        }
        int i = e.strategyNames().indexOf(c);
        if (i < 0) {
            problems.add((int) line, column, "'" + c + "' is not in the strategy set" + Problems.didYouMean(c,
                e.strategyNames()) + "; known: " + String.join(", ", e.strategyNames()));
        }
        return i;
    }

    private static boolean isNumber(String c) {
        try {
            Double.parseDouble(c);
            return YamlReader.NumberText.of(c) == YamlReader.NumberText.FINITE;
        } catch (NumberFormatException ex) {
            return false;
        }
    }

    private static boolean same(String cell, double v) {
        return cell.isEmpty() || Double.parseDouble(cell) == v;
    }

    private static boolean matches(PopulationExperiment.Point p, CSVRecord rec, List<String> header) {
        String rounds = cell(rec, header, "rounds");
        String cont = cell(rec, header, "continuation");
        if (!rounds.isEmpty() && !(p.horizon() instanceof Horizon.Rounds r && Double.parseDouble(rounds) == r.count())) {
            return false;
        }
        if (!cont.isEmpty() && !(p.horizon() instanceof Horizon.Continuation d
            && Double.parseDouble(cont) == d.probability())) {
            return false;
        }
        return same(cell(rec, header, "N"), p.population().size())
            && same(cell(rec, header, "selection"), p.population().selection())
            && same(cell(rec, header, "noise"), p.noise().executionX())
            && same(cell(rec, header, "misperception"), p.noise().perceptionX());
    }
}
