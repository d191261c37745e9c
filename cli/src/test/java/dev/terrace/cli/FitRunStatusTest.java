package dev.terrace.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.fit.FitResults.ModelFit;
import dev.terrace.core.fit.FitResults.RunStatus;
import dev.terrace.core.fit.FitResults.RunUse;
import dev.terrace.core.model.RecipeConverter;
import dev.terrace.models.IslandNucleationModel;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.PrintWriter;
import java.io.StringReader;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.Set;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code fit} accounts for every run: used, censored (through the Tobit likelihood) or excluded with
 * the reason, in the table and in the JSON. The campaign and its runs are invented for this test.
 */
class FitRunStatusTest {

    /** Invented campaign (test design): Ga islands on GaAs, the island-nucleation model alone. */
    static final String CAMPAIGN = String.join("\n",
            "# INVENTED campaign for a test; not a lab's data",
            "campaign: status-test",
            "material: {substrate: GaAs, deposit: Ga, group_v: As}",
            "parameters:",
            "  t: {unit: degC, min: 150, max: 350, role: substrate_temperature}",
            "  rate: {unit: ML/s, min: 0.02, max: 0.5, scale: log, role: deposition_rate}",
            "  amount: {unit: ML, min: 1, max: 5, role: coverage}",
            "outcomes:",
            "  density: {unit: cm^-2, scale: log, role: island_density}",
            "models: [island-nucleation]",
            "runs: runs.csv",
            "");

    /**
     * Eight ok runs generated from the model's defaults with 15 % lognormal scatter (test design), then a
     * failed run, a run whose density is censored ({@code <X} at twice the model's value, as when a dot
     * count falls below detection) and a run without its deposition rate.
     */
    static Path campaign(Path dir) throws Exception {
        Files.createDirectories(dir);
        Path yaml = dir.resolve("campaign.yaml");
        Files.writeString(yaml, CAMPAIGN, StandardCharsets.UTF_8);
        Campaign c = CampaignReader.parse(yaml, new StringReader(CAMPAIGN), null).campaign();
        IslandNucleationModel m = new IslandNucleationModel();
        ParameterValues truth = ParameterValues.defaults(m.parameters());
        Random r = new Random(3);
        StringBuilder csv = new StringBuilder("# INVENTED runs for a test\nrun_id,t,rate,amount,density,status\n");
        for (int i = 0; i < 8; i++) {
            double t = 150 + 25 * i;
            double rate = 0.02 * Math.pow(25, (i * 3 % 8) / 7.0);
            double amount = 1 + 0.5 * i;
            csv.append(String.format(Locale.ROOT, "R%02d,%.1f,%.4f,%.2f,%.4e,ok%n", i, t, rate, amount,
                    density(m, c, truth, t, rate, amount) * Math.exp(0.15 * r.nextGaussian())));
        }
        csv.append("F01,260,0.1,3,,failed\n");
        csv.append(String.format(Locale.ROOT, "C01,340,0.05,2,<%.3e,ok%n", 2 * density(m, c, truth, 340, 0.05, 2)));
        csv.append("M01,220,,3,3e9,ok\n");
        Files.writeString(dir.resolve("runs.csv"), csv, StandardCharsets.UTF_8);
        return yaml;
    }

    static double density(IslandNucleationModel m, Campaign c, ParameterValues v, double t, double rate, double amount) {
        Conditions cond = RecipeConverter.conditions(c, Map.of("t", t, "rate", rate, "amount", amount), Map.of());
        Prediction p = m.predict(cond, c.surface(), v);
        return p.value(Role.ISLAND_DENSITY).orElseThrow();
    }

    @Test
    void theTableGivesEveryRunItsStatus(@TempDir Path tmp) throws Exception {
        CliTest.Outcome o = run("fit", campaign(tmp.resolve("c")).toString(), "--quiet");
        assertEquals(0, o.code(), o.err() + o.out());
        String out = o.out();
        assertTrue(out.contains("runs (8 used, 1 censored, 2 excluded):"), out);
        for (int i = 0; i < 8; i++) {
            assertTrue(out.lines().anyMatch(l -> l.matches("\\s+R0\\d\\s+used\\s*")), out);
        }
        String f01 = line(out, "F01");
        assertTrue(f01.contains("excluded") && f01.contains("failed"), f01);
        String c01 = line(out, "C01");
        assertTrue(c01.contains("censored") && c01.contains("density <") && c01.contains("Tobit"), c01);
        String m01 = line(out, "M01");
        assertTrue(m01.contains("excluded") && m01.contains("deposition_rate"), m01);
        assertTrue(out.contains("(1 censored: Tobit terms, not in the RMSE)"), out);
    }

    @Test
    void theJsonListsEveryRunNotUsedAndTheCensoredOnes(@TempDir Path tmp) throws Exception {
        CliTest.Outcome o = run("fit", campaign(tmp.resolve("c")).toString(), "--format", "json", "--quiet");
        assertEquals(0, o.code(), o.err());
        JsonNode m = new ObjectMapper().readTree(o.out()).get("models").get(0);
        assertEquals(9, m.get("runs_used").asInt(), "eight measured runs plus the censored one");
        JsonNode ex = m.get("runs_excluded");
        assertEquals(2, ex.size(), ex.toString());
        assertEquals("F01", ex.get(0).get("run_id").asText());
        assertTrue(ex.get(0).get("reason").asText().contains("failed"), ex.toString());
        assertEquals("M01", ex.get(1).get("run_id").asText());
        assertTrue(ex.get(1).get("reason").asText().contains("deposition_rate"), ex.toString());
        JsonNode cen = m.get("runs_censored");
        assertEquals(1, cen.size(), cen.toString());
        assertEquals("C01", cen.get(0).get("run_id").asText());
        JsonNode st = m.get("run_status");
        assertEquals(11, st.size(), "every run of the log");
        Set<String> seen = new HashSet<>();
        for (JsonNode s : st) {
            seen.add(s.get("run_id").asText());
            assertTrue(Set.of("used", "censored", "excluded").contains(s.get("status").asText()), s.toString());
        }
        assertEquals(11, seen.size());
        assertEquals(1, m.get("fit").get("outcomes").get("density").get("censored").asInt());
    }

    @Test
    void longLogsGroupIdenticalStatusesAfterTheFirstLines() {
        List<RunStatus> runs = new ArrayList<>();
        for (int i = 0; i < 60; i++) {
            runs.add(i % 10 == 9 ? new RunStatus("X" + i, RunUse.EXCLUDED, "the run failed")
                    : new RunStatus("R" + i, RunUse.USED, ""));
        }
        ModelFit f = new ModelFit("m", 54, List.of(), List.of(), Map.of(), List.of(), List.of(), List.of(), List.of(),
                new double[0][], ParameterValues.defaults(List.of()), List.of(), "", runs);
        StringWriter sw = new StringWriter();
        FitCommand.printRuns(f, new PrintWriter(sw, true));
        List<String> lines = sw.toString().lines().toList();
        assertTrue(lines.get(0).contains("54 used, 0 censored, 6 excluded"), lines.get(0));
        // header, 39 single lines, the "more runs" line and one line per group (used; the failed ones)
        assertEquals(1 + 39 + 1 + 2, lines.size(), sw.toString());
        assertTrue(lines.get(40).contains("21 more runs"), lines.get(40));
        // runs 39-59 remain: X39, X49 and X59 failed, 18 used; groups in order of first appearance
        assertTrue(lines.get(41).contains("3 x") && lines.get(41).contains("excluded  the run failed")
                && lines.get(41).contains("(X39, X49, X59)"), lines.get(41));
        assertTrue(lines.get(42).contains("18 x") && lines.get(42).contains("used")
                && lines.get(42).contains("R40, R41, R42, R43, R44, R45, ..."), lines.get(42));
    }

    static String line(String out, String runId) {
        return out.lines().filter(l -> l.trim().startsWith(runId + " ")).findFirst().orElse("(no line for " + runId + ")");
    }
}
