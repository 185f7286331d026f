package reprise.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * What {@code --force} removes and how the lock refuses a second holder (the tool's own rules, README
 * "What check writes"; no external source).
 */
class OutputFolderTest {

    @TempDir
    Path tmp;

    /**
     * Only the fixed output names and files directly inside figures/ that run.json lists are the previous
     * run's: a listed path that leads out of the folder, into a subfolder, or to a folder is ignored, so a
     * hand-edited run.json cannot make {@code --force} delete anything else.
     */
    @Test
    void previousOutputsAreTheListedOutputsOnly() throws IOException {
        Path dir = Files.createDirectories(tmp.resolve("out"));
        Files.createDirectories(dir.resolve("figures/sub"));
        Files.writeString(dir.resolve("figures/a.png"), "a");
        Files.writeString(dir.resolve("figures/sub/b.png"), "b");
        Files.writeString(dir.resolve("figures/mine.txt"), "mine");
        Files.writeString(tmp.resolve("outside.txt"), "outside");
        Files.writeString(dir.resolve("run.json"), "{\"outputs\": [\"results.csv\", \"figures/a.png\", "
            + "\"../outside.txt\", \"figures/../../outside.txt\", \"" + tmp.resolve("outside.txt") + "\", "
            + "\"figures/sub/b.png\", \"figures/sub\", \"figures/none.png\", 7]}");
        List<Path> old = OutputFolder.previousOutputs(dir);
        List<Path> expected = new java.util.ArrayList<>();
        OutputFolder.OUTPUTS.forEach(n -> expected.add(dir.resolve(n)));
        expected.add(dir.resolve("figures/a.png"));
        assertEquals(expected, old);

        OutputFolder.prepare(dir, true);
        assertTrue(Files.exists(dir.resolve("figures/mine.txt")));
        assertTrue(Files.exists(dir.resolve("figures/sub/b.png")));
        assertTrue(Files.exists(tmp.resolve("outside.txt")));
        assertTrue(Files.notExists(dir.resolve("figures/a.png")));
    }

    /** A garbage run.json: only the fixed names are the previous run's. */
    @Test
    void anUnreadableRunJsonMeansTheFixedNames() throws IOException {
        Path dir = Files.createDirectories(tmp.resolve("out"));
        Files.write(dir.resolve("run.json"), new byte[] {(byte) 0xff, 0, 1, 2});
        assertEquals(OutputFolder.OUTPUTS.stream().map(dir::resolve).toList(), OutputFolder.previousOutputs(dir));
    }

    /**
     * Within one process a second lock on a held folder is refused too (the operating system's lock is
     * per process, so Java reports it as an overlap), naming the holder from the lock file; once released,
     * the folder can be locked again and the file stays.
     */
    @Test
    void aHeldFolderIsRefusedUntilReleased() {
        Path dir = tmp.resolve("held");
        OutputFolder.Lock first = OutputFolder.open("--out", dir, false, false, null);
        try {
            IllegalArgumentException ex = assertThrows(IllegalArgumentException.class,
                () -> OutputFolder.open("--out", dir, false, false, null));
            assertTrue(ex.getMessage().startsWith("--out: " + dir + " is in use by another run (pid "
                + ProcessHandle.current().pid() + " on host "), ex.getMessage());
        } finally {
            first.close();
        }
        OutputFolder.open("--out", dir, false, false, null).close();
        assertTrue(Files.exists(dir.resolve(OutputFolder.LOCK)));
    }

    /** A folder where the lock file belongs is bad input (exit 2), found before anything is written. */
    @Test
    void aFolderInPlaceOfTheLockFileIsRefused() throws IOException {
        Path dir = Files.createDirectories(tmp.resolve("odd").resolve(OutputFolder.LOCK)).getParent();
        IllegalArgumentException ex = assertThrows(IllegalArgumentException.class,
            () -> OutputFolder.check("--out", dir, false, false));
        assertEquals("--out: " + dir.resolve(OutputFolder.LOCK) + " is not a regular file; the run keeps its lock in a "
            + "file of that name", ex.getMessage());
    }
}
