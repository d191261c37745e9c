package dev.terrace.cli;

import dev.terrace.cli.plot.Plots;
import dev.terrace.core.Cautions;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.io.SafeFiles;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.propose.ProposeSettings;
import dev.terrace.core.propose.Proposer;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.window.ParetoFront;
import dev.terrace.core.window.WindowMap;
import dev.terrace.core.window.WindowMapResult;
import org.jfree.chart.JFreeChart;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.Callable;

/**
 * {@code terrace map CAMPAIGN --x PARAM --y PARAM}: the predicted process window over two settings,
 * optionally robust against a thermocouple error, as a text summary or a PNG/SVG chart; with
 * {@code --pareto} the trade-off between yield and a run's cost instead.
 */
@Command(name = "map", mixinStandardHelpOptions = true,
        description = {"Map the predicted yield over two settings with the others held, and the share of the map",
                "where a run is more likely than not to meet every target (the process window).",
                "With --pareto, find the recipes that trade yield against deposition time or group-V use.",
                "Predictions, not measurements; the run log is never changed."})
final class MapCommand implements Callable<Integer> {

    /** What {@code --at} accepts besides name=value pairs. */
    static final String AT_BEST = "best";
    /** Prefix of {@code --at run:ID}. */
    static final String AT_RUN = "run:";
    /** How many front recipes the text listing shows at most. */
    static final int FRONT_LISTING = 12;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Mixin
    GlobalOptions global = new GlobalOptions();

    @Parameters(index = "0", paramLabel = "CAMPAIGN", description = "The campaign YAML file.")
    Path campaignFile;

    @Option(names = "--x", paramLabel = "PARAM", description = "Numeric setting along the horizontal axis.")
    String x;

    @Option(names = "--y", paramLabel = "PARAM", description = "Numeric setting along the vertical axis.")
    String y;

    @Option(names = "--at", paramLabel = "SETTINGS", defaultValue = AT_BEST,
            description = "Where to hold the other settings: 'best' (the top proposal, with exactly the rounded"
                    + " values terrace propose gives with the same seed), 'run:ID' (a logged run's recipe) or"
                    + " name=value,name=value (settings left out come from the best proposal)."
                    + " Default: ${DEFAULT-VALUE}.")
    String at;

    @Option(names = "--out", paramLabel = "FILE", description = "Write the chart to FILE.png or FILE.svg (never overwrites without --force).")
    Path out;

    @Option(names = "--force", description = "Allow --out to replace an existing file (atomically).")
    boolean force;

    /** The checked --out target. */
    private SafeFiles.Target target;

    @Option(names = "--grid", paramLabel = "N", defaultValue = "" + WindowMap.DEFAULT_GRID,
            description = "Cells per axis, " + WindowMap.MIN_GRID + " to " + WindowMap.MAX_GRID + " (default: ${DEFAULT-VALUE}).")
    int grid;

    @Option(names = "--temperature-uncertainty", paramLabel = "K", defaultValue = "0",
            description = {"Standard deviation in K (0 to " + (int) OptionRanges.MAX_TEMPERATURE_UNCERTAINTY_K + ") of a thermocouple error that",
                    "shifts every temperature setting together; the yield is averaged over it (default: ${DEFAULT-VALUE},",
                    "the plain map)."})
    double temperatureUncertainty;

    @Option(names = "--pareto", paramLabel = "COST",
            description = "Show the yield/cost front instead of a map; COST is growth-time or group-v.")
    String pareto;

    @Option(names = "--seed", defaultValue = "" + ProposeSettings.DEFAULT_SEED,
            description = "Seed of the surrogate, the proposals and the front search (default: ${DEFAULT-VALUE}).")
    long seed;

    @Override
    public Integer call() throws Exception {
        CommandLine cl = spec.commandLine();
        // --grid and --temperature-uncertainty are range-checked before the command runs (OptionRanges)
        if (out != null) {
            String name = out.getFileName().toString().toLowerCase(Locale.ROOT);
            if (!name.endsWith(".png") && !name.endsWith(".svg")) {
                throw new CommandLine.ParameterException(cl, "--out must name a .png or .svg file, found " + out);
            }
        }
        PrintWriter err = cl.getErr();
        PluginRegistry reg = Registries.load(global, err);
        LoadedCampaign lc = LoadedCampaign.open(campaignFile, reg);
        if (out != null) {
            target = SafeFiles.target(out).replacing(force).protecting(lc.inputs());
            target.check();
        }
        Campaign c = lc.campaign();
        if (pareto != null) {
            return front(cl, lc, reg);
        }
        if (x == null || y == null) {
            throw new CommandLine.ParameterException(cl, "give both --x and --y (numeric settings of " + c.id()
                    + ": " + String.join(", ", c.numericParameterNames()) + "), or --pareto");
        }
        for (String[] axis : new String[][] {{"--x", x}, {"--y", y}}) {
            Optional<String> problem = WindowMap.axisProblem(c, axis[1]);
            if (problem.isPresent()) {
                throw new CommandLine.ParameterException(cl, axis[0] + ": " + problem.get());
            }
        }
        if (x.equals(y)) {
            throw new CommandLine.ParameterException(cl, "--x and --y must be two different settings, both are '" + x + "'");
        }
        Map<String, Object> held;
        String heldFrom;
        try {
            if (at.strip().equals(AT_BEST)) {
                held = Map.of();
                heldFrom = "the best proposal";
            } else if (at.strip().startsWith(AT_RUN)) {
                String id = at.strip().substring(AT_RUN.length()).strip();
                held = WindowMap.runRecipe(lc, id);
                heldFrom = "run " + id;
            } else {
                held = WindowMap.parseSettings(c, at);
                heldFrom = "--at";
            }
        } catch (IllegalArgumentException ex) {
            throw new CommandLine.ParameterException(cl, "--at: " + ex.getMessage());
        }
        for (String w : outsideBox(c, held, heldFrom, x, y)) {
            err.println("terrace: warning: " + w);
        }
        err.flush();
        CampaignSurrogate sur;
        WindowMapResult map;
        List<Proposal> proposals = List.of();
        try (Progress bar = Progress.startPhases("map", 2, global)) {
            bar.message("fitting models and surrogates");
            sur = CampaignSurrogate.build(lc, reg, true, seed);
            if (at.strip().equals(AT_BEST) || out != null) {
                proposals = Proposer.propose(sur, ProposeSettings.defaults().withSeed(seed)).proposals();
            }
            if (at.strip().equals(AT_BEST) && !proposals.isEmpty()) {
                // held at the top proposal's own rounded recipe, so the map and propose agree digit for digit
                Proposal top = proposals.get(0);
                Map<String, Object> recipe = new java.util.LinkedHashMap<>(top.recipe());
                recipe.remove(x);
                recipe.remove(y);
                held = recipe;
                heldFrom = "the top proposal " + top.id() + ", as terrace propose gives it with seed " + seed;
            }
            bar.step().message("predicting " + grid + " x " + grid + " cells");
            map = WindowMap.compute(sur, x, y, held, grid, temperatureUncertainty, seed);
            bar.step();
        }
        PrintWriter o = cl.getOut();
        o.print(summary(map, c, sur, heldFrom, held));
        o.flush();
        if (out != null) {
            JFreeChart chart = Plots.windowMap(map, lc.runLog().runs(), proposals, c);
            Plots.save(chart, target, Plots.DEFAULT_WIDTH, Plots.DEFAULT_HEIGHT);
            err.println("wrote " + out);
            err.flush();
        }
        return 0;
    }

    private int front(CommandLine cl, LoadedCampaign lc, PluginRegistry reg) throws Exception {
        Campaign c = lc.campaign();
        Optional<String> problem = ParetoFront.costProblem(c, pareto);
        if (problem.isPresent()) {
            throw new CommandLine.ParameterException(cl, "--pareto: " + problem.get());
        }
        if (x != null || y != null) {
            cl.getErr().println("terrace: --pareto searches over every setting; --x and --y are not used");
        }
        CampaignSurrogate sur;
        try (Progress bar = Progress.startPhases("map", 1, global)) {
            bar.message("fitting models and surrogates");
            sur = CampaignSurrogate.build(lc, reg, true, seed);
            bar.step();
        }
        ParetoFront f = ParetoFront.compute(sur, pareto, ParetoFront.DEFAULT_POPULATION, ParetoFront.DEFAULT_GENERATIONS,
                seed);
        if (f.points().isEmpty()) {
            throw new JobFailedException("the search found no recipe that keeps the campaign's limits; check them with"
                    + " 'terrace check'");
        }
        PrintWriter o = cl.getOut();
        o.print(frontSummary(f, c, sur));
        o.flush();
        if (out != null) {
            Plots.save(Plots.pareto(f), target, Plots.DEFAULT_WIDTH, Plots.DEFAULT_HEIGHT);
            cl.getErr().println("wrote " + out);
            cl.getErr().flush();
        }
        return 0;
    }

    /**
     * One warning per held numeric setting outside its campaign box, naming the setting, the value
     * and the box: the map holds the value as given, so its predictions there extrapolate.
     *
     * @param c        the campaign
     * @param held     the held settings as given ({@code --at} or a run's recipe)
     * @param heldFrom "--at" or "run ID"
     * @param x        the horizontal axis, not held
     * @param y        the vertical axis, not held
     * @return the warnings, in campaign order; empty when every held value is inside its box
     */
    static List<String> outsideBox(Campaign c, Map<String, Object> held, String heldFrom, String x, String y) {
        List<String> out = new java.util.ArrayList<>();
        for (ParameterSpec p : c.parameters()) {
            Object v = held.get(p.name());
            if (p.isCategorical() || !(v instanceof Double) || p.name().equals(x) || p.name().equals(y)) {
                continue;
            }
            double d = (Double) v;
            if (d < p.min() || d > p.max()) {
                String unit = " " + p.unit().symbol();
                out.add((heldFrom.equals("--at") ? "--at " + p.name() + "=" + Format.setting(d) + unit
                        : heldFrom + " holds " + p.name() + " at " + Format.setting(d) + unit)
                        + ", outside the campaign box of " + p.name() + ", " + Format.setting(p.min()) + " to "
                        + Format.setting(p.max()) + unit + "; the map holds it there, so its predictions extrapolate"
                        + " beyond the box");
            }
        }
        return out;
    }

    static String summary(WindowMapResult m, Campaign c, CampaignSurrogate sur, String heldFrom, Map<String, Object> given) {
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(Locale.ROOT, "Process window of campaign %s: %s against %s, %d x %d cells%n", c.id(),
                m.y().name(), m.x().name(), m.nx(), m.ny()));
        StringBuilder h = new StringBuilder();
        for (Map.Entry<String, Object> e : m.at().entrySet()) {
            if (e.getKey().equals(m.x().name()) || e.getKey().equals(m.y().name())) {
                continue;
            }
            // held values as given (a proposal's rounded recipe), not cut to a cell's 3 digits
            h.append(h.length() == 0 ? "" : ", ").append(e.getKey()).append(' ').append(heldValue(c, e.getKey(), e.getValue()));
        }
        boolean filled = !heldFrom.equals("the best proposal") && m.at().keySet().stream()
                .anyMatch(k -> !given.containsKey(k) && !k.equals(m.x().name()) && !k.equals(m.y().name()));
        sb.append("  held: ").append(h.length() == 0 ? "nothing else" : h).append(" (from ").append(heldFrom)
                .append(filled ? "; settings it leaves out from the best proposal" : "").append(")\n");
        sb.append(String.format(Locale.ROOT, "  window (yield >= %s): %s of the map%n", Format.num(WindowMap.WINDOW_THRESHOLD),
                pct(m.plainWindowFraction())));
        if (m.robust()) {
            sb.append(String.format(Locale.ROOT, "  with a thermocouple error of %s K (sd) on %s together: %s of the map,"
                            + " %s%n", Format.num(m.temperatureUncertaintyK()),
                    String.join(" and ", m.temperatureSettings()), pct(m.windowFraction()),
                    less(m.windowShrink())));
        } else if (m.temperatureUncertaintyK() == 0 && m.temperatureSettings().isEmpty()) {
            sb.append("  (the campaign has no temperature setting, so a thermocouple error cannot be mapped)\n");
        }
        WindowMapResult.Cell best = m.bestCell();
        sb.append(String.format(Locale.ROOT, "  best cell: %s %s, %s %s, yield %.2f%n", m.x().name(),
                value(c, m.x().name(), best.x()), m.y().name(), value(c, m.y().name(), best.y()), best.yield()));
        int infeasible = 0;
        for (int j = 0; j < m.ny(); j++) {
            for (int i = 0; i < m.nx(); i++) {
                if (!m.feasibleAt(i, j)) {
                    infeasible++;
                }
            }
        }
        if (infeasible > 0) {
            sb.append(String.format(Locale.ROOT, "  %s of the map breaks a campaign limit (yield 0 there)%n",
                    pct((double) infeasible / (m.nx() * m.ny()))));
        }
        if (m.classOutcome() != null) {
            StringBuilder cls = new StringBuilder();
            m.classShares().forEach((k, v) -> cls.append(cls.length() == 0 ? "" : ", ").append(k).append(' ').append(pct(v)));
            long regions = m.classRegions().size();
            sb.append("  most likely ").append(m.classOutcome()).append(": ").append(cls)
                    .append(String.format(Locale.ROOT, " (%d region%s)%n", regions, regions == 1 ? "" : "s"));
        }
        sb.append(String.format(Locale.ROOT, "Predictions from %d runs, not measurements.%n", sur.runsUsed()));
        cautions(sb, c);
        return sb.toString();
    }

    static String frontSummary(ParetoFront f, Campaign c, CampaignSurrogate sur) {
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(Locale.ROOT, "Yield against %s for campaign %s: %d recipes, none beaten on both by another%n",
                f.costName(), c.id(), f.points().size()));
        sb.append(String.format(Locale.ROOT, "  NSGA-II, population %d, %d generations, seed %d, %d recipes predicted%n",
                f.populationSize(), f.generations(), f.seed(), f.evaluations()));
        List<ParetoFront.FrontPoint> shown = f.spread(FRONT_LISTING);
        if (shown.size() < f.points().size()) {
            sb.append(String.format(Locale.ROOT, "  %d of them, spread along the front:%n", shown.size()));
        }
        for (ParetoFront.FrontPoint p : shown) {
            int idx = f.points().indexOf(p) + 1;
            StringBuilder r = new StringBuilder();
            for (ParameterSpec ps : c.parameters()) {
                r.append(r.length() == 0 ? "" : ", ").append(ps.name()).append(' ').append(value(c, ps.name(), p.recipe().get(ps.name())));
            }
            sb.append(String.format(Locale.ROOT, "  #%-3d yield %.2f  %s %s%n       %s%n", idx, p.yield(),
                    Format.num(p.cost()), f.costUnit(), r));
        }
        sb.append(String.format(Locale.ROOT, "Predictions from %d runs, not measurements.%n", sur.runsUsed()));
        cautions(sb, c);
        return sb.toString();
    }

    private static void cautions(StringBuilder sb, Campaign c) {
        sb.append(Cautions.pointer(c)).append('\n');
    }

    private static String heldValue(Campaign c, String name, Object v) {
        if (v instanceof Double) {
            ParameterSpec p = c.parameter(name).orElse(null);
            return Format.setting((Double) v) + (p == null || p.isCategorical() ? "" : " " + p.unit().symbol());
        }
        return String.valueOf(v);
    }

    private static String value(Campaign c, String name, Object v) {
        if (v instanceof Double) {
            ParameterSpec p = c.parameter(name).orElse(null);
            return Format.setting(round3((Double) v)) + (p == null || p.isCategorical() ? "" : " " + p.unit().symbol());
        }
        return String.valueOf(v);
    }

    /** Three significant digits, the precision a map cell or a front point carries. */
    private static double round3(double v) {
        if (v == 0 || !Double.isFinite(v)) {
            return v;
        }
        return new java.math.BigDecimal(v).round(new java.math.MathContext(3)).doubleValue();
    }

    private static String pct(double f) {
        return String.format(Locale.ROOT, "%.0f %%", 100 * f);
    }

    /**
     * How much smaller the window gets, in words: "12 % less", or "the same to the nearest 1 %"
     * when the shrink rounds to 0 % (never "0 % less").
     *
     * @param shrink the share of the map the window loses (negative when it grows)
     * @return the words; never null
     */
    static String less(double shrink) {
        long p = Math.round(100 * shrink);
        return p > 0 ? p + " % less" : p < 0 ? -p + " % more" : "the same to the nearest 1 %";
    }
}
