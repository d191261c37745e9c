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
     * Most runs a log may hold for the commands that fit models or propose from them: 100,000. The
     * growth-model fits evaluate every run at every step of the optimiser, so their time grows in
     * proportion to the runs (a 1000-run fit takes minutes on a 2-core machine; DEVELOPERS.md,
     * benchmarks), and the classifiers hold a feature row per run; beyond this size a command would
     * run for hours or exhaust the memory instead of answering. {@code terrace check} reads logs of
     * any length up to {@link dev.terrace.core.io.InputFiles#MAX_TABLE_BYTES}. Own choice.
     */
    public static final int MAX_MODEL_RUNS = 100_000;

    /** System property overriding {@link #MAX_MODEL_RUNS} (a positive integer), for tests. */
    public static final String MAX_MODEL_RUNS_PROPERTY = "terrace.maxModelRuns";

    /**
     * Reads a campaign file and its run log for a command that fits models, refusing logs longer
     * than {@link #MAX_MODEL_RUNS}. Model ids are checked against the registry.
     *
     * @param campaignFile the campaign YAML file
     * @param registry     the available growth models, or null to skip the model-id check
     * @return the loaded campaign; never null
     * @throws InputException when either file has errors (all of them are listed; when the campaign
     *                        itself is broken its run log is not read)
     * @throws IOException    on read failures other than a missing file
     */
    public static LoadedCampaign open(Path campaignFile, PluginRegistry registry) throws InputException, IOException {
        LoadedCampaign lc = openAnySize(campaignFile, registry);
        int max = maxModelRuns();
        int n = lc.runLog().runs().size();
        if (n > max) {
            throw new InputException(Diagnostic.error(lc.runLog().file(), 0, 0, String.format(java.util.Locale.ROOT,
                    "the run log holds %,d runs; Terrace fits models and proposes from at most %,d runs"
                            + " ('terrace check' reads longer logs); keep the runs that matter for this campaign,"
                            + " for example the most recent ones, in a run log of their own", n, max)));
        }
        return lc;
    }

    /** @return the run limit in force: {@value #MAX_MODEL_RUNS_PROPERTY} when set, else {@link #MAX_MODEL_RUNS} */
    static int maxModelRuns() {
        String v = System.getProperty(MAX_MODEL_RUNS_PROPERTY);
        if (v == null || v.isBlank()) {
            return MAX_MODEL_RUNS;
        }
        try {
            int n = Integer.parseInt(v.strip());
            if (n > 0) {
                return n;
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw new IllegalArgumentException(MAX_MODEL_RUNS_PROPERTY + " must be a positive integer, found '" + v + "'");
    }

    /**
     * Reads a campaign file and its run log whatever the number of runs (for {@code terrace check}).
     *
     * @param campaignFile the campaign YAML file
     * @param registry     the available growth models, or null to skip the model-id check
     * @return the loaded campaign; never null
     * @throws InputException when either file has errors
     * @throws IOException    on read failures other than a missing file
     */
    public static LoadedCampaign openAnySize(Path campaignFile, PluginRegistry registry)
            throws InputException, IOException {
        CampaignReader.Result r = CampaignReader.read(campaignFile, registry == null ? null : registry.ids());
        RunLog log = RunLogReader.read(r.campaign());
        List<Diagnostic> warnings = new ArrayList<>(r.warnings());
        warnings.addAll(log.warnings());
        warnings.addAll(CampaignConsistency.warnings(r.campaign(), log, registry));
        return new LoadedCampaign(r.campaign(), log, warnings);
    }
}
