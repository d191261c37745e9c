package dev.terrace.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;

import static dev.terrace.cli.CliSafetyTest.assertRefused;
import static dev.terrace.cli.CliSafetyTest.demo;
import static dev.terrace.cli.CliSafetyTest.hashes;
import static dev.terrace.cli.CliSafetyTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * {@code rank --candidates}: an empty file, a header without candidates and a header lacking a
 * setting column are each refused before any fitting, with exit code 2 and an error naming the
 * file, line and column and what was expected; every file in the campaign folder keeps its bytes
 * (SHA-256). The demo campaign is invented data.
 */
class CandidatesFileTest {

    private static final String ALL_SETTINGS = "t_drop,ga_amount,ga_rate,as_flux,t_cryst,as_source";

    private static void refused(Path tmp, String content, String... fragments) throws Exception {
        Path campaign = demo(tmp);
        Path cands = Files.writeString(campaign.getParent().resolve("cands.csv"), content);
        Map<String, String> before = hashes(campaign.getParent());
        assertRefused(run("rank", campaign.toString(), "--candidates", cands.toString(), "-q"), fragments);
        assertEquals(before, hashes(campaign.getParent()), "no file changed");
    }

    @Test
    void anEmptyFileIsRefusedAtLineOne(@TempDir Path tmp) throws Exception {
        refused(tmp, "", "cands.csv:1:1: error: the candidates file is empty",
                "expected a header row naming the settings, such as: run_id," + ALL_SETTINGS);
    }

    @Test
    void aFileOfOnlyCommentsIsRefusedAtLineOne(@TempDir Path tmp) throws Exception {
        refused(tmp, "# my picks for Monday\n\n", "cands.csv:1:1: error: the candidates file holds only comments");
    }

    @Test
    void aHeaderWithoutCandidatesIsRefusedAtTheLineAfterIt(@TempDir Path tmp) throws Exception {
        refused(tmp, "run_id," + ALL_SETTINGS + "\n", "cands.csv:2:1: error: the candidates file holds a header but"
                + " no candidate", "expected one row per candidate recipe below the header");
    }

    @Test
    void aHeaderLackingSettingColumnsIsRefusedAtTheEndOfTheHeader(@TempDir Path tmp) throws Exception {
        // "run_id,t_drop,ga_amount,ga_rate" is 31 characters: the error points just after it, column 32
        refused(tmp, "run_id,t_drop,ga_amount,ga_rate\nK1,250,3,0.1\n", "cands.csv:1:32: error: the header has no"
                + " column for the settings 'as_flux', 't_cryst', 'as_source'", "campaign ga-dots-demo",
                "expected a header such as: run_id," + ALL_SETTINGS);
    }

    @Test
    void aMissingColumnIsReportedTogetherWithTheRowErrors(@TempDir Path tmp) throws Exception {
        refused(tmp, "t_drop,ga_amount,ga_rate,as_flux,t_cryst\n250,abc,0.1,1e-6,300\n",
                "cands.csv:1:41: error: the header has no column for the setting 'as_source'", "cands.csv:2:");
    }
}
