package dev.terrace.cli;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.demo.DemoSeries;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;

/** {@code terrace demo}: copies the bundled demo campaign to a new folder and runs the job on it. */
@Command(name = "demo", mixinStandardHelpOptions = true,
        description = {"Run the whole job on the bundled demo campaign (invented data): copy it to a new folder,"
                + " check it, fit its growth models, propose the next batch (kept in the folder's proposal journal,"
                + " so terrace record --proposal works there), validate the predictions, map the process window"
                + " and write an HTML report there.",
                "Never writes into an existing folder."})
final class DemoCommand implements Callable<Integer> {

    /** Default folder for the demo copy. */
    static final String DEFAULT_DIR = "terrace-demo";

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Mixin
    GlobalOptions global = new GlobalOptions();

    @Option(names = "--dir", paramLabel = "DIR",
            description = "Where to put the demo copy (default: ./" + DEFAULT_DIR + ", or the next free "
                    + DEFAULT_DIR + "-N).")
    Path dir;

    @Option(names = "--series", paramLabel = "NAME",
            description = "Which bundled demo to run: ga-dots (GaAs droplet-epitaxy dots, the default) or "
                    + "sk-dots (InAs/GaAs strained-layer dots). Both are invented data.")
    String series = DemoSeries.GA_DOTS.key();

    @Override
    public Integer call() throws Exception {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        DemoSeries chosen = DemoSeries.byKey(series).orElseThrow(() -> new CommandLine.ParameterException(
                spec.commandLine(), "unknown demo series '" + series + "'; expected one of: "
                        + String.join(", ", DemoSeries.keys())));
        Path target = dir;
        if (target == null) {
            target = Path.of(DEFAULT_DIR);
            for (int i = 2; Files.exists(target); i++) {
                target = Path.of(DEFAULT_DIR + "-" + i);
            }
        } else if (Files.exists(target)) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    target + " exists already; the demo never writes into an existing folder");
        }
        Path campaign = chosen.copyTo(target);
        out.println("Demo campaign copied to " + target.toAbsolutePath().normalize());
        out.println("  (" + chosen.scenario() + ")");
        out.println();
        out.println("== terrace check " + campaign);
        dev.terrace.core.plugins.PluginRegistry reg = Registries.load(global, err);
        LoadedCampaign lc = LoadedCampaign.open(campaign, reg);
        CheckCommand.print(lc, out, global.quiet);
        DiagnosticLines.print(err, lc.warnings());
        out.println();
        out.println("== terrace fit " + campaign);
        dev.terrace.core.fit.FitResults.FitReport fit = dev.terrace.core.fit.ModelFitter.fit(lc, reg, FitCommand.DEFAULT_SEED);
        FitCommand.printTable(fit, out, false);
        out.println();
        out.println("== terrace propose " + campaign);
        dev.terrace.core.propose.ProposeSettings ps = dev.terrace.core.propose.ProposeSettings.defaults();
        dev.terrace.core.propose.Proposals.ProposalSet set = dev.terrace.core.propose.Proposer.propose(lc, reg, ps);
        out.print(ProposalOutput.table(set, lc.campaign()));
        if (!set.proposals().isEmpty()) {
            dev.terrace.core.journal.Journal.appendBatch(lc, set, Main.clock(spec).instant());
            out.println(NextStep.afterPropose(campaign, set, true));
        }
        Path proposals = target.resolve("proposals.json");
        dev.terrace.core.io.SafeFiles.writeNew(proposals, ProposalOutput.json(set));
        List<String> axes = ReportCommand.mapAxes(lc.campaign());
        Path mapFile = target.resolve("window-map.png");
        Path report = target.resolve("report.html");
        String[][] steps = {
            {"validate", campaign.toString(), "--quiet"},
            {"map", campaign.toString(), "--x", axes.get(0), "--y", axes.get(1), "--out", mapFile.toString(), "--quiet"},
            {"report", campaign.toString(), "--out", report.toString(), "--quiet"}};
        for (String[] step : steps) {
            out.println();
            out.println("== terrace " + String.join(" ", step));
            out.flush();
            CommandLine cl = Main.commandLine();
            cl.setOut(out);
            cl.setErr(err);
            int rc = cl.execute(step);
            if (rc != 0) {
                throw new JobFailedException("the demo step 'terrace " + step[0] + "' failed (exit code " + rc + ")");
            }
        }
        out.println();
        out.println("Files (invented demo data):");
        out.println("  proposals " + proposals.toAbsolutePath().normalize());
        out.println("  map       " + mapFile.toAbsolutePath().normalize());
        out.println("  report    " + report.toAbsolutePath().normalize() + "  (open it in a browser; prints on A4)");
        out.println("  campaign  " + campaign.toAbsolutePath().normalize());
        out.println("  run log   " + lc.runLog().file());
        out.flush();
        err.flush();
        return 0;
    }
}
