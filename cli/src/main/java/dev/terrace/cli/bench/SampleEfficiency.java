package dev.terrace.cli.bench;

import dev.terrace.core.CheckSummary;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.bench.TestFunctions;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.design.LatinHypercube;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.propose.ProposeSettings;
import dev.terrace.core.propose.Proposer;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.propose.Proposals.ProposalSet;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.core.search.SearchSettings;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;
import dev.terrace.core.surrogate.GpSettings;
import dev.terrace.demo.DemoCampaign;
import dev.terrace.demo.RunResult;
import dev.terrace.demo.VirtualChamber;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.IntConsumer;

/**
 * The sample-efficiency benchmark: how many runs (evaluations) each strategy needs, median over
 * seeds, side by side in one run.
 *
 * <ul>
 *   <li><b>Branin</b> on [-5,10]x[0,15] (minimise): evaluations until the best value is within 1 % of
 *       5/(4 pi). Published reference: EGO needs 28 (Jones, Schonlau and Welch 1998; from memory).</li>
 *   <li><b>Hartmann-6</b> on [0,1]^6: evaluations until within 1 % of -3.32237 (EGO: 121, from memory).</li>
 *   <li><b>Virtual chamber</b> (invented ground truth, {@link VirtualChamber}) on the demo campaign's
 *       targets, from 5 space-filling runs in batches of 2: (1) runs until the first run that meets
 *       spec; (2) runs until the recipe ranked first is reliable, i.e. its true probability of
 *       meeting spec on one run (known to the chamber: Monte Carlo over its scatter and failures) is
 *       at least {@link #RELIABLE}.</li>
 * </ul>
 * Strategies: random search, a maximin Latin hypercube of the same size taken in order, Terrace
 * with its growth models switched off (pure GP) and, on the chamber, Terrace with the physics on.
 * A strategy that does not succeed within the budget counts as budget + 1 (shown as "&gt;").
 *
 * @since 0.1
 */
public final class SampleEfficiency {

    /** True one-run probability of meeting spec that makes a recipe "reliable". */
    public static final double RELIABLE = 0.8;
    /** Monte Carlo repetitions for the chamber's true yield. */
    public static final int TRUE_YIELD_SAMPLES = 300;

    /** One strategy's result on one seed. */
    public record Trial(String problem, String strategy, long seed, int firstHit, int reliable) {
    }

    /** Strategy names, in table order. */
    public static final List<String> STRATEGIES = List.of("random", "lhs", "terrace-gp", "terrace");

    private final int seeds;
    private final int threads;
    private final IntConsumer progress;

    /**
     * @param seeds    repetitions per problem and strategy
     * @param threads  worker threads (seeds run in parallel; each trial is deterministic)
     * @param progress called with 1 after each finished trial (may be a no-op)
     */
    public SampleEfficiency(int seeds, int threads, IntConsumer progress) {
        this.seeds = seeds;
        this.threads = threads;
        this.progress = progress;
    }

    // ------------------------------------------------------------------ problems

    static final String BRANIN = String.join("\n",
            "campaign: bench-branin", "material: {substrate: GaAs}", "parameters:",
            "  x1: {unit: 1, min: -5, max: 10}", "  x2: {unit: 1, min: 0, max: 15}",
            "outcomes:", "  f: {unit: 1}", "targets:", "  f: {minimize: true}", "");

    static String hartmann() {
        StringBuilder sb = new StringBuilder("campaign: bench-hartmann6\nmaterial: {substrate: GaAs}\nparameters:\n");
        for (int i = 1; i <= 6; i++) {
            sb.append("  x").append(i).append(": {unit: 1, min: 0, max: 1}\n");
        }
        sb.append("outcomes:\n  f: {unit: 1}\ntargets:\n  f: {minimize: true}\n");
        return sb.toString();
    }

    static Campaign parse(String yaml, String name) {
        try {
            return CampaignReader.parse(Path.of(name + ".yaml"), new StringReader(yaml), null).campaign();
        } catch (Exception e) {
            throw new IllegalStateException("benchmark campaign does not parse: " + e.getMessage(), e);
        }
    }

    /** Settings Terrace uses in the benchmark: the defaults with a lighter GP search (documented in DEVELOPERS.md). */
    static ProposeSettings settings(int batch, long seed, boolean physics) {
        return ProposeSettings.defaults().withBatch(batch).withSeed(seed).withPhysics(physics)
                .withSearch(SearchSettings.builder().populationSize(30).maxGenerations(30).steadyGenerations(8)
                        .polishStarts(2).polishMaxIterations(60).build());
    }

    /** Lighter GP search for the benchmark; noise-free test functions use the library noise floor. */
    static final GpSettings BENCH_GP = GpSettings.defaults().withHpoStarts(3);
    /** GP settings for the chamber: the campaign defaults with 3 starts. */
    static final GpSettings BENCH_GP_CHAMBER = CampaignSurrogate.DEFAULT_GP.withHpoStarts(3);

    // ------------------------------------------------------------------ function problems

    /** Evaluations until the best observed value is within 1 % of the optimum (budget + 1 if never). */
    static int functionTrial(Campaign c, java.util.function.ToDoubleFunction<double[]> f, double fStar, String strategy,
                             long seed, int budget, PluginRegistry reg) {
        DesignSpace space = DesignSpace.of(c);
        int d = space.dimensions();
        List<Run> runs = new ArrayList<>();
        SplittableRandom rng = new SplittableRandom(seed);
        List<DesignPoint> lhs = strategy.equals("lhs")
                ? LatinHypercube.maximinPoints(budget, d, new int[0], seed, 2000) : List.of();
        double best = Double.POSITIVE_INFINITY;
        int evals = 0;
        while (evals < budget) {
            List<DesignPoint> next = new ArrayList<>();
            switch (strategy) {
                case "random":
                    double[] x = new double[d];
                    for (int i = 0; i < d; i++) {
                        x[i] = rng.nextDouble();
                    }
                    next.add(new DesignPoint(x, new int[0]));
                    break;
                case "lhs":
                    next.add(lhs.get(evals));
                    break;
                default:
                    CampaignSurrogate sur = CampaignSurrogate.build(loaded(c, runs), reg, false, seed + evals, BENCH_GP);
                    ProposalSet set = Proposer.propose(sur, settings(1, seed + evals, false));
                    for (Proposal p : set.proposals()) {
                        next.add(space.encode(numbers(p), Map.of()));
                    }
            }
            for (DesignPoint p : next) {
                Map<String, Double> nums = space.numbers(p);
                double[] v = new double[d];
                for (int i = 0; i < d; i++) {
                    v[i] = nums.get(space.continuous().get(i).name());
                }
                double y = f.applyAsDouble(v);
                Map<String, Double> row = new LinkedHashMap<>(nums);
                row.put("f", y);
                evals++;
                runs.add(new Run("E" + evals, row, Map.of(), Run.Status.OK, null, null, null, evals));
                best = Math.min(best, y);
                if (best - fStar <= 0.01 * Math.abs(fStar)) {
                    return evals;
                }
            }
        }
        return budget + 1;
    }

    static Map<String, Double> numbers(Proposal p) {
        Map<String, Double> m = new LinkedHashMap<>();
        p.recipe().forEach((k, v) -> {
            if (v instanceof Double) {
                m.put(k, (Double) v);
            }
        });
        return m;
    }

    static Map<String, String> categories(Proposal p) {
        Map<String, String> m = new LinkedHashMap<>();
        p.recipe().forEach((k, v) -> {
            if (v instanceof String) {
                m.put(k, (String) v);
            }
        });
        return m;
    }

    static LoadedCampaign loaded(Campaign c, List<Run> runs) {
        return new LoadedCampaign(c, new RunLog(c.runs(), runs, List.of()), List.of());
    }

    // ------------------------------------------------------------------ chamber problem

    /** The chamber's true probability that one run of the recipe succeeds and meets every target. */
    static double trueYield(Campaign c, Map<String, Double> nums, Map<String, String> cats, long seed) {
        // the chamber that grows the runs (same truth and smooth deviations), with its own scatter stream
        VirtualChamber mc = VirtualChamber.of(c, seed).replica(seed ^ 0x5DEECE66DL ^ nums.hashCode() ^ cats.hashCode());
        int hit = 0;
        for (int k = 0; k < TRUE_YIELD_SAMPLES; k++) {
            if (meetsSpec(c, mc.run(nums, cats))) {
                hit++;
            }
        }
        return (double) hit / TRUE_YIELD_SAMPLES;
    }

    static boolean meetsSpec(Campaign c, RunResult r) {
        if (!r.ok()) {
            return false;
        }
        Run run = toRun("x", r, Map.of(), Map.of(), 0);
        for (Target t : c.targets()) {
            Boolean m = CheckSummary.meets(t, run);
            if (m == null || !m) {
                return false;
            }
        }
        return true;
    }

    static Run toRun(String id, RunResult r, Map<String, Double> nums, Map<String, String> cats, int line) {
        Map<String, Double> n = new LinkedHashMap<>(nums);
        Map<String, String> k = new LinkedHashMap<>(cats);
        if (r.ok()) {
            n.putAll(r.numbers());
            k.putAll(r.classes());
        }
        return new Run(id, n, k, r.ok() ? Run.Status.OK : Run.Status.FAILED, null, null, r.notes(), line);
    }

    /** Closeness of a measured run to spec, for baselines' "ranked first": targets met, then distance. */
    static double specScore(Campaign c, Run r) {
        if (!r.ok()) {
            return -1e9;
        }
        double s = 0;
        for (Target t : c.targets()) {
            Boolean m = CheckSummary.meets(t, r);
            if (m != null && m) {
                s += 10;
            } else if (!t.isClassTarget() && r.number(t.outcome()).isPresent()) {
                OutcomeSpec o = c.outcome(t.outcome()).orElseThrow();
                double v = r.number(t.outcome()).getAsDouble();
                double lo = t.min();
                double hi = t.max();
                boolean log = o.scale() == Scale.LOG;
                double d = 0;
                if (!Double.isNaN(lo) && v < lo) {
                    d = log ? Math.log10(lo / v) : (lo - v) / Math.abs(lo);
                } else if (!Double.isNaN(hi) && v > hi) {
                    d = log ? Math.log10(v / hi) : (v - hi) / Math.abs(hi);
                }
                s -= d;
            }
        }
        return s;
    }

    static int[] chamberTrial(String strategy, long seed, int budget, PluginRegistry reg) {
        Campaign c = DemoBench.demoCampaign();
        DesignSpace space = DesignSpace.of(c);
        VirtualChamber chamber = VirtualChamber.of(c, seed);
        List<Run> runs = new ArrayList<>();
        SplittableRandom rng = new SplittableRandom(seed * 7919);
        // 5 space-filling runs (the same for every strategy with this seed)
        List<DesignPoint> start = feasible(space, LatinHypercube.maximinPoints(40, space.dimensions(),
                space.levelCounts(), seed, 2000), 5);
        List<DesignPoint> lhs = feasible(space, LatinHypercube.maximinPoints(4 * budget, space.dimensions(),
                space.levelCounts(), seed + 1, 2000), budget);
        int firstHit = budget + 1;
        int reliable = budget + 1;
        int lhsNext = 0;
        for (DesignPoint p : start) {
            grow(c, space, chamber, p, runs);
            if (firstHit > budget && meetsLast(c, runs)) {
                firstHit = runs.size();
            }
        }
        while (runs.size() < budget && (firstHit > budget || reliable > budget)) {
            List<DesignPoint> next = new ArrayList<>();
            DesignPoint top;
            if (strategy.startsWith("terrace")) {
                boolean physics = strategy.equals("terrace");
                CampaignSurrogate sur = CampaignSurrogate.build(loaded(c, runs), reg, physics, seed + runs.size(),
                        BENCH_GP_CHAMBER, CampaignSurrogate.MIN_NOISE_FRACTION);
                ProposalSet set = Proposer.propose(sur, settings(2, seed + runs.size(), physics));
                for (Proposal p : set.proposals()) {
                    next.add(space.encode(numbers(p), categories(p)));
                }
                Proposal first = set.proposals().get(0);
                if (reliable > budget && trueYield(c, numbers(first), categories(first), seed) >= RELIABLE) {
                    reliable = runs.size();
                }
            } else {
                Run best = null;
                for (Run r : runs) {
                    if (best == null || specScore(c, r) > specScore(c, best)) {
                        best = r;
                    }
                }
                if (best != null && reliable > budget) {
                    DesignPoint bp = space.encode(best.numbers(), best.categories());
                    if (bp != null && trueYield(c, space.numbers(bp), space.categories(bp), seed) >= RELIABLE) {
                        reliable = runs.size();
                    }
                }
                for (int k = 0; k < 2; k++) {
                    if (strategy.equals("random")) {
                        next.add(randomFeasible(space, rng));
                    } else {
                        next.add(lhs.get(Math.min(lhsNext++, lhs.size() - 1)));
                    }
                }
            }
            for (DesignPoint p : next) {
                if (runs.size() >= budget) {
                    break;
                }
                grow(c, space, chamber, p, runs);
                if (firstHit > budget && meetsLast(c, runs)) {
                    firstHit = runs.size();
                }
            }
        }
        return new int[] {firstHit, reliable};
    }

    static boolean meetsLast(Campaign c, List<Run> runs) {
        Run r = runs.get(runs.size() - 1);
        if (!r.ok()) {
            return false;
        }
        for (Target t : c.targets()) {
            Boolean m = CheckSummary.meets(t, r);
            if (m == null || !m) {
                return false;
            }
        }
        return true;
    }

    static void grow(Campaign c, DesignSpace space, VirtualChamber chamber, DesignPoint p, List<Run> runs) {
        Map<String, Double> nums = space.numbers(p);
        Map<String, String> cats = space.categories(p);
        RunResult r = chamber.run(nums, cats);
        runs.add(toRun("B" + (runs.size() + 1), r, nums, cats, runs.size() + 2));
    }

    static List<DesignPoint> feasible(DesignSpace space, List<DesignPoint> pts, int n) {
        List<DesignPoint> out = new ArrayList<>();
        for (DesignPoint p : pts) {
            if (space.feasible(p) && out.size() < n) {
                out.add(p);
            }
        }
        return out;
    }

    static DesignPoint randomFeasible(DesignSpace space, SplittableRandom rng) {
        int[] lv = space.levelCounts();
        for (int attempt = 0; ; attempt++) {
            double[] x = new double[space.dimensions()];
            for (int i = 0; i < x.length; i++) {
                x[i] = rng.nextDouble();
            }
            int[] l = new int[lv.length];
            for (int j = 0; j < l.length; j++) {
                l[j] = rng.nextInt(lv[j]);
            }
            DesignPoint p = new DesignPoint(x, l);
            if (space.feasible(p) || attempt > 10_000) {
                return p;
            }
        }
    }

    // ------------------------------------------------------------------ running

    /**
     * Runs the chosen problems.
     *
     * @param problems subset of "branin", "hartmann6", "chamber"
     * @param reg      plugins (for the physics on the chamber)
     * @return every trial; never null
     * @throws Exception when a worker fails
     */
    public List<Trial> run(List<String> problems, PluginRegistry reg) throws Exception {
        ExecutorService pool = Executors.newFixedThreadPool(threads);
        List<Future<Trial>> fs = new ArrayList<>();
        Campaign branin = parse(BRANIN, "bench-branin");
        Campaign h6 = parse(hartmann(), "bench-hartmann6");
        try {
            for (String problem : problems) {
                for (String strategy : STRATEGIES) {
                    if (strategy.equals("terrace") && !problem.equals("chamber")) {
                        continue; // no growth model applies to a test function: Terrace is the pure GP there
                    }
                    for (int s = 1; s <= seeds; s++) {
                        final long seed = 1000L * s + 17;
                        fs.add(pool.submit(() -> {
                            Trial t;
                            switch (problem) {
                                case "branin": {
                                    int e = functionTrial(branin, TestFunctions::branin, TestFunctions.BRANIN_MINIMUM,
                                            strategy, seed, 60, reg);
                                    t = new Trial(problem, strategy, seed, e, e);
                                    break;
                                }
                                case "hartmann6": {
                                    int e = functionTrial(h6, TestFunctions::hartmann6, TestFunctions.HARTMANN6_MINIMUM,
                                            strategy, seed, 200, reg);
                                    t = new Trial(problem, strategy, seed, e, e);
                                    break;
                                }
                                default: {
                                    int[] r = chamberTrial(strategy, seed, 31, reg);
                                    t = new Trial(problem, strategy, seed, r[0], r[1]);
                                }
                            }
                            progress.accept(1);
                            return t;
                        }));
                    }
                }
            }
            List<Trial> out = new ArrayList<>();
            for (Future<Trial> f : fs) {
                out.add(f.get());
            }
            return out;
        } finally {
            pool.shutdownNow();
        }
    }

    /** @return the number of trials {@link #run} will perform */
    public int trialCount(List<String> problems) {
        int n = 0;
        for (String p : problems) {
            n += (p.equals("chamber") ? STRATEGIES.size() : STRATEGIES.size() - 1) * seeds;
        }
        return n;
    }

    /** Budgets per problem (an unsolved trial counts as budget + 1). */
    public static int budget(String problem) {
        switch (problem) {
            case "branin":
                return 60;
            case "hartmann6":
                return 200;
            default:
                return 31;
        }
    }

    /**
     * @param values trial results
     * @return the median (the mean of the two middle values for an even count)
     */
    public static double median(int[] values) {
        int[] v = values.clone();
        Arrays.sort(v);
        int n = v.length;
        return n % 2 == 1 ? v[n / 2] : (v[n / 2 - 1] + v[n / 2]) / 2.0;
    }

    /**
     * Formats the side-by-side table.
     *
     * @param trials the trials
     * @return the table text
     */
    public static String table(List<Trial> trials) {
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(Locale.ROOT, "%-34s %10s %10s %12s %10s%n", "problem (median evaluations)",
                "random", "lhs", "terrace-gp", "terrace"));
        List<String> problems = new ArrayList<>();
        trials.forEach(t -> {
            if (!problems.contains(t.problem())) {
                problems.add(t.problem());
            }
        });
        for (String p : problems) {
            List<String[]> rows = new ArrayList<>();
            if (p.equals("chamber")) {
                rows.add(new String[] {"chamber: first run in spec", "first"});
                rows.add(new String[] {"chamber: top recipe reliable (>=0.8)", "reliable"});
            } else {
                rows.add(new String[] {p + ": within 1 % of optimum", "first"});
            }
            for (String[] row : rows) {
                sb.append(String.format(Locale.ROOT, "%-34s", row[0]));
                for (String s : STRATEGIES) {
                    int[] v = trials.stream().filter(t -> t.problem().equals(p) && t.strategy().equals(s))
                            .mapToInt(t -> row[1].equals("first") ? t.firstHit() : t.reliable()).toArray();
                    String cell;
                    if (v.length == 0) {
                        cell = "(same)";
                    } else {
                        double m = median(v);
                        cell = (m > budget(p) ? ">" + budget(p) : fmt(m)) + " (" + v.length + ")";
                    }
                    sb.append(String.format(Locale.ROOT, s.equals("terrace-gp") ? " %12s" : " %10s", cell));
                }
                sb.append('\n');
            }
        }
        sb.append("(n) = seeds; '>' = not reached within the budget in at least half the seeds; on the test\n"
                + "functions Terrace has no growth model, so 'terrace-gp' is Terrace itself.\n");
        return sb.toString();
    }

    static String fmt(double m) {
        return m == Math.rint(m) ? String.valueOf((long) m) : String.format(Locale.ROOT, "%.1f", m);
    }

    /** Bundled demo campaign, parsed once. */
    static final class DemoBench {
        private static Campaign campaign;

        static synchronized Campaign demoCampaign() {
            if (campaign == null) {
                try {
                    String yaml = DemoCampaign.files().get(DemoCampaign.CAMPAIGN_FILE);
                    campaign = CampaignReader.parse(Path.of("bench-chamber/campaign.yaml"), new StringReader(yaml), null)
                            .campaign();
                } catch (Exception e) {
                    throw new IllegalStateException(e);
                }
            }
            return campaign;
        }
    }

}
