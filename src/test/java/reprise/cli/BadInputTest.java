package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Every file under {@code src/test/resources/reprise/bad/} is a broken experiment. Its header says what
 * {@code check} must print: {@code # expect: FRAGMENT} (a fragment of the one-line message; a fragment
 * starting {@code :LINE:} must follow the file's name, so it pins the line number and field), and optionally
 * {@code # args: ...} (extra command-line arguments) and {@code # out: file} or {@code # out: under-file}
 * (the output folder is an existing regular file, or a path below one). Through the real entry point
 * each must exit 2, name the file, print only lines of the form {@code reprise check: ...} on stderr and
 * nothing on stdout, and create no output folder or file (nor leave a temporary file beside the input).
 */
class BadInputTest {

    static final Path BAD = Path.of("src/test/resources/reprise/bad");
    private static final Pattern DIRECTIVE = Pattern.compile("^# (expect|args|out): (.*)$");

    @TempDir
    Path tmp;

    static Stream<Path> badFiles() throws IOException {
        try (Stream<Path> s = Files.list(BAD)) {
            return s.filter(p -> p.toString().endsWith(".yaml")).sorted().toList().stream();
        }
    }

    @Test
    void theSuiteIsLargeEnough() throws IOException {
        assertTrue(badFiles().count() >= 30);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("badFiles")
    void badFileIsRefusedBeforeAnythingIsWritten(Path file) throws IOException {
        String expect = null;
        List<String> extra = new ArrayList<>();
        String outKind = "";
        for (String line : Files.readAllLines(file)) {
            Matcher m = DIRECTIVE.matcher(line);
            if (m.matches()) {
                switch (m.group(1)) {
                    case "expect" -> expect = m.group(2).trim();
                    case "args" -> extra.addAll(List.of(m.group(2).trim().split("\\s+")));
                    default -> outKind = m.group(2).trim();
                }
            }
        }
        assertTrue(expect != null, file + " has no '# expect:' header");
        Path out = tmp.resolve("out");
        byte[] occupied = "not a folder\n".getBytes();
        if (!outKind.isEmpty()) {
            Files.write(out, occupied);
        }
        Path target = outKind.equals("under-file") ? out.resolve("sub") : out;
        List<String> args = new ArrayList<>(List.of("check", file.toString(), "--out", target.toString(), "--quiet"));
        args.addAll(extra);

        StringWriter stdout = new StringWriter();
        StringWriter stderr = new StringWriter();
        int code = Main.run(args.toArray(String[]::new), new PrintWriter(stdout), new PrintWriter(stderr));
        String err = stderr.toString();

        assertEquals(Main.BAD_INPUT, code, err);
        assertEquals("", stdout.toString(), err);
        String name = file.getFileName().toString();
        String csv = name.replace(".yaml", ".csv");
        String whole = expect.startsWith(":") ? name + expect : expect;
        assertTrue(err.contains(whole), "expected '" + whole + "' in:\n" + err);
        assertTrue(err.contains(name) || err.contains(csv), "no file name in:\n" + err);
        for (String line : err.split("\n")) {
            assertTrue(line.startsWith("reprise check: "), "not one line per problem: " + line);
        }
        try (Stream<Path> left = Files.list(tmp)) {
            List<Path> all = left.toList();
            assertEquals(outKind.isEmpty() ? List.of() : List.of(out), all, "something was written");
        }
        if (!outKind.isEmpty()) {
            assertTrue(Files.isRegularFile(out));
            assertEquals(new String(occupied), Files.readString(out));
        }
        try (Stream<Path> s = Files.list(BAD)) {
            assertFalse(s.anyMatch(p -> p.getFileName().toString().startsWith(".")), "temporary file left in " + BAD);
        }
    }

    /**
     * An output folder that cannot be created, whoever runs the test (root included, for whom permission
     * bits do not stop writing): its path runs through a regular file, two levels below it. The run must
     * be refused in the output-folder check, before anything is simulated or written, with the reason
     * (the file in the way) in one line; the file must be left as it was. Where permission bits do apply
     * (not root), a folder without write permission is refused too, as "not writable".
     */
    @Test
    void unwritableOutputIsRefused() throws IOException {
        Path blocker = tmp.resolve("blocker");
        Files.writeString(blocker, "a regular file\n");
        Path target = blocker.resolve("deeper").resolve("out");
        StringWriter stderr = new StringWriter();
        StringWriter stdout = new StringWriter();
        int code = Main.run(new String[] {"check", BAD.resolve("../ok/tiny.yaml").toString(), "--out",
            target.toString(), "--quiet"}, new PrintWriter(stdout), new PrintWriter(stderr));
        assertEquals(Main.BAD_INPUT, code, stderr.toString());
        assertEquals("", stdout.toString());
        assertEquals("reprise check: " + BAD.resolve("../ok/tiny.yaml") + ": --out: " + target + " cannot be created: "
            + blocker.toAbsolutePath().normalize() + " is a file, not a folder", stderr.toString().strip());
        assertEquals("a regular file\n", Files.readString(blocker));
        try (Stream<Path> left = Files.list(tmp)) {
            assertEquals(List.of(blocker), left.toList(), "something was written");
        }

        Path locked = tmp.resolve("locked");
        Files.createDirectory(locked);
        Files.setPosixFilePermissions(locked, PosixFilePermissions.fromString("r-xr-xr-x"));
        try {
            if (!Files.isWritable(locked)) {
                stderr = new StringWriter();
                code = Main.run(new String[] {"check", BAD.resolve("../ok/tiny.yaml").toString(), "--out",
                    locked.resolve("out").toString(), "--quiet"}, new PrintWriter(new StringWriter()),
                    new PrintWriter(stderr));
                assertEquals(Main.BAD_INPUT, code, stderr.toString());
                assertTrue(stderr.toString().contains("not writable"), stderr.toString());
                assertFalse(Files.exists(locked.resolve("out")));
            }
        } finally {
            Files.setPosixFilePermissions(locked, PosixFilePermissions.fromString("rwxr-xr-x"));
        }
    }
}
