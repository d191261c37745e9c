package dev.terrace.core.campaign;

import java.util.Objects;

/**
 * What counts as a good run for one outcome: a window on a numeric outcome, or a required class.
 *
 * @param outcome  outcome name; never blank
 * @param min      lowest acceptable value in the outcome's unit, NaN for no lower limit
 * @param max      highest acceptable value in the outcome's unit, NaN for no upper limit
 * @param is       required class of a class outcome, null for numeric targets
 * @param position where the target is declared
 * @since 0.1
 */
public record Target(String outcome, double min, double max, String is, SourcePosition position) {

    /** Checks the invariants. */
    public Target {
        Objects.requireNonNull(outcome, "outcome");
        if (is == null && Double.isNaN(min) && Double.isNaN(max)) {
            throw new IllegalArgumentException("target on " + outcome + " sets neither a window nor a class");
        }
        if (!Double.isNaN(min) && !Double.isNaN(max) && !(min < max)) {
            throw new IllegalArgumentException("target on " + outcome + ": min must be below max");
        }
    }

    /** @return true for a class target */
    public boolean isClassTarget() {
        return is != null;
    }

    /**
     * @param value a measured value in the outcome's unit
     * @return true when it lies in the window
     */
    public boolean accepts(double value) {
        return (Double.isNaN(min) || value >= min) && (Double.isNaN(max) || value <= max);
    }

    /**
     * @param cls an observed class
     * @return true when it is the required class
     */
    public boolean accepts(String cls) {
        return is != null && is.equals(cls);
    }
}
