package dev.terrace.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.validate.OutcomeValidation;
import dev.terrace.core.validate.ParityPoint;
import dev.terrace.core.validate.Score;
import dev.terrace.core.validate.Validation;
import dev.terrace.core.validate.ValidationReport;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;

/**
 * {@code terrace validate CAMPAIGN}: leave-one-out scores of the growth models, the GP and both
 * together, outcome by outcome, with a verdict in plain words.
 *
 * @since 0.1
 */
@Command(name = "validate", mixinStandardHelpOptions = true,
        description = {"Hold out each ok run in turn, refit the growth models, the GP and both together to the",
                "other runs, and score how well each predicts the held-out run (RMSE, 90 %% interval",
                "coverage, MSLL; log loss and accuracy for classes) against the runs' plain mean.",
                "The proposal surrogate (models + GP, as propose builds it) comes first; the verdict is on it.",
                "Failed runs always stay in training. The run log is never changed."})
final class ValidateCommand implements Callable<Integer> {

    /** Default seed of every fit (the same as {@code terrace fit}). */
    static final long DEFAULT_SEED = FitCommand.DEFAULT_SEED;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Mixin
    GlobalOptions global = new GlobalOptions();

    @Parameters(index = "0", paramLabel = "CAMPAIGN", description = "The campaign YAML file.")
    Path campaignFile;

    @Option(names = "--format", defaultValue = "table", description = "table or json (default: ${DEFAULT-VALUE}).")
    String format;

    @Option(names = "--seed", defaultValue = "" + DEFAULT_SEED,
            description = "Seed of every refit; the same seed gives the same scores (default: ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--plots", paramLabel = "DIR",
            description = {"Also write a parity plot (predicted against measured, with 90 %% intervals) per numeric",
                    "outcome into DIR as parity-<outcome>.png; existing files are never replaced."})
    Path plots;

    @Override
    public Integer call() throws Exception {
        if (!format.equals("table") && !format.equals("json")) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    "--format must be table or json, found '" + format + "'");
        }
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        PluginRegistry reg = Registries.load(global, err);
        LoadedCampaign lc = LoadedCampaign.open(campaignFile, reg);
        if (plots != null && java.nio.file.Files.exists(plots) && !java.nio.file.Files.isDirectory(plots)) {
            throw new UsageException("--plots " + plots + " is a file; expected a folder (it is created if missing)");
        }
        int usable = Validation.usableRuns(lc);
        if (usable < Validation.MIN_RUNS) {
            throw new JobFailedException("campaign " + lc.campaign().id() + " has " + usable + " ok run"
                    + (usable == 1 ? "" : "s") + " with a measured outcome; leave-one-out validation needs at least "
                    + Validation.MIN_RUNS + " (log more runs, or check that their outcome columns are filled in)");
        }
        List<String> folds = Validation.heldOutRuns(lc);
        ValidationReport report;
        try (Progress p = Progress.start("validating (" + folds.size() + " refits)", folds.size(), global)) {
            report = Validation.run(lc, reg, seed, p.ticker());
        }
        if (report.outcomes().isEmpty()) {
            throw new JobFailedException("nothing could be validated:\n  " + String.join("\n  ", report.verdict()));
        }
        if (format.equals("json")) {
            out.println(json(report, seed));
        } else {
            printTable(report, seed, lc.campaign().models().isEmpty(), out);
        }
        out.flush();
        if (plots != null) {
            for (var o : report.outcomes()) {
                if (o.scale().equals("class") || o.parity().isEmpty()) {
                    continue;
                }
                var chart = parityChart(lc.campaign(), o);
                Path f = plots.resolve("parity-" + o.outcome() + ".png");
                dev.terrace.cli.plot.Plots.save(chart, dev.terrace.core.io.SafeFiles.target(f).creatingFolders()
                        .protecting(lc.inputs()), 800, 640);
                err.println("wrote " + f);
            }
            err.flush();
        }
        return 0;
    }

    /**
     * The parity chart of one outcome as {@code --plots} writes it: the proposal surrogate's points
     * carry their run ids and the outcome's target band is shaded, as in the report.
     */
    static org.jfree.chart.JFreeChart parityChart(dev.terrace.core.campaign.Campaign c, OutcomeValidation o) {
        var oc = c.outcome(o.outcome()).orElseThrow();
        double[] window = ReportCommand.targetWindow(c, o.outcome());
        double tMin = window[0];
        double tMax = window[1];
        return dev.terrace.cli.plot.Plots.parity(o.outcome() + " (" + ReportCommand.chartUnit(oc.unit().symbol())
                + ")", o.scale().equals("log10"), o.parity(), Validation.PHYSICS_GP, tMin, tMax);
    }

    static void printTable(ValidationReport r, long seed, boolean noModels, PrintWriter out) {
        out.println("Leave-one-out validation of campaign " + r.campaignId() + ", seed " + seed);
        out.println("First per outcome: " + Validation.PROPOSAL + ", the " + Validation.PROPOSAL_LABEL
                + " (growth models + GP on their residual, as terrace propose builds it); the others are comparisons.");
        out.println("Errors on each outcome's fitting scale (log10 for log outcomes); '" + Validation.MEAN
                + "' is the plain mean (or class frequencies) of the other runs.");
        out.println();
        out.println(Format.pad("outcome", 16) + Format.pad("scale", 8) + Format.pad("surrogate", 12)
                + Format.pad("runs", 6) + Format.pad("RMSE", 10) + Format.pad("in 90 %", 9) + Format.pad("MSLL", 9)
                + Format.pad("log loss", 10) + "right class");
        for (OutcomeValidation o : r.outcomes()) {
            boolean first = true;
            for (String k : Validation.REPORT_ORDER) {
                String lead = first ? Format.pad(o.outcome(), 16) + Format.pad(o.scale(), 8) : " ".repeat(24);
                first = false;
                Optional<Score> s = o.score(k);
                if (s.isEmpty()) {
                    String why = !k.equals(Validation.PHYSICS) ? "could not be fitted; see the verdict"
                            : noModels ? "the campaign lists no growth models" : "no growth model predicts it";
                    out.println(lead + Format.pad(k, 12) + "not available (" + why + ")");
                    continue;
                }
                Score sc = s.get();
                StringBuilder row = new StringBuilder(lead + Format.pad(k, 12) + Format.pad("" + sc.n(), 6));
                if (sc.forClasses()) {
                    row.append(Format.pad("-", 10)).append(Format.pad("-", 9)).append(Format.pad("-", 9))
                            .append(Format.pad(Format.num(sc.logLoss()), 10))
                            .append(sc.hits()).append(" of ").append(sc.n());
                } else {
                    row.append(Format.pad(Format.num(sc.rmse()), 10))
                            .append(Format.pad(sc.hits() + "/" + sc.n(), 9))
                            .append(Format.pad(Format.num(sc.msll()), 9))
                            .append(Format.pad("-", 10)).append("-");
                }
                out.println(row.toString().stripTrailing());
            }
        }
        out.println();
        out.println("Verdict:");
        for (String v : r.verdict()) {
            out.println("  * " + v);
        }
    }

    static String json(ValidationReport r, long seed) throws Exception {
        ObjectMapper om = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
        ObjectNode root = om.createObjectNode();
        root.put("campaign", r.campaignId());
        root.put("seed", seed);
        root.put("method", "leave-one-out");
        ArrayNode outs = root.putArray("outcomes");
        for (OutcomeValidation o : r.outcomes()) {
            ObjectNode on = outs.addObject();
            on.put("outcome", o.outcome());
            on.put("scale", o.scale());
            ObjectNode prop = on.putObject("proposal_surrogate");
            prop.put("surrogate", Validation.PROPOSAL);
            prop.put("built_as", "growth models + GP on their residual, as terrace propose builds it");
            Optional<Score> ps = o.score(Validation.PROPOSAL);
            if (ps.isPresent()) {
                putScore(prop.putObject("score"), ps.get());
            } else {
                prop.putNull("score");
            }
            prop.put("verdict", o.proposalVerdict());
            ObjectNode by = on.putObject("by_surrogate");
            for (String k : Validation.REPORT_ORDER) {
                Optional<Score> s = o.score(k);
                if (s.isEmpty()) {
                    by.putNull(k);
                    continue;
                }
                putScore(by.putObject(k), s.get());
            }
            ArrayNode par = on.putArray("parity");
            for (ParityPoint p : o.parity()) {
                par.addObject().put("surrogate", p.surrogate()).put("run_id", p.runId()).put("measured", p.measured())
                        .put("predicted", p.predicted()).put("lo90", p.lo90()).put("hi90", p.hi90());
            }
        }
        ArrayNode v = root.putArray("verdict");
        r.verdict().forEach(v::add);
        return om.writeValueAsString(root);
    }

    private static void putScore(ObjectNode sn, Score sc) {
        sn.put("n", sc.n());
        sc.rmseIfAny().ifPresent(v -> sn.put("rmse", v));
        sc.coverage90IfAny().ifPresent(v -> {
            sn.put("coverage90", v);
            sn.put("inside90", sc.hits());
        });
        sc.msllIfAny().ifPresent(v -> sn.put("msll", v));
        sc.logLossIfAny().ifPresent(v -> sn.put("log_loss", v));
        sc.accuracyIfAny().ifPresent(v -> sn.put("accuracy", v));
    }
}
