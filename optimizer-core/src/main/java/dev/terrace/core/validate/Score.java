package dev.terrace.core.validate;

import java.util.OptionalDouble;

/**
 * How well one surrogate predicted one outcome over the held-out runs.
 *
 * <p>Numeric outcomes carry {@code rmse}, {@code coverage90} and {@code msll}; class outcomes carry
 * {@code logLoss} and {@code accuracy}. A metric that does not apply to the outcome's kind is NaN
 * (and only then): use {@link #forClasses()} or the {@code OptionalDouble} accessors
 * ({@link #rmseIfAny()} and so on) before printing, so no NaN reaches an output.
 *
 * @param n          number of held-out runs scored, at least 1
 * @param rmse       root-mean-square error of the predictive mean on the outcome's fitting scale
 *                   (log10 for {@code scale: log} outcomes); NaN for class outcomes
 * @param coverage90 fraction of held-out values inside the central 90 % predictive interval of a
 *                   new measurement, in [0, 1]; NaN for class outcomes
 * @param msll       mean standardized log loss (Rasmussen and Williams 2006, eq. 2.34): the negative
 *                   log predictive density minus that of a Gaussian with the training mean and
 *                   variance, averaged; negative is better than that trivial Gaussian, 0 is no better;
 *                   NaN for class outcomes
 * @param logLoss    mean -ln p of the observed class (nats); NaN for numeric outcomes
 * @param accuracy   fraction of held-out runs whose most likely class was observed, in [0, 1]; NaN
 *                   for numeric outcomes
 * @since 0.1
 */
public record Score(int n, double rmse, double coverage90, double msll, double logLoss, double accuracy) {

    /** Checks the invariants: exactly one kind's metrics are present, all finite and in range. */
    public Score {
        if (n < 1) {
            throw new IllegalArgumentException("a score needs at least one held-out run, found " + n);
        }
        boolean numeric = !Double.isNaN(rmse);
        if (numeric) {
            requireIn("rmse", rmse, 0, Double.MAX_VALUE);
            requireIn("coverage90", coverage90, 0, 1);
            requireIn("msll", msll, -Double.MAX_VALUE, Double.MAX_VALUE);
            requireNaN("logLoss", logLoss);
            requireNaN("accuracy", accuracy);
        } else {
            requireNaN("coverage90", coverage90);
            requireNaN("msll", msll);
            requireIn("logLoss", logLoss, 0, Double.MAX_VALUE);
            requireIn("accuracy", accuracy, 0, 1);
        }
    }

    /**
     * A score of a numeric outcome.
     *
     * @param n          held-out runs scored
     * @param rmse       root-mean-square error on the fitting scale
     * @param coverage90 fraction inside the 90 % intervals
     * @param msll       mean standardized log loss
     * @return the score; never null
     */
    public static Score numeric(int n, double rmse, double coverage90, double msll) {
        return new Score(n, rmse, coverage90, msll, Double.NaN, Double.NaN);
    }

    /**
     * A score of a class outcome.
     *
     * @param n        held-out runs scored
     * @param logLoss  mean -ln p of the observed class
     * @param accuracy fraction whose most likely class was observed
     * @return the score; never null
     */
    public static Score classes(int n, double logLoss, double accuracy) {
        return new Score(n, Double.NaN, Double.NaN, Double.NaN, logLoss, accuracy);
    }

    /** @return true for the score of a class outcome (log loss and accuracy present) */
    public boolean forClasses() {
        return Double.isNaN(rmse);
    }

    /** @return the RMSE, empty for a class outcome */
    public OptionalDouble rmseIfAny() {
        return present(rmse);
    }

    /** @return the 90 % coverage, empty for a class outcome */
    public OptionalDouble coverage90IfAny() {
        return present(coverage90);
    }

    /** @return the MSLL, empty for a class outcome */
    public OptionalDouble msllIfAny() {
        return present(msll);
    }

    /** @return the log loss, empty for a numeric outcome */
    public OptionalDouble logLossIfAny() {
        return present(logLoss);
    }

    /** @return the accuracy, empty for a numeric outcome */
    public OptionalDouble accuracyIfAny() {
        return present(accuracy);
    }

    /**
     * @return held-out runs inside the 90 % intervals (numeric) or with the right most likely class
     *         (classes)
     */
    public int hits() {
        return (int) Math.round((forClasses() ? accuracy : coverage90) * n);
    }

    private static OptionalDouble present(double v) {
        return Double.isNaN(v) ? OptionalDouble.empty() : OptionalDouble.of(v);
    }

    private static void requireIn(String name, double v, double lo, double hi) {
        if (!(v >= lo && v <= hi) || !Double.isFinite(v)) {
            throw new IllegalArgumentException(name + " must be finite and in [" + lo + ", " + hi + "], found " + v);
        }
    }

    private static void requireNaN(String name, double v) {
        if (!Double.isNaN(v)) {
            throw new IllegalArgumentException(name + " does not apply to this kind of outcome and must be NaN");
        }
    }
}
