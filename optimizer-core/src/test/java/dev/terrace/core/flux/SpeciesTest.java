package dev.terrace.core.flux;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class SpeciesTest {

    @Test
    void molarMassesAreStandardAtomicWeightsTimesAtoms() {
        // IUPAC standard atomic weights (CIAAW, Pure Appl. Chem. 88, 265 (2016); values from memory):
        // As 74.921595, Sb 121.760, P 30.973762, Ga 69.723, In 114.818, Al 26.9815385.
        // M_As4 = 4 * 74.921595 = 299.68638 g/mol.
        assertEquals(4 * 74.921595, Species.As4.molarMass(), 1e-6, "M(As4) = 4 M(As), IUPAC");
        assertEquals(69.723, Species.Ga.molarMass(), 1e-9, "M(Ga), IUPAC");
        assertEquals(2 * 74.921595, Species.As2.molarMass(), 1e-6, "M(As2), IUPAC");
        assertEquals(74.921595, Species.As.molarMass(), 1e-6, "M(As), IUPAC");
        assertEquals(4 * 121.760, Species.Sb4.molarMass(), 1e-6, "M(Sb4), IUPAC");
        assertEquals(2 * 121.760, Species.Sb2.molarMass(), 1e-6, "M(Sb2), IUPAC");
        assertEquals(2 * 30.973762, Species.P2.molarMass(), 1e-6, "M(P2), IUPAC");
        assertEquals(4 * 30.973762, Species.P4.molarMass(), 1e-6, "M(P4), IUPAC");
        assertEquals(114.818, Species.In.molarMass(), 1e-6, "M(In), IUPAC");
        assertEquals(26.98154, Species.Al.molarMass(), 1e-5, "M(Al), IUPAC");
    }

    @Test
    void electronCountsAreAtomicNumbersTimesAtoms() {
        // Atomic numbers: P 15, As 33, Sb 51, Al 13, Ga 31, In 49.
        assertEquals(132, Species.As4.electrons());
        assertEquals(66, Species.As2.electrons());
        assertEquals(33, Species.As.electrons());
        assertEquals(204, Species.Sb4.electrons());
        assertEquals(102, Species.Sb2.electrons());
        assertEquals(51, Species.Sb.electrons());
        assertEquals(30, Species.P2.electrons());
        assertEquals(60, Species.P4.electrons());
        assertEquals(13, Species.Al.electrons());
        assertEquals(31, Species.Ga.electrons());
        assertEquals(49, Species.In.electrons());
    }

    @Test
    void groupsAndAtomCountsFollowTheFormula() {
        assertEquals(4, Species.As4.atoms());
        assertEquals(2, Species.P2.atoms());
        assertEquals(1, Species.Ga.atoms());
        assertEquals("As", Species.As4.element());
        assertEquals("Sb", Species.Sb2.element());
        assertTrue(Species.Sb4.isGroupV());
        assertFalse(Species.In.isGroupV());
        assertEquals(Species.Group.III, Species.Al.group());
    }

    @Test
    void parseAcceptsTheUsualSpellings() {
        for (Species s : Species.values()) {
            assertEquals(s, Species.parse(s.symbol()));
        }
        assertEquals(Species.As4, Species.parse(" As4 "));
    }

    @Test
    void parseIsCaseSensitiveAndSuggestsTheRightSpelling() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Species.parse("as4"));
        assertTrue(e.getMessage().contains("did you mean As4"), e.getMessage());
    }

    @Test
    void parseListsEveryValidNameWhenTheNameIsUnknown() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Species.parse("As5"));
        for (Species s : Species.values()) {
            assertTrue(e.getMessage().contains(s.symbol()), e.getMessage());
        }
        assertThrows(IllegalArgumentException.class, () -> Species.parse(null));
        assertThrows(IllegalArgumentException.class, () -> Species.parse(""));
    }

    @Test
    void defaultSourceTemperaturesLieInThePracticeRanges() {
        // [practice]: sublimation cells for As4 and P4 run at about 573-623 K, crackers at about
        // 1100-1200 K, group-III effusion cells at about 1050-1400 K.
        assertTrue(Species.As4.defaultSourceTemperatureK() >= 573 && Species.As4.defaultSourceTemperatureK() <= 623);
        assertTrue(Species.P4.defaultSourceTemperatureK() >= 573 && Species.P4.defaultSourceTemperatureK() <= 623);
        for (Species s : new Species[] {Species.As, Species.As2, Species.Sb, Species.Sb2, Species.P2}) {
            assertTrue(s.defaultSourceTemperatureK() >= 1100 && s.defaultSourceTemperatureK() <= 1200, s.symbol());
        }
        for (Species s : new Species[] {Species.Ga, Species.In, Species.Al}) {
            assertTrue(s.defaultSourceTemperatureK() >= 1050 && s.defaultSourceTemperatureK() <= 1400, s.symbol());
        }
    }
}
