package reprise.experiment;

import java.io.IOException;
import java.math.BigDecimal;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.Locale;

/**
 * Reads and validates experiment files (YAML).
 *
 * <p>Every problem is collected and reported at once, one line each, as {@code file:line: field: message},
 * before anything is simulated. The format is documented in README.md ("Experiment files"). Reading has
 * three layers: {@link YamlReader} (YAML with line numbers, generic), {@link ExperimentSchema} (each
 * section's fields) and {@link ExperimentRules} (rules that join fields, and the limits).
 */
public final class ExperimentFile {

    private ExperimentFile() {
    }

    /**
     * Reads an experiment file.
     *
     * @param file the YAML file
     * @return the validated experiment
     * @throws InvalidExperimentException listing every problem with file, line and field
     */
    public static Experiment read(Path file) {
        Problems problems = new Problems(file.toString());
        Source source = source(file, problems);
        return parse(file, source.text(), sha256(source.bytes()), problems);
    }

    /**
     * An experiment file's bytes and text.
     *
     * @param bytes the bytes as read
     * @param text the decoded text
     */
    record Source(byte[] bytes, String text) {
    }

    /**
     * Reads an experiment file (pairs or population) through {@link InputFiles}, with the experiment-file
     * size cap; a file that cannot be read is its only problem, thrown at once.
     *
     * @param file the file
     * @param problems where the problem goes
     * @return the bytes and text
     * @throws InvalidExperimentException when the file cannot be read as UTF-8 text
     */
    static Source source(Path file, Problems problems) {
        try {
            byte[] bytes = InputFiles.bytes(file, "experiment file", InputFiles.MOST_EXPERIMENT_BYTES);
            return new Source(bytes, InputFiles.decode(bytes, "experiment file"));
        } catch (IllegalArgumentException e) {
            problems.add(0, "file", e.getMessage());
        } catch (IOException e) {
            problems.add(0, "file", "cannot be read: " + e.getMessage());
        }
        problems.throwIfAny();
        throw new IllegalStateException("unreachable: a problem was added");
    }

    static Experiment parse(Path file, String text, String hash, Problems problems) {
        ExperimentSchema schema = ExperimentSchema.read(file, YamlReader.compose(text, problems), problems);
        ExperimentRules.check(schema, problems);
        problems.throwIfAny();
        Experiment.Builder b = schema.builder();
        b.sha256 = hash;
        return b.build();
    }

    /**
     * Parses "E" or "EX,EY" as a pair of probabilities.
     *
     * @param text the text
     * @return {X's, Y's}
     */
    static double[] pair(String text) {
        String[] parts = text.split(",", -1);
        if (parts.length > 2) {
            throw new IllegalArgumentException("takes one probability or two (X's,Y's): '" + text + "'");
        }
        double[] v = new double[2];
        for (int i = 0; i < parts.length; i++) {
            String t = parts[i].trim();
            YamlReader.NumberText kind = YamlReader.NumberText.of(t);
            if (kind == YamlReader.NumberText.NOT_FINITE) {
                throw new IllegalArgumentException("must be a finite probability: '" + t + "'");
            }
            if (kind == YamlReader.NumberText.NOT_A_NUMBER) {
                throw new IllegalArgumentException("is not a number: '" + t + "'");
            }
            double d = Double.parseDouble(t);
            if (!(d >= 0 && d <= 1)) {
                throw new IllegalArgumentException("must be a probability in [0, 1]: " + t);
            }
            v[i] = d;
        }
        if (parts.length == 1) {
            v[1] = v[0];
        }
        return v;
    }

    static String num(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return Long.toString((long) v);
        }
        return BigDecimal.valueOf(v).stripTrailingZeros().toPlainString();
    }

    static String sha256(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is missing from this Java runtime", e);
        }
    }
}
