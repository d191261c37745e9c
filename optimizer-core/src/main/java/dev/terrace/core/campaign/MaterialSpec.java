package dev.terrace.core.campaign;

import java.util.Objects;

/**
 * The campaign's {@code material} section, as keys into the material table.
 *
 * @param substrate the substrate (or grown film) compound, for example {@code "GaAs"}; never null
 * @param deposit   the deposited metal, or null for film growth
 * @param groupV    the group-V element, or null
 * @since 0.1
 */
public record MaterialSpec(String substrate, String deposit, String groupV) {
    /** Checks the invariants. */
    public MaterialSpec {
        Objects.requireNonNull(substrate, "substrate");
    }
}
