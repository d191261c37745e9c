package dev.terrace.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code check} as the gate, from the command line: one message per cause, no raw control
 * characters on the terminal, and no echo of a file that is not a run log. Exit codes, positions
 * and unchanged inputs (SHA-256) are checked. The demo campaign is invented data.
 */
class CheckGateCliTest extends CliFixtures {

    @TempDir
    Path tmp;

    @Test
    void aControlCharacterInARunIdIsAPositionedErrorAndNoCommandPrintsItRaw() throws Exception {
        Path campaign = demo(tmp);
        Path runs = campaign.resolveSibling("runs.csv");
        // ESC [ 2 J clears a VT100/ECMA-48 terminal (ECMA-48, 5th ed. 1991, 8.3.39 ED)
        edit(runs, "\nD02,", "\nD\u001b[2J02,");
        Map<String, String> before = CliSafetyTest.hashes(campaign.getParent());
        for (String cmd : new String[] {"check", "fit", "propose", "validate"}) {
            CliTest.Outcome o = run(cmd, campaign.toString(), "--quiet");
            assertEquals(2, o.code(), cmd + ": " + o.err());
            assertFalse(o.out().contains("\u001b") || o.err().contains("\u001b"), cmd + " printed a raw ESC");
            assertTrue(o.err().contains("control character U+001B"), cmd + ": " + o.err());
            assertTrue(o.err().contains("runs.csv:5:1"), cmd + ": the position (line 5, column 1): " + o.err());
        }
        assertEquals(before, CliSafetyTest.hashes(campaign.getParent()), "inputs byte-identical");
    }

    @Test
    void aRunsEntryPointingOutsideAtAFileThatIsNoRunLogEchoesOnlyAShortExcerpt() throws Exception {
        Path campaign = demo(tmp);
        Path outside = Files.createDirectories(tmp.resolve("elsewhere")).resolve("passwd");
        String secret = "root:x:0:0:root:/root:/bin/bash\ndaemon:x:1:1:daemon:/usr/sbin:/usr/sbin/nologin\n";
        Files.writeString(outside, secret, StandardCharsets.UTF_8);
        edit(campaign, "runs: runs.csv", "runs: ../elsewhere/passwd");
        CliTest.Outcome o = run("check", campaign.toString(), "--quiet");
        assertEquals(2, o.code(), o.err());
        assertTrue(o.err().contains("does not look like a run log"), o.err());
        assertFalse(o.err().contains("/bin/bash") || o.err().contains("daemon"), "no more than a short excerpt: "
                + o.err());
    }

    @Test
    void minAboveMaxIsOneMessageEvenWhenALimitNamesTheSetting() throws Exception {
        Path campaign = demo(tmp);
        edit(campaign, "t_drop:    {unit: degC, min: 150, max: 350,", "t_drop:    {unit: degC, min: 350, max: 150,");
        CliTest.Outcome o = run("check", campaign.toString(), "--quiet");
        assertEquals(2, o.code(), o.err());
        assertTrue(o.err().contains("must be below max"), o.err());
        assertFalse(o.err().contains("unknown parameter"), "one cause, one message: " + o.err());
    }

    @Test
    void aProductOfTwoSettingsInALimitSaysLimitsMustBeLinear() throws Exception {
        Path campaign = demo(tmp);
        edit(campaign, "  - t_cryst >= t_drop - 20", "  - t_cryst >= t_drop * ga_amount");
        CliTest.Outcome o = run("check", campaign.toString(), "--quiet");
        assertEquals(2, o.code(), o.err());
        assertTrue(o.err().contains("limits must be linear"), o.err());
        assertFalse(o.err().contains("is not a number"), "one cause, one message: " + o.err());
    }
}
