package reprise.sim;

import java.util.List;

/**
 * Creates user-written agents for strategy specs {@code agent:NAME[,ARG...]}.
 *
 * <p>Factories are found with {@link java.util.ServiceLoader}: put the implementation on the class path
 * with a public no-argument constructor and list its binary name in a file
 * {@code META-INF/services/reprise.sim.AgentFactory}, one class per line. The spec's NAME is matched
 * against {@link #name()} ignoring case. The simulator calls {@link #create(List)} once when a run is
 * set up (so bad arguments are reported before any work) and then once per worker thread.
 */
public interface AgentFactory {

    /** @return the name used in specs, e.g. {@code runcap} for {@code agent:runcap,2} */
    String name();

    /** @return a one-line description of the arguments, shown when a spec is wrong */
    String usage();

    /**
     * Creates a fresh agent.
     *
     * @param arguments the spec's arguments after the name, trimmed, in order
     * @return a new agent
     * @throws IllegalArgumentException with a one-line message naming the bad argument and its value
     */
    Agent create(List<String> arguments);
}
