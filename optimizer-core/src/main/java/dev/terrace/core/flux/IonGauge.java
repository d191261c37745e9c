package dev.terrace.core.flux;

/**
 * Relative sensitivity of a hot-cathode (Bayard-Alpert) ion gauge to the molecules of a beam.
 *
 * <p>An ion gauge counts ions made by electron impact, so its reading is proportional to the
 * number density of molecules in its ionisation volume times their ionisation efficiency
 * &eta;. Gauges are calibrated for N2; for another species the reading must be divided by
 * &eta;/&eta;<sub>N2</sub>. Terrace uses a rule linear in the electrons per molecule (Dushman and
 * Found (1921) found the sensitivity to grow with the electrons per molecule):
 *
 * <pre>    &eta;/&eta;<sub>N2</sub> = 0.6 (Z/14) + 0.4</pre>
 *
 * where Z is the total number of electrons in the molecule and 14 is Z for N2.
 *
 * <p><b>Why these coefficients.</b> Two forms circulate in MBE practice, 0.4 Z/14 + 0.6 and
 * 0.6 Z/14 + 0.4; for an As4/Ga beam-pressure ratio they differ by 19 % in the V/III ratio. The
 * statement of the rule in its usual attribution, R. L. Summers, NASA Technical Note D-5285 (1969),
 * "Empirical Observations on the Sensitivity of Hot Cathode Ionization Type Vacuum Gages", was not
 * read here, so the choice rests on measured sensitivities instead:
 * <ul>
 *   <li>Summers' compiled measured sensitivities relative to N2 (as tabulated from that report in a
 *       vacuum-instrument manual): Ar 1.2, Kr 1.7, CO2 1.4, N2O 1.7, NO 1.2, CO 1.05, O2 1.0,
 *       Br2 3.8, HI 3.1. The 0.6/0.4 form has an rms log error of 0.12 on these, the 0.4/0.6 form
 *       0.22; the 0.6/0.4 form is closer for six of the nine (tied for CO, farther for Kr and O2).</li>
 *   <li>The CRC Handbook of Chemistry and Physics table of Bayard-Alpert relative sensitivities
 *       (averages of twelve experimenters, section 15): for the heavy atoms Kr 1.9, Xe 2.7 and Hg 3.5,
 *       the beam-like species closest to Ga, In and As, the 0.6/0.4 form is within 10 % (+2 %, +1 %,
 *       +9 %) while the 0.4/0.6 form is 14-21 % low. Its worst case is SF6 (+48 %).</li>
 * </ul>
 *
 * <p>How good is it? Against the CRC table the rule gives Ar 1.17 against 1.4 and Hg 3.83 against
 * 3.5, and the table itself shows a gauge-to-gauge spread of about &plusmn;15 %. Hence
 * {@link #DEFAULT_RELATIVE_UNCERTAINTY}: a flux ratio derived from beam-equivalent pressures is good
 * to about &plusmn;30 % unless the gauge has been calibrated for these species (for example against
 * RHEED growth rates). The rule fails for light gases (He, H2), which do not occur in III-V beams.
 *
 * @since 0.1
 */
public final class IonGauge {

    /**
     * Slope of the linear electron-count rule, 0.6: of the two forms in circulation, the one closer
     * to Summers' compiled measured sensitivities (NASA TN D-5285 (1969)) and to the CRC Handbook
     * Bayard-Alpert averages for heavy atoms; see the class description.
     */
    public static final double SUMMERS_SLOPE = 0.6;

    /** Intercept of the linear electron-count rule, 0.4 (so that N2, Z = 14, gives exactly 1). */
    public static final double SUMMERS_INTERCEPT = 0.4;

    /** The other form in circulation, 0.4 Z/14 + 0.6, kept for comparison in reports and tests: slope. */
    public static final double ALTERNATIVE_SLOPE = 0.4;

    /** The other form in circulation: intercept. */
    public static final double ALTERNATIVE_INTERCEPT = 0.6;

    /** Electrons in one N2 molecule, the calibration gas of ion gauges: 2 x 7 = 14. */
    public static final int N2_ELECTRONS = 14;

    /**
     * Relative uncertainty of a quantity derived from ion-gauge readings of different species
     * with the electron-count rule, 0.30, for an uncalibrated gauge. It covers the rule's error
     * against the CRC Handbook table of Bayard-Alpert relative sensitivities (Ar -16 %, Hg +9 %)
     * plus the &plusmn;15 % gauge-to-gauge spread that table shows.
     */
    public static final double DEFAULT_RELATIVE_UNCERTAINTY = 0.30;

    /**
     * Gauge-to-gauge spread of relative sensitivities, 0.15, as seen in the CRC Handbook table of
     * Bayard-Alpert relative sensitivities (averages of twelve experimenters).
     */
    public static final double GAUGE_TO_GAUGE_SPREAD = 0.15;

    /** Summers' rule as text, for reports. */
    public static final String SUMMERS_FORMULA =
            "eta/eta_N2 = 0.6*(Z/14) + 0.4 (linear in electrons per molecule; checked against Summers' measured "
                    + "sensitivities, NASA TN D-5285, 1969)";

    private IonGauge() {
    }

    /**
     * Relative ionisation efficiency for a molecule with a given number of electrons.
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
     * The other form in circulation, {@code 0.4 Z/14 + 0.6}, for comparison only.
     *
     * @param electronsPerMolecule Z; positive
     * @return &eta;/&eta;<sub>N2</sub> by that form
     */
    public static double alternativeRelativeSensitivity(int electronsPerMolecule) {
        if (electronsPerMolecule <= 0) {
            throw new IllegalArgumentException("electrons per molecule must be positive, got " + electronsPerMolecule);
        }
        return ALTERNATIVE_SLOPE * electronsPerMolecule / N2_ELECTRONS + ALTERNATIVE_INTERCEPT;
    }

    /**
     * Relative ionisation efficiency for a beam species.
     *
     * @param species the species; never null
     * @return &eta;/&eta;<sub>N2</sub>, always positive
     */
    public static double relativeSensitivity(Species species) {
        return relativeSensitivity(species.electrons());
    }
}
