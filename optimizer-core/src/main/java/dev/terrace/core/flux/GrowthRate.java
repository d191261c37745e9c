package dev.terrace.core.flux;

import dev.terrace.core.material.Compound;

import java.util.Objects;

/**
 * A growth rate of a zinc-blende (001) film, in the units growers use.
 *
 * <p>One (001) monolayer (ML) is one cation plane plus one anion plane, a/2 thick, with 2/a^2
 * atoms of each kind per unit area; the lattice constant is the compound's 300 K value (at a
 * typical growth temperature a is larger by about 0.4 %, well below the precision of a rate
 * calibration).
 *
 * @param mlPerS          monolayers per second; positive and finite
 * @param nmPerS          nanometres per second, ML/s times a/2; positive and finite
 * @param umPerH          micrometres per hour, nm/s times 3.6; positive and finite
 * @param atomsPerCm2PerS atoms of either sublattice incorporated per cm^2 per s, ML/s times
 *                        2/a^2 (the group-III flux when all of it sticks); positive and finite
 * @param compound        the film; never null
 * @since 0.1
 */
public record GrowthRate(double mlPerS, double nmPerS, double umPerH, double atomsPerCm2PerS, Compound compound) {

    /** Relative tolerance for the consistency check between the four units. */
    private static final double CONSISTENCY = 1e-9;

    /** Checks that the values are positive, finite and agree with each other for the compound. */
    public GrowthRate {
        Objects.requireNonNull(compound, "compound");
        for (double v : new double[] {mlPerS, nmPerS, umPerH, atomsPerCm2PerS}) {
            if (!(v > 0) || !Double.isFinite(v)) {
                throw new IllegalArgumentException("growth rates must be positive and finite, got " + v);
            }
        }
        if (!close(nmPerS, mlPerS * compound.monolayerHeightNm())
                || !close(umPerH, nmPerS * 3.6)
                || !close(atomsPerCm2PerS, mlPerS * compound.sitesPerCm2())) {
            throw new IllegalArgumentException("growth rates in different units disagree for " + compound.name());
        }
    }

    /**
     * A growth rate from monolayers per second.
     *
     * @param mlPerS   monolayers per second; positive and finite
     * @param compound the film; never null
     * @return the rate in every unit; never null
     */
    public static GrowthRate ofMonolayersPerSecond(double mlPerS, Compound compound) {
        Objects.requireNonNull(compound, "compound");
        double nmPerS = mlPerS * compound.monolayerHeightNm();
        return new GrowthRate(mlPerS, nmPerS, nmPerS * 3.6, mlPerS * compound.sitesPerCm2(), compound);
    }

    private static boolean close(double a, double b) {
        return Math.abs(a - b) <= CONSISTENCY * Math.max(Math.abs(a), Math.abs(b));
    }
}
