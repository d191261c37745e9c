package dev.terrace.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@code check} counts the cells recorded only as a bound, per outcome. Invented campaign and runs. */
class CheckCensoredTest {

    static final String CAMPAIGN = String.join("\n",
            "# INVENTED campaign for a test; not a lab's data",
            "campaign: censored-check",
            "material: {substrate: GaAs, deposit: Ga, group_v: As}",
            "parameters:",
            "  t: {unit: degC, min: 150, max: 350, role: substrate_temperature}",
            "outcomes:",
            "  density: {unit: cm^-2, scale: log, role: island_density}",
            "  diameter: {unit: nm, role: island_diameter}",
            "  height: {unit: nm}",
            "models: []",
            "runs: runs.csv",
            "");

    @Test
    void eachOutcomeWithCensoredCellsGetsOneLine(@TempDir Path tmp) throws Exception {
        Path yaml = tmp.resolve("campaign.yaml");
        Files.writeString(yaml, CAMPAIGN, StandardCharsets.UTF_8);
        Files.writeString(tmp.resolve("runs.csv"), String.join("\n",
                "run_id,t,density,diameter,height",
                "A,200,<1e8,30,5",
                "B,220,<=5e8,31,>12",
                "C,240,>3e11,32,6",
                "D,260,2e10,33,7",
                ""), StandardCharsets.UTF_8);
        CliTest.Outcome o = run("check", yaml.toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        String out = o.out();
        assertTrue(out.contains("Censored cells"), out);
        // counted by hand from the four rows above: density <1e8 and <=5e8 below, >3e11 above; height >12 above
        assertTrue(out.lines().anyMatch(l -> l.matches("\\s+density\\s+2 x <X, 1 x >X, bounds 1\\.000e8 to 3\\.000e11 cm\\^-2")),
                out);
        assertTrue(out.lines().anyMatch(l -> l.matches("\\s+height\\s+0 x <X, 1 x >X, bound 12 nm")), out);
        assertFalse(out.lines().anyMatch(l -> l.trim().startsWith("diameter ") && l.contains("<X")), out);
    }

    @Test
    void aLogWithoutCensoredCellsPrintsNoSuchSection(@TempDir Path tmp) throws Exception {
        Path yaml = tmp.resolve("campaign.yaml");
        Files.writeString(yaml, CAMPAIGN, StandardCharsets.UTF_8);
        Files.writeString(tmp.resolve("runs.csv"), "run_id,t,density,diameter,height\nA,200,1e9,30,5\n",
                StandardCharsets.UTF_8);
        CliTest.Outcome o = run("check", yaml.toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        assertFalse(o.out().contains("Censored cells"), o.out());
    }
}
