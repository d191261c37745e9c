package dev.terrace.core.campaign;

import java.util.List;
import java.util.Objects;

/**
 * How a campaign's substrate-temperature readings were calibrated ({@code temperature_calibration:}):
 * the reference points observed and whether the fit may also adjust the offset.
 *
 * <p><b>Offset.</b> Each point gives {@code d = true − reading} with variance {@code u_reading² +
 * u_true²}. The offset is their inverse-variance weighted mean; its uncertainty is the internal one,
 * {@code 1/sqrt(Σw)}, scaled up by the Birge ratio {@code R = sqrt(Σw(d − mean)²/(n − 1))} when the
 * points scatter more than their uncertainties allow (R > 1): R. T. Birge, Phys. Rev. 40, 207 (1932)
 * (from memory), the practice of the Particle Data Group's scale factor. A single offset assumes the
 * error is the same at every temperature; a Birge ratio well above 1 says it is not.
 *
 * <p><b>Where it applies.</b> {@link dev.terrace.core.model.RecipeConverter} adds {@link #appliedOffsetK()}
 * to every setting with a substrate-temperature role (substrate, crystallisation and anneal
 * temperature: all read on the same holder thermocouple) before any model sees it, so fit,
 * proposals, validation and the map all use corrected temperatures. The run log and the campaign's
 * boxes stay in readings.
 *
 * @param points         the reference points, in file order; never null, possibly empty
 * @param fitOffset      true when the fit should also adjust the offset ({@code fit_offset: true}),
 *                       with the points' offset as its Gaussian prior
 * @param appliedOverrideK an offset to apply instead of the points' estimate (a fitted offset), or NaN
 * @param position       where the section is written; never null
 * @since 0.3
 */
public record TemperatureCalibration(List<CalibrationPoint> points, boolean fitOffset, double appliedOverrideK,
                                     SourcePosition position) {

    /** A campaign without calibration points: no offset. */
    public static final TemperatureCalibration NONE =
            new TemperatureCalibration(List.of(), false, Double.NaN, SourcePosition.UNKNOWN);

    /**
     * Standard uncertainty of a reading when the point does not state one, 2 K: the holder
     * temperature is ramping while the grower waits for the melt or the RHEED change, and readings
     * are taken to the kelvin (own choice in line with common practice; state {@code reading_uncertainty:}
     * to override).
     */
    public static final double DEFAULT_READING_UNCERTAINTY_K = 2;

    /** Copies and checks the contents. */
    public TemperatureCalibration {
        points = List.copyOf(points);
        Objects.requireNonNull(position, "position");
        if (fitOffset && points.isEmpty()) {
            throw new IllegalArgumentException("fit_offset needs at least one calibration point as its prior");
        }
        if (Double.isInfinite(appliedOverrideK)) {
            throw new IllegalArgumentException("offset override must be finite or NaN");
        }
    }

    /**
     * The offset the points give (see the class description).
     *
     * @return the offset; {@link TemperatureOffset#NONE} without points
     */
    public TemperatureOffset estimate() {
        return estimate(points);
    }

    /**
     * The inverse-variance weighted offset of some points, with the Birge-ratio scaling.
     *
     * @param points the points; never null
     * @return the offset; {@link TemperatureOffset#NONE} when the list is empty
     */
    public static TemperatureOffset estimate(List<CalibrationPoint> points) {
        int n = points.size();
        if (n == 0) {
            return TemperatureOffset.NONE;
        }
        // a point known exactly (both uncertainties 0) would take all the weight: floor its variance
        // at a millikelvin squared, far below any reading's resolution
        double sw = 0;
        double swd = 0;
        for (CalibrationPoint p : points) {
            double w = 1 / Math.max(p.varianceK2(), 1e-6);
            sw += w;
            swd += w * p.offsetK();
        }
        double mean = swd / sw;
        double internal = 1 / Math.sqrt(sw);
        double birge = Double.NaN;
        double u = internal;
        if (n > 1) {
            double chi2 = 0;
            for (CalibrationPoint p : points) {
                double d = p.offsetK() - mean;
                chi2 += d * d / Math.max(p.varianceK2(), 1e-6);
            }
            birge = Math.sqrt(chi2 / (n - 1));
            u = internal * Math.max(1, birge);
        }
        return new TemperatureOffset(mean, u, internal, birge, n);
    }

    /** @return the offset added to substrate-temperature readings, kelvin: the override when set, else the estimate */
    public double appliedOffsetK() {
        return Double.isNaN(appliedOverrideK) ? estimate().offsetK() : appliedOverrideK;
    }

    /**
     * @param offsetK the offset to apply instead of the points' estimate, kelvin (finite)
     * @return a copy applying that offset
     */
    public TemperatureCalibration withAppliedOffset(double offsetK) {
        if (!Double.isFinite(offsetK)) {
            throw new IllegalArgumentException("offset must be finite");
        }
        return new TemperatureCalibration(points, fitOffset, offsetK, position);
    }
}
