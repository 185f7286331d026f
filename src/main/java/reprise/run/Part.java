package reprise.run;

import java.util.Locale;

/**
 * Which part of a run a {@link UnitFile} belongs to: shard I of N, or the whole run (1 of 1).
 *
 * @param shard I, from 1
 * @param shards N, at least 1
 */
public record Part(int shard, int shards) {

    /** The whole run, as an unsharded {@code check} runs it. */
    public static final Part WHOLE = new Part(1, 1);

    /**
     * @throws IllegalArgumentException unless 1 &le; I &le; N
     */
    public Part {
        if (!(shards >= 1 && shard >= 1 && shard <= shards)) {
            throw new IllegalArgumentException("shard " + shard + " of " + shards + " is not I/N with 1 <= I <= N");
        }
    }

    /** @return the shard file's name, e.g. {@code shard-3-of-8.json} */
    public String fileName() {
        return String.format(Locale.ROOT, "shard-%d-of-%d.json", shard, shards);
    }
}
