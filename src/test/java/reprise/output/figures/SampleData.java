package reprise.output.figures;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.apache.commons.rng.simple.RandomSource;

/**
 * Plausible made-up data for rendering the figures: a geometric approach to a stationary distribution,
 * with Gaussian scatter of the size sampling would give. Not a model of any real strategy pair.
 */
final class SampleData {
    private SampleData() {
    }

    static final double[] PI = {0.42, 0.18, 0.15, 0.25};
    static final double[] FIRST = {1.0, 0.0, 0.0, 0.0};
    static final double RATE = 0.8;

    /** Expected time-average frequency over the first n rounds when deviations decay like RATE^(t-1). */
    static double expectedFrequency(int s, double n) {
        return PI[s] + (FIRST[s] - PI[s]) * (1 - Math.pow(RATE, n)) / ((1 - RATE) * n);
    }

    static double probabilityInRound(int s, double t) {
        return PI[s] + (FIRST[s] - PI[s]) * Math.pow(RATE, t - 1);
    }

    static ConvergenceData convergence(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        ZigguratSampler.NormalizedGaussian z = ZigguratSampler.NormalizedGaussian.of(rng);
        double[] lengths = {10, 20, 50, 100, 200, 500, 1000, 2000, 5000, 10000};
        List<Estimates> sim = new ArrayList<>();
        List<Curve> exact = new ArrayList<>();
        for (int s = 0; s < 4; s++) {
            double[] est = new double[lengths.length];
            double[] lo = new double[lengths.length];
            double[] hi = new double[lengths.length];
            for (int i = 0; i < lengths.length; i++) {
                double se = 0.6 * Math.sqrt(PI[s] * (1 - PI[s]) / lengths[i]);
                est[i] = expectedFrequency(s, lengths[i]) + se * z.sample();
                lo[i] = est[i] - 1.96 * se;
                hi[i] = est[i] + 1.96 * se;
            }
            sim.add(new Estimates(lengths, est, lo, hi));
            double[] nx = new double[200];
            double[] ny = new double[200];
            for (int j = 0; j < nx.length; j++) {
                nx[j] = Math.pow(10, 1 + 3.0 * j / (nx.length - 1));
                ny[j] = expectedFrequency(s, nx[j]);
            }
            exact.add(new Curve(nx, ny));
        }
        return new ConvergenceData("", sim, exact, PI.clone());
    }

    static ErrorScalingData errorScaling(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        ZigguratSampler.NormalizedGaussian z = ZigguratSampler.NormalizedGaussian.of(rng);
        double[] lengths = {10, 20, 50, 100, 200, 500, 1000, 2000, 5000, 10000, 20000};
        double[] err = new double[lengths.length];
        for (int i = 0; i < lengths.length; i++) {
            double bias = expectedFrequency(0, lengths[i]) - PI[0];
            err[i] = Math.abs(bias + 0.05 / Math.sqrt(lengths[i]) * z.sample());
        }
        double[] nx = new double[100];
        double[] ny = new double[100];
        for (int j = 0; j < nx.length; j++) {
            nx[j] = Math.pow(10, 1 + Math.log10(2000) * j / (nx.length - 1));
            ny[j] = Math.abs(expectedFrequency(0, nx[j]) - PI[0]);
        }
        return new ErrorScalingData("", "CC frequency", lengths, err, new Curve(nx, ny));
    }

    static PayoffData payoff(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        ZigguratSampler.NormalizedGaussian z = ZigguratSampler.NormalizedGaussian.of(rng);
        double[] dx = new double[100];
        double[] ux = new double[100];
        double[] uy = new double[100];
        for (int j = 0; j < dx.length; j++) {
            dx[j] = 0.99 * j / (dx.length - 1);
            ux[j] = 2.2 + 0.6 * dx[j] * dx[j];
            uy[j] = 2.6 - 0.3 * dx[j];
        }
        double[] d = {0.1, 0.3, 0.5, 0.7, 0.8, 0.9, 0.95, 0.99};
        double[][] est = new double[2][d.length];
        double[][] lo = new double[2][d.length];
        double[][] hi = new double[2][d.length];
        for (int i = 0; i < d.length; i++) {
            double se = 0.02 / Math.sqrt(1 - d[i]);
            est[0][i] = 2.2 + 0.6 * d[i] * d[i] + se * z.sample();
            est[1][i] = 2.6 - 0.3 * d[i] + se * z.sample();
            for (int p = 0; p < 2; p++) {
                lo[p][i] = est[p][i] - 1.96 * se;
                hi[p][i] = est[p][i] + 1.96 * se;
            }
        }
        return new PayoffData("", "normalised discounted payoff per round", new Curve(dx, ux), new Curve(dx, uy),
            new Estimates(d, est[0], lo[0], hi[0]), new Estimates(d, est[1], lo[1], hi[1]));
    }

    static StateDistributionData stateDistribution(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        ZigguratSampler.NormalizedGaussian z = ZigguratSampler.NormalizedGaussian.of(rng);
        int games = 400;
        double[] snaps = {1, 2, 3, 5, 8, 12, 20, 30};
        List<Curve> exact = new ArrayList<>();
        List<Estimates> sim = new ArrayList<>();
        for (int s = 0; s < 4; s++) {
            double[] t = new double[30];
            double[] p = new double[30];
            for (int j = 0; j < t.length; j++) {
                t[j] = j + 1;
                p[j] = probabilityInRound(s, t[j]);
            }
            exact.add(new Curve(t, p));
            double[] est = new double[snaps.length];
            double[] lo = new double[snaps.length];
            double[] hi = new double[snaps.length];
            for (int i = 0; i < snaps.length; i++) {
                double q = probabilityInRound(s, snaps[i]);
                double se = Math.sqrt(q * (1 - q) / games);
                est[i] = Math.min(1, Math.max(0, q + se * z.sample()));
                lo[i] = Math.max(0, est[i] - 1.96 * se);
                hi[i] = Math.min(1, est[i] + 1.96 * se);
            }
            sim.add(new Estimates(snaps, est, lo, hi));
        }
        return new StateDistributionData("", exact, sim);
    }

    static CalibrationData calibration(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int k = 200;
        double[] good = new double[k];
        double[] liberal = new double[k];
        double[] conservative = new double[k];
        for (int i = 0; i < k; i++) {
            good[i] = rng.nextDouble();
            liberal[i] = Math.pow(rng.nextDouble(), 1.5);
            conservative[i] = Math.pow(rng.nextDouble(), 0.7);
        }
        return new CalibrationData("", List.of(new PValueSample("batch-means z test", good),
            new PValueSample("naive binomial test", liberal), new PValueSample("chi-squared test", conservative)));
    }

    static GridAxes gridAxes() {
        return new GridAxes("execution error \u03b5", List.of("0", "0.001", "0.01", "0.02", "0.05", "0.1"),
            "game length n (rounds)", List.of("10", "100", "1000", "10000", "100000"));
    }

    static GridValues gridValues() {
        double[][] v = new double[5][6];
        for (int r = 0; r < 5; r++) {
            for (int c = 0; c < 6; c++) {
                v[r][c] = Math.abs(3.0 / Math.sqrt(r + 1) * Math.exp(-c * 0.3) + 0.1 * ((r * 7 + c * 3) % 5));
            }
        }
        return new GridValues("", gridAxes(), "|observed \u2212 exact| / standard error", v);
    }

    static GridVerdicts gridVerdicts() {
        int[][] v = new int[5][6];
        for (int r = 0; r < 5; r++) {
            for (int c = 0; c < 6; c++) {
                v[r][c] = r + c < 3 ? 2 : (r + c < 5 ? 1 : 0);
            }
        }
        return new GridVerdicts("", gridAxes(), List.of("consistent", "inconclusive", "deviates"), v);
    }
}
