package dev.terrace.core.material;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class MaterialsTest {

    /** 1 um/h expressed in nm/s: 1000 nm / 3600 s. */
    private static final double NM_PER_S_PER_UM_PER_H = 1000.0 / 3600.0;

    /**
     * Lattice constants at 300 K: Vurgaftman, Meyer, Ram-Mohan, J. Appl. Phys. 89, 5815 (2001),
     * as tabulated in the project's reference file (physics check values, section 4); the other
     * columns are [derived] there: ML height a/2 (nm), sites 2/a^2 (cm^-2), um/h per ML/s.
     */
    private static final Object[][] TABLE = {
        {"GaAs", 5.65325, 0.28266, 6.2580e14, 1.0176},
        {"AlAs", 5.6611, 0.28306, 6.2406e14, 1.0190},
        {"InAs", 6.0583, 0.30291, 5.4491e14, 1.0905},
        {"GaSb", 6.0959, 0.30480, 5.3821e14, 1.0973},
        {"InP", 5.8697, 0.29348, 5.8049e14, 1.0565},
        {"InSb", 6.4794, 0.32397, 4.7639e14, 1.1663},
    };

    @Test
    void binariesMatchTheVurgaftmanTableAndItsDerivedColumns() {
        for (Object[] row : TABLE) {
            String name = (String) row[0];
            Compound c = Materials.compound(name).orElseThrow();
            assertEquals((double) row[1], c.a300(), 1e-9, name + " a300, Vurgaftman 2001");
            assertEquals((double) row[2], c.monolayerHeightNm(), 5e-6, name + " a/2 [derived]");
            assertEquals((double) row[3], c.sitesPerCm2(), 0.00005e14, name + " 2/a^2 [derived]");
            double umPerHPerMlPerS = c.monolayerHeightNm() / NM_PER_S_PER_UM_PER_H;
            assertEquals((double) row[4], umPerHPerMlPerS, 5e-5, name + " um/h per ML/s [derived]");
            assertFalse(c.source().isBlank());
        }
        assertEquals(TABLE.length, Materials.compoundNames().size());
    }

    @Test
    void vegardLawGivesTheIndiumGalliumArsenideLatticeConstant() {
        // Reference file section 4: In0.3Ga0.7As a = 5.7748 angstrom from the GaAs and InAs values.
        Compound c = Materials.compound("In0.3Ga0.7As").orElseThrow();
        assertEquals(5.7748, c.a300(), 5e-5);
        assertEquals(5.7748, Materials.compound("In0.3Ga0.7As").orElseThrow().a300(), 5e-5);
        assertEquals(c.a300(), Materials.compound("In.3Ga.7As").orElseThrow().a300(), 1e-12);
    }

    @Test
    void unresolvableFormulasGiveEmpty() {
        assertTrue(Materials.compound("GaN").isEmpty());
        assertTrue(Materials.compound("In0.3Ga0.8As").isEmpty(), "fractions must add to 1");
        assertTrue(Materials.compound("gaas").isEmpty());
    }

    @Test
    void latticeConstantGrowsLinearlyWithTemperature() {
        // a(T) = a300 + c (T - 300 K), c = 3.88e-5 angstrom/K for GaAs (Vurgaftman 2001):
        // a(900 K) = 5.65325 + 0.02328 = 5.67653 angstrom [derived].
        Compound gaas = Materials.compound("GaAs").orElseThrow();
        assertEquals(5.67653, gaas.latticeConstant(900), 1e-9);
        assertEquals(gaas.a300(), gaas.latticeConstant(300), 0.0);
    }

    @Test
    void dropletMetalsMeltAtTheIts90FixedPoints() {
        // ITS-90 (Preston-Thomas, Metrologia 27, 3 (1990); from memory): Ga melting point
        // 29.7646 degC = 302.9146 K, In freezing point 156.5985 degC = 429.7485 K.
        assertEquals(302.9146, Materials.metal("Ga").orElseThrow().meltingK(), 1e-6);
        assertEquals(429.7485, Materials.metal("In").orElseThrow().meltingK(), 1e-6);
    }

    @Test
    void liquidGalliumAtomDensityFollowsFromItsMassDensity() {
        // CRC Handbook (from memory): liquid Ga 6.095 g/cm^3 -> 5.265e22 atoms/cm^3 [derived,
        // reference file section 2a], with M = 69.723 g/mol and N_A = 6.02214076e23 /mol.
        Metal ga = Materials.metal("Ga").orElseThrow();
        assertEquals(6.095, ga.liquidDensity(), 1e-9);
        double atomsPerCm3 = ga.liquidAtomsPerNm3() * 1e21;
        assertEquals(5.265e22, atomsPerCm3, 0.001e22);
    }

    @Test
    void groupVElementsHaveStandardWeightsAndAtomicNumbers() {
        // IUPAC standard atomic weights (from memory) and atomic numbers.
        assertEquals(74.921595, Materials.groupVMolarMass("As").orElseThrow(), 1e-6);
        assertEquals(121.760, Materials.groupVMolarMass("Sb").orElseThrow(), 1e-6);
        assertEquals(30.973762, Materials.groupVMolarMass("P").orElseThrow(), 1e-6);
        assertEquals(33, Materials.groupVElectrons("As").orElseThrow());
        assertEquals(51, Materials.groupVElectrons("Sb").orElseThrow());
        assertEquals(15, Materials.groupVElectrons("P").orElseThrow());
        assertTrue(Materials.groupVMolarMass("N").isEmpty());
    }
}
