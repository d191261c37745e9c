package dev.terrace.cli.bench;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.design.LatinHypercube;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.propose.Proposals.NumericPrediction;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.propose.Proposals.ProposalSet;
import dev.terrace.core.propose.Proposer;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;
import dev.terrace.demo.VirtualChamber;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.IntConsumer;

/**
 * Does the printed yield mean what it says? The closed loop of the sample-efficiency benchmark on
 * the virtual chamber (invented ground truth, see {@link VirtualChamber}): from 5 space-filling runs,
 * Terrace proposes batches of 2 until the log holds {@value #BUDGET} runs. For every proposal it
 * records the yield Terrace printed and the chamber's true probability that one run there meets
 * every target (estimated from {@value SampleEfficiency#TRUE_YIELD_SAMPLES} simulated runs, which
 * know the chamber's truth and scatter), and for every grown proposal whether each measured
 * outcome fell inside the printed 90 % interval.
 *
 * <p>Reported: the reliability table (proposals binned by printed yield, with the mean printed
 * yield and the mean true in-spec probability per bin; a reliability diagram in table form,
 * DeGroot and Fienberg, The Statistician 32, 12 (1983)), the bin-weighted mean absolute
 * calibration error, and the 90 % interval coverage.
 *
 * @since 0.2
 */
public final class CalibrationBench {

    /** Runs in the log when a seed's loop stops (5 space-filling runs and 8 batches of 2). */
    public static final int BUDGET = 21;

    /** Space-filling runs before the first proposal, as in the sample-efficiency benchmark. */
    static final int START_RUNS = 5;

    /** Upper edges of the reliability bins of printed yield. */
    static final double[] BIN_EDGES = {0.2, 0.4, 0.6, 0.8, 1.0};

    /** One proposal: what Terrace said and what was true. */
    public record Record(long seed, int runsBefore, boolean first, double said, double truth) {
    }

    /** Interval checks of the measured outcomes of grown proposals. */
    public record Coverage(int inside, int checked) {
        /** @return the fraction inside, NaN when nothing was checked */
        public double fraction() {
            return checked == 0 ? Double.NaN : (double) inside / checked;
        }
    }

    /** All seeds' results. */
    public record Result(List<Record> records, Coverage coverage, int seeds) {
    }

    private final int seeds;
    private final int threads;
    private final IntConsumer progress;

    /**
     * @param seeds    seeds to run (20 in the published table of the closing note)
     * @param threads  worker threads
     * @param progress called with 1 after each seed
     */
    public CalibrationBench(int seeds, int threads, IntConsumer progress) {
        this.seeds = seeds;
        this.threads = threads;
        this.progress = progress;
    }

    /**
     * Runs every seed.
     *
     * @param reg the growth models
     * @return the records in seed order; never null
     * @throws Exception when a trial fails
     */
    public Result run(PluginRegistry reg) throws Exception {
        ExecutorService pool = Executors.newFixedThreadPool(threads);
        try {
            List<Future<Object[]>> fs = new ArrayList<>();
            for (int s = 1; s <= seeds; s++) {
                final long seed = 1000L * s + 17; // the sample-efficiency benchmark's seeds
                fs.add(pool.submit(() -> {
                    Object[] r = trial(seed, reg);
                    progress.accept(1);
                    return r;
                }));
            }
            List<Record> all = new ArrayList<>();
            int inside = 0;
            int checked = 0;
            for (Future<Object[]> f : fs) {
                Object[] r = f.get();
                @SuppressWarnings("unchecked")
                List<Record> rec = (List<Record>) r[0];
                all.addAll(rec);
                inside += (Integer) r[1];
                checked += (Integer) r[2];
            }
            return new Result(all, new Coverage(inside, checked), seeds);
        } finally {
            pool.shutdownNow();
        }
    }

    /** One seed's loop: the records, then the counts of measurements inside and checked. */
    static Object[] trial(long seed, PluginRegistry reg) {
        Campaign c = SampleEfficiency.DemoBench.demoCampaign();
        DesignSpace space = DesignSpace.of(c);
        VirtualChamber chamber = VirtualChamber.of(c, seed);
        List<Run> runs = new ArrayList<>();
        for (DesignPoint p : SampleEfficiency.feasible(space, LatinHypercube.maximinPoints(40, space.dimensions(),
                space.levelCounts(), seed, 2000), START_RUNS)) {
            SampleEfficiency.grow(c, space, chamber, p, runs);
        }
        List<Record> records = new ArrayList<>();
        int inside = 0;
        int checked = 0;
        while (runs.size() < BUDGET) {
            CampaignSurrogate sur = CampaignSurrogate.build(SampleEfficiency.loaded(c, runs), reg, true,
                    seed + runs.size(), SampleEfficiency.BENCH_GP_CHAMBER, CampaignSurrogate.MIN_NOISE_FRACTION);
            ProposalSet set = Proposer.propose(sur, SampleEfficiency.settings(2, seed + runs.size(), true));
            int before = runs.size();
            boolean first = true;
            for (Proposal p : set.proposals()) {
                Map<String, Double> nums = SampleEfficiency.numbers(p);
                Map<String, String> cats = SampleEfficiency.categories(p);
                double truth = SampleEfficiency.trueYield(c, nums, cats, seed);
                records.add(new Record(seed, before, first, p.yield(), truth));
                first = false;
                if (runs.size() >= BUDGET) {
                    continue;
                }
                SampleEfficiency.grow(c, space, chamber, space.encode(nums, cats), runs);
                Run grown = runs.get(runs.size() - 1);
                if (!grown.ok()) {
                    continue;
                }
                for (Map.Entry<String, NumericPrediction> e : p.numeric().entrySet()) {
                    if (grown.number(e.getKey()).isEmpty()) {
                        continue;
                    }
                    double v = grown.number(e.getKey()).getAsDouble();
                    checked++;
                    if (v >= e.getValue().lo90() && v <= e.getValue().hi90()) {
                        inside++;
                    }
                }
            }
        }
        return new Object[] {records, inside, checked};
    }

    /**
     * The bin-weighted mean absolute calibration error: the sum over bins of (proposals in the bin)
     * times |mean printed yield - mean true probability|, over all proposals.
     *
     * @param records the proposals
     * @return the error in [0, 1]; NaN without records
     */
    public static double weightedCalibrationError(List<Record> records) {
        double sum = 0;
        for (double[] b : bins(records)) {
            if (b[0] > 0) {
                sum += b[0] * Math.abs(b[1] - b[2]);
            }
        }
        return records.isEmpty() ? Double.NaN : sum / records.size();
    }

    /** Per bin: count, mean said, mean true. */
    static List<double[]> bins(List<Record> records) {
        List<double[]> out = new ArrayList<>();
        for (int b = 0; b < BIN_EDGES.length; b++) {
            double lo = b == 0 ? Double.NEGATIVE_INFINITY : BIN_EDGES[b - 1];
            double hi = b == BIN_EDGES.length - 1 ? Double.POSITIVE_INFINITY : BIN_EDGES[b];
            int n = 0;
            double said = 0;
            double truth = 0;
            for (Record r : records) {
                if (r.said() >= lo && r.said() < hi) {
                    n++;
                    said += r.said();
                    truth += r.truth();
                }
            }
            out.add(new double[] {n, n == 0 ? Double.NaN : said / n, n == 0 ? Double.NaN : truth / n});
        }
        return out;
    }

    /**
     * @param result the benchmark's result
     * @return the reliability table, the weighted error and the interval coverage as text
     */
    public static String table(Result result) {
        StringBuilder sb = new StringBuilder();
        List<Record> rs = result.records();
        sb.append(String.format(Locale.ROOT, "Calibration on the virtual chamber (invented ground truth): %d seeds,"
                + " %d proposals, runs %d to %d%n%n", result.seeds(), rs.size(), START_RUNS, BUDGET - 1));
        sb.append("| printed yield | proposals | mean printed | true chance of reading in spec |\n");
        sb.append("|---|---|---|---|\n");
        List<double[]> bins = bins(rs);
        for (int b = 0; b < bins.size(); b++) {
            double lo = b == 0 ? 0 : BIN_EDGES[b - 1];
            double[] v = bins.get(b);
            sb.append(String.format(Locale.ROOT, "| %.1f-%.1f | %d | %s | %s |%n", lo, BIN_EDGES[b], (int) v[0],
                    v[0] == 0 ? "-" : String.format(Locale.ROOT, "%.2f", v[1]),
                    v[0] == 0 ? "-" : String.format(Locale.ROOT, "%.2f", v[2])));
        }
        List<Record> tops = rs.stream().filter(Record::first).toList();
        sb.append(String.format(Locale.ROOT, "%nweighted mean absolute calibration error  %.3f  (top proposals only: %.3f)%n",
                weightedCalibrationError(rs), weightedCalibrationError(tops)));
        // runs to a reliable top recipe in the same loops (the sample-efficiency benchmark's measure)
        java.util.TreeMap<Long, Integer> reliable = new java.util.TreeMap<>();
        for (Record r : rs) {
            reliable.putIfAbsent(r.seed(), BUDGET + 1);
            if (r.first() && r.truth() >= SampleEfficiency.RELIABLE && r.runsBefore() < reliable.get(r.seed())) {
                reliable.put(r.seed(), r.runsBefore());
            }
        }
        List<Integer> rl = new ArrayList<>(reliable.values());
        java.util.Collections.sort(rl);
        long never = rl.stream().filter(v -> v > BUDGET).count();
        if (!rl.isEmpty()) {
            double median = rl.size() % 2 == 1 ? rl.get(rl.size() / 2)
                    : 0.5 * (rl.get(rl.size() / 2 - 1) + rl.get(rl.size() / 2));
            sb.append(String.format(Locale.ROOT, "runs until the top proposal is reliable (true P(in spec) >= %.1f):"
                            + " median %s over %d seeds%s%n", SampleEfficiency.RELIABLE,
                    median > BUDGET ? "> " + (BUDGET - 1) : String.format(Locale.ROOT, "%.1f", median), rl.size(),
                    never == 0 ? "" : " (" + never + " never within " + (BUDGET - 1) + " runs)"));
        }
        Coverage cov = result.coverage();
        sb.append(String.format(Locale.ROOT, "90 %% interval coverage of measured outcomes  %.3f  (%d of %d)%n",
                cov.fraction(), cov.inside(), cov.checked()));
        return sb.toString();
    }
}
