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

    /**
     * picocli wraps descriptions at sentence ends, a full stop followed by a space: a file name such as
     * "run.json" must never come out as "run. json", at any terminal width.
     */
    @ParameterizedTest
    @ValueSource(strings = {"check", "merge", "slurm-script", "solve", "simulate", "plan", "calibrate", "plot"})
    void fileNamesAreNeverSplitAtTheirDot(String command) {
        picocli.CommandLine cl = Main.commandLine().getSubcommands().get(command);
        java.util.regex.Pattern split = java.util.regex.Pattern.compile(
            "\\b(run|cases|results|curves|report|calibration|manifest|shard-I-of-N)\\.\\s+(json|csv|md)\\b");
        for (int width = 55; width <= 160; width++) {
            cl.setUsageHelpWidth(width);
            String help = cl.getUsageMessage(picocli.CommandLine.Help.Ansi.OFF);
            java.util.regex.Matcher m = split.matcher(help);
            assertFalse(m.find(), command + " at width " + width + ": " + (m.find(0) ? m.group() : ""));
        }
    }

    /** The usage line of an option with a list value reads as one list, not a nested repetition. */
    @ParameterizedTest
    @ValueSource(strings = {"simulate", "calibrate", "plan"})
    void snapshotOptionReadsWell(String command) {
        String help = Main.commandLine().getSubcommands().get(command).getUsageMessage(picocli.CommandLine.Help.Ansi.OFF);
        assertFalse(help.contains("......"), command + ": " + help);
        assertFalse(help.contains("[,t1"), command + ": " + help);
    }
}
