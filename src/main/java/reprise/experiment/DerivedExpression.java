package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * A small parser of derived-quantity expressions, of our own (no scripting engine): numbers, base
 * quantity names ({@code CC}, {@code coop_x}, {@code payoff_y}, ...), {@code +}, {@code -} (also unary),
 * {@code *} and parentheses, for an affine combination of the quantities; and the ratio form
 * {@code ratio(A, B)} of two such combinations, only at the top.
 *
 * <p>Grammar (recursive descent, one token of look-ahead):
 * <pre>
 *   top    = "ratio" "(" sum "," sum ")" | sum
 *   sum    = term { ("+" | "-") term }
 *   term   = unary { "*" unary }        (at most one factor of a product may hold a quantity)
 *   unary  = "-" unary | atom
 *   atom   = number | name | "(" sum ")"
 * </pre>
 * Numbers are decimal, with an optional fraction and exponent ({@code 1}, {@code 0.5}, {@code 2e-3});
 * a product of two quantities is refused, since the result would not be linear in the counts. Errors
 * name the character position (from 1) and what was expected.
 */
final class DerivedExpression {

    /** The ratio form's keyword. */
    static final String RATIO = "ratio";

    private final String text;
    private int pos;

    private DerivedExpression(String text) {
        this.text = text;
    }

    /**
     * A parsed expression: a linear form, or a ratio of two.
     *
     * @param numerator the combination (the numerator of a ratio)
     * @param denominator the ratio's denominator, or null for a linear combination
     */
    record Parsed(LinearForm numerator, LinearForm denominator) {
    }

    /**
     * Parses an expression.
     *
     * @param text the expression
     * @return the parsed form
     * @throws IllegalArgumentException with a one-line message naming the position
     */
    static Parsed parse(String text) {
        DerivedExpression p = new DerivedExpression(text);
        p.skip();
        Parsed out;
        int save = p.pos;
        String word = p.peekName();
        if (RATIO.equals(word)) {
            p.pos += RATIO.length();
            p.skip();
            p.expect('(');
            LinearForm a = p.sum();
            p.expect(',');
            LinearForm b = p.sum();
            p.expect(')');
            if (b.isConstant() && b.constant() == 0) {
                throw new IllegalArgumentException("the ratio's denominator is 0");
            }
            out = new Parsed(a, b);
        } else {
            p.pos = save;
            out = new Parsed(p.sum(), null);
        }
        if (p.pos < text.length()) {
            throw p.error("unexpected '" + text.charAt(p.pos) + "'");
        }
        if (out.denominator() == null && out.numerator().isConstant()) {
            throw new IllegalArgumentException("names no quantity (a derived quantity combines quantities such as "
                + "payoff_x)");
        }
        return out;
    }

    private LinearForm sum() {
        LinearForm acc = term();
        while (pos < text.length() && (text.charAt(pos) == '+' || text.charAt(pos) == '-')) {
            double sign = text.charAt(pos) == '+' ? 1 : -1;
            pos++;
            skip();
            acc = acc.plus(term(), sign);
        }
        return acc;
    }

    private LinearForm term() {
        int start = pos;
        LinearForm acc = unary();
        while (pos < text.length() && text.charAt(pos) == '*') {
            pos++;
            skip();
            LinearForm next = unary();
            if (acc.isConstant()) {
                acc = next.times(acc.constant());
            } else if (next.isConstant()) {
                acc = acc.times(next.constant());
            } else {
                pos = start;
                throw error("a product of two quantities is not linear; multiply quantities by numbers only");
            }
        }
        return acc;
    }

    private LinearForm unary() {
        if (pos < text.length() && text.charAt(pos) == '-') {
            pos++;
            skip();
            return unary().times(-1);
        }
        return atom();
    }

    private LinearForm atom() {
        if (pos >= text.length()) {
            throw error("expected a number, a quantity or '(' but the expression ends");
        }
        char ch = text.charAt(pos);
        if (ch == '(') {
            pos++;
            skip();
            LinearForm inner = sum();
            expect(')');
            return inner;
        }
        if (Character.isDigit(ch) || ch == '.') {
            return LinearForm.constant(number());
        }
        String name = peekName();
        if (name != null) {
            int at = pos;
            pos += name.length();
            skip();
            for (BaseQuantity q : BaseQuantity.values()) {
                if (q.label().equals(name)) {
                    return LinearForm.of(q);
                }
            }
            pos = at;
            List<String> known = new ArrayList<>();
            for (BaseQuantity q : BaseQuantity.values()) {
                known.add(q.label());
            }
            throw error("unknown quantity '" + name + "'" + Problems.didYouMean(name, known) + "; known: "
                + String.join(", ", known) + (name.equals(RATIO) ? " (ratio(A, B) is allowed only as the whole "
                + "expression)" : ""));
        }
        throw error("expected a number, a quantity or '(' but found '" + ch + "'");
    }

    private double number() {
        int start = pos;
        while (pos < text.length() && (Character.isDigit(text.charAt(pos)) || text.charAt(pos) == '.')) {
            pos++;
        }
        if (pos < text.length() && (text.charAt(pos) == 'e' || text.charAt(pos) == 'E')) {
            int save = pos;
            pos++;
            if (pos < text.length() && (text.charAt(pos) == '+' || text.charAt(pos) == '-')) {
                pos++;
            }
            if (pos < text.length() && Character.isDigit(text.charAt(pos))) {
                while (pos < text.length() && Character.isDigit(text.charAt(pos))) {
                    pos++;
                }
            } else {
                pos = save;
            }
        }
        String t = text.substring(start, pos);
        double v;
        try {
            v = Double.parseDouble(t);
        } catch (NumberFormatException e) {
            pos = start;
            throw error("not a number: '" + t + "'");
        }
        if (!Double.isFinite(v)) {
            pos = start;
            throw error("the number " + t + " is not finite");
        }
        skip();
        return v;
    }

    /** The name (letters, digits, '_', starting with a letter) at the position, or null. */
    private String peekName() {
        if (pos >= text.length() || !Character.isLetter(text.charAt(pos))) {
            return null;
        }
        int end = pos;
        while (end < text.length() && (Character.isLetterOrDigit(text.charAt(end)) || text.charAt(end) == '_')) {
            end++;
        }
        return text.substring(pos, end);
    }

    private void expect(char ch) {
        if (pos >= text.length() || text.charAt(pos) != ch) {
            throw error("expected '" + ch + "'" + (pos >= text.length() ? " but the expression ends"
                : " but found '" + text.charAt(pos) + "'"));
        }
        pos++;
        skip();
    }

    private void skip() {
        while (pos < text.length() && Character.isWhitespace(text.charAt(pos))) {
            pos++;
        }
    }

    private IllegalArgumentException error(String what) {
        return new IllegalArgumentException(String.format(Locale.ROOT, "%s at character %d of '%s'", what, pos + 1,
            text));
    }
}
