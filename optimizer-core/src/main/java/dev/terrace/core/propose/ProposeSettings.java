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
 *                     ({@code Acquisitions.optimisticWindowProbability}); 0 is pure exploitation:
 *                     every pick maximises the predicted yield, also with a maximize/minimize
 *                     target (whose trade is then only reported)
 * @param minDistance  distance over the scaled numeric settings within which the search penalises a
 *                     candidate near an earlier pick of the batch (never below
 *                     {@link Proposer#MIN_BATCH_SEPARATION}, which is enforced)
 * @param usePhysics   false switches the growth models off (pure GP; the ablation)
 * @param search       settings of the genetic search
 * @param withinRuns   margin m around the ok runs as a fraction of each setting's logged span: the
 *                     search box is the campaign box intersected with
 *                     [runs_min − m·span, runs_max + m·span] on each setting's scaled axis (log10
 *                     for log settings); {@link Double#POSITIVE_INFINITY} searches the whole box
 * @since 0.1
 */
public record ProposeSettings(int batch, long seed, double explore, double minDistance, boolean usePhysics,
                              SearchSettings search, double withinRuns) {

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

    /** Largest finite margin around the runs; beyond it the margin box is practically the campaign box. */
    public static final double MAX_WITHIN_RUNS = 10;

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
        if (!(withinRuns >= 0 && withinRuns <= MAX_WITHIN_RUNS) && withinRuns != Double.POSITIVE_INFINITY) {
            throw new IllegalArgumentException("the margin around the runs must be 0 to " + MAX_WITHIN_RUNS
                    + " (or infinite for the whole box), found " + withinRuns);
        }
    }

    /** @return the defaults; never null */
    public static ProposeSettings defaults() {
        return new ProposeSettings(DEFAULT_BATCH, DEFAULT_SEED, DEFAULT_EXPLORE, DEFAULT_MIN_DISTANCE, true,
                SearchSettings.builder().populationSize(40).maxGenerations(40).steadyGenerations(10)
                        .polishStarts(2).build(), Double.POSITIVE_INFINITY);
    }

    /** @return a copy with another batch size */
    public ProposeSettings withBatch(int q) {
        return new ProposeSettings(q, seed, explore, minDistance, usePhysics, search, withinRuns);
    }

    /** @return a copy with another seed */
    public ProposeSettings withSeed(long s) {
        return new ProposeSettings(batch, s, explore, minDistance, usePhysics, search, withinRuns);
    }

    /** @return a copy with another exploration weight */
    public ProposeSettings withExplore(double b) {
        return new ProposeSettings(batch, seed, b, minDistance, usePhysics, search, withinRuns);
    }

    /** @return a copy with the physics on or off */
    public ProposeSettings withPhysics(boolean on) {
        return new ProposeSettings(batch, seed, explore, minDistance, on, search, withinRuns);
    }

    /** @return a copy with another margin around the runs (infinite for the whole box) */
    public ProposeSettings withWithinRuns(double m) {
        return new ProposeSettings(batch, seed, explore, minDistance, usePhysics, search, m);
    }

    /** @return a copy with other search settings */
    public ProposeSettings withSearch(SearchSettings s) {
        return new ProposeSettings(batch, seed, explore, minDistance, usePhysics, s, withinRuns);
    }
}
