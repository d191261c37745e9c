package dev.terrace.demo;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;

/**
 * One planned growth run: numeric and categorical settings in the campaign's units, with a note
 * a grower would write beside it.
 *
 * @param numbers    numeric settings by column name, campaign units; finite; insertion order kept
 * @param categories categorical settings by column name; insertion order kept
 * @param note       the planner's note, for example "t_drop series"; never null, possibly empty
 * @since 0.1
 */
public record Recipe(Map<String, Double> numbers, Map<String, String> categories, String note) {

    /** Copies and checks the contents. */
    public Recipe {
        Objects.requireNonNull(note, "note");
        numbers = Collections.unmodifiableMap(new LinkedHashMap<>(numbers));
        categories = Collections.unmodifiableMap(new LinkedHashMap<>(categories));
        for (Map.Entry<String, Double> e : numbers.entrySet()) {
            if (e.getValue() == null || !Double.isFinite(e.getValue())) {
                throw new IllegalArgumentException("setting " + e.getKey() + " is not finite");
            }
        }
        for (Map.Entry<String, String> e : categories.entrySet()) {
            Objects.requireNonNull(e.getValue(), e.getKey());
        }
    }
}
