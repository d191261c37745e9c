package dev.terrace.spi;

import java.util.EnumMap;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * One recipe as a growth model sees it: values by {@link Role}, in the canonical unit of
 * each role's {@link Quantity}.
 *
 * <p>A campaign need not declare every role; a model asks with {@link #value(Role)} and
 * decides what to do when a role is absent.
 *
 * @param numbers    numeric settings by role, canonical units; copied, never null
 * @param categories categorical settings by role (for example group-V species); copied, never null
 * @since 0.1
 */
public record Conditions(Map<Role, Double> numbers, Map<Role, String> categories) {

    /** Copies and checks the maps. */
    public Conditions {
        Objects.requireNonNull(numbers, "numbers");
        Objects.requireNonNull(categories, "categories");
        numbers.forEach((r, v) -> {
            if (!r.quantity().isNumeric()) {
                throw new IllegalArgumentException("role " + r.key() + " is not numeric");
            }
            if (v == null || !Double.isFinite(v)) {
                throw new IllegalArgumentException("role " + r.key() + " has a non-finite value " + v);
            }
        });
        categories.forEach((r, v) -> Objects.requireNonNull(v, () -> "role " + r.key() + " has no category"));
        // role order (EnumMap): the same iteration order in every JVM, and array-indexed lookups
        numbers = numbers.isEmpty() ? Map.of() : java.util.Collections.unmodifiableMap(new EnumMap<>(numbers));
        categories = categories.isEmpty() ? Map.of()
                : java.util.Collections.unmodifiableMap(new EnumMap<>(categories));
    }

    /** @return a builder for conditions; never null */
    public static Builder builder() {
        return new Builder();
    }

    /**
     * @param role a numeric role
     * @return its value in the canonical unit, or empty when the recipe does not set it
     */
    public OptionalDouble value(Role role) {
        Double v = numbers.get(role);
        return v == null ? OptionalDouble.empty() : OptionalDouble.of(v);
    }

    /**
     * @param role a categorical role
     * @return its value, or empty when the recipe does not set it
     */
    public Optional<String> category(Role role) {
        return Optional.ofNullable(categories.get(role));
    }

    /**
     * @param role a numeric role
     * @return true when the recipe sets it
     */
    public boolean has(Role role) {
        return numbers.containsKey(role) || categories.containsKey(role);
    }

    /** Mutable builder; not thread-safe. */
    public static final class Builder {
        private final Map<Role, Double> numbers = new EnumMap<>(Role.class);
        private final Map<Role, String> categories = new EnumMap<>(Role.class);

        private Builder() {
        }

        /**
         * @param role  a numeric role
         * @param value its value in the canonical unit of the role's quantity
         * @return this builder
         */
        public Builder set(Role role, double value) {
            numbers.put(role, value);
            return this;
        }

        /**
         * @param role  a categorical role
         * @param value the category
         * @return this builder
         */
        public Builder set(Role role, String value) {
            categories.put(role, Objects.requireNonNull(value));
            return this;
        }

        /** @return the conditions; never null */
        public Conditions build() {
            return new Conditions(numbers, categories);
        }
    }
}
