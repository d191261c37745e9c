package dev.terrace.core.campaign;

import dev.terrace.core.units.Unit;
import dev.terrace.spi.Role;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * One recipe setting of a campaign: numeric with a box, or categorical with choices.
 *
 * @param name     column name in the run log; never blank
 * @param unit     unit for a numeric setting, null for a categorical one
 * @param min      lower bound of the box in {@code unit} (NaN for categorical)
 * @param max      upper bound of the box in {@code unit} (NaN for categorical)
 * @param scale    spacing of a numeric setting; never null
 * @param role     physical meaning, or null when the setting has none
 * @param choices  the allowed values of a categorical setting, empty for numeric
 * @param position where the setting is declared
 * @since 0.1
 */
public record ParameterSpec(String name, Unit unit, double min, double max, Scale scale, Role role,
                            List<String> choices, SourcePosition position) {

    /** Checks the invariants. */
    public ParameterSpec {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(scale, "scale");
        choices = List.copyOf(choices);
        if (choices.isEmpty()) {
            Objects.requireNonNull(unit, "numeric setting " + name + " needs a unit");
            if (!(min < max)) {
                throw new IllegalArgumentException(name + ": min must be below max");
            }
            if (scale == Scale.LOG && !(min > 0)) {
                throw new IllegalArgumentException(name + ": log scale needs min > 0");
            }
        }
    }

    /** @return true for a setting chosen among named alternatives */
    public boolean isCategorical() {
        return !choices.isEmpty();
    }

    /** @return the role, if the setting has one */
    public Optional<Role> roleIfAny() {
        return Optional.ofNullable(role);
    }

    /**
     * Maps a value in the campaign unit to [0, 1] across the box (on log10 for log settings).
     *
     * @param value value in the campaign unit
     * @return its position in the box; below 0 or above 1 when outside
     */
    public double toUnit(double value) {
        if (scale == Scale.LOG) {
            return (Math.log10(value) - Math.log10(min)) / (Math.log10(max) - Math.log10(min));
        }
        return (value - min) / (max - min);
    }

    /**
     * The inverse of {@link #toUnit(double)}.
     *
     * @param u a position in the box, 0 to 1
     * @return the value in the campaign unit
     */
    public double fromUnit(double u) {
        if (scale == Scale.LOG) {
            return Math.pow(10, Math.log10(min) + u * (Math.log10(max) - Math.log10(min)));
        }
        return min + u * (max - min);
    }
}
