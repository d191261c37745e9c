package dev.terrace.core.flux;

import dev.terrace.core.material.Compound;
import dev.terrace.core.material.Metal;

import java.util.Objects;

/**
 * Beam fluxes from beam-equivalent pressures (BEP) read on an ion gauge.
 *
 * <p>An ion gauge placed in the beam measures the number density n of beam molecules in its
 * ionisation volume, weighted by their ionisation efficiency &eta; (see {@link IonGauge}). For
 * an effusive beam from a source at temperature T, the flux carried by molecules of density n
 * is J = n v&#772; with v&#772; = sqrt(8 k<sub>B</sub> T / (&pi; m)), the Maxwellian mean
 * speed (kinetic theory, from memory: the density-weighted speed distribution of an effusive
 * beam is the Maxwellian one, so the ratio J/n is exactly that mean). Two consequences:
 *
 * <ul>
 *   <li>Ratios: J_a/J_b = (P_a/P_b) (&eta;_b/&eta;_a) sqrt(T_a M_b / (T_b M_a)). The gauge's
 *       geometry and calibration cancel, leaving the &plusmn;30 % of the ion-gauge electron-count rule
 *       ({@link IonGauge#DEFAULT_RELATIVE_UNCERTAINTY}). This is the usual way MBE growers turn
 *       a BEP ratio into a flux ratio [practice].</li>
 *   <li>Absolute values: n = BEP / (&eta; k<sub>B</sub> T<sub>gauge</sub>), with the gauge's
 *       reading interpreted at its calibration temperature {@link #GAUGE_TEMPERATURE_K}. This is
 *       rough: the gauge's position and cross-section in the beam, its calibration and the
 *       source-to-sample geometry make it uncertain by about a factor of 2
 *       ({@link #ABSOLUTE_UNCERTAINTY_FACTOR}) [practice]. The core uses it only to give growth
 *       models a group-V arrival rate per surface site; a RHEED calibration is better wherever
 *       one exists.</li>
 * </ul>
 *
 * @since 0.1
 */
public final class BeamFlux {

    /** Boltzmann constant in J/K, exact (SI 2019 definition). */
    public static final double BOLTZMANN_J_PER_K = 1.380649e-23;

    /**
     * Temperature at which a gauge reading is turned into a number density, 300 K: ion gauges
     * are calibrated with N2 at room temperature, so the reading P means a density P/(k_B 300 K)
     * of N2-equivalent molecules [practice].
     */
    public static final double GAUGE_TEMPERATURE_K = 300.0;

    /**
     * Factor within which an absolute flux from a single BEP reading is believed to be right, 2:
     * gauge geometry in the beam and calibration make such estimates uncertain by about a factor
     * of 2 [practice].
     */
    public static final double ABSOLUTE_UNCERTAINTY_FACTOR = 2.0;

    /** The ratio formula, as text. */
    public static final String RATIO_FORMULA =
            "J_a/J_b = (P_a/P_b) * (eta_b/eta_a) * sqrt(T_a*M_b/(T_b*M_a)); atoms: times n_a/n_b atoms per molecule";

    /** The absolute-flux formula, as text. */
    public static final String ABSOLUTE_FORMULA =
            "J = BEP/(eta*k_B*T_gauge) * sqrt(8*k_B*T_source/(pi*m)), T_gauge = 300 K; atoms: times atoms per molecule";

    private BeamFlux() {
    }

    /**
     * Ratio of the fluxes of two beams, with the default uncertainty of an uncalibrated gauge.
     *
     * @param a the beam in the numerator; never null
     * @param b the beam in the denominator; never null
     * @return J_a/J_b in molecules and in atoms, &plusmn;{@link IonGauge#DEFAULT_RELATIVE_UNCERTAINTY}; never null
     */
    public static FluxRatio ratio(BeamReading a, BeamReading b) {
        return ratio(a, b, IonGauge.DEFAULT_RELATIVE_UNCERTAINTY);
    }

    /**
     * Ratio of the fluxes of two beams: J_a/J_b = (P_a/P_b) (&eta;_b/&eta;_a) sqrt(T_a M_b / (T_b M_a)).
     *
     * @param a                   the beam in the numerator; never null
     * @param b                   the beam in the denominator; never null
     * @param relativeUncertainty the relative uncertainty to report, in [0, 1), for example
     *                            smaller than 0.30 when both sensitivities were calibrated
     * @return J_a/J_b in molecules and in atoms; never null
     */
    public static FluxRatio ratio(BeamReading a, BeamReading b, double relativeUncertainty) {
        Objects.requireNonNull(a, "a");
        Objects.requireNonNull(b, "b");
        double molecules = (a.bepPa() / b.bepPa()) * (b.sensitivity() / a.sensitivity())
                * Math.sqrt(a.sourceTemperatureK() * b.species().molarMass()
                / (b.sourceTemperatureK() * a.species().molarMass()));
        double atoms = molecules * a.species().atoms() / b.species().atoms();
        return new FluxRatio(molecules, atoms, relativeUncertainty, RATIO_FORMULA);
    }

    /**
     * The V/III ratio: the group-V to group-III flux ratio, counted in molecules and in atoms
     * (molecule ratio times atoms per group-V molecule over atoms per group-III molecule).
     *
     * @param groupV   the group-V beam; never null
     * @param groupIII the group-III beam; never null
     * @return the ratio, &plusmn;{@link IonGauge#DEFAULT_RELATIVE_UNCERTAINTY}; never null
     * @throws IllegalArgumentException when the beams are not a group-V and a group-III beam
     */
    public static FluxRatio vToIii(BeamReading groupV, BeamReading groupIII) {
        if (!groupV.species().isGroupV()) {
            throw new IllegalArgumentException(groupV.species() + " is not a group-V species");
        }
        if (groupIII.species().isGroupV()) {
            throw new IllegalArgumentException(groupIII.species() + " is not a group-III species");
        }
        return ratio(groupV, groupIII);
    }

    /**
     * Mean speed of the molecules of a species at a temperature, sqrt(8 k_B T / (&pi; m)).
     *
     * @param species      the species; never null
     * @param temperatureK the temperature in K; positive
     * @return the mean speed in m/s
     */
    public static double meanSpeed(Species species, double temperatureK) {
        if (!(temperatureK > 0) || !Double.isFinite(temperatureK)) {
            throw new IllegalArgumentException("temperature must be positive and finite, got " + temperatureK);
        }
        double massKg = species.molarMass() * 1e-3 / Metal.AVOGADRO;
        return Math.sqrt(8 * BOLTZMANN_J_PER_K * temperatureK / (Math.PI * massKg));
    }

    /**
     * Rough absolute flux of one beam from its BEP: n = BEP/(&eta; k_B T_gauge),
     * J_molecules = n sqrt(8 k_B T_source/(&pi; m)), J_atoms = J_molecules times atoms per molecule.
     *
     * @param beam the reading; never null
     * @return the flux, uncertain by a factor {@link #ABSOLUTE_UNCERTAINTY_FACTOR}; never null
     */
    public static AtomFlux absolute(BeamReading beam) {
        Objects.requireNonNull(beam, "beam");
        double densityPerM3 = beam.bepPa() / (beam.sensitivity() * BOLTZMANN_J_PER_K * GAUGE_TEMPERATURE_K);
        double moleculesPerM2PerS = densityPerM3 * meanSpeed(beam.species(), beam.sourceTemperatureK());
        double molecules = moleculesPerM2PerS * 1e-4;
        return new AtomFlux(beam.species(), molecules, molecules * beam.species().atoms(),
                ABSOLUTE_UNCERTAINTY_FACTOR, ABSOLUTE_FORMULA);
    }

    /**
     * Rough arrival rate of atoms per (001) surface site per second for a beam given only by
     * species and BEP, at the species' default source temperature and with the ion-gauge electron-count sensitivity.
     * This is what growth models use for the group-V supply.
     *
     * @param species  the beam species; never null
     * @param bepPa    the beam-equivalent pressure in Pa; positive
     * @param compound the surface; never null
     * @return atoms per site per second, uncertain by a factor {@link #ABSOLUTE_UNCERTAINTY_FACTOR}
     */
    public static double arrivalPerSite(Species species, double bepPa, Compound compound) {
        return absolute(BeamReading.of(species, bepPa)).perSite(compound);
    }
}
