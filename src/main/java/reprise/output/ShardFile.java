package reprise.output;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import reprise.experiment.WorkPlan;
import reprise.sim.SimulationResult;
import reprise.sim.TallyFile;

/**
 * The partial results of one shard of a sharded run: {@code OUT/shards/shard-I-of-N.json}, written
 * atomically (complete or absent). It holds the tallies of the shard's units and what is needed to check
 * that shards belong together, but no verdicts: those come from the merge, after all tallies are added.
 *
 * <p>Format {@value #FORMAT}: a JSON object with {@code format}, {@code experiment_file} (absolute path),
 * {@code experiment_sha256}, {@code claims_file} and {@code claims_sha256} (null without claims),
 * {@code seed}, {@code tool_version}, {@code shard} (I, from 1), {@code shards} (N), {@code units_total}
 * (units of the whole experiment), {@code threads}, {@code seconds} (simulation wall time) and
 * {@code units}: one object per unit of the shard, in plan order, with {@code case_index}, {@code chunk},
 * {@code from}, {@code to} (game indexes, {@code to} exclusive) and {@code tally} (a
 * {@link TallyFile} object).
 */
public final class ShardFile {

    /** The format identifier. */
    public static final String FORMAT = "reprise-shard-1";
    /** The folder of shard files inside the output folder. */
    public static final String FOLDER = "shards";
    private static final ObjectMapper MAPPER = new ObjectMapper();

    private ShardFile() {
    }

    /**
     * What identifies a shard and the run it belongs to.
     *
     * @param experimentFile the experiment file, absolute
     * @param experimentSha256 its SHA-256, hex
     * @param claimsFile the claims file, or null
     * @param claimsSha256 its SHA-256, or null
     * @param seed the experiment's seed
     * @param toolVersion the tool version that simulated the shard
     * @param shard I, from 1 to N
     * @param shards N
     * @param unitsTotal the number of units of the whole experiment
     * @param threads worker threads used
     * @param seconds simulation wall time
     */
    public record Header(Path experimentFile, String experimentSha256, Path claimsFile, String claimsSha256, long seed,
        String toolVersion, int shard, int shards, int unitsTotal, int threads, double seconds) {
    }

    /**
     * One unit's tallies.
     *
     * @param caseIndex the case
     * @param chunk the chunk within the case
     * @param from first game index
     * @param to one past the last game index
     * @param tally the tallies of games [from, to)
     */
    public record UnitTally(int caseIndex, int chunk, long from, long to, SimulationResult tally) {
        /**
         * @param u a unit of the plan
         * @return whether this entry is that unit (same case, chunk and games)
         */
        public boolean is(WorkPlan.Unit u) {
            return caseIndex == u.caseIndex() && chunk == u.chunk() && from == u.from() && to == u.to();
        }
    }

    /**
     * A shard file's content.
     *
     * @param header the header
     * @param units the unit tallies, in plan order
     */
    public record Shard(Header header, List<UnitTally> units) {
    }

    /**
     * The file name of shard i of n.
     *
     * @param shard i
     * @param shards n
     * @return e.g. {@code shard-3-of-8.json}
     */
    public static String fileName(int shard, int shards) {
        return String.format(Locale.ROOT, "shard-%d-of-%d.json", shard, shards);
    }

    /**
     * Writes a shard file atomically, replacing an earlier one of the same name.
     *
     * @param target the file
     * @param shard the content
     */
    public static void write(Path target, Shard shard) {
        Header h = shard.header();
        ObjectNode o = MAPPER.createObjectNode();
        o.put("format", FORMAT);
        o.put("experiment_file", h.experimentFile().toString());
        o.put("experiment_sha256", h.experimentSha256());
        if (h.claimsFile() == null) {
            o.putNull("claims_file");
        } else {
            o.put("claims_file", h.claimsFile().toString());
        }
        if (h.claimsSha256() == null) {
            o.putNull("claims_sha256");
        } else {
            o.put("claims_sha256", h.claimsSha256());
        }
        o.put("seed", h.seed());
        o.put("tool_version", h.toolVersion());
        o.put("shard", h.shard());
        o.put("shards", h.shards());
        o.put("units_total", h.unitsTotal());
        o.put("threads", h.threads());
        o.put("seconds", h.seconds());
        ArrayNode units = o.putArray("units");
        for (UnitTally u : shard.units()) {
            ObjectNode n = units.addObject();
            n.put("case_index", u.caseIndex());
            n.put("chunk", u.chunk());
            n.put("from", u.from());
            n.put("to", u.to());
            n.set("tally", TallyFile.toJson(u.tally()));
        }
        AtomicFiles.writeText(target, w -> w.write(MAPPER.writeValueAsString(o)));
    }

    /**
     * Reads a shard file.
     *
     * @param file the file
     * @return its content
     * @throws IllegalArgumentException naming the file, if it cannot be read or is not a valid shard file
     */
    public static Shard read(Path file) {
        JsonNode o;
        try {
            o = MAPPER.readTree(file.toFile());
        } catch (com.fasterxml.jackson.core.JsonProcessingException ex) {
            throw new IllegalArgumentException(file + ": cannot be read as a shard file: "
                + ex.getOriginalMessage().replaceAll("\\s*\\R\\s*", " "), ex);
        } catch (IOException ex) {
            throw new IllegalArgumentException(file + ": cannot be read: " + ex.getMessage(), ex);
        }
        if (o == null || !FORMAT.equals(o.path("format").asText())) {
            throw new IllegalArgumentException(file + ": not a " + FORMAT + " shard file (format: "
                + (o == null ? "none" : o.path("format").asText("none")) + ")");
        }
        for (String f : List.of("experiment_file", "experiment_sha256", "seed", "tool_version", "shard", "shards",
            "units_total", "units")) {
            if (!o.hasNonNull(f)) {
                throw new IllegalArgumentException(file + ": shard file without " + f);
            }
        }
        try {
            Header h = new Header(Path.of(o.get("experiment_file").asText()), o.get("experiment_sha256").asText(),
                o.hasNonNull("claims_file") ? Path.of(o.get("claims_file").asText()) : null,
                o.hasNonNull("claims_sha256") ? o.get("claims_sha256").asText() : null, o.get("seed").asLong(),
                o.get("tool_version").asText(), o.get("shard").asInt(), o.get("shards").asInt(),
                o.get("units_total").asInt(), o.path("threads").asInt(1), o.path("seconds").asDouble(Double.NaN));
            List<UnitTally> units = new ArrayList<>();
            for (JsonNode n : o.get("units")) {
                units.add(new UnitTally(n.path("case_index").asInt(-1), n.path("chunk").asInt(-1),
                    n.path("from").asLong(-1), n.path("to").asLong(-1), TallyFile.fromJson(n.get("tally"))));
            }
            return new Shard(h, List.copyOf(units));
        } catch (IllegalArgumentException ex) {
            throw new IllegalArgumentException(file + ": " + ex.getMessage(), ex);
        }
    }
}
