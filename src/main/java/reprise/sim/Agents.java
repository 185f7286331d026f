package reprise.sim;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.ServiceLoader;
import java.util.TreeMap;
import reprise.game.CustomStrategy;
import reprise.game.MemoryStrategy;
import reprise.game.Strategy;

/**
 * Turns strategies into agents.
 *
 * <p>Every {@link MemoryStrategy} (reactive, memory-one, memory-n, the named classics and the
 * zero-determinant strategies) becomes a table agent whose record is its own-view history index. A
 * {@link CustomStrategy} {@code agent:NAME[,ARG...]} is looked up among the {@link AgentFactory}
 * implementations found by {@link ServiceLoader} (the shipped one is {@code runcap}).
 */
public final class Agents {

    private Agents() {
    }

    /**
     * A fresh agent for a strategy.
     *
     * @param strategy a memory strategy or a custom agent spec
     * @return a new agent, not yet started
     * @throws IllegalArgumentException for an unknown agent name (the message lists the known names) or
     *     arguments the agent's factory refuses
     */
    public static Agent create(Strategy strategy) {
        if (strategy instanceof MemoryStrategy m) {
            return new MemoryAgent(m);
        }
        CustomStrategy c = (CustomStrategy) strategy;
        return factory(c.name()).create(c.arguments());
    }

    /**
     * The factory registered under a name.
     *
     * @param name the agent name, any case
     * @return its factory
     * @throws IllegalArgumentException if no factory has that name; the message lists the known names
     */
    public static AgentFactory factory(String name) {
        AgentFactory f = factories().get(name.toLowerCase(Locale.ROOT));
        if (f == null) {
            throw new IllegalArgumentException("unknown agent '" + name + "'; known agents: "
                + String.join(", ", knownNames())
                + " (add one through META-INF/services/" + AgentFactory.class.getName() + ")");
        }
        return f;
    }

    /** @return the names of all loadable agents, sorted */
    public static List<String> knownNames() {
        return new ArrayList<>(factories().keySet());
    }

    private static Map<String, AgentFactory> factories() {
        Map<String, AgentFactory> map = new TreeMap<>();
        ClassLoader loader = Thread.currentThread().getContextClassLoader();
        ServiceLoader<AgentFactory> sl = ServiceLoader.load(AgentFactory.class,
            loader != null ? loader : Agents.class.getClassLoader());
        for (AgentFactory f : sl) {
            map.putIfAbsent(f.name().toLowerCase(Locale.ROOT), f);
        }
        if (!map.containsKey("runcap")) {
            map.put("runcap", new RunCapAgentFactory());
        }
        return map;
    }
}
