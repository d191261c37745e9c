package dev.terrace.core.propose;

import dev.terrace.core.search.SearchSettings;

import java.util.Objects;

/**
 * Settings of a proposal run.
 *
 * @param batch        number of recipes to propose (q), at least 1
 * @param seed         seed of every random choice
 * @param explore      exploration weight beta: the search scores each target window with the most
 *                     favourable mean within beta latent standard deviations
 *                     ({@code Acquisitions.optimisticWindowProbability}); 0 is pure exploitation of
 *                     the predicted yield
 * @param minDistance  smallest distance between two proposals of a batch in the scaled space
 *                     (unit cube, +1 per differing choice)
 * @param usePhysics   false switches the growth models off (pure GP; the ablation)
 * @param search       settings of the genetic search
 * @since 0.1
 */
public record ProposeSettings(int batch, long seed, double explore, double minDistance, boolean usePhysics,
                              SearchSettings search) {

    /** Default batch size. */
    public static final int DEFAULT_BATCH = 4;
    /** Default seed, printed with every proposal so runs can be reproduced. */
    public static final long DEFAULT_SEED = 7;
    /**
     * Default exploration weight: 1 latent standard deviation of optimism per target, a moderate
     * choice (Srinivas et al. 2010 use larger, growing weights for regret bounds; small campaigns
     * cannot afford that much exploration).
     */
    public static final double DEFAULT_EXPLORE = 1.0;
    /** Default minimum distance within a batch: 0.15 of the unit cube's edge (common practice). */
    public static final double DEFAULT_MIN_DISTANCE = 0.15;

    /** Checks the invariants. */
    public ProposeSettings {
        Objects.requireNonNull(search, "search");
        if (batch < 1 || batch > 100) {
            throw new IllegalArgumentException("batch must be 1 to 100, found " + batch);
        }
        if (!(explore >= 0) || !Double.isFinite(explore)) {
            throw new IllegalArgumentException("explore must be a finite number >= 0");
        }
        if (!(minDistance >= 0) || !Double.isFinite(minDistance)) {
            throw new IllegalArgumentException("minimum distance must be >= 0");
        }
    }

    /** @return the defaults; never null */
    public static ProposeSettings defaults() {
        return new ProposeSettings(DEFAULT_BATCH, DEFAULT_SEED, DEFAULT_EXPLORE, DEFAULT_MIN_DISTANCE, true,
                SearchSettings.builder().populationSize(40).maxGenerations(40).steadyGenerations(10)
                        .polishStarts(2).build());
    }

    /** @return a copy with another batch size */
    public ProposeSettings withBatch(int q) {
        return new ProposeSettings(q, seed, explore, minDistance, usePhysics, search);
    }

    /** @return a copy with another seed */
    public ProposeSettings withSeed(long s) {
        return new ProposeSettings(batch, s, explore, minDistance, usePhysics, search);
    }

    /** @return a copy with another exploration weight */
    public ProposeSettings withExplore(double b) {
        return new ProposeSettings(batch, seed, b, minDistance, usePhysics, search);
    }

    /** @return a copy with the physics on or off */
    public ProposeSettings withPhysics(boolean on) {
        return new ProposeSettings(batch, seed, explore, minDistance, on, search);
    }

    /** @return a copy with other search settings */
    public ProposeSettings withSearch(SearchSettings s) {
        return new ProposeSettings(batch, seed, explore, minDistance, usePhysics, s);
    }
}
