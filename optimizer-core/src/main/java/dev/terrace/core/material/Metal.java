package dev.terrace.core.material;

import java.util.Objects;

/**
 * A metal that can be deposited as droplets.
 *
 * @param symbol           element symbol, for example {@code "Ga"}
 * @param meltingK         melting point in K
 * @param liquidDensity    density of the liquid near the melting point in g/cm^3
 * @param molarMass        molar mass in g/mol
 * @param electrons        atomic number (electrons per atom), for ion-gauge sensitivity
 * @param supercoolingLimitK lowest temperature in K at which droplets of this metal are still taken as a
 *                         (supercooled) liquid, equal to {@code meltingK} when no margin is published
 * @param source           where the numbers come from, the supercooling margin included
 * @since 0.1
 */
public record Metal(String symbol, double meltingK, double liquidDensity, double molarMass, int electrons,
                    double supercoolingLimitK, String source) {

    /** Avogadro constant in mol^-1, exact (SI 2019). */
    public static final double AVOGADRO = 6.02214076e23;

    /** Checks the invariants. */
    public Metal {
        Objects.requireNonNull(symbol);
        Objects.requireNonNull(source);
        if (!(meltingK > 0 && liquidDensity > 0 && molarMass > 0 && electrons > 0)) {
            throw new IllegalArgumentException("bad data for metal " + symbol);
        }
        if (!(supercoolingLimitK > 0 && supercoolingLimitK <= meltingK)) {
            throw new IllegalArgumentException("supercooling limit of " + symbol + " must lie in (0 K, melting point]");
        }
    }

    /** @return how far below the melting point droplets are still taken as liquid, in K (0 when no margin) */
    public double supercoolingMarginK() {
        return meltingK - supercoolingLimitK;
    }

    /** @return atoms per nm^3 in the liquid: rho N_A / M, converted from cm^-3 */
    public double liquidAtomsPerNm3() {
        return liquidDensity * AVOGADRO / molarMass * 1e-21;
    }
}
