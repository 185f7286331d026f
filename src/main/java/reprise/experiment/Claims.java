package reprise.experiment;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import reprise.game.Horizon;

/**
 * A researcher's own claimed values, read from a CSV file and matched to the cases of an experiment.
 *
 * <p>Format (documented in README.md, "Claims files"): a header row; a {@code pair} column naming the
 * pair; optional key columns {@code noise}, {@code misperception}, {@code rounds} or {@code continuation}
 * and one per grid parameter, which pick the grid points the row is about (a key column left out, or an
 * empty cell, means "every value of that axis"); and one or more value columns among {@link #QUANTITIES}
 * and the experiment's derived quantities. Two optional columns qualify a row's claims: {@code value_is}
 * ({@code exact}, the default: the expected value for the game length played; or {@code long-run}: the
 * stationary value, or the time-average limit when there is no unique stationary distribution) and
 * {@code tolerance} (a margin for this row, absolute such as 0.05 or relative such as 2%). An empty value
 * cell claims nothing. Every row must match at least one case, and no two rows may claim the same quantity
 * of the same case.
 */
public final class Claims {

    /** The names of the quantities a claim can be about, as written in the header. */
    public static final List<String> QUANTITIES = java.util.Arrays.stream(BaseQuantity.values())
        .map(BaseQuantity::label).toList();

    private Claims() {
    }

    /** The column that says which value a row claims. */
    static final String VALUE_IS = "value_is";
    /** The column that gives a row's own tolerance. */
    static final String TOLERANCE = "tolerance";

    /**
     * One claimed value.
     *
     * @param value the claimed number
     * @param line the CSV line it came from (header is line 1)
     * @param longRun whether the value claimed is the long-run one (else the value for the length played)
     * @param tolerance the row's own margin, or null for the experiment's
     */
    public record Claim(double value, long line, boolean longRun, Tolerance tolerance) {
        /**
         * A claim of the value for the length played, with the experiment's tolerance.
         *
         * @param value the claimed number
         * @param line its CSV line
         */
        public Claim(double value, long line) {
            this(value, line, false, null);
        }

        /**
         * The margin this claim is judged with.
         *
         * @param e the experiment
         * @param q the quantity claimed
         * @return the row's tolerance, else the experiment's for the quantity
         */
        public Tolerance tolerance(Experiment e, Quantity q) {
            return tolerance != null ? tolerance : Tolerance.of(e, q);
        }
    }

    /**
     * The line of the file on which a record starts, counting every line (comments and blank lines too),
     * from 1: the parser's line count after the record, less the line breaks inside its quoted cells.
     */
    private static long physicalLine(CSVParser parser, CSVRecord rec) {
        long breaks = 0;
        for (String cell : rec) {
            breaks += cell.chars().filter(ch -> ch == '\n').count();
        }
        return parser.getCurrentLineNumber() - breaks;
    }

    /**
     * @return the first header name that appears twice and the header's line, or null (the header is the
     *     first record)
     */
    private static Object[] duplicatedColumn(String text, CSVFormat format) {
        CSVFormat plain = format.builder().setHeader((String[]) null).setSkipHeaderRecord(false).build();
        try (CSVParser p = plain.parse(new java.io.StringReader(text))) {
            java.util.Iterator<CSVRecord> it = p.iterator();
            if (!it.hasNext()) {
                return null;
            }
            java.util.Set<String> seen = new java.util.HashSet<>();
            CSVRecord header = it.next();
            for (String h : header) {
                if (!h.isEmpty() && !seen.add(h)) {
                    return new Object[] {h, (int) physicalLine(p, header)};
                }
            }
            return null;
        } catch (IOException | IllegalArgumentException | IllegalStateException e) {
            return null;
        }
    }

    /**
     * Reads a claims file and matches it to the experiment's cases.
     *
     * @param file the CSV file
     * @param experiment the experiment
     * @param cases its expanded cases
     * @return for each case index that has claims, the claims by quantity, in file order
     * @throws InvalidExperimentException listing every problem with file, line and column
     */
    public static Map<Integer, Map<BaseQuantity, Claim>> read(Path file, Experiment experiment, List<Case> cases) {
        Map<Integer, Map<BaseQuantity, Claim>> out = new LinkedHashMap<>();
        readAll(file, experiment, cases).forEach((i, m) -> {
            Map<BaseQuantity, Claim> base = new LinkedHashMap<>();
            m.forEach((q, c) -> {
                if (q instanceof BaseQuantity b) {
                    base.put(b, c);
                }
            });
            if (!base.isEmpty()) {
                out.put(i, base);
            }
        });
        return out;
    }

    /**
     * Reads a claims file, with claims on derived quantities too, and matches it to the experiment's cases.
     *
     * @param file the CSV file
     * @param experiment the experiment
     * @param cases its expanded cases
     * @return for each case index that has claims, the claims by quantity, in file order
     * @throws InvalidExperimentException listing every problem with file, line and column
     */
    public static Map<Integer, Map<Quantity, Claim>> readAll(Path file, Experiment experiment, List<Case> cases) {
        Problems problems = new Problems(file.toString());
        Map<Integer, Map<Quantity, Claim>> out = new LinkedHashMap<>();
        CSVFormat format = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).setTrim(true)
            .setIgnoreEmptyLines(true).setCommentMarker('#').build();
        String text = text(file, format, problems);
        try (Reader r = new java.io.StringReader(text); CSVParser parser = format.parse(r)) {
            List<String> header = parser.getHeaderNames();
            List<Quantity> valueColumns = valueColumns(header, knownColumns(experiment), experiment,
                (int) Math.max(1, parser.getCurrentLineNumber()), problems);
            problems.throwIfAny();
            List<String> skip = new ArrayList<>(valueColumns.stream().map(Quantity::label).toList());
            skip.add(VALUE_IS);
            skip.add(TOLERANCE);
            for (CSVRecord rec : parser) {
                long line = physicalLine(parser, rec);
                if (!rec.isConsistent()) {
                    problems.add((int) line, "row", "has " + rec.size() + " cells, the header has " + header.size());
                    continue;
                }
                Map<Quantity, Double> values = values(rec, valueColumns, line, problems);
                boolean longRun = longRun(rec, header, line, problems);
                Tolerance tolerance = tolerance(rec, header, line, problems);
                List<Case> matches = cases.stream().filter(c -> matches(c, rec, header, skip)).toList();
                if (matches.isEmpty()) {
                    problems.add((int) line, "row", "matches no grid point of the experiment (" + describe(rec, header, skip)
                        + ")");
                    continue;
                }
                for (Case c : matches) {
                    record(out.computeIfAbsent(c.index(), k -> new LinkedHashMap<>()), c, values, line, longRun,
                        tolerance, problems);
                }
            }
        } catch (IOException | IllegalArgumentException e) {
            if (e instanceof InvalidExperimentException ie) {
                throw ie;
            }
            problems.add(0, "file", "cannot be read as CSV: " + e.getMessage());
        }
        problems.throwIfAny();
        return out;
    }

    /** The file's text, after the checks of {@link InputFiles} and the duplicate-column check. */
    private static String text(Path file, CSVFormat format, Problems problems) {
        String text;
        try {
            text = InputFiles.text(file, "claims file");
        } catch (IOException | IllegalArgumentException e) {
            problems.add(0, "file", e instanceof IOException ? "cannot be read: " + e.getMessage() : e.getMessage());
            problems.throwIfAny();
            throw new IllegalStateException(e);
        }
        Object[] duplicated = duplicatedColumn(text, format);
        if (duplicated != null) {
            problems.add((int) duplicated[1], (String) duplicated[0], "column appears twice in the header; give each "
                + "column once");
            problems.throwIfAny();
        }
        return text;
    }

    /** The key columns of this experiment's claims files, then the value columns. */
    private static List<String> knownColumns(Experiment experiment) {
        List<String> known = new ArrayList<>(List.of("pair", "noise", "misperception",
            experiment.horizons().get(0) instanceof Horizon.Rounds ? "rounds" : "continuation"));
        known.addAll(experiment.parameters().keySet());
        known.addAll(QUANTITIES);
        experiment.derived().forEach(d -> known.add(d.name()));
        known.add(VALUE_IS);
        known.add(TOLERANCE);
        return known;
    }

    /** A row's value_is cell: false for exact (or empty), true for long-run; anything else is reported. */
    private static boolean longRun(CSVRecord rec, List<String> header, long line, Problems problems) {
        if (!header.contains(VALUE_IS)) {
            return false;
        }
        String cell = rec.get(VALUE_IS);
        if (cell.isEmpty() || cell.equals("exact")) {
            return false;
        }
        if (cell.equals("long-run")) {
            return true;
        }
        problems.add((int) line, VALUE_IS, "must be exact (the value for the game length played) or long-run (the "
            + "stationary or time-average limit value): '" + cell + "'");
        return false;
    }

    /** A row's tolerance cell, or null when absent or empty; a bad cell is reported. */
    private static Tolerance tolerance(CSVRecord rec, List<String> header, long line, Problems problems) {
        if (!header.contains(TOLERANCE) || rec.get(TOLERANCE).isEmpty()) {
            return null;
        }
        try {
            return Tolerance.parse(rec.get(TOLERANCE));
        } catch (IllegalArgumentException e) {
            problems.add((int) line, TOLERANCE, e.getMessage());
            return null;
        }
    }

    /** The header's value columns, after reporting a missing pair column and unknown columns. */
    private static List<Quantity> valueColumns(List<String> header, List<String> known, Experiment experiment,
        int headerLine, Problems problems) {
        if (!header.contains("pair")) {
            problems.add(headerLine, "pair", "column is missing; the header needs pair and at least one of "
                + String.join(", ", QUANTITIES));
        }
        List<Quantity> valueColumns = new ArrayList<>();
        for (String h : header) {
            if (!known.contains(h)) {
                problems.add(headerLine, h, "unknown column" + Problems.didYouMean(h, known) + "; known: "
                    + String.join(", ", known));
            } else if (QUANTITIES.contains(h)) {
                valueColumns.add(BaseQuantity.ofLabel(h));
            } else {
                experiment.derived().stream().filter(d -> d.name().equals(h)).findFirst().ifPresent(valueColumns::add);
            }
        }
        if (valueColumns.isEmpty()) {
            problems.add(headerLine, "header", "no value column; give at least one of " + String.join(", ", QUANTITIES));
        }
        return valueColumns;
    }

    /** The claimed values of one row (empty cells claim nothing); bad cells are reported. */
    private static Map<Quantity, Double> values(CSVRecord rec, List<Quantity> columns, long line,
        Problems problems) {
        Map<Quantity, Double> values = new LinkedHashMap<>();
        for (Quantity q : columns) {
            String cell = rec.get(q.label());
            if (cell.isEmpty()) {
                continue;
            }
            double v;
            try {
                v = Double.parseDouble(cell);
            } catch (NumberFormatException e) {
                v = Double.NaN;
            }
            if (!Double.isFinite(v)) {
                problems.add((int) line, q.label(), "must be a finite number: '" + cell + "'");
            } else if (q instanceof BaseQuantity b && b.isFrequency() && !(v >= 0 && v <= 1)) {
                problems.add((int) line, q.label(), "is a frequency and must be in [0, 1]: " + cell);
            } else {
                values.put(q, v);
            }
        }
        return values;
    }

    /** Adds a row's values to one case's claims, reporting a second claim of the same quantity. */
    private static void record(Map<Quantity, Claim> claims, Case c, Map<Quantity, Double> values, long line,
        boolean longRun, Tolerance tolerance, Problems problems) {
        for (Map.Entry<Quantity, Double> v : values.entrySet()) {
            Claim prev = claims.put(v.getKey(), new Claim(v.getValue(), line, longRun, tolerance));
            if (prev != null) {
                problems.add((int) line, v.getKey().label(), "case " + c.id() + " already has a claim for "
                    + v.getKey().label() + " from line " + prev.line());
            }
        }
    }

    private static boolean matches(Case c, CSVRecord rec, List<String> header, List<String> skip) {
        for (String h : header) {
            String cell = rec.get(h);
            if (cell.isEmpty() || skip.contains(h)) {
                continue;
            }
            switch (h) {
                case "pair":
                    if (!cell.equals(c.pair())) {
                        return false;
                    }
                    break;
                case "noise":
                    if (!sameNumbers(cell, c.noise())) {
                        return false;
                    }
                    break;
                case "misperception":
                    if (!sameNumbers(cell, c.misperception())) {
                        return false;
                    }
                    break;
                case "rounds":
                    if (!(c.horizon() instanceof Horizon.Rounds r) || !sameNumbers(cell, Long.toString(r.count()))) {
                        return false;
                    }
                    break;
                case "continuation":
                    if (!(c.horizon() instanceof Horizon.Continuation d)
                        || !sameNumbers(cell, Double.toString(d.probability()))) {
                        return false;
                    }
                    break;
                default:
                    Double v = c.parameters().get(h);
                    if (v == null || !sameNumbers(cell, Double.toString(v))) {
                        return false;
                    }
            }
        }
        return true;
    }

    private static boolean sameNumbers(String a, String b) {
        try {
            double[] x = ExperimentFile.pair(a);
            double[] y = ExperimentFile.pair(b);
            return x[0] == y[0] && x[1] == y[1];
        } catch (IllegalArgumentException e) {
            try {
                return Double.parseDouble(a) == Double.parseDouble(b);
            } catch (NumberFormatException n) {
                return a.equals(b);
            }
        }
    }

    private static String describe(CSVRecord rec, List<String> header, List<String> skip) {
        List<String> parts = new ArrayList<>();
        for (String h : header) {
            if (!QUANTITIES.contains(h) && !skip.contains(h) && !rec.get(h).isEmpty()) {
                parts.add(h + "=" + rec.get(h));
            }
        }
        return String.join(", ", parts);
    }
}
