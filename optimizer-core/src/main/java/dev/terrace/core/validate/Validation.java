package dev.terrace.core.validate;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.fit.FitResults.Estimate;
import dev.terrace.core.fit.FitResults.FitReport;
import dev.terrace.core.fit.FitResults.ModelFit;
import dev.terrace.core.fit.ModelFitter;
import dev.terrace.core.model.ModelChain;
import dev.terrace.core.model.RecipeConverter;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;
import dev.terrace.core.surrogate.ClassModel;
import dev.terrace.spi.GrowthModel;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Leave-one-out cross-validation of a campaign's surrogates, outcome by outcome.
 *
 * <p><b>Folds.</b> Each ok run that records every setting and measured at least one outcome
 * (measured on at least {@link #MIN_RUNS} ok runs) is held out once; every surrogate is refitted
 * to the remaining runs (failed runs always stay in training, as in a real fit) and predicts the
 * held-out recipe as a new one, with no measured outcome fed in. Folds run one after another with
 * the same seed.
 *
 * <p><b>Surrogates.</b>
 * <ul>
 *   <li>{@value #PHYSICS}: the campaign's growth-model chain alone, refitted with
 *       {@link ModelFitter#fit(LoadedCampaign, PluginRegistry, long, boolean)} (fast mode). Its
 *       predictive spread of a new measurement is a constant: the root-mean-square residual of the
 *       refitted chain on the training runs, with n - p degrees of freedom (p = the fitted
 *       parameters of the models that predict the outcome; the residual standard error of
 *       regression). This ignores the parameters' own uncertainty, so the intervals are slightly
 *       too narrow far from the runs. Not available when the campaign lists no models, and absent
 *       for an outcome no model predicts.</li>
 *   <li>{@value #GP}: {@link CampaignSurrogate} with the physics switched off (a Gaussian process
 *       around the training mean, classifiers from uniform priors).</li>
 *   <li>{@value #PHYSICS_GP}, the <b>proposal surrogate</b> ({@link #PROPOSAL}): {@link
 *       CampaignSurrogate#build(LoadedCampaign, PluginRegistry, boolean, long)} with the physics on,
 *       exactly as {@code terrace propose} builds it by default: the GP on the residual of the
 *       growth models (the GP alone when the campaign lists no models, as in propose). Its chain is
 *       also the {@value #PHYSICS} surrogate of the fold, so the models are fitted once per fold.
 *       It is reported first; the others are comparisons.</li>
 *   <li>{@value #MEAN}: the trivial predictor, a Gaussian with the training runs' mean and sample
 *       variance (numeric outcomes), or the training class frequencies with add-one (Laplace)
 *       smoothing (class outcomes). It is the reference of the MSLL, and the baseline the proposal
 *       surrogate must beat in the verdict.</li>
 * </ul>
 *
 * <p><b>Verdict.</b> Each outcome's verdict opens with the proposal surrogate: its RMSE (log loss
 * for classes) against the trivial predictor's, and for numeric outcomes how many held-out runs its
 * 90 % intervals cover ("11 of 13"). Coverage is read with a one-sided exact binomial test: with n
 * held-out runs and honest intervals the count inside is Binomial(n, 0.9), and a count whose lower
 * (or upper) tail probability is below {@link #COVERAGE_TAIL} is called implausibly low (too narrow)
 * or implausibly high (too wide). The best surrogate and the physics prior follow as comparisons.
 *
 * <p><b>Metrics</b> (numeric outcomes on their fitting scale, log10 for {@code scale: log}): RMSE
 * of the predictive mean; coverage of the central 90 % interval of a new measurement, mean ± {@link
 * #Z90} sd with sd = sqrt(latent variance + noise variance); mean standardized log loss (Rasmussen
 * and Williams, Gaussian Processes for Machine Learning, MIT Press 2006, eq. 2.34, from memory):
 * SLL = ½ ln(2πσ²) + (y - μ)²/(2σ²) minus the same for the trivial Gaussian of that fold, averaged.
 * Every predictive sd is floored at the fitter's noise floor ({@link ModelFitter#LOG_NOISE_FLOOR}
 * dex, or {@link ModelFitter#LINEAR_NOISE_FLOOR} of the mean magnitude) so densities stay finite.
 * Class outcomes: mean -ln p of the observed class (p floored at {@link
 * ClassModel#PROBABILITY_FLOOR}) and accuracy of the most likely class (the first in campaign
 * order on a tie).
 *
 * <p><b>Cost.</b> Per held-out run: one growth-model fit (inside the {@value #PHYSICS_GP}
 * surrogate) and one GP-only surrogate. The growth-model fit dominates: a few seconds per fold
 * for the demo campaign's two models, so about a minute for its 13 folds on one core.
 *
 * @since 0.1
 */
public final class Validation {

    /** Key of the growth models alone. */
    public static final String PHYSICS = "physics";
    /** Key of the Gaussian process alone. */
    public static final String GP = "gp";
    /** Key of the Gaussian process on the growth models' residual. */
    public static final String PHYSICS_GP = "physics+gp";
    /** Key of the surrogate {@code terrace propose} builds (growth models + GP on their residual). */
    public static final String PROPOSAL = PHYSICS_GP;
    /** Plain name of {@link #PROPOSAL} in reports. */
    public static final String PROPOSAL_LABEL = "proposal surrogate";
    /** Key of the trivial predictor (training mean and variance, or class frequencies). */
    public static final String MEAN = "mean";
    /** The three surrogates, in the order they are scored. */
    public static final List<String> SURROGATES = List.of(PHYSICS, GP, PHYSICS_GP);
    /** Report order: the proposal surrogate first, then the comparisons, then the trivial predictor. */
    public static final List<String> REPORT_ORDER = List.of(PROPOSAL, PHYSICS, GP, MEAN);
    /**
     * Fewest ok runs with a measured outcome for a validation, and fewest ok runs measuring an
     * outcome for that outcome to be validated: holding one out leaves two, the least that gives a
     * training variance for the trivial predictor.
     */
    public static final int MIN_RUNS = 3;
    /** The 95 % quantile of the standard normal, half-width of a central 90 % interval in sd (standard normal tables). */
    public static final double Z90 = 1.6448536269514722;
    /**
     * A surrogate whose error reaches this fraction of the trivial predictor's counts as "no better
     * than the mean" in the verdict (Terrace's own reading threshold, not a published one).
     */
    public static final double NO_BETTER_THAN_MEAN = 0.9;
    /**
     * Two errors whose ratio is below this count as "little difference" in the verdict (Terrace's
     * own reading threshold: with a dozen held-out runs, RMSEs within 20 % are not told apart).
     */
    public static final double CLEAR_RATIO = 1.2;
    /** One-sided binomial tail below which the verdict calls 90 % intervals too narrow or too wide (common practice). */
    public static final double COVERAGE_TAIL = 0.05;
    /** Most fold failures spelled out in the verdict. */
    public static final int MAX_PROBLEMS_LISTED = 3;

    private Validation() {
    }

    /**
     * Validates every outcome of a campaign with the three surrogates.
     *
     * @param lc   the campaign and its runs
     * @param reg  the plugins its models come from
     * @param seed seed of every fit (the same in every fold)
     * @return the report; never null; without outcomes (and saying why) when fewer than
     *         {@link #MIN_RUNS} ok runs measured anything
     */
    public static ValidationReport run(LoadedCampaign lc, PluginRegistry reg, long seed) {
        return run(lc, reg, seed, Set.copyOf(SURROGATES), () -> { });
    }

    /**
     * Validates every outcome of a campaign, calling back after each fold (for a progress bar).
     *
     * @param lc        the campaign and its runs
     * @param reg       the plugins its models come from
     * @param seed      seed of every fit
     * @param afterFold called once after each held-out run, {@link #heldOutRuns} times in all; never null
     * @return the report; never null
     */
    public static ValidationReport run(LoadedCampaign lc, PluginRegistry reg, long seed, Runnable afterFold) {
        return run(lc, reg, seed, Set.copyOf(SURROGATES), afterFold);
    }

    /**
     * The runs a validation holds out: ok runs that record every setting and measured an outcome
     * that at least {@link #MIN_RUNS} ok runs measured.
     *
     * @param lc a campaign and its runs
     * @return their ids in log order; never null, empty when fewer than {@link #MIN_RUNS} ok runs
     *         measured anything
     */
    public static List<String> heldOutRuns(LoadedCampaign lc) {
        if (usableRuns(lc) < MIN_RUNS) {
            return List.of();
        }
        List<Run> runs = lc.runLog().runs();
        List<OutcomeSpec> eligible = eligible(lc.campaign(), runs);
        DesignSpace space = DesignSpace.of(lc.campaign());
        List<String> out = new ArrayList<>();
        for (Run r : runs) {
            if (r.ok() && eligible.stream().anyMatch(o -> measured(o, r))
                    && space.encode(r.numbers(), r.categories()) != null) {
                out.add(r.runId());
            }
        }
        return out;
    }

    /** Number of threads that build fold surrogates (the machines Terrace targets have 2 cores). */
    public static final int FOLD_THREADS = 2;

    /** The surrogates fitted without one run. */
    record FoldModels(ModelChain chain, FitReport fit, CampaignSurrogate pg, CampaignSurrogate.Evaluation evPg,
                      CampaignSurrogate gp, CampaignSurrogate.Evaluation evGp, List<String> problems) {
    }

    static FoldModels buildFold(LoadedCampaign lc, PluginRegistry reg, long seed, int fi, boolean wantPg,
                                boolean wantPhysics, boolean wantGp, Runnable afterFold) {
        Campaign c = lc.campaign();
        DesignSpace space = DesignSpace.of(c);
        List<Run> runs = lc.runLog().runs();
        Run held = runs.get(fi);
        List<Run> train = new ArrayList<>(runs);
        train.remove(fi);
        LoadedCampaign reduced = new LoadedCampaign(c,
                new RunLog(lc.runLog().file(), train, lc.runLog().warnings()), lc.warnings());
        DesignPoint point = space.encode(held.numbers(), held.categories());
        List<String> problems = new ArrayList<>();
            ModelChain chain = null;
        FitReport fit = null;
        CampaignSurrogate.Evaluation evPg = null;
        CampaignSurrogate pgSurrogate = null;
        if (wantPg) {
            try {
                pgSurrogate = CampaignSurrogate.build(reduced, reg, true, seed);
                chain = pgSurrogate.chain();
                fit = pgSurrogate.fit();
                evPg = pgSurrogate.evaluate(List.of(point));
            } catch (RuntimeException e) {
                problems.add(failure(held, PHYSICS_GP, e));
                pgSurrogate = null;
                evPg = null;
            }
        }
        if (wantPhysics && chain == null) {
            try {
                fit = ModelFitter.fit(reduced, reg, seed, false);
                chain = ModelFitter.chain(c, reg, fit);
            } catch (RuntimeException e) {
                problems.add(failure(held, PHYSICS, e));
                chain = null;
            }
        }
        CampaignSurrogate gpSurrogate = null;
        CampaignSurrogate.Evaluation evGp = null;
        if (wantGp) {
            try {
                gpSurrogate = CampaignSurrogate.build(reduced, reg, false, seed);
                evGp = gpSurrogate.evaluate(List.of(point));
            } catch (RuntimeException e) {
                problems.add(failure(held, GP, e));
                gpSurrogate = null;
                evGp = null;
            }
        }
        synchronized (afterFold) {
            afterFold.run();
        }
        return new FoldModels(chain, fit, pgSurrogate, evPg, gpSurrogate, evGp, problems);
    }

    static List<OutcomeSpec> eligible(Campaign c, List<Run> runs) {
        List<OutcomeSpec> out = new ArrayList<>();
        for (OutcomeSpec o : c.outcomes()) {
            if (runs.stream().filter(r -> r.ok() && measured(o, r)).count() >= MIN_RUNS) {
                out.add(o);
            }
        }
        return out;
    }

    /**
     * @param lc a campaign and its runs
     * @return the ok runs that measured at least one outcome
     */
    public static int usableRuns(LoadedCampaign lc) {
        Campaign c = lc.campaign();
        int n = 0;
        for (Run r : lc.runLog().runs()) {
            if (r.ok() && c.outcomes().stream().anyMatch(o -> measured(o, r))) {
                n++;
            }
        }
        return n;
    }

    /** Validates with a chosen subset of the surrogates, without a callback. */
    static ValidationReport run(LoadedCampaign lc, PluginRegistry reg, long seed, Set<String> surrogates) {
        return run(lc, reg, seed, surrogates, () -> { });
    }

    /**
     * Validates with a chosen subset of the surrogates (the trivial predictor always runs).
     *
     * @param lc         the campaign and its runs
     * @param reg        the plugins
     * @param seed       seed of every fit
     * @param surrogates keys out of {@link #SURROGATES}
     * @param afterFold  called after each fold
     * @return the report; never null
     */
    static ValidationReport run(LoadedCampaign lc, PluginRegistry reg, long seed, Set<String> surrogates,
                                Runnable afterFold) {
        Campaign c = lc.campaign();
        List<String> head = new ArrayList<>();
        int usable = usableRuns(lc);
        if (usable < MIN_RUNS) {
            head.add("only " + usable + " ok run" + (usable == 1 ? "" : "s") + " with a measured outcome; leave-one-out"
                    + " validation needs at least " + MIN_RUNS);
            return new ValidationReport(c.id(), List.of(), head);
        }
        boolean hasModels = !c.models().isEmpty();
        boolean wantPhysics = hasModels && surrogates.contains(PHYSICS);
        boolean wantGp = surrogates.contains(GP) || (!hasModels && surrogates.contains(PHYSICS_GP));
        boolean wantPg = hasModels && surrogates.contains(PHYSICS_GP);
        DesignSpace space = DesignSpace.of(c);
        List<Run> runs = lc.runLog().runs();

        // outcomes with enough measurements
        List<OutcomeSpec> eligible = eligible(c, runs);
        List<String> skipped = new ArrayList<>();
        for (OutcomeSpec o : c.outcomes()) {
            long k = runs.stream().filter(r -> r.ok() && measured(o, r)).count();
            if (k < MIN_RUNS) {
                skipped.add(o.name() + " was measured on " + k + " ok run" + (k == 1 ? "" : "s") + " (needs "
                        + MIN_RUNS + "): not validated");
            }
        }
        // folds
        List<Integer> folds = new ArrayList<>();
        List<String> notEncoded = new ArrayList<>();
        for (int i = 0; i < runs.size(); i++) {
            Run r = runs.get(i);
            if (!r.ok() || eligible.stream().noneMatch(o -> measured(o, r))) {
                continue;
            }
            if (space.encode(r.numbers(), r.categories()) == null) {
                notEncoded.add(r.runId());
                continue;
            }
            folds.add(i);
        }

        Map<String, Map<String, Acc>> acc = new LinkedHashMap<>();
        for (OutcomeSpec o : eligible) {
            Map<String, Acc> m = new LinkedHashMap<>();
            for (String s : List.of(PHYSICS, GP, PHYSICS_GP, MEAN)) {
                m.put(s, new Acc());
            }
            acc.put(o.name(), m);
        }
        Set<String> physicsCovers = new HashSet<>();
        List<String> problems = new ArrayList<>();

        // the surrogates of every fold are independent: build them on up to FOLD_THREADS threads
        // (each with the same seed, so the result does not depend on the thread count)
        List<FoldModels> built = new ArrayList<>();
        java.util.concurrent.ExecutorService pool = java.util.concurrent.Executors.newFixedThreadPool(
                Math.max(1, Math.min(FOLD_THREADS, folds.size())));
        try {
            List<java.util.concurrent.Future<FoldModels>> futures = new ArrayList<>();
            for (int fi : folds) {
                futures.add(pool.submit(() -> buildFold(lc, reg, seed, fi, wantPg, wantPhysics, wantGp, afterFold)));
            }
            for (java.util.concurrent.Future<FoldModels> f : futures) {
                try {
                    built.add(f.get());
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    throw new IllegalStateException("validation interrupted", e);
                } catch (java.util.concurrent.ExecutionException e) {
                    throw new IllegalStateException("validation fold failed: " + e.getCause(), e.getCause());
                }
            }
        } finally {
            pool.shutdownNow();
        }
        for (int k = 0; k < folds.size(); k++) {
            int fi = folds.get(k);
            FoldModels fm = built.get(k);
            problems.addAll(fm.problems());
            Run held = runs.get(fi);
            List<Run> train = new ArrayList<>(runs);
            train.remove(fi);
            DesignPoint point = space.encode(held.numbers(), held.categories());
            ModelChain chain = fm.chain();
            FitReport fit = fm.fit();
            CampaignSurrogate.Evaluation evPg = fm.evPg();
            CampaignSurrogate pgSurrogate = fm.pg();
            CampaignSurrogate gpSurrogate = fm.gp();
            CampaignSurrogate.Evaluation evGp = fm.evGp();
            if (!hasModels && surrogates.contains(PHYSICS_GP)) {
                // without growth models the physics+gp surrogate is the GP alone
                pgSurrogate = gpSurrogate;
                evPg = evGp;
            }
            // physics at the held-out recipe and at the training runs
            ModelChain.Result atHeld = null;
            List<ModelChain.Result> atTrain = null;
            if (wantPhysics && chain != null) {
                try {
                    atHeld = chain.predict(RecipeConverter.conditions(c, held, false));
                    atTrain = new ArrayList<>();
                    for (Run r : train) {
                        atTrain.add(r.ok() ? chain.predict(RecipeConverter.conditions(c, r, false)) : null);
                    }
                } catch (RuntimeException e) {
                    problems.add(failure(held, PHYSICS, e));
                    atHeld = null;
                }
            }

            for (OutcomeSpec o : eligible) {
                if (!measured(o, held)) {
                    continue;
                }
                Map<String, Acc> m = acc.get(o.name());
                if (o.isClass()) {
                    int obs = o.classes().indexOf(held.category(o.name()).orElseThrow());
                    m.get(MEAN).addClass(held.runId(), frequencies(o, train), obs);
                    if (atHeld != null) {
                        double[] p = physicsProbabilities(o, atHeld);
                        if (p != null) {
                            physicsCovers.add(o.name());
                            m.get(PHYSICS).addClass(held.runId(), p, obs);
                        }
                    }
                    if (evGp != null && surrogates.contains(GP)) {
                        m.get(GP).addClass(held.runId(), evGp.classProbs().get(o.name())[0], obs);
                    }
                    if (evPg != null && surrogates.contains(PHYSICS_GP)) {
                        m.get(PHYSICS_GP).addClass(held.runId(), evPg.classProbs().get(o.name())[0], obs);
                    }
                    continue;
                }
                double y = scaled(o, held.number(o.name()).getAsDouble());
                double[] trivial = trivialGaussian(o, train);
                double m0 = trivial[0];
                double s0 = trivial[1];
                double floor = sdFloor(o, trivial[2]);
                m.get(MEAN).addNumber(held.runId(), y, m0, s0, m0, s0);
                if (atHeld != null) {
                    double mu = priorValue(c, o, atHeld);
                    double sd = physicsSd(c, o, train, atTrain, fit, reg);
                    if (Double.isFinite(mu) && Double.isFinite(sd)) {
                        physicsCovers.add(o.name());
                        m.get(PHYSICS).addNumber(held.runId(), y, mu, Math.max(sd, floor), m0, s0);
                    }
                }
                if (evGp != null && surrogates.contains(GP) && gpSurrogate.hasGp(o.name())) {
                    m.get(GP).addNumber(held.runId(), y, evGp.mean().get(o.name())[0],
                            Math.max(sdNew(evGp, o.name()), floor), m0, s0);
                }
                if (evPg != null && surrogates.contains(PHYSICS_GP) && pgSurrogate.hasGp(o.name())) {
                    m.get(PHYSICS_GP).addNumber(held.runId(), y, evPg.mean().get(o.name())[0],
                            Math.max(sdNew(evPg, o.name()), floor), m0, s0);
                }
            }
        }

        // scores, parity points, verdict
        List<OutcomeValidation> outs = new ArrayList<>();
        List<String> outcomeLines = new ArrayList<>();
        Map<String, String> bestByOutcome = new LinkedHashMap<>();
        for (OutcomeSpec o : eligible) {
            Map<String, Acc> m = acc.get(o.name());
            Map<String, Score> scores = new LinkedHashMap<>();
            List<ParityPoint> parity = new ArrayList<>();
            for (String s : List.of(PHYSICS, GP, PHYSICS_GP, MEAN)) {
                Acc a = m.get(s);
                if (a.size() == 0) {
                    continue;
                }
                scores.put(s, a.score(o.isClass()));
                if (!o.isClass() && !s.equals(MEAN)) {
                    parity.addAll(a.parity(s, o));
                }
            }
            if (scores.isEmpty()) {
                continue;
            }
            String proposal = ValidationVerdict.proposalVerdict(o, new OutcomeValidation(o.name(), scaleName(o), scores, parity));
            OutcomeValidation ov = new OutcomeValidation(o.name(), scaleName(o), scores, parity, proposal);
            outs.add(ov);
            Optional<String> best = ValidationVerdict.best(ov);
            best.ifPresent(b -> bestByOutcome.put(o.name(), b));
            if (!proposal.isEmpty()) {
                outcomeLines.add(proposal);
            }
            outcomeLines.addAll(ValidationVerdict.verdict(c, o, ov, hasModels, physicsCovers.contains(o.name()), m.get(MEAN).size()));
        }

        List<String> verdict = new ArrayList<>();
        int failed = lc.runLog().failedRuns().size();
        verdict.add("held out " + folds.size() + " run" + (folds.size() == 1 ? "" : "s")
                + " one at a time and refitted each surrogate to the rest"
                + (failed > 0 ? "; " + failed + " failed run" + (failed == 1 ? "" : "s")
                + " stayed in training" : ""));
        if (!hasModels) {
            verdict.add("the campaign lists no growth models: " + PHYSICS + " alone is not available and "
                    + PHYSICS_GP + " is the GP alone");
        }
        verdict.addAll(skipped);
        for (String id : notEncoded) {
            verdict.add("run " + id + " does not record every setting: it stayed in training but was not held out");
        }
        for (int i = 0; i < Math.min(problems.size(), MAX_PROBLEMS_LISTED); i++) {
            verdict.add(problems.get(i));
        }
        if (problems.size() > MAX_PROBLEMS_LISTED) {
            verdict.add((problems.size() - MAX_PROBLEMS_LISTED) + " more fold failures not listed");
        }
        if (eligible.isEmpty()) {
            verdict.add("no outcome was measured on at least " + MIN_RUNS + " ok runs; nothing to validate");
        }
        verdict.addAll(outcomeLines);
        Set<String> bests = new LinkedHashSet<>(bestByOutcome.values());
        if (bests.size() == 1 && bestByOutcome.size() > 1) {
            verdict.add(bests.iterator().next() + " is the best surrogate on every validated outcome");
        } else if (bests.size() > 1) {
            List<String> parts = new ArrayList<>();
            bestByOutcome.forEach((k, v) -> parts.add(k + " " + v));
            verdict.add("best surrogate by outcome: " + String.join(", ", parts));
        }
        return new ValidationReport(c.id(), outs, verdict);
    }

    // ------------------------------------------------------------------ per-fold pieces

    /** True when the run holds a usable measurement of the outcome. */
    static boolean measured(OutcomeSpec o, Run r) {
        if (o.isClass()) {
            return r.category(o.name()).map(v -> o.classes().contains(v)).orElse(false);
        }
        var v = r.number(o.name());
        return v.isPresent() && Double.isFinite(v.getAsDouble()) && (o.scale() != Scale.LOG || v.getAsDouble() > 0);
    }

    static double scaled(OutcomeSpec o, double v) {
        return o.scale() == Scale.LOG ? Math.log10(v) : v;
    }

    static double unscaled(OutcomeSpec o, double v) {
        return o.scale() == Scale.LOG ? Math.pow(10, v) : v;
    }

    static String scaleName(OutcomeSpec o) {
        if (o.isClass()) {
            return "class";
        }
        return o.scale() == Scale.LOG ? "log10" : "linear";
    }

    /** {mean, sample sd floored, mean magnitude} of the ok training runs' values on the fitting scale. */
    static double[] trivialGaussian(OutcomeSpec o, List<Run> train) {
        double sum = 0;
        double sumAbs = 0;
        int n = 0;
        List<Double> ys = new ArrayList<>();
        for (Run r : train) {
            if (r.ok() && measured(o, r)) {
                double y = scaled(o, r.number(o.name()).getAsDouble());
                ys.add(y);
                sum += y;
                sumAbs += Math.abs(y);
                n++;
            }
        }
        double mean = sum / n;
        double ss = 0;
        for (double y : ys) {
            ss += (y - mean) * (y - mean);
        }
        double meanAbs = sumAbs / n;
        double sd = n > 1 ? Math.sqrt(ss / (n - 1)) : 0;
        return new double[] {mean, Math.max(sd, sdFloor(o, meanAbs)), meanAbs};
    }

    /** The smallest predictive sd allowed, from the fitter's noise floors. */
    static double sdFloor(OutcomeSpec o, double meanAbs) {
        if (o.scale() == Scale.LOG) {
            return ModelFitter.LOG_NOISE_FLOOR;
        }
        return Math.max(ModelFitter.LINEAR_NOISE_FLOOR * meanAbs, Double.MIN_NORMAL);
    }

    /** Laplace-smoothed class frequencies of the ok training runs, in campaign class order. */
    static double[] frequencies(OutcomeSpec o, List<Run> train) {
        int k = o.classes().size();
        double[] p = new double[k];
        java.util.Arrays.fill(p, 1);
        double total = k;
        for (Run r : train) {
            if (r.ok() && measured(o, r)) {
                p[o.classes().indexOf(r.category(o.name()).get())] += 1;
                total += 1;
            }
        }
        for (int j = 0; j < k; j++) {
            p[j] /= total;
        }
        return p;
    }

    /** The chain's prediction of a numeric outcome on its fitting scale, or NaN. */
    static double priorValue(Campaign c, OutcomeSpec o, ModelChain.Result r) {
        if (o.role() == null) {
            return Double.NaN;
        }
        Double v = r.values().get(o.role());
        if (v == null) {
            return Double.NaN;
        }
        double inUnit = o.unit().fromCanonical(v, c.surface().monolayerHeightNm());
        if (!Double.isFinite(inUnit) || (o.scale() == Scale.LOG && inUnit <= 0)) {
            return Double.NaN;
        }
        return scaled(o, inUnit);
    }

    /** The chain's class probabilities in campaign order, floored and renormalised, or null. */
    static double[] physicsProbabilities(OutcomeSpec o, ModelChain.Result r) {
        if (o.role() == null) {
            return null;
        }
        Map<String, Double> m = r.probabilities().get(o.role());
        if (m == null) {
            return null;
        }
        double[] p = new double[o.classes().size()];
        double sum = 0;
        for (int k = 0; k < p.length; k++) {
            Double v = m.get(o.classes().get(k));
            p[k] = Math.max(v == null || !Double.isFinite(v) ? 0 : v, ClassModel.PROBABILITY_FLOOR);
            sum += p[k];
        }
        for (int k = 0; k < p.length; k++) {
            p[k] /= sum;
        }
        return p;
    }

    /**
     * Residual standard error of the chain on the training runs: sqrt(SSE / max(n - p, 1)) with p
     * the fitted parameters of the models that predict the outcome; NaN when no training run has a
     * valid prediction.
     */
    static double physicsSd(Campaign c, OutcomeSpec o, List<Run> train, List<ModelChain.Result> atTrain,
                            FitReport fit, PluginRegistry reg) {
        double sse = 0;
        int n = 0;
        for (int i = 0; i < train.size(); i++) {
            Run r = train.get(i);
            if (!r.ok() || !measured(o, r) || atTrain.get(i) == null) {
                continue;
            }
            double f = priorValue(c, o, atTrain.get(i));
            if (!Double.isFinite(f)) {
                continue;
            }
            double e = scaled(o, r.number(o.name()).getAsDouble()) - f;
            sse += e * e;
            n++;
        }
        if (n == 0) {
            return Double.NaN;
        }
        int p = 0;
        if (fit != null && o.role() != null) {
            for (ModelFit mf : fit.models()) {
                Optional<GrowthModel> gm = reg.model(mf.id());
                if (gm.isPresent() && gm.get().predictedOutcomes().contains(o.role())) {
                    for (Estimate e : mf.estimates()) {
                        if (!e.held()) {
                            p++;
                        }
                    }
                }
            }
        }
        return Math.sqrt(sse / Math.max(n - p, 1));
    }

    static double sdNew(CampaignSurrogate.Evaluation ev, String outcome) {
        return Math.hypot(ev.sdLatent().get(outcome)[0], ev.noiseSd().get(outcome));
    }

    static String failure(Run held, String surrogate, RuntimeException e) {
        return "with run " + held.runId() + " held out, " + surrogate + " could not be fitted ("
                + e.getClass().getSimpleName() + (e.getMessage() == null ? "" : ": " + e.getMessage())
                + "); that fold is not scored for it";
    }

    /** Negative log density of y under N(mu, sd²). */
    static double nlpd(double y, double mu, double sd) {
        double z = (y - mu) / sd;
        return 0.5 * Math.log(2 * Math.PI * sd * sd) + 0.5 * z * z;
    }

    // ------------------------------------------------------------------ accumulation

    /** Held-out predictions of one surrogate for one outcome. */
    private static final class Acc {
        final List<String> runIds = new ArrayList<>();
        final List<double[]> numbers = new ArrayList<>();
        final List<double[]> probs = new ArrayList<>();
        final List<Integer> observed = new ArrayList<>();

        void addNumber(String runId, double y, double mu, double sd, double m0, double s0) {
            runIds.add(runId);
            numbers.add(new double[] {y, mu, sd, m0, s0});
        }

        void addClass(String runId, double[] p, int obs) {
            runIds.add(runId);
            probs.add(p.clone());
            observed.add(obs);
        }

        int size() {
            return runIds.size();
        }

        Score score(boolean cls) {
            int n = size();
            if (cls) {
                double ll = 0;
                int right = 0;
                for (int i = 0; i < n; i++) {
                    double[] p = probs.get(i);
                    int obs = observed.get(i);
                    ll -= Math.log(Math.max(p[obs], ClassModel.PROBABILITY_FLOOR));
                    int top = 0;
                    for (int k = 1; k < p.length; k++) {
                        if (p[k] > p[top]) {
                            top = k;
                        }
                    }
                    if (top == obs) {
                        right++;
                    }
                }
                return Score.classes(n, ll / n, (double) right / n);
            }
            double ss = 0;
            int inside = 0;
            double sll = 0;
            for (double[] v : numbers) {
                double e = v[0] - v[1];
                ss += e * e;
                if (Math.abs(e) <= Z90 * v[2]) {
                    inside++;
                }
                sll += nlpd(v[0], v[1], v[2]) - nlpd(v[0], v[3], v[4]);
            }
            return Score.numeric(n, Math.sqrt(ss / n), (double) inside / n, sll / n);
        }

        List<ParityPoint> parity(String surrogate, OutcomeSpec o) {
            List<ParityPoint> out = new ArrayList<>();
            for (int i = 0; i < numbers.size(); i++) {
                double[] v = numbers.get(i);
                double meas = unscaled(o, v[0]);
                double pred = unscaled(o, v[1]);
                double lo = unscaled(o, v[1] - Z90 * v[2]);
                double hi = unscaled(o, v[1] + Z90 * v[2]);
                if (Double.isFinite(meas) && Double.isFinite(pred) && Double.isFinite(lo) && Double.isFinite(hi)) {
                    out.add(new ParityPoint(surrogate, runIds.get(i), meas, pred, Math.min(lo, pred),
                            Math.max(hi, pred)));
                }
            }
            return out;
        }
    }
}
