package dev.terrace.core.propose;

import dev.terrace.core.surrogate.GaussianProcess;

/**
 * Student-t tails for spreads whose scale is estimated from few runs ({@link #factor}).
 *
 * @since 0.3
 */
public final class StudentSpread {

    private StudentSpread() {
    }

    /**
     * The factor on an outcome's predictive sd that stands in for the Student-t predictive of a
     * GP whose scale is estimated from its n runs: with a constant mean and the variance scale
     * integrated out under their usual non-informative priors, the predictive at a new recipe is a
     * Student t with n &minus; 1 degrees of freedom, not a normal (Santner, Williams and Notz 2003,
     * <i>The Design and Analysis of Computer Experiments</i>, sec. 4.1.2; Handcock and Stein 1993,
     * <i>Technometrics</i> 35:403). The normal that Terrace's yield and intervals use is widened by
     * t<sub>0.95, n&minus;1</sub> / z<sub>0.95</sub>, so that its central 90 % interval is the t's:
     * 1.30 at 5 runs, 1.11 at 10, 1.05 at 20, 1.02 at 40 (the quantiles: any t table, e.g.
     * Abramowitz and Stegun 1964, table 26.10). One run keeps the single-run spread of
     * {@link GaussianProcess} (factor 1).
     *
     * @param runs the measured runs of the outcome
     * @return the factor, &ge; 1
     */
    public static double factor(int runs) {
        if (runs < 2) {
            return 1;
        }
        if (runs > TABLE_RUNS) {
            // t_0.95,nu / z_0.95 = 1 + (1 + z^2) / (4 nu) + O(nu^-2) (Cornish-Fisher; Abramowitz and Stegun 26.7.5)
            double nu = runs - 1;
            return 1 + (1 + Proposer.Z90 * Proposer.Z90) / (4 * nu);
        }
        return StudentTable.FACTOR[runs];
    }

    /** {@link #factor} for 2 to {@link #TABLE_RUNS} runs, computed once (holder idiom). */
    private static final class StudentTable {
        static final double[] FACTOR = new double[TABLE_RUNS + 1];

        static {
            for (int n = 2; n <= TABLE_RUNS; n++) {
                FACTOR[n] = new org.apache.commons.math3.distribution.TDistribution(null, n - 1, 1e-12)
                        .inverseCumulativeProbability(0.95) / Proposer.Z90;
            }
        }
    }

    /** Above this many runs {@link #factor} uses its first-order expansion (error below 1e-5). */
    static final int TABLE_RUNS = 400;
}
