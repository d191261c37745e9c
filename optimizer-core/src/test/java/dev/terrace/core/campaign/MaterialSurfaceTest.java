package dev.terrace.core.campaign;

import dev.terrace.core.model.RecipeConverter;
import dev.terrace.spi.Surface;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The growth surface the core resolves from a campaign's {@code material} section: the compound the deposit
 * crystallises into, its supercooling limit, and the group-V molecule assumed when a run names none.
 */
class MaterialSurfaceTest {

    private static Surface surface(String material) throws Exception {
        String yaml = String.join("\n",
                "campaign: m1",
                "material: " + material,
                "parameters:",
                "  temp: {unit: degC, min: 100, max: 300, role: substrate_temperature}",
                "outcomes:",
                "  shape: {classes: [dot, ring], role: morphology}",
                "");
        return CampaignReaderTest.parse(yaml).surface();
    }

    @Test
    void dropletsCrystalliseIntoTheirOwnArsenide() throws Exception {
        // 4/a^3 with a300 from Vurgaftman, Meyer, Ram-Mohan, J. Appl. Phys. 89, 5815 (2001): GaAs 22.1394,
        // InAs 17.9890 nm^-3 (arithmetic done here); In droplets on GaAs crystallise into InAs, not GaAs
        assertEquals(22.1394, surface("{substrate: GaAs, deposit: Ga}").crystalCationDensityPerNm3().orElseThrow(), 1e-3);
        assertEquals(17.9890, surface("{substrate: GaAs, deposit: In}").crystalCationDensityPerNm3().orElseThrow(), 1e-3);
        // Ga under P forms GaP, which the material table does not hold
        assertTrue(surface("{substrate: GaAs, deposit: Ga, group_v: P}").crystalCationDensityPerNm3().isEmpty());
        // Ga supercools to 150 K (Bosio and Windsor, Phys. Rev. Lett. 35, 1652 (1975)); In has no margin
        assertEquals(150.0, surface("{substrate: GaAs, deposit: Ga}").supercoolingLimitK().orElseThrow(), 1e-9);
        assertEquals(429.7485, surface("{substrate: GaAs, deposit: In}").supercoolingLimitK().orElseThrow(), 1e-9);
    }

    @Test
    void fluxConverterAndModelsAssumeTheSameGroupVMolecule() throws Exception {
        // As4 for an As campaign, P2 for a P campaign (common practice): one table for both
        for (String[] c : new String[][] {{"{substrate: GaAs, deposit: Ga}", "As4"},
            {"{substrate: InP, deposit: In}", "P2"}, {"{substrate: GaSb, deposit: Ga}", "Sb4"}}) {
            Surface s = surface(c[0]);
            assertEquals(c[1], s.defaultGroupVSpecies().orElseThrow(), c[0]);
            assertEquals(c[1], RecipeConverter.defaultSpecies(s.groupV()).orElseThrow().name(), c[0]);
        }
    }
}
