package dev.terrace.spi;

import java.util.List;
import java.util.Objects;

/**
 * One adjustable parameter of a growth model, with its default and where that default comes from.
 *
 * @param name         identifier used in fits and reports, lower case with underscores; never blank
 * @param unit         unit symbol for display (for example {@code "eV"}), empty when dimensionless
 * @param defaultValue value used when the lab's runs cannot determine the parameter
 * @param min          lowest physically sensible value (a fit never leaves {@code [min, max]})
 * @param max          highest physically sensible value
 * @param choices      the allowed values of a discrete parameter (for example critical size 1, 2, 3),
 *                     empty for a continuous one
 * @param logScale     true when the parameter spans decades and is fitted on its logarithm
 * @param source       where the default and bounds come from (paper, handbook, or "no general value
 *                     published"); never blank
 * @param description  one line saying what the parameter means
 * @since 0.1
 */
public record ModelParameter(String name, String unit, double defaultValue, double min, double max,
                             List<Double> choices, boolean logScale, String source, String description) {

    /** Checks the invariants. */
    public ModelParameter {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(description, "description");
        choices = List.copyOf(choices);
        if (name.isBlank()) {
            throw new IllegalArgumentException("parameter name is blank");
        }
        if (source.isBlank()) {
            throw new IllegalArgumentException("parameter " + name + " has no source for its default");
        }
        if (!(min <= defaultValue && defaultValue <= max)) {
            throw new IllegalArgumentException("parameter " + name + ": default " + defaultValue
                    + " outside [" + min + ", " + max + "]");
        }
        if (logScale && min <= 0) {
            throw new IllegalArgumentException("parameter " + name + ": log scale needs min > 0");
        }
        if (!choices.isEmpty() && !choices.contains(defaultValue)) {
            throw new IllegalArgumentException("parameter " + name + ": default is not one of its choices");
        }
    }

    /**
     * A continuous parameter.
     *
     * @return the parameter; never null
     */
    public static ModelParameter continuous(String name, String unit, double defaultValue, double min, double max,
                                            boolean logScale, String source, String description) {
        return new ModelParameter(name, unit, defaultValue, min, max, List.of(), logScale, source, description);
    }

    /**
     * A discrete parameter chosen among a few values (by information criterion when fitted).
     *
     * @return the parameter; never null
     */
    public static ModelParameter discrete(String name, double defaultValue, List<Double> choices,
                                          String source, String description) {
        double lo = choices.stream().mapToDouble(Double::doubleValue).min().orElse(defaultValue);
        double hi = choices.stream().mapToDouble(Double::doubleValue).max().orElse(defaultValue);
        return new ModelParameter(name, "", defaultValue, lo, hi, choices, false, source, description);
    }

    /** @return true when the parameter takes one of a few listed values */
    public boolean isDiscrete() {
        return !choices.isEmpty();
    }
}
