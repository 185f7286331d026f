package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class SweepCommandTest {

    private static String[] run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new String[] {String.valueOf(code), out.toString(), err.toString()};
    }

    /**
     * The sweep's CSV equals {@code solve --json} at sampled grid points, to the 15 significant digits the CSV
     * carries (relative 1e-14) plus the 1e-12 the two engines may differ by (common practice, no source).
     */
    @Test
    void csvEqualsSolveAtSampledPoints(@TempDir Path dir) throws Exception {
        Path csv = dir.resolve("s.csv");
        Path maps = dir.resolve("maps");
        String[] r = run("sweep", "--reactive", "0:1:11,0.1:0.9:5", "--against", "extort:chi=3", "--against", "wsls",
            "--noise", "0.01", "--rounds", "20", "--continuation", "0.9", "--long-run", "--relation", "gap=1,-1,0",
            "--out", csv.toString(), "--maps", maps.toString());
        assertEquals("0", r[0], r[2]);
        try (CSVParser p = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).build()
            .parse(Files.newBufferedReader(csv))) {
            List<CSVRecord> rows = p.getRecords();
            assertEquals(11 * 5 * 2 * 3, rows.size());
            ObjectMapper m = new ObjectMapper();
            for (int i = 0; i < rows.size(); i += 17) {
                CSVRecord row = rows.get(i);
                String x = "reactive:" + row.get("p") + "," + row.get("q");
                String length = row.get("length");
                List<String> args = new java.util.ArrayList<>(List.of("solve", "--json", "--x", x, "--y",
                    row.get("co_player"), "--noise", "0.01"));
                if (length.startsWith("rounds=")) {
                    args.addAll(List.of("--rounds", length.substring(7)));
                } else if (length.startsWith("continuation=")) {
                    args.addAll(List.of("--continuation", length.substring(13)));
                }
                String[] s = run(args.toArray(String[]::new));
                assertEquals("0", s[0], s[2]);
                JsonNode j = m.readTree(s[1]);
                JsonNode pay = length.equals("long_run") ? j.get("limit_payoffs") : j.get("horizon").get("payoffs");
                double px = Double.parseDouble(row.get("payoff_x"));
                double py = Double.parseDouble(row.get("payoff_y"));
                assertEquals(pay.get("x").asDouble(), px, 1e-12, x + " " + length);
                assertEquals(pay.get("y").asDouble(), py, 1e-12, x + " " + length);
                assertEquals(px - py, Double.parseDouble(row.get("gap")), 1e-12);
                boolean zd = row.get("co_player").startsWith("extort");
                assertEquals(zd, !row.get("enforced_residual").isEmpty());
            }
        }
        // 2 co-players x 3 lengths x (payoff, cooperation, plus residual for the extortioner) x 2 kinds
        assertEquals(2 * 3 * 2 * 2 + 3 * 2, Files.list(maps).count());
        assertTrue(r[2].contains("wrote 30 value maps"), r[2]);
    }

    @Test
    void badInputIsOneLine() {
        String[] r = run("sweep", "--reactive", "0:1:11", "--against", "tft");
        assertEquals("2", r[0]);
        assertEquals("reprise sweep: --reactive needs 2 axes separated by commas: 0:1:11", r[2].strip());
        String[] m = run("sweep", "--random", "10", "--against", "tft", "--maps", "x");
        assertEquals("2", m[0]);
        assertTrue(m[2].contains("value maps need a grid"), m[2]);
        String[] both = run("sweep", "--random", "10", "--reactive", "0,0", "--against", "tft");
        assertEquals("reprise sweep: give exactly one of --reactive, --memory-one, --random", both[2].strip());
    }
}
