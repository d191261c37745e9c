package dev.terrace.core.surrogate;

/**
 * How well a Gaussian process would have predicted each run before it was grown: the one-step-ahead
 * (prequential) errors of the runs in log order, each predicted from the runs before it, at the
 * hyperparameters fitted on all of them (Dawid 1984, <i>J. R. Stat. Soc. A</i> 147:278, "the
 * prequential approach"; from memory).
 *
 * <p>Why this and not leave-one-out alone: a grower (or Terrace) grows a run <em>because</em> the
 * model of the day predicted it well, so the prediction error at a chosen recipe is larger, and
 * biased towards the target, than at a recipe drawn at random: the optimizer's curse (Smith and
 * Winkler 2006, <i>Management Science</i> 52:311). Leave-one-out predicts each run from all the
 * others, later runs nearby included, and so misses that selection; the one-step-ahead errors
 * contain it. They cost nothing extra: with L the Cholesky factor of the runs' covariance plus noise
 * in log order, w = L<sup>&minus;1</sup>z holds the standardized innovations, the error of run j
 * given runs 1..j&minus;1 is w<sub>j</sub>L<sub>jj</sub> and its predictive variance
 * L<sub>jj</sub>&sup2; (the prediction-error decomposition of a Gaussian likelihood; Harvey 1989,
 * <i>Forecasting, Structural Time Series Models and the Kalman Filter</i>, sec. 3.4; from memory).
 *
 * <p>Calibration: {@link #latentFactor} is the factor &lambda; &ge; k on the latent (model) sd that
 * makes the mean squared standardized one-step-ahead error 1, with the noise sd scaled by the
 * leave-one-out factor k ({@link GpLeaveOneOut#sdFactor}): mean<sub>j</sub> u<sub>j</sub>&sup2; /
 * (&lambda;&sup2;a<sub>j</sub> + k&sup2;b) = 1, with a<sub>j</sub> the latent and b the noise variance
 * (the same moment condition as {@link GpLeaveOneOut#varianceScale}, applied to the model's part of
 * the spread, the part that selection makes too small). Only widening, and only with at least
 * {@value #MIN_SCORED} scored runs.
 *
 * <p>Instances are immutable.
 *
 * @since 0.3
 */
public final class GpForward {

    /**
     * Runs before the first scored one, 3: a run predicted from fewer says more about the prior
     * than about the model the proposals use (a project choice).
     */
    public static final int FIRST_SCORED = 3;

    /** Fewest scored runs, 5, for a judgement, as for leave-one-out ({@link GpLeaveOneOut#MIN_RUNS}). */
    public static final int MIN_SCORED = GpLeaveOneOut.MIN_RUNS;

    /** Largest latent factor, 10: beyond that the model says nothing a wide interval does not (a project choice). */
    public static final double MAX_FACTOR = 10;

    private final double[] u2;
    private final double[] latent;
    private final double noise;

    private GpForward(double[] u2, double[] latent, double noise) {
        this.u2 = u2;
        this.latent = latent;
        this.noise = noise;
    }

    /**
     * @param error    one-step-ahead error of each scored run (outcome minus its prediction), fitting scale
     * @param latent   latent variance of each prediction, &ge; 0
     * @param noise    noise variance of a measurement, &ge; 0
     * @return the check; never null. Non-finite entries are dropped.
     */
    static GpForward of(double[] error, double[] latent, double noise) {
        if (error.length != latent.length) {
            throw new IllegalArgumentException("error and latent arrays differ in length");
        }
        if (!(noise >= 0) || !Double.isFinite(noise)) {
            throw new IllegalArgumentException("noise variance must be finite and >= 0: " + noise);
        }
        int m = 0;
        double[] e2 = new double[error.length];
        double[] a = new double[error.length];
        for (int j = 0; j < error.length; j++) {
            if (Double.isFinite(error[j]) && latent[j] >= 0 && Double.isFinite(latent[j])
                    && latent[j] + noise > 0) {
                e2[m] = error[j] * error[j];
                a[m] = latent[j];
                m++;
            }
        }
        return new GpForward(java.util.Arrays.copyOf(e2, m), java.util.Arrays.copyOf(a, m), noise);
    }

    /** @return the squared one-step-ahead errors of the scored runs, in order (a copy) */
    double[] squaredErrors() {
        return u2.clone();
    }

    /** @return the latent variances of the scored runs' predictions, in order (a copy) */
    double[] latentVariances() {
        return latent.clone();
    }

    /** @return the number of runs scored */
    public int scored() {
        return u2.length;
    }

    /**
     * @param latentFactor factor on the latent sd
     * @param noiseFactor  factor on the noise sd
     * @return the mean squared standardized one-step-ahead error at those factors; NaN with no run scored
     */
    public double meanSquare(double latentFactor, double noiseFactor) {
        if (u2.length == 0) {
            return Double.NaN;
        }
        double s = 0;
        double l2 = latentFactor * latentFactor;
        double n2 = noiseFactor * noiseFactor * noise;
        for (int j = 0; j < u2.length; j++) {
            double v = l2 * latent[j] + n2;
            s += v > 0 ? u2[j] / v : 0;
        }
        return s / u2.length;
    }

    /**
     * The factor on the latent sd of new predictions (see the class comment).
     *
     * @param noiseFactor the factor already on the noise sd (and on the latent sd), &ge; 1
     * @return &lambda; in [noiseFactor, {@link #MAX_FACTOR}] (noiseFactor itself when fewer than
     *         {@value #MIN_SCORED} runs were scored or the errors are already no larger than predicted)
     */
    public double latentFactor(double noiseFactor) {
        if (u2.length < MIN_SCORED || !(meanSquare(noiseFactor, noiseFactor) > 1)) {
            return noiseFactor;
        }
        double hi = Math.max(MAX_FACTOR, noiseFactor);
        if (meanSquare(hi, noiseFactor) > 1) {
            return hi;
        }
        double lo = noiseFactor;
        // the mean square falls monotonically in the factor: bisection to a relative 1e-6
        for (int it = 0; it < 60 && hi - lo > 1e-6 * hi; it++) {
            double mid = 0.5 * (lo + hi);
            if (meanSquare(mid, noiseFactor) > 1) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }
}
