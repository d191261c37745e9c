package dev.terrace.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Collectors;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code check} as the gate before a fit: problems that only show when the campaign file, the run
 * log and the growth models are read together get a warning naming the column, role or key. The
 * demo campaign is invented data.
 */
class CheckConsistencyTest extends CliFixtures {

    @TempDir
    Path tmp;

    @Test
    void theDemoHasNoneOfTheseWarnings() throws Exception {
        CliTest.Outcome o = run("check", demo(tmp).toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        assertFalse(o.err().contains("no run records"), o.err());
        assertFalse(o.err().contains("needs a setting"), o.err());
        assertFalse(o.err().contains("no targets"), o.err());
    }

    @Test
    void aSettingColumnMissingFromTheRunLogIsNamed() throws Exception {
        Path campaign = demo(tmp);
        Path runs = campaign.resolveSibling("runs.csv");
        // drop the t_drop column (the second) from every row that is not a comment
        String cut = Files.readAllLines(runs, StandardCharsets.UTF_8).stream()
                .map(l -> l.startsWith("#") ? l : l.replaceFirst("^([^,]*),[^,]*", "$1"))
                .collect(Collectors.joining("\n", "", "\n"));
        assertTrue(cut.contains("run_id,ga_amount"), cut);
        Files.writeString(runs, cut, StandardCharsets.UTF_8);
        CliTest.Outcome o = run("check", campaign.toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        assertTrue(o.err().contains("no run records setting 't_drop'"), o.err());
        assertTrue(o.err().contains("add the column"), o.err());
    }

    @Test
    void aModelWhoseRoleNoSettingHasIsNamedWithTheRole() throws Exception {
        Path campaign = demo(tmp);
        edit(campaign, "role: substrate_temperature}", "}");
        CliTest.Outcome o = run("check", campaign.toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        assertTrue(o.err().contains("growth model 'island-nucleation' needs a setting with role"
                + " 'substrate_temperature'"), o.err());
    }

    @Test
    void emptyTargetsAreFlaggedBecauseYieldWouldOnlyBeTheChanceOfSuccess() throws Exception {
        Path campaign = demo(tmp);
        String s = Files.readString(campaign, StandardCharsets.UTF_8);
        int at = s.indexOf("targets:");
        int end = s.indexOf("\n\n", at);
        Files.writeString(campaign, s.substring(0, at) + "targets: {}" + s.substring(end), StandardCharsets.UTF_8);
        CliTest.Outcome o = run("check", campaign.toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        assertTrue(o.err().contains("states no targets"), o.err());
    }
}
