package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * The probability that a run at a recipe succeeds, learnt from the run log with failed runs as
 * data (no film, wrong phase, an equipment fault): failures are recorded, never dropped.
 *
 * <p>Model: logistic regression P(success | x) = &sigma;(b + w&middot;f(x)) on the features of
 * {@link ClassModel} (continuous coordinates mapped to [&minus;1, 1], optional centred squares,
 * level indicators), where &sigma; is the logistic function. The slopes w carry a ridge penalty
 * (&lambda;/2)&Vert;w&Vert;&sup2; with &lambda; chosen by cross-validated log loss as in
 * {@link ClassModel}. The intercept b carries a Beta(&alpha;, &beta;) prior on the success rate
 * &sigma;(b) at the centre of the box, with &alpha; = r&middot;m and &beta; = (1 &minus; r)&middot;m for
 * the base rate r = {@link #BASE_SUCCESS_RATE} and weight m = {@link #PRIOR_PSEUDO_RUNS}; its
 * log-density &alpha; ln &sigma;(b) + &beta; ln(1 &minus; &sigma;(b)) is exactly the log-likelihood
 * of m pseudo-runs at the centre of which a fraction r succeeded (the conjugate reading of the
 * beta prior as prior counts: Gelman et al., <i>Bayesian Data Analysis</i>, 3rd ed., 2013, ch. 2;
 * from memory). Consequences: with no runs the model predicts r everywhere; for s successes
 * among n runs all at the centre it predicts (s + &alpha;)/(n + m), the posterior mean of the
 * conjugate beta&ndash;binomial model; so with only successes the rate stays high but below 1, with
 * only failures low but above 0 (about these values when the runs are spread out); and a
 * cluster of failures in one corner tilts w so that the probability drops there.
 *
 * <p>Fitting: Newton&ndash;Raphson with a backtracking line search on the strictly convex
 * penalised negative log-likelihood. Predictions are clamped to
 * [{@link #PROBABILITY_FLOOR}, 1 &minus; {@link #PROBABILITY_FLOOR}]. Instances are immutable.
 *
 * @since 0.1
 */
public final class SuccessModel {

    /**
     * Base success rate 0.9 that the intercept prior is centred on: most MBE runs in a campaign
     * give a usable film, while failures are common enough to plan for [practice; no single
     * source, an assumption that data override after a few runs].
     */
    public static final double BASE_SUCCESS_RATE = 0.9;

    /**
     * Weight of the intercept prior, 2 pseudo-runs (Beta(1.8, 0.2) for the default base rate):
     * enough to keep probabilities off 0 and 1 for a small log, little enough that three or
     * four real failures outweigh it [practice].
     */
    public static final double PRIOR_PSEUDO_RUNS = 2.0;

    /** Probabilities are clamped to [1e-6, 1 &minus; 1e-6] [practice, as {@link ClassModel#PROBABILITY_FLOOR}]. */
    public static final double PROBABILITY_FLOOR = ClassModel.PROBABILITY_FLOOR;

    private static final int MAX_NEWTON = 100;
    private static final double STEP_TOLERANCE = 1e-9;

    private final ClassModelSupport.FeatureMap features;
    private final double[] weights;
    private final double ridge;
    private final int runs;
    private final int failures;
    private final double cvLogLoss;

    private SuccessModel(ClassModelSupport.FeatureMap features, double[] weights, double ridge, int runs, int failures,
                         double cvLogLoss) {
        this.features = features;
        this.weights = weights;
        this.ridge = ridge;
        this.runs = runs;
        this.failures = failures;
        this.cvLogLoss = cvLogLoss;
    }

    /**
     * Fits the model with {@link ClassModelSettings#defaults()}.
     *
     * @param x         recipes of the runs; never null, may be empty
     * @param succeeded whether each run succeeded; never null, same length as {@code x}
     * @param seed      seed of the cross-validation folds
     * @return the fitted model; never null
     */
    public static SuccessModel fit(List<DesignPoint> x, boolean[] succeeded, long seed) {
        return fit(x, succeeded, seed, ClassModelSettings.defaults());
    }

    /**
     * Fits the model.
     *
     * @param x         recipes of the runs; never null, may be empty
     * @param succeeded whether each run succeeded; never null, same length as {@code x}
     * @param seed      seed of the cross-validation folds
     * @param settings  features and ridge grid; never null
     * @return the fitted model; never null
     */
    public static SuccessModel fit(List<DesignPoint> x, boolean[] succeeded, long seed, ClassModelSettings settings) {
        Objects.requireNonNull(x, "x");
        Objects.requireNonNull(succeeded, "succeeded");
        Objects.requireNonNull(settings, "settings");
        if (succeeded.length != x.size()) {
            throw new IllegalArgumentException(x.size() + " recipes but " + succeeded.length + " outcomes");
        }
        int n = x.size();
        int fails = 0;
        for (boolean s : succeeded) {
            fails += s ? 0 : 1;
        }
        ClassModelSupport.FeatureMap map = ClassModelSupport.FeatureMap.of(x, settings.squaredTerms());
        List<Double> grid = new ArrayList<>(settings.ridgeGrid());
        grid.sort((a, b) -> Double.compare(b, a));
        double[] start = new double[map.size()];
        start[0] = logit(BASE_SUCCESS_RATE);
        if (n == 0) {
            return new SuccessModel(map, start, grid.get(0), 0, 0, Double.NaN);
        }
        double[][] f = map.map(x);
        int[][] fl = ClassModelSupport.folds(n, settings.folds(), settings.leaveOneOutUpTo(), seed);
        int[] fold = fl[0];
        int folds = fl[1][0];
        double[] loss = new double[grid.size()];
        for (int q = 0; q < folds; q++) {
            int[] train = ClassModelSupport.indices(fold, q, false);
            int[] test = ClassModelSupport.indices(fold, q, true);
            double[] w = start.clone();
            for (int g = 0; g < grid.size(); g++) {
                w = newton(f, succeeded, train, grid.get(g), w);
                for (int i : test) {
                    double p = probability(w, f[i]);
                    loss[g] -= Math.log(succeeded[i] ? p : 1 - p);
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
        double[] w = newton(f, succeeded, all, grid.get(best), start);
        return new SuccessModel(map, w, grid.get(best), n, fails, loss[best] / n);
    }

    /**
     * Success probabilities at recipes.
     *
     * @param x recipes of the training shape (any shape when the model has no runs); never null
     * @return P(success) per recipe, in [{@link #PROBABILITY_FLOOR}, 1 &minus; {@link #PROBABILITY_FLOOR}]; never null
     */
    public double[] predict(List<DesignPoint> x) {
        Objects.requireNonNull(x, "x");
        double[] out = new double[x.size()];
        for (int i = 0; i < out.length; i++) {
            out[i] = runs == 0 ? clamp(sigmoid(weights[0])) : probability(weights, features.map(x.get(i)));
        }
        return out;
    }

    /** @return the ridge strength &lambda; on the slopes (with no runs, the largest of the grid) */
    public double ridge() {
        return ridge;
    }

    /** @return number of runs fitted */
    public int runs() {
        return runs;
    }

    /** @return number of failed runs among them */
    public int failures() {
        return failures;
    }

    /** @return mean held-out log loss (nats per run) at the chosen &lambda;; empty with no runs */
    public OptionalDouble crossValidatedLogLoss() {
        return runs == 0 ? OptionalDouble.empty() : OptionalDouble.of(cvLogLoss);
    }

    // ------------------------------------------------------------------ fitting

    private static double[] newton(double[][] f, boolean[] y, int[] rows, double lambda, double[] start) {
        int p = start.length;
        double alpha = BASE_SUCCESS_RATE * PRIOR_PSEUDO_RUNS;
        double beta = (1 - BASE_SUCCESS_RATE) * PRIOR_PSEUDO_RUNS;
        double[] w = start.clone();
        double obj = objective(f, y, rows, lambda, w);
        for (int it = 0; it < MAX_NEWTON; it++) {
            double[] grad = new double[p];
            double[][] hess = new double[p][p];
            double sb = sigmoid(w[0]);
            grad[0] = (alpha + beta) * sb - alpha;
            hess[0][0] = (alpha + beta) * sb * (1 - sb);
            for (int j = 1; j < p; j++) {
                grad[j] = lambda * w[j];
                hess[j][j] = lambda;
            }
            for (int i : rows) {
                double[] fi = f[i];
                double pi = sigmoid(dot(w, fi));
                double r = pi - (y[i] ? 1 : 0);
                double h = pi * (1 - pi);
                for (int j = 0; j < p; j++) {
                    grad[j] += r * fi[j];
                    if (fi[j] == 0.0 || h == 0.0) {
                        continue;
                    }
                    for (int l = j; l < p; l++) {
                        hess[j][l] += h * fi[j] * fi[l];
                    }
                }
            }
            for (int j = 0; j < p; j++) {
                for (int l = 0; l < j; l++) {
                    hess[j][l] = hess[l][j];
                }
            }
            double[] step = ClassModelSupport.solveSpd(hess, grad);
            double slope = dot(grad, step);
            double t = 1.0;
            double[] trial = new double[p];
            double trialObj = Double.NaN;
            for (int ls = 0; ls < 40; ls++) {
                for (int j = 0; j < p; j++) {
                    trial[j] = w[j] - t * step[j];
                }
                trialObj = objective(f, y, rows, lambda, trial);
                if (trialObj <= obj - 1e-4 * t * slope) {
                    break;
                }
                t *= 0.5;
            }
            if (!(trialObj <= obj)) {
                break;
            }
            double moved = 0;
            for (int j = 0; j < p; j++) {
                moved = Math.max(moved, Math.abs(t * step[j]));
            }
            w = trial.clone();
            obj = trialObj;
            if (moved < STEP_TOLERANCE) {
                break;
            }
        }
        ClassModelSupport.checkFinite(w, "success-model weight");
        return w;
    }

    /** Penalised negative log-likelihood, the pseudo-runs of the intercept prior included. */
    private static double objective(double[][] f, boolean[] y, int[] rows, double lambda, double[] w) {
        double alpha = BASE_SUCCESS_RATE * PRIOR_PSEUDO_RUNS;
        double beta = (1 - BASE_SUCCESS_RATE) * PRIOR_PSEUDO_RUNS;
        double s = alpha * softplus(-w[0]) + beta * softplus(w[0]);
        for (int j = 1; j < w.length; j++) {
            s += 0.5 * lambda * w[j] * w[j];
        }
        for (int i : rows) {
            double eta = dot(w, f[i]);
            s += y[i] ? softplus(-eta) : softplus(eta);
        }
        return s;
    }

    private static double probability(double[] w, double[] fi) {
        return clamp(sigmoid(dot(w, fi)));
    }

    private static double clamp(double p) {
        return Math.min(1 - PROBABILITY_FLOOR, Math.max(PROBABILITY_FLOOR, p));
    }

    private static double dot(double[] a, double[] b) {
        double s = 0;
        for (int j = 0; j < a.length; j++) {
            s += a[j] * b[j];
        }
        return s;
    }

    /** ln(1 + e^x) without overflow. */
    private static double softplus(double x) {
        return Math.max(x, 0) + Math.log1p(Math.exp(-Math.abs(x)));
    }

    private static double sigmoid(double x) {
        if (x >= 0) {
            return 1 / (1 + Math.exp(-x));
        }
        double e = Math.exp(x);
        return e / (1 + e);
    }

    private static double logit(double p) {
        return Math.log(p / (1 - p));
    }
}
