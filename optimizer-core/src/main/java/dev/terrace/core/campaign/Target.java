package dev.terrace.core.campaign;

import java.util.Objects;

/**
 * What counts as a good run for one outcome: a window on a numeric outcome, or a required class.
 *
 * @param outcome  outcome name; never blank
 * @param min      lowest acceptable value in the outcome's unit, NaN for no lower limit
 * @param max      highest acceptable value in the outcome's unit, NaN for no upper limit
 * @param is       required class of a class outcome, null for numeric targets
 * @param goal     whether the outcome is also to be maximised or minimised (at most one target of a
 *                 campaign has a goal other than {@link Goal#WINDOW})
 * @param position where the target is declared
 * @since 0.1
 */
public record Target(String outcome, double min, double max, String is, Goal goal, SourcePosition position) {

    /** What the target asks of its outcome beyond an optional window. */
    public enum Goal {
        /** Only the window (or class) counts. */
        WINDOW,
        /** As large as possible, inside the window if one is given. */
        MAXIMIZE,
        /** As small as possible, inside the window if one is given. */
        MINIMIZE
    }

    /**
     * A window or class target without an objective.
     *
     * @param outcome  outcome name
     * @param min      lower limit or NaN
     * @param max      upper limit or NaN
     * @param is       required class or null
     * @param position where it is declared
     */
    public Target(String outcome, double min, double max, String is, SourcePosition position) {
        this(outcome, min, max, is, Goal.WINDOW, position);
    }

    /** Checks the invariants. */
    public Target {
        Objects.requireNonNull(outcome, "outcome");
        Objects.requireNonNull(goal, "goal");
        if (is == null && Double.isNaN(min) && Double.isNaN(max) && goal == Goal.WINDOW) {
            throw new IllegalArgumentException("target on " + outcome + " sets neither a window nor a class");
        }
        if (is != null && goal != Goal.WINDOW) {
            throw new IllegalArgumentException("a class target cannot be maximised or minimised");
        }
        if (!Double.isNaN(min) && !Double.isNaN(max) && !(min < max)) {
            throw new IllegalArgumentException("target on " + outcome + ": min must be below max");
        }
    }

    /** @return true when the target asks to maximise or minimise its outcome */
    public boolean isObjective() {
        return goal != Goal.WINDOW;
    }

    /** @return true when the target has a window (a lower or upper limit) */
    public boolean hasWindow() {
        return !Double.isNaN(min) || !Double.isNaN(max);
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
