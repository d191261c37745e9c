package dev.terrace.core.units;

import dev.terrace.core.material.Materials;
import dev.terrace.spi.Quantity;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

class UnitsTest {

    /** GaAs(001) monolayer height a/2 in nm, from a300 = 5.65325 angstrom (Vurgaftman 2001). */
    private static final double GAAS_ML_NM = Materials.compound("GaAs").orElseThrow().monolayerHeightNm();

    private static Unit unit(String symbol) {
        return Units.bySymbol(symbol).orElseThrow();
    }

    @Test
    void torrIsExactly101325Over760Pascal() {
        // Definition of the torr: 1 atm = 760 Torr = 101325 Pa exactly.
        assertEquals(101325.0, unit("Torr").toCanonical(760, 0), 1e-9);
        assertEquals(133.322368, unit("Torr").toCanonical(1, 0), 1e-6);
        assertEquals(1e-5, unit("Torr").fromCanonical(unit("Torr").toCanonical(1e-5, 0), 0), 1e-18);
    }

    @Test
    void millibarIsOneHundredPascal() {
        // SI: 1 bar = 1e5 Pa exactly, so 1 mbar = 100 Pa; 1 Torr = 1.333224 mbar [derived].
        assertEquals(100.0, unit("mbar").toCanonical(1, 0), 0.0);
        assertEquals(1.333224, unit("mbar").fromCanonical(unit("Torr").toCanonical(1, 0), 0), 1e-6);
    }

    @Test
    void celsiusIsKelvinMinus273Point15() {
        // SI: T/K = t/degC + 273.15. Ga melting point 29.7646 degC = 302.9146 K (ITS-90, from memory).
        assertEquals(298.15, unit("degC").toCanonical(25, 0), 1e-12);
        assertEquals(302.9146, unit("degC").toCanonical(29.7646, 0), 1e-9);
        assertEquals(580.0, unit("degC").fromCanonical(853.15, 0), 1e-9);
    }

    @Test
    void micronsPerHourConvertToMonolayersPerSecondOnGaAsThroughTheMonolayerHeight() {
        // a(GaAs, 300 K) = 0.565325 nm (Vurgaftman, Meyer, Ram-Mohan, J. Appl. Phys. 89, 5815 (2001)).
        // Derivation: 1 ML = a/2 = 0.2826625 nm; 1 ML/s = 0.2826625 nm/s * 3600 s/h / 1000 nm/um
        // = 1.017585 um/h.
        assertEquals(0.2826625, GAAS_ML_NM, 1e-9);
        assertEquals(1.017585, unit("um/h").fromCanonical(1.0, GAAS_ML_NM), 1e-9);
        assertEquals(1.0, unit("um/h").toCanonical(1.017585, GAAS_ML_NM), 1e-6);
        assertEquals(1.0, unit("nm/s").toCanonical(0.2826625, GAAS_ML_NM), 1e-9);
    }

    @Test
    void perSquareMicronIsTenToTheEightPerSquareCentimetre() {
        // 1 cm = 1e4 um, so 1 um^-2 = 1e8 cm^-2.
        assertEquals(1e8, unit("um^-2").toCanonical(1, 0), 0.0);
        assertEquals(250.0, unit("um^-2").fromCanonical(2.5e10, 0), 1e-9);
    }

    @Test
    void minutesAndHoursConvertToSeconds() {
        assertEquals(120.0, unit("min").toCanonical(2, 0), 0.0);
        assertEquals(5400.0, unit("h").toCanonical(1.5, 0), 0.0);
    }

    @Test
    void nanometresOfCoverageBecomeMonolayers() {
        // 1 nm of GaAs = 1/0.2826625 = 3.5378 ML [derived from Vurgaftman 2001 a300].
        Unit nm = Units.forQuantity("nm", Quantity.COVERAGE).orElseThrow();
        assertSame(Units.NM_COVERAGE, nm);
        assertEquals(3.5378, nm.toCanonical(1.0, GAAS_ML_NM), 5e-5);
        assertEquals(0.565325, nm.fromCanonical(2.0, GAAS_ML_NM), 1e-9, "2 ML = 2 a/2");
    }

    @Test
    void lookupsRejectUnknownSymbolsAndWrongQuantities() {
        assertTrue(Units.bySymbol("furlong").isEmpty());
        assertTrue(Units.forQuantity("Torr", Quantity.TEMPERATURE).isEmpty());
        assertTrue(Units.forQuantity("nm", Quantity.LENGTH).isPresent());
        assertTrue(Units.symbolsOf(Quantity.PRESSURE).containsAll(java.util.List.of("Pa", "Torr", "mbar")));
        assertTrue(Units.symbolsOf(Quantity.COVERAGE).contains("nm"));
    }
}
