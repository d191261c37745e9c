package dev.terrace.models;

import java.util.Map;

/**
 * Test helper: the rough beam-equivalent-pressure to atom-flux conversion that the core uses, kept here
 * because the plugins may not depend on the core.
 *
 * <p>The ion gauge measures the beam's number density, {@code n = BEP/(eta·k_B·T_gauge)} with the Summers
 * sensitivity relative to N2, {@code eta = 0.6·Z/14 + 0.4} (the form of the electron-count rule closer to
 * the measured sensitivities compiled by R. L. Summers, NASA TN D-5285 (1969); see the core's IonGaugeTest), {@code Z} the electrons per molecule and {@code T_gauge = 300 K}.
 * The molecule flux is {@code n·sqrt(8 k_B T_source/(π m))}, the atom flux that times the atoms per
 * molecule. Source temperatures: 600 K for tetramers and 1150 K for cracked dimers (common practice).
 */
final class RoughBeamFlux {

    /** Boltzmann constant in J/K, exact in the 2019 SI. */
    static final double BOLTZMANN_J_PER_K = 1.380649e-23;

    /** Atomic mass constant in kg, CODATA 2018. */
    static final double ATOMIC_MASS_KG = 1.66053906660e-27;

    /** Pascal per torr, exact (101325/760). */
    static final double PA_PER_TORR = 101325.0 / 760.0;

    /** Gauge (room) temperature, K. */
    static final double GAUGE_K = 300;

    /** Source temperature of tetramer beams, K (common practice). */
    static final double TETRAMER_SOURCE_K = 600;

    /** Source (cracker) temperature of dimer beams, K (common practice). */
    static final double DIMER_SOURCE_K = 1150;

    /** Atomic numbers and IUPAC standard atomic weights of the group-V elements and Ga. */
    private static final Map<String, double[]> ELEMENTS = Map.of(
            "As", new double[] {33, 74.921595},
            "Sb", new double[] {51, 121.760},
            "P", new double[] {15, 30.973762},
            "Ga", new double[] {31, 69.723});

    private RoughBeamFlux() {
    }

    /**
     * Ion-gauge sensitivity relative to N2 by the electron-count rule.
     *
     * @param electrons electrons per molecule
     * @return eta
     */
    static double ionisationEfficiency(double electrons) {
        return 0.6 * electrons / 14.0 + 0.4;
    }

    /**
     * Molecule flux of a beam.
     *
     * @param bepTorr   flux-gauge reading in Torr
     * @param electrons electrons per molecule
     * @param massAmu   molecular mass in u
     * @param sourceK   source temperature in K
     * @return molecules cm^-2 s^-1
     */
    static double moleculeFlux(double bepTorr, double electrons, double massAmu, double sourceK) {
        double n = bepTorr * PA_PER_TORR / (ionisationEfficiency(electrons) * BOLTZMANN_J_PER_K * GAUGE_K);
        double speed = Math.sqrt(8 * BOLTZMANN_J_PER_K * sourceK / (Math.PI * massAmu * ATOMIC_MASS_KG));
        return n * speed * 1e-4;
    }

    /**
     * Atom flux of a group-V beam given as, for example, {@code "As4"} or {@code "Sb2"}.
     *
     * @param bepTorr flux-gauge reading in Torr
     * @param species element symbol followed by the atoms per molecule (2 or 4)
     * @return atoms cm^-2 s^-1
     */
    static double atomFlux(double bepTorr, String species) {
        String element = species.replaceAll("\\d", "");
        int atoms = Integer.parseInt(species.substring(element.length()));
        double[] e = ELEMENTS.get(element);
        double source = atoms == 4 ? TETRAMER_SOURCE_K : DIMER_SOURCE_K;
        return atoms * moleculeFlux(bepTorr, atoms * e[0], atoms * e[1], source);
    }

    /**
     * Atom flux of a Ga beam.
     *
     * @param bepTorr flux-gauge reading in Torr
     * @param sourceK cell temperature in K
     * @return atoms cm^-2 s^-1
     */
    static double galliumFlux(double bepTorr, double sourceK) {
        double[] e = ELEMENTS.get("Ga");
        return moleculeFlux(bepTorr, e[0], e[1], sourceK);
    }
}
