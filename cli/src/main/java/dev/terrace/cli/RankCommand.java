package dev.terrace.cli;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.propose.ProposeSettings;
import dev.terrace.core.propose.Proposer;
import dev.terrace.core.propose.Proposals.ProposalSet;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.core.runlog.RunLogReader;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.util.concurrent.Callable;

/** {@code terrace rank CAMPAIGN --candidates FILE}: ranks the grower's own recipes by predicted yield. */
@Command(name = "rank", mixinStandardHelpOptions = true,
        description = {"Rank your own candidate recipes (a CSV with the campaign's setting columns) by predicted",
                "yield, with the same predictions as propose. Candidates outside the boxes or limits are flagged."})
final class RankCommand implements Callable<Integer> {

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Mixin
    GlobalOptions global = new GlobalOptions();

    @Mixin
    OutputOptions output = new OutputOptions();

    @Parameters(index = "0", paramLabel = "CAMPAIGN", description = "The campaign YAML file.")
    Path campaignFile;

    @Option(names = "--candidates", required = true, paramLabel = "FILE",
            description = "CSV of candidate recipes: one column per setting, optional run_id column for names.")
    Path candidates;

    @Option(names = "--seed", defaultValue = "" + ProposeSettings.DEFAULT_SEED, description = "Seed (default: ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--no-physics", description = "Switch the growth models off (a pure Gaussian process).")
    boolean noPhysics;

    @Override
    public Integer call() throws Exception {
        output.check(spec);
        PluginRegistry reg = Registries.load(global, spec.commandLine().getErr());
        LoadedCampaign lc = LoadedCampaign.open(campaignFile, reg);
        RunLog cands = RunLogReader.readCandidates(lc.campaign(), candidates);
        ProposeSettings s = ProposeSettings.defaults().withSeed(seed).withPhysics(!noPhysics);
        CampaignSurrogate sur;
        try (Progress bar = Progress.startPhases("rank", 1, global)) {
            bar.message("fitting models and surrogates");
            sur = CampaignSurrogate.build(lc, reg, s.usePhysics(), seed);
            bar.step();
        }
        ProposalSet set = Proposer.rank(sur, cands.runs(), s);
        output.emit(spec, ProposalOutput.render(set, lc.campaign(), output.format));
        return 0;
    }
}
