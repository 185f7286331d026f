package reprise.evolution;

/**
 * An in-place iterative radix-2 complex discrete Fourier transform,
 * X(w) = sum_j x(j) exp(-2 pi i w j / L), for lengths L a power of two.
 *
 * <p>Implementation note. Cooley-Tukey decimation in time with bit-reversal; twiddle factors are taken
 * from one table of cos and sin of 2 pi j / L computed directly (not by recurrence), so the rounding
 * error of each output is about eps log2(L) times the root-sum-square of the inputs.
 *
 * <p>References: Cooley, J.W. &amp; Tukey, J.W. (1965). An algorithm for the machine calculation of complex
 * Fourier series. Mathematics of Computation 19, 297-301.
 */
final class Fourier {
    private Fourier() {
    }

    static int lengthFor(long points) {
        int l = 1;
        while (l < points) {
            l <<= 1;
            if (l <= 0) {
                throw new IllegalArgumentException("transform too long: " + points);
            }
        }
        return Math.max(l, 2);
    }

    static void forward(double[] re, double[] im) {
        int n = re.length;
        for (int i = 1, j = 0; i < n; i++) {
            int bit = n >> 1;
            for (; (j & bit) != 0; bit >>= 1) {
                j ^= bit;
            }
            j ^= bit;
            if (i < j) {
                double t = re[i];
                re[i] = re[j];
                re[j] = t;
                t = im[i];
                im[i] = im[j];
                im[j] = t;
            }
        }
        double[] cos = new double[n / 2];
        double[] sin = new double[n / 2];
        for (int j = 0; j < n / 2; j++) {
            double a = 2 * Math.PI * j / n;
            cos[j] = Math.cos(a);
            sin[j] = -Math.sin(a);
        }
        for (int len = 2; len <= n; len <<= 1) {
            int half = len >> 1;
            int stride = n / len;
            for (int i = 0; i < n; i += len) {
                for (int k = 0; k < half; k++) {
                    double wr = cos[k * stride];
                    double wi = sin[k * stride];
                    int a = i + k;
                    int b = a + half;
                    double xr = re[b] * wr - im[b] * wi;
                    double xi = re[b] * wi + im[b] * wr;
                    re[b] = re[a] - xr;
                    im[b] = im[a] - xi;
                    re[a] += xr;
                    im[a] += xi;
                }
            }
        }
    }
}
