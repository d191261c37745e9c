package dev.terrace.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.List;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code propose} → journal → {@code record} → {@code check}'s track record, on a copy of the demo
 * campaign (invented data), whose run log has a {@code proposal} column.
 */
class RecordCommandTest {

    /** The demo copied; its run log has a (still empty) proposal column. */
    static Path demoWithProposalColumn(Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        assertTrue(Files.readString(campaign.resolveSibling("runs.csv")).contains(",proposal,"),
                "the demo log carries a proposal column");
        return campaign;
    }

    /** The demo copied, with the proposal column taken out of its run log (a log made before the column existed). */
    static Path demoWithoutProposalColumn(Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Path log = campaign.resolveSibling("runs.csv");
        List<String> out = new ArrayList<>();
        for (String l : Files.readAllLines(log)) {
            // the demo's columns: ..., status, date, proposal (empty), notes
            out.add(l.startsWith("#") ? l : l.startsWith("run_id") ? l.replace(",proposal,", ",")
                    : l.replaceFirst("(\\d{4}-\\d\\d-\\d\\d),,", "$1,"));
        }
        Files.write(log, out);
        return campaign;
    }

    static String sha256(byte[] b) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(b));
    }

    static void assertUsageError(CliTest.Outcome o, String fragment) {
        assertEquals(2, o.code(), o.out() + o.err());
        assertTrue(o.err().contains(fragment), "expected '" + fragment + "' in: " + o.err());
        assertFalse(o.err().contains("\tat "), "no stack trace without --debug");
    }

    @Test
    void proposeJournalsRecordFollowsAProposalAndCheckShowsTheTrackRecord(@TempDir Path tmp) throws Exception {
        Path campaign = demoWithProposalColumn(tmp);
        Path journal = campaign.resolveSibling("journal.jsonl");
        Path log = campaign.resolveSibling("runs.csv");

        CliTest.Outcome quiet = run("propose", campaign.toString(), "--batch", "2", "--seed", "3", "--format", "json",
                "--no-journal");
        assertEquals(0, quiet.code(), quiet.err());
        assertFalse(Files.exists(journal), "--no-journal writes no journal");
        CliTest.Outcome p = run("propose", campaign.toString(), "--batch", "2", "--seed", "3", "--format", "json");
        assertEquals(0, p.code(), p.err());
        assertEquals(quiet.out(), p.out(), "journaling changes nothing printed");
        assertTrue(p.err().contains(NextStep.PREFIX + "grow P-"), p.err());
        JsonNode ps = new ObjectMapper().readTree(p.out()).get("proposals");
        String first = ps.get(0).get("id").asText();
        String second = ps.get(1).get("id").asText();
        List<String> lines = Files.readAllLines(journal);
        assertEquals(1, lines.size(), "one line per batch");
        JsonNode entry = new ObjectMapper().readTree(lines.get(0));
        assertEquals(sha256(Files.readAllBytes(log)), entry.get("run_log_sha256").asText());
        assertEquals(sha256(Files.readAllBytes(campaign)), entry.get("campaign_sha256").asText());
        assertEquals(3, entry.get("seed").asLong());
        assertEquals(first, entry.get("proposals").get(0).get("id").asText());

        // grown as proposed, but the heater settled 2 degC off: the setting is overridden
        double tDrop = ps.get(0).get("recipe").get("t_drop").asDouble();
        String grownAt = Format.setting(tDrop + 2);
        byte[] before = Files.readAllBytes(log);
        CliTest.Outcome r1 = run("record", campaign.toString(), "--proposal", first, "t_drop=" + grownAt,
                "dot_density=1.0e10", "dot_diameter=38", "shape=dot", "date=2026-03-02", "notes=grown, as proposed");
        assertEquals(0, r1.code(), r1.err());
        byte[] after = Files.readAllBytes(log);
        assertEquals(sha256(before), sha256(Arrays.copyOf(after, before.length)), "every earlier byte kept");
        String row = Files.readAllLines(log).get(Files.readAllLines(log).size() - 1);
        assertTrue(row.startsWith("D15," + grownAt + ","), row);
        // the demo log's column order: ..., status, date, proposal, notes
        assertTrue(row.endsWith(",2026-03-02," + first + ",\"grown, as proposed\""), row);
        assertTrue(r1.out().contains("proposed " + Format.setting(tDrop)), r1.out());
        assertTrue(r1.out().contains(NextStep.PREFIX + "terrace check"), r1.out());

        CliTest.Outcome r2 = run("record", campaign.toString(), "--proposal", second, "dot_density=5e10",
                "dot_diameter=20", "shape=ring", "date=2026-03-03");
        assertEquals(0, r2.code(), r2.err());

        CliTest.Outcome c = run("check", campaign.toString(), "-q");
        assertEquals(0, c.code(), c.err());
        assertTrue(c.out().contains("Track record"), c.out());
        assertTrue(c.out().contains("D15  " + first) && c.out().contains("D16  " + second), c.out());
        double y1 = ps.get(0).get("yield").asDouble();
        double y2 = ps.get(1).get("yield").asDouble();
        assertTrue(c.out().contains(String.format(java.util.Locale.ROOT,
                "over 2 grown proposals with a verdict: mean predicted yield %.2f, met spec 1 of 2 (0.50)",
                (y1 + y2) / 2)), c.out());
        assertTrue(c.out().contains(NextStep.PREFIX + "run terrace propose"), c.out());
    }

    @Test
    void refusedRecordsLeaveTheRunLogByteIdentical(@TempDir Path tmp) throws Exception {
        Path campaign = demoWithProposalColumn(tmp);
        Path log = campaign.resolveSibling("runs.csv");
        byte[] before = Files.readAllBytes(log);
        assertUsageError(run("record", campaign.toString(), "t_drop=250", "dot_density=lots"), "dot_density=lots");
        assertUsageError(run("record", campaign.toString(), "t_drop=250", "dot_densty=1e10"), "did you mean 'dot_density'");
        assertUsageError(run("record", campaign.toString(), "t_drop=250", "run_id=D03"), "D03");
        assertUsageError(run("record", campaign.toString(), "t_drop"), "NAME=VALUE");
        assertUsageError(run("record", campaign.toString(), "t_drop=1", "t_drop=2"), "twice");
        assertUsageError(run("record", campaign.toString(), "--proposal", "P-12345678"), "not in the proposal journal");
        assertArrayEquals(before, Files.readAllBytes(log));
        CliTest.Outcome dry = run("record", campaign.toString(), "--dry-run", "t_drop=250", "status=failed");
        assertEquals(0, dry.code(), dry.err());
        assertTrue(dry.out().startsWith("Would record run D15"), dry.out());
        assertArrayEquals(before, Files.readAllBytes(log));
    }

    @Test
    void aLogWithoutAProposalColumnIsNotRewritten(@TempDir Path tmp) throws Exception {
        Path campaign = demoWithoutProposalColumn(tmp);
        Path log = campaign.resolveSibling("runs.csv");
        byte[] before = Files.readAllBytes(log);
        assertUsageError(run("record", campaign.toString(), "proposal=P-12345678", "t_drop=250"),
                "no column 'proposal'");
        assertArrayEquals(before, Files.readAllBytes(log));
    }

    @Test
    void noOutputMayReplaceTheJournal(@TempDir Path tmp) throws Exception {
        Path campaign = demoWithProposalColumn(tmp);
        Path journal = campaign.resolveSibling("journal.jsonl");
        Files.writeString(journal, "");
        CliTest.Outcome o = run("propose", campaign.toString(), "--out", journal.toString(), "--force");
        assertUsageError(o, "proposal journal");
        assertEquals("", Files.readString(journal));
        Files.delete(journal);
        CliTest.Outcome absent = run("propose", campaign.toString(), "--out", journal.toString());
        assertUsageError(absent, "proposal journal");
        assertFalse(Files.exists(journal), "a journal not yet written is guarded too");
    }
}
