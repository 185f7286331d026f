package reprise.output;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/**
 * A growable buffer of ASCII bytes for writing large CSV files: text goes straight into bytes, without the
 * char-to-byte work of a {@link StringBuilder} and a later {@code String.getBytes}. Only for text whose
 * characters are all below 128 (numbers, identifiers the program makes, quoted names written as
 * ISO-8859-1 like the rest of the sweep CSV).
 */
final class AsciiBuffer {

    private byte[] bytes;
    private int size;

    /** @param capacity the initial capacity in bytes */
    AsciiBuffer(int capacity) {
        bytes = new byte[Math.max(16, capacity)];
    }

    /** Makes room for {@code more} bytes. */
    void reserve(int more) {
        if (size + more > bytes.length) {
            bytes = Arrays.copyOf(bytes, Math.max(bytes.length * 2, size + more));
        }
    }

    /** @param c one ASCII character */
    void put(char c) {
        reserve(1);
        bytes[size++] = (byte) c;
    }

    /** @param s text, each character written as its ISO-8859-1 byte */
    void put(String s) {
        int n = s.length();
        reserve(n);
        for (int i = 0; i < n; i++) {
            bytes[size + i] = (byte) s.charAt(i);
        }
        size += n;
    }

    /** @param other another buffer, appended */
    void put(AsciiBuffer other) {
        reserve(other.size);
        System.arraycopy(other.bytes, 0, bytes, size, other.size);
        size += other.size;
    }

    /** @param v a whole number, in decimal */
    void put(long v) {
        put(Long.toString(v));
    }

    /** Writes a byte at the end, the caller having reserved room. */
    void putUnchecked(byte b) {
        bytes[size++] = b;
    }

    /** Writes bytes at the end, the caller having reserved room. */
    void putUnchecked(byte[] src, int offset, int length) {
        System.arraycopy(src, offset, bytes, size, length);
        size += length;
    }

    /** @return the number of bytes written */
    int size() {
        return size;
    }

    /** @return the bytes written (a copy) */
    byte[] toByteArray() {
        return Arrays.copyOf(bytes, size);
    }

    /** @return the bytes as text */
    @Override
    public String toString() {
        return new String(bytes, 0, size, StandardCharsets.ISO_8859_1);
    }
}
