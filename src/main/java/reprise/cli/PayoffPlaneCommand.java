package reprise.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.experiment.PayoffClouds;
import reprise.experiment.PayoffPlane;
import reprise.game.Horizon;
import reprise.game.Noise;
import reprise.game.StageGame;
import reprise.output.PayoffPlaneFigure;

/** {@code payoff-plane}: the zero-determinant payoff plane of one strategy against several co-players. */
@Command(name = "payoff-plane", mixinStandardHelpOptions = true,
    description = {"Draws pi_Y against pi_X for a zero-determinant strategy of X: the feasible payoffs of the game, "
        + "the line the strategy enforces, and the exact payoff pair against each co-player for each game length "
        + "(PNG), and with --games the payoffs of simulated single games as clouds. Prints the exact points as CSV: length, co_player, payoff_x, payoff_y, line_y (the line's pi_Y at "
        + "payoff_x) and off_line (payoff_y - line_y)."},
    exitCodeListHeading = "%nExit codes:%n", exitCodeList = {"0:ok", "2:bad input or usage", "3:internal error"})
final class PayoffPlaneCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Option(names = "--x", required = true, paramLabel = "SPEC",
        description = "X's zero-determinant strategy: extort:.., generous:.. or equalizer:..")
    String x;

    @Option(names = "--against", required = true, paramLabel = "SPEC", description = "A co-player; repeat for several.")
    List<String> against;

    @Option(names = "--game", paramLabel = "GAME", defaultValue = "3,0,5,1", description = "Stage game. Default: ${DEFAULT-VALUE}.")
    String game;

    @Option(names = "--noise", paramLabel = "E[,EY]", defaultValue = "0", description = "Execution error. Default: ${DEFAULT-VALUE}.")
    String noise;

    @Option(names = "--misperception", paramLabel = "H[,HY]", defaultValue = "0",
        description = "Perception error. Default: ${DEFAULT-VALUE}.")
    String misperception;

    @Option(names = "--rounds", split = ",", paramLabel = "N", description = "Fixed game lengths, e.g. 2,10,100.")
    List<Long> rounds = new ArrayList<>();

    @Option(names = "--continuation", split = ",", paramLabel = "DELTA", description = "Continuation probabilities.")
    List<Double> continuation = new ArrayList<>();

    @Option(names = "--out", required = true, paramLabel = "FILE", description = "The PNG file to write.")
    Path out;

    @Option(names = "--games", paramLabel = "G", defaultValue = "0", description = "Also play G single games round "
        + "by round per finite length and co-player and draw their payoffs per round as a cloud (0: none). "
        + "Default: ${DEFAULT-VALUE}.")
    int games;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "1", description = "Master seed of the simulated games. "
        + "Default: ${DEFAULT-VALUE}.")
    long seed;

    @Override
    public Integer call() {
        StageGame g;
        try {
            g = StageGame.parse(game);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("--game: " + e.getMessage(), e);
        }
        double[] e = MatchOptions.pair("--noise", noise);
        double[] h = MatchOptions.pair("--misperception", misperception);
        List<Horizon> lengths = new ArrayList<>();
        lengths.add(null);
        for (long n : rounds) {
            if (n < 1) {
                throw new IllegalArgumentException("--rounds must be at least 1: " + n);
            }
            lengths.add(Horizon.rounds(n));
        }
        for (double d : continuation) {
            if (!(d >= 0 && d < 1)) {
                throw new IllegalArgumentException("--continuation must be a probability in [0, 1): " + d);
            }
            lengths.add(Horizon.continuation(d));
        }
        if (games < 0 || games > PayoffClouds.MOST_GAMES) {
            throw new IllegalArgumentException("--games must be between 0 and " + PayoffClouds.MOST_GAMES + ": " + games);
        }
        Noise n = new Noise(e[0], e[1], h[0], h[1]);
        PayoffPlane plane = PayoffPlane.of(g, x, against, n, lengths);
        PayoffClouds clouds = games > 0 && lengths.size() > 1 ? PayoffClouds.play(g, x, against, n, lengths, games, seed)
            : null;
        PayoffPlaneFigure.write(plane, clouds, out);
        PrintWriter w = spec.commandLine().getOut();
        w.println("length,co_player,payoff_x,payoff_y,line_y,off_line");
        for (int k = 0; k < lengths.size(); k++) {
            for (int j = 0; j < against.size(); j++) {
                double px = plane.payoffX()[k][j];
                double py = plane.payoffY()[k][j];
                double ly = plane.lineY(px);
                String co = against.get(j).contains(",") ? '"' + against.get(j) + '"' : against.get(j);
                w.println((lengths.get(k) == null ? "long_run" : lengths.get(k).describe()) + "," + co + "," + px + ","
                    + py + "," + ly + "," + (py - ly));
            }
        }
        return Main.OK;
    }
}
