package dev.terrace.core.material;

import java.util.Objects;

/**
 * A zinc-blende III-V compound with its lattice constant.
 *
 * @param name      formula, for example {@code "GaAs"}; never blank
 * @param a300      lattice constant at 300 K in angstrom; positive
 * @param dadT      linear thermal coefficient of the lattice constant in angstrom per kelvin
 * @param groupIII  the group-III element
 * @param groupV    the group-V element
 * @param source    where the numbers come from; never blank
 * @since 0.1
 */
public record Compound(String name, double a300, double dadT, String groupIII, String groupV, String source) {

    /** Checks the invariants. */
    public Compound {
        Objects.requireNonNull(name);
        Objects.requireNonNull(source);
        if (!(a300 > 0)) {
            throw new IllegalArgumentException("lattice constant must be positive");
        }
    }

    /**
     * @param temperatureK temperature in K
     * @return the lattice constant at that temperature in angstrom, a(T) = a300 + dadT (T - 300 K)
     */
    public double latticeConstant(double temperatureK) {
        return a300 + dadT * (temperatureK - 300.0);
    }

    /** @return the height of one (001) monolayer, a/2, in nm, at 300 K */
    public double monolayerHeightNm() {
        return a300 / 2.0 / 10.0;
    }

    /**
     * @return group-III atoms per nm^3 in the crystal at 300 K, 4/a^3 (four cations in the cubic cell of
     *         zinc blende)
     */
    public double cationsPerNm3() {
        double aNm = a300 / 10.0;
        return 4.0 / (aNm * aNm * aNm);
    }

    /** @return the number of surface sites per (001) monolayer, 2/a^2, in cm^-2, at 300 K */
    public double sitesPerCm2() {
        double aCm = a300 * 1e-8;
        return 2.0 / (aCm * aCm);
    }
}
