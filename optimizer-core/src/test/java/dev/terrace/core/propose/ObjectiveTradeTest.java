package dev.terrace.core.propose;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.propose.Proposer.Reference;
import org.junit.jupiter.api.Test;

import java.io.StringReader;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The reason line of an objective campaign, checked on hand-worked arithmetic: a minimize target on
 * an invented anneal time, reference recipe at yield 0.62 and 100 s.
 */
class ObjectiveTradeTest {

    static Campaign campaign(String goal) throws Exception {
        String y = "campaign: trade-example\nmaterial: {substrate: GaAs}\nparameters:\n"
                + "  t: {unit: degC, min: 100, max: 300}\noutcomes:\n  anneal_time: {unit: s}\n"
                + "targets:\n  anneal_time: {" + goal + ": true}\n";
        return CampaignReader.parse(Path.of("/virtual/trade.yaml"), new StringReader(y), null).campaign();
    }

    @Test
    void saysWhatYieldIsTradedForHowMuchObjective() throws Exception {
        Campaign c = campaign("minimize");
        Reference ref = new Reference("P-00000001", 0.62, 100);
        // (82 - 100) / 100 = -18 %: lower is better for a minimize target, so yield is traded for it
        assertEquals("trades predicted yield 0.62 to 0.48 for 18 % lower anneal_time than the highest-yield recipe"
                + " found (P-00000001)", ObjectiveTrade.reason(c, ref, "P-00000002", 0.48, 82));
        // (112 - 100) / 100 = +12 % is worse: the recipe only explores
        assertEquals("predicted yield 0.62 to 0.48 with 12 % higher anneal_time than the highest-yield recipe found"
                + " (P-00000001): explores where anneal_time is uncertain",
                ObjectiveTrade.reason(c, ref, "P-00000002", 0.48, 112));
        assertEquals("highest predicted yield found (0.62), with predicted anneal_time 100 s",
                ObjectiveTrade.reason(c, ref, "P-00000001", 0.62, 100));
        // |100.3 - 100| / 100 = 0.3 % < 0.5 %: about the same
        assertEquals("predicted yield 0.62 against 0.62, with about the same anneal_time as the highest-yield recipe"
                + " found (P-00000001)", ObjectiveTrade.reason(c, ref, "P-00000003", 0.62, 100.3));
    }

    @Test
    void aMaximizeTargetCountsHigherAsBetter() throws Exception {
        Campaign c = campaign("maximize");
        Reference ref = new Reference("P-0000000a", 0.70, 40);
        // (50 - 40) / 40 = +25 %
        assertEquals("trades predicted yield 0.70 to 0.55 for 25 % higher anneal_time than the highest-yield recipe"
                + " found (P-0000000a)", ObjectiveTrade.reason(c, ref, "P-0000000b", 0.55, 50));
        // reference objective 0: no percentage, an absolute difference with the unit
        assertEquals("trades predicted yield 0.70 to 0.55 for anneal_time higher by 3 s than the highest-yield recipe"
                + " found (P-0000000a)", ObjectiveTrade.reason(c, new Reference("P-0000000a", 0.70, 0), "P-0000000b",
                0.55, 3));
    }
}
