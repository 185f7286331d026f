package reprise.chain;

/**
 * Small dense linear-algebra helpers on {@code double[][]} (row-major) and {@code double[]} row vectors.
 *
 * <p>Hand-written rather than Commons Math {@code RealMatrix} because the hot loops here (repeated
 * squaring, vector-matrix products) run on raw arrays without boxing or copying.
 */
final class Dense {
    private Dense() {
    }

    static double[][] identity(int k) {
        double[][] a = new double[k][k];
        for (int i = 0; i < k; i++) {
            a[i][i] = 1;
        }
        return a;
    }

    static double[][] copy(double[][] a) {
        double[][] c = new double[a.length][];
        for (int i = 0; i < a.length; i++) {
            c[i] = a[i].clone();
        }
        return c;
    }

    /** A (r x m) times B (m x c). */
    static double[][] multiply(double[][] a, double[][] b) {
        int r = a.length;
        int m = b.length;
        int c = b[0].length;
        double[][] out = new double[r][c];
        for (int i = 0; i < r; i++) {
            double[] ai = a[i];
            double[] oi = out[i];
            for (int l = 0; l < m; l++) {
                double x = ai[l];
                if (x != 0) {
                    double[] bl = b[l];
                    for (int j = 0; j < c; j++) {
                        oi[j] += x * bl[j];
                    }
                }
            }
        }
        return out;
    }

    /** Row vector v (m) times B (m x c). */
    static double[] multiply(double[] v, double[][] b) {
        int c = b[0].length;
        double[] out = new double[c];
        for (int l = 0; l < v.length; l++) {
            double x = v[l];
            if (x != 0) {
                double[] bl = b[l];
                for (int j = 0; j < c; j++) {
                    out[j] += x * bl[j];
                }
            }
        }
        return out;
    }

    /** A + B, new array. */
    static double[][] add(double[][] a, double[][] b) {
        double[][] out = new double[a.length][];
        for (int i = 0; i < a.length; i++) {
            out[i] = a[i].clone();
            for (int j = 0; j < out[i].length; j++) {
                out[i][j] += b[i][j];
            }
        }
        return out;
    }

    /** a += b in place. */
    static void addTo(double[] a, double[] b) {
        for (int i = 0; i < a.length; i++) {
            a[i] += b[i];
        }
    }

    /**
     * P P for a stochastic P, with each row rescaled to sum to 1. Without the rescaling the row-sum defect
     * of about 1e-16 doubles with every squaring, so M^(2^30) would carry a relative error near 1e-7.
     */
    static double[][] squareStochastic(double[][] p) {
        double[][] out = multiply(p, p);
        for (double[] row : out) {
            double s = 0;
            for (double x : row) {
                s += x;
            }
            if (s > 0) {
                for (int j = 0; j < row.length; j++) {
                    row[j] /= s;
                }
            }
        }
        return out;
    }

    /** v M^t by repeated squaring; t &ge; 0. */
    static double[] power(double[] v, double[][] m, long t) {
        double[] y = v.clone();
        double[][] p = m;
        long e = t;
        while (e > 0) {
            if ((e & 1) == 1) {
                y = multiply(y, p);
            }
            e >>= 1;
            if (e > 0) {
                p = squareStochastic(p);
            }
        }
        return y;
    }
}
