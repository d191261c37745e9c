package dev.terrace.cli;

import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static dev.terrace.cli.CliFixtures.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A setting outside the campaign box gets exactly one positioned warning (file:line:column) per
 * cell: in {@code check}, in {@code record} (which reads the log twice: once to load the campaign,
 * once under the lock) and on a stream shared by several commands. The demo campaign is invented
 * data; the out-of-box values are edits of it for this test.
 */
class OneWarningPerCellTest {

    private static final String BOX = "lies outside the campaign box";

    private static List<String> boxWarnings(String err) {
        return err.lines().filter(l -> l.contains(BOX)).toList();
    }

    /** The demo log with t_drop 500 on line 4 (D01), and ga_amount 9 and t_cryst 900 on line 5 (D02). */
    private static Path campaignWithOutOfBoxCells(Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Path log = campaign.resolveSibling("runs.csv");
        List<String> lines = Files.readAllLines(log);
        assertTrue(lines.get(2).startsWith("run_id,t_drop,ga_amount,ga_rate,as_flux,t_cryst,"), lines.get(2));
        assertTrue(lines.get(3).startsWith("D01,250,3,"), lines.get(3));
        assertTrue(lines.get(4).startsWith("D02,175,3,0.1,3.2e-6,175,"), lines.get(4));
        lines.set(3, lines.get(3).replaceFirst("^D01,250,", "D01,500,"));
        lines.set(4, lines.get(4).replaceFirst("^D02,175,3,0.1,3.2e-6,175,", "D02,175,9,0.1,3.2e-6,900,"));
        Files.write(log, lines);
        return campaign;
    }

    @Test
    void checkPrintsOnePositionedWarningPerOutOfBoxCell(@TempDir Path tmp) throws Exception {
        Path campaign = campaignWithOutOfBoxCells(tmp);
        String log = campaign.resolveSibling("runs.csv").toString();
        CliFixtures.Outcome o = run("check", campaign.toString());
        assertEquals(0, o.code(), o.err());
        List<String> w = boxWarnings(o.err());
        assertEquals(3, w.size(), o.err());
        // columns: "D01," is 4 characters, so t_drop starts at column 5; "D02,175," puts ga_amount at 9
        // and "D02,175,9,0.1,3.2e-6," puts t_cryst at 22
        assertTrue(w.get(0).startsWith(log + ":4:5: warning: column 't_drop' value 500 "), w.get(0));
        assertTrue(w.get(1).startsWith(log + ":5:9: warning: column 'ga_amount' value 9 "), w.get(1));
        assertTrue(w.get(2).startsWith(log + ":5:22: warning: column 't_cryst' value 900 "), w.get(2));
    }

    @Test
    void recordWarnsOnceAboutTheNewRowAndNotAboutEarlierRows(@TempDir Path tmp) throws Exception {
        Path campaign = campaignWithOutOfBoxCells(tmp);
        Path log = campaign.resolveSibling("runs.csv");
        int newLine = Files.readAllLines(log).size() + 1;
        String before = CliFixtures.sha256(log);
        CliFixtures.Outcome refused = run("record", campaign.toString(), "t_drop=600", "dot_density=lots");
        assertEquals(2, refused.code(), refused.err());
        List<String> w = boxWarnings(refused.err());
        assertEquals(1, w.size(), refused.err());
        assertTrue(w.get(0).startsWith(log + ":" + newLine + ":5: warning: the new row (t_drop=600)"), w.get(0));
        assertEquals(1, refused.err().lines().filter(l -> l.contains(": error: ")).count(), refused.err());
        assertEquals(before, CliFixtures.sha256(log), "nothing was recorded");

        CliFixtures.Outcome recorded = run("record", campaign.toString(), "t_drop=600", "status=failed", "-q");
        assertEquals(0, recorded.code(), recorded.err());
        w = boxWarnings(recorded.err());
        assertEquals(1, w.size(), recorded.err());
        assertTrue(w.get(0).startsWith(log + ":" + newLine + ":5: warning: column 't_drop' value 600 "), w.get(0));
    }

    @Test
    void aLinePrintedOnAStreamIsNotPrintedThereAgain() {
        StringWriter text = new StringWriter();
        PrintWriter err = new PrintWriter(text, true);
        List<String> warnings = List.of("runs.csv:4:5: warning: a", "runs.csv:5:9: warning: b");
        DiagnosticLines.print(err, warnings); // the first command on the stream (demo: check)
        DiagnosticLines.print(err, List.of(warnings.get(1), "runs.csv:6:1: warning: c")); // a later one (report)
        assertEquals(List.of("runs.csv:4:5: warning: a", "runs.csv:5:9: warning: b", "runs.csv:6:1: warning: c"),
                text.toString().lines().toList());
        StringWriter other = new StringWriter();
        DiagnosticLines.print(new PrintWriter(other, true), warnings);
        assertEquals(2, other.toString().lines().count(), "another stream prints its own lines");
    }
}
