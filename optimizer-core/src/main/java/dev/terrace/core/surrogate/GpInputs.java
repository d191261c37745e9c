package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;

import java.util.List;
import java.util.Objects;
import java.util.SplittableRandom;

/**
 * Input checks and the small numerics of {@link GaussianProcess}: outcome and prior-mean validation,
 * residuals, overflow-safe mean and sd, and the seeded subset for large data sets.
 *
 * @since 0.2
 */
final class GpInputs {

    private GpInputs() {
    }

    static int checkRuns(List<DesignPoint> x, double[] y) {
        Objects.requireNonNull(x, "x");
        Objects.requireNonNull(y, "y");
        if (x.isEmpty()) {
            throw new IllegalArgumentException("at least one run is needed");
        }
        if (x.size() != y.length) {
            throw new IllegalArgumentException("runs and outcomes differ in number: " + x.size() + " vs " + y.length);
        }
        int d = x.get(0).dimensions();
        int c = x.get(0).levelCount();
        for (int i = 0; i < y.length; i++) {
            DesignPoint p = Objects.requireNonNull(x.get(i), "design point");
            if (p.dimensions() != d || p.levelCount() != c) {
                throw new IllegalArgumentException("run " + i + " has another number of settings");
            }
            if (!Double.isFinite(y[i])) {
                throw new IllegalArgumentException("outcome " + i + " is not finite: " + y[i]);
            }
        }
        return y.length;
    }

    static double[] priorAtRuns(double[] priorMean, int n) {
        if (priorMean == null) {
            return null;
        }
        if (priorMean.length != n) {
            throw new IllegalArgumentException("prior mean has " + priorMean.length + " values for " + n + " runs");
        }
        boolean allNaN = true;
        for (double v : priorMean) {
            allNaN &= Double.isNaN(v);
        }
        if (allNaN) {
            return null;
        }
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(priorMean[i])) {
                throw new IllegalArgumentException("prior mean must be finite at every run or NaN at all: run " + i);
            }
        }
        return priorMean.clone();
    }

    static double[][] encode(List<DesignPoint> x) {
        double[][] f = new double[x.size()][];
        for (int i = 0; i < f.length; i++) {
            f[i] = GpKernel.encode(x.get(i));
        }
        return f;
    }

    static double[] residuals(double[] y, double[] m) {
        double[] r = new double[y.length];
        for (int i = 0; i < r.length; i++) {
            r[i] = y[i] - (m == null ? 0 : m[i]);
            if (!Double.isFinite(r[i])) {
                throw new IllegalArgumentException("outcome minus prior mean overflows at run " + i);
            }
        }
        return r;
    }

    /** Mean, summed as v/n so that values near the double range cannot overflow. */
    static double mean(double[] a) {
        double s = 0;
        for (double v : a) {
            s += v / a.length;
        }
        return s;
    }

    /** Sample sd (n − 1), on values divided by their largest magnitude so that squares cannot overflow. */
    static double sampleSd(double[] a, double mean) {
        double big = 0;
        for (double v : a) {
            big = Math.max(big, Math.abs(v - mean));
        }
        if (!(big > 0) || !Double.isFinite(big)) {
            return 0;
        }
        double s = 0;
        for (double v : a) {
            double u = (v - mean) / big;
            s += u * u;
        }
        return big * Math.sqrt(s / (a.length - 1));
    }

    static double magnitude(double[] y, double[] m) {
        double mag = 0;
        for (int i = 0; i < y.length; i++) {
            mag = Math.max(mag, Math.abs(y[i]));
            if (m != null) {
                mag = Math.max(mag, Math.abs(m[i]));
            }
        }
        return mag > 0 && Double.isFinite(mag) ? mag : 1.0;
    }

    /** Seeded partial Fisher–Yates draw of k distinct indices from n, in increasing order. */
    static int[] subset(int n, int k, SplittableRandom rng) {
        int[] idx = new int[n];
        for (int i = 0; i < n; i++) {
            idx[i] = i;
        }
        for (int i = 0; i < k; i++) {
            int j = i + rng.nextInt(n - i);
            int t = idx[i];
            idx[i] = idx[j];
            idx[j] = t;
        }
        int[] out = java.util.Arrays.copyOf(idx, k);
        java.util.Arrays.sort(out);
        return out;
    }
}
