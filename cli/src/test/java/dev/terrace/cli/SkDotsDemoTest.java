package dev.terrace.cli;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.fit.FitResults.Estimate;
import dev.terrace.core.fit.ModelFitter;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.demo.SkDotChamber;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@code terrace demo --series sk-dots}: the invented InAs/GaAs SK dot series runs the whole job. */
class SkDotsDemoTest {

    @Test
    void skDotsDemoRunsAndTheFitFindsTheCriticalThickness(@TempDir Path tmp) throws Exception {
        Path dir = tmp.resolve("sk");
        CliTest.Outcome o = CliTest.run("demo", "--series", "sk-dots", "--dir", dir.toString());
        assertEquals(0, o.code(), o.err() + o.out());
        assertTrue(o.out().contains("invented data: InAs/GaAs(001) strained-layer dots"), o.out());
        assertTrue(o.out().contains("critical_thickness"), o.out());
        assertFalse(o.out().toLowerCase(java.util.Locale.ROOT).contains("ga droplet"), o.out());
        assertTrue(Files.exists(dir.resolve("report.html")));
        // the fit with the command's seed finds the invented truth (SkDotChamber.TRUE_CRITICAL_ML = 1.64 ML)
        LoadedCampaign lc = LoadedCampaign.open(dir.resolve("campaign.yaml"), PluginRegistry.builder().build());
        Estimate e = ModelFitter.fit(lc, PluginRegistry.builder().build(), FitCommand.DEFAULT_SEED).models().get(0)
                .estimate("critical_thickness");
        assertFalse(e.held(), e.toString());
        assertTrue(e.lo() <= SkDotChamber.TRUE_CRITICAL_ML && SkDotChamber.TRUE_CRITICAL_ML <= e.hi(), e.toString());
        // and says more than the prior range: narrower than 0.3 ML (test design choice)
        assertTrue(e.hi() - e.lo() < 0.3, e.toString());
    }

    @Test
    void skDotsRunLogHasTheProposalColumnSoTheTrackRecordWorks(@TempDir Path tmp) throws Exception {
        Path campaign = dev.terrace.demo.DemoSeries.SK_DOTS.copyTo(tmp.resolve("sk"));
        String header = Files.readAllLines(campaign.resolveSibling("runs.csv")).stream()
                .filter(l -> l.startsWith("run_id,")).findFirst().orElseThrow();
        assertTrue(header.contains(",proposal,"), header);
        CliTest.Outcome fresh = CliTest.run("check", campaign.toString());
        assertEquals(0, fresh.code(), fresh.err());
        assertEquals("", fresh.err().strip(), "check on the bundled series warns about nothing");
        CliTest.Outcome p = CliTest.run("propose", campaign.toString(), "--batch", "2", "--format", "json", "--quiet");
        assertEquals(0, p.code(), p.err());
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("\"id\"\\s*:\\s*\"(P-[0-9a-f]+)\"").matcher(p.out());
        assertTrue(m.find(), p.out());
        String top = m.group(1);
        // invented outcomes of the grown proposal: a density in the target, dots on RHEED
        CliTest.Outcome r = CliTest.run("record", campaign.toString(), "--proposal", top, "dot_density=3.1e10",
                "rheed=dots", "--quiet");
        assertEquals(0, r.code(), r.err());
        assertTrue(Files.readString(campaign.resolveSibling("runs.csv")).contains("," + top + ","),
                "the new row names its proposal");
        CliTest.Outcome c = CliTest.run("check", campaign.toString());
        assertEquals(0, c.code(), c.err());
        assertTrue(c.out().contains("Track record (runs that followed a proposal"), c.out());
        assertTrue(c.out().contains("K17  " + top), c.out());
        assertEquals("", c.err().strip(), "no warnings after recording");
    }

    @Test
    void unknownSeriesIsAUsageError(@TempDir Path tmp) {
        CliTest.Outcome o = CliTest.run("demo", "--series", "no-such", "--dir", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("sk-dots"), o.err());
        assertFalse(Files.exists(tmp.resolve("x")));
    }
}
