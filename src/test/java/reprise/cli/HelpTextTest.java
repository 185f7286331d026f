package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Every command's help is rendered as written: picocli treats descriptions as format strings, so a bare
 * percent sign ("95% intervals") makes it print a warning on stderr and show the raw text.
 */
class HelpTextTest {
    @ParameterizedTest
    @ValueSource(strings = {"check", "merge", "slurm-script", "status", "solve", "simulate", "plan", "calibrate", "plot"})
    void helpRendersWithoutFormatWarnings(String command) {
        PrintStream saved = System.err;
        ByteArrayOutputStream captured = new ByteArrayOutputStream();
        StringWriter out = new StringWriter();
        int code;
        try {
            System.setErr(new PrintStream(captured, true, StandardCharsets.UTF_8));
            code = Main.run(new String[] {command, "--help"}, new PrintWriter(out), new PrintWriter(new StringWriter()));
        } finally {
            System.setErr(saved);
        }
        assertEquals(Main.OK, code, command);
        String warnings = captured.toString(StandardCharsets.UTF_8);
        assertFalse(warnings.contains("WARN"), command + ": " + warnings);
        assertFalse(out.toString().contains("%n"), command + " help shows a raw format string");
    }
}
