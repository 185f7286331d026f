package reprise.sim;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.ArrayList;
import java.util.List;

/**
 * Writes a {@link SimulationResult} as JSON and reads it back exactly: every tally is an integer, so a
 * result read back merges with others into bit-identical numbers. It is the tally object inside the run
 * layer's unit files (checkpoints and shards, {@code reprise.run.UnitFile}), and lives here because it
 * reads and writes the accumulator's fields.
 *
 * <p>The JSON object has {@code format} = {@value #FORMAT}, the run's {@code configuration} text, {@code seed},
 * {@code fast_path}, the payoff vectors, the replicate {@code ranges} and the raw tallies. Reading checks the
 * format, the array sizes and that the tallies are consistent (for example that the state counts add up to
 * the tallied rounds), and refuses anything else with a message.
 */
public final class TallyFile {

    /** The format identifier written into every file. */
    public static final String FORMAT = "reprise-tally-1";

    private static final ObjectMapper MAPPER = new ObjectMapper();

    private TallyFile() {
    }

    /**
     * The JSON form of a result.
     *
     * @param r the result
     * @return a JSON object
     */
    public static ObjectNode toJson(SimulationResult r) {
        Accumulator a = r.accumulator();
        ObjectNode o = MAPPER.createObjectNode();
        o.put("format", FORMAT);
        o.put("configuration", r.configuration());
        o.put("seed", r.seed());
        o.put("fast_path", r.fastPath());
        o.set("payoff_x", doubles(r.payoffVector(true)));
        o.set("payoff_y", doubles(r.payoffVector(false)));
        ArrayNode ranges = o.putArray("ranges");
        for (SimulationResult.ReplicateRange range : r.replicateRanges()) {
            ranges.addArray().add(range.from()).add(range.to());
        }
        o.put("history_memory", a.historyMemory);
        o.set("snapshot_rounds", longs(a.snapshotRounds));
        o.put("time_rounds", a.timeRounds);
        o.set("states", longs(a.states));
        o.set("steps", longs(a.steps));
        o.set("snapshot_counts", longs(a.snapshotCounts));
        o.set("time_counts", longs(a.timeCounts));
        o.put("games", a.games);
        o.put("games_tallied", a.gamesTallied);
        o.put("length_sum", a.lengthSum);
        o.put("length_min", a.lengthMin);
        o.put("length_max", a.lengthMax);
        o.set("length_squares", longs(a.lengthSquares));
        o.put("tallied_sum", a.talliedSum);
        o.set("tallied_squares", longs(a.talliedSquares));
        o.set("product_sums", longs(a.productSums));
        o.set("length_state_sums", longs(a.lengthStateSums));
        return o;
    }

    /**
     * Reads a result from its JSON form.
     *
     * @param o the JSON object written by {@link #toJson(SimulationResult)}
     * @return the result
     * @throws IllegalArgumentException if the object is not a valid tally
     */
    public static SimulationResult fromJson(JsonNode o) {
        if (o == null || !FORMAT.equals(o.path("format").asText())) {
            throw new IllegalArgumentException("not a " + FORMAT + " tally (format: " + (o == null ? "none"
                : o.path("format").asText("none")) + ")");
        }
        int memory = o.path("history_memory").asInt(-1);
        if (memory < 1 || memory > 3) {
            throw new IllegalArgumentException("tally: history_memory must be 1 to 3: " + memory);
        }
        long[] snapshotRounds = longs(o, "snapshot_rounds", -1);
        int timeRounds = o.path("time_rounds").asInt(-1);
        if (timeRounds < 0) {
            throw new IllegalArgumentException("tally: time_rounds is missing");
        }
        Accumulator a = new Accumulator(memory, snapshotRounds, timeRounds);
        copy(longs(o, "states", 4), a.states);
        copy(longs(o, "steps", a.steps.length), a.steps);
        copy(longs(o, "snapshot_counts", a.snapshotCounts.length), a.snapshotCounts);
        copy(longs(o, "time_counts", a.timeCounts.length), a.timeCounts);
        a.games = field(o, "games");
        a.gamesTallied = field(o, "games_tallied");
        a.lengthSum = field(o, "length_sum");
        a.lengthMin = field(o, "length_min");
        a.lengthMax = field(o, "length_max");
        copy(longs(o, "length_squares", 2), a.lengthSquares);
        a.talliedSum = field(o, "tallied_sum");
        copy(longs(o, "tallied_squares", 2), a.talliedSquares);
        copy(longs(o, "product_sums", 32), a.productSums);
        copy(longs(o, "length_state_sums", 8), a.lengthStateSums);
        long sum = 0;
        for (long s : a.states) {
            if (s < 0) {
                throw new IllegalArgumentException("tally: negative state count " + s);
            }
            sum += s;
        }
        if (sum != a.talliedSum) {
            throw new IllegalArgumentException("tally: state counts add up to " + sum + ", not the tallied rounds "
                + a.talliedSum);
        }
        List<SimulationResult.ReplicateRange> ranges = new ArrayList<>();
        long covered = 0;
        for (JsonNode r : o.path("ranges")) {
            SimulationResult.ReplicateRange range = new SimulationResult.ReplicateRange(r.path(0).asLong(-1),
                r.path(1).asLong(-1));
            ranges.add(range);
            covered += range.to() - range.from();
        }
        if (ranges.isEmpty() || covered != a.games) {
            throw new IllegalArgumentException("tally: replicate ranges cover " + covered + " games, the tallies "
                + a.games);
        }
        return new SimulationResult(o.path("configuration").asText(), field(o, "seed"),
            o.path("fast_path").asBoolean(), doubles(o, "payoff_x"), doubles(o, "payoff_y"), ranges, a);
    }

    private static ArrayNode longs(long[] v) {
        ArrayNode a = MAPPER.createArrayNode();
        for (long x : v) {
            a.add(x);
        }
        return a;
    }

    private static ArrayNode doubles(double[] v) {
        ArrayNode a = MAPPER.createArrayNode();
        for (double x : v) {
            a.add(x);
        }
        return a;
    }

    private static long field(JsonNode o, String name) {
        JsonNode n = o.get(name);
        if (n == null || !n.isIntegralNumber() || !n.canConvertToLong()) {
            throw new IllegalArgumentException("tally: " + name + " is missing or not a whole number: " + n);
        }
        return n.asLong();
    }

    private static long[] longs(JsonNode o, String name, int length) {
        JsonNode n = o.get(name);
        if (n == null || !n.isArray() || (length >= 0 && n.size() != length)) {
            throw new IllegalArgumentException("tally: " + name + " must be an array" + (length >= 0 ? " of " + length
                + " whole numbers" : ""));
        }
        long[] v = new long[n.size()];
        for (int i = 0; i < v.length; i++) {
            if (!n.get(i).isIntegralNumber() || !n.get(i).canConvertToLong()) {
                throw new IllegalArgumentException("tally: " + name + "[" + i + "] is not a whole number");
            }
            v[i] = n.get(i).asLong();
        }
        return v;
    }

    private static double[] doubles(JsonNode o, String name) {
        JsonNode n = o.get(name);
        if (n == null || !n.isArray() || n.size() != 4) {
            throw new IllegalArgumentException("tally: " + name + " must be an array of 4 numbers");
        }
        double[] v = new double[4];
        for (int i = 0; i < 4; i++) {
            v[i] = n.get(i).asDouble();
        }
        return v;
    }

    private static void copy(long[] from, long[] to) {
        System.arraycopy(from, 0, to, 0, to.length);
    }
}
