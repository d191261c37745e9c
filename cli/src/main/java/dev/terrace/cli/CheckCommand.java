package dev.terrace.cli;

import dev.terrace.core.Cautions;
import dev.terrace.core.CensoredCells;
import dev.terrace.core.CheckSummary;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.Target;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;

import java.io.PrintWriter;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;

/** {@code terrace check CAMPAIGN}: validates the campaign and its run log and summarises the runs. */
@Command(name = "check", mixinStandardHelpOptions = true,
        description = {"Validate a campaign file and its run log and summarise the runs so far.",
                "Every problem is listed with file, line and column; nothing is changed."})
final class CheckCommand implements Callable<Integer> {

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Mixin
    CampaignInput input = new CampaignInput();

    @Override
    public Integer call() throws Exception {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        LoadedCampaign lc = LoadedCampaign.openAnySize(input.file, Registries.load(input.global, err));
        print(lc, out, input.global.quiet);
        TrackRecordSection.Result track = TrackRecordSection.print(lc, out);
        DiagnosticLines.print(err, lc.warnings());
        DiagnosticLines.print(err, track.journal().warnings());
        DiagnosticLines.print(err, track.trackRecord().warnings());
        out.println(NextStep.afterCheck(input.file, lc, track.journal()));
        err.flush();
        out.flush();
        return 0;
    }

    static void print(LoadedCampaign lc, PrintWriter out, boolean quiet) {
        Campaign c = lc.campaign();
        CheckSummary s = CheckSummary.of(lc);
        out.println("Campaign " + c.id() + (c.title().isBlank() ? "" : ": " + c.title()));
        out.println("  material  " + c.material().substrate()
                + (c.material().deposit() == null ? "" : ", deposit " + c.material().deposit())
                + (c.surface().groupV() == null ? "" : ", group V " + c.surface().groupV())
                + String.format(java.util.Locale.ROOT, "  (1 ML = %.5f nm, %.4g sites/cm^2)",
                c.surface().monolayerHeightNm(), c.surface().sitesPerCm2()));
        out.println("  models    " + (c.models().isEmpty() ? "(none: data only)" : String.join(", ", c.models())));
        out.println("  run log   " + lc.runLog().file());
        if (c.temperatureCalibration().estimate().isCalibrated()) {
            out.println("  T offset  " + FitExtras.offsetLine(c.temperatureCalibration().estimate())
                    + (c.temperatureCalibration().fitOffset() ? "; terrace fit also fits it" : ""));
        }
        out.println();
        out.println("Runs: " + s.runs() + " (" + s.ok() + " ok, " + s.failed() + " failed)");
        out.println();
        out.println(Format.pad("column", 18) + Format.pad("unit", 8) + Format.pad("runs", 6) + "recorded");
        for (CheckSummary.ColumnSummary col : s.columns()) {
            String range;
            if (!col.counts().isEmpty()) {
                range = col.counts().entrySet().stream().map(e -> e.getKey() + " x" + e.getValue())
                        .collect(Collectors.joining(", "));
            } else if (col.count() == 0) {
                range = "(none)";
            } else {
                range = Format.num(col.min()) + " to " + Format.num(col.max());
            }
            out.println(Format.pad(col.name() + (col.isOutcome() ? " *" : ""), 18) + Format.pad(col.unit(), 8)
                    + Format.pad(String.valueOf(col.count()), 6) + range);
        }
        out.println("(* measured outcome)");
        printCensored(CensoredCells.of(lc), out);
        if (!s.targets().isEmpty()) {
            out.println();
            out.println("Targets met so far (ok runs that measured the outcome):");
            for (CheckSummary.TargetSummary t : s.targets()) {
                out.println("  " + Format.pad(describe(t.target(), c), 40) + t.met() + " of " + t.measured());
            }
            out.println("  every target: " + (s.runsMeetingAll().isEmpty() ? "no run yet"
                    : s.runsMeetingAll().size() + " run(s): " + String.join(", ", s.runsMeetingAll())));
        }
        if (!quiet) {
            out.println();
            out.println("Safety reminders:");
            for (String line : Cautions.forCampaign(c)) {
                out.println("  - " + line);
            }
            out.println("  " + Cautions.DEFER);
        }
    }

    /** One line per outcome with censored cells: how many below, how many above, and the range of the bounds. */
    static void printCensored(java.util.List<CensoredCells> cells, PrintWriter out) {
        if (cells.isEmpty()) {
            return;
        }
        out.println();
        out.println("Censored cells (only a bound recorded; fits use them through the Tobit likelihood):");
        for (CensoredCells c : cells) {
            String range = c.minBound() == c.maxBound() ? "bound " + Format.num(c.minBound())
                    : "bounds " + Format.num(c.minBound()) + " to " + Format.num(c.maxBound());
            out.println("  " + Format.pad(c.outcome(), 16) + c.below() + " x <X, " + c.above() + " x >X, " + range
                    + (c.unit().isEmpty() ? "" : " " + c.unit()));
        }
    }

    static String describe(Target t, Campaign c) {
        if (t.isClassTarget()) {
            return t.outcome() + " is " + t.is();
        }
        String unit = c.outcome(t.outcome()).map(o -> o.unit().symbol()).orElse("");
        if (Double.isNaN(t.min())) {
            return t.outcome() + " <= " + Format.num(t.max()) + " " + unit;
        }
        if (Double.isNaN(t.max())) {
            return t.outcome() + " >= " + Format.num(t.min()) + " " + unit;
        }
        return t.outcome() + " " + Format.num(t.min()) + " to " + Format.num(t.max()) + " " + unit;
    }

}
