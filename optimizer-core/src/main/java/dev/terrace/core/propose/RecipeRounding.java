package dev.terrace.core.propose;

import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;
import dev.terrace.spi.Quantity;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * Rounds a proposed recipe to what a grower can set on the chamber: temperatures to 1 degree,
 * pressures to 2 significant digits (a gauge reads about two), everything else to 3 significant
 * digits (common practice). The rounded recipe stays inside the boxes and limits: when plain
 * rounding breaks a limit, the other rounding direction is tried per setting.
 *
 * @since 0.1
 */
public final class RecipeRounding {

    /** Significant digits kept for pressures. */
    public static final int PRESSURE_DIGITS = 2;
    /** Significant digits kept for rates, amounts, times and other settings. */
    public static final int DEFAULT_DIGITS = 3;

    private RecipeRounding() {
    }

    /**
     * @param p     a numeric setting
     * @param value a value in its unit
     * @param up    round up (true) or down (false); null for nearest
     * @return the rounded value
     */
    public static double round(ParameterSpec p, double value, Boolean up) {
        RoundingMode mode = up == null ? RoundingMode.HALF_EVEN : (up ? RoundingMode.CEILING : RoundingMode.FLOOR);
        Quantity q = p.unit().quantity();
        if (q == Quantity.TEMPERATURE) {
            return new BigDecimal(value).setScale(0, mode).doubleValue();
        }
        if (value == 0) {
            return 0;
        }
        int digits = q == Quantity.PRESSURE ? PRESSURE_DIGITS : DEFAULT_DIGITS;
        return new BigDecimal(value).round(new MathContext(digits, mode)).doubleValue();
    }

    /**
     * Rounds a design point's numeric settings.
     *
     * @param space the design space
     * @param point the point
     * @return rounded numeric settings by name (campaign units), inside the boxes and, when possible,
     *     the limits; never null
     */
    public static Map<String, Double> round(DesignSpace space, DesignPoint point) {
        Map<String, Double> raw = space.numbers(point);
        Map<String, Double> nearest = new LinkedHashMap<>();
        for (ParameterSpec p : space.continuous()) {
            nearest.put(p.name(), clampToBox(p, round(p, raw.get(p.name()), null)));
        }
        if (holds(space, nearest)) {
            return nearest;
        }
        int d = space.continuous().size();
        if (d > 16) {
            return raw;
        }
        Map<String, Double> best = null;
        double bestDist = Double.POSITIVE_INFINITY;
        for (int mask = 0; mask < (1 << d); mask++) {
            Map<String, Double> cand = new LinkedHashMap<>();
            double dist = 0;
            for (int i = 0; i < d; i++) {
                ParameterSpec p = space.continuous().get(i);
                double v = clampToBox(p, round(p, raw.get(p.name()), (mask & (1 << i)) != 0));
                cand.put(p.name(), v);
                double du = p.toUnit(v) - p.toUnit(raw.get(p.name()));
                dist += du * du;
            }
            if (holds(space, cand) && dist < bestDist) {
                best = cand;
                bestDist = dist;
            }
        }
        return best != null ? best : raw;
    }

    private static boolean holds(DesignSpace space, Map<String, Double> values) {
        return space.limits().stream().allMatch(l -> l.holds(values));
    }

    private static double clampToBox(ParameterSpec p, double v) {
        return Math.max(p.min(), Math.min(p.max(), v));
    }
}
