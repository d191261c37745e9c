package dev.terrace.cli;

import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code terrace rank} names, per candidate, the settings that are missing or outside the box,
 * exits 2 when no candidate can be ranked, and speaks of candidates, not measurements. The box
 * (t_drop 150 to 350 degC) is the bundled demo campaign's (invented data).
 */
class RankMessagesTest {

    static final String HEADER = "run_id,t_drop,ga_amount,ga_rate,as_flux,t_cryst,as_source\n";

    @TempDir
    static Path tmp;

    static Path campaign;

    @BeforeAll
    static void copyTheDemo() throws Exception {
        campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
    }

    @Test
    void namesTheMissingAndOutOfBoxSettingsOfEachCandidate() throws Exception {
        Path cands = tmp.resolve("mixed.csv");
        Files.writeString(cands, HEADER + "C1,250,2.5,0.1,2e-6,250,As4\nC2,400,2.5,0.1,2e-6,390,As4\n"
                + "C3,,2.5,0.1,2e-6,250,As4\n");
        CliTest.Outcome o = run("rank", campaign.toString(), "--candidates", cands.toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().contains("candidate C3 has no value for t_drop; it cannot be ranked"), o.out());
        assertTrue(o.out().contains("outside the campaign's box: t_drop 400 degC (box 150 to 350 degC)"), o.out());
        assertFalse(o.out().contains("does not give every setting"), o.out());
    }

    @Test
    void noRankableCandidateExitsTwoNamingEachCandidate() throws Exception {
        Path cands = tmp.resolve("none.csv");
        Files.writeString(cands, HEADER + "K1,,2.5,0.1,2e-6,250,As4\nK2,250,2.5,0.1,,250,\n");
        CliTest.Outcome o = run("rank", campaign.toString(), "--candidates", cands.toString(), "--quiet");
        assertEquals(2, o.code(), o.err());
        assertTrue(o.err().contains("candidate K1 has no t_drop"), o.err());
        assertTrue(o.err().contains("candidate K2 has no as_flux, as_source"), o.err());
        assertFalse(o.err().contains("Usage:"), o.err());
    }

    @Test
    void badCellsAreWordedForCandidatesNotMeasurements() throws Exception {
        Path cands = tmp.resolve("bad.csv");
        Files.writeString(cands, HEADER + "C1,250,abc,0.1,2e-6,250,As4\nC2,400,2.5,0.1,2e-6,390,As4\n");
        CliTest.Outcome o = run("rank", campaign.toString(), "--candidates", cands.toString(), "--quiet");
        assertEquals(2, o.code(), o.err());
        assertTrue(o.err().contains("bad.csv:2:8: error: column 'ga_amount'"), o.err());
        assertTrue(o.err().contains("a candidate needs a number for every setting"), o.err());
        assertTrue(o.err().contains("the candidate is still ranked"), o.err());
        assertFalse(o.err().contains("measured") || o.err().contains("the run is kept"), o.err());
    }
}
