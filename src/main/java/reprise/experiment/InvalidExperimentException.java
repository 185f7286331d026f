package reprise.experiment;

import java.util.List;

/**
 * Thrown when an experiment file or its claims file has problems; carries one line per problem, each
 * naming the file, the line and the field.
 */
public final class InvalidExperimentException extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;

    /** The problems, one line each. */
    private final List<String> problems;

    /**
     * Creates the exception.
     *
     * @param problems one line per problem, at least one
     */
    public InvalidExperimentException(List<String> problems) {
        super(String.join(System.lineSeparator(), problems));
        this.problems = List.copyOf(problems);
    }

    /** @return the problems, one line each, in file order */
    public List<String> problems() {
        return problems;
    }
}
