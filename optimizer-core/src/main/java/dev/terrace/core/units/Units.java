package dev.terrace.core.units;

import dev.terrace.spi.Quantity;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The table of units Terrace understands.
 *
 * <p>Why not a JSR 385 units library: the conversions MBE needs most (ML to nm, ML/s to um/h)
 * depend on the grown material's monolayer height, which a general units library does not
 * model, and the remaining set is a short, fixed table. Each factor below is exact by
 * definition (SI, and 1 Torr = 101325/760 Pa exactly).
 *
 * @since 0.1
 */
public final class Units {

    /** Pascal per torr, exact: 101325/760 (definition of the torr). */
    public static final double PA_PER_TORR = 101325.0 / 760.0;
    /** Offset between degrees Celsius and kelvin, exact (SI definition). */
    public static final double KELVIN_OFFSET = 273.15;

    private static final Map<String, Unit> BY_SYMBOL = new LinkedHashMap<>();

    static {
        add(new Unit("K", Quantity.TEMPERATURE, 1, 0, false));
        add(new Unit("degC", Quantity.TEMPERATURE, 1, KELVIN_OFFSET, false));
        add(new Unit("Pa", Quantity.PRESSURE, 1, 0, false));
        add(new Unit("Torr", Quantity.PRESSURE, PA_PER_TORR, 0, false));
        add(new Unit("mbar", Quantity.PRESSURE, 100, 0, false));
        add(new Unit("ML", Quantity.COVERAGE, 1, 0, false));
        add(new Unit("ML/s", Quantity.DEPOSITION_RATE, 1, 0, false));
        add(new Unit("nm/s", Quantity.DEPOSITION_RATE, 1, 0, true));
        // 1 um/h = 1000 nm / 3600 s
        add(new Unit("um/h", Quantity.DEPOSITION_RATE, 1000.0 / 3600.0, 0, true));
        add(new Unit("s", Quantity.TIME, 1, 0, false));
        add(new Unit("min", Quantity.TIME, 60, 0, false));
        add(new Unit("h", Quantity.TIME, 3600, 0, false));
        add(new Unit("deg", Quantity.ANGLE, 1, 0, false));
        // 1 arcsec = 1/3600 deg (X-ray rocking-curve widths)
        add(new Unit("arcsec", Quantity.ANGLE, 1.0 / 3600.0, 0, false));
        add(new Unit("cm^-2", Quantity.AREAL_DENSITY, 1, 0, false));
        add(new Unit("um^-2", Quantity.AREAL_DENSITY, 1e8, 0, false));
        add(new Unit("nm", Quantity.LENGTH, 1, 0, false));
        add(new Unit("um", Quantity.LENGTH, 1000, 0, false));
        add(new Unit("cm^-2 s^-1", Quantity.PARTICLE_FLUX, 1, 0, false));
        add(new Unit("eV", Quantity.ENERGY, 1, 0, false));
        add(new Unit("meV", Quantity.ENERGY, 1e-3, 0, false));
        add(new Unit("1", Quantity.DIMENSIONLESS, 1, 0, false));
        // a share of a whole, 0 to 1 (yields, areal coverages, fill factors); predictions stay in [0, 1]
        add(new Unit("fraction", Quantity.DIMENSIONLESS, 1, 0, false));
        // per cent: 1 % = 0.01 (SI Brochure, 9th ed., 5.4.7)
        add(new Unit("%", Quantity.DIMENSIONLESS, 0.01, 0, false));
    }

    /**
     * A unit label the table does not know, for an outcome with no role: kept as written, printed
     * as written and never converted (a dimensionless factor of 1).
     *
     * @param symbol the label as written; never blank
     * @return the label unit; never null
     */
    public static Unit label(String symbol) {
        if (symbol == null || symbol.isBlank()) {
            throw new IllegalArgumentException("a unit label must not be blank");
        }
        return new Unit(symbol, Quantity.DIMENSIONLESS, 1, 0, false);
    }

    /** A deposited amount given as a thickness in nm (converted with the monolayer height). */
    public static final Unit NM_COVERAGE = new Unit("nm", Quantity.COVERAGE, 1, 0, true);

    private Units() {
    }

    private static void add(Unit u) {
        BY_SYMBOL.put(u.symbol(), u);
    }

    /**
     * Looks up a unit by its symbol.
     *
     * @param symbol the symbol as written in a campaign file
     * @return the unit, or empty when unknown
     */
    public static Optional<Unit> bySymbol(String symbol) {
        return Optional.ofNullable(BY_SYMBOL.get(symbol));
    }

    /**
     * Looks up a unit for a column whose role expects a given quantity. A thickness in nm is
     * accepted for a coverage.
     *
     * @param symbol   the symbol as written in a campaign file
     * @param expected the quantity the role expects
     * @return the unit, or empty when unknown or not a unit of that quantity
     */
    public static Optional<Unit> forQuantity(String symbol, Quantity expected) {
        if (expected == Quantity.COVERAGE && "nm".equals(symbol)) {
            return Optional.of(NM_COVERAGE);
        }
        return bySymbol(symbol).filter(u -> u.quantity() == expected);
    }

    /** @return every known symbol, in table order; never null */
    public static List<String> symbols() {
        return Collections.unmodifiableList(new ArrayList<>(BY_SYMBOL.keySet()));
    }

    /**
     * @param quantity a quantity
     * @return the symbols of the units of that quantity; never null
     */
    public static List<String> symbolsOf(Quantity quantity) {
        List<String> out = new ArrayList<>();
        BY_SYMBOL.values().stream().filter(u -> u.quantity() == quantity).forEach(u -> out.add(u.symbol()));
        if (quantity == Quantity.COVERAGE) {
            out.add("nm");
        }
        return out;
    }
}
