package dev.terrace.core.propose;

import dev.terrace.core.CheckSummary;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.acquisition.Acquisitions;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.model.RecipeConverter;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate.Evaluation;
import dev.terrace.core.propose.Proposals.BeyondRuns;
import dev.terrace.core.propose.Proposals.NumericPrediction;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.propose.Proposals.ProposalSet;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.Role;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Proposes the next batch of growth runs, or ranks a grower's own candidates, by predicted yield.
 *
 * <p><b>Yield</b> of a recipe: the probability that the next run's measurements meet every target,
 * taken as the product over numeric targets of P(min &le; y &le; max) under the predictive
 * distribution of a new measurement (GP latent variance plus noise), times P(class = target) for
 * class targets, times P(run succeeds). The product assumes the outcomes' errors are independent
 * given the recipe; correlated outcomes (a dense layer of small dots) make it conservative or
 * optimistic, which the ranking tolerates.
 *
 * <p><b>Acquisition.</b> Without an objective the search maximises the <em>optimistic</em> yield:
 * each window probability is taken at the most favourable mean within {@code explore} latent
 * standard deviations ({@link Acquisitions#optimisticWindowProbability}); {@code explore = 0}
 * maximises the predicted yield itself. With a {@code maximize}/{@code minimize} target the search
 * maximises constrained expected improvement (Gardner et al. 2014): EI of the objective over the best
 * predicted mean among runs that met the other targets, times the (optimistic) probabilities of the
 * windows, classes and success; with no such run yet it maximises the probability of meeting them
 * (Gelbart, Snoek and Adams 2014). All products are taken as sums of logarithms.
 *
 * <p><b>Batches</b> use the Kriging believer (Ginsbourger, Le Riche and Carraro 2010): after each
 * pick the GPs are conditioned on their own predicted mean there, so uncertainty shrinks and the
 * next pick goes elsewhere; picks closer than {@code minDistance} to an earlier pick over the
 * numeric settings are penalised, and no two rounded picks are closer than
 * {@link #MIN_BATCH_SEPARATION} (when the box and limits leave no room, the batch is cut short and a
 * note says so). In a batch of two or more, the first pick maximises the predicted yield itself
 * (the best bet) and the others the acquisition, so every batch holds one recipe to rely on and
 * some to learn from. With {@code explore = 0} every pick maximises the predicted yield, with or
 * without an objective; with an objective each reason line then says what yield the recipe trades
 * for how much objective against the highest-yield recipe found ({@link ObjectiveTrade}).
 *
 * <p><b>What the runs cover.</b> Each proposal lists the numeric settings outside the range of the
 * ok runs ({@link RunRanges}); {@link ProposeSettings#withinRuns()} keeps the search within a
 * margin of those ranges ({@link SearchBox}).
 *
 * <p><b>Too few runs.</b> With fewer ok runs with outcomes than {@link #runsNeeded} (settings + 1,
 * or half that when fitted growth models shape the surrogate), a maximin Latin
 * hypercube (Johnson, Moore and Ylvisaker 1990) is drawn and, when growth models are present, its
 * points are taken in order of their predicted yield (physics prior), keeping them apart.
 *
 * @since 0.1
 */
public final class Proposer {

    /**
     * Smallest distance between two proposals of a batch over the scaled numeric settings (each
     * setting on [0, 1] across the campaign box, log settings on log10; Euclidean; a different
     * categorical choice alone does not count), after rounding. A project choice in line with the
     * common practice of keeping batch points apart; not a published value.
     */
    public static final double MIN_BATCH_SEPARATION = 0.1;
    /** Score subtracted from a candidate closer than the minimum distance to an earlier pick. */
    public static final double DIVERSITY_PENALTY = 1000;
    /** Multiple of 1.645 for 90 % central intervals of a normal distribution. */
    public static final double Z90 = 1.6448536269514722;
    /** GaAs congruent evaporation temperature, about 625 degC = 898 K (Heyn et al.; Zhou et al., APL 2010). */
    public static final double CONGRUENT_EVAPORATION_K = 898;
    /** A group-V BEP below 1e-7 Torr (1.33e-5 Pa) is "almost none" (local droplet etching regime; Heyn et al. 2009). */
    public static final double LOW_GROUP_V_PA = 1.333e-5;

    private Proposer() {
    }

    /**
     * Proposes a batch for a campaign.
     *
     * @param lc       the campaign and its runs
     * @param registry the plugins
     * @param s        settings
     * @return the ranked batch; never null
     */
    public static ProposalSet propose(LoadedCampaign lc, PluginRegistry registry, ProposeSettings s) {
        CampaignSurrogate sur = CampaignSurrogate.build(lc, registry, s.usePhysics(), s.seed());
        return propose(sur, s);
    }

    /**
     * Proposes a batch from an already fitted surrogate.
     *
     * @param sur the surrogate
     * @param s   settings
     * @return the ranked batch; never null
     */
    public static ProposalSet propose(CampaignSurrogate sur, ProposeSettings s) {
        DesignSpace space = sur.space();
        int needed = runsNeeded(sur, s);
        RunRanges ranges = RunRanges.of(space, sur.loaded().runLog().runs());
        SearchBox box = SearchBox.of(space, ranges, s.withinRuns());
        List<String> notes = new ArrayList<>(sur.notes());
        notes.addAll(ranges.notes(space));
        notes.addAll(box.notes());
        BatchSearch.Picks picks;
        String mode;
        if (sur.runsUsed() < needed) {
            mode = "space-filling start";
            picks = BatchSearch.spaceFilling(sur, s, box);
            notes.add("only " + sur.runsUsed() + " run" + (sur.runsUsed() == 1 ? "" : "s")
                    + " with measured outcomes, fewer than the " + needed + " needed to fit the"
                    + " surrogates: proposing a maximin Latin-hypercube design"
                    + (sur.campaign().models().isEmpty() || !s.usePhysics() ? ""
                    : ", taken in order of the growth models' predicted yield"));
        } else {
            mode = "search";
            picks = BatchSearch.search(sur, s, box, incumbent(sur));
        }
        notes.addAll(picks.notes());
        List<Proposal> out = new ArrayList<>();
        Double inc = incumbent(sur); // computed once: it evaluates the surrogate at every qualifying run
        Reference ref = null; // the highest-yield recipe found: the search's own, or a pick that beats it
        if (picks.reference() != null) {
            List<DesignPoint> cand = new ArrayList<>(picks.points());
            cand.add(picks.reference());
            for (DesignPoint q : cand) {
                Reference r = reference(sur, q, s, inc);
                if (ref == null || r.yield() > ref.yield()) {
                    ref = r;
                }
            }
        }
        for (DesignPoint p : picks.points()) {
            Map<String, Double> rounded = new LinkedHashMap<>(); // picks are already rounded: undo float noise only
            space.numbers(p).forEach((k, v) -> rounded.put(k,
                    new java.math.BigDecimal(v).round(new java.math.MathContext(12)).doubleValue()));
            DesignPoint rp = space.encode(rounded, space.categories(p));
            out.add(describe(sur, rp != null ? rp : p, s, mode, rounded, space.categories(p), inc, ranges, ref));
        }
        out.sort(Comparator.comparingDouble(Proposal::yield).reversed().thenComparing(Proposal::id));
        List<Proposal> ranked = new ArrayList<>();
        for (int i = 0; i < out.size(); i++) {
            ranked.add(out.get(i).withRank(i + 1));
        }
        return new ProposalSet(sur.campaign().id(), sur.runsUsed(), s.seed(), mode, s.explore(), ranked, notes,
                sur.trainingSubsets());
    }

    /**
     * Fewest ok runs with outcomes before the surrogates drive the search: settings + 1 without growth
     * models; with growth models that could be fitted, half of that (at least
     * {@link dev.terrace.core.fit.ModelFitter#MIN_RUNS}), because the fitted physics already gives the
     * surrogate its shape and the GP only learns what the physics misses.
     *
     * @param sur the surrogate
     * @param s   settings
     * @return the threshold
     */
    public static int runsNeeded(CampaignSurrogate sur, ProposeSettings s) {
        DesignSpace space = sur.space();
        int plain = space.dimensions() + space.categorical().size() + 1;
        boolean physics = s.usePhysics() && sur.fit() != null && sur.fit().fittedAnything();
        return physics ? Math.max(dev.terrace.core.fit.ModelFitter.MIN_RUNS, (plain + 1) / 2) : plain;
    }

    /**
     * Ranks a grower's candidate recipes by predicted yield. Candidates outside the boxes or limits
     * are kept and flagged.
     *
     * @param sur        the surrogate
     * @param candidates candidate recipes (as runs; only their settings are used)
     * @param s          settings (seed and explore are reported; no search runs)
     * @return the ranking; never null
     */
    public static ProposalSet rank(CampaignSurrogate sur, List<Run> candidates, ProposeSettings s) {
        DesignSpace space = sur.space();
        List<Proposal> out = new ArrayList<>();
        Double inc = incumbent(sur); // computed once: it evaluates the surrogate at every qualifying run
        List<String> notes = new ArrayList<>(sur.notes());
        RunRanges ranges = RunRanges.of(space, sur.loaded().runLog().runs());
        notes.addAll(ranges.notes(space));
        for (Run r : candidates) {
            DesignPoint p = space.encode(r.numbers(), r.categories());
            if (p == null) {
                notes.add("candidate " + r.runId() + " does not give every setting; it cannot be ranked");
                continue;
            }
            Map<String, Double> nums = new LinkedHashMap<>();
            for (ParameterSpec ps : space.continuous()) {
                nums.put(ps.name(), r.numbers().get(ps.name()));
            }
            Proposal pr = describe(sur, p, s, "ranking", nums, space.categories(p), inc, ranges, null);
            out.add(new Proposal(r.runId(), 0, pr.yield(), pr.acquisition(), pr.recipe(), pr.numeric(), pr.classes(),
                    pr.success(), pr.nearestRun(), pr.nearestDistance(), pr.reason(), pr.flags(), pr.insideBox(),
                    pr.keepsLimits(), pr.beyondRuns()));
        }
        out.sort(Comparator.comparingDouble(Proposal::yield).reversed().thenComparing(Proposal::id));
        List<Proposal> ranked = new ArrayList<>();
        for (int i = 0; i < out.size(); i++) {
            ranked.add(out.get(i).withRank(i + 1));
        }
        return new ProposalSet(sur.campaign().id(), sur.runsUsed(), s.seed(), "ranking", s.explore(), ranked, notes,
                sur.trainingSubsets());
    }

    // ------------------------------------------------------------------ scoring

    /** Log yield and log acquisition per point, and the factors of the yield. */
    record Scores(double[] logYield, double[] logAcq, List<Map<String, Double>> factors) {
    }

    /**
     * The predicted yield of each point of an evaluation: the probability that a run there meets
     * every target, exactly as {@link #propose} and {@link #rank} report it (the product over the
     * targets described in the class comment, clamped to [0, 1]). Neither the exploration weight
     * nor an objective enters the yield.
     *
     * @param sur the surrogate that made the evaluation
     * @param e   an evaluation of {@code sur} at some points
     * @return the yield per point, in the evaluation's order, each in [0, 1]; never null
     */
    public static double[] yields(CampaignSurrogate sur, Evaluation e) {
        double[] ly = score(sur, e, 0, null).logYield();
        double[] y = new double[ly.length];
        for (int i = 0; i < ly.length; i++) {
            y[i] = clamp01(Math.exp(ly[i]));
        }
        return y;
    }

    static double scaled(OutcomeSpec o, double v) {
        if (Double.isNaN(v)) {
            return Double.NaN;
        }
        return o.scale() == Scale.LOG ? (v > 0 ? Math.log10(v) : Double.NEGATIVE_INFINITY) : v;
    }

    static Scores score(CampaignSurrogate sur, Evaluation e, double beta, Double incumbent) {
        Campaign c = sur.campaign();
        int n = e.points().size();
        double[] ly = new double[n];
        double[] la = new double[n];
        List<Map<String, Double>> factors = new ArrayList<>(n);
        Target objective = c.targets().stream().filter(Target::isObjective).findFirst().orElse(null);
        for (int i = 0; i < n; i++) {
            Map<String, Double> f = new LinkedHashMap<>();
            double y = 0;
            double a = 0;
            for (Target t : c.targets()) {
                OutcomeSpec o = c.outcome(t.outcome()).orElseThrow();
                if (t.isClassTarget()) {
                    double[] p = e.classProbs().get(o.name())[i];
                    double pk = p[o.classes().indexOf(t.is())];
                    f.put(o.name() + " is " + t.is(), pk);
                    y += Math.log(Math.max(pk, 1e-300));
                    a += Math.log(Math.max(pk, 1e-300));
                    continue;
                }
                if (!t.hasWindow()) {
                    continue;
                }
                double mu = e.mean().get(o.name())[i];
                double sl = e.sdLatent().get(o.name())[i];
                double ns = e.noiseSd().get(o.name());
                double sn = Math.sqrt(sl * sl + ns * ns);
                PhysicalRange range = PhysicalRange.of(o);
                double lo = range.windowLow(o.scale(), scaled(o, t.min()));
                double hi = range.windowHigh(o.scale(), scaled(o, t.max()));
                double lw = Acquisitions.logWindowProbability(mu, sn, lo, hi);
                f.put(o.name() + " in window", Math.exp(lw));
                y += lw;
                a += Acquisitions.logOptimisticWindowProbability(mu, sl, sn, lo, hi, beta);
            }
            double ps = e.success()[i];
            f.put("run succeeds", ps);
            y += Math.log(Math.max(ps, 1e-300));
            a += Math.log(Math.max(ps, 1e-300));
            if (objective != null && incumbent != null) {
                OutcomeSpec o = c.outcome(objective.outcome()).orElseThrow();
                double mu = e.mean().get(o.name())[i];
                double sl = e.sdLatent().get(o.name())[i];
                a += objective.goal() == Target.Goal.MAXIMIZE
                        ? Acquisitions.logExpectedImprovementMax(mu, sl, incumbent, 0)
                        : Acquisitions.logExpectedImprovement(mu, sl, incumbent, 0);
            }
            ly[i] = Math.max(y, Acquisitions.LOG_ZERO);
            la[i] = Math.max(a, Acquisitions.LOG_ZERO);
            factors.add(f);
        }
        return new Scores(ly, la, factors);
    }

    /** Best predicted mean of the objective among ok runs that met every other target, or null. */
    static Double incumbent(CampaignSurrogate sur) {
        Campaign c = sur.campaign();
        Target objective = c.targets().stream().filter(Target::isObjective).findFirst().orElse(null);
        if (objective == null || !sur.hasGp(objective.outcome())) {
            return null;
        }
        List<DesignPoint> pts = new ArrayList<>();
        List<Run> runs = sur.runs();
        List<DesignPoint> all = sur.runPoints();
        for (int i = 0; i < runs.size(); i++) {
            Run r = runs.get(i);
            if (!r.ok() || r.number(objective.outcome()).isEmpty()) {
                continue;
            }
            boolean meets = true;
            for (Target t : c.targets()) {
                if (t.isObjective() && !t.hasWindow()) {
                    continue;
                }
                Boolean m = CheckSummary.meets(t, r);
                if (m == null || !m) {
                    meets = false;
                }
            }
            if (meets) {
                pts.add(all.get(i));
            }
        }
        if (pts.isEmpty()) {
            return null;
        }
        double[] mu = sur.evaluate(pts).mean().get(objective.outcome());
        double best = objective.goal() == Target.Goal.MAXIMIZE ? Double.NEGATIVE_INFINITY : Double.POSITIVE_INFINITY;
        for (double m : mu) {
            best = objective.goal() == Target.Goal.MAXIMIZE ? Math.max(best, m) : Math.min(best, m);
        }
        return best;
    }

    static boolean inCube(DesignPoint p) {
        for (int i = 0; i < p.dimensions(); i++) {
            if (p.x(i) < 0 || p.x(i) > 1) {
                return false;
            }
        }
        return true;
    }

    // ------------------------------------------------------------------ description

    static Proposal describe(CampaignSurrogate sur, DesignPoint p, ProposeSettings s, String mode,
                             Map<String, Double> numbers, Map<String, String> categories, Double incumbent,
                             RunRanges ranges, Reference ref) {
        Campaign c = sur.campaign();
        DesignSpace space = sur.space();
        Evaluation e = sur.evaluate(List.of(p));
        Scores sc = score(sur, e, s.explore(), incumbent);
        double yield = clamp01(Math.exp(sc.logYield()[0]));
        double acq = Math.exp(sc.logAcq()[0]);
        Map<String, Object> recipe = new LinkedHashMap<>();
        for (ParameterSpec ps : c.parameters()) {
            if (ps.isCategorical()) {
                recipe.put(ps.name(), categories.get(ps.name()));
            } else {
                recipe.put(ps.name(), numbers.get(ps.name()));
            }
        }
        Map<String, NumericPrediction> numeric = new LinkedHashMap<>();
        for (OutcomeSpec o : c.outcomes()) {
            if (o.isClass()) {
                continue;
            }
            double mu = e.mean().get(o.name())[0];
            double sl = e.sdLatent().get(o.name())[0];
            double ns = e.noiseSd().get(o.name());
            double sn = Math.sqrt(sl * sl + ns * ns);
            Target t = c.target(o.name()).orElse(null);
            PhysicalRange range = PhysicalRange.of(o);
            double inWin = t != null && t.hasWindow()
                    ? clamp01(Acquisitions.windowProbability(mu, sn, range.windowLow(o.scale(), scaled(o, t.min())),
                    range.windowHigh(o.scale(), scaled(o, t.max())))) : -1;
            if (sn > 1e5) {
                continue; // never measured and no growth model predicts it: nothing to say
            }
            // the censored view (PhysicalRange): median and 90 % interval clipped to the physical range
            if (o.scale() == Scale.LOG) {
                double med = Math.pow(10, mu);
                numeric.put(o.name(), new NumericPrediction(range.clip(bounded(med)), bounded(med * Math.log(10) * sn),
                        range.clip(bounded(Math.pow(10, mu - Z90 * sn))), range.clip(bounded(Math.pow(10, mu + Z90 * sn))),
                        inWin));
            } else {
                numeric.put(o.name(), new NumericPrediction(range.clip(mu), sn, range.clip(mu - Z90 * sn),
                        range.clip(mu + Z90 * sn), inWin));
            }
        }
        Map<String, Map<String, Double>> classes = new LinkedHashMap<>();
        for (OutcomeSpec o : c.outcomes()) {
            if (!o.isClass()) {
                continue;
            }
            double[] pr = e.classProbs().get(o.name())[0];
            Map<String, Double> m = new LinkedHashMap<>();
            for (int k = 0; k < pr.length; k++) {
                m.put(o.classes().get(k), clamp01(pr[k]));
            }
            classes.put(o.name(), m);
        }
        String nearest = null;
        double nd = Double.NaN;
        List<DesignPoint> rp = sur.runPoints();
        for (int i = 0; i < rp.size(); i++) {
            double d = DesignSpace.distance(p, rp.get(i));
            if (nearest == null || d < nd) {
                nearest = sur.runs().get(i).runId();
                nd = d;
            }
        }
        boolean inside = space.insideBox(numbers);
        boolean limits = c.limits().stream().allMatch(l -> l.holds(numbers));
        List<String> flags = new ArrayList<>();
        if (!inside) {
            flags.add("outside the campaign's parameter box");
        }
        if (!limits) {
            c.limits().stream().filter(l -> !l.holds(numbers)).forEach(l -> flags.add("breaks the limit " + l.text()));
        }
        Map<String, BeyondRuns> beyond = ranges.beyond(space, numbers);
        for (Map.Entry<String, BeyondRuns> b : beyond.entrySet()) {
            String unit = c.parameter(b.getKey()).map(ps -> " " + ps.unit().symbol()).orElse("");
            flags.add(String.format(Locale.ROOT, "%s %s%s is beyond the ok runs (they span %s to %s%s): the prediction"
                            + " extrapolates", b.getKey(), num(b.getValue().value()), unit, num(b.getValue().runsMin()),
                    num(b.getValue().runsMax()), unit));
        }
        flags.addAll(ranges.untriedChoices(space, categories));
        flags.addAll(e.validity().get(0));
        flags.addAll(safetyFlags(c, numbers, categories));
        String id = id(c.id(), recipe);
        String reason = reason(mode, yield, acq, sc.factors().get(0), nearest, nd, sur, s);
        if (ref != null && mode.equals("search")) {
            reason = ObjectiveTrade.reason(c, ref, id, yield, objectiveValue(c, e)) + tail(sc.factors().get(0), nearest, nd);
        }
        return new Proposal(id, 0, yield, bounded(acq), recipe, numeric, classes,
                clamp01(e.success()[0]), nearest, Double.isNaN(nd) ? 0 : nd, reason, flags, inside, limits, beyond);
    }

    /** Short number for messages: up to 4 significant digits. */
    static String num(double v) {
        if (!Double.isFinite(v)) {
            return "-";
        }
        java.math.BigDecimal b = new java.math.BigDecimal(v).round(new java.math.MathContext(4)).stripTrailingZeros();
        double a = Math.abs(v);
        if (a != 0 && (a < 1e-3 || a >= 1e6)) {
            int exp = b.precision() - b.scale() - 1;
            return b.movePointLeft(exp).stripTrailingZeros().toPlainString() + "e" + exp;
        }
        return b.toPlainString();
    }

    /**
     * The highest-yield recipe the search found, to which the objective's trade is reported.
     *
     * @param id        its proposal id
     * @param yield     its predicted yield
     * @param objective its predicted objective (mean, or median for a log outcome)
     */
    record Reference(String id, double yield, double objective) {
    }

    static Reference reference(CampaignSurrogate sur, DesignPoint p, ProposeSettings s, Double inc) {
        Campaign c = sur.campaign();
        DesignSpace space = sur.space();
        Map<String, Double> rounded = RecipeRounding.round(space, p);
        DesignPoint rp = space.encode(rounded, space.categories(p));
        DesignPoint q = rp != null ? rp : p;
        Evaluation e = sur.evaluate(List.of(q));
        double y = clamp01(Math.exp(score(sur, e, 0, inc).logYield()[0]));
        Map<String, Object> recipe = new LinkedHashMap<>();
        for (ParameterSpec ps : c.parameters()) {
            recipe.put(ps.name(), ps.isCategorical() ? space.categories(q).get(ps.name()) : rounded.get(ps.name()));
        }
        return new Reference(id(c.id(), recipe), y, objectiveValue(c, e));
    }

    /** The predicted objective at the first point of an evaluation, in the outcome's unit (median for log outcomes). */
    static double objectiveValue(Campaign c, Evaluation e) {
        Target objective = c.targets().stream().filter(Target::isObjective).findFirst().orElse(null);
        if (objective == null) {
            return Double.NaN;
        }
        OutcomeSpec o = c.outcome(objective.outcome()).orElseThrow();
        double mu = e.mean().get(o.name())[0];
        return PhysicalRange.of(o).clip(o.scale() == Scale.LOG ? Math.pow(10, mu) : mu);
    }

    static List<String> safetyFlags(Campaign c, Map<String, Double> numbers, Map<String, String> categories) {
        List<String> out = new ArrayList<>();
        Conditions cond = RecipeConverter.conditions(c, numbers, categories);
        double tMax = Math.max(cond.value(Role.SUBSTRATE_TEMPERATURE).orElse(0),
                Math.max(cond.value(Role.CRYSTALLIZATION_TEMPERATURE).orElse(0), cond.value(Role.ANNEAL_TEMPERATURE).orElse(0)));
        var bep = cond.value(Role.GROUP_V_BEP);
        boolean arsenide = "GaAs".equals(c.material().substrate()) || c.material().substrate().endsWith("As");
        if (arsenide && tMax > CONGRUENT_EVAPORATION_K && bep.isPresent() && bep.getAsDouble() < LOW_GROUP_V_PA) {
            out.add(String.format(Locale.ROOT, "about %.0f degC with almost no group-V flux: above the congruent "
                    + "evaporation temperature (about 625 degC) the surface decomposes and free Ga forms (Zhou et al., "
                    + "APL 2010); intended only for local droplet etching", tMax - 273.15));
        }
        return out;
    }

    /** "; weakest: ... (nearest run ...)": the end of every reason line of a search. */
    static String tail(Map<String, Double> factors, String nearest, double nd) {
        String weakest = null;
        double wv = 2;
        for (Map.Entry<String, Double> f : factors.entrySet()) {
            if (f.getValue() < wv) {
                wv = f.getValue();
                weakest = f.getKey();
            }
        }
        String weak = weakest == null ? "" : String.format(Locale.ROOT, "; weakest: %s %.2f", weakest, wv);
        String near = nearest == null ? "no run yet" : String.format(Locale.ROOT, "nearest run %s at %.2f", nearest, nd);
        return weak + " (" + near + ")";
    }

    static String reason(String mode, double yield, double acq, Map<String, Double> factors, String nearest,
                         double nd, CampaignSurrogate sur, ProposeSettings s) {
        String tail = tail(factors, nearest, nd);
        if (mode.equals("space-filling start")) {
            boolean physics = s.usePhysics() && !sur.campaign().models().isEmpty();
            String near = nearest == null ? "no run yet" : String.format(Locale.ROOT, "nearest run %s at %.2f", nearest, nd);
            return "space-filling start" + (physics ? ", placed where the growth models expect results in spec" : "")
                    + " (" + near + ")";
        }
        if (mode.equals("ranking")) {
            return String.format(Locale.ROOT, "predicted yield %.2f", yield) + tail;
        }
        if (yield >= 0.5) {
            return String.format(Locale.ROOT, "likely in spec (yield %.2f)", yield) + tail;
        }
        if (acq > 3 * yield) {
            return "explores where predictions are uncertain and could meet spec" + tail;
        }
        return String.format(Locale.ROOT, "best predicted yield found (%.2f)", yield) + tail;
    }

    static String id(String campaign, Map<String, Object> recipe) {
        try {
            MessageDigest md = MessageDigest.getInstance("SHA-256");
            md.update(campaign.getBytes(StandardCharsets.UTF_8));
            for (Map.Entry<String, Object> e : recipe.entrySet()) {
                md.update(("|" + e.getKey() + "=" + e.getValue()).getBytes(StandardCharsets.UTF_8));
            }
            byte[] h = md.digest();
            return String.format(Locale.ROOT, "P-%02x%02x%02x%02x", h[0], h[1], h[2], h[3]);
        } catch (NoSuchAlgorithmException ex) {
            throw new IllegalStateException(ex);
        }
    }

    static double clamp01(double v) {
        return Double.isFinite(v) ? Math.max(0, Math.min(1, v)) : 0;
    }

    /** Finite value for outputs: overflow maps to the largest double, NaN to 0. */
    static double bounded(double v) {
        if (Double.isNaN(v)) {
            return 0;
        }
        return Math.max(-Double.MAX_VALUE, Math.min(Double.MAX_VALUE, v));
    }

    static double finite(double v) {
        return Double.isFinite(v) ? v : (v > 0 ? Double.MAX_VALUE : Double.NaN);
    }
}
