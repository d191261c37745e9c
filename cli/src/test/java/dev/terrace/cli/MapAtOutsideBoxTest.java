package dev.terrace.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;
import java.util.Map;

import static dev.terrace.cli.CliSafetyTest.demo;
import static dev.terrace.cli.CliSafetyTest.hashes;
import static dev.terrace.cli.CliSafetyTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code map --at NAME=VALUE} with a value outside the campaign box: the map is still drawn (exit 0)
 * and a warning names the setting, the value and the box; the inputs keep their bytes. The demo
 * campaign is invented data (its box for t_drop is 150 to 350 degC).
 */
class MapAtOutsideBoxTest {

    @Test
    void aHeldValueOutsideTheBoxIsMappedWithAWarningNamingSettingValueAndBox(@TempDir Path tmp) throws Exception {
        Path campaign = demo(tmp);
        Map<String, String> before = hashes(campaign.getParent());
        CliSafetyTest.Outcome o = run("map", campaign.toString(), "--x", "ga_rate", "--y", "as_flux", "--grid", "5",
                "--at", "t_drop=500,t_cryst=300", "-q");
        assertEquals(0, o.code(), o.err());
        assertTrue(o.err().contains("terrace: warning: --at t_drop=500 degC, outside the campaign box of t_drop,"
                + " 150 to 350 degC; the map holds it there"), o.err());
        assertFalse(o.err().contains("t_cryst=300"), "t_cryst 300 degC is inside its box (150 to 400): " + o.err());
        assertTrue(o.out().contains("held: t_drop 500 degC"), o.out());
        assertEquals(before, hashes(campaign.getParent()));
    }

    @Test
    void valuesInsideTheBoxAndTheAxesGiveNoWarning(@TempDir Path tmp) throws Exception {
        dev.terrace.core.campaign.Campaign c = dev.terrace.core.campaign.CampaignReader.read(demo(tmp), null).campaign();
        assertTrue(MapCommand.outsideBox(c, Map.of("t_drop", 350.0, "ga_amount", 1.0, "as_source", "As4"), "--at",
                "ga_rate", "as_flux").isEmpty(), "the box ends are inside");
        assertTrue(MapCommand.outsideBox(c, Map.of("t_drop", 900.0), "--at", "t_drop", "t_cryst").isEmpty(),
                "an axis is not held");
        assertEquals(1, MapCommand.outsideBox(c, Map.of("ga_amount", 0.5), "run D07", "t_drop", "t_cryst").size());
        assertTrue(MapCommand.outsideBox(c, Map.of("ga_amount", 0.5), "run D07", "t_drop", "t_cryst").get(0)
                .startsWith("run D07 holds ga_amount at 0.5 ML, outside the campaign box of ga_amount, 1 to 5 ML"));
    }
}
