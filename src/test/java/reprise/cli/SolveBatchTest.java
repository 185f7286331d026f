package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** solve-batch equals one-by-one solve (common practice, no source: the same code path must give the same bits). */
class SolveBatchTest {

    private static final ObjectMapper M = new ObjectMapper();

    /** Each row as solve's arguments. */
    private static final String[][] ROWS = {
        {"--x", "tft", "--y", "reactive:0.9,0.2", "--noise", "0.01", "--rounds", "100"},
        {"--x", "extort:chi=3", "--y", "allc"},
        {"--x", "wsls", "--y", "gtft", "--game", "4,0,5,1", "--noise", "0.02,0.01", "--misperception", "0.01",
            "--continuation", "0.95"},
        {"--x", "tf2t", "--y", "equalizer:score=2,phi=1/3", "--rounds", "7"},
        {"--x", "tft", "--y", "tft"},
    };
    private static final String INPUT = "x,y,game,noise,misperception,rounds,continuation\n"
        + "tft,\"reactive:0.9,0.2\",,0.01,,100,\n"
        + "extort:chi=3,allc,,,,,\n"
        + "wsls,gtft,\"4,0,5,1\",\"0.02,0.01\",0.01,,0.95\n"
        + "bogus,allc,,,,,\n"
        + "tf2t,\"equalizer:score=2,phi=1/3\",,,,7,\n"
        + "wsls,tft,,1.5,,,\n"
        + "tft,tft,,,,,\n"
        + "tft,tft,,,,0,\n";

    private static String[] run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new String[] {String.valueOf(code), out.toString(), err.toString()};
    }

    @Test
    void jsonLinesEqualOneByOneSolveBitForBit(@TempDir Path dir) throws Exception {
        Path in = dir.resolve("in.csv");
        Files.writeString(in, INPUT);
        String[] r = run("solve-batch", in.toString());
        assertEquals("2", r[0], r[2]);
        String[] lines = r[1].split("\n");
        assertEquals(8, lines.length);
        List<JsonNode> good = new ArrayList<>();
        for (String l : lines) {
            JsonNode n = M.readTree(l);
            if (!n.has("error")) {
                good.add(n);
            }
        }
        assertEquals(ROWS.length, good.size());
        long[] expectedLines = {2, 3, 4, 6, 8};
        for (int i = 0; i < ROWS.length; i++) {
            List<String> args = new ArrayList<>(List.of("solve", "--json"));
            args.addAll(List.of(ROWS[i]));
            String[] one = run(args.toArray(String[]::new));
            assertEquals("0", one[0], one[2]);
            ObjectNode batch = (ObjectNode) good.get(i).deepCopy();
            assertEquals(expectedLines[i], batch.get("line").asLong());
            batch.remove("line");
            // JsonNode equality compares doubles exactly, so this is bit for bit
            assertEquals(M.readTree(one[1]), batch, String.join(" ", ROWS[i]));
        }
    }

    @Test
    void badRowsAreNamedOneLineEachAndTheRestIsIntact(@TempDir Path dir) throws Exception {
        Path in = dir.resolve("in.csv");
        Files.writeString(in, INPUT);
        String[] r = run("solve-batch", in.toString(), "--format", "csv");
        assertEquals("2", r[0]);
        String[] err = r[2].split("\n");
        assertEquals(4, err.length, r[2]);
        assertTrue(err[0].startsWith("reprise solve-batch: " + in + ": line 5, field 'x': unknown strategy 'bogus'"),
            err[0]);
        assertEquals("reprise solve-batch: " + in + ": line 7, field 'noise': must be a probability in [0, 1]: 1.5",
            err[1]);
        assertEquals("reprise solve-batch: " + in + ": line 9, field 'rounds': must be at least 1: 0", err[2]);
        assertEquals("reprise solve-batch: 3 row(s) failed; the other rows were solved", err[3]);
        try (CSVParser p = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).build()
            .parse(new java.io.StringReader(r[1]))) {
            List<CSVRecord> rows = p.getRecords();
            assertEquals(8, rows.size());
            // row of line 3: the extortioner against ALLC, Press & Dyson (2012) PNAS 109(26): 41/11 and 21/11
            CSVRecord ext = rows.get(1);
            assertEquals("3", ext.get("line"));
            assertEquals(41 / 11.0, Double.parseDouble(ext.get("long_run_payoff_x")), 1e-12);
            assertEquals(21 / 11.0, Double.parseDouble(ext.get("long_run_payoff_y")), 1e-12);
            assertEquals("0.0", ext.get("x_first_move"));
            assertEquals("", ext.get("error"));
            assertTrue(rows.get(3).get("error").startsWith("field 'x': unknown strategy"));
            // noise-free tit-for-tat pair: not ergodic, stationary columns empty, limit from CC
            CSVRecord tft = rows.get(6);
            assertEquals("", tft.get("stationary_cc"));
            assertEquals("1.0", tft.get("limit_cc"));
        }
    }

    @Test
    void badHeaderIsOneLine(@TempDir Path dir) throws Exception {
        Path in = dir.resolve("in.csv");
        Files.writeString(in, "x,y,rouds\ntft,tft,10\n");
        String[] r = run("solve-batch", in.toString());
        assertEquals("2", r[0]);
        assertEquals("", r[1]);
        assertTrue(r[2].startsWith("reprise solve-batch: " + in + ": line 1: unknown column 'rouds'"), r[2]);
    }
}
