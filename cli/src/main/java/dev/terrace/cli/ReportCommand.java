package dev.terrace.cli;

import dev.terrace.cli.plot.Plots;
import dev.terrace.cli.report.Figure;
import dev.terrace.cli.report.Html;
import dev.terrace.cli.report.HtmlReport;
import dev.terrace.cli.report.ReportContent;
import dev.terrace.cli.report.ReportContent.ArrheniusPanel;
import dev.terrace.cli.report.ReportContent.ScoreRow;
import dev.terrace.cli.report.ReportContent.ScoreTable;
import dev.terrace.cli.report.ReportContent.ValidationPanel;
import dev.terrace.cli.report.ReportContent.WindowPanel;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.fit.Arrhenius;
import dev.terrace.core.fit.FitResults.FitReport;
import dev.terrace.core.fit.ModelFitter;
import dev.terrace.core.io.SafeFiles;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.propose.ProposeSettings;
import dev.terrace.core.propose.Proposer;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.propose.Proposals.ProposalSet;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.validate.OutcomeValidation;
import dev.terrace.core.validate.ParityPoint;
import dev.terrace.core.validate.Score;
import dev.terrace.core.validate.Validation;
import dev.terrace.core.validate.ValidationReport;
import dev.terrace.core.window.WindowMap;
import dev.terrace.core.window.WindowMapResult;
import dev.terrace.spi.Role;
import org.jfree.chart.JFreeChart;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.function.Supplier;

/**
 * {@code terrace report CAMPAIGN --out FILE}: one self-contained HTML page with the campaign, its
 * runs and targets, the fitted growth-model parameters, the validation of the predictions, an
 * Arrhenius plot, window maps, the proposed next runs, the safety cautions and what the numbers mean.
 */
@Command(name = "report", mixinStandardHelpOptions = true,
        description = {"Write one self-contained HTML report of a campaign (inline figures, no scripts, prints on A4)",
                "with runs and targets, fitted parameters, validation, window maps, proposals and safety cautions.",
                "Never overwrites a file without --force and never touches the run log."})
final class ReportCommand implements Callable<Integer> {

    /**
     * Temperature uncertainty of the second window map, in K: a typical spread between the
     * thermocouple or pyrometer reading and the true surface temperature of a substrate (common
     * practice; from memory).
     */
    static final double MAP_TEMPERATURE_UNCERTAINTY_K = 5;
    /** Grid points per axis of the window maps. */
    static final int MAP_GRID = 41;
    /** Width of the figures in SVG user units (pixels at 96 dpi: about 17 cm, the text width of an A4 page). */
    static final int FIGURE_WIDTH = 640;
    /** Height of the figures in SVG user units. */
    static final int FIGURE_HEIGHT = 480;
    /** Height of the window maps in SVG user units (their legend needs more room). */
    static final int MAP_HEIGHT = 600;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Mixin
    GlobalOptions global = new GlobalOptions();

    @Parameters(index = "0", paramLabel = "CAMPAIGN", description = "The campaign YAML file.")
    Path campaignFile;

    @Option(names = "--out", required = true, paramLabel = "FILE", description = "The HTML file to write.")
    Path out;

    @Option(names = "--force", description = "Replace FILE if it exists (atomically).")
    boolean force;

    @Option(names = "--seed", defaultValue = "" + ProposeSettings.DEFAULT_SEED,
            description = "Seed of every random choice; the same seed gives the same report (default: ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--map", paramLabel = "X,Y",
            description = "Map the predicted yield over these two numeric settings (X across, Y up); repeat the "
                    + "option for more maps. Without it the report maps the substrate temperature against the "
                    + "group-V pressure when the campaign has both, else its first two numeric settings.")
    List<String> maps;

    /** The phases of the report, in order, for the progress bar. */
    private static final List<String> PHASES = List.of("reading", "fitting models", "validating",
            "proposing", "mapping", "density plot", "writing");

    @Override
    public Integer call() throws Exception {
        PrintWriter err = spec.commandLine().getErr();
        LocalDate date = LocalDate.now(Main.clock(spec));
        String html;
        SafeFiles.Target target;
        try (Progress bar = Progress.startPhases("report", PHASES.size(), global)) {
            bar.message(PHASES.get(0));
            PluginRegistry reg = Registries.load(global, err);
            LoadedCampaign lc = LoadedCampaign.open(campaignFile, reg);
            // the report never replaces the campaign file or its run log, whatever --force says
            target = SafeFiles.target(out).replacing(force).protecting(lc.inputs());
            target.check();
            mapPairs(lc.campaign());
            DiagnosticLines.print(err, lc.warnings());
            ReportContent content = compute(lc, reg, bar, err, date);
            bar.step().message(PHASES.get(6));
            html = HtmlReport.render(content);
            bar.step();
        }
        target.write(html);
        if (!global.quiet) {
            err.println("wrote " + out);
        }
        err.flush();
        return 0;
    }

    /** Computes every part of the report; a part that fails is left out with the reason. */
    private ReportContent compute(LoadedCampaign lc, PluginRegistry reg, Progress bar, PrintWriter err, LocalDate date) {
        Campaign c = lc.campaign();
        Map<String, String> problems = new LinkedHashMap<>();
        bar.step().message(PHASES.get(1));
        FitReport fit = null;
        if (c.models().isEmpty()) {
            problems.put(ReportContent.FIT, "The campaign lists no growth models (models: []), so there are no "
                    + "parameters to fit; the predictions come from the Gaussian process alone.");
        } else {
            fit = part(ReportContent.FIT, problems, err, () -> ModelFitter.fit(lc, reg, seed));
        }
        bar.step().message(PHASES.get(2));
        ValidationPanel validation = part(ReportContent.VALIDATION, problems, err, () -> validation(lc, reg, problems));
        bar.step().message(PHASES.get(3));
        CampaignSurrogate sur = part(ReportContent.PROPOSALS, problems, err,
                () -> CampaignSurrogate.build(lc, reg, true, seed));
        ProposalSet proposals = sur == null ? null : part(ReportContent.PROPOSALS, problems, err,
                () -> Proposer.propose(sur, ProposeSettings.defaults().withSeed(seed)));
        bar.step().message(PHASES.get(4));
        List<WindowPanel> windows = null;
        if (sur == null) {
            problems.putIfAbsent(ReportContent.WINDOWS, "No window maps: the surrogates could not be built.");
        } else {
            List<List<String>> pairs = mapPairs(c);
            if (pairs.isEmpty()) {
                problems.put(ReportContent.WINDOWS, "No window maps: a map needs two numeric settings and this "
                        + "campaign has " + mapAxes(c).size() + ".");
            } else {
                List<WindowPanel> panels = new ArrayList<>();
                for (int k = 0; k < pairs.size(); k++) {
                    List<String> xy = pairs.get(k);
                    String suffix = k == 0 ? "" : "-" + (k + 1);
                    WindowPanel w = part(ReportContent.WINDOWS, problems, err,
                            () -> windows(sur, proposals, xy.get(0), xy.get(1), suffix, problems));
                    if (w != null) {
                        panels.add(w);
                    }
                }
                windows = panels.isEmpty() ? null : panels;
            }
        }
        bar.step().message(PHASES.get(5));
        ArrheniusPanel arrhenius = part(ReportContent.ARRHENIUS, problems, err, () -> arrhenius(lc, problems));
        ReportContent.TrackRecordPanel track = part(ReportContent.TRACK_RECORD, problems, err,
                () -> ReportTrackRecord.panel(lc, problems));
        return new ReportContent(lc, generator(), seed, date, fit, validation, arrhenius, windows,
                proposals, problems, track);
    }

    private <T> T part(String key, Map<String, String> problems, PrintWriter err, Supplier<T> work) {
        try {
            return work.get();
        } catch (RuntimeException e) {
            String msg = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
            problems.put(key, "This part could not be computed: " + msg);
            err.println("terrace: report: " + key + " left out: " + msg);
            if (global.debug) {
                e.printStackTrace(err);
            }
            return null;
        }
    }

    // ------------------------------------------------------------------ validation

    /** How the validation scores were obtained, in plain words (see {@link Validation}). */
    static final String VALIDATION_METHOD = "Each ok run was left out in turn; every predictor was refitted to "
            + "the other runs and predicted the left-out recipe as a new one (leave-one-out cross-validation). "
            + "Lower RMSE is better; about 90 % of the runs should fall inside the 90 % intervals; MSLL below 0 "
            + "means better than guessing the mean of the other runs.";

    private ValidationPanel validation(LoadedCampaign lc, PluginRegistry reg, Map<String, String> problems) {
        ValidationReport v = Validation.run(lc, reg, seed);
        if (v.outcomes().isEmpty()) {
            problems.put(ReportContent.VALIDATION, "No validation: " + (v.verdict().isEmpty()
                    ? "fewer than " + Validation.MIN_RUNS + " ok runs measured an outcome."
                    : String.join("; ", v.verdict()) + "."));
            return null;
        }
        List<ScoreTable> tables = new ArrayList<>();
        List<Figure> parity = new ArrayList<>();
        for (OutcomeValidation o : v.outcomes()) {
            List<ScoreRow> rows = new ArrayList<>();
            for (Map.Entry<String, Score> e : o.bySurrogate().entrySet()) {
                Score s = e.getValue();
                rows.add(new ScoreRow(e.getKey(), s.n(), s.rmse(), s.coverage90(), s.msll(), s.logLoss(), s.accuracy()));
            }
            tables.add(new ScoreTable(o.outcome(), o.scale(), rows));
            if (!o.forClasses() && !o.parity().isEmpty()) {
                Figure f = parityFigure(lc.campaign(), o, problems);
                if (f != null) {
                    parity.add(f);
                }
            }
        }
        return new ValidationPanel(VALIDATION_METHOD, tables, v.verdict(), parity);
    }

    private Figure parityFigure(Campaign c, OutcomeValidation o, Map<String, String> problems) {
        OutcomeSpec spec = c.outcome(o.outcome()).orElseThrow();
        List<ParityPoint> pts = o.parity();
        int n = pts.size();
        String[] groups = new String[n];
        double[] measured = new double[n];
        double[] predicted = new double[n];
        double[] lo = new double[n];
        double[] hi = new double[n];
        String[] ids = new String[n];
        for (int i = 0; i < n; i++) {
            ParityPoint p = pts.get(i);
            ids[i] = p.runId();
            groups[i] = chartName(p.surrogate());
            measured[i] = p.measured();
            predicted[i] = p.predicted();
            lo[i] = p.lo90();
            hi[i] = p.hi90();
        }
        String quantity = o.outcome() + " (" + chartUnit(spec.unit().symbol()) + ")";
        double[] window = targetWindow(c, o.outcome());
        double tMin = window[0];
        double tMax = window[1];
        double bandMin = tMin;
        double bandMax = tMax;
        String labelled = chartName(Validation.PHYSICS_GP);
        return figure("parity-" + key(o.outcome()), "Each run's measured " + o.outcome() + " against the prediction "
                + "made without it, for each predictor; bars are 90 % intervals, the dashed line is a perfect "
                + "prediction, the grey band the target, and the " + labelled + " points carry their run ids.",
                () -> Plots.parity(quantity, o.scale().equals("log10"), groups, measured, predicted,
                lo, hi, ids, labelled, bandMin, bandMax), ReportContent.VALIDATION, problems);
    }

    /** Short legend names of the predictors. */
    static String chartName(String surrogate) {
        switch (surrogate) {
            case Validation.PHYSICS:
                return "growth models";
            case Validation.GP:
                return "Gaussian process";
            case Validation.PHYSICS_GP:
                return "models + Gaussian process";
            default:
                return surrogate;
        }
    }

    /**
     * Draws a chart as an inline figure; a chart that cannot be drawn (or would hold undefined
     * numbers) is left out and the reason added to the part's problems.
     */
    private Figure figure(String key, String caption, Supplier<JFreeChart> chart, String part,
                          Map<String, String> problems) {
        return figure(key, caption, chart, FIGURE_HEIGHT, part, problems);
    }

    private Figure figure(String key, String caption, Supplier<JFreeChart> chart, int height, String part,
                          Map<String, String> problems) {
        try {
            return Figure.of(key, caption, Plots.toSvg(chart.get(), FIGURE_WIDTH, height));
        } catch (RuntimeException e) {
            String msg = "A figure (" + caption + ") was left out: " + e.getMessage();
            problems.merge(part, msg, (a, b) -> a + " " + b);
            return null;
        }
    }

    /** A figure key made of letters, digits and '-'. */
    static String key(String name) {
        String k = name.replaceAll("[^A-Za-z0-9]+", "-");
        return Character.isLetter(k.isEmpty() ? '0' : k.charAt(0)) ? k : "x" + k;
    }

    /**
     * @param c       the campaign
     * @param outcome a numeric outcome
     * @return {min, max} of the outcome's target window (the last window target on it; NaN for an
     *         open side or no target), for shading a chart's target band
     */
    static double[] targetWindow(dev.terrace.core.campaign.Campaign c, String outcome) {
        double[] w = {Double.NaN, Double.NaN};
        for (dev.terrace.core.campaign.Target t : c.targets()) {
            if (t.outcome().equals(outcome) && t.hasWindow()) {
                w[0] = t.min();
                w[1] = t.max();
            }
        }
        return w;
    }

    /** A unit symbol for chart text: powers as Unicode superscripts (cm^-2 as cm⁻²), degC as °C. */
    static String chartUnit(String symbol) {
        String s = symbol.replace("degC", "\u00b0C");
        StringBuilder b = new StringBuilder();
        boolean power = false;
        for (char ch : s.toCharArray()) {
            if (ch == '^') {
                power = true;
                continue;
            }
            if (power && (ch == '-' || Character.isDigit(ch))) {
                b.append(ch == '-' ? '\u207b' : "\u2070\u00b9\u00b2\u00b3\u2074\u2075\u2076\u2077\u2078\u2079".charAt(ch - '0'));
                continue;
            }
            power = false;
            b.append(ch);
        }
        return b.toString();
    }

    // ------------------------------------------------------------------ windows

    /**
     * The two settings to map: the first numeric settings with the roles substrate temperature and
     * group-V BEP when the campaign has them, filled up from the other numeric settings in campaign order.
     *
     * @param c a campaign
     * @return up to two numeric setting names
     */
    static List<String> mapAxes(Campaign c) {
        List<String> axes = new ArrayList<>();
        for (Role r : List.of(Role.SUBSTRATE_TEMPERATURE, Role.GROUP_V_BEP)) {
            c.parameters().stream().filter(p -> !p.isCategorical() && p.role() == r).findFirst()
                    .ifPresent(p -> axes.add(p.name()));
        }
        for (ParameterSpec p : c.parameters()) {
            if (axes.size() >= 2) {
                break;
            }
            if (!p.isCategorical() && !axes.contains(p.name())) {
                axes.add(p.name());
            }
        }
        return axes;
    }

    /**
     * The pairs of settings to map: each --map X,Y as given, checked against the campaign (two
     * different numeric settings), or the default pair from {@link #mapAxes}.
     *
     * @param c the campaign
     * @return the pairs, in order; empty when the campaign has fewer than two numeric settings
     * @throws UsageException for a --map value that does not name two numeric settings
     */
    List<List<String>> mapPairs(Campaign c) {
        if (maps == null || maps.isEmpty()) {
            List<String> axes = mapAxes(c);
            return axes.size() < 2 ? List.of() : List.of(axes);
        }
        List<String> numeric = c.parameters().stream().filter(p -> !p.isCategorical()).map(ParameterSpec::name).toList();
        List<List<String>> pairs = new ArrayList<>();
        for (String m : maps) {
            String[] xy = m.split(",", -1);
            String expected = "; expected two different numeric settings of campaign " + c.id() + " as X,Y, from: "
                    + String.join(", ", numeric);
            if (xy.length != 2) {
                throw new UsageException("--map '" + m + "' is not two setting names joined by a comma" + expected);
            }
            String x = xy[0].strip();
            String y = xy[1].strip();
            for (String name : List.of(x, y)) {
                if (!numeric.contains(name)) {
                    boolean categorical = c.parameters().stream().anyMatch(p -> p.name().equals(name));
                    throw new UsageException("--map '" + m + "': " + (categorical ? "'" + name + "' is a choice, not"
                            + " a number, so it cannot be a map axis" : "the campaign has no setting '" + name + "'")
                            + expected);
                }
            }
            if (x.equals(y)) {
                throw new UsageException("--map '" + m + "' names the same setting twice" + expected);
            }
            pairs.add(List.of(x, y));
        }
        return pairs;
    }

    private WindowPanel windows(CampaignSurrogate sur, ProposalSet proposals, String x, String y, String suffix,
                                Map<String, String> problems) {
        Campaign c = sur.campaign();
        Map<String, Object> at = new LinkedHashMap<>();
        String atSource;
        if (proposals != null && !proposals.proposals().isEmpty()) {
            Proposal top = proposals.proposals().get(0);
            at.putAll(top.recipe());
            atSource = "those of the top proposal " + top.id();
        } else {
            atSource = "those of the single recipe with the highest predicted yield";
        }
        WindowMapResult plain = WindowMap.compute(sur, x, y, at, MAP_GRID, 0, seed);
        WindowMapResult robust = WindowMap.compute(sur, x, y, plain.at(), MAP_GRID, MAP_TEMPERATURE_UNCERTAINTY_K, seed);
        List<String> held = new ArrayList<>();
        for (ParameterSpec p : c.parameters()) {
            if (p.name().equals(x) || p.name().equals(y)) {
                continue;
            }
            Object v = plain.at().get(p.name());
            held.add(p.name() + " " + (v instanceof Double ? Html.setting((Double) v) + " " + p.unit().symbol()
                    : String.valueOf(v)));
        }
        List<String> notes = new ArrayList<>();
        WindowMapResult.Cell best = plain.bestCell();
        notes.add("Without a temperature error, " + Html.percent(plain.windowFraction()) + " of the map is "
                + "predicted more likely than not (yield at least " + Html.percent(WindowMap.WINDOW_THRESHOLD)
                + ") to meet every target. The best cell, " + x + " " + Html.setting(round(best.x())) + " "
                + plain.x().unit().symbol() + ", " + y + " " + Html.setting(round(best.y())) + " " + plain.y().unit().symbol()
                + ", has a predicted yield of " + Html.percent(best.yield()) + ".");
        if (robust.robust()) {
            notes.add("If the true substrate temperature differs from the reading by a random error with a "
                    + "standard deviation of " + Html.num(MAP_TEMPERATURE_UNCERTAINTY_K) + " K (the same error for "
                    + String.join(" and ", robust.temperatureSettings()) + "), the window covers "
                    + Html.percent(robust.windowFraction()) + " of the map"
                    + (Math.round(100 * robust.windowShrink()) > 0 ? ", " + MapCommand.less(robust.windowShrink()) : "")
                    + ". Recipes in the middle of the window are the safer choice.");
        } else {
            notes.add("No setting of this campaign is a temperature, so a temperature error does not change the map.");
        }
        if (!plain.classShares().isEmpty()) {
            StringBuilder sb = new StringBuilder();
            plain.classShares().forEach((k, v) -> sb.append(sb.length() == 0 ? "" : ", ").append(k).append(' ')
                    .append(Html.percent(v)));
            notes.add("Most likely " + plain.classOutcome() + " across the map: " + sb + ".");
        }
        List<Figure> figs = new ArrayList<>();
        String legend = " Runs are drawn at their own settings (filled: met every target); plus signs are the "
                + "proposals, numbered by rank; the dashed line marks a yield of " + Html.percent(WindowMap.WINDOW_THRESHOLD) + ".";
        mapFigure(sur, plain, proposals, "map-plain" + suffix, "Predicted yield over " + x + " and " + y
                + ", temperatures exactly as set." + legend, problems).ifPresent(figs::add);
        if (robust.robust()) {
            mapFigure(sur, robust, proposals, "map-robust" + suffix, "The same map with a random temperature error of "
                    + Html.num(MAP_TEMPERATURE_UNCERTAINTY_K) + " K (standard deviation) averaged in." + legend, problems)
                    .ifPresent(figs::add);
        }
        return new WindowPanel(x, y, held, atSource, figs, notes);
    }

    private java.util.Optional<Figure> mapFigure(CampaignSurrogate sur, WindowMapResult m, ProposalSet proposals,
                                                 String key, String caption, Map<String, String> problems) {
        List<Proposal> ps = proposals == null ? List.of() : proposals.proposals();
        return java.util.Optional.ofNullable(figure(key, caption, () -> Plots.windowMap(m, sur.loaded().runLog().runs(),
                ps, sur.campaign()), MAP_HEIGHT, ReportContent.WINDOWS, problems));
    }

    /** Rounds a map coordinate to 3 significant digits for the text. */
    static double round(double v) {
        if (v == 0 || !Double.isFinite(v)) {
            return v;
        }
        return new java.math.BigDecimal(v).round(new java.math.MathContext(3)).doubleValue();
    }

    // ------------------------------------------------------------------ arrhenius

    private ArrheniusPanel arrhenius(LoadedCampaign lc, Map<String, String> problems) {
        Campaign c = lc.campaign();
        OutcomeSpec density = densityOutcome(c);
        ParameterSpec temp = temperatureSetting(c);
        if (density == null || temp == null) {
            problems.put(ReportContent.ARRHENIUS, "No Arrhenius plot: it needs an outcome with role island_density "
                    + "and a setting with role substrate_temperature"
                    + (density == null ? "; this campaign has no island_density outcome" : "")
                    + (temp == null ? "; this campaign has no substrate_temperature setting" : "") + ".");
            return null;
        }
        List<double[]> pts = arrheniusPoints(lc, density, temp);
        long distinct = pts.stream().mapToDouble(p -> p[0]).distinct().count();
        if (pts.size() < 2 || distinct < 2) {
            problems.put(ReportContent.ARRHENIUS, "No Arrhenius plot: fewer than two ok runs at different "
                    + "temperatures measured " + density.name() + ".");
            return null;
        }
        double[] t = pts.stream().mapToDouble(p -> p[0]).toArray();
        double[] n = pts.stream().mapToDouble(p -> p[1]).toArray();
        Arrhenius a = Arrhenius.fit(t, n);
        String label = density.name() + " (" + chartUnit(density.unit().symbol()) + ")";
        Figure fig = figure("arrhenius", "ln(" + density.name() + ") against 1/kT over the ok runs, with the fitted "
                + "line" + (Double.isFinite(a.lo()) ? " and the band of its 95 % interval" : "") + ".",
                () -> Plots.arrhenius(t, n, a.energyEv(), a.lo(), a.hi(), label), ReportContent.ARRHENIUS, problems);
        return new ArrheniusPanel(density.name(), temp.name(), a, fig);
    }

    /** @return the numeric outcome with role island_density, or null */
    static OutcomeSpec densityOutcome(Campaign c) {
        return c.outcomes().stream().filter(o -> !o.isClass() && o.role() == Role.ISLAND_DENSITY)
                .findFirst().orElse(null);
    }

    /** @return the numeric setting with role substrate_temperature, or null */
    static ParameterSpec temperatureSetting(Campaign c) {
        return c.parameters().stream()
                .filter(p -> !p.isCategorical() && p.role() == Role.SUBSTRATE_TEMPERATURE).findFirst().orElse(null);
    }

    /** (temperature in K, density) of every ok run that measured a positive density. */
    static List<double[]> arrheniusPoints(LoadedCampaign lc, OutcomeSpec density, ParameterSpec temp) {
        List<double[]> pts = new ArrayList<>();
        double ml = lc.campaign().surface().monolayerHeightNm();
        for (Run r : lc.runLog().okRuns()) {
            var d = r.number(density.name());
            var tv = r.number(temp.name());
            if (d.isPresent() && tv.isPresent() && d.getAsDouble() > 0) {
                double k = temp.unit().toCanonical(tv.getAsDouble(), ml);
                if (k > 0) {
                    pts.add(new double[] {k, d.getAsDouble()});
                }
            }
        }
        return pts;
    }

    private static String generator() {
        try {
            return new Main.Version().getVersion()[0];
        } catch (Exception e) {
            return "terrace";
        }
    }
}
