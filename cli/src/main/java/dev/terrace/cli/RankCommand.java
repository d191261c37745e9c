package dev.terrace.cli;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.propose.ProposeSettings;
import dev.terrace.core.propose.Proposer;
import dev.terrace.core.propose.Proposals.ProposalSet;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.core.runlog.CandidatesReader;
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
        output.guard(lc, java.util.List.of(new dev.terrace.core.io.SafeFiles.Input(candidates, "candidates file")));
        RunLog cands;
        try {
            cands = CandidatesReader.read(lc.campaign(), candidates);
        } catch (dev.terrace.core.InputException e) {
            throw new dev.terrace.core.InputException(CandidateWording.reworded(e.diagnostics()));
        }
        refuseUnrankable(lc.campaign(), cands);
        ProposeSettings s = ProposeSettings.defaults().withSeed(seed).withPhysics(!noPhysics);
        CampaignSurrogate sur;
        try (Progress bar = Progress.startPhases("rank", 1, global)) {
            bar.message("fitting models and surrogates");
            sur = CampaignSurrogate.build(lc, reg, s.usePhysics(), seed);
            bar.step();
        }
        ProposalSet set = CandidateWording.named(Proposer.rank(sur, cands.runs(), s), lc.campaign(), cands.runs());
        if (set.proposals().isEmpty()) {
            throw new UsageException("--candidates " + candidates + ": no candidate can be ranked ("
                    + String.join("; ", set.notes()) + ")");
        }
        output.emit(spec, ProposalOutput.render(set, lc.campaign(), output.resolve(spec.commandLine().getErr())));
        if (!global.quiet) {
            spec.commandLine().getErr().println(dev.terrace.core.Cautions.pointer(lc.campaign()));
        }
        return 0;
    }

    /**
     * Exit 2 before any fitting when no candidate gives every setting, naming what is missing (an
     * empty file, one without candidates and a missing setting column are refused by the reader).
     */
    private void refuseUnrankable(dev.terrace.core.campaign.Campaign c, RunLog cands) {
        java.util.List<String> why = new java.util.ArrayList<>();
        for (dev.terrace.core.runlog.Run r : cands.runs()) {
            java.util.List<String> missing = c.parameters().stream()
                    .filter(p -> p.isCategorical() ? r.category(p.name()).isEmpty() : r.number(p.name()).isEmpty())
                    .map(p -> p.name()).toList();
            if (missing.isEmpty()) {
                return;
            }
            if (why.size() < 3) {
                why.add("candidate " + r.runId() + " has no " + String.join(", ", missing));
            }
        }
        throw new UsageException("--candidates " + candidates + ": no candidate can be ranked, each leaves out a setting ("
                + String.join("; ", why) + (cands.runs().size() > 3 ? "; ..." : "")
                + "); expected a value for every setting of campaign " + c.id());
    }
}
