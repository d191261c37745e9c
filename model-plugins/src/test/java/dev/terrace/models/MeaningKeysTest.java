package dev.terrace.models;

import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ModelParameter;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.ServiceLoader;
import java.util.Set;
import java.util.TreeSet;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Every shared meaning the bundled plugins declare is listed in {@link ModelParameter#MEANING_KEYS}. */
class MeaningKeysTest {

    @Test
    void everyDeclaredMeaningIsAListedKey() {
        List<GrowthModel> models = new ArrayList<>();
        ServiceLoader.load(GrowthModel.class).forEach(models::add);
        assertFalse(models.isEmpty(), "the bundled plugins are registered");
        Set<String> declared = new TreeSet<>();
        for (GrowthModel m : models) {
            for (ModelParameter p : m.parameters()) {
                if (p.hasSharedMeaning()) {
                    declared.add(p.meaning());
                    assertTrue(ModelParameter.MEANING_KEYS.contains(p.meaning()),
                            m.id() + "." + p.name() + " declares '" + p.meaning() + "', not in MEANING_KEYS");
                }
            }
        }
        assertTrue(declared.contains(NucleationLaw.MEANING_SURFACTANT_SHIFT), declared.toString());
        assertEquals("surfactant_diffusion_shift", NucleationLaw.MEANING_SURFACTANT_SHIFT);
    }
}
