package dev.terrace.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Every {@code init --kind} template passes {@code check} and {@code propose}, gets its id from the
 * folder name and says where the materials are listed; propose on an untouched template says its
 * recipes rest on the growth models' defaults alone.
 */
class InitKindTest {

    @Test
    void everyKindPassesCheckAndPropose(@TempDir Path tmp) throws Exception {
        for (String kind : InitCommand.KINDS) {
            Path dir = tmp.resolve("My " + kind + " Series 2026");
            CliTest.Outcome init = run("init", dir.toString(), "--kind", kind);
            assertEquals(0, init.code(), kind + ": " + init.err());
            assertTrue(init.out().contains("terrace models"), init.out());
            Path campaign = dir.resolve("campaign.yaml");
            String text = Files.readString(campaign);
            assertTrue(text.contains("campaign: my-" + kind + "-series-2026"), text);
            assertTrue(text.contains("terrace models lists the materials"), text);
            assertTrue(text.contains("safety officer"), text);
            CliTest.Outcome check = run("check", campaign.toString());
            assertEquals(0, check.code(), kind + ": " + check.err() + check.out());
            CliTest.Outcome propose = run("propose", campaign.toString(), "--batch", "2", "--no-journal", "--quiet");
            assertEquals(0, propose.code(), kind + ": " + propose.err());
            assertTrue(propose.out().contains("growth models' defaults alone"), kind + ": " + propose.out());
        }
    }

    @Test
    void modelsListsTheMaterialsTheTemplatesPointTo() {
        CliTest.Outcome m = run("models");
        assertEquals(0, m.code(), m.err());
        assertTrue(m.out().contains("Materials (keys for the campaign's material section):"), m.out());
        // the keys the three templates use (their material lines)
        for (String key : new String[] {"GaAs", "In", "As", "Vurgaftman"}) {
            assertTrue(m.out().contains(key), key + " in " + m.out());
        }
    }

    @Test
    void theSkTemplateNamesItsPendingModelAndTheIdFallsBack(@TempDir Path tmp) throws Exception {
        assertTrue(InitCommand.template("sk-dots").contains("critical-thickness"));
        assertEquals("new-campaign", InitCommand.idFor(tmp.resolve("___")));
        assertEquals("inas-qds-2026", InitCommand.idFor(tmp.resolve("InAs QDs 2026")));
        CliTest.Outcome bad = run("init", tmp.resolve("x").toString(), "--kind", "nanowires");
        assertEquals(2, bad.code());
        assertTrue(bad.err().contains("--kind must be one of droplet-dots, sk-dots, film"), bad.err());
        assertTrue(Files.notExists(tmp.resolve("x")));
    }
}
