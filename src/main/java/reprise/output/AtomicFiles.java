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

    /**
     * A hook for fault tests, read only here: with this system property set to a file name, writing a
     * file of that name fails partway, after some of its content, as a full disk fails
     * ({@code No space left on device}). Without the property (the normal case) nothing happens.
     */
    static final String FAIL_PROPERTY = "reprise.output.failWriting";

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
            createFolders(dir);
            tmp = createTemporary(dir, target.getFileName().toString());
            content.write(tmp);
            failIfTold(target, tmp);
            try {
                Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
            }
            tmp = null;
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + target + ": " + reason(e), e);
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

    private static void failIfTold(Path target, Path tmp) throws IOException {
        String name = System.getProperty(FAIL_PROPERTY);
        if (name != null && name.equals(target.getFileName().toString())) {
            long size = Files.size(tmp);
            try (java.nio.channels.FileChannel ch = java.nio.channels.FileChannel.open(tmp,
                java.nio.file.StandardOpenOption.WRITE)) {
                ch.truncate(size / 2);
            }
            throw new IOException(tmp + ": No space left on device");
        }
    }

    /**
     * Creates a folder and its parents, refusing with a user-facing message when a part of the path is an
     * existing regular file (a mistake in the path given, not a fault of the machine).
     *
     * @param dir the folder
     * @throws IllegalArgumentException when a part of the path is a file
     * @throws IOException when the folder cannot be made for another reason
     */
    public static void createFolders(Path dir) throws IOException {
        for (Path p = dir.toAbsolutePath(); p != null; p = p.getParent()) {
            if (Files.exists(p)) {
                if (!Files.isDirectory(p)) {
                    throw new IllegalArgumentException("cannot write into " + dir + ": " + p
                        + " is a file, not a folder");
                }
                break;
            }
        }
        Files.createDirectories(dir);
    }

    /**
     * A new, empty, hidden temporary file beside the target. Unlike {@link Files#createTempFile}, which
     * makes files readable by their owner only, it is created with the process's default permissions (the
     * umask applies), so results in a group-shared folder stay readable by the group.
     */
    private static Path createTemporary(Path dir, String name) throws IOException {
        for (int attempt = 0; ; attempt++) {
            Path tmp = dir.resolve("." + name + "." + Long.toUnsignedString(java.util.concurrent.ThreadLocalRandom.current().nextLong(), 36)
                + ".partial");
            try {
                return Files.createFile(tmp);
            } catch (java.nio.file.FileAlreadyExistsException e) {
                if (attempt > 100) {
                    throw e;
                }
            }
        }
    }

    /**
     * @param e an I/O failure
     * @return its reason in words: the message, with "no space left" and "permission denied" named
     *     plainly
     */
    static String reason(IOException e) {
        String m = String.valueOf(e.getMessage());
        if (m.contains("No space left on device")) {
            return "no space left on device";
        }
        if (e instanceof java.nio.file.AccessDeniedException) {
            return "permission denied: " + m;
        }
        return m;
    }
}
