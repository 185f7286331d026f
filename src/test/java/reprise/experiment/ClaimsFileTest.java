package reprise.experiment;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** How a claims file is read as text: encodings, comments and header problems (format: README, "Claims files"). */
class ClaimsFileTest {

    private static final String EXPERIMENT = "experiment: claims-text\npairs:\n  - {name: p, x: tft, y: gtft}\n"
        + "grid:\n  noise: [0.01]\n  rounds: [20]\nreplicates: 50\n";

    @TempDir
    Path tmp;

    private Experiment experiment() throws IOException {
        return ExperimentFile.read(Files.writeString(tmp.resolve("e.yaml"), EXPERIMENT));
    }

    @Test
    void aByteOrderMarkAsSpreadsheetsWriteItIsAccepted() throws IOException {
        Experiment e = experiment();
        Path plain = Files.writeString(tmp.resolve("plain.csv"), "pair,CC\np,0.25\n");
        Path marked = tmp.resolve("marked.csv");
        Files.write(marked, ("\ufeffpair,CC\np,0.25\n").getBytes(StandardCharsets.UTF_8));
        Map<Integer, Map<BaseQuantity, Claims.Claim>> a = Claims.read(plain, e, e.cases());
        Map<Integer, Map<BaseQuantity, Claims.Claim>> b = Claims.read(marked, e, e.cases());
        assertEquals(a, b);
        assertEquals(0.25, b.get(0).get(BaseQuantity.CC).value());
    }

    @Test
    void aDuplicatedColumnIsNamed() throws IOException {
        Experiment e = experiment();
        Path f = Files.writeString(tmp.resolve("dup.csv"), "# a comment first\npair,CC,CC\np,0.5,0.5\n");
        InvalidExperimentException ex = assertThrows(InvalidExperimentException.class,
            () -> Claims.read(f, e, e.cases()));
        assertEquals(f + ":2: CC: column appears twice in the header; give each column once", ex.getMessage());
    }

    @Test
    void lineNumbersCountCommentAndBlankLines() throws IOException {
        Experiment e = experiment();
        Path f = Files.writeString(tmp.resolve("c.csv"), "# derived by hand\npair,CC\n# next row\n\np,2\n");
        InvalidExperimentException ex = assertThrows(InvalidExperimentException.class,
            () -> Claims.read(f, e, e.cases()));
        assertTrue(ex.getMessage().contains(f + ":5: CC: is a frequency"), ex.getMessage());
    }

    @Test
    void binaryAndSpecialFilesAreRefusedInOneLine() throws IOException {
        Experiment e = experiment();
        Path bin = tmp.resolve("bin.csv");
        Files.write(bin, new byte[] {'p', 'a', (byte) 0xff, (byte) 0xfe, 0, 1, '\n'});
        InvalidExperimentException ex = assertThrows(InvalidExperimentException.class,
            () -> Claims.read(bin, e, e.cases()));
        assertTrue(ex.getMessage().startsWith(bin + ": file: is not UTF-8 text"), ex.getMessage());
        Path zero = Path.of("/dev/zero");
        if (Files.exists(zero)) {
            ex = assertThrows(InvalidExperimentException.class, () -> Claims.read(zero, e, e.cases()));
            assertTrue(ex.getMessage().contains("is not a regular file"), ex.getMessage());
        }
    }
}
