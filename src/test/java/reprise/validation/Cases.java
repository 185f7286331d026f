package reprise.validation;

import java.util.List;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;

/** The cases on which the simulator and the exact engine meet: both noises, memory one and two, both horizons. */
final class Cases {

    private Cases() {
    }

    /**
     * One case.
     *
     * @param name a readable name
     * @param x X's strategy spec
     * @param y Y's strategy spec
     * @param noise execution and perception errors
     * @param horizon fixed rounds or continuation
     * @param burnIn rounds left out at the start
     * @param games games for the default-run check
     */
    record Case(String name, String x, String y, Noise noise, Horizon horizon, long burnIn, long games) {
        Match match() {
            StageGame g = StageGame.DEFAULT;
            return new Match(g, Strategies.parse(x, g, Player.X), Strategies.parse(y, g, Player.Y), noise);
        }

        @Override
        public String toString() {
            return name;
        }
    }

    static List<Case> all() {
        return List.of(
            new Case("tft vs tft, execution, 50 rounds", "tft", "tft", new Noise(0.05, 0.05, 0, 0), Horizon.rounds(50),
                0, 4000),
            new Case("wsls vs wsls, execution, 100 rounds, burn-in 10", "wsls", "wsls", new Noise(0.02, 0.02, 0, 0),
                Horizon.rounds(100), 10, 3000),
            new Case("gtft vs alld, execution, delta 0.95, burn-in 5", "gtft", "alld", new Noise(0.01, 0.01, 0, 0),
                Horizon.continuation(0.95), 5, 4000),
            new Case("wsls vs tft, perception, delta 0.9", "wsls", "tft", new Noise(0, 0, 0.03, 0.03),
                Horizon.continuation(0.9), 0, 6000),
            new Case("tf2t vs tft, execution, 50 rounds", "tf2t", "tft", new Noise(0.05, 0.05, 0, 0),
                Horizon.rounds(50), 0, 4000),
            new Case("tf2t vs wsls, perception, 50 rounds", "tf2t", "wsls", new Noise(0, 0, 0.05, 0.05),
                Horizon.rounds(50), 0, 4000),
            new Case("grim vs tft, both noises, 200 rounds, burn-in 10", "grim", "tft", Noise.symmetric(0.02, 0.02),
                Horizon.rounds(200), 10, 2000),
            new Case("tf2t vs tf2t, execution, delta 0.97", "tf2t", "tf2t", new Noise(0.02, 0.02, 0, 0),
                Horizon.continuation(0.97), 0, 3000),
            new Case("memory-one pair, execution, 20 rounds", "memory1:0.9,0.2,0.7,0.1", "memory1:0.8,0.3,0.6,0.2",
                new Noise(0.05, 0.05, 0, 0), Horizon.rounds(20), 0, 5000),
            new Case("reactive pair, both noises, delta 0.75", "reactive:0.9,0.2@0.5", "reactive:0.7,0.4",
                Noise.symmetric(0.02, 0.04), Horizon.continuation(0.75), 0, 10000),
            new Case("extortioner vs gtft, execution, 30 rounds, burn-in 3", "extort:chi=3", "gtft",
                new Noise(0.02, 0.02, 0, 0), Horizon.rounds(30), 3, 4000),
            new Case("tf2t vs memory-one, asymmetric execution, delta 0.9, burn-in 2", "tf2t",
                "memory1:0.7,0.1,0.9,0.3", new Noise(0.05, 0.02, 0, 0), Horizon.continuation(0.9), 2, 6000));
    }
}
