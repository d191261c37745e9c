package dev.terrace.core.search;

/**
 * Fitness of one individual: every point keeping the limits ranks above every point breaking
 * them; feasible points rank by objective value, infeasible ones by smaller total violation.
 *
 * <p>This ordering replaces a numeric penalty such as −10⁶ − violation, which could collide with
 * an objective that itself takes very negative values.
 *
 * @param feasible whether the point keeps every limit
 * @param value    the objective value when feasible, minus the total violation otherwise
 */
record Score(boolean feasible, double value) implements Comparable<Score> {

    /** Checks the value. */
    Score {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("score must be finite");
        }
    }

    /**
     * @param objective the objective value of a feasible point
     * @return its score
     */
    static Score ofObjective(double objective) {
        return new Score(true, objective);
    }

    /**
     * @param violation total violation of an infeasible point, positive
     * @return its score
     */
    static Score ofViolation(double violation) {
        return new Score(false, -violation);
    }

    @Override
    public int compareTo(Score o) {
        if (feasible != o.feasible) {
            return feasible ? 1 : -1;
        }
        return Double.compare(value, o.value);
    }
}
