package dev.terrace.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code propose} says when leave-one-out finds an outcome's surrogate no better than the mean.
 * Invented scenario without growth models: dot sizes that alternate from run to run (no skill
 * possible) next to a height that follows temperature smoothly (skill).
 */
class NoSkillNoteTest {

    static final String CAMPAIGN = String.join("\n",
            "campaign: skill-note-test",
            "title: \"invented data for a test\"",
            "material: {substrate: GaAs}",
            "parameters:",
            "  temp: {unit: degC, min: 200, max: 600}",
            "outcomes:",
            "  size: {unit: nm}",
            "  height: {unit: nm}",
            "targets:",
            "  size: {min: 20, max: 30}",
            "runs: runs.csv",
            "");

    @Test
    void proposeNamesTheOutcomeWithoutSkillAndOnlyThatOne(@TempDir Path tmp) throws Exception {
        Path campaign = tmp.resolve("campaign.yaml");
        Files.writeString(campaign, CAMPAIGN);
        StringBuilder csv = new StringBuilder("run_id,temp,size,height,status\n");
        for (int i = 0; i < 12; i++) {
            csv.append(String.format(Locale.ROOT, "R%02d,%.0f,%s,%.2f,ok%n", i, 200 + 400.0 * i / 11,
                    i % 2 == 0 ? "18" : "32", 2 + 0.01 * (200 + 400.0 * i / 11)));
        }
        Files.writeString(tmp.resolve("runs.csv"), csv.toString());
        CliTest.Outcome o = run("propose", campaign.toString(), "--batch", "1", "--seed", "3");
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().contains("note: size: no skill"), o.out());
        assertFalse(o.out().contains("height: no skill"), o.out());
    }
}
