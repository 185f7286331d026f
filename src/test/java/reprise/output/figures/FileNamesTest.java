package reprise.output.figures;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;

class FileNamesTest {

    /** Expected stems worked out by hand from the documented rules (common practice, no source). */
    static Stream<Arguments> names() {
        return Stream.of(
            Arguments.of("tft-vs-alld_e0.01", "tft-vs-alld_e0.01"),
            Arguments.of("TFT vs ALLD, e=0.01", "TFT_vs_ALLD_e_0.01-"),
            Arguments.of("Ünïcödé δ=0.9", "Unicode_0.9-"),
            Arguments.of("a/b\\c:d*e?f\"g<h>i|j", "a_b_c_d_e_f_g_h_i_j-"),
            Arguments.of("..hidden.", "hidden-"),
            Arguments.of("CON", "CON_-"),
            Arguments.of("nul.txt", "nul_.txt-"),
            Arguments.of("δδδ", "case-"));
    }

    @ParameterizedTest
    @MethodSource("names")
    void makesSafeNames(String caseName, String expectedStart) {
        String safe = FileNames.safe(caseName);
        assertTrue(safe.startsWith(expectedStart), safe);
        assertTrue(safe.matches("[A-Za-z0-9._-]+"), safe);
        if (expectedStart.endsWith("-")) {
            assertTrue(safe.matches(".*-[0-9a-f]{8}"), "changed names carry a checksum: " + safe);
        }
        assertEquals(safe, FileNames.safe(safe), "a safe name maps to itself");
    }

    @Test
    void namesThatDifferOnlyInReplacedCharactersStayApart() {
        assertNotEquals(FileNames.safe("e=0.1"), FileNames.safe("e 0.1"));
    }

    @Test
    void capsTheLength() {
        String safe = FileNames.safe("x".repeat(500));
        assertEquals(FileNames.MAX_LENGTH, safe.length());
        assertTrue(safe.matches("x+-[0-9a-f]{8}"), safe);
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "   "})
    void rejectsBlankNames(String blank) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> FileNames.safe(blank));
        assertEquals("case name must not be blank: \"" + blank + "\"", e.getMessage());
    }
}
