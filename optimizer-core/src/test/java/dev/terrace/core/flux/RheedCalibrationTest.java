package dev.terrace.core.flux;

import dev.terrace.core.material.Compound;
import dev.terrace.core.material.Materials;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;

class RheedCalibrationTest {

    private static final Compound GAAS = Materials.compound("GaAs").orElseThrow();

    @Test
    void periodOfOnePointTwoFiveSecondsIsPointEightMonolayersPerSecondOnGaAs() {
        // One RHEED oscillation period = 1 ML = a/2 on GaAs(001) (Harris, Joyce, Dobson, Surf. Sci.
        // 103, L90 (1981); Wood, Surf. Sci. 108, L441 (1981); citations from memory), with
        // a(GaAs, 300 K) = 0.565325 nm (Vurgaftman, Meyer, Ram-Mohan, J. Appl. Phys. 89, 5815 (2001),
        // Table III). Derivation: 1/1.25 s = 0.8 ML/s; 0.8 * 0.2826625 nm = 0.22613 nm/s;
        // * 3600 s/h / 1000 nm/um = 0.81407 um/h; sites 2/a^2 = 2/(0.565325e-7 cm)^2 = 6.2580e14 cm^-2,
        // * 0.8 = 5.0064e14 cm^-2 s^-1.
        GrowthRate g = RheedCalibration.fromPeriod(1.25, GAAS);
        assertEquals(0.8, g.mlPerS(), 1e-12);
        assertEquals(0.2261, g.nmPerS(), 5e-5);
        assertEquals(0.814, g.umPerH(), 5e-4);
        assertEquals(5.006e14, g.atomsPerCm2PerS(), 0.0005e14);
        assertSame(GAAS, g.compound());
    }

    @Test
    void periodOfOneSecondGivesOneMonolayerPerSecondOnGaAs() {
        // Same sources as above. Derivation: 1 ML/s * a/2 = 0.2826625 nm/s; 2/a^2 = 6.2580e14 cm^-2 s^-1;
        // 0.2826625 nm/s * 3.6 = 1.01759 um/h.
        GrowthRate g = RheedCalibration.fromPeriod(1.0, GAAS);
        assertEquals(0.28266, g.nmPerS(), 5e-6);
        assertEquals(6.258e14, g.atomsPerCm2PerS(), 0.0005e14);
        assertEquals(1.0176, g.umPerH(), 5e-5);
    }

    @Test
    void monolayerDependsOnTheCompound() {
        // a(InAs, 300 K) = 0.60583 nm (Vurgaftman, Meyer, Ram-Mohan, J. Appl. Phys. 89, 5815 (2001),
        // Table XIII). Derivation: a/2 = 0.302915 nm; 2/a^2 = 2/(0.60583e-7 cm)^2 = 5.4491e14 cm^-2;
        // 0.302915 nm/s * 3.6 = 1.09049 um/h.
        GrowthRate g = RheedCalibration.fromPeriod(1.0, Materials.compound("InAs").orElseThrow());
        assertEquals(0.30291, g.nmPerS(), 5e-6);
        assertEquals(5.4491e14, g.atomsPerCm2PerS(), 0.00005e14);
        assertEquals(1.0905, g.umPerH(), 5e-5);
    }

    @Test
    void countingPeriodsOverASpanGivesTheMeanPeriod() {
        // Ten periods in 12.5 s is the 1.25 s period of the reference case.
        GrowthRate g = RheedCalibration.fromPeriods(10, 12.5, GAAS);
        assertEquals(0.8, g.mlPerS(), 1e-12);
        assertEquals(0.814, g.umPerH(), 5e-4);
    }

    @Test
    void peakTimesGiveTheLeastSquaresPeriod() {
        // Invented peak times: period 1.25 s, with the second and fourth peaks read 0.05 s late;
        // errors placed symmetrically about the middle peak leave the least-squares slope unchanged.
        double[] t = {2.00, 3.30, 4.50, 5.80, 7.00};
        assertEquals(0.8, RheedCalibration.fromPeakTimes(t, GAAS).mlPerS(), 1e-12);
        double[] two = {1.0, 2.25};
        assertEquals(0.8, RheedCalibration.fromPeakTimes(two, GAAS).mlPerS(), 1e-12);
    }

    @Test
    void rejectsBadPeriodsSpansAndPeakLists() {
        assertThrows(IllegalArgumentException.class, () -> RheedCalibration.fromPeriod(0, GAAS));
        assertThrows(IllegalArgumentException.class, () -> RheedCalibration.fromPeriod(-1, GAAS));
        assertThrows(IllegalArgumentException.class, () -> RheedCalibration.fromPeriod(Double.NaN, GAAS));
        assertThrows(IllegalArgumentException.class, () -> RheedCalibration.fromPeriods(0, 10, GAAS));
        assertThrows(IllegalArgumentException.class, () -> RheedCalibration.fromPeriods(5, 0, GAAS));
        assertThrows(IllegalArgumentException.class, () -> RheedCalibration.fromPeakTimes(new double[] {1.0}, GAAS));
        assertThrows(IllegalArgumentException.class, () -> RheedCalibration.fromPeakTimes(new double[] {1.0, 1.0}, GAAS));
        assertThrows(IllegalArgumentException.class, () -> RheedCalibration.fromPeakTimes(new double[] {2.0, 1.0}, GAAS));
    }

    @Test
    void growthRateRejectsValuesThatDisagreeAcrossUnits() {
        GrowthRate g = GrowthRate.ofMonolayersPerSecond(1.0, GAAS);
        assertThrows(IllegalArgumentException.class,
                () -> new GrowthRate(1.0, 2 * g.nmPerS(), g.umPerH(), g.atomsPerCm2PerS(), GAAS));
        assertThrows(IllegalArgumentException.class,
                () -> new GrowthRate(1.0, g.nmPerS(), g.umPerH(), g.atomsPerCm2PerS() * 1.01, GAAS));
        assertThrows(IllegalArgumentException.class, () -> GrowthRate.ofMonolayersPerSecond(0, GAAS));
    }
}
