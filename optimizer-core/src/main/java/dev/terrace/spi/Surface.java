package dev.terrace.spi;

import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * Material facts about the growth surface that growth models need, resolved by the core from
 * the campaign's {@code material} section and the material table.
 *
 * @param substrate              substrate material name, for example {@code "GaAs"}; never blank
 * @param monolayerHeightNm      height of one (001) monolayer, a/2, in nm; positive
 * @param sitesPerCm2            surface sites per monolayer, 2/a^2, in cm^-2; positive
 * @param deposit                deposited metal (Ga, In, Al, ...), or null for film growth
 * @param depositMeltingK        melting point of the deposited metal in K, NaN when unknown or no deposit
 * @param depositLiquidAtomsPerNm3 atomic number density of the liquid metal in nm^-3, NaN when unknown
 * @param groupV                 group-V element (As, Sb, P), or null
 * @since 0.1
 */
public record Surface(String substrate, double monolayerHeightNm, double sitesPerCm2, String deposit,
                      double depositMeltingK, double depositLiquidAtomsPerNm3, String groupV) {

    /** Checks the invariants. */
    public Surface {
        Objects.requireNonNull(substrate, "substrate");
        if (substrate.isBlank()) {
            throw new IllegalArgumentException("substrate is blank");
        }
        if (!(monolayerHeightNm > 0) || !(sitesPerCm2 > 0)) {
            throw new IllegalArgumentException("monolayer height and site density must be positive");
        }
    }

    /** @return the deposited metal, if any */
    public Optional<String> depositMetal() {
        return Optional.ofNullable(deposit);
    }

    /** @return the deposit's melting point in K, if known */
    public OptionalDouble meltingPointK() {
        return Double.isFinite(depositMeltingK) ? OptionalDouble.of(depositMeltingK) : OptionalDouble.empty();
    }

    /** @return the liquid deposit's atom density in nm^-3, if known */
    public OptionalDouble liquidAtomDensityPerNm3() {
        return Double.isFinite(depositLiquidAtomsPerNm3)
                ? OptionalDouble.of(depositLiquidAtomsPerNm3) : OptionalDouble.empty();
    }
}
