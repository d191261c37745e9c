package dev.terrace.core.design;

import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.SplittableRandom;
import java.util.random.RandomGenerator;

/**
 * Latin hypercube designs on the unit cube, improved for the maximin distance, with balanced
 * categorical levels.
 *
 * <p>A Latin hypercube sample (McKay, Beckman &amp; Conover 1979, <i>Technometrics</i> 21:239)
 * of n points in [0, 1]<sup>d</sup> places x<sub>ij</sub> = (&pi;<sub>j</sub>(i) &minus; 1 + u<sub>ij</sub>)/n
 * with &pi;<sub>j</sub> an independent random permutation of 1..n per axis, so that every one of
 * the n strata of every axis holds exactly one point; u = 1/2 gives the midpoint design,
 * u ~ U(0, 1) the jittered one. Swapping two entries within a column keeps that property, so the
 * design is improved by a stochastic search over such swaps (Morris &amp; Mitchell 1995,
 * <i>J. Stat. Plan. Inference</i> 43:381, who used simulated annealing over the same moves) for
 * the criterion &phi;<sub>p</sub> = (&Sigma;<sub>i&lt;j</sub> d<sub>ij</sub><sup>&minus;p</sup>)<sup>1/p</sup>,
 * which ranks designs like the maximin distance min d<sub>ij</sub> of Johnson, Moore &amp;
 * Ylvisaker 1990 (<i>J. Stat. Plan. Inference</i> 26:131) as p grows while also rewarding fewer
 * pairs at that distance.
 *
 * <p>Categorical settings are columns of balanced levels (level counts differing by at most one)
 * that take part in the same swaps; distances are measured as in
 * {@link DesignSpace#distance(DesignPoint, DesignPoint)}: Euclidean over the unit cube plus 1 per
 * differing level.
 *
 * <p>All randomness comes from the generator (or seed) passed in: a design is a function of its
 * arguments.
 *
 * @since 0.1
 */
public final class LatinHypercube {

    /**
     * Exponent p = 50 of the &phi;<sub>p</sub> criterion: large enough that &phi;<sub>p</sub>
     * orders designs by their smallest distances first [practice; Morris &amp; Mitchell 1995
     * studied p from 1 to 100, from memory].
     */
    public static final double DEFAULT_P = 50.0;

    /** Default number of proposed swaps, 10 000: ample for the 10&ndash;100-point designs of a campaign [practice]. */
    public static final int DEFAULT_ITERATIONS = 10_000;

    /**
     * Starting temperature 0.01 of the annealing on ln &phi;<sub>p</sub>: a swap that worsens
     * &phi;<sub>p</sub> by 1 % is first accepted with probability 1/e [practice].
     */
    public static final double INITIAL_TEMPERATURE = 0.01;

    /** Final temperature 1e-5, reached geometrically on the last swap: the search ends greedy [practice]. */
    public static final double FINAL_TEMPERATURE = 1e-5;

    /** Cap on one scaled pair term, so that coincident points leave the sums finite. */
    private static final double TERM_CAP = 1e250;

    /** Where a point lies inside its stratum. */
    public enum Placement {
        /** At the centre of the stratum, u = 1/2. */
        MIDPOINT,
        /** Uniformly at random inside the stratum. */
        JITTERED
    }

    private LatinHypercube() {
    }

    /**
     * A plain random Latin hypercube.
     *
     * @param n         number of points, &ge; 1
     * @param d         number of dimensions, &ge; 1
     * @param rng       source of randomness; never null
     * @param placement where points sit inside their strata; never null
     * @return n rows of d coordinates in [0, 1); never null
     */
    public static double[][] random(int n, int d, RandomGenerator rng, Placement placement) {
        checkSizes(n, d, 1);
        Objects.requireNonNull(rng, "rng");
        Objects.requireNonNull(placement, "placement");
        return transpose(randomColumns(n, d, rng, placement), n, d);
    }

    /**
     * A maximin-improved midpoint Latin hypercube from a seed.
     *
     * @param n          number of points, &ge; 1
     * @param d          number of dimensions, &ge; 1
     * @param seed       seed of a {@link SplittableRandom}
     * @param iterations number of proposed swaps, &ge; 0 (0 gives the plain random design)
     * @return n rows of d coordinates in [0, 1); never null
     */
    public static double[][] maximin(int n, int d, long seed, int iterations) {
        return maximin(n, d, new SplittableRandom(seed), iterations, Placement.MIDPOINT);
    }

    /**
     * A maximin-improved midpoint Latin hypercube.
     *
     * @param n          number of points, &ge; 1
     * @param d          number of dimensions, &ge; 1
     * @param rng        source of randomness; never null
     * @param iterations number of proposed swaps, &ge; 0
     * @return n rows of d coordinates in [0, 1); never null
     */
    public static double[][] maximin(int n, int d, RandomGenerator rng, int iterations) {
        return maximin(n, d, rng, iterations, Placement.MIDPOINT);
    }

    /**
     * A maximin-improved Latin hypercube: starts from {@link #random(int, int, RandomGenerator, Placement)}
     * drawn from the same generator and returns the best design (lowest &phi;<sub>p</sub>, p =
     * {@link #DEFAULT_P}) met by the swap search, never one worse than the start.
     *
     * @param n          number of points, &ge; 1
     * @param d          number of dimensions, &ge; 1
     * @param rng        source of randomness; never null
     * @param iterations number of proposed swaps, &ge; 0
     * @param placement  where points sit inside their strata; never null
     * @return n rows of d coordinates in [0, 1); never null
     */
    public static double[][] maximin(int n, int d, RandomGenerator rng, int iterations, Placement placement) {
        checkSizes(n, d, 1);
        checkIterations(iterations);
        Objects.requireNonNull(rng, "rng");
        Objects.requireNonNull(placement, "placement");
        double[][] cols = randomColumns(n, d, rng, placement);
        double[][] best = new Search(cols, new boolean[d], DEFAULT_P).run(rng, iterations);
        return transpose(best, n, d);
    }

    /**
     * A maximin design over a mixed space from a seed: midpoint Latin hypercube coordinates plus
     * balanced categorical levels, improved together.
     *
     * @param n           number of points, &ge; 1
     * @param d           number of continuous dimensions, &ge; 0
     * @param levelCounts number of levels of each categorical setting, each &ge; 1; never null
     * @param seed        seed of a {@link SplittableRandom}
     * @param iterations  number of proposed swaps, &ge; 0
     * @return the n design points; never null
     */
    public static List<DesignPoint> maximinPoints(int n, int d, int[] levelCounts, long seed, int iterations) {
        return maximinPoints(n, d, levelCounts, new SplittableRandom(seed), iterations, Placement.MIDPOINT);
    }

    /**
     * A maximin design over a mixed space. The continuous columns form a Latin hypercube, each
     * categorical column holds its levels in balanced numbers
     * ({@link #balancedLevels(int, int[], RandomGenerator)}); swaps within any column keep both
     * properties while the search lowers &phi;<sub>p</sub> of the distances of
     * {@link DesignSpace#distance(DesignPoint, DesignPoint)}.
     *
     * @param n           number of points, &ge; 1
     * @param d           number of continuous dimensions, &ge; 0
     * @param levelCounts number of levels of each categorical setting, each &ge; 1; never null
     * @param rng         source of randomness; never null
     * @param iterations  number of proposed swaps, &ge; 0
     * @param placement   where points sit inside their strata; never null
     * @return the n design points; never null
     */
    public static List<DesignPoint> maximinPoints(int n, int d, int[] levelCounts, RandomGenerator rng,
                                                  int iterations, Placement placement) {
        Objects.requireNonNull(levelCounts, "levelCounts");
        checkSizes(n, d, 0);
        checkIterations(iterations);
        Objects.requireNonNull(rng, "rng");
        Objects.requireNonNull(placement, "placement");
        int c = levelCounts.length;
        double[][] cols = new double[d + c][];
        boolean[] categorical = new boolean[d + c];
        double[][] cont = randomColumns(n, d, rng, placement);
        System.arraycopy(cont, 0, cols, 0, d);
        int[][] levels = balancedLevels(n, levelCounts, rng);
        for (int j = 0; j < c; j++) {
            categorical[d + j] = true;
            cols[d + j] = new double[n];
            for (int i = 0; i < n; i++) {
                cols[d + j][i] = levels[i][j];
            }
        }
        double[][] best = new Search(cols, categorical, DEFAULT_P).run(rng, iterations);
        List<DesignPoint> out = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            double[] x = new double[d];
            for (int j = 0; j < d; j++) {
                x[j] = best[j][i];
            }
            int[] lv = new int[c];
            for (int j = 0; j < c; j++) {
                lv[j] = (int) best[d + j][i];
            }
            out.add(new DesignPoint(x, lv));
        }
        return List.copyOf(out);
    }

    /**
     * Balanced level assignments: for a setting with L levels, row r first gets level r mod L,
     * then the rows are shuffled, so every level is used &lfloor;n/L&rfloor; or &lceil;n/L&rceil; times.
     *
     * @param n           number of rows, &ge; 1
     * @param levelCounts number of levels of each categorical setting, each &ge; 1; never null
     * @param rng         source of randomness; never null
     * @return n rows of level indices, one per setting; never null
     */
    public static int[][] balancedLevels(int n, int[] levelCounts, RandomGenerator rng) {
        Objects.requireNonNull(levelCounts, "levelCounts");
        Objects.requireNonNull(rng, "rng");
        if (n < 1) {
            throw new IllegalArgumentException("need at least one point: " + n);
        }
        int[][] out = new int[n][levelCounts.length];
        for (int j = 0; j < levelCounts.length; j++) {
            if (levelCounts[j] < 1) {
                throw new IllegalArgumentException("a categorical setting needs at least one level: " + levelCounts[j]);
            }
            int[] col = new int[n];
            for (int r = 0; r < n; r++) {
                col[r] = r % levelCounts[j];
            }
            shuffle(col, rng);
            for (int r = 0; r < n; r++) {
                out[r][j] = col[r];
            }
        }
        return out;
    }

    /**
     * The smallest Euclidean distance between two points of a design.
     *
     * @param points at least two rows of equal length with finite entries; never null
     * @return min over i &lt; j of |x_i &minus; x_j|
     */
    public static double minDistance(double[][] points) {
        checkPoints(points);
        double m = Double.POSITIVE_INFINITY;
        for (int i = 0; i < points.length; i++) {
            for (int k = i + 1; k < points.length; k++) {
                m = Math.min(m, squared(points[i], points[k]));
            }
        }
        return Math.sqrt(m);
    }

    /**
     * The smallest scaled-space distance ({@link DesignSpace#distance(DesignPoint, DesignPoint)})
     * between two points of a mixed design.
     *
     * @param points at least two points of the same shape; never null
     * @return the minimum pairwise distance
     */
    public static double minDistance(List<DesignPoint> points) {
        checkPoints(points);
        double m = Double.POSITIVE_INFINITY;
        for (int i = 0; i < points.size(); i++) {
            for (int k = i + 1; k < points.size(); k++) {
                m = Math.min(m, DesignSpace.distance(points.get(i), points.get(k)));
            }
        }
        return m;
    }

    /**
     * The Morris&ndash;Mitchell criterion &phi;<sub>p</sub> = (&Sigma;<sub>i&lt;j</sub> d<sub>ij</sub><sup>&minus;p</sup>)<sup>1/p</sup>
     * over Euclidean distances, evaluated as (1/d_min)(&Sigma;(d_min/d_ij)<sup>p</sup>)<sup>1/p</sup>
     * so that large p cannot overflow.
     *
     * @param points at least two rows of equal length with finite entries; never null
     * @param p      exponent, &gt; 0 and finite
     * @return &phi;<sub>p</sub> (smaller is better), or {@link Double#MAX_VALUE} when two points coincide
     */
    public static double phiP(double[][] points, double p) {
        checkPoints(points);
        int n = points.length;
        double[] d = new double[n * (n - 1) / 2];
        int q = 0;
        for (int i = 0; i < n; i++) {
            for (int k = i + 1; k < n; k++) {
                d[q++] = Math.sqrt(squared(points[i], points[k]));
            }
        }
        return phiOfDistances(d, p);
    }

    /**
     * The criterion &phi;<sub>p</sub> over the scaled-space distances of a mixed design.
     *
     * @param points at least two points of the same shape; never null
     * @param p      exponent, &gt; 0 and finite
     * @return &phi;<sub>p</sub>, or {@link Double#MAX_VALUE} when two points coincide
     */
    public static double phiP(List<DesignPoint> points, double p) {
        checkPoints(points);
        int n = points.size();
        double[] d = new double[n * (n - 1) / 2];
        int q = 0;
        for (int i = 0; i < n; i++) {
            for (int k = i + 1; k < n; k++) {
                d[q++] = DesignSpace.distance(points.get(i), points.get(k));
            }
        }
        return phiOfDistances(d, p);
    }

    // ------------------------------------------------------------------ internals

    private static double phiOfDistances(double[] d, double p) {
        if (!(p > 0) || !Double.isFinite(p)) {
            throw new IllegalArgumentException("phi_p exponent must be finite and > 0: " + p);
        }
        double min = Double.POSITIVE_INFINITY;
        for (double v : d) {
            min = Math.min(min, v);
        }
        if (min == 0.0) {
            return Double.MAX_VALUE;
        }
        double s = 0;
        for (double v : d) {
            s += Math.pow(min / v, p);
        }
        double phi = Math.pow(s, 1.0 / p) / min;
        return Double.isFinite(phi) ? phi : Double.MAX_VALUE;
    }

    /** d columns of n stratified coordinates. */
    private static double[][] randomColumns(int n, int d, RandomGenerator rng, Placement placement) {
        double[][] cols = new double[d][n];
        int[] perm = new int[n];
        for (int j = 0; j < d; j++) {
            for (int i = 0; i < n; i++) {
                perm[i] = i;
            }
            shuffle(perm, rng);
            for (int i = 0; i < n; i++) {
                double u = placement == Placement.MIDPOINT ? 0.5 : rng.nextDouble();
                int k = perm[i];
                double x = (k + u) / n;
                if (x >= (k + 1.0) / n) {
                    x = Math.nextDown((k + 1.0) / n);
                }
                cols[j][i] = x;
            }
        }
        return cols;
    }

    /** Fisher&ndash;Yates shuffle. */
    private static void shuffle(int[] a, RandomGenerator rng) {
        for (int i = a.length - 1; i > 0; i--) {
            int r = rng.nextInt(i + 1);
            int t = a[i];
            a[i] = a[r];
            a[r] = t;
        }
    }

    private static double[][] transpose(double[][] cols, int n, int d) {
        double[][] rows = new double[n][d];
        for (int j = 0; j < d; j++) {
            for (int i = 0; i < n; i++) {
                rows[i][j] = cols[j][i];
            }
        }
        return rows;
    }

    private static double squared(double[] a, double[] b) {
        double s = 0;
        for (int j = 0; j < a.length; j++) {
            double t = a[j] - b[j];
            s += t * t;
        }
        return s;
    }

    private static void checkSizes(int n, int d, int minD) {
        if (n < 1) {
            throw new IllegalArgumentException("need at least one point: " + n);
        }
        if (d < minD) {
            throw new IllegalArgumentException("need at least " + minD + " dimension(s): " + d);
        }
    }

    private static void checkIterations(int iterations) {
        if (iterations < 0) {
            throw new IllegalArgumentException("iterations must be >= 0: " + iterations);
        }
    }

    private static void checkPoints(double[][] points) {
        Objects.requireNonNull(points, "points");
        if (points.length < 2) {
            throw new IllegalArgumentException("a distance needs at least two points: " + points.length);
        }
        int d = points[0].length;
        for (double[] row : points) {
            if (row.length != d) {
                throw new IllegalArgumentException("rows of different lengths: " + d + " and " + row.length);
            }
            for (double v : row) {
                if (!Double.isFinite(v)) {
                    throw new IllegalArgumentException("design coordinate is not finite: " + v);
                }
            }
        }
    }

    private static void checkPoints(List<DesignPoint> points) {
        Objects.requireNonNull(points, "points");
        if (points.size() < 2) {
            throw new IllegalArgumentException("a distance needs at least two points: " + points.size());
        }
        DesignPoint first = points.get(0);
        for (DesignPoint p : points) {
            if (p.dimensions() != first.dimensions() || p.levelCount() != first.levelCount()) {
                throw new IllegalArgumentException("design points of different shapes");
            }
        }
    }

    /**
     * Annealing over within-column swaps, on ln &phi;<sub>p</sub>. Pair terms are kept scaled as
     * t_ij = (d&sup2;_ref/d&sup2;_ij)<sup>p/2</sup>, with d&sup2;_ref the starting minimum, so that
     * &phi;<sub>p</sub> = S<sup>1/p</sup>/d_ref with S = &Sigma;t_ij stays representable.
     */
    private static final class Search {

        private final double[][] cols;
        private final boolean[] categorical;
        private final double p;
        private final int n;
        private final double[][] term;
        private double ref2;
        private double sum;

        Search(double[][] cols, boolean[] categorical, double p) {
            this.cols = cols;
            this.categorical = categorical;
            this.p = p;
            this.n = cols.length == 0 ? 0 : cols[0].length;
            this.term = new double[n][n];
            rescale();
        }

        /** Recomputes every pair term with d&sup2;_ref set to the current smallest positive d&sup2;. */
        private void rescale() {
            double min = Double.POSITIVE_INFINITY;
            double[][] d2 = new double[n][n];
            for (int i = 0; i < n; i++) {
                for (int k = i + 1; k < n; k++) {
                    d2[i][k] = pair(i, k, -1, -1, -1);
                    if (d2[i][k] > 0) {
                        min = Math.min(min, d2[i][k]);
                    }
                }
            }
            ref2 = Double.isFinite(min) ? min : 1.0;
            for (int i = 0; i < n; i++) {
                for (int k = i + 1; k < n; k++) {
                    term[i][k] = scaled(d2[i][k]);
                    term[k][i] = term[i][k];
                }
            }
            sum = total();
        }

        /** ln &phi;_p of the current design. */
        private double logPhi() {
            return Math.log(sum) / p - 0.5 * Math.log(ref2);
        }

        /** Runs the search and returns the best columns met (copies). */
        double[][] run(RandomGenerator rng, int iterations) {
            double[][] best = copy(cols);
            if (n < 3 || cols.length == 0) {
                return best; // with two points every swap leaves the single distance unchanged
            }
            double bestLogPhi = logPhi();
            double[] newA = new double[n];
            double[] newB = new double[n];
            int accepted = 0;
            for (int it = 0; it < iterations; it++) {
                int j = rng.nextInt(cols.length);
                int a = rng.nextInt(n);
                int b = rng.nextInt(n - 1);
                if (b >= a) {
                    b++;
                }
                if (cols[j][a] == cols[j][b]) {
                    continue; // same level: the swap changes nothing
                }
                double oldPart = 0;
                double newPart = 0;
                for (int k = 0; k < n; k++) {
                    if (k == a || k == b) {
                        continue;
                    }
                    newA[k] = scaled(pair(a, k, j, b, a));
                    newB[k] = scaled(pair(b, k, j, a, b));
                    oldPart += term[a][k] + term[b][k];
                    newPart += newA[k] + newB[k];
                }
                double candidate = Math.max(0.0, sum - oldPart) + newPart;
                double logRatio = candidate > 0 ? (Math.log(candidate) - Math.log(sum)) / p : Double.NEGATIVE_INFINITY;
                double temperature = INITIAL_TEMPERATURE
                        * Math.pow(FINAL_TEMPERATURE / INITIAL_TEMPERATURE, it / (double) Math.max(1, iterations - 1));
                if (logRatio <= 0 || rng.nextDouble() < Math.exp(-logRatio / temperature)) {
                    double t = cols[j][a];
                    cols[j][a] = cols[j][b];
                    cols[j][b] = t;
                    for (int k = 0; k < n; k++) {
                        if (k == a || k == b) {
                            continue;
                        }
                        term[a][k] = newA[k];
                        term[k][a] = newA[k];
                        term[b][k] = newB[k];
                        term[k][b] = newB[k];
                    }
                    sum = candidate;
                    if (++accepted % n == 0) {
                        sum = total(); // bound the drift of the running sum
                    }
                    if (sum < 1e-100) {
                        rescale(); // every pair has moved far beyond the reference distance
                    }
                    double lp = logPhi();
                    if (lp < bestLogPhi) {
                        bestLogPhi = lp;
                        for (int c = 0; c < cols.length; c++) {
                            System.arraycopy(cols[c], 0, best[c], 0, n);
                        }
                    }
                }
            }
            return best;
        }

        /**
         * Squared distance between rows i and k, with row {@code self}'s entry in column
         * {@code col} replaced by row {@code other}'s (col = -1: no replacement).
         */
        private double pair(int i, int k, int col, int other, int self) {
            double s = 0;
            for (int c = 0; c < cols.length; c++) {
                double vi = c == col && i == self ? cols[c][other] : cols[c][i];
                double vk = cols[c][k];
                if (categorical[c]) {
                    s += vi != vk ? 1.0 : 0.0;
                } else {
                    double t = vi - vk;
                    s += t * t;
                }
            }
            return s;
        }

        private double scaled(double d2) {
            if (d2 <= 0) {
                return TERM_CAP;
            }
            double t = Math.pow(ref2 / d2, 0.5 * p);
            return Math.min(TERM_CAP, t);
        }

        private double total() {
            double s = 0;
            for (int i = 0; i < n; i++) {
                for (int k = i + 1; k < n; k++) {
                    s += term[i][k];
                }
            }
            return s;
        }

        private static double[][] copy(double[][] a) {
            double[][] c = new double[a.length][];
            for (int i = 0; i < a.length; i++) {
                c[i] = a[i].clone();
            }
            return c;
        }
    }
}
