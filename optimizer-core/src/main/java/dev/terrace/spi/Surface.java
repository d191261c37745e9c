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
 * @param depositSupercoolingLimitK lowest temperature in K at which droplets of the deposit are still taken
 *                               as (supercooled) liquid, at most the melting point; NaN when no margin is
 *                               known (the melting point is then the limit)
 * @param crystalCationsPerNm3   group-III atoms per nm^3 in the compound the deposit forms with the group-V
 *                               element (4/a^3 for zinc blende, for example GaAs from Ga and As); NaN when
 *                               unknown
 * @since 0.1
 */
public record Surface(String substrate, double monolayerHeightNm, double sitesPerCm2, String deposit,
                      double depositMeltingK, double depositLiquidAtomsPerNm3, String groupV,
                      double depositSupercoolingLimitK, double crystalCationsPerNm3) {

    /** Checks the invariants. */
    public Surface {
        Objects.requireNonNull(substrate, "substrate");
        if (substrate.isBlank()) {
            throw new IllegalArgumentException("substrate is blank");
        }
        if (!(monolayerHeightNm > 0) || !(sitesPerCm2 > 0)) {
            throw new IllegalArgumentException("monolayer height and site density must be positive");
        }
        if (Double.isFinite(depositSupercoolingLimitK) && Double.isFinite(depositMeltingK)
                && depositSupercoolingLimitK > depositMeltingK) {
            throw new IllegalArgumentException("supercooling limit " + depositSupercoolingLimitK
                    + " K is above the melting point " + depositMeltingK + " K");
        }
        if (Double.isFinite(crystalCationsPerNm3) && !(crystalCationsPerNm3 > 0)) {
            throw new IllegalArgumentException("cation density of the crystal must be positive");
        }
    }

    /**
     * A surface without a supercooling margin or crystal cation density (both unknown).
     *
     * @since 0.1
     */
    public Surface(String substrate, double monolayerHeightNm, double sitesPerCm2, String deposit,
                   double depositMeltingK, double depositLiquidAtomsPerNm3, String groupV) {
        this(substrate, monolayerHeightNm, sitesPerCm2, deposit, depositMeltingK, depositLiquidAtomsPerNm3, groupV,
                Double.NaN, Double.NaN);
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

    /**
     * @return the lowest temperature in K at which the deposit is still taken as a supercooled liquid, if a
     *         margin is known; without one the melting point is the limit
     * @since 0.3
     */
    public OptionalDouble supercoolingLimitK() {
        return Double.isFinite(depositSupercoolingLimitK)
                ? OptionalDouble.of(depositSupercoolingLimitK) : OptionalDouble.empty();
    }

    /**
     * @return group-III atoms per nm^3 in the compound the deposit crystallises into, if known
     * @since 0.3
     */
    public OptionalDouble crystalCationDensityPerNm3() {
        return Double.isFinite(crystalCationsPerNm3) ? OptionalDouble.of(crystalCationsPerNm3) : OptionalDouble.empty();
    }

    /**
     * @return the group-V molecule assumed when a run does not say which one arrives, for this surface's
     *         group-V element (see {@link #defaultGroupVSpecies(String)}); empty without a group-V element
     * @since 0.3
     */
    public Optional<String> defaultGroupVSpecies() {
        return defaultGroupVSpecies(groupV);
    }

    /**
     * The group-V molecule assumed when a run does not name one: As4 and Sb4 (plain sublimation cells, the
     * common case without a cracker) and P2 (phosphorus is normally supplied through a cracker); common
     * practice. This is the one table that both the BEP-to-flux conversion of the core and the sticking of
     * the growth models follow, so the flux and the incorporation assume the same molecule.
     *
     * @param element group-V element symbol, or null
     * @return the species spelling, for example {@code "As4"}; empty for null or an unknown element
     * @since 0.3
     */
    public static Optional<String> defaultGroupVSpecies(String element) {
        if (element == null) {
            return Optional.empty();
        }
        switch (element) {
            case "As":
                return Optional.of("As4");
            case "Sb":
                return Optional.of("Sb4");
            case "P":
                return Optional.of("P2");
            default:
                return Optional.empty();
        }
    }
}
