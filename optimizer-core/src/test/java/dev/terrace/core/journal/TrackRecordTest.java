package dev.terrace.core.journal;

import dev.terrace.core.LoadedCampaign;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The track record on a small invented campaign (no lab's data): two batches in the journal, three
 * runs that name a proposal, one of which is not in the journal.
 */
class TrackRecordTest {

    static final String CAMPAIGN = """
            campaign: track-test
            title: "Invented campaign for track-record tests"
            material: {substrate: GaAs, deposit: Ga, group_v: As}
            parameters:
              t_drop:    {unit: degC, min: 150, max: 350}
              ga_amount: {unit: ML, min: 1, max: 5}
            outcomes:
              dot_density: {unit: cm^-2, scale: log}
              shape:       {classes: [dot, ring]}
            targets:
              dot_density: {min: 5.0e9, max: 2.0e10}
              shape:       {is: dot}
            """;

    static final String RUNS = """
            run_id,t_drop,ga_amount,dot_density,shape,status,date,proposal,notes
            R1,250,3,1e10,dot,ok,2026-03-01,,
            R2,251,3,1.2e10,dot,ok,2026-03-03,P-00000001,in spec
            R3,300,2,3e10,dot,ok,2026-03-04,P-00000002,too dense
            R4,280,2,<1e8,,ok,2026-03-05,P-00000003,nothing seen below detection
            R5,270,2,,,ok,2026-03-06,P-0000000l,typo in the id
            """;

    static JournalProposal proposal(String id, int rank, double yield, double mean, double lo, double hi) {
        Map<String, Object> recipe = new LinkedHashMap<>();
        recipe.put("t_drop", 250.0);
        recipe.put("ga_amount", 3.0);
        return new JournalProposal(id, rank, yield, recipe,
                Map.of("dot_density", new JournalProposal.Predicted(mean, mean / 4, lo, hi)),
                Map.of("shape", Map.of("dot", 0.8, "ring", 0.2)));
    }

    @Test
    void comparesEachGrownProposalWithItsPredictionAndSumsUp(@TempDir Path tmp) throws Exception {
        Path campaign = tmp.resolve("campaign.yaml");
        Files.writeString(campaign, CAMPAIGN);
        Files.writeString(tmp.resolve("runs.csv"), RUNS);
        Path journal = tmp.resolve("journal.jsonl");
        Journal.append(journal, new JournalEntry(Instant.parse("2026-03-02T09:00:00Z"), "track-test",
                JournalFixtures.SHA_A, JournalFixtures.SHA_B, 1, 7, 1, "space-filling start",
                List.of(proposal("P-00000001", 1, 0.8, 1.1e10, 7e9, 1.6e10),
                        proposal("P-00000002", 2, 0.4, 1.5e10, 9e9, 2.5e10),
                        proposal("P-00000003", 3, 0.3, 6e9, 2e9, 1.5e10)), 0));
        LoadedCampaign lc = LoadedCampaign.open(campaign, null);
        TrackRecord tr = TrackRecord.of(lc, Journal.read(journal, "track-test"));

        assertEquals(List.of("R2", "R3", "R4"), tr.grown().stream().map(TrackRecord.Grown::runId).toList());
        TrackRecord.Grown r2 = tr.grown().get(0);
        assertEquals(Boolean.TRUE, r2.metSpec());
        assertEquals(Boolean.TRUE, r2.outcomes().get(0).inInterval());
        assertEquals(3, r2.line());
        TrackRecord.Grown r3 = tr.grown().get(1);
        assertEquals(Boolean.FALSE, r3.metSpec(), "3e10 is above the 2e10 window");
        assertEquals(Boolean.FALSE, r3.outcomes().get(0).inInterval(), "3e10 is above the 90 % interval");
        TrackRecord.Grown r4 = tr.grown().get(2);
        assertEquals(Boolean.FALSE, r4.metSpec(), "below 1e8 cannot reach the 5e9 minimum, whatever the shape");
        assertEquals("<1e8", r4.outcomes().get(0).measured());
        assertNull(r4.outcomes().get(0).inInterval());

        // mean of 0.8, 0.4, 0.3 against 1 of 3 met (arithmetic worked by hand)
        assertEquals((0.8 + 0.4 + 0.3) / 3, tr.meanPredictedYield(), 1e-12);
        assertEquals(1.0 / 3, tr.fractionMet(), 1e-12);

        assertEquals(1, tr.warnings().size());
        assertEquals(6, tr.warnings().get(0).line(), "the line of R5");
        assertTrue(tr.warnings().get(0).message().contains("P-0000000l"));
        assertTrue(tr.warnings().get(0).message().contains("did you mean P-00000001?"), tr.warnings().get(0).message());
    }

    @Test
    void anUnmeasuredTargetLeavesTheVerdictOpen(@TempDir Path tmp) throws Exception {
        Path campaign = tmp.resolve("campaign.yaml");
        Files.writeString(campaign, CAMPAIGN);
        Files.writeString(tmp.resolve("runs.csv"), "run_id,t_drop,ga_amount,dot_density,shape,proposal\n"
                + "R1,250,3,1e10,,P-00000001\nR2,250,3,,,P-00000002\n");
        Path journal = tmp.resolve("journal.jsonl");
        Journal.append(journal, new JournalEntry(Instant.parse("2026-03-02T09:00:00Z"), "track-test",
                JournalFixtures.SHA_A, JournalFixtures.SHA_B, 1, 7, 1, "search",
                List.of(proposal("P-00000001", 1, 0.8, 1.1e10, 7e9, 1.6e10),
                        proposal("P-00000002", 2, 0.6, 1.1e10, 7e9, 1.6e10)), 0));
        TrackRecord tr = TrackRecord.of(LoadedCampaign.open(campaign, null), Journal.read(journal, "track-test"));
        assertEquals(2, tr.grown().size());
        assertNull(tr.grown().get(0).metSpec(), "shape not recorded");
        assertTrue(tr.judged().isEmpty());
        assertTrue(Double.isNaN(tr.fractionMet()));
        assertFalse(tr.grown().get(1).outcomes().isEmpty());
    }
}
