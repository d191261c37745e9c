package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;

/**
 * Shared pieces of the penalised logistic models {@link ClassModel} and {@link SuccessModel}:
 * the feature map, fold assignment and a small dense SPD solver.
 *
 * @since 0.1
 */
final class ClassModelSupport {

    private ClassModelSupport() {
    }

    /**
     * Features of a design point: an intercept 1, each continuous coordinate as u = 2x &minus; 1
     * (so the centre of the box is 0 and the box is [&minus;1, 1]), optionally u&sup2; &minus; 1/3
     * (centred for a uniform u), and a 0/1 indicator per level seen in training. A level index
     * beyond those seen in training gets all-zero indicators, that is no level effect.
     *
     * @param dims        number of continuous coordinates
     * @param levelCounts indicator columns per categorical setting
     * @param squared     whether squared terms are included
     */
    record FeatureMap(int dims, int[] levelCounts, boolean squared) {

        FeatureMap {
            levelCounts = levelCounts.clone();
        }

        /** The map fitted to training points: level counts are the largest index seen plus one. */
        static FeatureMap of(List<DesignPoint> x, boolean squared) {
            if (x.isEmpty()) {
                return new FeatureMap(0, new int[0], squared);
            }
            DesignPoint first = x.get(0);
            int[] counts = new int[first.levelCount()];
            for (DesignPoint p : x) {
                if (p.dimensions() != first.dimensions() || p.levelCount() != first.levelCount()) {
                    throw new IllegalArgumentException("design points of different shapes");
                }
                for (int j = 0; j < counts.length; j++) {
                    if (p.level(j) < 0) {
                        throw new IllegalArgumentException("negative level index: " + p.level(j));
                    }
                    counts[j] = Math.max(counts[j], p.level(j) + 1);
                }
            }
            return new FeatureMap(first.dimensions(), counts, squared);
        }

        /** Number of features, the intercept included. */
        int size() {
            int s = 1 + dims * (squared ? 2 : 1);
            for (int c : levelCounts) {
                s += c;
            }
            return s;
        }

        /** Features of one point. */
        double[] map(DesignPoint p) {
            if (p.dimensions() != dims || p.levelCount() != levelCounts.length) {
                throw new IllegalArgumentException("design point shape " + p.dimensions() + "+" + p.levelCount()
                        + " differs from the training shape " + dims + "+" + levelCounts.length);
            }
            double[] f = new double[size()];
            int q = 0;
            f[q++] = 1.0;
            for (int i = 0; i < dims; i++) {
                f[q++] = 2.0 * p.x(i) - 1.0;
            }
            if (squared) {
                for (int i = 0; i < dims; i++) {
                    double u = 2.0 * p.x(i) - 1.0;
                    f[q++] = u * u - 1.0 / 3.0;
                }
            }
            for (int j = 0; j < levelCounts.length; j++) {
                int lv = p.level(j);
                if (lv >= 0 && lv < levelCounts[j]) {
                    f[q + lv] = 1.0;
                }
                q += levelCounts[j];
            }
            return f;
        }

        /** Features of many points. */
        double[][] map(List<DesignPoint> x) {
            double[][] out = new double[x.size()][];
            for (int i = 0; i < out.length; i++) {
                out[i] = map(x.get(i));
            }
            return out;
        }

        @Override
        public int[] levelCounts() {
            return levelCounts.clone();
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof FeatureMap && ((FeatureMap) o).dims == dims && ((FeatureMap) o).squared == squared
                    && Arrays.equals(((FeatureMap) o).levelCounts, levelCounts);
        }

        @Override
        public int hashCode() {
            return 31 * (31 * dims + Arrays.hashCode(levelCounts)) + (squared ? 1 : 0);
        }
    }

    /**
     * Fold labels for cross-validation: leave-one-out up to {@code looUpTo} runs, otherwise
     * {@code k} folds of a seeded shuffle.
     *
     * @return fold index per run and, as the last element of the array pair, the number of folds
     */
    static int[][] folds(int n, int k, int looUpTo, long seed) {
        int[] fold = new int[n];
        int count;
        if (n <= looUpTo) {
            for (int i = 0; i < n; i++) {
                fold[i] = i;
            }
            count = n;
        } else {
            int[] order = new int[n];
            for (int i = 0; i < n; i++) {
                order[i] = i;
            }
            SplittableRandom rng = new SplittableRandom(seed);
            for (int i = n - 1; i > 0; i--) {
                int r = rng.nextInt(i + 1);
                int t = order[i];
                order[i] = order[r];
                order[r] = t;
            }
            count = Math.min(k, n);
            for (int i = 0; i < n; i++) {
                fold[order[i]] = i % count;
            }
        }
        return new int[][] {fold, {count}};
    }

    /** Indices with fold != f (train) or == f (test). */
    static int[] indices(int[] fold, int f, boolean test) {
        List<Integer> out = new ArrayList<>();
        for (int i = 0; i < fold.length; i++) {
            if ((fold[i] == f) == test) {
                out.add(i);
            }
        }
        int[] a = new int[out.size()];
        for (int i = 0; i < a.length; i++) {
            a[i] = out.get(i);
        }
        return a;
    }

    /**
     * Solves A x = b for a symmetric positive-definite A by Cholesky, adding a small multiple of
     * the mean diagonal if the factorisation meets a non-positive pivot.
     */
    static double[] solveSpd(double[][] a, double[] b) {
        int n = b.length;
        double meanDiag = 0;
        for (int i = 0; i < n; i++) {
            meanDiag += a[i][i];
        }
        meanDiag = Math.max(meanDiag / Math.max(1, n), 1e-300);
        double jitter = 0;
        for (int attempt = 0; attempt < 12; attempt++) {
            double[][] l = cholesky(a, jitter);
            if (l != null) {
                double[] y = new double[n];
                for (int i = 0; i < n; i++) {
                    double s = b[i];
                    for (int k = 0; k < i; k++) {
                        s -= l[i][k] * y[k];
                    }
                    y[i] = s / l[i][i];
                }
                double[] x = new double[n];
                for (int i = n - 1; i >= 0; i--) {
                    double s = y[i];
                    for (int k = i + 1; k < n; k++) {
                        s -= l[k][i] * x[k];
                    }
                    x[i] = s / l[i][i];
                }
                return x;
            }
            jitter = jitter == 0 ? 1e-12 * meanDiag : jitter * 10;
        }
        throw new IllegalStateException("Newton system is not positive definite");
    }

    private static double[][] cholesky(double[][] a, double jitter) {
        int n = a.length;
        double[][] l = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                double s = a[i][j] + (i == j ? jitter : 0.0);
                for (int k = 0; k < j; k++) {
                    s -= l[i][k] * l[j][k];
                }
                if (i == j) {
                    if (!(s > 0) || !Double.isFinite(s)) {
                        return null;
                    }
                    l[i][i] = Math.sqrt(s);
                } else {
                    l[i][j] = s / l[j][j];
                }
            }
        }
        return l;
    }

    /** Checks that every value is finite. */
    static void checkFinite(double[] v, String what) {
        for (double d : v) {
            if (!Double.isFinite(d)) {
                throw new IllegalStateException(what + " is not finite");
            }
        }
    }
}
