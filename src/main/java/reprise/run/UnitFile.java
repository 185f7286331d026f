package reprise.run;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
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
 * <p>Last comes {@code sha256}: the SHA-256 (lower-case hex) of the object without that field, written
 * compactly in field order ({@link #checksum}). {@link #read} checks every field's type first (so a field
 * of the wrong kind is named as such) and then the checksum, and refuses a file whose content was changed
 * after it was written, even when its counts still add up, naming the file.
 *
 * <p>Room to grow: a unit cut by game-index ranges finer than today's is already described by its
 * {@code from} and {@code to}, which is what readers compare.
 */
public final class UnitFile {

    /** The format identifier. */
    public static final String FORMAT = "reprise-units-1";
    private static final ObjectMapper MAPPER = new ObjectMapper();
    private static final String CHECKSUM = "sha256";
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
        o.put(CHECKSUM, checksum(o));
        AtomicFiles.writeText(target, w -> w.write(MAPPER.writeValueAsString(o)));
    }

    /**
     * The checksum of a unit file's object: SHA-256 (lower-case hex) of its compact JSON text, fields in
     * their order, without a {@code sha256} field.
     *
     * @param o the object (not changed)
     * @return 64 hex digits
     */
    public static String checksum(JsonNode o) {
        ObjectNode body = (ObjectNode) o.deepCopy();
        body.remove(CHECKSUM);
        try {
            return sha256(MAPPER.writeValueAsString(body).getBytes(StandardCharsets.UTF_8));
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("a JSON tree could not be written", e);
        }
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
        if (Files.exists(file) && !Files.isRegularFile(file)) {
            throw new IllegalArgumentException(file + ": is not a regular file, not a " + kind);
        }
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
        Content content;
        try {
            content = new Content(header(o), units(o));
        } catch (IllegalArgumentException ex) {
            throw new IllegalArgumentException(file + ": " + ex.getMessage(), ex);
        }
        JsonNode sum = o.get(CHECKSUM);
        if (sum == null || !sum.isTextual()) {
            throw new IllegalArgumentException(file + ": " + kind + " without its " + CHECKSUM + " checksum (written by "
                + "an older version, or edited)");
        }
        if (!sum.asText().equals(checksum(o))) {
            throw new IllegalArgumentException(file + ": " + kind + " fails its " + CHECKSUM + " checksum: its content "
                + "was changed after it was written");
        }
        return content;
    }

    private static Header header(JsonNode o) {
        RunIdentity id = new RunIdentity(Path.of(text(o, "experiment_file")), text(o, "experiment_sha256"),
            o.hasNonNull("claims_file") ? Path.of(text(o, "claims_file")) : null,
            o.hasNonNull("claims_sha256") ? text(o, "claims_sha256") : null, whole(o, "seed", Long.MIN_VALUE, Long.MAX_VALUE),
            text(o, "tool_version"));
        int threads = o.hasNonNull("threads") ? (int) whole(o, "threads", 1, Integer.MAX_VALUE) : 1;
        JsonNode seconds = o.get("seconds");
        return new Header(id, new Part((int) whole(o, "shard", 1, Integer.MAX_VALUE), (int) whole(o, "shards", 1, Integer.MAX_VALUE)),
            (int) whole(o, "units_total", 1, Integer.MAX_VALUE), threads, seconds != null && seconds.isNumber() ? seconds.asDouble()
            : Double.NaN, o.hasNonNull("build") ? text(o, "build") : null);
    }

    private static List<UnitTally> units(JsonNode o) {
        if (!o.get("units").isArray()) {
            throw new IllegalArgumentException("field units must be a list of units: " + o.get("units"));
        }
        List<UnitTally> units = new ArrayList<>();
        for (JsonNode n : o.get("units")) {
            if (!n.isObject()) {
                throw new IllegalArgumentException("field units holds a non-object: " + n);
            }
            units.add(new UnitTally((int) whole(n, "case_index", 0, Integer.MAX_VALUE), (int) whole(n, "chunk", 0,
                Integer.MAX_VALUE), whole(n, "from", 0, Long.MAX_VALUE), whole(n, "to", 0, Long.MAX_VALUE), TallyFile.fromJson(n.get("tally"))));
        }
        return units;
    }

    /** A text field, or a one-line reason naming it. */
    private static String text(JsonNode o, String field) {
        JsonNode n = o.get(field);
        if (n == null || !n.isTextual()) {
            throw new IllegalArgumentException("field " + field + " must be text: " + n);
        }
        return n.asText();
    }

    /** A whole-number field in [min, max], or a one-line reason naming it. */
    private static long whole(JsonNode o, String field, long min, long max) {
        JsonNode n = o.get(field);
        if (n == null || !n.isIntegralNumber() || !n.canConvertToLong() || n.asLong() < min || n.asLong() > max) {
            throw new IllegalArgumentException("field " + field + " must be a whole number" + (min == Long.MIN_VALUE ? ""
                : " from " + min + " to " + max) + ": " + n);
        }
        return n.asLong();
    }

    private static String sha256(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is missing from this Java runtime", e);
        }
    }
}
