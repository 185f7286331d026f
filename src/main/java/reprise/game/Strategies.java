package reprise.game;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Parses strategy specs.
 *
 * <p>Forms (numbers may be decimals or fractions such as {@code 1/3}; {@code @p0} sets the first-round
 * cooperation probability, default 1, except 0 for {@code alld} and {@code stft} and 1/2 for
 * {@code random}; the zero-determinant forms refuse {@code @p0}: extortionate strategies always open
 * with D and generous ones with C, as the discounted zero-determinant condition requires, and an
 * equalizer takes {@code p0=} inside its spec, default 1):
 * <ul>
 *   <li>{@code reactive:p,q[@p0]}: cooperate with probability p after the co-player's C, q after its D;</li>
 *   <li>{@code memory1:pCC,pCD,pDC,pDD[@p0]}: memory-one, own move first in each state;</li>
 *   <li>{@code memory2:16 numbers[@p0]}, {@code memory3:64 numbers[@p0]}: lookup tables in the layout
 *       of {@link MemoryStrategy};</li>
 *   <li>named: {@code allc}, {@code alld}, {@code tft}, {@code stft} (tit-for-tat opening with D),
 *       {@code gtft} (generous tit-for-tat, q from the game), {@code wsls}, {@code grim}, {@code tf2t}
 *       (tit-for-two-tats, memory two), {@code random} (cooperate with probability 1/2); a named strategy
 *       also takes {@code @p0};</li>
 *   <li>zero-determinant: {@code extort:chi=C[,phi=F][,delta=D]}, {@code generous:chi=C[,phi=F][,delta=D]},
 *       {@code equalizer:score=S[,phi=F][,delta=D][,p0=Q]}; a missing phi is the middle of its allowed
 *       range (half the largest for extort and generous);</li>
 *   <li>{@code agent:NAME[,ARG...]}: a user-written agent, played by the simulator only.</li>
 * </ul>
 *
 * <p>Generous tit-for-tat uses q = min{1 - (T - R)/(R - S), (R - P)/(T - P)} from the player's own payoffs,
 * the largest generosity that keeps defection from paying (Molander 1985; Nowak &amp; Sigmund 1992).
 *
 * <p>References:
 * Molander, P. (1985). The optimal level of generosity in a selfish, uncertain environment. Journal of
 * Conflict Resolution 29(4), 611-618.
 * Nowak, M.A. &amp; Sigmund, K. (1992). Tit for tat in heterogeneous populations. Nature 355, 250-253.
 */
public final class Strategies {

    /** The named strategies, in the order they are listed in messages. */
    public static final List<String> NAMES = List.of("allc", "alld", "tft", "stft", "gtft", "wsls", "grim",
        "tf2t", "random");

    /** The parameterised forms, as listed in messages. */
    public static final List<String> FORMS = List.of("reactive:p,q", "memory1:pCC,pCD,pDC,pDD",
        "memory2:<16 numbers>", "memory3:<64 numbers>", "extort:chi=..,phi=..", "generous:chi=..",
        "equalizer:score=..", "agent:NAME");

    private Strategies() {
    }

    /**
     * Parses a spec for one player of a game.
     *
     * @param spec the text
     * @param game the stage game (gtft and zero-determinant strategies depend on it)
     * @param player whose strategy it is (its own payoffs are used)
     * @return the strategy
     * @throws IllegalArgumentException with a one-line message naming the problem
     */
    public static Strategy parse(String spec, StageGame game, Player player) {
        String s = spec == null ? "" : spec.trim();
        if (s.isEmpty()) {
            throw new IllegalArgumentException("strategy is empty; " + known());
        }
        String lower = s.toLowerCase(Locale.ROOT);
        if (lower.startsWith("agent:")) {
            String[] parts = s.substring(6).split(",", -1);
            return new CustomStrategy(parts[0].trim(),
                Arrays.stream(parts).skip(1).map(String::trim).toList());
        }
        double p0 = 1;
        boolean p0Given = false;
        int at = lower.indexOf('@');
        String body = lower;
        if (at >= 0) {
            p0 = Checks.probability("first-round cooperation probability (@p0) in '" + s + "'",
                Numbers.parse("@p0 of '" + s + "'", lower.substring(at + 1)));
            p0Given = true;
            body = lower.substring(0, at).trim();
        }
        int colon = body.indexOf(':');
        String head = colon < 0 ? body : body.substring(0, colon).trim();
        String args = colon < 0 ? "" : body.substring(colon + 1);
        if (colon >= 0 && NAMES.contains(head)) {
            throw new IllegalArgumentException("strategy '" + head + "' takes no parameters (only @p0): '" + s + "'");
        }
        double[] ownPayoffs = game.ownView(player);
        switch (head) {
            case "allc":
                return table(s, 1, new double[] {1, 1, 1, 1}, p0);
            case "alld":
                return table(s, 1, new double[] {0, 0, 0, 0}, p0Given ? p0 : 0);
            case "tft":
                return table(s, 1, new double[] {1, 0, 1, 0}, p0);
            case "stft":
                return table(s, 1, new double[] {1, 0, 1, 0}, p0Given ? p0 : 0);
            case "gtft": {
                double q = generosity(ownPayoffs);
                return table(s, 1, new double[] {1, q, 1, q}, p0);
            }
            case "wsls":
                return table(s, 1, new double[] {1, 0, 0, 1}, p0);
            case "grim":
                return table(s, 1, new double[] {1, 0, 0, 0}, p0);
            case "random":
                return table(s, 1, new double[] {0.5, 0.5, 0.5, 0.5}, p0Given ? p0 : 0.5);
            case "tf2t": {
                double[] t = new double[16];
                for (int i = 0; i < 16; i++) {
                    boolean lastD = (i & 1) == 1;
                    boolean prevD = ((i >> 2) & 1) == 1;
                    t[i] = lastD && prevD ? 0 : 1;
                }
                return table(s, 2, t, p0);
            }
            case "reactive": {
                double[] v = Numbers.parseList("reactive strategy '" + s + "'", args, 2);
                checkProbabilities("reactive strategy '" + s + "'", v);
                return MemoryStrategy.reactive(s, v[0], v[1], p0);
            }
            case "memory1":
            case "memory2":
            case "memory3": {
                int n = head.charAt(6) - '0';
                int size = 1 << (2 * n);
                double[] v = Numbers.parseList(head + " strategy", args, size);
                checkProbabilities(head + " strategy '" + shortSpec(s) + "'", v);
                return table(s, n, v, p0);
            }
            case "extort":
            case "generous":
            case "equalizer":
                return zeroDeterminant(s, head, args, game, player, p0Given);
            default:
                throw new IllegalArgumentException("unknown strategy '" + s + "'; " + known());
        }
    }

    /**
     * The generosity of generous tit-for-tat, q* = min{1 - (T - R)/(R - S), (R - P)/(T - P)}, clipped to [0, 1].
     *
     * @param own the player's payoffs (R, S, T, P) in its own view
     * @return q*
     */
    public static double generosity(double[] own) {
        double r = own[0];
        double s = own[1];
        double t = own[2];
        double p = own[3];
        if (!(r > s && t > p)) {
            throw new IllegalArgumentException("gtft needs R > S and T > P to define its generosity: got R,S,T,P = "
                + Numbers.format(r) + "," + Numbers.format(s) + "," + Numbers.format(t) + "," + Numbers.format(p));
        }
        double q = Math.min(1 - (t - r) / (r - s), (r - p) / (t - p));
        return Math.max(0, Math.min(1, q));
    }

    private static Strategy zeroDeterminant(String spec, String kind, String args, StageGame game, Player player,
        boolean p0Given) {
        if (p0Given) {
            throw new IllegalArgumentException("zero-determinant strategy '" + spec + "' sets its own first move; "
                + "use p0=.. inside the equalizer spec, or memory1:..@p0 for a free choice");
        }
        Map<String, Double> kv = keyValues(spec, args);
        List<String> allowed = switch (kind) {
            case "extort", "generous" -> List.of("chi", "phi", "delta");
            default -> List.of("score", "phi", "delta", "p0");
        };
        for (String k : kv.keySet()) {
            if (!allowed.contains(k)) {
                throw new IllegalArgumentException("unknown parameter '" + k + "' in '" + spec + "'; " + kind
                    + " takes " + String.join(", ", allowed));
            }
        }
        double phi = kv.getOrDefault("phi", Double.NaN);
        double delta = kv.getOrDefault("delta", 1.0);
        if (!(delta > 0 && delta <= 1)) {
            throw new IllegalArgumentException("delta in '" + spec + "' must be in (0, 1] (1 = no discounting): "
                + Numbers.format(delta));
        }
        MemoryStrategy m;
        switch (kind) {
            case "extort":
                m = ZeroDeterminant.extortionate(game, player, required(kv, "chi", spec), phi, delta);
                break;
            case "generous":
                m = ZeroDeterminant.generous(game, player, required(kv, "chi", spec), phi, delta);
                break;
            default:
                m = ZeroDeterminant.equalizer(game, player, required(kv, "score", spec), phi, delta,
                    kv.getOrDefault("p0", 1.0));
                break;
        }
        return new MemoryStrategy(spec, 1, m.table(), m.initial());
    }

    /**
     * The zero-determinant parameters behind a spec, or null when the spec is not one of the three
     * zero-determinant forms.
     *
     * @param spec the spec
     * @param game the stage game
     * @param player whose strategy it is
     * @return the parameters, or null
     */
    static ZeroDeterminant.Parameters zeroDeterminantParameters(String spec, StageGame game, Player player) {
        String lower = spec.trim().toLowerCase(Locale.ROOT);
        int colon = lower.indexOf(':');
        String head = colon < 0 ? lower : lower.substring(0, colon).trim();
        String family = switch (head) {
            case "extort" -> "extortionate";
            case "generous" -> "generous";
            case "equalizer" -> "equalizer";
            default -> null;
        };
        if (family == null || lower.indexOf('@') >= 0) {
            return null;
        }
        Map<String, Double> kv = keyValues(spec, colon < 0 ? "" : lower.substring(colon + 1));
        double level = required(kv, family.equals("equalizer") ? "score" : "chi", spec);
        return ZeroDeterminant.parameters(family, game, player, level, kv.getOrDefault("phi", Double.NaN),
            kv.getOrDefault("delta", 1.0), kv.getOrDefault("p0", 1.0));
    }

    private static double required(Map<String, Double> kv, String key, String spec) {
        Double v = kv.get(key);
        if (v == null) {
            throw new IllegalArgumentException("'" + spec + "' needs " + key + "=..");
        }
        return v;
    }

    private static Map<String, Double> keyValues(String spec, String args) {
        Map<String, Double> kv = new LinkedHashMap<>();
        if (args.isBlank()) {
            return kv;
        }
        for (String part : args.split(",", -1)) {
            int eq = part.indexOf('=');
            if (eq < 0) {
                throw new IllegalArgumentException("zero-determinant parameters are written key=value: '" + part.trim()
                    + "' in '" + spec + "'");
            }
            String k = part.substring(0, eq).trim();
            if (kv.containsKey(k)) {
                throw new IllegalArgumentException("parameter '" + k + "' given twice in '" + spec + "'");
            }
            kv.put(k, Numbers.parse(k + " in '" + spec + "'", part.substring(eq + 1)));
        }
        return kv;
    }

    private static void checkProbabilities(String what, double[] v) {
        for (int i = 0; i < v.length; i++) {
            if (!(v[i] >= 0 && v[i] <= 1)) {
                throw new IllegalArgumentException(what + ": entry " + (i + 1) + " must be a probability in [0, 1]: "
                    + Numbers.format(v[i]));
            }
        }
    }

    private static MemoryStrategy table(String spec, int memory, double[] t, double p0) {
        return new MemoryStrategy(spec, memory, t, p0);
    }

    private static String shortSpec(String s) {
        return s.length() > 40 ? s.substring(0, 37) + "..." : s;
    }

    private static String known() {
        List<String> all = new ArrayList<>(NAMES);
        all.addAll(FORMS);
        return "known: " + String.join(", ", all);
    }
}
