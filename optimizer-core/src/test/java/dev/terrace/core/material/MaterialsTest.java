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
     * the parameter tables of each binary (read in a materials database that cites that paper).
     * The other columns are derived here, a in angstrom: ML height a/2 in nm = a/20; sites per
     * (001) monolayer 2/a^2 = 2/(a * 1e-8 cm)^2 (two atoms per a^2 face per plane, counting one
     * sublattice); um/h per ML/s = (a/20 nm) * 3600 s/h / 1000 nm/um. Example, GaAs: 5.65325/20 =
     * 0.282663 nm; 2/(5.65325e-8)^2 = 6.25797e14 cm^-2; 0.282663 * 3.6 = 1.017585 um/h.
     */
    private static final Object[][] TABLE = {
        {"GaAs", 5.65325, 0.2826625, 6.257972e14, 1.017585},
        {"AlAs", 5.6611, 0.283055, 6.240629e14, 1.018998},
        {"InAs", 6.0583, 0.302915, 5.449146e14, 1.090494},
        {"GaSb", 6.0959, 0.3047950, 5.382132e14, 1.097262},
        {"InP", 5.8697, 0.293485, 5.804946e14, 1.056546},
        {"InSb", 6.4794, 0.323970, 4.763876e14, 1.166292},
    };

    @Test
    void binariesMatchTheVurgaftmanTableAndItsDerivedColumns() {
        for (Object[] row : TABLE) {
            String name = (String) row[0];
            Compound c = Materials.compound(name).orElseThrow();
            assertEquals((double) row[1], c.a300(), 1e-9, name + " a300, Vurgaftman 2001");
            assertEquals((double) row[2], c.monolayerHeightNm(), 1e-9, name + " a/2 [derived]");
            assertEquals((double) row[3], c.sitesPerCm2(), 1e-6 * (double) row[3], name + " 2/a^2 [derived]");
            double umPerHPerMlPerS = c.monolayerHeightNm() / NM_PER_S_PER_UM_PER_H;
            assertEquals((double) row[4], umPerHPerMlPerS, 1e-6, name + " um/h per ML/s [derived]");
            assertFalse(c.source().isBlank());
        }
        assertEquals(TABLE.length, Materials.compoundNames().size());
    }

    @Test
    void vegardLawGivesTheIndiumGalliumArsenideLatticeConstant() {
        // Vegard's law (L. Vegard, Z. Phys. 5, 17 (1921)) with the 300 K binaries of Vurgaftman et
        // al., J. Appl. Phys. 89, 5815 (2001), as recommended there for InGaAs (no bowing of a):
        // a = 0.3 * 6.0583 + 0.7 * 5.65325 = 1.81749 + 3.957275 = 5.774765 angstrom.
        Compound c = Materials.compound("In0.3Ga0.7As").orElseThrow();
        assertEquals(5.774765, c.a300(), 1e-9);
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
        // CRC Handbook of Chemistry and Physics, density of liquid Ga at the melting point (value from
        // memory): 6.095 g/cm^3; M = 69.723 g/mol (IUPAC) and N_A = 6.02214076e23 /mol (SI, 2019).
        // Derivation: 6.095 / 69.723 * 6.02214076e23 = 5.26440e22 atoms/cm^3.
        Metal ga = Materials.metal("Ga").orElseThrow();
        assertEquals(6.095, ga.liquidDensity(), 1e-9);
        double atomsPerCm3 = ga.liquidAtomsPerNm3() * 1e21;
        assertEquals(5.26440e22, atomsPerCm3, 1e-5 * 5.26440e22);
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

    @Test
    void liquidMetalHoldsMoreCationsPerVolumeThanItsArsenide() {
        // Cation number densities: liquid at the melting point rho*N_A/M (CRC Handbook of Chemistry and Physics
        // liquid densities, values from memory: Ga 6.095, In 7.02, Al 2.375 g/cm^3; IUPAC molar masses) against
        // 4/a^3 for zinc blende with a300 from Vurgaftman, Meyer, Ram-Mohan, J. Appl. Phys. 89, 5815 (2001).
        // Derived here: Ga 5.2644e22 vs GaAs 4/(5.65325e-8)^3 = 2.2139e22 /cm^3, ratio 2.378;
        // In 3.6820e22 vs InAs 4/(6.0583e-8)^3 = 1.7989e22, ratio 2.047; Al 5.3009e22 vs AlAs 4/(5.6611e-8)^3
        // = 2.2047e22, ratio 2.404.
        Object[][] cases = {{"Ga", "As", 5.2644e22, 2.2139e22, 2.378}, {"In", "As", 3.6820e22, 1.7989e22, 2.047},
            {"Al", "As", 5.3009e22, 2.2047e22, 2.404}};
        for (Object[] c : cases) {
            Metal m = Materials.metal((String) c[0]).orElseThrow();
            Compound x = Materials.crystal((String) c[0], (String) c[1]).orElseThrow();
            double liquid = m.liquidAtomsPerNm3() * 1e21;
            double crystal = x.cationsPerNm3() * 1e21;
            assertEquals((double) c[2], liquid, 2e-4 * (double) c[2], c[0] + " liquid");
            assertEquals((double) c[3], crystal, 2e-4 * (double) c[3], x.name());
            assertEquals((double) c[4], liquid / crystal, 2e-3, c[0] + " into " + x.name());
        }
        assertEquals("InP", Materials.crystal("In", "P").orElseThrow().name());
        assertTrue(Materials.crystal("Ga", "P").isEmpty(), "GaP is not in the table");
        assertTrue(Materials.crystal(null, "As").isEmpty());
    }

    @Test
    void galliumSupercoolsWithAStatedMarginAndTheOthersDoNot() {
        // liquid Ga metastability limit 150 K: Bosio and Windsor, Phys. Rev. Lett. 35, 1652 (1975); margin
        // 302.9146 - 150 = 152.9146 K. In and Al: no margin (melting point is the limit).
        assertEquals(150.0, Materials.metal("Ga").orElseThrow().supercoolingLimitK(), 1e-9);
        assertEquals(152.9146, Materials.metal("Ga").orElseThrow().supercoolingMarginK(), 1e-9);
        assertEquals(0.0, Materials.metal("In").orElseThrow().supercoolingMarginK(), 1e-9);
        assertEquals(0.0, Materials.metal("Al").orElseThrow().supercoolingMarginK(), 1e-9);
        for (String metal : Materials.metalNames()) {
            Metal m = Materials.metal(metal).orElseThrow();
            assertTrue(m.source().contains("supercool"), metal + " names the source of its supercooling limit");
        }
    }
}
