package dev.terrace.demo;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.core.runlog.RunLogReader;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The second bundled demo (invented InAs/GaAs SK dot series) and its generator. */
class SkDotChamberTest {

    @Test
    void bundledRunLogIsTheGeneratorsOutput() throws Exception {
        // If this fails after a change to the invented truth, regenerate the file with SkDotChamber.main.
        assertEquals(DemoSeries.SK_DOTS.files().get("runs.csv"), SkDotChamber.runLog(SkDotChamber.SEED));
    }

    @Test
    void bundledCampaignReadsAndSaysItIsInvented(@TempDir Path tmp) throws Exception {
        Path file = DemoSeries.SK_DOTS.copyTo(tmp.resolve("sk"));
        Campaign c = CampaignReader.read(file, null).campaign();
        assertEquals("sk-dots-demo", c.id());
        assertTrue(DemoSeries.SK_DOTS.files().get("campaign.yaml").startsWith("# SECOND DEMO CAMPAIGN - INVENTED DATA."));
        assertTrue(DemoSeries.SK_DOTS.scenario().startsWith("invented data"));
        RunLog log = RunLogReader.read(c);
        assertEquals(SkDotChamber.PLAN.size(), log.runs().size());
        // the series brackets the onset: censored cells below it, measured densities above it
        assertTrue(log.runs().stream().anyMatch(r -> r.censored("dot_density").isPresent()));
        assertTrue(log.runs().stream().filter(r -> r.number("dot_density").isPresent()).count() >= 8);
    }

    @Test
    void noDotsBelowTheInventedOnsetAndAPowerLawAboveIt() {
        assertEquals(0.0, SkDotChamber.trueDensity(773.15, 0.05, SkDotChamber.TRUE_CRITICAL_ML - 0.01));
        double n1 = SkDotChamber.trueDensity(773.15, 0.05, SkDotChamber.TRUE_CRITICAL_ML + 0.5);
        double n2 = SkDotChamber.trueDensity(773.15, 0.05, SkDotChamber.TRUE_CRITICAL_ML + 1.0);
        assertEquals(Math.pow(2, SkDotChamber.TRUE_EXPONENT), n2 / n1, 1e-12);
        assertEquals(SkDotChamber.N_REF_PER_CM2, n2, 1e-3);
    }

    @Test
    void seriesAreFoundByTheirCommandLineNames() {
        assertEquals(DemoSeries.SK_DOTS, DemoSeries.byKey("sk-dots").orElseThrow());
        assertEquals(DemoSeries.GA_DOTS, DemoSeries.byKey("ga-dots").orElseThrow());
        assertTrue(DemoSeries.byKey("nope").isEmpty());
    }
}
