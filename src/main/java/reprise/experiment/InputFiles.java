package reprise.experiment;

import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

/**
 * Reads the user's input files (experiments, claims) with the checks that keep a wrong path from costing
 * time or memory: the path must be a regular file, at most a stated number of bytes ({@value #MOST_BYTES}
 * for claims, {@value #MOST_EXPERIMENT_BYTES} for experiment files; checked before reading, and again while
 * reading, for files that grow or special files that report no size), UTF-8 text without NUL bytes. A UTF-8 byte-order mark, as spreadsheet programs write it, is dropped.
 */
public final class InputFiles {

    /** The largest input file read: far more than any experiment or claims file needs (16 MiB). */
    public static final int MOST_BYTES = 16 << 20;
    /**
     * The largest experiment file read (1 MiB): a hand-written experiment is a few kilobytes, and a larger
     * one is refused before YAML parsing spends time and memory on it.
     */
    public static final int MOST_EXPERIMENT_BYTES = 1 << 20;

    private InputFiles() {
    }

    /**
     * The text of an input file.
     *
     * @param file the path
     * @param what what the file is, for messages ("experiment file", "claims file")
     * @return the decoded text, without a leading byte-order mark
     * @throws IllegalArgumentException with a one-line reason (no file name: the caller adds it)
     * @throws IOException when reading fails for another reason
     */
    public static String text(Path file, String what) throws IOException {
        return decode(bytes(file, what), what);
    }

    /**
     * The bytes of an input file of at most {@value #MOST_BYTES} bytes, after the checks of the class
     * description.
     *
     * @param file the path
     * @param what what the file is, for messages
     * @return the bytes
     * @throws IllegalArgumentException with a one-line reason
     * @throws IOException when reading fails for another reason
     */
    public static byte[] bytes(Path file, String what) throws IOException {
        return bytes(file, what, MOST_BYTES);
    }

    /**
     * The bytes of an input file, after the checks of the class description.
     *
     * @param file the path
     * @param what what the file is, for messages
     * @param most the largest size accepted, in bytes
     * @return the bytes
     * @throws IllegalArgumentException with a one-line reason
     * @throws IOException when reading fails for another reason
     */
    public static byte[] bytes(Path file, String what, int most) throws IOException {
        if (Files.isDirectory(file)) {
            throw new IllegalArgumentException("is a folder, not " + article(what));
        }
        if (!Files.exists(file)) {
            throw new IllegalArgumentException("does not exist");
        }
        if (!Files.isRegularFile(file)) {
            throw new IllegalArgumentException("is not a regular file (a device or pipe?), not " + article(what));
        }
        long size = Files.size(file);
        if (size > most) {
            throw new IllegalArgumentException(tooLarge(size, what, most));
        }
        try (InputStream in = Files.newInputStream(file)) {
            byte[] b = in.readNBytes(most + 1);
            if (b.length > most) {
                throw new IllegalArgumentException(tooLarge(b.length, what, most));
            }
            return b;
        }
    }

    /**
     * Decodes UTF-8, refusing malformed bytes and NUL characters and dropping a byte-order mark.
     *
     * @param bytes the bytes
     * @param what what the file is, for messages
     * @return the text
     * @throws IllegalArgumentException when the bytes are not UTF-8 text
     */
    public static String decode(byte[] bytes, String what) {
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            throw new IllegalArgumentException("is not UTF-8 text (is it a binary file?); save the " + what
                + " as plain UTF-8 text");
        }
        int nul = text.indexOf('\0');
        if (nul >= 0) {
            throw new IllegalArgumentException("contains a NUL character (is it a binary file?); save the " + what
                + " as plain UTF-8 text");
        }
        return text.startsWith("\ufeff") ? text.substring(1) : text;
    }

    private static String tooLarge(long size, String what, int most) {
        return String.format(Locale.ROOT, "is too large for %s (%d bytes; at most %d)", article(what), size,
            most);
    }

    private static String article(String what) {
        return (what.matches("[aeiou].*") ? "an " : "a ") + what;
    }
}
