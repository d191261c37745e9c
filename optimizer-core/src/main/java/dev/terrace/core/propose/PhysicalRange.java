package dev.terrace.core.propose;

import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.units.Unit;
import dev.terrace.spi.Quantity;

/**
 * The values a numeric outcome can physically take, in the outcome's campaign unit, and how a
 * prediction is reported against them.
 *
 * <p>Sizes, densities, amounts, rates, pressures and times are never negative, a temperature is
 * never below absolute zero, and an outcome in the unit {@code fraction} lies in [0, 1]; angles
 * and plain numbers (unit {@code 1}) may take any value. The Gaussian-process prediction is a
 * normal distribution on the outcome's scale and knows nothing of these bounds, so for a small
 * diameter its 90 % interval can reach below zero.
 *
 * <p>Terrace reports the <em>censored view</em> of the prediction: a value the normal places
 * beyond a bound is read as the bound itself (the normal censored at the bounds, as in the Tobit
 * model; Tobin, Econometrica 26 (1958) 24-36). Its quantiles are the normal's quantiles clipped to
 * the range, so the printed central value (the median) and the 90 % interval never leave it; and
 * the probability of a target window that reaches a bound includes the mass beyond that bound
 * (the censored value sits on the bound, inside the window), while a window that stops short of
 * the bound is unchanged. The yield and the interval therefore describe one distribution.
 *
 * @param min smallest possible value, campaign unit, or negative infinity
 * @param max largest possible value, campaign unit, or positive infinity
 * @since 0.3
 */
public record PhysicalRange(double min, double max) {

    /** No bound on either side. */
    public static final PhysicalRange UNBOUNDED = new PhysicalRange(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);

    /** Symbol of the dimensionless unit whose values are fractions of a whole, 0 to 1. */
    public static final String FRACTION_UNIT = "fraction";

    /** Checks that the range is ordered and not NaN. */
    public PhysicalRange {
        if (!(min < max)) {
            throw new IllegalArgumentException("a physical range needs min < max, found " + min + " to " + max);
        }
    }

    /**
     * The physical range of a numeric outcome, from the quantity of its unit.
     *
     * @param o a numeric outcome; never null
     * @return its range in the outcome's unit; {@link #UNBOUNDED} for angles and plain numbers
     * @throws IllegalArgumentException for a class outcome
     */
    public static PhysicalRange of(OutcomeSpec o) {
        if (o.isClass()) {
            throw new IllegalArgumentException("outcome " + o.name() + " is a class and has no numeric range");
        }
        Unit u = o.unit();
        if (u.quantity() == Quantity.DIMENSIONLESS) {
            return u.symbol().equals(FRACTION_UNIT) ? new PhysicalRange(0, 1) : UNBOUNDED;
        }
        switch (u.quantity()) {
            case TEMPERATURE:
            case COVERAGE:
            case DEPOSITION_RATE:
            case PRESSURE:
            case TIME:
            case AREAL_DENSITY:
            case LENGTH:
            case PARTICLE_FLUX:
                // canonical zero (0 K for temperatures) in the outcome's unit; thickness-based units
                // scale by the monolayer height, which leaves zero at zero
                double zero = u.perMonolayerHeight() ? 0 : u.fromCanonical(0, 1);
                return new PhysicalRange(zero, Double.POSITIVE_INFINITY);
            default:
                return UNBOUNDED;
        }
    }

    /** @return true when at least one side is bounded */
    public boolean bounded() {
        return Double.isFinite(min) || Double.isFinite(max);
    }

    /**
     * @param v a value in the campaign unit
     * @return {@code v} moved to the nearest bound when outside the range (the censored view)
     */
    public double clip(double v) {
        return Math.max(min, Math.min(max, v));
    }

    /**
     * The lower end of a target window on the prediction's scale, for the censored view: negative
     * infinity when the window reaches the lower bound, so that the mass below it counts as in the
     * window.
     *
     * @param scale    the outcome's scale
     * @param lowScaled the window's lower end on that scale (log10 for log outcomes), or NaN for none
     * @return the end to integrate the normal from
     */
    public double windowLow(Scale scale, double lowScaled) {
        return lowScaled <= scaled(scale, min) ? Double.NEGATIVE_INFINITY : lowScaled;
    }

    /**
     * The upper end of a target window for the censored view: positive infinity when the window
     * reaches the upper bound.
     *
     * @param scale      the outcome's scale
     * @param highScaled the window's upper end on that scale, or NaN for none
     * @return the end to integrate the normal to
     */
    public double windowHigh(Scale scale, double highScaled) {
        return highScaled >= scaled(scale, max) ? Double.POSITIVE_INFINITY : highScaled;
    }

    private static double scaled(Scale scale, double v) {
        if (scale != Scale.LOG) {
            return v;
        }
        return v > 0 ? Math.log10(v) : Double.NEGATIVE_INFINITY;
    }
}
