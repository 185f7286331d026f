package reprise.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.experiment.Sweep;
import reprise.experiment.SweepDefinition;
import reprise.experiment.SweepTable;
import reprise.game.Horizon;
import reprise.game.Noise;
import reprise.game.StageGame;
import reprise.output.SweepCsv;
import reprise.output.SweepMaps;

/** {@code sweep}: exact values over a dense grid or a random sample of strategies against fixed co-players. */
@Command(name = "sweep", mixinStandardHelpOptions = true,
    description = {"Solves exactly (no simulation) every match of a family of swept strategies, playing X, against "
        + "each co-player (Y), for each game length, and writes tidy CSV: frequencies, cooperation, payoffs, the "
        + "relation a zero-determinant co-player enforces, and any --relation. Give one family: --reactive, "
        + "--memory-one or --random. An AXIS is a value V or an even grid LO:HI:POINTS."},
    exitCodeListHeading = "%nExit codes:%n", exitCodeList = {"0:ok", "2:bad input or usage", "3:internal error"})
final class SweepCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Option(names = "--reactive", paramLabel = "P_AXIS,Q_AXIS",
        description = "Grid of reactive strategies, e.g. 0:1:101,0:1:101.")
    String reactive;

    @Option(names = "--memory-one", paramLabel = "CC,CD,DC,DD",
        description = "Grid of memory-one strategies, one AXIS per entry (own view), e.g. 0:1:32,0:1:32,0:1:32,0:1:32 "
            + "or 1,0:1:51,0:1:51,0.")
    String memoryOne;

    @Option(names = "--random", paramLabel = "N", description = "N random strategies, uniform on the unit cube.")
    Integer random;

    @Option(names = "--random-kind", paramLabel = "KIND", defaultValue = "memory-one",
        description = "reactive or memory-one. Default: ${DEFAULT-VALUE}.")
    String randomKind;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "1", description = "Seed of --random. Default: ${DEFAULT-VALUE}.")
    long seed;

    @Option(names = "--first-move", paramLabel = "P0", defaultValue = "1",
        description = "First-round cooperation probability of the swept strategies. Default: ${DEFAULT-VALUE}.")
    double firstMove;

    @Option(names = "--against", required = true, paramLabel = "SPEC",
        description = "A co-player (memory-one strategy spec, Y's own view); repeat for several.")
    List<String> against;

    @Option(names = "--game", paramLabel = "GAME", defaultValue = "3,0,5,1", description = "Stage game. Default: ${DEFAULT-VALUE}.")
    String game;

    @Option(names = "--noise", paramLabel = "E[,EY]", defaultValue = "0", description = "Execution error. Default: ${DEFAULT-VALUE}.")
    String noise;

    @Option(names = "--misperception", paramLabel = "H[,HY]", defaultValue = "0",
        description = "Perception error. Default: ${DEFAULT-VALUE}.")
    String misperception;

    @Option(names = "--long-run", description = "Include the long run (the default when no length is given).")
    boolean longRun;

    @Option(names = "--rounds", split = ",", paramLabel = "N", description = "Fixed game lengths, e.g. 10,100,1000.")
    List<Long> rounds = new ArrayList<>();

    @Option(names = "--continuation", split = ",", paramLabel = "DELTA",
        description = "Continuation probabilities, e.g. 0.9,0.99.")
    List<Double> continuation = new ArrayList<>();

    @Option(names = "--relation", paramLabel = "NAME=A,B,C",
        description = "Add a column NAME = A payoff_x + B payoff_y + C; repeat for several.")
    List<String> relation = new ArrayList<>();

    @Option(names = "--threads", paramLabel = "N", defaultValue = "2", description = "Worker threads. Default: ${DEFAULT-VALUE}.")
    int threads;

    @Option(names = "--out", paramLabel = "FILE", description = "Write the CSV here instead of stdout.")
    Path out;

    @Option(names = "--maps", paramLabel = "DIR",
        description = "Draw value maps (heatmap and contour, PNG) of payoff_x, cooperation_x and enforced_residual "
            + "for each co-player and length; needs a grid with exactly two axes of more than one value.")
    Path maps;

    @Override
    public Integer call() throws IOException {
        SweepDefinition d = definition();
        if (threads < 1) {
            throw new IllegalArgumentException("--threads must be at least 1: " + threads);
        }
        SweepTable t = Sweep.run(d, threads);
        if (maps != null) {
            SweepMaps.check(d);
        }
        if (out == null) {
            PrintWriter cliOut = spec.commandLine().getOut();
            SweepCsv.write(t, cliOut, threads);
        } else {
            try (java.io.OutputStream w = new java.io.BufferedOutputStream(Files.newOutputStream(out), 1 << 16)) {
                SweepCsv.write(t, w, threads);
            }
        }
        if (maps != null) {
            List<Path> files = SweepMaps.write(t, maps);
            spec.commandLine().getErr().println("wrote " + files.size() + " value maps to " + maps);
        }
        return Main.OK;
    }

    SweepDefinition definition() {
        int given = (reactive != null ? 1 : 0) + (memoryOne != null ? 1 : 0) + (random != null ? 1 : 0);
        if (given != 1) {
            throw new IllegalArgumentException("give exactly one of --reactive, --memory-one, --random");
        }
        SweepDefinition.Family family;
        if (reactive != null) {
            double[][] ax = axes("--reactive", reactive, 2);
            family = new SweepDefinition.ReactiveGrid(ax[0], ax[1]);
        } else if (memoryOne != null) {
            family = new SweepDefinition.MemoryOneGrid(axes("--memory-one", memoryOne, 4));
        } else {
            boolean r = switch (randomKind) {
                case "reactive" -> true;
                case "memory-one" -> false;
                default -> throw new IllegalArgumentException("--random-kind must be reactive or memory-one: " + randomKind);
            };
            family = new SweepDefinition.RandomStrategies(random, seed, r);
        }
        StageGame g;
        try {
            g = StageGame.parse(game);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("--game: " + e.getMessage(), e);
        }
        double[] e = MatchOptions.pair("--noise", noise);
        double[] h = MatchOptions.pair("--misperception", misperception);
        List<Horizon> lengths = new ArrayList<>();
        if (longRun || (rounds.isEmpty() && continuation.isEmpty())) {
            lengths.add(SweepDefinition.LONG_RUN);
        }
        for (long n : rounds) {
            if (n < 1) {
                throw new IllegalArgumentException("--rounds must be at least 1: " + n);
            }
            lengths.add(Horizon.rounds(n));
        }
        for (double delta : continuation) {
            if (!(delta >= 0 && delta < 1)) {
                throw new IllegalArgumentException("--continuation must be a probability in [0, 1): " + delta);
            }
            lengths.add(Horizon.continuation(delta));
        }
        List<SweepDefinition.Relation> relations = new ArrayList<>();
        for (String r : relation) {
            int eq = r.indexOf('=');
            double[] c = eq < 0 ? null : numbers("--relation " + r, r.substring(eq + 1), 3);
            if (c == null) {
                throw new IllegalArgumentException("--relation is written NAME=A,B,C: " + r);
            }
            relations.add(new SweepDefinition.Relation(r.substring(0, eq).trim(), c[0], c[1], c[2]));
        }
        if (!(firstMove >= 0 && firstMove <= 1)) {
            throw new IllegalArgumentException("--first-move must be a probability in [0, 1]: " + firstMove);
        }
        return new SweepDefinition(g, new Noise(e[0], e[1], h[0], h[1]), family, firstMove, against, lengths,
            relations);
    }

    private static double[][] axes(String option, String text, int count) {
        String[] parts = text.split(",", -1);
        if (parts.length != count) {
            throw new IllegalArgumentException(option + " needs " + count + " axes separated by commas: " + text);
        }
        double[][] out = new double[count][];
        for (int i = 0; i < count; i++) {
            String p = parts[i].trim();
            String[] r = p.split(":", -1);
            if (r.length == 1) {
                out[i] = new double[] {number(option, r[0])};
            } else if (r.length == 3) {
                int points;
                try {
                    points = Integer.parseInt(r[2].trim());
                } catch (NumberFormatException ex) {
                    throw new IllegalArgumentException(option + ": the number of points is not an integer: '" + r[2]
                        + "'", ex);
                }
                if (points < 1) {
                    throw new IllegalArgumentException(option + ": an axis needs at least 1 point: " + p);
                }
                out[i] = SweepDefinition.steps(number(option, r[0]), number(option, r[1]), points);
            } else {
                throw new IllegalArgumentException(option + ": an axis is V or LO:HI:POINTS: '" + p + "'");
            }
        }
        return out;
    }

    private static double[] numbers(String what, String text, int count) {
        String[] parts = text.split(",", -1);
        if (parts.length != count) {
            return null;
        }
        double[] v = new double[count];
        for (int i = 0; i < count; i++) {
            v[i] = number(what, parts[i]);
        }
        return v;
    }

    private static double number(String what, String token) {
        try {
            return Double.parseDouble(token.trim());
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(what + ": not a number: '" + token.trim() + "'", e);
        }
    }
}
