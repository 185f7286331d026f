package reprise.game;

import java.util.List;

/**
 * A user-written agent, named by its spec {@code agent:NAME[,ARG...]}, played only by the simulator.
 *
 * <p>The game model does not know what such an agent does; the simulator looks the name up among the
 * agents it can load. The exact engine refuses it with a plain message, because no Markov chain of
 * bounded memory is known for it.
 *
 * @param name the agent's registered name
 * @param arguments its arguments as given, in order
 */
public record CustomStrategy(String name, List<String> arguments) implements Strategy {
    /**
     * Validates the name and copies the arguments.
     *
     * @param name the agent's name, not blank
     * @param arguments its arguments
     */
    public CustomStrategy {
        if (name == null || name.isBlank()) {
            throw new IllegalArgumentException("agent name is empty: use agent:NAME[,ARG...]");
        }
        arguments = List.copyOf(arguments);
    }

    @Override
    public String label() {
        return arguments.isEmpty() ? "agent:" + name : "agent:" + name + "," + String.join(",", arguments);
    }
}
