package reprise.game;

import java.util.Arrays;
import java.util.Locale;

/**
 * What a strategy spec resolved to, for showing to the user: the probability table, the first move and,
 * for the zero-determinant constructors, the parameters used (chi or score, phi and its allowed range,
 * delta).
 *
 * @param label the spec
 * @param kind "table" for a lookup table (reactive, memory-n and the named classics),
 *     "zero-determinant" for the three constructors, "agent" for a user-written agent
 * @param memory the number of rounds the table reads (0 for an agent)
 * @param table the cooperation probabilities in the layout of {@link MemoryStrategy} (own view), empty for
 *     an agent
 * @param firstMove the first-round cooperation probability, NaN for an agent
 * @param zeroDeterminant the constructor's parameters, or null for other strategies
 */
public record StrategyDescription(String label, String kind, int memory, double[] table, double firstMove,
    ZeroDeterminant.Parameters zeroDeterminant) {

    /**
     * Copies the table.
     *
     * @param label spec
     * @param kind kind
     * @param memory memory
     * @param table probabilities
     * @param firstMove p0
     * @param zeroDeterminant parameters or null
     */
    public StrategyDescription {
        table = table.clone();
    }

    /** @return the table (a copy) */
    @Override
    public double[] table() {
        return table.clone();
    }

    /**
     * Describes a strategy parsed from a spec for one player.
     *
     * @param spec the spec
     * @param game the stage game
     * @param player whose strategy it is
     * @return the description
     * @throws IllegalArgumentException as {@link Strategies#parse} does
     */
    public static StrategyDescription of(String spec, StageGame game, Player player) {
        Strategy s = Strategies.parse(spec, game, player);
        if (s instanceof MemoryStrategy m) {
            ZeroDeterminant.Parameters zd = Strategies.zeroDeterminantParameters(spec, game, player);
            return new StrategyDescription(m.label(), zd == null ? "table" : "zero-determinant", m.memory(),
                m.table(), m.initial(), zd);
        }
        return new StrategyDescription(s.label(), "agent", 0, new double[0], Double.NaN, null);
    }

    /**
     * One line for a text report, e.g. {@code first move C w.p. 0; table CC,CD,DC,DD = 0.8,0.5,0.2,0;
     * chi=3, phi=0.038 in (0, 0.077], delta=1}.
     *
     * @return the line
     */
    public String describe() {
        if (kind.equals("agent")) {
            return "user-written agent (no table; simulation only)";
        }
        StringBuilder sb = new StringBuilder();
        sb.append("first move C with probability ").append(Numbers.format(firstMove)).append("; ");
        sb.append(memory == 1 ? "after CC,CD,DC,DD: " : "memory-" + memory + " table (" + table.length + " entries): ");
        sb.append(String.join(",", Arrays.stream(table).mapToObj(Numbers::format).toList()));
        if (zeroDeterminant != null) {
            ZeroDeterminant.Parameters z = zeroDeterminant;
            sb.append("; ").append(z.family()).append(' ');
            sb.append(Double.isNaN(z.chi()) ? "score=" + Numbers.format(z.score()) : "chi=" + Numbers.format(z.chi()));
            sb.append(String.format(Locale.ROOT, ", phi=%s (allowed %s%s, %s]), delta=%s", Numbers.format(z.phi()),
                z.phiLow() > 0 ? "[" : "(", Numbers.format(z.phiLow()), Numbers.format(z.phiHigh()),
                Numbers.format(z.delta())));
        }
        return sb.toString();
    }
}
