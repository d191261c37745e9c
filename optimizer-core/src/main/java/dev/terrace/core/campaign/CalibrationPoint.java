package dev.terrace.core.campaign;

import java.util.Objects;

/**
 * One temperature reference the grower observed on the substrate thermocouple (or pyrometer): the
 * event, what the instrument read, and the accepted true temperature with its uncertainty.
 *
 * @param event              the event's name: a {@link ReferenceEvent} key or a custom name; never blank
 * @param builtIn            true when the accepted value comes from {@link ReferenceEvent}
 * @param readingK           the instrument's reading, kelvin; finite and positive
 * @param readingUncertaintyK standard uncertainty of the reading, kelvin; finite, not negative
 * @param trueK              the accepted true temperature, kelvin; finite and positive
 * @param trueUncertaintyK   standard uncertainty of the accepted value, kelvin; finite, not negative
 * @param source             where the accepted value comes from; never blank
 * @param position           where the point is written in the campaign file; never null
 * @since 0.3
 */
public record CalibrationPoint(String event, boolean builtIn, double readingK, double readingUncertaintyK,
                               double trueK, double trueUncertaintyK, String source, SourcePosition position) {

    /** Checks the invariants. */
    public CalibrationPoint {
        Objects.requireNonNull(event, "event");
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(position, "position");
        if (event.isBlank() || source.isBlank()) {
            throw new IllegalArgumentException("a calibration point needs an event and a source");
        }
        if (!(readingK > 0) || !(trueK > 0) || !Double.isFinite(readingK) || !Double.isFinite(trueK)) {
            throw new IllegalArgumentException("temperatures of a calibration point must be above 0 K");
        }
        if (!(readingUncertaintyK >= 0) || !(trueUncertaintyK >= 0)
                || !Double.isFinite(readingUncertaintyK) || !Double.isFinite(trueUncertaintyK)) {
            throw new IllegalArgumentException("uncertainties of a calibration point must be finite and not negative");
        }
    }

    /**
     * A point for a built-in event.
     *
     * @param event              the event
     * @param readingK           the reading, kelvin
     * @param readingUncertaintyK the reading's standard uncertainty, kelvin
     * @param position           where it is written
     * @return the point; never null
     */
    public static CalibrationPoint of(ReferenceEvent event, double readingK, double readingUncertaintyK,
                                      SourcePosition position) {
        return new CalibrationPoint(event.key(), true, readingK, readingUncertaintyK, event.trueKelvin(),
                event.uncertaintyK(), event.source(), position);
    }

    /** @return true − reading, kelvin: what must be added to a reading to get the true temperature */
    public double offsetK() {
        return trueK - readingK;
    }

    /** @return variance of {@link #offsetK()}: reading and accepted value independent, K² */
    public double varianceK2() {
        return readingUncertaintyK * readingUncertaintyK + trueUncertaintyK * trueUncertaintyK;
    }
}
