package reprise.output;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.concurrent.TimeUnit;

/**
 * {@code run.json}: what produced the results, so that a reader can reproduce them: tool version and
 * commit (when the tool runs from a git checkout), Java and OS, seeds and generator, input hashes, times.
 */
public final class Provenance {
    private static final ObjectMapper MAPPER = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    private Provenance() {
    }

    /**
     * What a run was.
     *
     * @param toolVersion the tool's version
     * @param commandLine the arguments
     * @param experimentFile the experiment file
     * @param experimentSha256 its hash
     * @param claimsFile the claims file or null
     * @param claimsSha256 its hash or null
     * @param seed the experiment's seed
     * @param generator the generator's name
     * @param seedDerivation how case and game streams derive from the seed
     * @param threads worker threads
     * @param cases number of cases
     * @param roundsTotal tallied rounds over all cases
     * @param start when the run started
     * @param end when it ended
     * @param exitCode the exit code
     * @param outputs the files written, relative to the output folder
     */
    public record Run(String toolVersion, List<String> commandLine, Path experimentFile, String experimentSha256,
        Path claimsFile, String claimsSha256, long seed, String generator, String seedDerivation, int threads,
        int cases, long roundsTotal, Instant start, Instant end, int exitCode, List<String> outputs) {
    }

    /**
     * Writes run.json atomically.
     *
     * @param file the target
     * @param run the run
     */
    public static void write(Path file, Run run) {
        ObjectNode o = MAPPER.createObjectNode();
        o.put("tool", "reprise");
        o.put("tool_version", run.toolVersion());
        String[] commit = gitCommit();
        if (commit == null) {
            o.putNull("tool_commit");
        } else {
            o.put("tool_commit", commit[0]);
            o.put("tool_commit_dirty", commit[1].equals("dirty"));
        }
        o.put("java_version", System.getProperty("java.version"));
        o.put("java_vendor", System.getProperty("java.vendor"));
        o.put("os", System.getProperty("os.name") + " " + System.getProperty("os.version"));
        o.put("arch", System.getProperty("os.arch"));
        o.put("cores", Runtime.getRuntime().availableProcessors());
        o.put("threads", run.threads());
        ArrayNode args = o.putArray("command_line");
        run.commandLine().forEach(args::add);
        o.put("experiment_file", run.experimentFile().toString());
        o.put("experiment_sha256", run.experimentSha256());
        if (run.claimsFile() == null) {
            o.putNull("claims_file");
            o.putNull("claims_sha256");
        } else {
            o.put("claims_file", run.claimsFile().toString());
            o.put("claims_sha256", run.claimsSha256());
        }
        o.put("seed", run.seed());
        o.put("generator", run.generator());
        o.put("seed_derivation", run.seedDerivation());
        o.put("cases", run.cases());
        o.put("rounds_total", run.roundsTotal());
        o.put("start", run.start().toString());
        o.put("end", run.end().toString());
        o.put("wall_seconds", Duration.between(run.start(), run.end()).toMillis() / 1000.0);
        o.put("exit_code", run.exitCode());
        ArrayNode outs = o.putArray("outputs");
        run.outputs().forEach(outs::add);
        AtomicFiles.writeText(file, w -> w.write(MAPPER.writeValueAsString(o) + "\n"));
    }

    /** @return {commit, "clean"|"dirty"} of the checkout the tool runs from, or null when unknown */
    static String[] gitCommit() {
        try {
            Path where = Path.of(Provenance.class.getProtectionDomain().getCodeSource().getLocation().toURI());
            Path dir = Files.isDirectory(where) ? where : where.getParent();
            String head = git(dir, "rev-parse", "HEAD");
            if (head == null || !head.matches("[0-9a-f]{40}")) {
                return null;
            }
            String status = git(dir, "status", "--porcelain", "--untracked-files=no");
            return new String[] {head, status == null || status.isEmpty() ? "clean" : "dirty"};
        } catch (RuntimeException | java.net.URISyntaxException e) {
            return null;
        }
    }

    private static String git(Path dir, String... args) {
        try {
            String[] cmd = new String[args.length + 3];
            cmd[0] = "git";
            cmd[1] = "-C";
            cmd[2] = dir.toString();
            System.arraycopy(args, 0, cmd, 3, args.length);
            Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
            p.getOutputStream().close();
            String out;
            try (InputStream in = p.getInputStream()) {
                out = new String(in.readAllBytes(), StandardCharsets.UTF_8).trim();
            }
            if (!p.waitFor(5, TimeUnit.SECONDS) || p.exitValue() != 0) {
                p.destroyForcibly();
                return null;
            }
            return out;
        } catch (IOException e) {
            return null;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return null;
        }
    }
}
