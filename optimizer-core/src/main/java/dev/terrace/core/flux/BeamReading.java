package dev.terrace.core.flux;

import java.util.Objects;

/**
 * One beam-equivalent-pressure reading of one beam, with what is needed to turn it into a flux.
 *
 * @param species            the species in the beam; never null
 * @param bepPa              the beam-equivalent pressure read on the ion gauge, in Pa (the
 *                           gauge's N2-calibrated reading with the background subtracted); positive
 * @param sourceTemperatureK the temperature of the zone the molecules last equilibrated in (the
 *                           cracker zone of a cracker, the cell otherwise), in K; positive
 * @param sensitivity        the gauge's ionisation efficiency for this species relative to N2;
 *                           positive. {@link #of(Species, double)} uses the ion-gauge electron-count rule
 * @param temperatureDefaulted true when the source temperature is the species' [practice] default
 * @since 0.1
 */
public record BeamReading(Species species, double bepPa, double sourceTemperatureK, double sensitivity,
                          boolean temperatureDefaulted) {

    /** Checks the invariants. */
    public BeamReading {
        Objects.requireNonNull(species, "species");
        if (!(bepPa > 0) || !Double.isFinite(bepPa)) {
            throw new IllegalArgumentException("beam-equivalent pressure of " + species + " must be positive and finite, got " + bepPa);
        }
        if (!(sourceTemperatureK > 0) || !Double.isFinite(sourceTemperatureK)) {
            throw new IllegalArgumentException("source temperature of " + species + " must be positive and finite (K), got "
                    + sourceTemperatureK);
        }
        if (!(sensitivity > 0) || !Double.isFinite(sensitivity)) {
            throw new IllegalArgumentException("gauge sensitivity for " + species + " must be positive and finite, got "
                    + sensitivity);
        }
    }

    /**
     * A reading at the species' default source temperature, with the ion-gauge electron-count sensitivity.
     *
     * @param species the species; never null
     * @param bepPa   the beam-equivalent pressure in Pa; positive
     * @return the reading; never null
     */
    public static BeamReading of(Species species, double bepPa) {
        return new BeamReading(species, bepPa, species.defaultSourceTemperatureK(),
                IonGauge.relativeSensitivity(species), true);
    }

    /**
     * A reading at a given source temperature, with the ion-gauge electron-count sensitivity.
     *
     * @param species            the species; never null
     * @param bepPa              the beam-equivalent pressure in Pa; positive
     * @param sourceTemperatureK the source temperature in K; positive
     * @return the reading; never null
     */
    public static BeamReading of(Species species, double bepPa, double sourceTemperatureK) {
        return new BeamReading(species, bepPa, sourceTemperatureK, IonGauge.relativeSensitivity(species), false);
    }

    /**
     * The same reading with a calibrated gauge sensitivity in place of the ion-gauge electron-count rule.
     *
     * @param relativeSensitivity &eta;/&eta;<sub>N2</sub> measured for this gauge and species; positive
     * @return a new reading; never null
     */
    public BeamReading withSensitivity(double relativeSensitivity) {
        return new BeamReading(species, bepPa, sourceTemperatureK, relativeSensitivity, temperatureDefaulted);
    }
}
