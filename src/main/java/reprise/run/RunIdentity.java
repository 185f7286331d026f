package reprise.run;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import reprise.experiment.Experiment;

/**
 * What ties saved tallies to one run: the experiment file (absolute path and SHA-256), the claims file
 * (or null), the seed and the tool version. Every {@link UnitFile} carries one; a checkpoint is resumed
 * and a set of shards merged only if theirs matches.
 *
 * @param experimentFile the experiment file, absolute and normalised
 * @param experimentSha256 its SHA-256, hex
 * @param claimsFile the claims file, absolute, or null without claims
 * @param claimsSha256 its SHA-256, or null
 * @param seed the experiment's seed
 * @param toolVersion the version of the tool that simulated the tallies
 */
public record RunIdentity(Path experimentFile, String experimentSha256, Path claimsFile, String claimsSha256,
    long seed, String toolVersion) {

    /**
     * The identity of a run of an experiment by this tool.
     *
     * @param e the experiment
     * @param file the experiment file as given
     * @param toolVersion the tool version
     * @return the identity
     */
    public static RunIdentity of(Experiment e, Path file, String toolVersion) {
        Path claims = e.claims() == null ? null : e.claims().toAbsolutePath().normalize();
        return new RunIdentity(file.toAbsolutePath().normalize(), e.sha256(), claims,
            e.claims() == null ? null : sha256(e.claims()), e.seed(), toolVersion);
    }

    /**
     * @param p a file
     * @return its SHA-256 in hex, or null if it cannot be read
     */
    public static String sha256(Path p) {
        try {
            MessageDigest md = MessageDigest.getInstance("SHA-256");
            return HexFormat.of().formatHex(md.digest(Files.readAllBytes(p)));
        } catch (IOException | NoSuchAlgorithmException ex) {
            return null;
        }
    }
}
