package dev.terrace.cli;

import dev.terrace.core.Cautions;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.plugins.PluginRegistry;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code terrace fit} prints the one safety line that points to the full cautions, as the other
 * commands that are not {@code check} or the report do: on standard error, so that {@code --format
 * json} stays valid JSON, and not with {@code --quiet}. Uses an invented test campaign.
 */
class FitCautionLineTest {

    @Test
    void fitPointsToTheCautionsOnceAndKeepsJsonClean(@TempDir Path tmp) throws Exception {
        Path campaign = FitRunStatusTest.campaign(tmp.resolve("c"));
        String line = Cautions.pointer(LoadedCampaign.open(campaign, PluginRegistry.builder().build()).campaign());
        CliTest.Outcome table = run("fit", campaign.toString());
        assertEquals(0, table.code(), table.err());
        assertEquals(1, table.err().lines().filter(line::equals).count(), table.err());
        assertTrue(line.contains("'terrace check', the report and the README give the full cautions"), line);
        assertFalse(table.out().contains("Safety: "), "the line goes to standard error: " + table.out());
        CliTest.Outcome json = run("fit", campaign.toString(), "--format", "json");
        assertEquals(0, json.code(), json.err());
        new com.fasterxml.jackson.databind.ObjectMapper().readTree(json.out());
        assertTrue(json.err().contains(line), json.err());
        CliTest.Outcome quiet = run("fit", campaign.toString(), "--quiet");
        assertEquals(0, quiet.code(), quiet.err());
        assertFalse(quiet.err().contains("Safety: "), quiet.err());
    }
}
