package reprise.cli;

import java.io.PrintWriter;
import java.util.List;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.IVersionProvider;

/**
 * The {@code reprise} command line.
 *
 * <p>Exit codes: 0 when everything ran and every comparison agrees; 1 when a comparison disagrees;
 * 2 for bad input or usage (one line on stderr naming the option and the value); 3 when the machine
 * fails the run (a file cannot be written or read: disk full, permissions; out of memory), said in one line,
 * or for an internal error (a bug: please report it with the command line; this one prints a stack trace).
 */
@Command(name = "reprise",
    mixinStandardHelpOptions = true,
    versionProvider = Main.Version.class,
    description = {"Checks exact Markov-chain results for repeated 2x2 games against finite, noisy simulations.",
        "Data goes to stdout, messages to stderr."},
    subcommands = {CheckCommand.class, MergeCommand.class, SlurmScriptCommand.class, StatusCommand.class,
        SolveCommand.class, SolveBatchCommand.class, SweepCommand.class, PayoffPlaneCommand.class,
        SimulateCommand.class, PlanCommand.class,
        CalibrateCommand.class, PlotCommand.class,
        CommandLine.HelpCommand.class},
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {"0:ok, every comparison agrees", "1:a comparison disagrees",
        "2:bad input or usage", "3:the machine failed the run (disk full, out of memory, ...) or internal error"})
public final class Main implements Runnable {

    /** Exit code when everything agrees (the code a finished run records in run.json). */
    public static final int OK = reprise.run.Finished.AGREES;
    /** Exit code when a comparison disagrees (the code a finished run records in run.json). */
    public static final int DISAGREES = reprise.run.Finished.DISAGREES;
    /** Exit code for bad input or usage. */
    public static final int BAD_INPUT = 2;
    /** Exit code for an internal error. */
    public static final int INTERNAL = 3;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(), "a command is required");
    }

    /**
     * Runs the command line and exits with its code.
     *
     * @param args the arguments
     */
    public static void main(String[] args) {
        int code;
        try {
            code = run(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true));
        } catch (OutOfMemoryError e) {
            System.err.println(outOfMemory());
            code = INTERNAL;
        }
        System.exit(code);
    }

    private static String outOfMemory() {
        return String.format(java.util.Locale.ROOT, "reprise: out of memory (the Java heap is limited to %d MB): "
            + "give java a larger -Xmx, or make the run smaller", Runtime.getRuntime().maxMemory() >> 20);
    }

    /**
     * Runs the command line with the given output streams, without exiting (for tests and embedding).
     *
     * @param args the arguments
     * @param out where data goes
     * @param err where messages go
     * @return the exit code
     */
    public static int run(String[] args, PrintWriter out, PrintWriter err) {
        CommandLine cl = commandLine();
        cl.setOut(out);
        cl.setErr(err);
        int code = cl.execute(args);
        out.flush();
        err.flush();
        return code;
    }

    /** Holds a file name's dot to its extension while help text is wrapped; removed from the printed help. */
    private static final String GLUE = "\uFEFF";
    private static final java.util.regex.Pattern FILE_DOT = java.util.regex.Pattern.compile(
        "(?<=[\\w-])\\.(?=(json|csv|md|yaml|png|svg|pdf|eps)\\b)");

    /**
     * picocli wraps help text with the JDK's line breaker, which allows a break after any full stop, so that
     * "run.json" could be printed as "run." and "json" on the next line. A zero-width no-break space after
     * such a dot keeps the name whole while wrapping, and is taken out of the printed help again.
     */
    private static void keepFileNamesWhole(CommandLine c) {
        CommandSpec spec = c.getCommandSpec();
        spec.usageMessage().description(glue(spec.usageMessage().description()));
        for (CommandLine.Model.OptionSpec o : List.copyOf(spec.options())) {
            String[] glued = glue(o.description());
            if (!java.util.Arrays.equals(glued, o.description())) {
                spec.remove(o);
                spec.addOption(o.toBuilder().description(glued).build());
            }
        }
        c.getHelpSectionMap().replaceAll((key, renderer) -> help -> renderer.render(help).replace(GLUE, ""));
        c.getSubcommands().values().forEach(Main::keepFileNamesWhole);
    }

    private static String[] glue(String[] lines) {
        String[] out = lines.clone();
        for (int i = 0; i < out.length; i++) {
            out[i] = FILE_DOT.matcher(out[i]).replaceAll("." + GLUE);
        }
        return out;
    }

    static CommandLine commandLine() {
        CommandLine cl = new CommandLine(new Main());
        cl.getSubcommands().get("calibrate").getCommandSpec().resourceBundle(new CalibrateCommand.Help());
        cl.setCaseInsensitiveEnumValuesAllowed(true);
        cl.registerConverter(java.nio.file.Path.class, Main::path);
        keepFileNamesWhole(cl);
        cl.setExecutionExceptionHandler((ex, commandLine, parseResult) -> {
            PrintWriter err = commandLine.getErr();
            if (ex instanceof IllegalArgumentException
                && !(ex instanceof org.apache.commons.math3.exception.MathIllegalArgumentException)) {
                err.println("reprise " + commandLine.getCommandName() + ": " + ex.getMessage());
                return BAD_INPUT;
            }
            Throwable io = ioCause(ex);
            if (io != null) {
                err.println("reprise " + commandLine.getCommandName() + ": " + io.getMessage());
                return INTERNAL;
            }
            if (ex.getCause() instanceof OutOfMemoryError) {
                err.println(outOfMemory());
                return INTERNAL;
            }
            err.println("reprise " + commandLine.getCommandName() + ": internal error: " + ex);
            ex.printStackTrace(err);
            return INTERNAL;
        });
        cl.setParameterExceptionHandler((ex, args) -> {
            CommandLine c = ex.getCommandLine();
            String suggestions = "";
            if (ex instanceof CommandLine.UnmatchedArgumentException u && !u.getSuggestions().isEmpty()) {
                suggestions = "; did you mean " + String.join(" or ", u.getSuggestions()) + "?";
            }
            c.getErr().println((c.getParent() == null ? "reprise" : "reprise " + c.getCommandName()) + ": "
                + ex.getMessage() + suggestions + " (see 'reprise "
                + (c.getParent() == null ? "" : c.getCommandName() + " ") + "--help')");
            return BAD_INPUT;
        });
        return cl;
    }

    /**
     * Every path on the command line (files, --out, --script, --merge): an empty one is refused, since it
     * would silently mean the current folder.
     */
    private static java.nio.file.Path path(String text) {
        if (text.isBlank()) {
            throw new CommandLine.TypeConversionException("must name a file or folder, not be empty");
        }
        return java.nio.file.Path.of(text);
    }

    /**
     * @param ex a failure
     * @return the I/O failure it is (or wraps, possibly inside a worker thread's exception), or null
     */
    private static Throwable ioCause(Throwable ex) {
        for (Throwable t = ex; t != null; t = t.getCause()) {
            if (t instanceof java.io.UncheckedIOException || t instanceof java.io.IOException) {
                return t;
            }
        }
        return null;
    }

    /** Reads the version from the jar manifest, falling back to "development" when run from classes. */
    static final class Version implements IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"reprise " + version(), "Java " + System.getProperty("java.version")};
        }
    }

    /** @return the tool version, or "development" when not run from the jar */
    public static String version() {
        String v = Main.class.getPackage().getImplementationVersion();
        return v == null ? "development" : v;
    }
}
