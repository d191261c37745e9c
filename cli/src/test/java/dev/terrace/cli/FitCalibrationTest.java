package dev.terrace.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.model.RecipeConverter;
import dev.terrace.models.IslandNucleationModel;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Role;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.Random;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code check} and {@code fit} report the thermocouple offset and the earlier series' priors. The
 * campaigns and runs are invented for this test (a spring and an autumn series of Ga islands in a
 * made-up chamber whose thermocouple reads 12 K low).
 */
class FitCalibrationTest {

    static final double OFFSET_K = 12;

    static String campaign(String id, String extra) {
        return String.join("\n",
                "# INVENTED campaign for a test; not a lab's data",
                "campaign: " + id,
                "material: {substrate: GaAs, deposit: Ga, group_v: As}",
                "parameters:",
                "  t: {unit: degC, min: 150, max: 350, role: substrate_temperature}",
                "  rate: {unit: ML/s, min: 0.02, max: 0.5, scale: log, role: deposition_rate}",
                "  amount: {unit: ML, min: 1, max: 5, role: coverage}",
                "outcomes:",
                "  density: {unit: cm^-2, scale: log, role: island_density}",
                "models: [island-nucleation]",
                "temperature_calibration:",
                "  points:",
                "    - {event: indium_melting, reading: 144.5985 degC, reading_uncertainty: 1 K}",
                extra,
                "");
    }

    /** Runs from the model's defaults at true temperature reading + 12 K, 15 % lognormal scatter (test design). */
    static Path write(Path dir, String id, String extra, int n, long seed) throws Exception {
        Files.createDirectories(dir);
        Path yaml = dir.resolve("campaign.yaml");
        String text = campaign(id, extra);
        Files.writeString(yaml, text, StandardCharsets.UTF_8);
        Campaign c = CampaignReader.parse(Path.of("/virtual/c.yaml"), new StringReader(campaign(id, "")), null)
                .campaign().withTemperatureCalibration(dev.terrace.core.campaign.TemperatureCalibration.NONE);
        IslandNucleationModel m = new IslandNucleationModel();
        ParameterValues truth = ParameterValues.defaults(m.parameters());
        Random r = new Random(seed);
        StringBuilder csv = new StringBuilder("# INVENTED runs for a test\nrun_id,t,rate,amount,density\n");
        for (int i = 0; i < n; i++) {
            double t = 150 + 200.0 * i / (n - 1);
            double rate = 0.02 * Math.pow(25, (i * 3 % n) / (double) (n - 1));
            double amount = 1 + 4.0 * i / (n - 1);
            Conditions cond = RecipeConverter.conditions(c, Map.of("t", t + OFFSET_K, "rate", rate, "amount", amount),
                    Map.of());
            double d = m.predict(cond, c.surface(), truth).value(Role.ISLAND_DENSITY).orElseThrow();
            csv.append(String.format(Locale.ROOT, "R%02d,%.1f,%.4f,%.2f,%.4e%n", i, t, rate, amount,
                    d * Math.exp(0.15 * r.nextGaussian())));
        }
        Files.writeString(dir.resolve("runs.csv"), csv, StandardCharsets.UTF_8);
        return yaml;
    }

    @Test
    void checkShowsTheOffsetLine(@TempDir Path tmp) throws Exception {
        Path f = write(tmp.resolve("c"), "check-offset", "", 6, 1);
        CliTest.Outcome o = run("check", f.toString(), "--quiet");
        assertEquals(0, o.code(), o.err() + o.out());
        // In freezing point 156.5985 degC (ITS-90, Preston-Thomas, Metrologia 27, 3 (1990)) read as 144.5985 degC
        assertTrue(o.out().contains("T offset  +12.0 K +/- 1.0 K (1 sd) from 1 calibration point"), o.out());
    }

    @Test
    void fitReportsTheOffsetAndEachPriorInTextAndJson(@TempDir Path tmp) throws Exception {
        write(tmp.resolve("spring"), "spring", "", 16, 2);
        Path autumn = write(tmp.resolve("autumn"), "autumn", "priors: [../spring/campaign.yaml]", 5, 3);
        CliTest.Outcome o = run("fit", autumn.toString(), "--quiet");
        assertEquals(0, o.code(), o.err() + o.out());
        String out = o.out();
        assertTrue(out.contains("Thermocouple offset +12.0 K added to every substrate-temperature reading"), out);
        assertTrue(out.contains("Priors from earlier series"), out);
        assertTrue(out.contains("prior from series spring (../spring/campaign.yaml, 16 runs)"), out);

        CliTest.Outcome j = run("fit", autumn.toString(), "--format", "json", "--quiet");
        assertEquals(0, j.code(), j.err());
        JsonNode root = new ObjectMapper().readTree(j.out());
        assertEquals(12, root.get("temperature_offset").get("value_k").asDouble(), 1e-9);
        assertEquals(1, root.get("temperature_offset").get("calibration").get("points").asInt());
        JsonNode priors = root.get("priors");
        assertTrue(priors.size() >= 1, priors.toString());
        for (JsonNode p : priors) {
            assertTrue(p.get("prior").get("ci95").isArray(), p.toString());
            assertTrue(p.has("data") && p.has("combined") && p.has("conflict"), p.toString());
            assertTrue(!p.get("conflict").asBoolean(), "same chamber, same truth: no conflict " + p);
        }
    }

    @Test
    void aContradictedPriorIsFlaggedInTextAndJson() throws Exception {
        // a prior of 0.70 +/- 0.02 eV against these runs' own 0.90 (0.86 to 0.94) eV: z = 0.20 / sqrt(0.02^2 +
        // 0.0204^2) = 7.0 (by hand), beyond the 3-sd rule
        var prior = new dev.terrace.core.fit.ParameterPrior("island-nucleation", "diffusion_barrier", "eV", false,
                0.70, 0.02, "series spring (invented)", Map.of());
        var check = new dev.terrace.core.fit.PriorCheck("island-nucleation", prior, 0.90, 0.86, 0.94, 0.80, 0.77, 0.83,
                (0.90 - 0.70) / Math.sqrt(0.02 * 0.02 + Math.pow(0.04 / 1.959964, 2)));
        assertTrue(check.conflict());
        var fit = new dev.terrace.core.fit.CampaignFit(
                new dev.terrace.core.fit.FitResults.FitReport("x", 0, 0, java.util.List.of(), 1),
                dev.terrace.core.fit.OffsetResult.fromPoints(dev.terrace.core.campaign.TemperatureOffset.NONE),
                java.util.List.of(prior), java.util.List.of(check), java.util.List.of());
        java.io.StringWriter sw = new java.io.StringWriter();
        FitExtras.printPriors(fit, new java.io.PrintWriter(sw, true));
        assertTrue(sw.toString().contains("island-nucleation diffusion_barrier (eV)   CONTRADICTED"), sw.toString());
        assertTrue(sw.toString().contains("these runs contradict the prior (z = 7.0"), sw.toString());
        ObjectMapper om = new ObjectMapper();
        var root = om.createObjectNode();
        FitExtras.json(fit, root);
        JsonNode p = root.get("priors").get(0);
        assertTrue(p.get("conflict").asBoolean());
        assertEquals(7.0, p.get("z").asDouble(), 0.05);
        assertTrue(p.get("warning").asText().contains("contradict"), p.toString());
        assertTrue(root.get("temperature_offset").get("ci95_k").isNull(), "no points: no interval");
    }
}
