package dev.terrace.spi;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * Values for a model's parameters, by parameter name.
 *
 * @param values the values; copied, never null
 * @since 0.1
 */
public record ParameterValues(Map<String, Double> values) {

    /** Copies and checks the map. */
    public ParameterValues {
        Objects.requireNonNull(values, "values");
        values.forEach((k, v) -> {
            if (v == null || !Double.isFinite(v)) {
                throw new IllegalArgumentException("parameter " + k + " is not a finite number: " + v);
            }
        });
        // declaration order (the order given), the same in every JVM
        values = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(values));
    }

    /**
     * The defaults of the given parameters.
     *
     * @param parameters the model's parameter list
     * @return their default values; never null
     */
    public static ParameterValues defaults(List<ModelParameter> parameters) {
        Map<String, Double> m = new LinkedHashMap<>();
        parameters.forEach(p -> m.put(p.name(), p.defaultValue()));
        return new ParameterValues(m);
    }

    /**
     * @param name a parameter name
     * @return its value
     * @throws IllegalArgumentException when no value is set for that name
     */
    public double get(String name) {
        Double v = values.get(name);
        if (v == null) {
            throw new IllegalArgumentException("no value for model parameter '" + name + "'");
        }
        return v;
    }

    /**
     * @return a copy with one value replaced or added; never null
     */
    public ParameterValues with(String name, double value) {
        Map<String, Double> m = new LinkedHashMap<>(values);
        m.put(name, value);
        return new ParameterValues(m);
    }
}
