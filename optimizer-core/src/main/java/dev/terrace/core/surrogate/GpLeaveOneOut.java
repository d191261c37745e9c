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
 * @param rmse       root mean squared leave-one-out error, finite, &ge; 0
 * @param q2         predictive Q&sup2;, at most 1; NaN when the outcomes have no spread
 * @param observedSd sample standard deviation (n &minus; 1) of the scored outcomes, &ge; 0; 0 for one run
 * @since 0.2
 */
public record GpLeaveOneOut(int runs, double rmse, double q2, double observedSd) {

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
        for (int i = 0; i < n; i++) {
            ss += (y[i] - mean) * (y[i] - mean);
            press += error[i] * error[i];
            if (!Double.isFinite(error[i]) || !(variance[i] > 0)) {
                throw new IllegalStateException("leave-one-out prediction " + i + " is not finite");
            }
        }
        double q2 = ss > 0 ? Math.min(1, 1 - press / ss) : Double.NaN;
        return new GpLeaveOneOut(n, Math.sqrt(press / n), q2, n > 1 ? Math.sqrt(ss / (n - 1)) : 0);
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
}
