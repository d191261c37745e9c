package dev.terrace.core.search;

import dev.terrace.core.space.DesignPoint;

import java.util.List;

/**
 * A quantity to maximise over a design space, evaluated for many points in one call so that the
 * caller can batch its work (for instance one surrogate prediction over a whole population).
 *
 * @apiNote Contract: the implementation receives a non-empty list of points that all lie in the
 *          unit cube and keep every limit of the space; it must return an array of exactly the
 *          same length, entry {@code i} belonging to point {@code i}, holding only finite values.
 *          Larger is better. It must not keep or modify the list. It is called on the searching
 *          thread: once for the first population, at most once per generation and once per
 *          polish step, and a
 *          search with a given seed makes the same calls in the same order every time, so a
 *          deterministic objective gives a reproducible search. {@link GeneticSearch} rejects a
 *          result of the wrong length or with a NaN or infinite entry with an
 *          {@link IllegalStateException}.
 * @since 0.1
 */
@FunctionalInterface
public interface BatchObjective {

    /**
     * Evaluates a batch of points.
     *
     * @param points the points to evaluate; never null or empty, feasible, in the unit cube
     * @return one finite value per point, in the same order; larger is better
     */
    double[] evaluate(List<DesignPoint> points);
}
