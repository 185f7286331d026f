package reprise.output;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * Writes files so that a crash never leaves a half-written file under the final name: the content goes
 * to a temporary file in the same folder, which is then moved into place (atomically where the file
 * system allows).
 */
public final class AtomicFiles {

    /** Something that writes a file's content. */
    @FunctionalInterface
    public interface Content {
        /**
         * Writes the content.
         *
         * @param w the writer
         * @throws IOException if writing fails
         */
        void write(Writer w) throws IOException;
    }

    /** Something that writes a file given its (temporary) path. */
    @FunctionalInterface
    public interface PathContent {
        /**
         * Writes the file.
         *
         * @param temporary the path to write to
         * @throws IOException if writing fails
         */
        void write(Path temporary) throws IOException;
    }

    private AtomicFiles() {
    }

    /**
     * Writes a UTF-8 text file atomically.
     *
     * @param target the final path
     * @param content what to write
     */
    public static void writeText(Path target, Content content) {
        write(target, tmp -> {
            try (Writer w = Files.newBufferedWriter(tmp, StandardCharsets.UTF_8)) {
                content.write(w);
            }
        });
    }

    /**
     * Writes any file atomically.
     *
     * @param target the final path
     * @param content writes the temporary file
     */
    public static void write(Path target, PathContent content) {
        Path dir = target.toAbsolutePath().getParent();
        Path tmp = null;
        try {
            Files.createDirectories(dir);
            tmp = Files.createTempFile(dir, "." + target.getFileName() + ".", ".partial");
            content.write(tmp);
            try {
                Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
            }
            tmp = null;
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + target + ": " + e.getMessage(), e);
        } finally {
            if (tmp != null) {
                try {
                    Files.deleteIfExists(tmp);
                } catch (IOException ignored) {
                    // the temporary file is hidden and named .partial; nothing more can be done here
                }
            }
        }
    }
}
