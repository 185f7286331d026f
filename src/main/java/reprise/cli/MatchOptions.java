package reprise.cli;

import picocli.CommandLine.Option;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;

/** The options that define a match and a horizon, shared by every command that plays or solves a game. */
final class MatchOptions {

    @Option(names = "--x", required = true, paramLabel = "SPEC",
        description = "Strategy of player X, e.g. tft, gtft, wsls, reactive:0.9,0.2, memory1:1,0,0,1@1, "
            + "extort:chi=3,phi=0.05. First move C unless @P0 says otherwise (alld and stft: D; extort: always D; "
            + "generous: always C).")
    String x;

    @Option(names = "--y", required = true, paramLabel = "SPEC", description = "Strategy of player Y (in its own view).")
    String y;

    @Option(names = "--game", paramLabel = "GAME", defaultValue = "3,0,5,1",
        description = "Stage game: R,S,T,P (symmetric), 8 numbers (X's four then Y's four, own view first), "
            + "or pd[:R,S,T,P], donation:b,c, snowdrift:b,c, staghunt:R,S,T,P. Default: ${DEFAULT-VALUE}.")
    String game;

    @Option(names = "--noise", paramLabel = "E[,EY]", defaultValue = "0",
        description = "Execution error: probability that a realised move is the opposite of the intended one; "
            + "one value for both players or X's,Y's. Default: ${DEFAULT-VALUE}.")
    String noise;

    @Option(names = "--misperception", paramLabel = "H[,HY]", defaultValue = "0",
        description = "Perception error: probability that a player misreads the co-player's move; one value or "
            + "X's,Y's. Default: ${DEFAULT-VALUE}.")
    String misperception;

    @Option(names = "--rounds", paramLabel = "N", description = "Fixed number of rounds per game (at least 1).")
    Long rounds;

    @Option(names = "--continuation", paramLabel = "DELTA",
        description = "Random length: after each round another follows with probability DELTA in [0, 1).")
    Double continuation;

    StageGame stageGame() {
        try {
            return StageGame.parse(game);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("--game: " + e.getMessage(), e);
        }
    }

    Match match() {
        StageGame g = stageGame();
        double[] e = pair("--noise", noise);
        double[] h = pair("--misperception", misperception);
        return new Match(g, strategy("--x", x, g, Player.X), strategy("--y", y, g, Player.Y),
            new Noise(e[0], e[1], h[0], h[1]));
    }

    /**
     * @param command the command that needs a horizon, for the message
     * @return the horizon given
     * @throws IllegalArgumentException when none was given
     */
    Horizon requiredHorizon(String command) {
        Horizon h = horizonOrNull();
        if (h == null) {
            throw new IllegalArgumentException(command + " needs --rounds N or --continuation DELTA");
        }
        return h;
    }

    /** @return the horizon given, or null when none was */
    Horizon horizonOrNull() {
        if (rounds != null && continuation != null) {
            throw new IllegalArgumentException("give --rounds or --continuation, not both");
        }
        if (rounds != null) {
            if (rounds < 1) {
                throw new IllegalArgumentException("--rounds must be at least 1: " + rounds);
            }
            return Horizon.rounds(rounds);
        }
        if (continuation == null) {
            return null;
        }
        double d = continuation;
        if (!(d >= 0 && d < 1)) {
            throw new IllegalArgumentException("--continuation must be a probability in [0, 1): " + d);
        }
        return Horizon.continuation(d);
    }

    private static reprise.game.Strategy strategy(String option, String spec, StageGame g, Player p) {
        try {
            return Strategies.parse(spec, g, p);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException(option + ": " + e.getMessage(), e);
        }
    }

    static double[] pair(String option, String text) {
        String[] parts = text.split(",", -1);
        if (parts.length < 1 || parts.length > 2) {
            throw new IllegalArgumentException(option + " takes one probability or two (X's,Y's): " + text);
        }
        double[] v = new double[2];
        for (int i = 0; i < parts.length; i++) {
            double d;
            try {
                d = Double.parseDouble(parts[i].trim());
            } catch (NumberFormatException ex) {
                throw new IllegalArgumentException(option + " is not a number: '" + parts[i].trim() + "'", ex);
            }
            if (!(d >= 0 && d <= 1)) {
                throw new IllegalArgumentException(option + " must be a probability in [0, 1]: " + parts[i].trim());
            }
            v[i] = d;
        }
        if (parts.length == 1) {
            v[1] = v[0];
        }
        return v;
    }
}
