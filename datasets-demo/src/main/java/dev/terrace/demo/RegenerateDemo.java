package dev.terrace.demo;

import dev.terrace.core.InputException;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;

import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Path;
import java.util.List;

/**
 * Regenerates the bundled demo run log, {@code ga-dots/runs.csv}: the demo campaign's
 * {@link GrowerDesign} plan of {@link GrowerDesign#DEFAULT_RUNS} runs grown in a
 * {@link VirtualChamber} with the default truth, both with seed {@link #SEED}. The output is
 * invented data. A test checks that the bundled file equals this output byte for byte, so the
 * file and the code cannot drift apart; after changing the chamber, run
 * {@code java dev.terrace.demo.RegenerateDemo > datasets-demo/src/main/resources/dev/terrace/demo/ga-dots/runs.csv}.
 *
 * @since 0.1
 */
public final class RegenerateDemo {

    /** Seed of the bundled demo log, 20260202 (the date of its first invented run). */
    public static final long SEED = 20260202L;

    private RegenerateDemo() {
    }

    /**
     * @return the bundled demo campaign, parsed; never null
     * @throws IOException    when the bundled campaign is missing from the build
     * @throws InputException when it does not parse
     */
    public static Campaign demoCampaign() throws IOException, InputException {
        String yaml = DemoCampaign.files().get(DemoCampaign.CAMPAIGN_FILE);
        return CampaignReader.parse(Path.of(DemoCampaign.CAMPAIGN_FILE), new StringReader(yaml), null).campaign();
    }

    /**
     * @return the text the bundled {@code runs.csv} must hold; never null
     * @throws IOException    when the bundled campaign is missing from the build
     * @throws InputException when it does not parse
     */
    public static String regenerate() throws IOException, InputException {
        Campaign campaign = demoCampaign();
        List<Recipe> plan = GrowerDesign.plan(campaign, SEED);
        return DemoLogWriter.write(VirtualChamber.of(campaign, SEED), plan, true);
    }

    /**
     * Prints the regenerated demo log to standard output.
     *
     * @param args ignored
     * @throws Exception when the bundled campaign cannot be read
     */
    public static void main(String[] args) throws Exception {
        System.out.print(regenerate());
        System.out.flush();
    }
}
