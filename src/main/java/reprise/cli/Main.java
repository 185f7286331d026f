package reprise.cli;

import java.io.PrintWriter;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.IVersionProvider;

/**
 * The {@code reprise} command line.
 *
 * <p>Exit codes: 0 when everything ran and every comparison agrees; 1 when a comparison disagrees;
 * 2 for bad input or usage (one line on stderr naming the option and the value); 3 for an internal error
 * (a bug: please report it with the command line).
 */
@Command(name = "reprise",
    mixinStandardHelpOptions = true,
    versionProvider = Main.Version.class,
    description = {"Checks exact Markov-chain results for repeated 2x2 games against finite, noisy simulations.",
        "Data goes to stdout, messages to stderr."},
    subcommands = {CheckCommand.class, MergeCommand.class, SlurmScriptCommand.class, SolveCommand.class, SolveBatchCommand.class, SweepCommand.class, PayoffPlaneCommand.class,
        SimulateCommand.class, PlanCommand.class,
        CalibrateCommand.class, PlotCommand.class,
        CommandLine.HelpCommand.class},
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {"0:ok, every comparison agrees", "1:a comparison disagrees",
        "2:bad input or usage", "3:internal error"})
public final class Main implements Runnable {

    /** Exit code when everything agrees. */
    public static final int OK = 0;
    /** Exit code when a comparison disagrees. */
    public static final int DISAGREES = 1;
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
        System.exit(run(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
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

    static CommandLine commandLine() {
        CommandLine cl = new CommandLine(new Main());
        cl.getSubcommands().get("calibrate").getCommandSpec().resourceBundle(new CalibrateCommand.Help());
        cl.setCaseInsensitiveEnumValuesAllowed(true);
        cl.setExecutionExceptionHandler((ex, commandLine, parseResult) -> {
            PrintWriter err = commandLine.getErr();
            if (ex instanceof IllegalArgumentException
                && !(ex instanceof org.apache.commons.math3.exception.MathIllegalArgumentException)) {
                err.println("reprise " + commandLine.getCommandName() + ": " + ex.getMessage());
                return BAD_INPUT;
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
