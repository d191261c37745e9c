package dev.terrace.core.search;

import dev.terrace.core.space.DesignPoint;

import java.util.List;
import java.util.Objects;

/**
 * The outcome of one {@link GeneticSearch} run.
 *
 * <p>When {@code feasibleFound} is true, {@code best} keeps every limit of the space, {@code value}
 * is its objective value and {@code topDistinct} starts with {@code best}. When no point keeping
 * the limits was found, {@code best} is the point with the smallest total limit violation (so the
 * grower can see how far the limits are from being met), {@code value} is minus that violation in
 * campaign units (the objective is never called on such points) and {@code topDistinct} is empty.
 *
 * @param best          the best point found (see above); never null
 * @param value         objective value of {@code best}, or minus its violation; finite
 * @param topDistinct   best feasible points found, best first, pairwise at least the minimum
 *                      distance apart in the scaled space; copied, never null
 * @param evaluations   number of points passed to the objective
 * @param generations   number of generations the genetic search ran
 * @param seed          the seed the search was run with
 * @param feasibleFound whether any point keeping every limit was found
 * @since 0.1
 */
public record SearchResult(DesignPoint best, double value, List<DesignPoint> topDistinct, long evaluations,
                           int generations, long seed, boolean feasibleFound) {

    /** Checks the invariants and copies the list. */
    public SearchResult {
        Objects.requireNonNull(best, "best");
        topDistinct = List.copyOf(topDistinct);
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("value must be finite");
        }
        if (evaluations < 0 || generations < 0) {
            throw new IllegalArgumentException("counts must not be negative");
        }
        if (feasibleFound && (topDistinct.isEmpty() || !topDistinct.get(0).equals(best))) {
            throw new IllegalArgumentException("topDistinct must start with best");
        }
        if (!feasibleFound && !topDistinct.isEmpty()) {
            throw new IllegalArgumentException("no feasible point, so no distinct points");
        }
    }
}
