package dev.terrace.demo;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.core.runlog.RunLogReader;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import java.util.stream.Collectors;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class RegenerateDemoTest {

    @Test
    void theBundledRunLogIsExactlyWhatTheChamberRegenerates() throws Exception {
        // If this fails after a change to the chamber, regenerate the file with RegenerateDemo.main.
        assertEquals(DemoCampaign.files().get("runs.csv"), RegenerateDemo.regenerate());
    }

    @Test
    void theBundledRunLogReadsWithoutErrorsOrWarnings(@TempDir Path tmp) throws Exception {
        Path file = DemoCampaign.copyTo(tmp.resolve("demo"));
        Campaign campaign = CampaignReader.read(file, null).campaign();
        RunLog log = RunLogReader.read(campaign);
        assertEquals(GrowerDesign.DEFAULT_RUNS, log.runs().size());
        assertEquals(List.of(), log.warnings());
    }

    @Test
    void theBundledRunLogHasAFailureAMixOfShapesAndNearMissesButNoHit(@TempDir Path tmp) throws Exception {
        Path file = DemoCampaign.copyTo(tmp.resolve("demo"));
        Campaign campaign = CampaignReader.read(file, null).campaign();
        RunLog log = RunLogReader.read(campaign);
        assertTrue(log.failedRuns().size() >= 1, "at least one failed run");
        Set<String> shapes = log.okRuns().stream().map(r -> r.category("shape").orElse("?")).collect(Collectors.toSet());
        assertTrue(shapes.size() >= 2, "a mix of shapes: " + shapes);
        int best = 0;
        for (Run r : log.okRuns()) {
            int met = 0;
            for (Target t : campaign.targets()) {
                boolean ok = t.isClassTarget() ? r.category(t.outcome()).map(t::accepts).orElse(false)
                        : r.number(t.outcome()).isPresent() && t.accepts(r.number(t.outcome()).getAsDouble());
                met += ok ? 1 : 0;
            }
            best = Math.max(best, met);
        }
        assertEquals(campaign.targets().size() - 1, best, "some runs come close; none meets every target yet");
        assertTrue(DemoCampaign.files().get("runs.csv").startsWith("# INVENTED DATA"));
    }
}
