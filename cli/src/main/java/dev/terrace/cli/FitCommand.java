package dev.terrace.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.fit.FitResults.Candidate;
import dev.terrace.core.fit.FitResults.Estimate;
import dev.terrace.core.fit.FitResults.RunStatus;
import dev.terrace.core.fit.FitResults.RunUse;
import dev.terrace.core.fit.FitResults.FitReport;
import dev.terrace.core.fit.FitResults.ModelFit;
import dev.terrace.core.fit.FitResults.OutcomeFit;
import dev.terrace.core.fit.CampaignFit;
import dev.terrace.core.plugins.PluginRegistry;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;

/** {@code terrace fit CAMPAIGN}: fits the campaign's growth models to its ok runs. */
@Command(name = "fit", mixinStandardHelpOptions = true,
        description = {"Fit the campaign's growth models to its ok runs, with 95 %% intervals, held parameters",
                "and their reasons, discrete choices by AICc, and residuals per run."})
final class FitCommand implements Callable<Integer> {

    /** Run lines printed one per run before the rest are grouped by status and reason (readability choice). */
    static final int RUN_LINES = 40;
    /** Run ids shown per group of identical statuses. */
    static final int GROUP_IDS = 6;

    /** Default seed of the bootstrap and multi-start. */
    static final long DEFAULT_SEED = 7;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Mixin
    GlobalOptions global = new GlobalOptions();

    @Parameters(index = "0", paramLabel = "CAMPAIGN", description = "The campaign YAML file.")
    Path campaignFile;

    @Option(names = "--format", defaultValue = "table", description = "table or json (default: ${DEFAULT-VALUE}).")
    String format;

    @Option(names = "--seed", defaultValue = "" + DEFAULT_SEED, description = "Seed for bootstrap and restarts (default: ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--residuals", description = "Also list residuals per run (table format).")
    boolean showResiduals;

    @Option(names = "--plot", paramLabel = "FILE.png|FILE.svg",
            description = {"Also draw the Arrhenius plot: density against 1/kT over the ok runs with the fitted",
                    "line and its 95 %% band (needs island_density and substrate_temperature roles)."})
    Path plot;

    @Option(names = "--force", description = "Allow --plot to replace an existing file.")
    boolean force;

    /** The checked --plot target. */
    private dev.terrace.core.io.SafeFiles.Target plotTarget;

    @Override
    public Integer call() throws Exception {
        if (!format.equals("table") && !format.equals("json")) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--format must be table or json, found '" + format + "'");
        }
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        PluginRegistry reg = Registries.load(global, err);
        LoadedCampaign lc = LoadedCampaign.open(campaignFile, reg);
        if (lc.campaign().models().isEmpty()) {
            throw new JobFailedException("campaign " + lc.campaign().id() + " lists no growth models (models: [])");
        }
        if (plot != null) {
            String name = plot.getFileName().toString().toLowerCase(java.util.Locale.ROOT);
            if (!name.endsWith(".png") && !name.endsWith(".svg")) {
                throw new CommandLine.ParameterException(spec.commandLine(), "--plot must end in .png or .svg");
            }
            plotTarget = dev.terrace.core.io.SafeFiles.target(plot).replacing(force).protecting(lc.inputs());
            plotTarget.check();
        }
        FitReport report;
        CampaignFit whole;
        try (Progress bar = Progress.startPhases("fit", 1, global)) {
            bar.message("fitting " + String.join(", ", lc.campaign().models()));
            whole = CampaignFit.run(lc, reg, seed);
            report = whole.report();
            bar.step();
        }
        if (format.equals("json")) {
            ObjectMapper om = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
            ObjectNode root = (ObjectNode) om.readTree(json(report));
            FitExtras.json(whole, root);
            out.println(om.writeValueAsString(root));
        } else {
            FitExtras.printOffset(whole, out);
            printTable(report, out, showResiduals);
            FitExtras.printPriors(whole, out);
        }
        out.flush();
        if (plot != null) {
            arrheniusPlot(lc, err, whole.offset().value());
        }
        if (!report.fittedAnything()) {
            StringBuilder sb = new StringBuilder("nothing could be fitted:");
            for (ModelFit f : report.models()) {
                sb.append("\n  ").append(f.id()).append(": ")
                        .append(f.message().isEmpty() ? String.join("; ", f.verdict()) : f.message());
            }
            if (report.runs() > 0 && report.failedRuns() == report.runs()) {
                sb.append("\n  every run in the log failed; failed runs carry no outcomes to fit");
            }
            throw new JobFailedException(sb.toString());
        }
        if (!global.quiet) {
            // one line pointing to the full cautions, as propose, rank, map and record print it
            err.println(dev.terrace.core.Cautions.pointer(lc.campaign()));
            err.flush();
        }
        return 0;
    }

    private void arrheniusPlot(LoadedCampaign lc, PrintWriter err, double offsetK) throws Exception {
        var c = lc.campaign();
        var density = ReportCommand.densityOutcome(c);
        var temp = ReportCommand.temperatureSetting(c);
        if (density == null || temp == null) {
            throw new JobFailedException("no Arrhenius plot: the campaign needs an outcome with role island_density "
                    + "and a setting with role substrate_temperature");
        }
        java.util.List<double[]> pts = ReportCommand.arrheniusPoints(lc, density, temp);
        if (pts.stream().mapToDouble(p -> p[0]).distinct().count() < 2) {
            throw new JobFailedException("no Arrhenius plot: fewer than two ok runs at different temperatures measured "
                    + density.name());
        }
        // readings to true temperatures with the thermocouple offset the fit applied
        double[] t = pts.stream().mapToDouble(p -> p[0] + offsetK).toArray();
        double[] n = pts.stream().mapToDouble(p -> p[1]).toArray();
        dev.terrace.core.fit.Arrhenius a = dev.terrace.core.fit.Arrhenius.fit(t, n);
        var chart = dev.terrace.cli.plot.Plots.arrhenius(t, n, a.energyEv(), a.lo(), a.hi(),
                density.name() + " (" + ReportCommand.chartUnit(density.unit().symbol()) + ")");
        dev.terrace.cli.plot.Plots.save(chart, plotTarget, 800, 600);
        err.println(String.format(java.util.Locale.ROOT, "wrote %s (effective activation energy %.3f eV%s over %d runs)",
                plot, a.energyEv(), Double.isFinite(a.lo()) ? String.format(java.util.Locale.ROOT, ", 95 %% %.3f to %.3f",
                        a.lo(), a.hi()) : "", a.n()));
        err.flush();
    }

    static void printTable(FitReport r, PrintWriter out, boolean residuals) {
        out.println("Fit of campaign " + r.campaignId() + ": " + r.runs() + " runs (" + r.failedRuns()
                + " failed, not used), seed " + r.seed());
        for (ModelFit f : r.models()) {
            out.println();
            out.println("== " + f.id() + "  (" + f.runsUsed() + " runs used)");
            if (!f.message().isEmpty()) {
                out.println("  " + f.message());
            }
            for (String v : f.verdict()) {
                out.println("  * " + v);
            }
            if (!f.estimates().isEmpty()) {
                out.println();
                out.println("  " + Format.pad("parameter", 27) + Format.pad("value", 12) + Format.pad("95 % interval", 24) + "status");
                for (Estimate e : f.estimates()) {
                    String val = Format.num(e.value()) + (e.unit().isEmpty() ? "" : " " + e.unit());
                    String ci = e.held() ? "-" : Format.num(e.lo()) + " to " + Format.num(e.hi());
                    out.println("  " + Format.pad(e.name(), 27) + Format.pad(val, 12) + Format.pad(ci, 24)
                            + (e.held() ? "held: " : "fitted: ") + e.reason());
                }
            }
            if (f.candidates().size() > 1) {
                out.println();
                out.println("  discrete choices (AICc, lower is better):");
                for (Candidate c : f.candidates()) {
                    out.println("    " + (c.selected() ? "> " : "  ") + Format.pad(choices(c.choices()), 40)
                            + (Double.isFinite(c.aicc()) ? Format.num(c.aicc()) : "n/a (too few runs)"));
                }
            }
            if (!f.outcomes().isEmpty()) {
                out.println();
                for (OutcomeFit o : f.outcomes()) {
                    if (o.scale().equals("class")) {
                        out.println("  " + Format.pad(o.outcome(), 16) + "log loss " + Format.num(o.logLoss())
                                + ", accuracy " + Math.round(100 * o.accuracy()) + " % over " + o.n() + " runs");
                    } else {
                        out.println("  " + Format.pad(o.outcome(), 16) + "RMSE " + Format.num(o.rmse())
                                + (o.scale().equals("log10") ? " (log10; x" + Format.num(Math.pow(10, o.rmse())) + ")" : "")
                                + " over " + o.n() + " runs"
                                + (o.censored() > 0 ? " (" + o.censored() + " censored: Tobit terms, not in the RMSE)" : ""));
                    }
                }
            }
            if (f.correlationNames().size() > 1) {
                out.println();
                out.println("  correlations of fitted parameters:");
                for (int a = 0; a < f.correlationNames().size(); a++) {
                    StringBuilder sb = new StringBuilder("    " + Format.pad(f.correlationNames().get(a), 27));
                    for (int b = 0; b < f.correlationNames().size(); b++) {
                        sb.append(String.format(java.util.Locale.ROOT, "%6.2f", f.correlations()[a][b]));
                    }
                    out.println(sb);
                }
            }
            if (!f.runs().isEmpty()) {
                out.println();
                printRuns(f, out);
            }
            if (residuals && !f.residuals().isEmpty()) {
                out.println();
                out.println("  residuals (measured - predicted; log10 for log outcomes, -ln p for classes):");
                for (var res : f.residuals()) {
                    out.println("    " + Format.pad(res.runId(), 8) + Format.pad(res.outcome(), 16)
                            + (res.observedClass() != null ? Format.pad(res.observedClass(), 22)
                            : Format.pad(Format.num(res.measured()) + " vs " + Format.num(res.predicted()), 22))
                            + Format.num(res.residual()));
                }
            }
        }
    }

    /**
     * Every run of the log with its status in one model's fit, one line each; past
     * {@link #RUN_LINES} lines the remaining runs are grouped by status and reason with a count
     * (the JSON output always lists every run).
     */
    static void printRuns(ModelFit f, PrintWriter out) {
        out.println("  runs (" + f.count(RunUse.USED) + " used, " + f.count(RunUse.CENSORED) + " censored, "
                + f.count(RunUse.EXCLUDED) + " excluded):");
        List<RunStatus> all = f.runs();
        int single = all.size() <= RUN_LINES ? all.size() : RUN_LINES - 1;
        int width = Math.max(8, all.stream().limit(single).mapToInt(r -> r.runId().length() + 2).max().orElse(8));
        for (RunStatus r : all.subList(0, single)) {
            out.println("    " + Format.pad(r.runId(), width) + statusText(r.use(), r.reason()));
        }
        if (single == all.size()) {
            return;
        }
        Map<String, List<String>> groups = new LinkedHashMap<>();
        for (RunStatus r : all.subList(single, all.size())) {
            groups.computeIfAbsent(statusText(r.use(), r.reason()), k -> new ArrayList<>()).add(r.runId());
        }
        out.println("    ... " + (all.size() - single) + " more runs, grouped by status (JSON lists each):");
        groups.forEach((text, ids) -> out.println("    " + Format.pad(ids.size() + " x", width) + text + "  ("
                + String.join(", ", ids.subList(0, Math.min(GROUP_IDS, ids.size())))
                + (ids.size() > GROUP_IDS ? ", ..." : "") + ")"));
    }

    private static String statusText(RunUse use, String reason) {
        return (Format.pad(use.word(), 10) + reason).stripTrailing();
    }

    static String choices(Map<String, Double> m) {
        StringBuilder sb = new StringBuilder();
        m.forEach((k, v) -> sb.append(sb.length() == 0 ? "" : ", ").append(k).append(' ').append(Format.num(v)));
        return sb.toString();
    }

    static String json(FitReport r) throws Exception {
        ObjectMapper om = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
        ObjectNode root = om.createObjectNode();
        root.put("campaign", r.campaignId());
        root.put("runs", r.runs());
        root.put("runs_failed", r.failedRuns());
        root.put("seed", r.seed());
        ArrayNode models = root.putArray("models");
        for (ModelFit f : r.models()) {
            ObjectNode m = models.addObject();
            m.put("id", f.id());
            m.put("runs_used", f.runsUsed());
            ArrayNode ex = m.putArray("runs_excluded");
            ArrayNode cen = m.putArray("runs_censored");
            ArrayNode st = m.putArray("run_status");
            for (RunStatus x : f.runs()) {
                if (x.use() == RunUse.EXCLUDED) {
                    ex.addObject().put("run_id", x.runId()).put("reason", x.reason());
                } else if (x.use() == RunUse.CENSORED) {
                    cen.addObject().put("run_id", x.runId()).put("reason", x.reason());
                }
                st.addObject().put("run_id", x.runId()).put("status", x.use().word()).put("reason", x.reason());
            }
            ObjectNode ps = m.putObject("parameters");
            for (Estimate e : f.estimates()) {
                ObjectNode p = ps.putObject(e.name());
                p.put("value", e.value());
                p.put("unit", e.unit());
                if (e.held()) {
                    p.putNull("ci95");
                } else {
                    p.putArray("ci95").add(e.lo()).add(e.hi());
                }
                p.put("held", e.held());
                p.put("reason", e.reason());
                p.put("source", e.source());
            }
            ObjectNode sel = m.putObject("selected");
            f.selected().forEach((k, v) -> {
                if (v == Math.rint(v)) {
                    sel.put(k, (long) (double) v);
                } else {
                    sel.put(k, v);
                }
            });
            ArrayNode cands = m.putArray("candidates");
            for (Candidate c : f.candidates()) {
                ObjectNode co = cands.addObject();
                c.choices().forEach((k, v) -> {
                    if (v == Math.rint(v)) {
                        co.put(k, (long) (double) v);
                    } else {
                        co.put(k, v);
                    }
                });
                if (Double.isFinite(c.aicc())) {
                    co.put("aicc", c.aicc());
                } else {
                    co.putNull("aicc");
                }
                co.put("selected", c.selected());
            }
            ObjectNode fit = m.putObject("fit");
            OutcomeFit primary = f.outcomes().stream().filter(o -> !o.scale().equals("class")).findFirst().orElse(null);
            if (primary != null) {
                fit.put("rmse", primary.rmse());
                fit.put("rmse_scale", primary.scale());
                fit.put("outcome", primary.outcome());
            } else {
                fit.putNull("rmse");
                fit.putNull("rmse_scale");
            }
            ObjectNode per = fit.putObject("outcomes");
            for (OutcomeFit o : f.outcomes()) {
                ObjectNode oo = per.putObject(o.outcome());
                oo.put("n", o.n());
                oo.put("scale", o.scale());
                if (o.scale().equals("class")) {
                    oo.put("log_loss", o.logLoss());
                    oo.put("accuracy", o.accuracy());
                } else {
                    oo.put("rmse", o.rmse());
                    oo.put("censored", o.censored());
                }
            }
            ObjectNode corr = m.putObject("correlations");
            for (int a = 0; a < f.correlationNames().size(); a++) {
                ObjectNode row = corr.putObject(f.correlationNames().get(a));
                for (int b = 0; b < f.correlationNames().size(); b++) {
                    row.put(f.correlationNames().get(b), f.correlations()[a][b]);
                }
            }
            ArrayNode res = m.putArray("residuals");
            for (var x : f.residuals()) {
                ObjectNode ro = res.addObject();
                ro.put("run_id", x.runId());
                ro.put("outcome", x.outcome());
                if (x.observedClass() != null) {
                    ro.put("observed", x.observedClass());
                    ro.put("minus_log_p", x.residual());
                } else {
                    ro.put("measured", x.measured());
                    if (Double.isFinite(x.predicted())) {
                        ro.put("predicted", x.predicted());
                        ro.put("residual", x.residual());
                    } else {
                        ro.putNull("predicted");
                        ro.putNull("residual");
                    }
                }
            }
            ArrayNode v = m.putArray("verdict");
            f.verdict().forEach(v::add);
            if (!f.message().isEmpty()) {
                m.put("message", f.message());
            }
        }
        return om.writeValueAsString(root);
    }
}
