package dev.terrace.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.validate.OutcomeValidation;
import dev.terrace.core.validate.Score;
import dev.terrace.core.validate.Validation;
import dev.terrace.core.validate.ValidationReport;
import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;
import java.util.Iterator;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code terrace validate} on the invented demo campaign puts the proposal surrogate (growth models +
 * GP, as {@code terrace propose} builds it) first in text and JSON and bases each outcome's verdict
 * on it. The demo campaign is validated once and rendered both ways, to keep the test to one run of
 * 13 folds.
 */
class ValidateProposalFirstTest {

    @TempDir
    static Path tmp;

    static ValidationReport report;
    static String text;
    static JsonNode json;

    @BeforeAll
    static void validateDemoOnce() throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        PluginRegistry reg = Registries.load(new GlobalOptions(), new PrintWriter(new StringWriter()));
        LoadedCampaign lc = LoadedCampaign.open(campaign, reg);
        report = Validation.run(lc, reg, ValidateCommand.DEFAULT_SEED);
        StringWriter sw = new StringWriter();
        PrintWriter pw = new PrintWriter(sw);
        ValidateCommand.printTable(report, ValidateCommand.DEFAULT_SEED, false, pw);
        pw.flush();
        text = sw.toString();
        json = new ObjectMapper().readTree(ValidateCommand.json(report, ValidateCommand.DEFAULT_SEED));
    }

    @Test
    void textListsTheProposalSurrogateFirstForEveryOutcome() {
        assertTrue(text.contains("First per outcome: physics+gp, the proposal surrogate"), text);
        List<String> lines = text.lines().toList();
        for (OutcomeValidation o : report.outcomes()) {
            int at = -1;
            for (int i = 0; i < lines.size(); i++) {
                if (lines.get(i).startsWith(o.outcome() + " ")) {
                    at = i;
                }
            }
            assertTrue(at >= 0, o.outcome() + " row in\n" + text);
            assertTrue(lines.get(at).matches(".*\\s" + java.util.regex.Pattern.quote(Validation.PROPOSAL) + "\\s.*"),
                    "first row of " + o.outcome() + " is the proposal surrogate: " + lines.get(at));
        }
    }

    @Test
    void jsonPutsProposalSurrogateFirstAndTheComparisonsAfter() {
        for (JsonNode out : json.get("outcomes")) {
            Iterator<String> names = out.fieldNames();
            assertEquals("outcome", names.next());
            assertEquals("scale", names.next());
            assertEquals("proposal_surrogate", names.next(), "proposal_surrogate is the first score block");
            JsonNode p = out.get("proposal_surrogate");
            assertEquals("physics+gp", p.get("surrogate").asText());
            // the demo log has 14 runs, one failed: 13 held out
            assertEquals(13, p.get("score").get("n").asInt(), out.get("outcome").asText());
            Iterator<String> by = out.get("by_surrogate").fieldNames();
            assertEquals("physics+gp", by.next(), "comparisons follow the proposal surrogate");
            assertEquals(List.of("physics", "gp", "mean"), List.of(by.next(), by.next(), by.next()));
            assertTrue(p.get("verdict").asText().startsWith("proposal surrogate (physics+gp, as terrace propose"
                    + " builds it) on " + out.get("outcome").asText()), p.get("verdict").asText());
        }
    }

    @Test
    void verdictNamesTheProposalSurrogateWithCoverageCountsAndTheBaseline() {
        for (OutcomeValidation o : report.outcomes()) {
            Score p = o.score(Validation.PROPOSAL).orElseThrow();
            Score mean = o.score(Validation.MEAN).orElseThrow();
            String v = o.proposalVerdict();
            assertTrue(report.verdict().contains(v), "the per-outcome line is in the verdict: " + v);
            boolean beats = (o.forClasses() ? p.logLoss() < Validation.NO_BETTER_THAN_MEAN * mean.logLoss()
                    : p.rmse() < Validation.NO_BETTER_THAN_MEAN * mean.rmse());
            assertTrue(v.contains(beats ? "; beats the " : "; does not beat the "), v);
            if (!o.forClasses()) {
                assertTrue(v.contains("90 % intervals cover " + p.hits() + " of " + p.n() + " held-out runs"), v);
                assertTrue(v.contains("binomial"), v);
            }
            // the proposal line comes before the comparison lines of the same outcome
            int first = report.verdict().indexOf(v);
            for (int i = 0; i < first; i++) {
                assertTrue(!report.verdict().get(i).contains(" predicts " + o.outcome() + " best"),
                        report.verdict().toString());
            }
        }
        assertTrue(text.contains("  * proposal surrogate (physics+gp"), text);
    }
}
