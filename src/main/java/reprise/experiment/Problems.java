package reprise.experiment;

import java.util.ArrayList;
import java.util.List;

/** Collects input problems so that all of them are reported at once, one line each. */
final class Problems {
    private final String file;
    private final List<String> lines = new ArrayList<>();
    private final List<Integer> numbers = new ArrayList<>();

    Problems(String file) {
        this.file = file;
    }

    void add(int line, String field, String message) {
        lines.add(file + (line > 0 ? ":" + line : "") + ": " + field + ": " + message);
        numbers.add(line);
    }

    /** @return how many problems have been added */
    int size() {
        return lines.size();
    }

    boolean isEmpty() {
        return lines.isEmpty();
    }

    /** @return the problems in file order (problems without a line first), in the order found within a line */
    List<String> lines() {
        List<Integer> order = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            order.add(i);
        }
        order.sort(java.util.Comparator.comparingInt(numbers::get));
        return order.stream().map(lines::get).toList();
    }

    void throwIfAny() {
        if (!lines.isEmpty()) {
            throw new InvalidExperimentException(lines());
        }
    }

    /** The Levenshtein distance, for did-you-mean hints on mistyped keys. */
    static int distance(String a, String b) {
        int[] prev = new int[b.length() + 1];
        int[] cur = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            prev[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            cur[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
                cur[j] = Math.min(Math.min(cur[j - 1] + 1, prev[j] + 1), prev[j - 1] + cost);
            }
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length()];
    }

    static String didYouMean(String key, List<String> known) {
        String best = null;
        int bestD = Integer.MAX_VALUE;
        for (String k : known) {
            int d = distance(key.toLowerCase(java.util.Locale.ROOT), k);
            if (d < bestD) {
                bestD = d;
                best = k;
            }
        }
        return best != null && bestD <= Math.max(2, key.length() / 3) ? " (did you mean '" + best + "'?)" : "";
    }
}
