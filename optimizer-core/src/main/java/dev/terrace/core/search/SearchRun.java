package dev.terrace.core.search;

import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;

/**
 * The mutable state of one search: the objective with its call counts, the archive of every
 * feasible point evaluated, and the least-violating infeasible point seen. Confined to the
 * searching thread.
 */
final class SearchRun {

    /**
     * Violation given to a point whose limits cannot be evaluated (a limit naming a setting the
     * space does not have): such a point is treated as infeasible.
     */
    static final double UNEVALUABLE_LIMIT_VIOLATION = 1.0;

    /** One evaluated feasible point. */
    record Entry(DesignPoint point, double value) {
    }

    private final DesignSpace space;
    private final BatchObjective objective;
    private final List<Entry> archive = new ArrayList<>();
    private DesignPoint leastViolating;
    private double leastViolation = Double.MAX_VALUE;
    private long evaluations;
    private int calls;

    SearchRun(DesignSpace space, BatchObjective objective) {
        this.space = space;
        this.objective = objective;
    }

    DesignSpace space() {
        return space;
    }

    /**
     * @param p a point
     * @return its total limit violation in campaign units; 0 when it keeps every limit
     */
    double violation(DesignPoint p) {
        double v = space.violation(p);
        if (v > 0) {
            return v;
        }
        return space.feasible(p) ? 0 : UNEVALUABLE_LIMIT_VIOLATION;
    }

    /**
     * Records an infeasible point, so that the least-violating one can be reported.
     *
     * @param p         the point
     * @param violation its violation, positive
     */
    void noteInfeasible(DesignPoint p, double violation) {
        if (violation < leastViolation) {
            leastViolation = violation;
            leastViolating = p;
        }
    }

    /**
     * Calls the objective once for a batch of feasible points and archives the results.
     *
     * @param points feasible points; not empty
     * @return one finite value per point
     * @throws IllegalStateException when the objective breaks its contract
     */
    double[] evaluate(List<DesignPoint> points) {
        List<DesignPoint> batch = List.copyOf(points);
        double[] y = objective.evaluate(batch);
        calls++;
        if (y == null || y.length != batch.size()) {
            throw new IllegalStateException("objective returned " + (y == null ? "null" : y.length + " values")
                    + " for " + batch.size() + " points");
        }
        y = y.clone();
        for (int i = 0; i < y.length; i++) {
            if (!Double.isFinite(y[i])) {
                throw new IllegalStateException("objective returned a non-finite value (" + y[i]
                        + ") for " + batch.get(i));
            }
            archive.add(new Entry(batch.get(i), y[i]));
        }
        evaluations += batch.size();
        return y;
    }

    long evaluations() {
        return evaluations;
    }

    int calls() {
        return calls;
    }

    /** @return the feasible point of highest value (earliest on ties), if any was evaluated */
    Optional<Entry> best() {
        Entry best = null;
        for (Entry e : archive) {
            if (best == null || e.value() > best.value()) {
                best = e;
            }
        }
        return Optional.ofNullable(best);
    }

    /** @return the least-violating infeasible point seen, if any */
    Optional<DesignPoint> leastViolating() {
        return Optional.ofNullable(leastViolating);
    }

    /** @return the violation of {@link #leastViolating()} */
    double leastViolation() {
        return leastViolation;
    }

    /**
     * Greedy selection of the best archived points that lie pairwise at least {@code minDistance}
     * apart (and are not identical) in the scaled space, starting with {@code first}.
     *
     * @param first       the entry to put first (the best)
     * @param minDistance minimum pairwise distance
     * @param count       maximum number of points
     * @return the entries, best first
     */
    List<Entry> distinct(Entry first, double minDistance, int count) {
        List<Entry> sorted = new ArrayList<>(archive);
        sorted.sort(Comparator.comparingDouble(Entry::value).reversed());
        List<Entry> picked = new ArrayList<>();
        picked.add(first);
        for (Entry e : sorted) {
            if (picked.size() >= count) {
                break;
            }
            boolean far = true;
            for (Entry q : picked) {
                double d = DesignSpace.distance(e.point(), q.point());
                if (d < minDistance || d == 0) {
                    far = false;
                    break;
                }
            }
            if (far) {
                picked.add(e);
            }
        }
        return picked;
    }
}
