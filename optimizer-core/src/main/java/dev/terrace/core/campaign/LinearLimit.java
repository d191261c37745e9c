package dev.terrace.core.campaign;

import java.util.Map;
import java.util.Objects;

/**
 * A hard constraint beyond the parameter boxes: {@code sum(coefficient * parameter) + constant >= 0},
 * with every parameter in its campaign unit.
 *
 * @param text         the limit as the grower wrote it; never null
 * @param coefficients coefficient by parameter name; copied, never null, not empty
 * @param constant     the constant term
 * @param position     where the limit is written
 * @since 0.1
 */
public record LinearLimit(String text, Map<String, Double> coefficients, double constant, SourcePosition position) {

    /** Tolerance used when checking a recipe against a limit, in the campaign units. */
    public static final double TOLERANCE = 1e-9;

    /** Checks the invariants. */
    public LinearLimit {
        Objects.requireNonNull(text, "text");
        coefficients = Map.copyOf(coefficients);
        if (coefficients.isEmpty()) {
            throw new IllegalArgumentException("limit '" + text + "' names no parameter");
        }
    }

    /**
     * @param values numeric recipe values by parameter name, campaign units
     * @return the slack, {@code sum + constant}; negative when the limit is broken
     */
    public double slack(Map<String, Double> values) {
        double s = constant;
        for (Map.Entry<String, Double> e : coefficients.entrySet()) {
            Double v = values.get(e.getKey());
            if (v == null) {
                return Double.NaN;
            }
            s += e.getValue() * v;
        }
        return s;
    }

    /**
     * @param values numeric recipe values by parameter name, campaign units
     * @return true when the recipe keeps the limit (within {@link #TOLERANCE})
     */
    public boolean holds(Map<String, Double> values) {
        double s = slack(values);
        return !Double.isNaN(s) && s >= -TOLERANCE * (1 + Math.abs(constant));
    }
}
