package reprise.run;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import reprise.output.AtomicFiles;
import reprise.sim.SimulationResult;
import reprise.sim.TallyFile;

/**
 * The one file format for saved tallies: a checkpoint unit ({@code OUT/.checkpoint/case-C-chunk-K.json},
 * one unit) and a shard ({@code OUT/shards/shard-I-of-N.json}, all units of shard I) are both unit files.
 * A file is written atomically (complete or absent) and holds exact integer tallies, so units read back
 * merge into bit-identical numbers; it holds no verdicts.
 *
 * <p>Format {@value #FORMAT}: a JSON object with {@code format}; the run's identity
 * ({@link RunIdentity}): {@code experiment_file}, {@code experiment_sha256}, {@code claims_file} and
 * {@code claims_sha256} (null without claims), {@code seed}, {@code tool_version}; the part
 * ({@link Part}): {@code shard} (I, from 1) and {@code shards} (N); {@code units_total} (units of the
 * whole experiment), {@code threads}, {@code seconds} (simulation wall time, NaN if unknown),
 * {@code build} (the jar's or class folder's SHA-256 and the git commit, {@link Build}; absent in files
 * written before it was recorded) and
 * {@code units}: one object per unit, in plan order, with {@code case_index}, {@code chunk}, {@code from},
 * {@code to} (game indexes, {@code to} exclusive) and {@code tally} (the simulator's exact tally object,
 * {@link TallyFile}).
 *
 * <p>Room to grow: a checksum of the file's body would be one more top-level field, checked in
 * {@link #read}; a unit cut by game-index ranges finer than today's is already described by its
 * {@code from} and {@code to}, which is what readers compare.
 */
public final class UnitFile {

    /** The format identifier. */
    public static final String FORMAT = "reprise-units-1";
    private static final ObjectMapper MAPPER = new ObjectMapper();
    private static final List<String> REQUIRED = List.of("experiment_file", "experiment_sha256", "seed",
        "tool_version", "shard", "shards", "units_total", "units");

    private UnitFile() {
    }

    /**
     * What a unit file says about the run it belongs to.
     *
     * @param run the run's identity
     * @param part the part of the run
     * @param unitsTotal the number of units of the whole experiment
     * @param threads worker threads used
     * @param seconds simulation wall time, NaN if unknown
     * @param build the build that simulated the tallies ({@link Build#current()}), null if the file does not say
     */
    public record Header(RunIdentity run, Part part, int unitsTotal, int threads, double seconds, String build) {

        /**
         * A header of tallies simulated by this process's build.
         *
         * @param run the run's identity
         * @param part the part of the run
         * @param unitsTotal the number of units of the whole experiment
         * @param threads worker threads used
         * @param seconds simulation wall time, NaN if unknown
         */
        public Header(RunIdentity run, Part part, int unitsTotal, int threads, double seconds) {
            this(run, part, unitsTotal, threads, seconds, Build.current());
        }
    }

    /**
     * One unit's tallies, with the games it covers.
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
         * @param tally its tallies
         * @return the entry
         */
        public static UnitTally of(WorkPlan.Unit u, SimulationResult tally) {
            return new UnitTally(u.caseIndex(), u.chunk(), u.from(), u.to(), tally);
        }

        /**
         * @param u a unit of the plan
         * @return whether this entry is that unit (same case, chunk and games, and tallies of exactly those games)
         */
        public boolean is(WorkPlan.Unit u) {
            List<SimulationResult.ReplicateRange> ranges = tally.replicateRanges();
            return caseIndex == u.caseIndex() && chunk == u.chunk() && from == u.from() && to == u.to()
                && ranges.size() == 1 && ranges.get(0).from() == u.from() && ranges.get(0).to() == u.to();
        }

        /** @return e.g. {@code case 3 chunk 0 games [0, 300)} */
        String describe() {
            return "case " + caseIndex + " chunk " + chunk + " games [" + from + ", " + to + ")";
        }
    }

    /**
     * A unit file's content.
     *
     * @param header the header
     * @param units the unit tallies, in plan order
     */
    public record Content(Header header, List<UnitTally> units) {
        /** Copies the list. */
        public Content {
            units = List.copyOf(units);
        }
    }

    /**
     * Writes a unit file atomically, replacing an earlier one of the same name.
     *
     * @param target the file
     * @param content the content
     */
    public static void write(Path target, Content content) {
        Header h = content.header();
        RunIdentity id = h.run();
        ObjectNode o = MAPPER.createObjectNode();
        o.put("format", FORMAT);
        o.put("experiment_file", id.experimentFile().toString());
        o.put("experiment_sha256", id.experimentSha256());
        putNullable(o, "claims_file", id.claimsFile() == null ? null : id.claimsFile().toString());
        putNullable(o, "claims_sha256", id.claimsSha256());
        o.put("seed", id.seed());
        o.put("tool_version", id.toolVersion());
        o.put("shard", h.part().shard());
        o.put("shards", h.part().shards());
        o.put("units_total", h.unitsTotal());
        o.put("threads", h.threads());
        o.put("seconds", h.seconds());
        putNullable(o, "build", h.build());
        ArrayNode units = o.putArray("units");
        for (UnitTally u : content.units()) {
            ObjectNode n = units.addObject();
            n.put("case_index", u.caseIndex());
            n.put("chunk", u.chunk());
            n.put("from", u.from());
            n.put("to", u.to());
            n.set("tally", TallyFile.toJson(u.tally()));
        }
        AtomicFiles.writeText(target, w -> w.write(MAPPER.writeValueAsString(o)));
    }

    private static void putNullable(ObjectNode o, String field, String value) {
        if (value == null) {
            o.putNull(field);
        } else {
            o.put(field, value);
        }
    }

    /**
     * Reads a unit file.
     *
     * @param file the file
     * @param kind what the file is to the reader, for messages ("shard file", "checkpoint")
     * @return its content
     * @throws IllegalArgumentException one line naming the file, if it cannot be read or is not a valid unit file
     */
    public static Content read(Path file, String kind) {
        JsonNode o;
        try {
            o = MAPPER.readTree(file.toFile());
        } catch (JsonProcessingException ex) {
            throw new IllegalArgumentException(file + ": cannot be read as a " + kind + ": "
                + ex.getOriginalMessage().replaceAll("\\s*\\R\\s*", " "), ex);
        } catch (IOException ex) {
            throw new IllegalArgumentException(file + ": cannot be read: " + ex.getMessage(), ex);
        }
        if (o == null || !FORMAT.equals(o.path("format").asText())) {
            throw new IllegalArgumentException(file + ": not a " + kind + " of format " + FORMAT + " (format: "
                + (o == null ? "none" : o.path("format").asText("none")) + ")");
        }
        for (String f : REQUIRED) {
            if (!o.hasNonNull(f)) {
                throw new IllegalArgumentException(file + ": " + kind + " without " + f);
            }
        }
        try {
            return new Content(header(o), units(o));
        } catch (IllegalArgumentException ex) {
            throw new IllegalArgumentException(file + ": " + ex.getMessage(), ex);
        }
    }

    private static Header header(JsonNode o) {
        RunIdentity id = new RunIdentity(Path.of(o.get("experiment_file").asText()), o.get("experiment_sha256").asText(),
            o.hasNonNull("claims_file") ? Path.of(o.get("claims_file").asText()) : null,
            o.hasNonNull("claims_sha256") ? o.get("claims_sha256").asText() : null, o.get("seed").asLong(),
            o.get("tool_version").asText());
        return new Header(id, new Part(o.get("shard").asInt(), o.get("shards").asInt()), o.get("units_total").asInt(),
            o.path("threads").asInt(1), o.path("seconds").asDouble(Double.NaN),
            o.hasNonNull("build") ? o.get("build").asText() : null);
    }

    private static List<UnitTally> units(JsonNode o) {
        List<UnitTally> units = new ArrayList<>();
        for (JsonNode n : o.get("units")) {
            units.add(new UnitTally(n.path("case_index").asInt(-1), n.path("chunk").asInt(-1), n.path("from").asLong(-1),
                n.path("to").asLong(-1), TallyFile.fromJson(n.get("tally"))));
        }
        return units;
    }
}
