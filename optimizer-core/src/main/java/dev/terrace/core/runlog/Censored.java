package dev.terrace.core.runlog;

/**
 * A censored measurement: the run log says only that the true value lies below or above a bound,
 * written {@code <X} or {@code >X} in the cell (for example {@code <1e8} when no dots were seen
 * above the microscope's detection limit). The bound is in the campaign's unit, like any number.
 *
 * <p>Censored values are kept apart from {@link Run#numbers()}: code that knows nothing of censoring
 * sees the cell as not measured, and code that handles it (the Tobit likelihood of the fits, the
 * surrogate's censored update) reads it through {@link Run#censored(String)}.
 *
 * @param side  whether the true value is below or above the bound; never null
 * @param bound the bound, finite
 * @since 0.2
 */
public record Censored(Side side, double bound) {

    /** Which side of the bound the true value lies on. */
    public enum Side {
        /** Written {@code <X}: the true value is below X (for example below detection). */
        BELOW,
        /** Written {@code >X}: the true value is above X (for example beyond the counting range). */
        ABOVE;

        /** @return the run-log prefix of this side, {@code <} or {@code >} */
        public String symbol() {
            return this == BELOW ? "<" : ">";
        }
    }

    /** Checks the invariants. */
    public Censored {
        java.util.Objects.requireNonNull(side, "side");
        if (!Double.isFinite(bound)) {
            throw new IllegalArgumentException("a censoring bound must be finite, got " + bound);
        }
    }

    /** @return a value that is below {@code bound} */
    public static Censored below(double bound) {
        return new Censored(Side.BELOW, bound);
    }

    /** @return a value that is above {@code bound} */
    public static Censored above(double bound) {
        return new Censored(Side.ABOVE, bound);
    }

    @Override
    public String toString() {
        return side.symbol() + bound;
    }
}
