package dev.terrace.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.terrace.core.surrogate.TrainingSubset;
import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code propose} on a run log longer than the GP's run cap says, in text and JSON, that the
 * Gaussian processes trained on a subset and on how many runs. The cap is lowered through
 * {@link TrainingSubset#MAX_RUNS_PROPERTY} so the bundled demo log (invented data) is long enough
 * and the test stays fast (test design choice).
 */
class ProposeSubsetTest {

    static final int CAP = 12;

    @AfterEach
    void clearCap() {
        System.clearProperty(TrainingSubset.MAX_RUNS_PROPERTY);
    }

    @Test
    void saysInTextAndJsonWhenTheGpTrainedOnASubset(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        long okWithDensity = Files.readAllLines(campaign.resolveSibling("runs.csv")).stream()
                .filter(l -> !l.startsWith("#") && !l.startsWith("run_id") && !l.isBlank()).count();
        assertTrue(okWithDensity > CAP, "the demo log must exceed the lowered cap");
        System.setProperty(TrainingSubset.MAX_RUNS_PROPERTY, String.valueOf(CAP));

        CliTest.Outcome json = run("propose", campaign.toString(), "--batch", "1", "--format", "json");
        assertEquals(0, json.code(), json.err());
        JsonNode root = new ObjectMapper().readTree(json.out());
        JsonNode dens = root.get("gp_subsets").get("dot_density");
        assertEquals(TrainingSubset.METHOD, dens.get("method").asText());
        assertEquals(CAP, dens.get("runs").asInt());
        int of = dens.get("of").asInt();
        assertTrue(of > CAP, "trained on fewer runs than offered: " + of);
        assertTrue(dens.get("cover_radius").asDouble() > 0);
        assertTrue(root.get("notes").toString().contains("trained on " + CAP + " of " + of + " runs"),
                root.get("notes").toString());

        CliTest.Outcome text = run("propose", campaign.toString(), "--batch", "1");
        assertEquals(0, text.code(), text.err());
        assertTrue(text.out().contains("note: dot_density: the Gaussian process trained on " + CAP + " of " + of
                + " runs, a " + TrainingSubset.METHOD), text.out());
    }
}
