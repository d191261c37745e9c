package dev.terrace.models;

import dev.terrace.spi.GrowthModel;
import org.junit.jupiter.api.Test;

import java.util.ServiceLoader;
import java.util.Set;
import java.util.stream.Collectors;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** The module registers exactly its four growth models, under their campaign-format ids. */
class ServiceRegistrationTest {

    @Test
    void serviceLoaderFindsTheFourModelsOfThisModule() {
        Set<String> ids = ServiceLoader.load(GrowthModel.class).stream()
                .filter(p -> p.type().getPackageName().equals("dev.terrace.models"))
                .map(p -> p.get().id()).collect(Collectors.toSet());
        // ids are part of the campaign format and must never change
        assertEquals(Set.of("island-nucleation", "step-flow", "droplet-crystallization", "critical-thickness"), ids);
    }
}
