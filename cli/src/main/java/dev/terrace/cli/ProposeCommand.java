package dev.terrace.cli;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.ProposeSettings;
import dev.terrace.core.propose.Proposer;
import dev.terrace.core.propose.Proposals.ProposalSet;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;

/** {@code terrace propose CAMPAIGN}: the next batch of recipes, ranked by predicted yield. */
@Command(name = "propose", mixinStandardHelpOptions = true,
        description = {"Propose the next batch of growth runs most likely to meet the campaign's targets,",
                "inside its boxes and limits, ranked by predicted yield. The run log is never changed."})
final class ProposeCommand implements Callable<Integer> {

    /**
     * Largest --explore accepted: 10 standard deviations of optimism. Beyond about 5 the optimistic
     * probability of meeting a target window is already close to 1 for nearly every recipe (the
     * normal tail beyond 5 sd is below 3e-7), so larger weights no longer tell recipes apart.
     */
    static final double MAX_EXPLORE = 10;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Mixin
    GlobalOptions global = new GlobalOptions();

    @Mixin
    OutputOptions output = new OutputOptions();

    @Parameters(index = "0", paramLabel = "CAMPAIGN", description = "The campaign YAML file.")
    Path campaignFile;

    @Option(names = "--batch", defaultValue = "" + ProposeSettings.DEFAULT_BATCH,
            description = "How many recipes to propose (default: ${DEFAULT-VALUE}).")
    int batch;

    @Option(names = "--seed", defaultValue = "" + ProposeSettings.DEFAULT_SEED,
            description = "Seed; the same seed gives the same proposals (default: ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--explore", defaultValue = "" + ProposeSettings.DEFAULT_EXPLORE,
            description = "Exploration weight: 0 proposes the highest predicted yield, also with a maximize or "
                    + "minimize target (each reason line then says what yield a recipe trades for how much objective); "
                    + "larger values favour recipes whose outcome is uncertain but could meet spec or improve the "
                    + "objective (default: ${DEFAULT-VALUE}).")
    double explore;

    @Option(names = "--within-runs", paramLabel = "MARGIN",
            description = "Keep each numeric setting within [runs min - MARGIN x span, runs max + MARGIN x span] of "
                    + "the values the ok runs used (span = runs max - runs min, on the log axis for log settings), "
                    + "inside the campaign box. 0 stays inside the runs' ranges; MARGIN is 0 to 10. Without it the "
                    + "whole campaign box is searched.")
    Double withinRuns;

    @Option(names = "--no-physics", description = "Switch the growth models off (a pure Gaussian process).")
    boolean noPhysics;

    @Option(names = "--no-journal", description = "Do not append this batch to the campaign's proposal journal.")
    boolean noJournal;

    /** Said when no ok run has been logged: nothing was fitted to the grower's chamber yet. */
    static final String DEFAULTS_ONLY = "the run log holds no ok run yet, so these recipes come from the growth"
            + " models' defaults alone (published or conventional parameter values, nothing fitted to your chamber);"
            + " read the yields as rough first guesses with wide uncertainty, and expect them to change once runs"
            + " are recorded";

    /** Said when no ok run has been logged and the growth models are off or absent. */
    static final String NOTHING_YET = "the run log holds no ok run yet and no growth model is used, so nothing is"
            + " known about this chamber: the recipes only spread over the box, and their yields say nothing yet";

    /**
     * Adds a note when no ok run has been logged, so the grower reads the yields for what they are.
     *
     * @param set     the proposals
     * @param lc      the campaign
     * @param physics whether the growth models were used
     * @return the proposals, with the note when it applies; never null
     */
    static ProposalSet withDefaultsNote(ProposalSet set, LoadedCampaign lc, boolean physics) {
        if (!lc.runLog().okRuns().isEmpty()) {
            return set;
        }
        java.util.List<String> notes = new java.util.ArrayList<>(set.notes());
        notes.add(0, physics && !lc.campaign().models().isEmpty() ? DEFAULTS_ONLY : NOTHING_YET);
        return new ProposalSet(set.campaignId(), set.runsUsed(), set.seed(), set.mode(), set.explore(),
                set.proposals(), notes, set.gpSubsets());
    }

    @Override
    public Integer call() throws Exception {
        output.check(spec);
        java.time.Clock clock = Main.clock(spec);
        // --batch, --explore and --within-runs are range-checked by OptionRanges before call()
        PrintWriter err = spec.commandLine().getErr();
        PluginRegistry reg = Registries.load(global, err);
        LoadedCampaign lc = LoadedCampaign.open(campaignFile, reg);
        output.guard(lc, java.util.List.of());
        if (!noJournal) {
            dev.terrace.core.journal.Journal.checkAppendable(lc.campaign().journal());
        }
        ProposeSettings s = ProposeSettings.defaults().withBatch(batch).withSeed(seed).withExplore(explore)
                .withPhysics(!noPhysics).withWithinRuns(withinRuns == null ? Double.POSITIVE_INFINITY : withinRuns);
        ProposalSet set;
        try (Progress bar = Progress.startPhases("propose", 2, global)) {
            bar.message("fitting models and surrogates");
            dev.terrace.core.propose.CampaignSurrogate sur = dev.terrace.core.propose.CampaignSurrogate.build(
                    lc, reg, s.usePhysics(), s.seed());
            bar.step().message("searching " + batch + " recipe" + (batch == 1 ? "" : "s"));
            set = Proposer.propose(sur, s);
            bar.step();
        }
        set = withDefaultsNote(set, lc, s.usePhysics());
        if (!noJournal && !set.proposals().isEmpty()) {
            dev.terrace.core.journal.Journal.appendBatch(lc, set, clock.instant());
        }
        output.emit(spec, ProposalOutput.render(set, lc.campaign(), output.resolve(spec.commandLine().getErr())));
        if (!global.quiet) {
            err.println(NextStep.afterPropose(campaignFile, set, !noJournal));
            err.println(dev.terrace.core.Cautions.pointer(lc.campaign()));
        }
        return 0;
    }
}
