package reprise.output;

/**
 * Fast decimal text of a double to 15 significant digits, for large tidy tables.
 *
 * <p>Implementation note. The value is scaled by a power of ten to an integer of 15 digits and rounded
 * once; the scaling multiplies or divides by exact powers of ten (at most 10^22, one extra step beyond),
 * so the scaled value has a relative error of at most about 2^-52 and the printed digits differ from the
 * correctly rounded ones by at most one unit in the 15th significant digit. Fifteen digits are what a
 * double always carries exactly through a decimal round trip (DBL_DIG = 15), so the printed number reads
 * back within a relative 1e-14 of the value. Trailing zeros are dropped; plain notation is used for decimal
 * exponents -5 to 14, scientific ({@code 1.5E-7}) otherwise; -0 prints as 0. Magnitudes outside
 * [1e-20, 1e20) go through {@link java.math.BigDecimal} (exact, slow, and written as {@code 1E+25}).
 *
 * <p>References:
 * IEEE 754-2008 (2008). IEEE Standard for Floating-Point Arithmetic, section 5.12.2 (decimal digits
 * that survive a round trip).
 */
final class Decimal15 {
    private static final double[] POW = new double[23];
    private static final long LOW = 100_000_000_000_000L;
    private static final long HIGH = 1_000_000_000_000_000L;

    static {
        double p = 1;
        for (int i = 0; i < POW.length; i++) {
            POW[i] = p;
            p *= 10;
        }
    }

    private Decimal15() {
    }

    /**
     * Appends the text of a value.
     *
     * @param sb where to append
     * @param value any double (NaN prints as NaN, infinities as Infinity and -Infinity)
     */
    static void append(StringBuilder sb, double value) {
        if (value == 0) {
            sb.append('0');
            return;
        }
        if (!Double.isFinite(value)) {
            sb.append(value);
            return;
        }
        double v = value;
        if (!(Math.abs(v) >= 1e-20 && Math.abs(v) < 1e20)) {
            sb.append(new java.math.BigDecimal(v).round(new java.math.MathContext(15)).stripTrailingZeros());
            return;
        }
        if (v < 0) {
            sb.append('-');
            v = -v;
        }
        byte[] digits = new byte[15];
        int e = digits(v, digits);
        char[] d = new char[15];
        for (int i = 0; i < 15; i++) {
            d[i] = (char) digits[i];
        }
        int nd = 15;
        while (nd > 1 && d[nd - 1] == '0') {
            nd--;
        }
        if (e >= -5 && e < 15) {
            if (e >= 0) {
                sb.append(d, 0, Math.min(nd, e + 1));
                for (int i = nd; i < e + 1; i++) {
                    sb.append('0');
                }
                if (nd > e + 1) {
                    sb.append('.').append(d, e + 1, nd - e - 1);
                }
            } else {
                sb.append("0.");
                for (int i = 0; i < -e - 1; i++) {
                    sb.append('0');
                }
                sb.append(d, 0, nd);
            }
        } else {
            sb.append(d[0]);
            if (nd > 1) {
                sb.append('.').append(d, 1, nd - 1);
            }
            sb.append('E').append(e);
        }
    }

    /**
     * The 15 significant decimal digits of a positive finite v in [1e-20, 1e20), rounded to nearest, as
     * ASCII digits, and its decimal exponent: v is about d[0].d[1]...d[14] x 10^e.
     *
     * @param v the value
     * @param d receives the 15 digits
     * @return e
     */
    private static int digits(double v, byte[] d) {
        // floor(log10 v) is floor(e2 log10 2) or one more, e2 the binary exponent
        int e = (int) Math.floor(Math.getExponent(v) * 0.30102999566398120);
        long m = Math.round(scale(v, 14 - e));
        while (m >= HIGH) {
            e++;
            m = Math.round(scale(v, 14 - e));
        }
        while (m < LOW) {
            e--;
            m = Math.round(scale(v, 14 - e));
        }
        int hi = (int) (m / 100_000_000L);
        int lo = (int) (m - hi * 100_000_000L);
        for (int i = 14; i >= 7; i--) {
            int q = lo / 10;
            d[i] = (byte) ('0' + lo - 10 * q);
            lo = q;
        }
        for (int i = 6; i >= 0; i--) {
            int q = hi / 10;
            d[i] = (byte) ('0' + hi - 10 * q);
            hi = q;
        }
        return e;
    }

    /**
     * Appends the text of a value as ASCII bytes: the same text as {@link #append(StringBuilder, double)}
     * (tested on many values), written without a char buffer.
     *
     * @param out where to append
     * @param value any double
     */
    static void append(AsciiBuffer out, double value) {
        if (value == 0) {
            out.put('0');
            return;
        }
        double v = value;
        if (!Double.isFinite(v) || !(Math.abs(v) >= 1e-20 && Math.abs(v) < 1e20)) {
            StringBuilder sb = new StringBuilder(32);
            append(sb, value);
            out.put(sb.toString());
            return;
        }
        out.reserve(40);
        if (v < 0) {
            out.putUnchecked((byte) '-');
            v = -v;
        }
        byte[] d = new byte[15];
        int e = digits(v, d);
        int nd = 15;
        while (nd > 1 && d[nd - 1] == '0') {
            nd--;
        }
        if (e >= -5 && e < 15) {
            if (e >= 0) {
                out.putUnchecked(d, 0, Math.min(nd, e + 1));
                for (int i = nd; i < e + 1; i++) {
                    out.putUnchecked((byte) '0');
                }
                if (nd > e + 1) {
                    out.putUnchecked((byte) '.');
                    out.putUnchecked(d, e + 1, nd - e - 1);
                }
            } else {
                out.putUnchecked((byte) '0');
                out.putUnchecked((byte) '.');
                for (int i = 0; i < -e - 1; i++) {
                    out.putUnchecked((byte) '0');
                }
                out.putUnchecked(d, 0, nd);
            }
        } else {
            out.putUnchecked(d[0]);
            if (nd > 1) {
                out.putUnchecked((byte) '.');
                out.putUnchecked(d, 1, nd - 1);
            }
            out.putUnchecked((byte) 'E');
            out.put(e);
        }
    }

    /** v * 10^k with exact powers of ten. */
    private static double scale(double v, int k) {
        if (k >= 0) {
            return k < POW.length ? v * POW[k] : v * POW[22] * POW[Math.min(22, k - 22)];
        }
        int j = -k;
        return j < POW.length ? v / POW[j] : v / POW[22] / POW[Math.min(22, j - 22)];
    }
}
