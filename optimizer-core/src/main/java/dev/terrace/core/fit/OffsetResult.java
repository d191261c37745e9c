package dev.terrace.core.fit;

import dev.terrace.core.campaign.TemperatureOffset;

import java.util.Objects;

/**
 * The thermocouple offset a fit applied to every substrate-temperature reading.
 *
 * @param calibration the offset the calibration points give (the prior when fitted); never null
 * @param fitted      true when the fit adjusted the offset ({@code fit_offset: true})
 * @param value       the offset applied, kelvin
 * @param lo          lower end of its 95 % interval, kelvin (NaN without calibration points)
 * @param hi          upper end of its 95 % interval, kelvin (NaN without calibration points)
 * @param method      how the interval was found; never null
 * @param evaluations how many model fits the profile took (0 when not fitted)
 * @since 0.3
 */
public record OffsetResult(TemperatureOffset calibration, boolean fitted, double value, double lo, double hi,
                           String method, int evaluations) {

    /** Checks the invariants. */
    public OffsetResult {
        Objects.requireNonNull(calibration, "calibration");
        Objects.requireNonNull(method, "method");
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("offset must be finite");
        }
    }

    /**
     * The offset taken from the calibration points as they are.
     *
     * @param t the points' offset
     * @return the result; never null
     */
    public static OffsetResult fromPoints(TemperatureOffset t) {
        if (!t.isCalibrated()) {
            return new OffsetResult(t, false, 0, Double.NaN, Double.NaN, "no calibration points: readings used as they are", 0);
        }
        return new OffsetResult(t, false, t.offsetK(), t.offsetK() - ParameterPrior.Z95 * t.uncertaintyK(),
                t.offsetK() + ParameterPrior.Z95 * t.uncertaintyK(),
                "from " + t.pointsUsed() + " calibration point" + (t.pointsUsed() == 1 ? "" : "s")
                        + " (inverse-variance mean, +/- 1.96 sd)", 0);
    }

    /** @return true when calibration points were given */
    public boolean isCalibrated() {
        return calibration.isCalibrated();
    }
}
