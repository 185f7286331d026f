package reprise.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A writer that fails halfway never leaves a half-written file under the final name, nor a temporary file. */
class AtomicFilesTest {

    @TempDir
    Path dir;

    private static void halfThenCrash(java.io.Writer w) throws IOException {
        w.write("a,b\n");
        for (int i = 0; i < 10_000; i++) {
            w.write(i + "," + i + "\n");
        }
        throw new IOException("disk gone halfway");
    }

    private List<Path> files() throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.sorted().toList();
        }
    }

    @Test
    void crashMidWriteLeavesNoFile() throws IOException {
        Path target = dir.resolve("results.csv");
        UncheckedIOException e = assertThrows(UncheckedIOException.class,
            () -> AtomicFiles.writeText(target, AtomicFilesTest::halfThenCrash));
        assertEquals("cannot write " + target + ": disk gone halfway", e.getMessage());
        assertEquals(List.of(), files());
    }

    @Test
    void crashMidWriteKeepsTheOldFileIntact() throws IOException {
        Path target = dir.resolve("results.csv");
        AtomicFiles.writeText(target, w -> w.write("old,complete\n"));
        assertThrows(UncheckedIOException.class, () -> AtomicFiles.writeText(target, AtomicFilesTest::halfThenCrash));
        assertEquals("old,complete\n", Files.readString(target));
        assertEquals(List.of(target), files());
    }

    @Test
    void runtimeFailureInTheWriterAlsoCleansUp() throws IOException {
        Path target = dir.resolve("curves.csv");
        assertThrows(IllegalStateException.class, () -> AtomicFiles.writeText(target, w -> {
            w.write("x,y\n1,2\n");
            throw new IllegalStateException("bug while writing");
        }));
        assertEquals(List.of(), files());
    }

    @Test
    void successfulWriteReplacesAtomically() throws IOException {
        Path target = dir.resolve("cases.csv");
        AtomicFiles.writeText(target, w -> w.write("first\n"));
        AtomicFiles.writeText(target, w -> w.write("second\n"));
        assertEquals("second\n", Files.readString(target));
        assertFalse(files().stream().anyMatch(p -> p.getFileName().toString().endsWith(".partial")));
    }
}
