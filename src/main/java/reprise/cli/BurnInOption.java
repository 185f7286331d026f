package reprise.cli;

import picocli.CommandLine.Option;
import reprise.game.Horizon;

/** The {@code --burn-in} option and its checks, shared by every command that tallies games after a burn-in. */
final class BurnInOption {

    @Option(names = "--burn-in", paramLabel = "B", defaultValue = "0",
        description = "Rounds at the start of each game left out of the tallies. Default: ${DEFAULT-VALUE}.")
    long burnIn;

    /**
     * @return the burn-in
     * @throws IllegalArgumentException when it is negative
     */
    long checked() {
        if (burnIn < 0) {
            throw new IllegalArgumentException("--burn-in must be at least 0: " + burnIn);
        }
        return burnIn;
    }

    /**
     * @param horizon the horizon the burn-in must fit in
     * @param game how the message names the game of that horizon, e.g. "game" or "predicted game"
     * @return the burn-in
     * @throws IllegalArgumentException when it is negative, or not shorter than a fixed horizon
     */
    long shorterThan(Horizon horizon, String game) {
        long b = checked();
        if (horizon instanceof Horizon.Rounds r && b >= r.count()) {
            throw new IllegalArgumentException("--burn-in must be shorter than the " + game + " (" + r.count()
                + " rounds): " + b);
        }
        return b;
    }
}
