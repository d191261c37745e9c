package dev.terrace.core.flux;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class IonGaugeTest {

    /** Tolerance of the check values (exact Summers-rule arithmetic to 1e-6). */
    private static final double ROUNDING = 1e-6;

    @Test
    void summersRuleGivesTheTabulatedSensitivities() {
        // Summers' rule, eta/eta_N2 = 0.4 Z/14 + 0.6 (R. L. Summers, "Empirical observations on the
        // sensitivity of hot cathode ionization type vacuum gages", NASA TN D-5285 (1969); the report
        // is confirmed, the coefficients 0.4 and 0.6 are from memory). Z = electrons per molecule
        // (atomic numbers Al 13, Ga 31, In 49, P 15, As 33, Sb 51). Arithmetic, rounded to 3 decimals:
        // Al 0.4*13/14+0.6 = 0.9714; Ga 0.4*31/14+0.6 = 1.4857; In 0.4*49/14+0.6 = 2.0000;
        // As 0.4*33/14+0.6 = 1.5429; As2 (Z 66) 2.4857; As4 (Z 132) 4.3714; Sb 2.0571;
        // Sb4 (Z 204) 6.4286; P2 (Z 30) 1.4571; P4 (Z 60) 2.3143.
        assertEquals(0.971429, IonGauge.relativeSensitivity(Species.Al), ROUNDING, "Al");
        assertEquals(1.485714, IonGauge.relativeSensitivity(Species.Ga), ROUNDING, "Ga");
        assertEquals(2.0, IonGauge.relativeSensitivity(Species.In), ROUNDING, "In");
        assertEquals(1.542857, IonGauge.relativeSensitivity(Species.As), ROUNDING, "As");
        assertEquals(2.485714, IonGauge.relativeSensitivity(Species.As2), ROUNDING, "As2");
        assertEquals(4.371429, IonGauge.relativeSensitivity(Species.As4), ROUNDING, "As4");
        assertEquals(2.057143, IonGauge.relativeSensitivity(Species.Sb), ROUNDING, "Sb");
        assertEquals(6.428571, IonGauge.relativeSensitivity(Species.Sb4), ROUNDING, "Sb4");
        assertEquals(1.457143, IonGauge.relativeSensitivity(Species.P2), ROUNDING, "P2");
        assertEquals(2.314286, IonGauge.relativeSensitivity(Species.P4), ROUNDING, "P4");
    }

    @Test
    void nitrogenHasUnitSensitivity() {
        // By definition of a gauge calibrated for N2 (Z = 14).
        assertEquals(1.0, IonGauge.relativeSensitivity(IonGauge.N2_ELECTRONS), 1e-12);
    }

    @Test
    void summersRuleStaysWithinThirtyPercentOfMeasuredBayardAlpertSensitivities() {
        // CRC Handbook of Chemistry and Physics, section 15 (vacuum technology), table of relative
        // sensitivities of Bayard-Alpert ionization gauges to various gases, averages over 12
        // experimenters (edition not recorded; values read in a copy of the table):
        // Ar 1.4 (Z 18), Hg 3.5 (Z 80), O2 0.96 (Z 16), CO 1.0 (Z 14), CO2 1.4 (Z 22).
        // Summers' formula gives Ar 0.4*18/14+0.6 = 1.114 and Hg 0.4*80/14+0.6 = 2.886.
        assertEquals(1.114286, IonGauge.relativeSensitivity(18), 1e-6, "Ar by the formula");
        assertEquals(2.885714, IonGauge.relativeSensitivity(80), 1e-6, "Hg by the formula");
        int[] z = {18, 80, 16, 14, 22};
        double[] measured = {1.4, 3.5, 0.96, 1.0, 1.4};
        for (int i = 0; i < z.length; i++) {
            double relativeError = Math.abs(IonGauge.relativeSensitivity(z[i]) / measured[i] - 1);
            assertTrue(relativeError <= IonGauge.DEFAULT_RELATIVE_UNCERTAINTY,
                    "Z = " + z[i] + ": formula off by " + relativeError);
        }
    }

    @Test
    void rejectsNonPositiveElectronCounts() {
        assertThrows(IllegalArgumentException.class, () -> IonGauge.relativeSensitivity(0));
        assertThrows(IllegalArgumentException.class, () -> IonGauge.relativeSensitivity(-3));
    }
}
