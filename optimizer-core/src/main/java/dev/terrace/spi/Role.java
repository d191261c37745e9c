package dev.terrace.spi;

import java.util.Arrays;
import java.util.Optional;

/**
 * The physical meaning of a campaign column, the link between a grower's column names and
 * what growth models understand.
 *
 * <p>The {@link #key()} is what a campaign file writes after {@code role:}; it is part of
 * the campaign format and never changes once released.
 *
 * @since 0.1
 */
public enum Role {
    /** Substrate temperature during deposition. */
    SUBSTRATE_TEMPERATURE("substrate_temperature", Quantity.TEMPERATURE, Kind.SETTING),
    /** Amount of deposited metal or film. */
    COVERAGE("coverage", Quantity.COVERAGE, Kind.SETTING),
    /** Deposition rate of the group-III metal or film. */
    DEPOSITION_RATE("deposition_rate", Quantity.DEPOSITION_RATE, Kind.SETTING),
    /** Group-V beam-equivalent pressure read on the flux gauge. */
    GROUP_V_BEP("group_v_bep", Quantity.PRESSURE, Kind.SETTING),
    /** Group-V atom flux, when the lab has calibrated it directly. */
    GROUP_V_FLUX("group_v_flux", Quantity.PARTICLE_FLUX, Kind.SETTING),
    /** Group-V molecular species leaving the cell or cracker (As2, As4, Sb2, P2, ...). */
    GROUP_V_SPECIES("group_v_species", Quantity.CATEGORY, Kind.SETTING),
    /** Substrate temperature while droplets are exposed to the group-V flux. */
    CRYSTALLIZATION_TEMPERATURE("crystallization_temperature", Quantity.TEMPERATURE, Kind.SETTING),
    /** Post-growth anneal temperature. */
    ANNEAL_TEMPERATURE("anneal_temperature", Quantity.TEMPERATURE, Kind.SETTING),
    /** Post-growth anneal duration. */
    ANNEAL_TIME("anneal_time", Quantity.TIME, Kind.SETTING),
    /** Substrate miscut angle from the nominal orientation. */
    MISCUT_ANGLE("miscut_angle", Quantity.ANGLE, Kind.SETTING),
    /** Surfactant (for example Bi or Sb) pre-coverage. */
    SURFACTANT_COVERAGE("surfactant_coverage", Quantity.COVERAGE, Kind.SETTING),
    /** Measured island, droplet or dot density. */
    ISLAND_DENSITY("island_density", Quantity.AREAL_DENSITY, Kind.OUTCOME),
    /** Measured island, dot or ring diameter. */
    ISLAND_DIAMETER("island_diameter", Quantity.LENGTH, Kind.OUTCOME),
    /** Measured island or dot height. */
    ISLAND_HEIGHT("island_height", Quantity.LENGTH, Kind.OUTCOME),
    /** Observed morphology class after crystallisation (dot, ring, disk, hole). */
    MORPHOLOGY("morphology", Quantity.CLASS, Kind.OUTCOME),
    /** Observed growth mode (step-flow or islands). */
    GROWTH_MODE("growth_mode", Quantity.CLASS, Kind.OUTCOME);

    /** Whether a role describes a recipe setting or a measured outcome. */
    public enum Kind {
        /** Set by the grower before or during the run. */
        SETTING,
        /** Measured after the run. */
        OUTCOME
    }

    private final String key;
    private final Quantity quantity;
    private final Kind kind;

    Role(String key, Quantity quantity, Kind kind) {
        this.key = key;
        this.quantity = quantity;
        this.kind = kind;
    }

    /** @return the campaign-file spelling of this role; never null */
    public String key() {
        return key;
    }

    /** @return the physical quantity a column with this role carries; never null */
    public Quantity quantity() {
        return quantity;
    }

    /** @return whether this role is a setting or an outcome; never null */
    public Kind kind() {
        return kind;
    }

    /**
     * Looks a role up by its campaign-file key.
     *
     * @param key the key, for example {@code "substrate_temperature"}
     * @return the role, or empty when no role has that key
     */
    public static Optional<Role> byKey(String key) {
        return Arrays.stream(values()).filter(r -> r.key.equals(key)).findFirst();
    }
}
