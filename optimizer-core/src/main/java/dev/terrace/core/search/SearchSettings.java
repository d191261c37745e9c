package dev.terrace.core.search;

/**
 * Tuning of a {@link GeneticSearch}. Start from {@link #defaults()} or {@link #builder()}.
 *
 * <p>Distances and step sizes are in the unit cube of the design space (each numeric setting
 * spans 0 to 1, on log10 for log settings).
 *
 * @param populationSize           individuals per generation, at least 4
 * @param maxGenerations           generation cap, at least 1
 * @param steadyGenerations        stop after this many generations without a better best, at least 1
 * @param mutationProbability      chance that a continuous gene of an offspring is perturbed, in [0, 1]
 * @param mutationSigma            standard deviation of that perturbation, in (0, 1]
 * @param levelMutationProbability chance that a categorical gene of an offspring is reset to another
 *                                 level, in [0, 1]
 * @param crossoverProbability     chance that an offspring is recombined with a mate, in [0, 1]
 * @param perturbationSigma        standard deviation of the Gaussian copies of the starting points
 *                                 placed in the first population, in (0, 1]
 * @param polish                   whether the best point is refined by a local compass search
 * @param polishStarts             how many well-separated good points are polished, at least 1
 * @param polishMaxIterations      cap on compass-search steps per start (one batched objective call each), ≥ 0
 * @param polishInitialStep        first compass-search step, in (0, 0.5]
 * @param minDistance              minimum scaled distance between the distinct points reported, ≥ 0
 * @param distinctCount            how many distinct points to report at most, at least 1
 * @since 0.1
 */
public record SearchSettings(int populationSize, int maxGenerations, int steadyGenerations,
                             double mutationProbability, double mutationSigma, double levelMutationProbability,
                             double crossoverProbability, double perturbationSigma, boolean polish,
                             int polishStarts, int polishMaxIterations, double polishInitialStep, double minDistance,
                             int distinctCount) {

    /** Default population size [common practice for 2–10 continuous dimensions; checked on Branin and Hartmann-6 by the tests]. */
    public static final int DEFAULT_POPULATION_SIZE = 60;

    /** Default generation cap [common practice; with the steady rule most runs stop earlier]. */
    public static final int DEFAULT_MAX_GENERATIONS = 60;

    /** Default steady-fitness window in generations [common practice]. */
    public static final int DEFAULT_STEADY_GENERATIONS = 12;

    /** Default per-gene mutation probability; Jenetics' default alter probability is also 0.2 (Alterer.DEFAULT_ALTER_PROBABILITY). */
    public static final double DEFAULT_MUTATION_PROBABILITY = 0.2;

    /** Default mutation standard deviation, a tenth of each setting's range [common practice]. */
    public static final double DEFAULT_MUTATION_SIGMA = 0.1;

    /** Default per-gene probability of a level change for categorical settings [common practice]. */
    public static final double DEFAULT_LEVEL_MUTATION_PROBABILITY = 0.1;

    /** Default crossover probability [common practice; 0.6–0.9 is the usual range]. */
    public static final double DEFAULT_CROSSOVER_PROBABILITY = 0.6;

    /** Default spread of the perturbed copies of starting points [common practice: local exploration around incumbents]. */
    public static final double DEFAULT_PERTURBATION_SIGMA = 0.05;

    /** Polish is on by default: a local search after a genetic search is standard practice for multimodal acquisition functions. */
    public static final boolean DEFAULT_POLISH = true;

    /**
     * Default number of polish starts: the best point and up to three good points at least
     * {@link GeneticSearch#POLISH_START_SEPARATION} from it and each other [common practice:
     * multi-start local search. On Hartmann-6 with the other defaults, a single start ended in
     * the second-best basin (−3.2032) for 13 of 30 seeds, four starts for 1 of 60].
     */
    public static final int DEFAULT_POLISH_STARTS = 4;

    /** Default cap on compass-search steps [common practice; enough to shrink the step from 0.05 to 1e-6 several times over]. */
    public static final int DEFAULT_POLISH_MAX_ITERATIONS = 100;

    /** Default first compass-search step [common practice: half the mutation spread]. */
    public static final double DEFAULT_POLISH_INITIAL_STEP = 0.05;

    /** Default minimum scaled distance between reported distinct points [common practice for batch diversity]. */
    public static final double DEFAULT_MIN_DISTANCE = 0.05;

    /** Default number of distinct points reported [common practice; covers typical batch sizes of 1–8 growth runs]. */
    public static final int DEFAULT_DISTINCT_COUNT = 10;

    /** Checks the ranges. */
    public SearchSettings {
        if (populationSize < 4) {
            throw new IllegalArgumentException("populationSize must be at least 4");
        }
        if (maxGenerations < 1 || steadyGenerations < 1) {
            throw new IllegalArgumentException("maxGenerations and steadyGenerations must be at least 1");
        }
        requireIn(mutationProbability, 0, 1, "mutationProbability");
        requireIn(levelMutationProbability, 0, 1, "levelMutationProbability");
        requireIn(crossoverProbability, 0, 1, "crossoverProbability");
        requirePositiveAtMost(mutationSigma, 1, "mutationSigma");
        requirePositiveAtMost(perturbationSigma, 1, "perturbationSigma");
        requirePositiveAtMost(polishInitialStep, 0.5, "polishInitialStep");
        if (polishStarts < 1) {
            throw new IllegalArgumentException("polishStarts must be at least 1");
        }
        if (polishMaxIterations < 0) {
            throw new IllegalArgumentException("polishMaxIterations must not be negative");
        }
        if (!(minDistance >= 0) || !Double.isFinite(minDistance)) {
            throw new IllegalArgumentException("minDistance must be finite and not negative");
        }
        if (distinctCount < 1) {
            throw new IllegalArgumentException("distinctCount must be at least 1");
        }
    }

    /** @return the default settings; never null */
    public static SearchSettings defaults() {
        return builder().build();
    }

    /** @return a builder holding the defaults; never null */
    public static Builder builder() {
        return new Builder();
    }

    /** @return a builder holding these settings; never null */
    public Builder toBuilder() {
        Builder b = new Builder();
        b.populationSize = populationSize;
        b.maxGenerations = maxGenerations;
        b.steadyGenerations = steadyGenerations;
        b.mutationProbability = mutationProbability;
        b.mutationSigma = mutationSigma;
        b.levelMutationProbability = levelMutationProbability;
        b.crossoverProbability = crossoverProbability;
        b.perturbationSigma = perturbationSigma;
        b.polish = polish;
        b.polishStarts = polishStarts;
        b.polishMaxIterations = polishMaxIterations;
        b.polishInitialStep = polishInitialStep;
        b.minDistance = minDistance;
        b.distinctCount = distinctCount;
        return b;
    }

    private static void requireIn(double v, double lo, double hi, String name) {
        if (!(v >= lo && v <= hi)) {
            throw new IllegalArgumentException(name + " must lie in [" + lo + ", " + hi + "]");
        }
    }

    private static void requirePositiveAtMost(double v, double hi, String name) {
        if (!(v > 0 && v <= hi)) {
            throw new IllegalArgumentException(name + " must lie in (0, " + hi + "]");
        }
    }

    /** A mutable builder for {@link SearchSettings}; starts from the defaults. */
    public static final class Builder {
        private int populationSize = DEFAULT_POPULATION_SIZE;
        private int maxGenerations = DEFAULT_MAX_GENERATIONS;
        private int steadyGenerations = DEFAULT_STEADY_GENERATIONS;
        private double mutationProbability = DEFAULT_MUTATION_PROBABILITY;
        private double mutationSigma = DEFAULT_MUTATION_SIGMA;
        private double levelMutationProbability = DEFAULT_LEVEL_MUTATION_PROBABILITY;
        private double crossoverProbability = DEFAULT_CROSSOVER_PROBABILITY;
        private double perturbationSigma = DEFAULT_PERTURBATION_SIGMA;
        private boolean polish = DEFAULT_POLISH;
        private int polishStarts = DEFAULT_POLISH_STARTS;
        private int polishMaxIterations = DEFAULT_POLISH_MAX_ITERATIONS;
        private double polishInitialStep = DEFAULT_POLISH_INITIAL_STEP;
        private double minDistance = DEFAULT_MIN_DISTANCE;
        private int distinctCount = DEFAULT_DISTINCT_COUNT;

        private Builder() {
        }

        /**
         * @param n individuals per generation, at least 4
         * @return this builder
         */
        public Builder populationSize(int n) {
            populationSize = n;
            return this;
        }

        /**
         * @param n generation cap, at least 1
         * @return this builder
         */
        public Builder maxGenerations(int n) {
            maxGenerations = n;
            return this;
        }

        /**
         * @param n steady-fitness window in generations, at least 1
         * @return this builder
         */
        public Builder steadyGenerations(int n) {
            steadyGenerations = n;
            return this;
        }

        /**
         * @param p per-gene mutation probability of continuous genes, in [0, 1]
         * @return this builder
         */
        public Builder mutationProbability(double p) {
            mutationProbability = p;
            return this;
        }

        /**
         * @param sigma mutation standard deviation in the unit cube, in (0, 1]
         * @return this builder
         */
        public Builder mutationSigma(double sigma) {
            mutationSigma = sigma;
            return this;
        }

        /**
         * @param p per-gene probability of a level change, in [0, 1]
         * @return this builder
         */
        public Builder levelMutationProbability(double p) {
            levelMutationProbability = p;
            return this;
        }

        /**
         * @param p crossover probability, in [0, 1]
         * @return this builder
         */
        public Builder crossoverProbability(double p) {
            crossoverProbability = p;
            return this;
        }

        /**
         * @param sigma spread of the perturbed copies of the starting points, in (0, 1]
         * @return this builder
         */
        public Builder perturbationSigma(double sigma) {
            perturbationSigma = sigma;
            return this;
        }

        /**
         * @param on whether to polish the best point by a compass search
         * @return this builder
         */
        public Builder polish(boolean on) {
            polish = on;
            return this;
        }

        /**
         * @param n how many well-separated good points are polished, at least 1
         * @return this builder
         */
        public Builder polishStarts(int n) {
            polishStarts = n;
            return this;
        }

        /**
         * @param n cap on compass-search steps per start, not negative
         * @return this builder
         */
        public Builder polishMaxIterations(int n) {
            polishMaxIterations = n;
            return this;
        }

        /**
         * @param step first compass-search step in the unit cube, in (0, 0.5]
         * @return this builder
         */
        public Builder polishInitialStep(double step) {
            polishInitialStep = step;
            return this;
        }

        /**
         * @param d minimum scaled distance between reported distinct points, not negative
         * @return this builder
         */
        public Builder minDistance(double d) {
            minDistance = d;
            return this;
        }

        /**
         * @param n how many distinct points to report at most, at least 1
         * @return this builder
         */
        public Builder distinctCount(int n) {
            distinctCount = n;
            return this;
        }

        /**
         * @return the settings
         * @throws IllegalArgumentException when a value is out of range
         */
        public SearchSettings build() {
            return new SearchSettings(populationSize, maxGenerations, steadyGenerations, mutationProbability,
                    mutationSigma, levelMutationProbability, crossoverProbability, perturbationSigma, polish,
                    polishStarts, polishMaxIterations, polishInitialStep, minDistance, distinctCount);
        }
    }
}
