package dev.terrace.core.campaign;

/**
 * The thermocouple offset a campaign's calibration points give: what to add to every
 * substrate-temperature reading to get the true temperature.
 *
 * @param offsetK       the offset, kelvin (0 when there are no points)
 * @param uncertaintyK  its standard uncertainty, kelvin (NaN when there are no points)
 * @param internalK     the uncertainty from the points' own uncertainties alone, kelvin (NaN when none)
 * @param birgeRatio    the Birge ratio of the points' scatter about the mean (NaN with fewer than two points)
 * @param pointsUsed    how many points entered
 * @since 0.3
 */
public record TemperatureOffset(double offsetK, double uncertaintyK, double internalK, double birgeRatio,
                                int pointsUsed) {

    /** No calibration: no offset. */
    public static final TemperatureOffset NONE = new TemperatureOffset(0, Double.NaN, Double.NaN, Double.NaN, 0);

    /** Checks the invariants. */
    public TemperatureOffset {
        if (!Double.isFinite(offsetK)) {
            throw new IllegalArgumentException("offset must be finite");
        }
        if (pointsUsed < 0) {
            throw new IllegalArgumentException("pointsUsed must not be negative");
        }
    }

    /** @return true when calibration points gave this offset */
    public boolean isCalibrated() {
        return pointsUsed > 0;
    }
}
