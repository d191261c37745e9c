package dev.terrace.core.surrogate;

/**
 * How well a Gaussian process predicts each of its own runs when that run is left out, from the
 * closed-form leave-one-out predictions of {@link GaussianProcess#leaveOneOut}, on the outcome's
 * fitting scale (log10 for log outcomes).
 *
 * <p>Skill is judged by the predictive coefficient of determination Q&sup2; = 1 &minus;
 * PRESS/SS, where PRESS is the sum of squared leave-one-out errors (Allen 1974, <i>Technometrics</i>
 * 16:125, "the prediction sum of squares"; from memory) and SS the sum of squared deviations of
 * the outcomes from their mean. Q&sup2; &le; 0 means the leave-one-out error is at least the
 * spread of the outcomes themselves: the model predicts no better than their mean
 * ({@link #hasSkill}).
 *
 * @param runs       runs scored, &ge; 1
 * @param rmse       root mean squared leave-one-out error, finite, &ge; 0 (0 when it could not be computed)
 * @param q2         predictive Q&sup2;, at most 1; NaN when the outcomes have no spread
 * <p>Calibration of the spread: if the predictive variances were right, the leave-one-out errors
 * divided by their predictive sds would have unit mean square. Scaling every predictive variance
 * (latent and noise) by a factor c changes no leave-one-out mean and multiplies every
 * leave-one-out variance by c, and the c that maximises the leave-one-out log predictive probability
 * (Rasmussen and Williams 2006, sec. 5.4.2, eq. 5.10; Sundararajan and Keerthi, Neural Computation
 * 13, 1103 (2001)) is the mean squared standardized error, {@link #varianceScale}.
 *
 * @param runs          runs scored, &ge; 1
 * @param rmse          root mean squared leave-one-out error, finite, &ge; 0 (0 when it could not be computed)
 * @param q2            predictive Q&sup2;, at most 1; NaN when the outcomes have no spread
 * @param observedSd    sample standard deviation (n &minus; 1) of the scored outcomes, &ge; 0; 0 for one run
 * @param varianceScale mean of (error&sup2; / leave-one-out variance) over the scored runs, &gt; 0;
 *                      NaN when it could not be computed
 * @since 0.2
 */
public record GpLeaveOneOut(int runs, double rmse, double q2, double observedSd, double varianceScale) {

    /**
     * Fewest scored runs, 5, for which {@link #hasSkill} passes judgement: below that a
     * leave-one-out Q&sup2; rests on too few errors to say anything (a project choice).
     */
    public static final int MIN_RUNS = 5;

    /** Checks the invariants. */
    public GpLeaveOneOut {
        if (runs < 1) {
            throw new IllegalArgumentException("at least one run is scored: " + runs);
        }
        if (!(rmse >= 0) || !Double.isFinite(rmse)) {
            throw new IllegalArgumentException("rmse must be finite and >= 0: " + rmse);
        }
        if (!Double.isNaN(q2) && !(q2 <= 1)) {
            throw new IllegalArgumentException("Q2 is at most 1: " + q2);
        }
        if (!(observedSd >= 0) || !Double.isFinite(observedSd)) {
            throw new IllegalArgumentException("observed sd must be finite and >= 0: " + observedSd);
        }
        if (!Double.isNaN(varianceScale) && !(varianceScale >= 0 && varianceScale < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("variance scale must be finite and >= 0: " + varianceScale);
        }
    }

    /**
     * Summarises leave-one-out errors.
     *
     * @param y        the runs' outcomes on the fitting scale
     * @param error    outcome minus its leave-one-out mean, per run
     * @param variance leave-one-out predictive variance, per run (not used in the summary; checked)
     * @return the summary; never null
     */
    static GpLeaveOneOut of(double[] y, double[] error, double[] variance) {
        int n = y.length;
        double mean = 0;
        for (double v : y) {
            mean += v / n;
        }
        double ss = 0;
        double press = 0;
        double z2 = 0;
        boolean finite = true;
        for (int i = 0; i < n; i++) {
            ss += (y[i] - mean) * (y[i] - mean);
            press += error[i] * error[i];
            z2 += error[i] * error[i] / variance[i];
            finite &= Double.isFinite(error[i]) && variance[i] > 0 && Double.isFinite(variance[i]);
        }
        if (!finite || !Double.isFinite(press)) {
            // a degenerate factor: no judgement rather than a failed proposal
            return new GpLeaveOneOut(n, 0, Double.NaN, n > 1 ? Math.sqrt(ss / (n - 1)) : 0, Double.NaN);
        }
        double q2 = ss > 0 ? Math.min(1, 1 - press / ss) : Double.NaN;
        double c = z2 / n;
        return new GpLeaveOneOut(n, Math.sqrt(press / n), q2, n > 1 ? Math.sqrt(ss / (n - 1)) : 0,
                Double.isFinite(c) ? c : Double.NaN);
    }

    /**
     * The no-skill rule: with at least {@link #MIN_RUNS} runs, the model has skill unless Q&sup2; &le;
     * 0 (leave-one-out RMSE at least the population sd of the outcomes). Outcomes without spread,
     * or too few runs, are given the benefit of the doubt.
     *
     * @return false when leave-one-out says the model predicts no better than the mean
     */
    public boolean hasSkill() {
        return runs < MIN_RUNS || Double.isNaN(q2) || q2 > 0;
    }

    /**
     * The spread a no-skill outcome's new measurement is given: the larger of the leave-one-out
     * RMSE and the observed outcomes' sample sd.
     *
     * @return the spread on the fitting scale, &ge; 0
     */
    public double noSkillSpread() {
        return Math.max(rmse, observedSd);
    }

    /**
     * The factor on the predictive sd (latent and noise) of new predictions: the square root of
     * {@link #varianceScale} when at least {@link #MIN_RUNS} runs were scored and it exceeds 1, else
     * 1. Only widening: below {@link #MIN_RUNS} errors the mean square is too noisy to narrow
     * intervals on, and a too-wide interval costs a grower less than a too-narrow one (a project
     * choice).
     *
     * @return the factor, &ge; 1
     */
    public double sdFactor() {
        if (runs < MIN_RUNS || !(varianceScale > 1)) {
            return 1;
        }
        return Math.sqrt(varianceScale);
    }
}
