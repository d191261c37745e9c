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
    void unknownSeriesIsAUsageError(@TempDir Path tmp) {
        CliTest.Outcome o = CliTest.run("demo", "--series", "no-such", "--dir", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("sk-dots"), o.err());
        assertFalse(Files.exists(tmp.resolve("x")));
    }
}
