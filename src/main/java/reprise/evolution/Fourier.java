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

    /** Twiddle factors cos and -sin of 2 pi j / L, j &lt; L / 2, for {@link #forward(double[], double[], double[][])}. */
    static double[][] twiddles(int n) {
        double[] cos = new double[n / 2];
        double[] sin = new double[n / 2];
        for (int j = 0; j < n / 2; j++) {
            double a = 2 * Math.PI * j / n;
            cos[j] = Math.cos(a);
            sin[j] = -Math.sin(a);
        }
        return new double[][] {cos, sin};
    }

    static void forward(double[] re, double[] im) {
        forward(re, im, twiddles(re.length));
    }

    static void forward(double[] re, double[] im, double[][] twiddles) {
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
        double[] cos = twiddles[0];
        double[] sin = twiddles[1];
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

    /**
     * The transforms of two real sequences by one complex transform: with z = x + i y,
     * X(w) = (Z(w) + conj Z(L - w)) / 2 and Y(w) = (Z(w) - conj Z(L - w)) / (2i), for w = 0..L/2.
     *
     * @return {Xre, Xim, Yre, Yim}, each of length L / 2 + 1
     */
    static double[][] forwardPair(double[] x, double[] y, double[][] twiddles) {
        int n = x.length;
        double[] re = x.clone();
        double[] im = y.clone();
        forward(re, im, twiddles);
        int h = n / 2 + 1;
        double[] xr = new double[h];
        double[] xi = new double[h];
        double[] yr = new double[h];
        double[] yi = new double[h];
        for (int w = 0; w < h; w++) {
            int m = (n - w) & (n - 1);
            xr[w] = 0.5 * (re[w] + re[m]);
            xi[w] = 0.5 * (im[w] - im[m]);
            yr[w] = 0.5 * (im[w] + im[m]);
            yi[w] = -0.5 * (re[w] - re[m]);
        }
        return new double[][] {xr, xi, yr, yi};
    }
}
