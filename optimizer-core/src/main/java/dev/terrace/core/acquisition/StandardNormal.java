package dev.terrace.core.acquisition;

/**
 * The standard normal density &phi;, distribution function &Phi; and their logarithms, accurate
 * to a few ulp in relative terms far into both tails.
 *
 * <p>Methods:
 * <ul>
 *   <li>&phi;(z) = exp(&minus;z&sup2;/2)/&radic;(2&pi;), with z&sup2; split as
 *       h&sup2; + (z &minus; h)(z + h) for h = z rounded to a multiple of 1/16, so that the
 *       rounding of z&sup2; does not grow into a relative error of order z&sup2;&middot;ulp
 *       (the device used by Cody's normal-integral routines; from memory).</li>
 *   <li>For |z| &le; 1: &Phi;(z) = 1/2 + &phi;(z)(z + z&sup3;/3 + z&#8309;/(3&middot;5) + &hellip;),
 *       a series of positive terms (Marsaglia 2004, <i>J. Stat. Softw.</i> 11(4); from
 *       memory).</li>
 *   <li>For z &lt; &minus;1: &Phi;(z) = &phi;(z)&middot;R(|z|) with Mills' ratio
 *       R(t) = 1/(t + 1/(t + 2/(t + 3/(t + &hellip;)))), Laplace's continued fraction, evaluated
 *       backwards from a depth that gives full double precision for t &ge; 1 (checked against
 *       50-digit mpmath 1.3.0 in the tests). The upper tail uses &Phi;(z) = 1 &minus; &Phi;(&minus;z).</li>
 * </ul>
 * Logarithms are formed from the same pieces, so log &Phi;(z) stays finite and accurate where
 * &Phi;(z) itself underflows (z below about &minus;38.5). No method returns NaN or an infinity:
 * logarithms are clamped below at {@link Acquisitions#LOG_ZERO}.
 *
 * @since 0.1
 */
public final class StandardNormal {

    /** ln &radic;(2&pi;) = 0.9189385332046728 (closed form). */
    static final double LN_SQRT_2PI = 0.91893853320467274178;

    /** 1/&radic;(2&pi;) = 0.3989422804014327 (closed form). */
    static final double INV_SQRT_2PI = 0.39894228040143267794;

    /** Beyond this |z| the density is below the smallest subnormal double and is returned as 0. */
    private static final double PDF_ZERO_BEYOND = 38.7;

    private StandardNormal() {
    }

    /**
     * The standard normal density.
     *
     * @param z a finite value
     * @return &phi;(z), in [0, 0.3989422804014327]
     */
    public static double pdf(double z) {
        double a = Math.abs(checkFinite(z));
        if (a > PDF_ZERO_BEYOND) {
            return 0.0;
        }
        return INV_SQRT_2PI * expHalfSquare(a);
    }

    /**
     * The logarithm of the standard normal density.
     *
     * @param z a finite value
     * @return ln &phi;(z) = &minus;z&sup2;/2 &minus; ln &radic;(2&pi;), clamped below at {@link Acquisitions#LOG_ZERO}
     */
    public static double logPdf(double z) {
        double a = Math.abs(checkFinite(z));
        return Math.max(Acquisitions.LOG_ZERO, -0.5 * a * a - LN_SQRT_2PI);
    }

    /**
     * The standard normal distribution function.
     *
     * @param z a finite value
     * @return &Phi;(z), in [0, 1]
     */
    public static double cdf(double z) {
        checkFinite(z);
        if (z < -1.0) {
            return lowerTail(-z);
        }
        if (z <= 1.0) {
            return 0.5 + pdf(z) * series(z);
        }
        return 1.0 - lowerTail(z);
    }

    /**
     * The upper tail 1 &minus; &Phi;(z) = &Phi;(&minus;z), without cancellation for large z.
     *
     * @param z a finite value
     * @return &Phi;(&minus;z), in [0, 1]
     */
    public static double upperTail(double z) {
        return cdf(-z);
    }

    /**
     * The logarithm of the standard normal distribution function, finite where &Phi; underflows.
     *
     * @param z a finite value
     * @return ln &Phi;(z), in [{@link Acquisitions#LOG_ZERO}, 0]
     */
    public static double logCdf(double z) {
        checkFinite(z);
        if (z < -1.0) {
            double t = -z;
            double[] f = continuedFraction(t);
            return Math.max(Acquisitions.LOG_ZERO, -0.5 * t * t - LN_SQRT_2PI - Math.log(f[0]));
        }
        if (z <= 1.0) {
            return Math.log(cdf(z));
        }
        return Math.log1p(-lowerTail(z));
    }

    /**
     * Mills' ratio R(t) = &Phi;(&minus;t)/&phi;(t) for t &ge; 1, by Laplace's continued fraction.
     *
     * @param t a value of at least 1
     * @return R(t), in (0, 1/t)
     */
    static double millsRatio(double t) {
        return 1.0 / continuedFraction(t)[0];
    }

    /**
     * The two outermost levels of Laplace's continued fraction for t &ge; 1.
     *
     * @param t a value of at least 1
     * @return {f1, f2} with f1 = t + 1/f2 and f2 = t + 2/(t + 3/(t + &hellip;)), so that
     *         R(t) = 1/f1 and 1 &minus; t&middot;R(t) = 1/(f1&middot;f2) without cancellation
     */
    static double[] continuedFraction(double t) {
        int depth = depth(t);
        double f = t;
        for (int k = depth; k >= 2; k--) {
            f = t + k / f;
        }
        double f2 = f;
        double f1 = t + 1.0 / f2;
        return new double[] {f1, f2};
    }

    /** Depth of the continued fraction that reaches full double precision (checked against mpmath). */
    private static int depth(double t) {
        if (t < 1.5) {
            return 700;
        }
        if (t < 2.0) {
            return 300;
        }
        if (t < 3.0) {
            return 150;
        }
        if (t < 5.0) {
            return 80;
        }
        return 40;
    }

    /** &Phi;(&minus;t) for t &gt; 1. */
    private static double lowerTail(double t) {
        if (t > PDF_ZERO_BEYOND) {
            return 0.0;
        }
        return INV_SQRT_2PI * expHalfSquare(t) * millsRatio(t);
    }

    /** z + z&sup3;/3 + z&#8309;/(3&middot;5) + &hellip; for |z| &le; 1. */
    private static double series(double z) {
        double z2 = z * z;
        double term = z;
        double sum = z;
        for (int k = 1; k < 60; k++) {
            term *= z2 / (2 * k + 1);
            double next = sum + term;
            if (next == sum) {
                break;
            }
            sum = next;
        }
        return sum;
    }

    /** exp(&minus;a&sup2;/2) for 0 &le; a &le; 38.7 with the split square. */
    private static double expHalfSquare(double a) {
        double h = Math.floor(a * 16.0) / 16.0;
        double lo = a - h;
        return Math.exp(-0.5 * h * h) * Math.exp(-0.5 * lo * (a + h));
    }

    private static double checkFinite(double z) {
        if (!Double.isFinite(z)) {
            throw new IllegalArgumentException("normal argument is not finite: " + z);
        }
        return z;
    }
}
