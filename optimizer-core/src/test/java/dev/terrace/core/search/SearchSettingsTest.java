package dev.terrace.core.search;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;

class SearchSettingsTest {

    @Test
    void defaultsAreTheNamedConstants() {
        SearchSettings s = SearchSettings.defaults();
        assertEquals(SearchSettings.DEFAULT_POPULATION_SIZE, s.populationSize());
        assertEquals(60, s.populationSize());
        assertEquals(60, s.maxGenerations());
        assertEquals(12, s.steadyGenerations());
        assertEquals(SearchSettings.DEFAULT_MUTATION_PROBABILITY, s.mutationProbability(), 0.0);
        assertEquals(SearchSettings.DEFAULT_POLISH, s.polish());
        assertEquals(SearchSettings.DEFAULT_MIN_DISTANCE, s.minDistance(), 0.0);
    }

    @Test
    void theBuilderChangesOnlyWhatItIsTold() {
        SearchSettings s = SearchSettings.builder().populationSize(100).polish(false).build();
        assertEquals(100, s.populationSize());
        assertFalse(s.polish());
        assertEquals(SearchSettings.DEFAULT_MAX_GENERATIONS, s.maxGenerations());
        assertEquals(s, s.toBuilder().build());
    }

    @Test
    void outOfRangeValuesAreRejected() {
        assertThrows(IllegalArgumentException.class, () -> SearchSettings.builder().populationSize(3).build());
        assertThrows(IllegalArgumentException.class, () -> SearchSettings.builder().mutationProbability(1.5).build());
        assertThrows(IllegalArgumentException.class, () -> SearchSettings.builder().mutationSigma(0).build());
        assertThrows(IllegalArgumentException.class, () -> SearchSettings.builder().minDistance(Double.NaN).build());
        assertThrows(IllegalArgumentException.class, () -> SearchSettings.builder().polishStarts(0).build());
        assertThrows(IllegalArgumentException.class, () -> SearchSettings.builder().distinctCount(0).build());
    }
}
