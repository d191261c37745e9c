package dev.terrace.core.surrogate;

import smile.math.BFGS;
import smile.math.DifferentiableMultivariateFunction;

import java.util.SplittableRandom;

/**
 * Type-II maximum likelihood for the {@link GpKernel} hyperparameters and the noise variance:
 * several seeded starts of Smile's limited-memory BFGS on the log marginal likelihood
 * ({@link GpLikelihood}), keeping the best point seen.
 *
 * <p>The parameters θ (log variances, log length scales, logit ρ) are kept inside their bounds by
 * a smooth box transform θ = lo + (hi − lo)·sigmoid(u), and the optimiser works on u without
 * bounds. Smile 3.1.1's bounded mode ({@code BFGS.minimize} with lower and upper bounds) was not
 * used: on a two-variable quadratic with one active bound it returned a point with 2.6 times the
 * constrained minimum, and the noise bound is often active here.
 */
final class GpHyperparameterSearch {

    /** Convergence tolerance on the gradient handed to Smile's L-BFGS. */
    private static final double GRADIENT_TOLERANCE = 1e-5;
    /** Number of correction pairs kept by L-BFGS (common practice: 3 to 7). */
    private static final int LBFGS_MEMORY = 5;
    /** Random starts draw ln ℓ uniformly between these length scales (unit-cube units). */
    private static final double START_LENGTH_MIN = 0.05;
    private static final double START_LENGTH_MAX = 2.0;
    /** Random starts draw ln σf² uniformly between these (standardised units). */
    private static final double START_SIGNAL_MIN = 0.3;
    private static final double START_SIGNAL_MAX = 3.0;
    /** Random starts draw ln σn² uniformly between max(floor, this) and {@link #START_NOISE_MAX}. */
    private static final double START_NOISE_MIN = 1e-5;
    private static final double START_NOISE_MAX = 0.3;
    /** Random starts draw ρ uniformly between these. */
    private static final double START_RHO_MIN = 0.1;
    private static final double START_RHO_MAX = 0.9;
    /** Objective value returned when an evaluation fails (it cannot be the best point). */
    private static final double FAILED = 1e300;

    private GpHyperparameterSearch() {
    }

    /** Result of a search: best parameters, their log likelihood and the evaluation count. */
    record Result(double[] theta, double logLikelihood, int evaluations) {
    }

    /**
     * @param lik      the objective
     * @param d        continuous dimensions
     * @param c        categorical settings
     * @param settings bounds and effort
     * @param starts   number of starts (the first is {@code first} when given, else the defaults)
     * @param maxIter  L-BFGS iterations per start
     * @param first    first start θ, or null for the default hyperparameters
     * @param rng      seeded source of the random starts
     * @return the best point seen; never null
     */
    static Result search(GpLikelihood lik, int d, int c, GpSettings settings, int starts, int maxIter,
            double[] first, SplittableRandom rng) {
        double[] lo = lower(d, c, settings);
        double[] hi = upper(d, c, settings);
        Objective obj = new Objective(lik, lo, hi);
        for (int s = 0; s < starts; s++) {
            double[] theta = s == 0 ? (first != null ? first.clone() : defaultStart(d, c, settings))
                    : randomStart(d, c, settings, rng);
            double[] u = obj.toFree(theta);
            obj.f(u);
            try {
                BFGS.minimize(obj, LBFGS_MEMORY, u, GRADIENT_TOLERANCE, maxIter);
            } catch (RuntimeException e) {
                // a failed line search ends this start; the best point seen so far is kept
            }
        }
        double[] best = obj.best == null ? defaultStart(d, c, settings) : obj.best;
        return new Result(best, obj.best == null ? Double.NEGATIVE_INFINITY : obj.bestValue,
                lik.evaluations());
    }

    static double[] lower(int d, int c, GpSettings s) {
        return box(d, c, Math.log(GpSettings.SIGNAL_VARIANCE_MIN), Math.log(s.lengthScaleMin()),
                GpKernel.logit(GpSettings.RHO_MIN), Math.log(s.noiseFloor()));
    }

    static double[] upper(int d, int c, GpSettings s) {
        return box(d, c, Math.log(GpSettings.SIGNAL_VARIANCE_MAX), Math.log(s.lengthScaleMax()),
                GpKernel.logit(GpSettings.RHO_MAX), Math.log(GpSettings.NOISE_VARIANCE_MAX));
    }

    private static double[] box(int d, int c, double s, double l, double r, double noise) {
        double[] b = new double[d + c + 2];
        b[0] = s;
        for (int k = 0; k < d; k++) {
            b[1 + k] = l;
        }
        for (int j = 0; j < c; j++) {
            b[1 + d + j] = r;
        }
        b[1 + d + c] = noise;
        return b;
    }

    /**
     * @param h hyperparameters
     * @return θ for them
     */
    static double[] theta(GpHyperparameters h) {
        int d = h.dimensions();
        int c = h.categoricalCount();
        double[] t = new double[d + c + 2];
        t[0] = Math.log(h.signalVariance());
        for (int k = 0; k < d; k++) {
            t[1 + k] = Math.log(h.lengthScale(k));
        }
        for (int j = 0; j < c; j++) {
            double r = Math.max(GpSettings.RHO_MIN, Math.min(GpSettings.RHO_MAX, h.rho(j)));
            t[1 + d + j] = GpKernel.logit(r);
        }
        t[1 + d + c] = Math.log(Math.max(h.noiseVariance(), Double.MIN_NORMAL));
        return t;
    }

    /**
     * @param theta θ
     * @param d     continuous dimensions
     * @param c     categorical settings
     * @return the hyperparameters for θ
     */
    static GpHyperparameters hyperparameters(double[] theta, int d, int c) {
        double[] l = new double[d];
        for (int k = 0; k < d; k++) {
            l[k] = Math.exp(theta[1 + k]);
        }
        double[] r = new double[c];
        for (int j = 0; j < c; j++) {
            r[j] = Math.min(GpSettings.RHO_MAX, 1 / (1 + Math.exp(-theta[1 + d + j])));
        }
        return new GpHyperparameters(Math.exp(theta[0]), l, r, Math.exp(theta[1 + d + c]));
    }

    private static double[] defaultStart(int d, int c, GpSettings s) {
        return theta(GpHyperparameters.defaults(d, c, s.noiseFloor()));
    }

    private static double[] randomStart(int d, int c, GpSettings s, SplittableRandom rng) {
        double[] t = new double[d + c + 2];
        t[0] = uniform(rng, Math.log(START_SIGNAL_MIN), Math.log(START_SIGNAL_MAX));
        double lMin = Math.log(Math.max(START_LENGTH_MIN, s.lengthScaleMin()));
        double lMax = Math.log(Math.min(START_LENGTH_MAX, s.lengthScaleMax()));
        for (int k = 0; k < d; k++) {
            t[1 + k] = uniform(rng, lMin, Math.max(lMin, lMax));
        }
        for (int j = 0; j < c; j++) {
            t[1 + d + j] = GpKernel.logit(uniform(rng, START_RHO_MIN, START_RHO_MAX));
        }
        double nMin = Math.log(Math.max(START_NOISE_MIN, s.noiseFloor()));
        t[1 + d + c] = uniform(rng, nMin, Math.max(nMin, Math.log(START_NOISE_MAX)));
        return t;
    }

    private static double uniform(SplittableRandom rng, double a, double b) {
        return a + (b - a) * rng.nextDouble();
    }

    /** −log p in the free coordinates u, remembering the best θ seen. */
    private static final class Objective implements DifferentiableMultivariateFunction {
        private static final long serialVersionUID = 1L;
        private final transient GpLikelihood lik;
        private final double[] lo;
        private final double[] hi;
        private double[] best;
        private double bestValue = Double.NEGATIVE_INFINITY;

        Objective(GpLikelihood lik, double[] lo, double[] hi) {
            this.lik = lik;
            this.lo = lo;
            this.hi = hi;
        }

        /** θ → u, inside the box by a small margin so that u stays finite. */
        double[] toFree(double[] theta) {
            double[] u = new double[theta.length];
            for (int i = 0; i < u.length; i++) {
                double w = hi[i] - lo[i];
                double t = (theta[i] - lo[i]) / w;
                t = Math.max(1e-6, Math.min(1 - 1e-6, t));
                u[i] = Math.log(t / (1 - t));
            }
            return u;
        }

        private double[] toTheta(double[] u, double[] dThetaDu) {
            double[] theta = new double[u.length];
            for (int i = 0; i < u.length; i++) {
                double sig = 1 / (1 + Math.exp(-u[i]));
                double w = hi[i] - lo[i];
                theta[i] = lo[i] + w * sig;
                if (dThetaDu != null) {
                    dThetaDu[i] = w * sig * (1 - sig);
                }
            }
            return theta;
        }

        @Override
        public double f(double[] u) {
            return g(u, null);
        }

        @Override
        public double g(double[] u, double[] gradient) {
            double[] dt = new double[u.length];
            double[] theta = toTheta(u, dt);
            double[] gt = gradient == null ? null : new double[u.length];
            double v;
            try {
                v = lik.value(theta, gt);
            } catch (RuntimeException e) {
                v = Double.NaN;
            }
            if (!Double.isFinite(v) || (gt != null && !allFinite(gt))) {
                if (gradient != null) {
                    java.util.Arrays.fill(gradient, 0);
                }
                return FAILED;
            }
            if (v > bestValue) {
                bestValue = v;
                best = theta;
            }
            if (gradient != null) {
                for (int i = 0; i < u.length; i++) {
                    gradient[i] = -gt[i] * dt[i];
                }
            }
            return -v;
        }

        private static boolean allFinite(double[] a) {
            for (double x : a) {
                if (!Double.isFinite(x)) {
                    return false;
                }
            }
            return true;
        }
    }
}
