package dev.terrace.core.validate;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.fit.FitResults.FitReport;
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

import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

import static dev.terrace.core.validate.FoldPredictions.failure;
import static dev.terrace.core.validate.FoldPredictions.frequencies;
import static dev.terrace.core.validate.FoldPredictions.measured;
import static dev.terrace.core.validate.FoldPredictions.physicsProbabilities;
import static dev.terrace.core.validate.FoldPredictions.physicsSd;
import static dev.terrace.core.validate.FoldPredictions.priorValue;
import static dev.terrace.core.validate.FoldPredictions.scaleName;
import static dev.terrace.core.validate.FoldPredictions.scaled;
import static dev.terrace.core.validate.FoldPredictions.sdFloor;
import static dev.terrace.core.validate.FoldPredictions.sdNew;
import static dev.terrace.core.validate.FoldPredictions.trivialGaussian;

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

        Map<String, Map<String, HeldOutPredictions>> acc = new LinkedHashMap<>();
        for (OutcomeSpec o : eligible) {
            Map<String, HeldOutPredictions> m = new LinkedHashMap<>();
            for (String s : List.of(PHYSICS, GP, PHYSICS_GP, MEAN)) {
                m.put(s, new HeldOutPredictions());
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
                Map<String, HeldOutPredictions> m = acc.get(o.name());
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
            Map<String, HeldOutPredictions> m = acc.get(o.name());
            Map<String, Score> scores = new LinkedHashMap<>();
            List<ParityPoint> parity = new ArrayList<>();
            for (String s : List.of(PHYSICS, GP, PHYSICS_GP, MEAN)) {
                HeldOutPredictions a = m.get(s);
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
}
