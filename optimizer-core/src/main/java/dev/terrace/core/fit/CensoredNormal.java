package dev.terrace.core.fit;

import dev.terrace.core.runlog.Censored;
import org.apache.commons.math3.special.Erf;

/**
 * The censored-normal (Tobit) terms of the fit's likelihood (Tobin, Econometrica 26, 24-36 (1958)).
 *
 * <p>A value known only to lie below a bound {@code b} (written {@code <b}) contributes
 * {@code log Φ((b − μ)/σ)} to the log-likelihood, a value above it ({@code >b}) contributes
 * {@code log(1 − Φ((b − μ)/σ))}, with μ the model's prediction and σ the outcome's scatter, both on the
 * outcome's fitting scale.
 */
final class CensoredNormal {

    /** Below this z the lower tail uses its asymptotic series (erfc underflows near z = −38). */
    private static final double TAIL_Z = -30;

    private CensoredNormal() {
    }

    /**
     * @param z standard normal quantile
     * @return log Φ(z), accurate far into the lower tail
     */
    static double logCdf(double z) {
        if (z < TAIL_Z) {
            // Mills ratio series: Φ(z) ≈ φ(z)/|z| (1 − 1/z² + 3/z⁴), Abramowitz and Stegun 26.2.12
            double z2 = z * z;
            return -0.5 * z2 - Math.log(-z) - 0.5 * Math.log(2 * Math.PI) + Math.log1p(-1 / z2 + 3 / (z2 * z2));
        }
        return Math.log(0.5 * Erf.erfc(-z / Math.sqrt(2)));
    }

    /**
     * Log-probability that the true value lies on the recorded side of the bound.
     *
     * @param side     which side the true value lies on
     * @param bound    the bound on the fitting scale
     * @param mean     the model's prediction on the fitting scale
     * @param sigma    the scatter; positive
     * @return the Tobit log-likelihood term, at most 0
     */
    static double logProbability(Censored.Side side, double bound, double mean, double sigma) {
        double z = (bound - mean) / sigma;
        return side == Censored.Side.BELOW ? logCdf(z) : logCdf(-z);
    }

    /**
     * The term as a least-squares residual: {@code sqrt(−2 log P)}, so that half its square is the
     * term's negative log-likelihood and Levenberg-Marquardt minimises the same objective.
     *
     * @return the pseudo-residual, at least 0
     */
    static double pseudoResidual(Censored.Side side, double bound, double mean, double sigma) {
        return Math.sqrt(Math.max(0, -2 * logProbability(side, bound, mean, sigma)));
    }
}
