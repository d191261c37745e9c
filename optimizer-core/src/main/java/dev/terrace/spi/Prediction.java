package dev.terrace.spi;

import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * What a growth model predicts for one recipe.
 *
 * @param values        numeric outcomes by role, in canonical units; copied, never null
 * @param probabilities class probabilities by class-valued role (each map sums to 1); copied, never null
 * @param validity      whether the model applies to this recipe; never null
 * @param notes         plain-words remarks for the grower (for example a transition temperature); never null
 * @since 0.1
 */
public record Prediction(Map<Role, Double> values, Map<Role, Map<String, Double>> probabilities,
                         Validity validity, List<String> notes) {

    /** Tolerance on the sum of class probabilities. */
    public static final double PROBABILITY_SUM_TOLERANCE = 1e-6;

    /** Copies and checks the contents. */
    public Prediction {
        Objects.requireNonNull(validity, "validity");
        values.forEach((r, v) -> {
            if (v == null || !Double.isFinite(v)) {
                throw new IllegalArgumentException("prediction for " + r.key() + " is not finite: " + v);
            }
        });
        Map<Role, Map<String, Double>> p = new EnumMap<>(Role.class);
        probabilities.forEach((r, m) -> {
            double sum = 0;
            for (Map.Entry<String, Double> e : m.entrySet()) {
                double v = e.getValue();
                if (!(v >= 0 && v <= 1)) {
                    throw new IllegalArgumentException("probability of " + e.getKey() + " is " + v);
                }
                sum += v;
            }
            if (Math.abs(sum - 1) > PROBABILITY_SUM_TOLERANCE) {
                throw new IllegalArgumentException("class probabilities for " + r.key() + " sum to " + sum);
            }
            p.put(r, java.util.Collections.unmodifiableMap(new LinkedHashMap<>(m)));
        });
        // role order (EnumMap): the same iteration order in every JVM, and array-indexed lookups
        values = values.isEmpty() ? Map.of() : java.util.Collections.unmodifiableMap(new EnumMap<>(values));
        probabilities = p.isEmpty() ? Map.of() : java.util.Collections.unmodifiableMap(p);
        notes = List.copyOf(notes);
    }

    /**
     * @param role a numeric outcome role
     * @return the predicted value, if the model predicts it
     */
    public OptionalDouble value(Role role) {
        Double v = values.get(role);
        return v == null ? OptionalDouble.empty() : OptionalDouble.of(v);
    }

    /**
     * @param role a class outcome role
     * @return the class probabilities, empty when not predicted; never null
     */
    public Map<String, Double> classProbabilities(Role role) {
        return probabilities.getOrDefault(role, Map.of());
    }

    /**
     * A prediction for a recipe the model cannot apply to whatever its parameter values (see
     * {@link Validity#notApplicable(String)}), with no values. For a reason that depends on the
     * parameters, return the values with {@link Validity#outside(String)} instead.
     *
     * @param reason why the model does not apply
     * @return the prediction; never null
     */
    public static Prediction notApplicable(String reason) {
        return new Prediction(Map.of(), Map.of(), Validity.notApplicable(reason), List.of());
    }
}
