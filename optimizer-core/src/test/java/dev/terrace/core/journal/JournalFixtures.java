package dev.terrace.core.journal;

import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Invented journal entries for the tests; no lab's proposals. */
final class JournalFixtures {

    static final String CAMPAIGN = "journal-test";
    static final String SHA_A = "a".repeat(64);
    static final String SHA_B = "b".repeat(64);

    private JournalFixtures() {
    }

    /** A batch of {@code n} proposals, ids {@code P-<tag>-<k>}, made at {@code time}. */
    static JournalEntry batch(String tag, int n, Instant time) {
        List<JournalProposal> ps = new java.util.ArrayList<>();
        for (int k = 1; k <= n; k++) {
            Map<String, Object> recipe = new LinkedHashMap<>();
            recipe.put("t_sub", 200.0 + k);
            recipe.put("as_bep", 3.2e-6);
            recipe.put("as_species", "As4");
            ps.add(new JournalProposal("P-" + tag + "-" + k, k, 0.9 / k, recipe,
                    Map.of("density", new JournalProposal.Predicted(1e10, 2e9, 7e9, 1.4e10)),
                    Map.of("shape", Map.of("dot", 0.7, "ring", 0.3))));
        }
        return new JournalEntry(time, CAMPAIGN, SHA_A, SHA_B, 12, 7, 1.0, "search", ps, 0);
    }
}
