package dev.terrace.core.acquisition;

/**
 * Acquisition functions over a Gaussian predictive distribution: expected improvement and its
 * logarithm, probability of improvement, window probabilities (the chance that an outcome lands
 * inside a target window), Terrace's optimistic window probability, and constrained expected
 * improvement.
 *
 * <p>Conventions: &mu; and &sigma; are the predictive mean and standard deviation of the
 * modelled quantity at one candidate recipe, &phi; and &Phi; the standard normal density and
 * distribution function ({@link StandardNormal}). Every method checks its arguments (finite
 * means and bounds, non-negative standard deviations) and throws
 * {@link IllegalArgumentException} otherwise; none returns NaN or an infinity. Logarithmic
 * forms return {@link #LOG_ZERO} in place of ln 0.
 *
 * @since 0.1
 */
public final class Acquisitions {

    /**
     * Finite stand-in for ln 0, &minus;10&#179;&#8304;&#8304;: returned where a probability or an
     * improvement is exactly zero, and the floor of every logarithm here. It sorts below every
     * attainable logarithm of a positive double and a sum of a few such terms stays finite, which
     * keeps the no-infinity rule of the outputs [practice].
     */
    public static final double LOG_ZERO = -1.0e300;

    /**
     * Exploration offset &xi; = 0.01 suggested for expected improvement on standardised outcomes
     * (Brochu, Cora &amp; de Freitas 2010, arXiv:1012.2599; from memory). Callers pass 0 for the
     * plain criterion of Jones, Schonlau &amp; Welch 1998.
     */
    public static final double SUGGESTED_XI = 0.01;

    /** Below this z the improvement function h(z) = &phi;(z) + z&Phi;(z) is formed without cancellation. */
    private static final double TAIL_Z = -1.0;

    private Acquisitions() {
    }

    // ------------------------------------------------------------------ expected improvement

    /**
     * Expected improvement below the incumbent for minimisation (Jones, Schonlau &amp; Welch
     * 1998, <i>J. Global Optim.</i> 13:455), with &xi; = 0.
     *
     * @param mu    predictive mean
     * @param sigma predictive standard deviation, &ge; 0
     * @param fMin  best (lowest) value observed so far
     * @return EI = (f_min &minus; &mu;)&Phi;(z) + &sigma;&phi;(z), z = (f_min &minus; &mu;)/&sigma;; &ge; 0
     */
    public static double expectedImprovement(double mu, double sigma, double fMin) {
        return expectedImprovement(mu, sigma, fMin, 0.0);
    }

    /**
     * Expected improvement for minimisation with an exploration offset &xi; (Jones, Schonlau
     * &amp; Welch 1998; &xi; as in Brochu, Cora &amp; de Freitas 2010):
     * EI = (f_min &minus; &mu; &minus; &xi;)&Phi;(z) + &sigma;&phi;(z) with
     * z = (f_min &minus; &mu; &minus; &xi;)/&sigma;, and EI = max(f_min &minus; &mu; &minus; &xi;, 0)
     * in the limit &sigma; = 0. For z &lt; &minus;1 it is evaluated as &sigma;&phi;(z)(1 &minus; |z|R(|z|))
     * with Mills' ratio R from a continued fraction, so small values keep full relative accuracy
     * until they underflow (see {@link #logExpectedImprovement(double, double, double, double)});
     * for z &gt; 1 as (f_min &minus; &mu; &minus; &xi;) + &sigma;h(&minus;z) by the identity
     * h(z) = z + h(&minus;z) of h(z) = &phi;(z) + z&Phi;(z).
     *
     * @param mu    predictive mean
     * @param sigma predictive standard deviation, &ge; 0
     * @param fMin  best (lowest) value observed so far
     * @param xi    exploration offset, &ge; 0 (0 for the plain criterion)
     * @return the expected improvement, &ge; 0
     */
    public static double expectedImprovement(double mu, double sigma, double fMin, double xi) {
        checkFinite(mu, "mean");
        checkSd(sigma, "standard deviation");
        checkFinite(fMin, "incumbent");
        checkXi(xi);
        double imp = clampFinite(fMin - mu - xi);
        if (sigma == 0.0) {
            return Math.max(imp, 0.0);
        }
        double z = imp / sigma;
        if (!Double.isFinite(z)) {
            return Math.max(imp, 0.0);
        }
        if (z < TAIL_Z) {
            return sigma * tailImprovement(-z);
        }
        if (z > -TAIL_Z) {
            // h(z) = z + h(-z): the sure improvement plus a small positive tail term, so that
            // EI >= f_min - mu - xi holds exactly and rounding cannot break monotonicity in sigma
            return clampFinite(imp + sigma * tailImprovement(z));
        }
        return clampFinite(imp * StandardNormal.cdf(z) + sigma * StandardNormal.pdf(z));
    }

    /**
     * Expected improvement above the incumbent for maximisation:
     * EI = (&mu; &minus; f_max &minus; &xi;)&Phi;(z) + &sigma;&phi;(z), z = (&mu; &minus; f_max &minus; &xi;)/&sigma;.
     *
     * @param mu    predictive mean
     * @param sigma predictive standard deviation, &ge; 0
     * @param fMax  best (highest) value observed so far
     * @param xi    exploration offset, &ge; 0
     * @return the expected improvement, &ge; 0
     */
    public static double expectedImprovementMax(double mu, double sigma, double fMax, double xi) {
        return expectedImprovement(-checkFinite(mu, "mean"), sigma, -checkFinite(fMax, "incumbent"), xi);
    }

    /**
     * Natural logarithm of the expected improvement for minimisation, finite and accurate where
     * EI itself underflows, following the log-EI reformulation of Ament, Daulton, Eriksson,
     * Balandat &amp; Bakshy, "Unexpected improvements to expected improvement", <i>NeurIPS</i>
     * 2023: ln EI = ln &sigma; + ln h(z) with h(z) = &phi;(z) + z&Phi;(z), and for z &lt; &minus;1
     * ln h(z) = &minus;z&sup2;/2 &minus; ln &radic;(2&pi;) &minus; ln(f1&middot;f2), where f1 and f2
     * are the outer levels of Laplace's continued fraction for Mills' ratio, so that
     * 1 &minus; |z|R(|z|) = 1/(f1&middot;f2) is formed without cancellation. (The paper uses erfcx
     * and log1mexp for the same quantity; the continued fraction is an equivalent route.)
     *
     * @param mu    predictive mean
     * @param sigma predictive standard deviation, &ge; 0
     * @param fMin  best (lowest) value observed so far
     * @param xi    exploration offset, &ge; 0
     * @return ln EI, or {@link #LOG_ZERO} when EI is exactly 0 (&sigma; = 0 and no improvement)
     */
    public static double logExpectedImprovement(double mu, double sigma, double fMin, double xi) {
        checkFinite(mu, "mean");
        checkSd(sigma, "standard deviation");
        checkFinite(fMin, "incumbent");
        checkXi(xi);
        double imp = clampFinite(fMin - mu - xi);
        double z = sigma == 0.0 ? Double.NaN : imp / sigma;
        if (sigma == 0.0 || !Double.isFinite(z)) {
            return imp > 0.0 ? Math.log(imp) : LOG_ZERO;
        }
        if (z < TAIL_Z) {
            double t = -z;
            double[] f = StandardNormal.continuedFraction(t);
            double v = Math.log(sigma) - 0.5 * t * t - StandardNormal.LN_SQRT_2PI - Math.log(f[0]) - Math.log(f[1]);
            return Math.max(LOG_ZERO, v);
        }
        double ei = expectedImprovement(mu, sigma, fMin, xi);
        return ei > 0.0 ? Math.max(LOG_ZERO, Math.log(ei)) : LOG_ZERO;
    }

    /**
     * Natural logarithm of the expected improvement for maximisation; see
     * {@link #logExpectedImprovement(double, double, double, double)}.
     *
     * @param mu    predictive mean
     * @param sigma predictive standard deviation, &ge; 0
     * @param fMax  best (highest) value observed so far
     * @param xi    exploration offset, &ge; 0
     * @return ln EI, or {@link #LOG_ZERO} when EI is exactly 0
     */
    public static double logExpectedImprovementMax(double mu, double sigma, double fMax, double xi) {
        return logExpectedImprovement(-checkFinite(mu, "mean"), sigma, -checkFinite(fMax, "incumbent"), xi);
    }

    // ------------------------------------------------------------------ probability of improvement

    /**
     * Probability of improvement for minimisation (Kushner 1964, <i>J. Basic Eng.</i> 86:97):
     * PI = &Phi;((f_min &minus; &mu; &minus; &xi;)/&sigma;); for &sigma; = 0 it is 1 when
     * f_min &minus; &mu; &minus; &xi; &gt; 0 and 0 otherwise.
     *
     * @param mu    predictive mean
     * @param sigma predictive standard deviation, &ge; 0
     * @param fMin  best (lowest) value observed so far
     * @param xi    exploration offset, &ge; 0
     * @return the probability, in [0, 1]
     */
    public static double probabilityOfImprovement(double mu, double sigma, double fMin, double xi) {
        checkFinite(mu, "mean");
        checkSd(sigma, "standard deviation");
        checkFinite(fMin, "incumbent");
        checkXi(xi);
        double imp = clampFinite(fMin - mu - xi);
        double z = sigma == 0.0 ? Double.NaN : imp / sigma;
        if (sigma == 0.0 || !Double.isFinite(z)) {
            return imp > 0.0 ? 1.0 : 0.0;
        }
        return StandardNormal.cdf(z);
    }

    /**
     * Probability of improvement for maximisation: PI = &Phi;((&mu; &minus; f_max &minus; &xi;)/&sigma;).
     *
     * @param mu    predictive mean
     * @param sigma predictive standard deviation, &ge; 0
     * @param fMax  best (highest) value observed so far
     * @param xi    exploration offset, &ge; 0
     * @return the probability, in [0, 1]
     */
    public static double probabilityOfImprovementMax(double mu, double sigma, double fMax, double xi) {
        return probabilityOfImprovement(-checkFinite(mu, "mean"), sigma, -checkFinite(fMax, "incumbent"), xi);
    }

    /**
     * Natural logarithm of the probability of improvement for minimisation, finite where PI underflows.
     *
     * @param mu    predictive mean
     * @param sigma predictive standard deviation, &ge; 0
     * @param fMin  best (lowest) value observed so far
     * @param xi    exploration offset, &ge; 0
     * @return ln PI, or {@link #LOG_ZERO} when PI is exactly 0
     */
    public static double logProbabilityOfImprovement(double mu, double sigma, double fMin, double xi) {
        checkFinite(mu, "mean");
        checkSd(sigma, "standard deviation");
        checkFinite(fMin, "incumbent");
        checkXi(xi);
        double imp = clampFinite(fMin - mu - xi);
        double z = sigma == 0.0 ? Double.NaN : imp / sigma;
        if (sigma == 0.0 || !Double.isFinite(z)) {
            return imp > 0.0 ? 0.0 : LOG_ZERO;
        }
        return StandardNormal.logCdf(z);
    }

    // ------------------------------------------------------------------ window probabilities

    /**
     * Probability that an outcome Y ~ N(&mu;, s&sup2;) lands inside the window [lo, hi]. A NaN
     * (or infinite) bound leaves that end open. The difference &Phi;(b) &minus; &Phi;(a) of the
     * standardised bounds is always taken on the side of the mean away from the window, as
     * &Phi;(&minus;a) &minus; &Phi;(&minus;b) when the window lies above the mean, so that windows
     * far in a tail keep their relative accuracy instead of cancelling against 1.
     *
     * @param mu mean of the outcome
     * @param s  standard deviation of the outcome, &ge; 0 (0 gives the indicator lo &le; &mu; &le; hi)
     * @param lo lower bound, or NaN for none
     * @param hi upper bound, or NaN for none; when both are given, lo &le; hi
     * @return P(lo &le; Y &le; hi), in [0, 1]
     */
    public static double windowProbability(double mu, double s, double lo, double hi) {
        checkFinite(mu, "mean");
        checkSd(s, "standard deviation");
        boolean hasLo = hasLower(lo);
        boolean hasHi = hasUpper(hi);
        checkOrder(lo, hi, hasLo, hasHi);
        if (!hasLo && !hasHi) {
            return 1.0;
        }
        if (s == 0.0) {
            return (!hasLo || mu >= lo) && (!hasHi || mu <= hi) ? 1.0 : 0.0;
        }
        double a = hasLo ? clampFinite((lo - mu) / s) : Double.NEGATIVE_INFINITY;
        double b = hasHi ? clampFinite((hi - mu) / s) : Double.POSITIVE_INFINITY;
        double p;
        if (a >= 0.0) {
            // window above the mean: upper-tail difference
            p = StandardNormal.cdf(-a) - (hasHi ? StandardNormal.cdf(-b) : 0.0);
        } else if (b <= 0.0) {
            // window below the mean: lower-tail difference
            p = StandardNormal.cdf(b) - (hasLo ? StandardNormal.cdf(a) : 0.0);
        } else {
            // window straddles the mean: 1 minus the two tails
            p = 1.0 - (hasLo ? StandardNormal.cdf(a) : 0.0) - (hasHi ? StandardNormal.cdf(-b) : 0.0);
        }
        return Math.min(1.0, Math.max(0.0, p));
    }

    /**
     * Natural logarithm of {@link #windowProbability(double, double, double, double)}, finite and
     * accurate for windows so far in a tail that the probability itself underflows.
     *
     * @param mu mean of the outcome
     * @param s  standard deviation of the outcome, &ge; 0
     * @param lo lower bound, or NaN for none
     * @param hi upper bound, or NaN for none
     * @return ln P(lo &le; Y &le; hi), or {@link #LOG_ZERO} when the probability is exactly 0
     */
    public static double logWindowProbability(double mu, double s, double lo, double hi) {
        checkFinite(mu, "mean");
        checkSd(s, "standard deviation");
        boolean hasLo = hasLower(lo);
        boolean hasHi = hasUpper(hi);
        checkOrder(lo, hi, hasLo, hasHi);
        if (s == 0.0 || !hasLo && !hasHi) {
            return windowProbability(mu, s, lo, hi) > 0.0 ? 0.0 : LOG_ZERO;
        }
        double a = hasLo ? clampFinite((lo - mu) / s) : Double.NEGATIVE_INFINITY;
        double b = hasHi ? clampFinite((hi - mu) / s) : Double.POSITIVE_INFINITY;
        if (a >= 0.0) {
            return logTailDifference(a, hasHi ? b : Double.POSITIVE_INFINITY);
        }
        if (b <= 0.0) {
            return logTailDifference(-b, hasLo ? -a : Double.POSITIVE_INFINITY);
        }
        double p = windowProbability(mu, s, lo, hi);
        return p > 0.0 ? Math.log(p) : LOG_ZERO;
    }

    /**
     * Terrace's exploration knob for target windows: the <em>optimistic window probability</em>,
     * an upper-confidence analogue of the yield. The latent mean of the outcome at a recipe is
     * only known to about &mu; &plusmn; &beta;&sigma;_latent; this returns the best chance of
     * landing in the window over that band,
     * max over m in [&mu; &minus; &beta;&sigma;_latent, &mu; + &beta;&sigma;_latent] of
     * P(lo &le; Y &le; hi) with Y ~ N(m, &sigma;_new&sup2;). It borrows the optimism in the face
     * of uncertainty of GP-UCB (Srinivas, Krause, Kakade &amp; Seeger 2010, <i>ICML</i>): recipes
     * whose outcome is poorly known score as if their mean were the most favourable plausible
     * one, so they get explored; &beta; = 0 gives back the plain window probability.
     *
     * <p>Closed form: for fixed spread the window probability of a two-sided window is unimodal
     * in m and symmetric about the window centre c = (lo + hi)/2, so the best m is c clamped to
     * the band; for a window open above (below) it grows (falls) with m, so the best m is the
     * upper (lower) edge of the band.
     *
     * @param mu          predictive mean of the latent outcome
     * @param sigmaLatent predictive standard deviation of the latent outcome, &ge; 0
     * @param sigmaNew    standard deviation of one new run's outcome about its mean (for example
     *                    the measurement noise), &ge; 0
     * @param lo          lower bound of the window, or NaN for none
     * @param hi          upper bound of the window, or NaN for none
     * @param beta        width of the band in latent standard deviations, &ge; 0
     * @return the optimistic probability, in [0, 1], never below
     *         {@code windowProbability(mu, sigmaNew, lo, hi)}
     */
    public static double optimisticWindowProbability(double mu, double sigmaLatent, double sigmaNew,
                                                     double lo, double hi, double beta) {
        double best = windowProbability(optimisticMean(mu, sigmaLatent, lo, hi, beta), sigmaNew, lo, hi);
        // mu itself lies in the band; taking the larger value keeps the "never below plain"
        // guarantee exact when the two maximisers differ only by rounding
        return Math.max(best, windowProbability(mu, sigmaNew, lo, hi));
    }

    /**
     * Natural logarithm of {@link #optimisticWindowProbability(double, double, double, double, double, double)}.
     *
     * @param mu          predictive mean of the latent outcome
     * @param sigmaLatent predictive standard deviation of the latent outcome, &ge; 0
     * @param sigmaNew    standard deviation of one new run's outcome about its mean, &ge; 0
     * @param lo          lower bound of the window, or NaN for none
     * @param hi          upper bound of the window, or NaN for none
     * @param beta        width of the band in latent standard deviations, &ge; 0
     * @return the logarithm, or {@link #LOG_ZERO} when the probability is exactly 0
     */
    public static double logOptimisticWindowProbability(double mu, double sigmaLatent, double sigmaNew,
                                                        double lo, double hi, double beta) {
        double best = logWindowProbability(optimisticMean(mu, sigmaLatent, lo, hi, beta), sigmaNew, lo, hi);
        return Math.max(best, logWindowProbability(mu, sigmaNew, lo, hi));
    }

    /**
     * The mean within the optimistic band that maximises the window probability.
     *
     * @param mu          predictive mean of the latent outcome
     * @param sigmaLatent predictive standard deviation of the latent outcome, &ge; 0
     * @param lo          lower bound of the window, or NaN for none
     * @param hi          upper bound of the window, or NaN for none
     * @param beta        width of the band in latent standard deviations, &ge; 0
     * @return the maximising mean, in [&mu; &minus; &beta;&sigma;_latent, &mu; + &beta;&sigma;_latent]
     */
    public static double optimisticMean(double mu, double sigmaLatent, double lo, double hi, double beta) {
        checkFinite(mu, "mean");
        checkSd(sigmaLatent, "latent standard deviation");
        if (!(beta >= 0.0) || !Double.isFinite(beta)) {
            throw new IllegalArgumentException("beta must be finite and >= 0: " + beta);
        }
        boolean hasLo = hasLower(lo);
        boolean hasHi = hasUpper(hi);
        checkOrder(lo, hi, hasLo, hasHi);
        double half = clampFinite(beta * sigmaLatent);
        double down = clampFinite(mu - half);
        double up = clampFinite(mu + half);
        if (hasLo && hasHi) {
            double c = lo + 0.5 * (hi - lo);
            return Math.min(up, Math.max(down, c));
        }
        if (hasLo) {
            return up;
        }
        if (hasHi) {
            return down;
        }
        return mu;
    }

    // ------------------------------------------------------------------ constraints

    /**
     * Probability that an independently modelled constraint c(x) ~ N(&mu;_c, &sigma;_c&sup2;)
     * holds, P(c &le; &lambda;) = &Phi;((&lambda; &minus; &mu;_c)/&sigma;_c) (Gardner et al.
     * 2014, <i>ICML</i>, PMLR 32:937).
     *
     * @param muC    predictive mean of the constraint
     * @param sigmaC predictive standard deviation of the constraint, &ge; 0
     * @param limit  the limit &lambda;
     * @return the probability of feasibility, in [0, 1]
     */
    public static double probabilityFeasible(double muC, double sigmaC, double limit) {
        checkFinite(limit, "limit");
        return windowProbability(muC, sigmaC, Double.NaN, limit);
    }

    /**
     * Constrained expected improvement for minimisation (Schonlau, Welch &amp; Jones 1998, IMS
     * Monograph Series 34:11; Gardner, Kusner, Xu, Weinberger &amp; Cunningham 2014, <i>ICML</i>):
     * cEI = EI(&mu;, &sigma;; f_min) &times; &Pi;_k P(feasible_k). The incumbent f_min should be
     * the best <em>feasible</em> observation; while none exists, maximise the product of the
     * feasibility probabilities alone (Gelbart, Snoek &amp; Adams 2014, <i>UAI</i>).
     *
     * @param mu        predictive mean of the objective
     * @param sigma     predictive standard deviation of the objective, &ge; 0
     * @param fMin      best feasible value observed so far
     * @param xi        exploration offset, &ge; 0
     * @param pFeasible probabilities of feasibility of the constraints, each in [0, 1]
     * @return the constrained expected improvement, &ge; 0
     */
    public static double constrainedExpectedImprovement(double mu, double sigma, double fMin, double xi,
                                                        double... pFeasible) {
        double v = expectedImprovement(mu, sigma, fMin, xi);
        for (double p : checkProbabilities(pFeasible)) {
            v *= p;
        }
        return v;
    }

    /**
     * Natural logarithm of the constrained expected improvement, ln EI + &Sigma;_k ln P(feasible_k),
     * finite where the product underflows.
     *
     * @param mu        predictive mean of the objective
     * @param sigma     predictive standard deviation of the objective, &ge; 0
     * @param fMin      best feasible value observed so far
     * @param xi        exploration offset, &ge; 0
     * @param pFeasible probabilities of feasibility of the constraints, each in [0, 1]
     * @return the logarithm, or {@link #LOG_ZERO} when the product is exactly 0
     */
    public static double logConstrainedExpectedImprovement(double mu, double sigma, double fMin, double xi,
                                                           double... pFeasible) {
        double v = logExpectedImprovement(mu, sigma, fMin, xi);
        if (v <= LOG_ZERO) {
            return LOG_ZERO;
        }
        for (double p : checkProbabilities(pFeasible)) {
            if (p == 0.0) {
                return LOG_ZERO;
            }
            v += Math.log(p);
        }
        return Math.max(LOG_ZERO, v);
    }

    // ------------------------------------------------------------------ helpers

    /**
     * h(&minus;t) = &phi;(t) &minus; t&Phi;(&minus;t) = &phi;(t)/(f1&middot;f2) for t &ge; 1, without cancellation.
     */
    private static double tailImprovement(double t) {
        double[] f = StandardNormal.continuedFraction(t);
        return StandardNormal.pdf(t) / (f[0] * f[1]);
    }

    /** ln(Q(a) &minus; Q(b)) for 0 &le; a &le; b (b may be +&infin;), Q the upper tail. */
    private static double logTailDifference(double a, double b) {
        double la = StandardNormal.logCdf(-a);
        if (b == Double.POSITIVE_INFINITY) {
            return la;
        }
        double lb = StandardNormal.logCdf(-b);
        double r = lb - la;
        if (!(r < 0.0)) {
            return LOG_ZERO;
        }
        // ln(Qa - Qb) = la + ln(1 - exp(r)), with the two-branch log1mexp of Maechler 2012,
        // "Accurately computing log(1 - exp(-|a|))", a vignette of the R package Rmpfr (from memory)
        double l1m = r > -0.6931471805599453 ? Math.log(-Math.expm1(r)) : Math.log1p(-Math.exp(r));
        return Math.max(LOG_ZERO, la + l1m);
    }

    private static boolean hasLower(double lo) {
        return !Double.isNaN(lo) && lo != Double.NEGATIVE_INFINITY;
    }

    private static boolean hasUpper(double hi) {
        return !Double.isNaN(hi) && hi != Double.POSITIVE_INFINITY;
    }

    private static void checkOrder(double lo, double hi, boolean hasLo, boolean hasHi) {
        if (hasLo && !Double.isFinite(lo)) {
            throw new IllegalArgumentException("lower bound must be finite, NaN or -infinity: " + lo);
        }
        if (hasHi && !Double.isFinite(hi)) {
            throw new IllegalArgumentException("upper bound must be finite, NaN or +infinity: " + hi);
        }
        if (hasLo && hasHi && lo > hi) {
            throw new IllegalArgumentException("window bounds out of order: " + lo + " > " + hi);
        }
    }

    private static double[] checkProbabilities(double[] p) {
        if (p == null) {
            throw new IllegalArgumentException("feasibility probabilities are null");
        }
        for (double v : p) {
            if (!(v >= 0.0 && v <= 1.0)) {
                throw new IllegalArgumentException("feasibility probability outside [0, 1]: " + v);
            }
        }
        return p;
    }

    private static double checkFinite(double v, String what) {
        if (!Double.isFinite(v)) {
            throw new IllegalArgumentException(what + " is not finite: " + v);
        }
        return v;
    }

    private static void checkSd(double s, String what) {
        if (!(s >= 0.0) || !Double.isFinite(s)) {
            throw new IllegalArgumentException(what + " must be finite and >= 0: " + s);
        }
    }

    private static void checkXi(double xi) {
        if (!(xi >= 0.0) || !Double.isFinite(xi)) {
            throw new IllegalArgumentException("xi must be finite and >= 0: " + xi);
        }
    }

    private static double clampFinite(double v) {
        if (v > Double.MAX_VALUE) {
            return Double.MAX_VALUE;
        }
        if (v < -Double.MAX_VALUE) {
            return -Double.MAX_VALUE;
        }
        return v;
    }
}
