package dev.terrace.spi;

/**
 * A physical quantity and the one canonical unit Terrace uses for it internally.
 *
 * <p>Every value handed to a {@link GrowthModel} is expressed in the canonical unit of
 * its quantity, whatever unit the campaign file used.
 *
 * @since 0.1
 */
public enum Quantity {
    /** Temperature, canonical unit kelvin. */
    TEMPERATURE("K"),
    /** Deposited amount, canonical unit monolayers of the substrate's (001) surface. */
    COVERAGE("ML"),
    /** Deposition rate, canonical unit monolayers per second. */
    DEPOSITION_RATE("ML/s"),
    /** Pressure (beam-equivalent pressure), canonical unit pascal. */
    PRESSURE("Pa"),
    /** Time, canonical unit second. */
    TIME("s"),
    /** Plane angle, canonical unit degree. */
    ANGLE("deg"),
    /** Number per area, canonical unit per square centimetre. */
    AREAL_DENSITY("cm^-2"),
    /** Length, canonical unit nanometre. */
    LENGTH("nm"),
    /** Particle flux, canonical unit atoms per square centimetre per second. */
    PARTICLE_FLUX("cm^-2 s^-1"),
    /** Energy, canonical unit electronvolt (photoluminescence peaks, band gaps). */
    ENERGY("eV"),
    /** A dimensionless number (ratio, count, fraction). */
    DIMENSIONLESS("1"),
    /** A choice among named alternatives set by the grower (for example As2 or As4). */
    CATEGORY(""),
    /** A class observed after a run (for example dot or ring). */
    CLASS("");

    private final String canonicalUnit;

    Quantity(String canonicalUnit) {
        this.canonicalUnit = canonicalUnit;
    }

    /** @return the symbol of the canonical unit, empty for categories and classes; never null */
    public String canonicalUnit() {
        return canonicalUnit;
    }

    /** @return true for quantities carried as numbers */
    public boolean isNumeric() {
        return this != CATEGORY && this != CLASS;
    }
}
