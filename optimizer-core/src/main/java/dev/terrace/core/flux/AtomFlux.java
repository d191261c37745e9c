package dev.terrace.core.flux;

import dev.terrace.core.material.Compound;

import java.util.Objects;

/**
 * A rough absolute flux of one beam at the sample, estimated from its beam-equivalent pressure.
 *
 * @param species              the beam species; never null
 * @param moleculesPerCm2PerS  molecules arriving per cm^2 per s; positive and finite
 * @param atomsPerCm2PerS      atoms arriving per cm^2 per s (molecules times atoms per
 *                             molecule); positive and finite
 * @param uncertaintyFactor    the true flux is believed to lie within value/f and value*f; at least 1
 * @param formula              the formula used, as text; never null
 * @since 0.1
 */
public record AtomFlux(Species species, double moleculesPerCm2PerS, double atomsPerCm2PerS,
                       double uncertaintyFactor, String formula) {

    /** Checks the invariants. */
    public AtomFlux {
        Objects.requireNonNull(species, "species");
        Objects.requireNonNull(formula, "formula");
        if (!(moleculesPerCm2PerS > 0) || !Double.isFinite(moleculesPerCm2PerS)
                || !(atomsPerCm2PerS > 0) || !Double.isFinite(atomsPerCm2PerS)) {
            throw new IllegalArgumentException("fluxes must be positive and finite, got "
                    + moleculesPerCm2PerS + " and " + atomsPerCm2PerS);
        }
        if (!(uncertaintyFactor >= 1) || !Double.isFinite(uncertaintyFactor)) {
            throw new IllegalArgumentException("uncertainty factor must be at least 1, got " + uncertaintyFactor);
        }
    }

    /**
     * Atoms arriving per surface site per second.
     *
     * @param sitesPerCm2 surface sites per cm^2, for example 2/a^2 for a (001) zinc-blende surface; positive
     * @return atoms per site per second; positive and finite
     */
    public double perSite(double sitesPerCm2) {
        if (!(sitesPerCm2 > 0) || !Double.isFinite(sitesPerCm2)) {
            throw new IllegalArgumentException("sites per cm^2 must be positive and finite, got " + sitesPerCm2);
        }
        return atomsPerCm2PerS / sitesPerCm2;
    }

    /**
     * Atoms arriving per (001) surface site per second on a compound, using its 2/a^2 sites per
     * cm^2 at 300 K. For a group-III beam this is the growth rate in ML/s it would give with unit
     * sticking.
     *
     * @param compound the surface; never null
     * @return atoms per site per second; positive and finite
     */
    public double perSite(Compound compound) {
        return perSite(compound.sitesPerCm2());
    }
}
