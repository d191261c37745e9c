package dev.terrace.core.surrogate;

/**
 * Settings of a {@link GaussianProcess} fit: how hard to search the hyperparameters and which
 * bounds to keep them in. Variances are in units of the standardised residuals (unit sample
 * variance); length scales are in unit-cube units of the design space.
 *
 * <p>Rule for large data sets: when there are more than {@link #hpoSubsetSize()} runs, the
 * hyperparameters are searched on a seeded random subset of that size with at most
 * {@link #largeDataStarts()} starts, then polished on all runs for at most
 * {@link #polishIterations()} iterations from the best subset optimum, and the final model is
 * built on all runs.
 *
 * @param hpoStarts        number of seeded starts of the likelihood maximisation, at least 1
 * @param maxIterations    L-BFGS iteration cap per start, at least 1
 * @param noiseFloor       smallest noise variance, as a fraction of the standardised variance;
 *                         in (0, 1)
 * @param lengthScaleMin   smallest length scale (unit-cube units), positive
 * @param lengthScaleMax   largest length scale (unit-cube units), above {@code lengthScaleMin}
 * @param hpoSubsetSize    largest number of runs the search works on directly, at least 2
 * @param largeDataStarts  starts used when the data are subsampled, at least 1
 * @param polishIterations iterations of the polish on all runs after a subset search, at least 0
 * @since 0.1
 */
public record GpSettings(int hpoStarts, int maxIterations, double noiseFloor, double lengthScaleMin,
        double lengthScaleMax, int hpoSubsetSize, int largeDataStarts, int polishIterations) {

    /**
     * Default number of likelihood starts. The log marginal likelihood of a GP is multimodal
     * (Rasmussen &amp; Williams 2006, <i>Gaussian Processes for Machine Learning</i>, sec. 5.4.1);
     * a handful of random restarts is common practice.
     */
    public static final int DEFAULT_HPO_STARTS = 8;

    /** Default L-BFGS iteration cap per start; 50 to 100 suffice for these 5 to 15 parameters (measured). */
    public static final int DEFAULT_MAX_ITERATIONS = 100;

    /**
     * Default noise floor: 1e-6 of the standardised variance, a noise standard deviation of 0.1 %
     * of the outcome's spread. That is well below the repeatability of any growth measurement, so it
     * never hides real noise, while it bounds the condition number of K + σn²I by about
     * n·(σf² + σn²)/σn² ≤ 1e11 for n = 1000 and σf² ≤ 100, which a double-precision Cholesky
     * factorises safely. A floor of this size is common practice for standardised GP data.
     */
    public static final double DEFAULT_NOISE_FLOOR = 1e-6;

    /** Default smallest length scale: 1 % of a setting's range (the brief's bound; common practice). */
    public static final double DEFAULT_LENGTH_SCALE_MIN = 0.01;

    /** Default largest length scale: 10 ranges, beyond which a setting has no measurable effect. */
    public static final double DEFAULT_LENGTH_SCALE_MAX = 10.0;

    /**
     * Default largest search set. One likelihood evaluation with gradient costs O(n³); at 400 runs
     * it takes about 7 ms with native BLAS on 2 cores (measured), so a full search stays within
     * seconds.
     */
    public static final int DEFAULT_HPO_SUBSET_SIZE = 400;

    /** Default number of starts when the search runs on a subset. */
    public static final int DEFAULT_LARGE_DATA_STARTS = 4;

    /** Default polish iterations on all runs after a subset search. */
    public static final int DEFAULT_POLISH_ITERATIONS = 15;

    /** Smallest signal variance (standardised units): three decades below the data's variance. */
    public static final double SIGNAL_VARIANCE_MIN = 1e-3;

    /** Largest signal variance (standardised units): two decades above the data's variance. */
    public static final double SIGNAL_VARIANCE_MAX = 1e2;

    /** Largest noise variance (standardised units): the residuals have unit sample variance. */
    public static final double NOISE_VARIANCE_MAX = 1.0;

    /** Smallest categorical correlation ρ (effectively independent levels). */
    public static final double RHO_MIN = 1e-3;

    /** Largest categorical correlation ρ (effectively identical levels); ρ stays below 1. */
    public static final double RHO_MAX = 0.999;

    /** Signal variance used when the data cannot support a search (one run, or no spread). */
    public static final double DEFAULT_SIGNAL_VARIANCE = 1.0;

    /** Length scale used when the data cannot support a search, and at the first start. */
    public static final double DEFAULT_LENGTH_SCALE = 0.5;

    /** Categorical correlation used when the data cannot support a search, and at the first start. */
    public static final double DEFAULT_RHO = 0.5;

    /** Noise variance used when the data cannot support a search (noise sd of 10 % of the spread). */
    public static final double DEFAULT_NOISE_VARIANCE = 0.01;

    /** Checks the settings. */
    public GpSettings {
        if (hpoStarts < 1 || maxIterations < 1 || largeDataStarts < 1 || polishIterations < 0) {
            throw new IllegalArgumentException("starts and iterations must be positive");
        }
        if (!(noiseFloor > 0 && noiseFloor < 1)) {
            throw new IllegalArgumentException("noise floor must lie in (0, 1): " + noiseFloor);
        }
        if (!(lengthScaleMin > 0 && lengthScaleMax > lengthScaleMin && Double.isFinite(lengthScaleMax))) {
            throw new IllegalArgumentException("length-scale bounds must satisfy 0 < min < max");
        }
        if (hpoSubsetSize < 2) {
            throw new IllegalArgumentException("HPO subset size must be at least 2: " + hpoSubsetSize);
        }
    }

    /** @return the default settings; never null */
    public static GpSettings defaults() {
        return new GpSettings(DEFAULT_HPO_STARTS, DEFAULT_MAX_ITERATIONS, DEFAULT_NOISE_FLOOR,
                DEFAULT_LENGTH_SCALE_MIN, DEFAULT_LENGTH_SCALE_MAX, DEFAULT_HPO_SUBSET_SIZE,
                DEFAULT_LARGE_DATA_STARTS, DEFAULT_POLISH_ITERATIONS);
    }

    /**
     * @param starts number of starts, at least 1
     * @return these settings with another number of starts
     */
    /**
     * @param floor smallest noise variance as a fraction of the standardised variance, in (0, 1)
     * @return a copy with another noise floor
     */
    public GpSettings withNoiseFloor(double floor) {
        return new GpSettings(hpoStarts, maxIterations, floor, lengthScaleMin, lengthScaleMax,
                hpoSubsetSize, largeDataStarts, polishIterations);
    }

    public GpSettings withHpoStarts(int starts) {
        return new GpSettings(starts, maxIterations, noiseFloor, lengthScaleMin, lengthScaleMax,
                hpoSubsetSize, largeDataStarts, polishIterations);
    }
}
