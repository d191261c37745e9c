package dev.terrace.core.campaign;

import dev.terrace.core.units.Unit;
import dev.terrace.spi.Role;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * One measured outcome of a campaign: numeric with a unit, or a class among named classes.
 *
 * @param name     column name in the run log; never blank
 * @param unit     unit of a numeric outcome, null for a class outcome
 * @param scale    spacing of a numeric outcome; never null
 * @param role     physical meaning, or null
 * @param classes  the class names of a class outcome, empty for numeric
 * @param position where the outcome is declared
 * @since 0.1
 */
public record OutcomeSpec(String name, Unit unit, Scale scale, Role role, List<String> classes,
                          SourcePosition position) {

    /** Checks the invariants. */
    public OutcomeSpec {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(scale, "scale");
        classes = List.copyOf(classes);
        if (classes.isEmpty()) {
            Objects.requireNonNull(unit, "numeric outcome " + name + " needs a unit");
        }
    }

    /** @return true for an outcome that is a class */
    public boolean isClass() {
        return !classes.isEmpty();
    }

    /** @return the role, if the outcome has one */
    public Optional<Role> roleIfAny() {
        return Optional.ofNullable(role);
    }
}
