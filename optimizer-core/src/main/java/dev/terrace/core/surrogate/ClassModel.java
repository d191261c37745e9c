package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * A probabilistic classifier for a class outcome of a run (for example a morphology such as dot,
 * ring, disk or hole, or a growth mode such as step-flow or islands) that starts from a prior
 * class-probability vector per recipe and learns from labelled runs.
 *
 * <p>Model: multinomial logistic regression with the log prior probabilities as an offset,
 * P(class k | x) = softmax<sub>k</sub>(ln p0<sub>k</sub>(x) + w<sub>k</sub>&middot;f(x)), where p0
 * is the prior (the growth-model plugin's probabilities, uniform without a plugin) and f(x) the
 * features of the recipe: an intercept, each continuous coordinate mapped to [&minus;1, 1],
 * optionally centred squares, and 0/1 indicators of the categorical levels. Every weight,
 * intercepts included, carries a ridge penalty (&lambda;/2)&Vert;w&Vert;&sup2; (at least
 * {@link #INTERCEPT_RIDGE_MIN} on the intercepts), so with no data
 * the weights are zero and the model <em>is</em> the prior, a class never observed keeps a share
 * of its prior probability that the penalty only lets the data shrink so far, and with many runs
 * the data dominate. This is penalised maximum likelihood with the plugin as offset (offsets in
 * generalised linear models: McCullagh &amp; Nelder 1989, <i>Generalized Linear Models</i>, 2nd
 * ed.; ridge-penalised logistic regression: le Cessie &amp; van Houwelingen 1992, <i>Appl.
 * Stat.</i> 41:191; both from memory).
 *
 * <p>Local evidence: a logistic model is smooth across the box, so on its own a class seen at one
 * recipe among runs of another class far away would be outvoted by the prior and the trend. The
 * predicted probabilities are therefore the posterior mean of a Dirichlet&ndash;multinomial whose
 * prior is the logistic model with the weight of {@value #MODEL_PSEUDO_RUNS} run and whose counts
 * are the labelled runs weighted by a Gaussian kernel of their distance to the recipe,
 * p<sub>k</sub>(x) = (m&middot;q<sub>k</sub>(x) + &Sigma;<sub>i</sub> w<sub>i</sub>(x)[y<sub>i</sub> = k]) /
 * (m + &Sigma;<sub>i</sub> w<sub>i</sub>(x)), w<sub>i</sub>(x) = exp(&minus;d(x, x<sub>i</sub>)&sup2; /
 * 2&ell;&sup2;), with q the logistic model, m = {@link #MODEL_PSEUDO_RUNS}, d the distance of
 * {@link DesignSpace#distance} and &ell; one of {@link #LOCAL_LENGTHS} (&ell; = 0: w<sub>i</sub> = 1 at the
 * run's own recipe, 0 elsewhere), the one with the lowest
 * leave-one-out log loss of the update over the labelled runs (likelihood cross-validation of the
 * bandwidth, Habbema, Hermans &amp; van den Broek 1974, <i>COMPSTAT</i>; from memory; q is taken from
 * the fit on all runs, ties go to the shorter length): a Nadaraya&ndash;Watson kernel
 * estimate of the class frequencies (Nadaraya 1964, <i>Theory Probab. Appl.</i> 9:141; Watson 1964,
 * <i>Sankhy&#257; A</i> 26:359) shrunk towards the model by the conjugate Dirichlet prior (Gelman et
 * al., <i>Bayesian Data Analysis</i>, 3rd ed., 2013, section 3.4; all from memory). Whatever the
 * length, at the recipe of a labelled run that no nearby run contradicts its class has probability
 * above 1/2 (its own weight is 1, the model's is 1);
 * many consistent runs nearby make the observed frequencies win; far from every run (several
 * &ell;) the logistic model is unchanged.
 *
 * <p>Fitting: Newton&ndash;Raphson on the strictly convex penalised negative log-likelihood with
 * a backtracking line search; &lambda; is chosen from {@link ClassModelSettings#ridgeGrid()} by
 * the lowest mean held-out log loss over leave-one-out (few runs) or seeded k-fold folds; ties go
 * to the larger &lambda;. Predictions are floored at {@link #PROBABILITY_FLOOR} and renormalised.
 *
 * <p>Instances are immutable.
 *
 * @since 0.1
 */
public final class ClassModel {

    /**
     * Probability floor 1e-6 applied to priors and predictions before renormalising, so that no
     * class is ever ruled out and log losses stay finite [practice].
     */
    public static final double PROBABILITY_FLOOR = 1e-6;

    /**
     * Smallest ridge strength 1 on the class intercepts, whatever &lambda; cross-validation picks:
     * a standard-normal prior on each class's log-odds shift from the prior, that is a belief
     * that the plugin's class odds are right to within a factor e at one standard deviation. It
     * keeps a class never seen in a few dozen runs at a few per cent rather than letting a weak
     * &lambda; drive it towards the floor, and is negligible against a few hundred runs [practice].
     */
    public static final double INTERCEPT_RIDGE_MIN = 1.0;

    /**
     * Weight of the logistic model in the local Dirichlet update, 1 run: one labelled run at a
     * recipe counts as much as the model there, so its class becomes the most likely at that
     * recipe (a project choice).
     */
    public static final double MODEL_PSEUDO_RUNS = 1.0;

    /**
     * Candidate lengths of the kernel of the local update, 0, 0.01, 0.03 and 0.1 in the units of
     * {@link DesignSpace#distance} (each numeric setting scaled to [0, 1] across the campaign box; a
     * different categorical choice counts 1, so runs with other choices hardly contribute). The
     * longest lets a run speak for recipes within about the batch separation of the proposals (its
     * weight falls below 1 % beyond 0.3); 0 counts a run only at its very own recipe, which leaves a
     * dense, noisy log to the logistic model (a project choice).
     */
    public static final List<Double> LOCAL_LENGTHS = List.of(0.0, 0.01, 0.03, 0.1);

    /** Most runs scored when the kernel length is cross-validated (an evenly spaced subset above). */
    static final int LOCAL_CV_MAX_ROWS = 2000;

    /** Newton iterations per fit at most. */
    private static final int MAX_NEWTON = 100;

    /** Newton stops when no weight moves by more than this. */
    private static final double STEP_TOLERANCE = 1e-9;

    private final List<String> classes;
    private final ClassModelSupport.FeatureMap features;
    private final double[][] weights;
    private final double ridge;
    private final int runs;
    private final double cvLogLoss;
    private final List<DesignPoint> labelled;
    private final int[] labels;
    private final double localLength;

    private ClassModel(List<String> classes, ClassModelSupport.FeatureMap features, double[][] weights, double ridge,
                       int runs, double cvLogLoss, List<DesignPoint> labelled, int[] labels, double localLength) {
        this.localLength = localLength;
        this.labelled = List.copyOf(labelled);
        this.labels = labels.clone();
        this.classes = List.copyOf(classes);
        this.features = features;
        this.weights = weights;
        this.ridge = ridge;
        this.runs = runs;
        this.cvLogLoss = cvLogLoss;
    }

    /**
     * Fits the model with {@link ClassModelSettings#defaults()}.
     *
     * @param x          recipes of the labelled runs; never null, may be empty
     * @param labels     observed class of each run, each one of {@code classes}; never null
     * @param classes    the possible classes, distinct, at least one; never null
     * @param priorProbs prior class probabilities per run (rows in the order of {@code classes},
     *                   non-negative, positive sum, normalised here), or null for uniform
     * @param seed       seed of the cross-validation folds
     * @return the fitted model; never null
     */
    public static ClassModel fit(List<DesignPoint> x, List<String> labels, List<String> classes, double[][] priorProbs,
                                 long seed) {
        return fit(x, labels, classes, priorProbs, seed, ClassModelSettings.defaults());
    }

    /**
     * Fits the model.
     *
     * @param x          recipes of the labelled runs; never null, may be empty
     * @param labels     observed class of each run, each one of {@code classes}; never null
     * @param classes    the possible classes, distinct, at least one; never null
     * @param priorProbs prior class probabilities per run, or null for uniform
     * @param seed       seed of the cross-validation folds
     * @param settings   features and ridge grid; never null
     * @return the fitted model; never null
     */
    public static ClassModel fit(List<DesignPoint> x, List<String> labels, List<String> classes, double[][] priorProbs,
                                 long seed, ClassModelSettings settings) {
        Objects.requireNonNull(x, "x");
        Objects.requireNonNull(labels, "labels");
        Objects.requireNonNull(settings, "settings");
        checkClasses(classes);
        if (labels.size() != x.size()) {
            throw new IllegalArgumentException(x.size() + " recipes but " + labels.size() + " labels");
        }
        int k = classes.size();
        int n = x.size();
        Map<String, Integer> index = new HashMap<>();
        for (int c = 0; c < k; c++) {
            index.put(classes.get(c), c);
        }
        int[] y = new int[n];
        for (int i = 0; i < n; i++) {
            Integer c = index.get(labels.get(i));
            if (c == null) {
                throw new IllegalArgumentException("label '" + labels.get(i) + "' of run " + i + " is not one of " + classes);
            }
            y[i] = c;
        }
        double[][] offset = logPrior(priorProbs, n, k);
        ClassModelSupport.FeatureMap map = ClassModelSupport.FeatureMap.of(x, settings.squaredTerms());
        List<Double> grid = descending(settings.ridgeGrid());
        if (n == 0) {
            return new ClassModel(classes, map, new double[k][map.size()], grid.get(0), 0, Double.NaN, List.of(),
                    new int[0], LOCAL_LENGTHS.get(0));
        }
        double[][] f = map.map(x);
        int[][] fl = ClassModelSupport.folds(n, settings.folds(), settings.leaveOneOutUpTo(), seed);
        int[] fold = fl[0];
        int folds = fl[1][0];
        double[] loss = new double[grid.size()];
        for (int q = 0; q < folds; q++) {
            int[] train = ClassModelSupport.indices(fold, q, false);
            int[] test = ClassModelSupport.indices(fold, q, true);
            double[][] w = new double[k][map.size()];
            for (int g = 0; g < grid.size(); g++) {
                w = newton(f, y, offset, train, grid.get(g), w);
                for (int i : test) {
                    loss[g] -= Math.log(probabilities(offset[i], w, f[i])[y[i]]);
                }
            }
        }
        int best = 0;
        for (int g = 1; g < grid.size(); g++) {
            if (loss[g] < loss[best]) {
                best = g;
            }
        }
        int[] all = new int[n];
        for (int i = 0; i < n; i++) {
            all[i] = i;
        }
        double[][] w = newton(f, y, offset, all, grid.get(best), new double[k][map.size()]);
        double[][] q = new double[n][];
        for (int i = 0; i < n; i++) {
            q[i] = probabilities(offset[i], w, f[i]);
        }
        return new ClassModel(classes, map, w, grid.get(best), n, loss[best] / n, x, y, localLength(x, y, q));
    }

    /** The kernel length of {@link #LOCAL_LENGTHS} with the lowest leave-one-out log loss of the local update. */
    private static double localLength(List<DesignPoint> x, int[] y, double[][] q) {
        int n = y.length;
        int rows = Math.min(n, LOCAL_CV_MAX_ROWS);
        double best = LOCAL_LENGTHS.get(0);
        double bestLoss = Double.POSITIVE_INFINITY;
        for (double len : LOCAL_LENGTHS) {
            double loss = 0;
            for (int r = 0; r < rows; r++) {
                int i = (int) ((long) r * n / rows);
                double[] count = new double[q[i].length];
                double total = 0;
                for (int j = 0; j < n; j++) {
                    if (j == i) {
                        continue;
                    }
                    double d = DesignSpace.distance(x.get(i), x.get(j));
                    double wt = kernel(d, len);
                    count[y[j]] += wt;
                    total += wt;
                }
                double p = (MODEL_PSEUDO_RUNS * q[i][y[i]] + count[y[i]]) / (MODEL_PSEUDO_RUNS + total);
                loss -= Math.log(Math.max(p, PROBABILITY_FLOOR));
            }
            if (loss < bestLoss - 1e-12) {
                bestLoss = loss;
                best = len;
            }
        }
        return best;
    }

    /**
     * Class probabilities at recipes.
     *
     * @param x          recipes, of the training shape (any shape when the model has no runs); never null
     * @param priorProbs prior class probabilities per recipe, or null for uniform
     * @return one row per recipe in the order of {@link #classes()}; rows sum to 1, entries at
     *         least about {@link #PROBABILITY_FLOOR}; never null
     */
    public double[][] predict(List<DesignPoint> x, double[][] priorProbs) {
        Objects.requireNonNull(x, "x");
        int k = classes.size();
        double[][] offset = logPrior(priorProbs, x.size(), k);
        double[][] out = new double[x.size()][];
        for (int i = 0; i < out.length; i++) {
            if (runs == 0) {
                out[i] = floored(exp(offset[i]));
            } else {
                out[i] = local(x.get(i), probabilities(offset[i], weights, features.map(x.get(i))));
            }
        }
        return out;
    }

    /** The Dirichlet&ndash;multinomial update of the model's probabilities q by the kernel-weighted labelled runs. */
    private double[] local(DesignPoint x, double[] q) {
        double[] count = new double[q.length];
        double total = 0;
        for (int i = 0; i < labels.length; i++) {
            double d = DesignSpace.distance(x, labelled.get(i));
            double w = kernel(d, localLength);
            count[labels[i]] += w;
            total += w;
        }
        if (!(total > 0)) {
            return q;
        }
        double[] p = new double[q.length];
        for (int c = 0; c < q.length; c++) {
            p[c] = (MODEL_PSEUDO_RUNS * q[c] + count[c]) / (MODEL_PSEUDO_RUNS + total);
        }
        return floored(p);
    }

    /** Gaussian kernel weight at distance d; length 0 counts only runs at the very same recipe. */
    private static double kernel(double d, double length) {
        if (length == 0) {
            return d == 0 ? 1 : 0;
        }
        return Math.exp(-0.5 * d * d / (length * length));
    }

    /** @return the kernel length of the local update chosen by cross-validation (0: the same recipe only) */
    public double localLength() {
        return localLength;
    }

    /** @return the classes in the order of the probability columns; never null */
    public List<String> classes() {
        return classes;
    }

    /** @return the ridge strength &lambda; chosen (with no runs, the largest of the grid) */
    public double ridge() {
        return ridge;
    }

    /** @return number of labelled runs fitted */
    public int runs() {
        return runs;
    }

    /**
     * @return mean held-out log loss (nats per run) of the logistic part at the chosen &lambda; (before the
     *         local update); empty with no runs
     */
    public OptionalDouble crossValidatedLogLoss() {
        return runs == 0 ? OptionalDouble.empty() : OptionalDouble.of(cvLogLoss);
    }

    // ------------------------------------------------------------------ fitting

    /** Penalised Newton&ndash;Raphson from a warm start. */
    private static double[][] newton(double[][] f, int[] y, double[][] offset, int[] rows, double lambda,
                                     double[][] start) {
        int k = start.length;
        int p = start[0].length;
        int dim = k * p;
        double[][] w = copy(start);
        double obj = objective(f, y, offset, rows, lambda, w);
        for (int it = 0; it < MAX_NEWTON; it++) {
            double[] grad = new double[dim];
            double[][] hess = new double[dim][dim];
            for (int c = 0; c < k; c++) {
                for (int j = 0; j < p; j++) {
                    double pen = penalty(lambda, j);
                    grad[c * p + j] = pen * w[c][j];
                    hess[c * p + j][c * p + j] = pen;
                }
            }
            for (int i : rows) {
                double[] pi = softmax(offset[i], w, f[i]);
                double[] fi = f[i];
                for (int c = 0; c < k; c++) {
                    double r = pi[c] - (y[i] == c ? 1.0 : 0.0);
                    for (int j = 0; j < p; j++) {
                        grad[c * p + j] += r * fi[j];
                    }
                    for (int e = c; e < k; e++) {
                        double h = c == e ? pi[c] * (1 - pi[c]) : -pi[c] * pi[e];
                        if (h == 0.0) {
                            continue;
                        }
                        for (int j = 0; j < p; j++) {
                            double hj = h * fi[j];
                            if (hj == 0.0) {
                                continue;
                            }
                            for (int l = 0; l < p; l++) {
                                hess[c * p + j][e * p + l] += hj * fi[l];
                            }
                        }
                    }
                }
            }
            // only the blocks (c, e) with e >= c were accumulated: mirror them below the diagonal
            for (int c = 0; c < k; c++) {
                for (int e = c + 1; e < k; e++) {
                    for (int j = 0; j < p; j++) {
                        for (int l = 0; l < p; l++) {
                            hess[e * p + l][c * p + j] = hess[c * p + j][e * p + l];
                        }
                    }
                }
            }
            double[] step = ClassModelSupport.solveSpd(hess, grad);
            double t = 1.0;
            double[][] trial = new double[k][p];
            double trialObj = Double.NaN;
            double slope = 0;
            for (int a = 0; a < dim; a++) {
                slope += grad[a] * step[a];
            }
            for (int ls = 0; ls < 40; ls++) {
                for (int c = 0; c < k; c++) {
                    for (int j = 0; j < p; j++) {
                        trial[c][j] = w[c][j] - t * step[c * p + j];
                    }
                }
                trialObj = objective(f, y, offset, rows, lambda, trial);
                if (trialObj <= obj - 1e-4 * t * slope) {
                    break;
                }
                t *= 0.5;
            }
            if (!(trialObj <= obj)) {
                break; // no descent left at double precision
            }
            double moved = 0;
            for (int a = 0; a < dim; a++) {
                moved = Math.max(moved, Math.abs(t * step[a]));
            }
            w = copy(trial);
            obj = trialObj;
            if (moved < STEP_TOLERANCE) {
                break;
            }
        }
        for (double[] row : w) {
            ClassModelSupport.checkFinite(row, "class-model weight");
        }
        return w;
    }

    /** Ridge strength of feature j: the intercept (j = 0) gets at least {@link #INTERCEPT_RIDGE_MIN}. */
    private static double penalty(double lambda, int j) {
        return j == 0 ? Math.max(lambda, INTERCEPT_RIDGE_MIN) : lambda;
    }

    /** Penalised negative log-likelihood over the given rows. */
    private static double objective(double[][] f, int[] y, double[][] offset, int[] rows, double lambda, double[][] w) {
        double s = 0;
        for (double[] row : w) {
            for (int j = 0; j < row.length; j++) {
                s += 0.5 * penalty(lambda, j) * row[j] * row[j];
            }
        }
        for (int i : rows) {
            double[] eta = logits(offset[i], w, f[i]);
            s += logSumExp(eta) - eta[y[i]];
        }
        return s;
    }

    // ------------------------------------------------------------------ probabilities

    private static double[] logits(double[] offset, double[][] w, double[] fi) {
        double[] eta = new double[w.length];
        for (int c = 0; c < w.length; c++) {
            double s = offset[c];
            for (int j = 0; j < fi.length; j++) {
                s += w[c][j] * fi[j];
            }
            eta[c] = s;
        }
        return eta;
    }

    private static double[] softmax(double[] offset, double[][] w, double[] fi) {
        double[] eta = logits(offset, w, fi);
        double m = logSumExp(eta);
        for (int c = 0; c < eta.length; c++) {
            eta[c] = Math.exp(eta[c] - m);
        }
        return eta;
    }

    /** Floored and renormalised class probabilities. */
    private static double[] probabilities(double[] offset, double[][] w, double[] fi) {
        return floored(softmax(offset, w, fi));
    }

    static double[] floored(double[] p) {
        double s = 0;
        double[] out = new double[p.length];
        for (int c = 0; c < p.length; c++) {
            out[c] = Math.max(PROBABILITY_FLOOR, p[c]);
            s += out[c];
        }
        for (int c = 0; c < p.length; c++) {
            out[c] /= s;
        }
        return out;
    }

    private static double logSumExp(double[] v) {
        double m = Double.NEGATIVE_INFINITY;
        for (double d : v) {
            m = Math.max(m, d);
        }
        double s = 0;
        for (double d : v) {
            s += Math.exp(d - m);
        }
        return m + Math.log(s);
    }

    private static double[] exp(double[] v) {
        double[] out = new double[v.length];
        for (int c = 0; c < v.length; c++) {
            out[c] = Math.exp(v[c]);
        }
        return out;
    }

    /** ln of the floored, normalised prior; uniform when null. */
    private static double[][] logPrior(double[][] prior, int n, int k) {
        double[][] out = new double[n][k];
        if (prior == null) {
            for (double[] row : out) {
                Arrays.fill(row, -Math.log(k));
            }
            return out;
        }
        if (prior.length != n) {
            throw new IllegalArgumentException(n + " recipes but " + prior.length + " prior rows");
        }
        for (int i = 0; i < n; i++) {
            double[] row = prior[i];
            if (row == null || row.length != k) {
                throw new IllegalArgumentException("prior row " + i + " needs " + k + " probabilities");
            }
            double s = 0;
            for (double v : row) {
                if (!(v >= 0) || !Double.isFinite(v)) {
                    throw new IllegalArgumentException("prior probability of row " + i + " is negative or not finite: " + v);
                }
                s += v;
            }
            if (!(s > 0)) {
                throw new IllegalArgumentException("prior row " + i + " sums to zero");
            }
            double[] norm = new double[k];
            for (int c = 0; c < k; c++) {
                norm[c] = row[c] / s;
            }
            double[] fl = floored(norm);
            for (int c = 0; c < k; c++) {
                out[i][c] = Math.log(fl[c]);
            }
        }
        return out;
    }

    private static void checkClasses(List<String> classes) {
        Objects.requireNonNull(classes, "classes");
        if (classes.isEmpty()) {
            throw new IllegalArgumentException("no classes");
        }
        for (String c : classes) {
            if (c == null) {
                throw new IllegalArgumentException("a class name is null");
            }
        }
        if (new HashSet<>(classes).size() != classes.size()) {
            throw new IllegalArgumentException("classes must be distinct: " + classes);
        }
    }

    private static List<Double> descending(List<Double> grid) {
        List<Double> g = new ArrayList<>(grid);
        g.sort((a, b) -> Double.compare(b, a));
        return g;
    }

    private static double[][] copy(double[][] a) {
        double[][] c = new double[a.length][];
        for (int i = 0; i < a.length; i++) {
            c[i] = a[i].clone();
        }
        return c;
    }
}
