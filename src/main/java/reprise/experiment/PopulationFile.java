package reprise.experiment;

import java.io.IOException;
import java.nio.file.Path;
import org.yaml.snakeyaml.nodes.Node;

/**
 * Reads population experiment files: experiment files whose top level has a {@code population:} section
 * (README.md, "Population experiments"). Problems are reported as {@link ExperimentFile} reports them, all
 * at once, one line each as {@code file:line: field: message}.
 */
public final class PopulationFile {

    private PopulationFile() {
    }

    /**
     * Whether a file is a population experiment. A file that cannot be read or composed is not (its
     * problems are then reported by {@link ExperimentFile#read}).
     *
     * @param file the YAML file
     * @return whether its top level is a mapping with a {@code population:} key
     */
    public static boolean declares(Path file) {
        try {
            byte[] bytes = InputFiles.bytes(file, "experiment file", InputFiles.MOST_EXPERIMENT_BYTES);
            Problems problems = new Problems(file.toString());
            Node root = YamlReader.compose(InputFiles.decode(bytes, "experiment file"), problems);
            return problems.isEmpty() && PopulationSchema.declares(root);
        } catch (IOException | RuntimeException e) {
            return false;
        }
    }

    /**
     * Reads a population experiment file.
     *
     * @param file the YAML file
     * @return the validated experiment
     * @throws InvalidExperimentException listing every problem with file, line and field
     */
    public static PopulationExperiment read(Path file) {
        Problems problems = new Problems(file.toString());
        ExperimentFile.Source source = ExperimentFile.source(file, problems);
        byte[] bytes = source.bytes();
        String text = source.text();
        Node root = YamlReader.compose(text, problems);
        problems.throwIfAny();
        if (!PopulationSchema.declares(root)) {
            problems.add(0, "population", "is required in a population experiment");
            problems.throwIfAny();
        }
        PopulationExperiment e = PopulationSchema.read(file, root, ExperimentFile.sha256(bytes), problems);
        return e.claimsFile() == null ? e : e.withClaims(e.claimsFile(), PopulationClaims.read(e.claimsFile(), e));
    }
}
