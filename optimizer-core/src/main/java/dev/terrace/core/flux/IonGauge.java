package dev.terrace.core.flux;

/**
 * Relative sensitivity of a hot-cathode (Bayard-Alpert) ion gauge to the molecules of a beam.
 *
 * <p>An ion gauge counts ions made by electron impact, so its reading is proportional to the
 * number density of molecules in its ionisation volume times their ionisation efficiency
 * &eta;. Gauges are calibrated for N2; for another species the reading must be divided by
 * &eta;/&eta;<sub>N2</sub>. Terrace uses the empirical rule of R. L. Summers, NASA Technical
 * Note D-5285 (1969), "Empirical Observations on the Sensitivity of Hot Cathode Ionization
 * Type Vacuum Gages":
 *
 * <pre>    &eta;/&eta;<sub>N2</sub> = 0.4 (Z/14) + 0.6</pre>
 *
 * where Z is the total number of electrons in the molecule and 14 is Z for N2. The
 * coefficients 0.4 and 0.6 are quoted here from memory, as they are widely quoted in MBE
 * practice; the report itself was not re-read. Dushman and Found (1921) had already found the
 * sensitivity to grow with the electrons per molecule.
 *
 * <p>How good is it? Against the CRC Handbook of Chemistry and Physics table of measured
 * Bayard-Alpert relative sensitivities (averages of twelve experimenters) the rule gives Ar
 * 1.11 against 1.4 and Hg 2.89 against 3.5, and the table itself shows a gauge-to-gauge spread
 * of about &plusmn;15 %. Hence {@link #DEFAULT_RELATIVE_UNCERTAINTY}: a flux ratio derived
 * from beam-equivalent pressures is good to about &plusmn;30 % unless the gauge has been
 * calibrated for these species (for example against RHEED growth rates). The rule fails for
 * light gases (He, H2), which do not occur in III-V beams.
 *
 * @since 0.1
 */
public final class IonGauge {

    /**
     * Slope of Summers' rule, 0.4 (R. L. Summers, NASA TN D-5285 (1969); coefficient from
     * memory, widely quoted).
     */
    public static final double SUMMERS_SLOPE = 0.4;

    /**
     * Intercept of Summers' rule, 0.6 (R. L. Summers, NASA TN D-5285 (1969); coefficient from
     * memory, widely quoted).
     */
    public static final double SUMMERS_INTERCEPT = 0.6;

    /** Electrons in one N2 molecule, the calibration gas of ion gauges: 2 x 7 = 14. */
    public static final int N2_ELECTRONS = 14;

    /**
     * Relative uncertainty of a quantity derived from ion-gauge readings of different species
     * with Summers' rule, 0.30, for an uncalibrated gauge. It covers the rule's error against the
     * CRC Handbook table of Bayard-Alpert relative sensitivities (Ar -20 %, Hg -18 %) plus the
     * &plusmn;15 % gauge-to-gauge spread that table shows.
     */
    public static final double DEFAULT_RELATIVE_UNCERTAINTY = 0.30;

    /**
     * Gauge-to-gauge spread of relative sensitivities, 0.15, as seen in the CRC Handbook table of
     * Bayard-Alpert relative sensitivities (averages of twelve experimenters).
     */
    public static final double GAUGE_TO_GAUGE_SPREAD = 0.15;

    /** Summers' rule as text, for reports. */
    public static final String SUMMERS_FORMULA = "eta/eta_N2 = 0.4*(Z/14) + 0.6 (Summers, NASA TN D-5285, 1969)";

    private IonGauge() {
    }

    /**
     * Summers' relative ionisation efficiency for a molecule with a given number of electrons.
     *
     * @param electronsPerMolecule Z, the total electrons in one molecule; positive
     * @return &eta;/&eta;<sub>N2</sub>, always positive
     * @throws IllegalArgumentException when Z is not positive
     */
    public static double relativeSensitivity(int electronsPerMolecule) {
        if (electronsPerMolecule <= 0) {
            throw new IllegalArgumentException("electrons per molecule must be positive, got " + electronsPerMolecule);
        }
        return SUMMERS_SLOPE * electronsPerMolecule / N2_ELECTRONS + SUMMERS_INTERCEPT;
    }

    /**
     * Summers' relative ionisation efficiency for a beam species.
     *
     * @param species the species; never null
     * @return &eta;/&eta;<sub>N2</sub>, always positive
     */
    public static double relativeSensitivity(Species species) {
        return relativeSensitivity(species.electrons());
    }
}
