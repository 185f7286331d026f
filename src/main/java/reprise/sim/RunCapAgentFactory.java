package reprise.sim;

import java.util.List;

/**
 * Factory of the example agent {@code agent:runcap[,K[,G]]} (see the rule in the agent's description:
 * retaliate against a seen defection, but forgive after K consecutive own defections; cooperate anyway
 * with probability G). K is an integer of at least 1 (default 2), G a probability in [0, 1] (default 0).
 * Registered through {@code META-INF/services/reprise.sim.AgentFactory}.
 */
public final class RunCapAgentFactory implements AgentFactory {

    /** Creates the factory (used by {@link java.util.ServiceLoader}). */
    public RunCapAgentFactory() {
    }

    @Override
    public String name() {
        return "runcap";
    }

    @Override
    public String usage() {
        return "agent:runcap[,K[,G]] with K >= 1 the longest run of own retaliations (default 2) and G in "
            + "[0, 1] the chance to cooperate anyway after a seen defection (default 0)";
    }

    @Override
    public Agent create(List<String> arguments) {
        if (arguments.size() > 2) {
            throw new IllegalArgumentException("agent runcap takes at most 2 arguments (K, G), got "
                + arguments.size() + ": " + String.join(",", arguments) + "; usage: " + usage());
        }
        int k = 2;
        if (!arguments.isEmpty()) {
            String a = arguments.get(0);
            try {
                k = Integer.parseInt(a.trim());
            } catch (NumberFormatException e) {
                throw new IllegalArgumentException("agent runcap: K must be a whole number of at least 1: '" + a
                    + "'", e);
            }
            if (k < 1) {
                throw new IllegalArgumentException("agent runcap: K must be a whole number of at least 1: " + k);
            }
        }
        double g = 0;
        if (arguments.size() == 2) {
            String a = arguments.get(1);
            try {
                g = Double.parseDouble(a.trim());
            } catch (NumberFormatException e) {
                throw new IllegalArgumentException("agent runcap: G must be a probability in [0, 1]: '" + a + "'",
                    e);
            }
            if (!(g >= 0 && g <= 1)) {
                throw new IllegalArgumentException("agent runcap: G must be a probability in [0, 1]: " + a.trim());
            }
        }
        return new RunCapAgent(k, g);
    }
}
