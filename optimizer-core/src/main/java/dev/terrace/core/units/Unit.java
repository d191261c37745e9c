package dev.terrace.core.units;

import dev.terrace.spi.Quantity;

import java.util.Objects;

/**
 * A unit a campaign file may name, with its conversion to the canonical unit of its quantity.
 *
 * <p>Conversion is {@code canonical = value * factor + offset} for most units. Units of coverage
 * and rate given as thickness (nm, nm/s, um/h) need the material's monolayer height and set
 * {@link #perMonolayerHeight()}: then {@code canonical = value * factor / monolayerHeightNm}.
 *
 * @param symbol             the spelling in campaign files, for example {@code "degC"}; never blank
 * @param quantity           the quantity measured; never null
 * @param factor             multiplicative factor to the canonical unit
 * @param offset             additive offset to the canonical unit (temperatures only)
 * @param perMonolayerHeight true when the conversion divides by the monolayer height in nm
 * @since 0.1
 */
public record Unit(String symbol, Quantity quantity, double factor, double offset, boolean perMonolayerHeight) {

    /** Checks the invariants. */
    public Unit {
        Objects.requireNonNull(symbol, "symbol");
        Objects.requireNonNull(quantity, "quantity");
        if (!(factor > 0) || !Double.isFinite(offset)) {
            throw new IllegalArgumentException("bad conversion for unit " + symbol);
        }
    }

    /**
     * Converts a value in this unit to the canonical unit of its quantity.
     *
     * @param value             the value in this unit
     * @param monolayerHeightNm the material's monolayer height, used only by thickness-based units
     * @return the value in the canonical unit
     */
    public double toCanonical(double value, double monolayerHeightNm) {
        if (perMonolayerHeight) {
            return value * factor / monolayerHeightNm;
        }
        return value * factor + offset;
    }

    /**
     * Converts a value in the canonical unit back to this unit.
     *
     * @param canonical         the value in the canonical unit
     * @param monolayerHeightNm the material's monolayer height, used only by thickness-based units
     * @return the value in this unit
     */
    public double fromCanonical(double canonical, double monolayerHeightNm) {
        if (perMonolayerHeight) {
            return canonical * monolayerHeightNm / factor;
        }
        return (canonical - offset) / factor;
    }
}
