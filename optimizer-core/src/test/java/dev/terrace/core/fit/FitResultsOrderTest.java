package dev.terrace.core.fit;

import dev.terrace.core.fit.FitResults.Candidate;
import dev.terrace.core.fit.FitResults.ModelFit;
import dev.terrace.spi.ParameterValues;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/**
 * The fit's discrete choices keep the model's declaration order. {@code Map.copyOf} iterates in an
 * order seeded per JVM run, so the fit table changed between runs; with twelve keys that order matches
 * insertion order by chance with vanishing probability, so these checks fail on such a copy.
 */
class FitResultsOrderTest {

    static Map<String, Double> twelveInReverse() {
        Map<String, Double> m = new LinkedHashMap<>();
        for (int i = 12; i >= 1; i--) {
            m.put("choice_" + i, (double) i);
        }
        return m;
    }

    @Test
    void candidateChoicesIterateInInsertionOrder() {
        Map<String, Double> in = twelveInReverse();
        Candidate c = new Candidate(in, 1, 2, 3, true);
        assertEquals(new ArrayList<>(in.keySet()), new ArrayList<>(c.choices().keySet()));
        assertThrows(UnsupportedOperationException.class, () -> c.choices().put("x", 1.0));
    }

    @Test
    void selectedChoicesIterateInInsertionOrder() {
        Map<String, Double> in = twelveInReverse();
        ModelFit f = new ModelFit("m", 0, List.of(), List.of(), in, List.of(), List.of(), List.of(), List.of(),
                new double[0][], ParameterValues.defaults(List.of()), List.of(), "", List.of());
        assertEquals(new ArrayList<>(in.keySet()), new ArrayList<>(f.selected().keySet()));
        assertThrows(UnsupportedOperationException.class, () -> f.selected().clear());
    }
}
