package dev.terrace.core;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.io.SafeFiles;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.core.runlog.RunLogReader;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * A campaign with its run log, both read and validated: the starting point of every command.
 *
 * @param campaign the campaign; never null
 * @param runLog   its runs; never null
 * @param warnings warnings from both files, in file order, then those of {@link CampaignConsistency};
 *                 never null
 * @since 0.1
 */
public record LoadedCampaign(Campaign campaign, RunLog runLog, List<Diagnostic> warnings) {

    /** Copies the list. */
    public LoadedCampaign {
        Objects.requireNonNull(campaign);
        Objects.requireNonNull(runLog);
        warnings = List.copyOf(warnings);
    }

    /**
     * The files this campaign was read from, which no output may replace.
     *
     * @return the campaign file, the run log and the proposal journal (which need not exist yet);
     *         never null
     */
    public List<SafeFiles.Input> inputs() {
        return List.of(new SafeFiles.Input(campaign.file(), "campaign file"),
                new SafeFiles.Input(runLog.file(), "run log"),
                new SafeFiles.Input(campaign.journal(), "proposal journal"));
    }

    /**
     * Reads a campaign file and its run log. Model ids are checked against the registry.
     *
     * @param campaignFile the campaign YAML file
     * @param registry     the available growth models, or null to skip the model-id check
     * @return the loaded campaign; never null
     * @throws InputException when either file has errors (all of them are listed; when the campaign
     *                        itself is broken its run log is not read)
     * @throws IOException    on read failures other than a missing file
     */
    public static LoadedCampaign open(Path campaignFile, PluginRegistry registry) throws InputException, IOException {
        CampaignReader.Result r = CampaignReader.read(campaignFile, registry == null ? null : registry.ids());
        RunLog log = RunLogReader.read(r.campaign());
        List<Diagnostic> warnings = new ArrayList<>(r.warnings());
        warnings.addAll(log.warnings());
        warnings.addAll(CampaignConsistency.warnings(r.campaign(), log, registry));
        return new LoadedCampaign(r.campaign(), log, warnings);
    }
}
