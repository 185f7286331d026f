package reprise.output.figures;

import java.nio.charset.StandardCharsets;
import java.text.Normalizer;
import java.util.Locale;
import java.util.Set;
import java.util.zip.CRC32;

/**
 * File names that are safe on Linux, macOS and Windows, made from free-form case names.
 *
 * <p>Accents are stripped, every run of characters other than ASCII letters, digits, '.', '_' and '-'
 * becomes one '_', and leading or trailing dots, underscores and hyphens are removed. Whenever this
 * changed the name, an 8-digit hexadecimal CRC-32 of the original (UTF-8) is appended, so two case
 * names that differ only in replaced characters ("e=0.1" and "e 0.1") still get different files.
 * Names reserved by Windows (CON, NUL, COM1, ...) get a trailing '_'; results are at most
 * {@value #MAX_LENGTH} characters.
 */
public final class FileNames {

    /** The longest name returned, well under every common file system's limit. */
    public static final int MAX_LENGTH = 96;

    private static final Set<String> RESERVED = Set.of("CON", "PRN", "AUX", "NUL", "COM1", "COM2", "COM3", "COM4",
        "COM5", "COM6", "COM7", "COM8", "COM9", "LPT1", "LPT2", "LPT3", "LPT4", "LPT5", "LPT6", "LPT7", "LPT8",
        "LPT9");

    private FileNames() {
    }

    /**
     * A safe file name (without extension) for a case name.
     *
     * @param caseName any non-blank text
     * @return the safe name; equal to {@code caseName} when that was already safe
     * @throws IllegalArgumentException if {@code caseName} is null or blank
     */
    public static String safe(String caseName) {
        if (caseName == null || caseName.isBlank()) {
            throw new IllegalArgumentException("case name must not be blank: "
                + (caseName == null ? "null" : "\"" + caseName + "\""));
        }
        String ascii = Normalizer.normalize(caseName, Normalizer.Form.NFKD).replaceAll("\\p{M}+", "");
        String cleaned = ascii.replaceAll("[^A-Za-z0-9._-]+", "_").replaceAll("^[._-]+|[._-]+$", "");
        boolean changed = !cleaned.equals(caseName);
        if (cleaned.isEmpty()) {
            cleaned = "case";
        }
        int stem = cleaned.indexOf('.') < 0 ? cleaned.length() : cleaned.indexOf('.');
        if (RESERVED.contains(cleaned.substring(0, stem).toUpperCase(Locale.ROOT))) {
            cleaned = cleaned.substring(0, stem) + "_" + cleaned.substring(stem);
            changed = true;
        }
        int room = changed ? MAX_LENGTH - 9 : MAX_LENGTH;
        if (cleaned.length() > room) {
            cleaned = cleaned.substring(0, room).replaceAll("[._-]+$", "");
            if (!changed) {
                changed = true;
                cleaned = cleaned.substring(0, Math.min(cleaned.length(), MAX_LENGTH - 9));
            }
        }
        if (!changed) {
            return cleaned;
        }
        CRC32 crc = new CRC32();
        crc.update(caseName.getBytes(StandardCharsets.UTF_8));
        return cleaned + "-" + String.format(Locale.ROOT, "%08x", crc.getValue());
    }

    /**
     * A readable file name (without extension) for a figure: accents stripped, every run of characters
     * other than ASCII letters, digits and '.' becomes one '-', leading and trailing '-' and '.' removed,
     * at most {@value #MAX_LENGTH} characters, names reserved by Windows get a trailing '-x'. Unlike
     * {@link #safe} it appends no checksum, so two texts that differ only in replaced characters get the
     * same name; {@link #unique} tells them apart.
     *
     * @param text any non-blank text, e.g. "convergence-TFT vs ALLD, noise=0.05"
     * @return e.g. "convergence-TFT-vs-ALLD-noise-0.05"
     * @throws IllegalArgumentException if {@code text} is null or blank
     */
    public static String readable(String text) {
        if (text == null || text.isBlank()) {
            throw new IllegalArgumentException("figure name must not be blank: "
                + (text == null ? "null" : "\"" + text + "\""));
        }
        String ascii = Normalizer.normalize(text, Normalizer.Form.NFKD).replaceAll("\\p{M}+", "");
        String cleaned = ascii.replaceAll("[^A-Za-z0-9.]+", "-").replaceAll("^[.-]+|[.-]+$", "");
        if (cleaned.length() > MAX_LENGTH) {
            cleaned = cleaned.substring(0, MAX_LENGTH).replaceAll("[.-]+$", "");
        }
        if (cleaned.isEmpty()) {
            cleaned = "figure";
        }
        int stem = cleaned.indexOf('.') < 0 ? cleaned.length() : cleaned.indexOf('.');
        if (RESERVED.contains(cleaned.substring(0, stem).toUpperCase(Locale.ROOT))) {
            cleaned = cleaned.substring(0, stem) + "-x" + cleaned.substring(stem);
        }
        return cleaned;
    }

    /**
     * {@code name} itself if not yet taken, else {@code name-2}, {@code name-3}, ... (the first free one);
     * the name returned is added to {@code taken}. Case is ignored when comparing, as on macOS and
     * Windows file systems.
     *
     * @param name a name from {@link #readable}
     * @param taken the names used so far (lower case), updated
     * @return the free name
     */
    public static String unique(String name, Set<String> taken) {
        String candidate = name;
        for (int i = 2; !taken.add(candidate.toLowerCase(Locale.ROOT)); i++) {
            String suffix = "-" + i;
            candidate = (name.length() + suffix.length() > MAX_LENGTH
                ? name.substring(0, MAX_LENGTH - suffix.length()) : name) + suffix;
        }
        return candidate;
    }
}
