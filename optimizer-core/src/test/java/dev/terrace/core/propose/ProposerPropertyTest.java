package dev.terrace.core.propose;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.Proposals.NumericPrediction;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.propose.Proposals.ProposalSet;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.core.runlog.RunLogReader;
import dev.terrace.core.search.SearchSettings;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.LongRange;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Over many random campaigns (invented: random boxes, log and linear settings, a categorical setting,
 * a linear limit, random target windows, runs from a random smooth function with noise and some
 * failures) every proposal stays inside the boxes and limits, every yield is in [0, 1], and nothing
 * holds NaN or infinity.
 */
class ProposerPropertyTest {

    static final SearchSettings SMALL = SearchSettings.builder().populationSize(16).maxGenerations(8)
            .steadyGenerations(4).polishStarts(1).polishMaxIterations(10).build();

    record Generated(LoadedCampaign lc, Campaign c) {
    }

    static Generated generate(long seed) throws Exception {
        Random r = new Random(seed);
        int d = 1 + r.nextInt(3);
        boolean cat = r.nextBoolean();
        StringBuilder y = new StringBuilder("campaign: random-" + Math.abs(seed % 1000) + "\n");
        y.append("material: {substrate: GaAs}\nparameters:\n");
        double[] lo = new double[d];
        double[] hi = new double[d];
        boolean[] log = new boolean[d];
        for (int i = 0; i < d; i++) {
            log[i] = r.nextBoolean();
            lo[i] = log[i] ? Math.pow(10, -8 + 6 * r.nextDouble()) : -50 + 100 * r.nextDouble();
            hi[i] = log[i] ? lo[i] * Math.pow(10, 0.5 + 3 * r.nextDouble()) : lo[i] + 1 + 200 * r.nextDouble();
            // angles may be negative; log settings use a pressure
            y.append(String.format(Locale.ROOT, "  x%d: {unit: %s, min: %.6g, max: %.6g%s}%n", i, log[i] ? "Torr" : "deg",
                    lo[i], hi[i], log[i] ? ", scale: log" : ""));
        }
        if (cat) {
            y.append("  c: {choices: [a, b, c]}\n");
        }
        y.append("outcomes:\n  out: {unit: nm}\n  mode: {classes: [good, bad]}\n");
        y.append(String.format(Locale.ROOT, "targets:%n  out: {min: %.4g, max: %.4g}%n  mode: {is: good}%n",
                0.2 + 0.3 * r.nextDouble(), 0.7 + 0.3 * r.nextDouble()));
        if (d >= 2 && !log[0] && !log[1]) {
            // a limit that cuts off part of the box but keeps its middle
            double mid = (lo[0] + hi[0]) / 2 + (lo[1] + hi[1]) / 2;
            y.append(String.format(Locale.ROOT, "limits:%n  - x0 + x1 <= %.6g%n", mid + 0.25 * (hi[0] - lo[0])));
        }
        Path file = Path.of("/virtual/random.yaml");
        Campaign c = CampaignReader.parse(file, new StringReader(y.toString()), null).campaign();
        int n = r.nextInt(14);
        StringBuilder csv = new StringBuilder("run_id");
        for (int i = 0; i < d; i++) {
            csv.append(",x").append(i);
        }
        if (cat) {
            csv.append(",c");
        }
        csv.append(",out,mode,status\n");
        double[] w = new double[d];
        for (int i = 0; i < d; i++) {
            w[i] = -2 + 4 * r.nextDouble();
        }
        for (int k = 0; k < n; k++) {
            csv.append("R").append(k);
            double s = 0;
            for (int i = 0; i < d; i++) {
                ParameterSpec p = c.parameters().get(i);
                double u = r.nextDouble();
                double v = p.fromUnit(u);
                s += w[i] * u;
                csv.append(',').append(String.format(Locale.ROOT, "%.6g", v));
            }
            if (cat) {
                csv.append(',').append("abc".charAt(r.nextInt(3)));
            }
            boolean failed = r.nextDouble() < 0.15;
            double out = 0.5 + 0.3 * Math.sin(3 * s) + 0.05 * r.nextGaussian();
            csv.append(failed ? ",,," : String.format(Locale.ROOT, ",%.4f,%s,", out, out > 0.5 ? "good" : "bad"));
            csv.append(failed ? "failed" : "ok").append('\n');
        }
        RunLog log2 = RunLogReader.read(c, c.runs(), new StringReader(csv.toString()));
        return new Generated(new LoadedCampaign(c, log2, List.of()), c);
    }

    @Property(tries = 25)
    void proposalsStayInsideBoxesAndLimitsWithFiniteProbabilities(@ForAll @LongRange(min = 1, max = 1_000_000) long seed)
            throws Exception {
        Generated g = generate(seed);
        ProposeSettings s = ProposeSettings.defaults().withBatch(2).withSeed(seed).withSearch(SMALL);
        ProposalSet set = Proposer.propose(g.lc(), PluginRegistry.builder().autoDiscovery(false).build(), s);
        assertTrue(set.proposals().size() >= 1 && set.proposals().size() <= 2);
        for (Proposal p : set.proposals()) {
            Map<String, Double> nums = new java.util.LinkedHashMap<>();
            for (ParameterSpec ps : g.c().parameters()) {
                Object v = p.recipe().get(ps.name());
                if (ps.isCategorical()) {
                    assertTrue(ps.choices().contains(v), "choice " + v);
                } else {
                    double x = (Double) v;
                    assertTrue(Double.isFinite(x));
                    assertTrue(x >= ps.min() && x <= ps.max(), ps.name() + "=" + x + " outside [" + ps.min() + ", "
                            + ps.max() + "]");
                    nums.put(ps.name(), x);
                }
            }
            assertTrue(g.c().limitsHold(nums), "limits hold for " + nums);
            assertTrue(p.insideBox() && p.keepsLimits());
            assertTrue(p.yield() >= 0 && p.yield() <= 1, "yield " + p.yield());
            assertTrue(p.success() >= 0 && p.success() <= 1);
            for (NumericPrediction np : p.numeric().values()) {
                for (double v : new double[] {np.mean(), np.sd(), np.lo90(), np.hi90()}) {
                    assertTrue(Double.isFinite(v), "numeric prediction " + np);
                }
                assertTrue(np.inWindow() <= 1);
            }
            for (Map<String, Double> m : p.classes().values()) {
                double sum = m.values().stream().mapToDouble(Double::doubleValue).sum();
                assertEquals(1.0, sum, 1e-6);
            }
            assertTrue(Double.isFinite(p.acquisition()));
            assertTrue(Double.isFinite(p.nearestDistance()));
        }
        List<Double> yields = new ArrayList<>();
        set.proposals().forEach(p -> yields.add(p.yield()));
        for (int i = 1; i < yields.size(); i++) {
            assertTrue(yields.get(i - 1) >= yields.get(i), "ranked by yield");
        }
    }
}
