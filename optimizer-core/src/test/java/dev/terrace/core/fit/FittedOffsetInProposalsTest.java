package dev.terrace.core.fit;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;
import java.util.Locale;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * With {@code fit_offset: true} the proposals' surrogate applies the same fitted thermocouple offset
 * as {@code terrace fit} (profile likelihood, see {@link CampaignFit}), not the calibration points'
 * own estimate. The runs are invented with a known 20 K offset and the accepted reference
 * temperatures of {@link CampaignFitTest} (In melting point 156.5985 degC, ITS-90 fixed point;
 * GaAs oxide desorption 580 +- 20 degC, as cited there).
 */
class FittedOffsetInProposalsTest {

    @Test
    void proposalsUseTheOffsetThatTheFitFinds(@TempDir Path dir) throws Exception {
        PluginRegistry reg = CampaignFitTest.registry(true);
        double trueOffset = 20; // test design choice
        Random r = new Random(5);
        String cal = String.format(Locale.ROOT, String.join("\n",
                "temperature_calibration:",
                "  fit_offset: true",
                "  points:",
                "    - {event: gaas_oxide_desorption, reading: %.2f degC}"), 580 - trueOffset + 15);
        Path f = CampaignFitTest.write(dir, "a", CampaignFitTest.campaign("offset-propose", cal),
                CampaignFitTest.runs(12, CampaignFitTest.TRUE_ENERGY, trueOffset, r));
        LoadedCampaign lc = LoadedCampaign.open(f, reg);
        long seed = 3;
        OffsetResult fitted = CampaignFit.run(lc, reg, seed).offset();
        double pointsOnly = lc.campaign().temperatureCalibration().estimate().offsetK();
        assertTrue(Math.abs(fitted.value() - pointsOnly) > 1,
                "the runs move the offset away from the points' own: " + fitted.value() + " vs " + pointsOnly);
        CampaignSurrogate sur = CampaignSurrogate.build(lc, reg, true, seed);
        assertEquals(fitted.value(), sur.campaign().temperatureCalibration().appliedOffsetK(), 1e-9);
        assertTrue(sur.notes().stream().anyMatch(n -> n.startsWith("thermocouple offset fitted")), sur.notes().toString());
    }
}
