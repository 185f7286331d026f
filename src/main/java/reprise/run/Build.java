package reprise.run;

import java.io.IOException;
import java.io.InputStream;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.stream.Stream;

/**
 * The build this process runs: the SHA-256 of the jar (or, when it runs from a class folder, of every file
 * in that folder, by relative path and content) and the git commit of the checkout the jar or folder sits
 * in, when there is one. Shard files record it, and a merge refuses shards of different builds, so that a
 * jar rebuilt while an array is queued cannot mix two builds' tallies silently.
 *
 * <p>Implementation note: the value is computed once per process (hashing a 3 MB jar takes a few
 * milliseconds). The commit is read from the files of the git folder ({@code HEAD}, a loose ref or
 * {@code packed-refs}, following the {@code gitdir:} and {@code commondir} links of a worktree); it names
 * the checked-out commit, not uncommitted edits, which the hash catches.
 */
public final class Build {

    private static volatile String current;

    private Build() {
    }

    /** @return e.g. {@code jar-sha256 3f2a... git 5026cf6...}, or {@code unknown} when the code cannot be read */
    public static String current() {
        String b = current;
        if (b == null) {
            b = compute();
            current = b;
        }
        return b;
    }

    private static String compute() {
        Path code;
        try {
            code = Path.of(Build.class.getProtectionDomain().getCodeSource().getLocation().toURI());
        } catch (URISyntaxException | SecurityException | NullPointerException | IllegalArgumentException ex) {
            return "unknown";
        }
        String hash;
        try {
            hash = Files.isDirectory(code) ? "classes-sha256 " + folderHash(code)
                : "jar-sha256 " + fileHash(code);
        } catch (IOException ex) {
            return "unknown";
        }
        String commit = gitCommit(code);
        return commit == null ? hash : hash + " git " + commit;
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException ex) {
            throw new IllegalStateException("SHA-256 is not available", ex);
        }
    }

    private static String fileHash(Path file) throws IOException {
        MessageDigest md = sha256();
        try (InputStream in = Files.newInputStream(file)) {
            byte[] buf = new byte[1 << 16];
            for (int n; (n = in.read(buf)) > 0;) {
                md.update(buf, 0, n);
            }
        }
        return HexFormat.of().formatHex(md.digest());
    }

    private static String folderHash(Path dir) throws IOException {
        MessageDigest md = sha256();
        List<Path> files = new ArrayList<>();
        try (Stream<Path> s = Files.walk(dir)) {
            s.filter(Files::isRegularFile).forEach(files::add);
        }
        files.sort(null);
        for (Path f : files) {
            md.update(dir.relativize(f).toString().getBytes(StandardCharsets.UTF_8));
            md.update((byte) 0);
            md.update(Files.readAllBytes(f));
        }
        return HexFormat.of().formatHex(md.digest());
    }

    /** The commit checked out in the nearest enclosing git checkout, or null. */
    static String gitCommit(Path code) {
        try {
            for (Path p = code.toAbsolutePath().getParent(); p != null; p = p.getParent()) {
                Path dotGit = p.resolve(".git");
                if (Files.isDirectory(dotGit)) {
                    return head(dotGit, dotGit);
                }
                if (Files.isRegularFile(dotGit)) {
                    String link = Files.readString(dotGit).trim();
                    if (!link.startsWith("gitdir:")) {
                        return null;
                    }
                    Path gitDir = p.resolve(link.substring("gitdir:".length()).trim()).normalize();
                    Path common = gitDir;
                    if (Files.isRegularFile(gitDir.resolve("commondir"))) {
                        common = gitDir.resolve(Files.readString(gitDir.resolve("commondir")).trim()).normalize();
                    }
                    return head(gitDir, common);
                }
            }
        } catch (IOException | RuntimeException ex) {
            return null;
        }
        return null;
    }

    private static String head(Path gitDir, Path common) throws IOException {
        String head = Files.readString(gitDir.resolve("HEAD")).trim();
        if (!head.startsWith("ref:")) {
            return isCommit(head) ? head : null;
        }
        String ref = head.substring("ref:".length()).trim();
        for (Path d : List.of(gitDir, common)) {
            if (Files.isRegularFile(d.resolve(ref))) {
                String id = Files.readString(d.resolve(ref)).trim();
                return isCommit(id) ? id : null;
            }
        }
        Path packed = common.resolve("packed-refs");
        if (Files.isRegularFile(packed)) {
            for (String line : Files.readAllLines(packed)) {
                String[] f = line.trim().split(" ");
                if (f.length == 2 && f[1].equals(ref) && isCommit(f[0])) {
                    return f[0];
                }
            }
        }
        return null;
    }

    private static boolean isCommit(String s) {
        return s.matches("[0-9a-f]{40}");
    }
}
