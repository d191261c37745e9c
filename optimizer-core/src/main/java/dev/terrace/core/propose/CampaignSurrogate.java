package dev.terrace.core.propose;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.fit.FitResults.FitReport;
import dev.terrace.core.fit.ModelFitter;
import dev.terrace.core.model.ModelChain;
import dev.terrace.core.model.RecipeConverter;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.runlog.Censored;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;
import dev.terrace.core.surrogate.ClassModel;
import dev.terrace.core.surrogate.GaussianProcess;
import dev.terrace.core.surrogate.GpCensoring;
import dev.terrace.core.surrogate.GpForward;
import dev.terrace.core.surrogate.GpLeaveOneOut;
import dev.terrace.core.surrogate.GpSettings;
import dev.terrace.core.surrogate.Predictive;
import dev.terrace.core.surrogate.SuccessModel;
import dev.terrace.core.surrogate.TrainingSubset;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.Prediction;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Everything Terrace has learned about one campaign, ready to predict new recipes: the growth
 * models with their fitted parameters (the physics prior), one Gaussian process per numeric
 * outcome on the residual the physics misses, a classifier per class outcome that starts from the
 * models' class probabilities, and a success-probability model fitted to ok and failed runs.
 *
 * <p>Prior mean: where a campaign model validly predicts an outcome for a run, the GP models
 * {@code y - prediction}; at runs where no model gives a valid prediction the prior is the mean of
 * the measured values (a constant), both when training and when predicting.
 *
 * <p>Censored runs ({@code <X}, {@code >X}) enter each GP by expectation propagation on the bound
 * ({@link GpCensoring}), after its hyperparameters are fitted on the measured values.
 *
 * <p>No-skill rule: when the closed-form leave-one-out predictions of an outcome's GP explain none
 * of the spread of its measured values (predictive Q&sup2; &le; 0 with at least
 * {@link GpLeaveOneOut#MIN_RUNS} of them, {@link GpLeaveOneOut#hasSkill}), the noise sd of a new
 * measurement of that outcome is raised to {@link GpLeaveOneOut#noSkillSpread} (the larger of the
 * leave-one-out RMSE and the sd of the measured values), so its window probabilities, the yield and
 * the printed intervals are no sharper than what the runs themselves scatter by; a note says so.
 *
 * @since 0.1
 */
public final class CampaignSurrogate {

    /** Spread assumed for a log10 outcome nobody has measured yet (0.5 dex: a factor of 3). */
    public static final double UNMEASURED_LOG_SD = 0.5;
    /** Relative spread assumed for a linear outcome nobody has measured yet. */
    public static final double UNMEASURED_RELATIVE_SD = 0.5;

    /** Predictions for a batch of points, on each outcome's fitting scale (log10 for log outcomes). */
    public record Evaluation(List<DesignPoint> points, Map<String, double[]> mean, Map<String, double[]> sdLatent,
                             Map<String, Double> noiseSd, Map<String, double[][]> classProbs, double[] success,
                             List<List<String>> validity) {
    }

    private final LoadedCampaign lc;
    private final DesignSpace space;
    private final ModelChain chain;
    private final FitReport fit;
    private final Map<String, GaussianProcess> gps;
    private final Map<String, GpLeaveOneOut> skill;
    /** Per outcome, the factor on the latent sd from the one-step-ahead errors ({@link GpForward#latentFactor}). */
    private final Map<String, Double> latentFactors;
    private final Map<String, Double> priorFill;
    private final Map<String, Boolean> physicsPrior;
    private final Map<String, ClassModel> classModels;
    private final SuccessModel success;
    private final List<DesignPoint> runPoints;
    private final List<Run> encodedRuns;
    private final List<String> notes;
    private final int runsUsed;
    private final Map<String, TrainingSubset> subsets;
    /** Uncertainty of the fitted physics from its parameters' intervals (delta method). */
    private final PhysicsBand band;
    /** Per outcome, the physics' derivatives at the GP's training rows (see {@link PhysicsBand}). */
    private final Map<String, double[][]> basisTrain;

    private CampaignSurrogate(LoadedCampaign lc, DesignSpace space, ModelChain chain, FitReport fit,
                              Map<String, GaussianProcess> gps, Map<String, GpLeaveOneOut> skill,
                              Map<String, Double> latentFactors,
                              Map<String, Double> priorFill,
                              Map<String, Boolean> physicsPrior, Map<String, ClassModel> classModels,
                              SuccessModel success, List<DesignPoint> runPoints, List<Run> encodedRuns,
                              List<String> notes, int runsUsed, Map<String, TrainingSubset> subsets,
                              PhysicsBand band, Map<String, double[][]> basisTrain) {
        this.lc = lc;
        this.space = space;
        this.chain = chain;
        this.fit = fit;
        this.gps = gps;
        this.skill = skill;
        this.latentFactors = latentFactors;
        this.priorFill = priorFill;
        this.physicsPrior = physicsPrior;
        this.classModels = classModels;
        this.success = success;
        this.runPoints = runPoints;
        this.encodedRuns = encodedRuns;
        this.notes = notes;
        this.runsUsed = runsUsed;
        this.subsets = Map.copyOf(subsets);
        this.band = band;
        this.basisTrain = basisTrain;
    }

    /**
     * Fits everything.
     *
     * @param lc         the campaign and its runs
     * @param registry   the plugins
     * @param usePhysics false to switch the growth models off (a pure GP, for ablations)
     * @param seed       seed of every random choice
     * @return the surrogate; never null
     */
    public static CampaignSurrogate build(LoadedCampaign lc, PluginRegistry registry, boolean usePhysics, long seed) {
        return build(lc, registry, usePhysics, seed, DEFAULT_GP, MIN_NOISE_FRACTION);
    }

    /**
     * Smallest measurement-noise sd of a numeric outcome as a fraction of the spread (sd) of its
     * measured values: 0.2. Growth outcomes repeat only to 5-15 % (common practice for AFM densities
     * and sizes), and a physics prior leaves residuals so small that a GP would otherwise claim
     * precision no run delivers; 0.2 was chosen by leave-one-out on the demo campaign (90 % intervals
     * covered 8 of 13 held-out densities at 0.1 and 11 of 13 at 0.2; `terrace validate`).
     */
    public static final double MIN_NOISE_FRACTION = 0.2;

    /**
     * Most runs the growth models are fitted on when proposing (a seeded random subset above this;
     * {@code terrace fit} always uses every run). The models have a handful of parameters, which a few
     * dozen runs already pin down; the GP then learns the residual from every run.
     */
    public static final int PHYSICS_FIT_RUNS = 40;
    /** Above this many runs the GP hyperparameter search uses {@link #LARGE_LOG_HPO_STARTS} starts. */
    public static final int LARGE_LOG_RUNS = 150;
    /** Hyperparameter starts for large run logs (the likelihood surface is well determined there). */
    public static final int LARGE_LOG_HPO_STARTS = 3;

    /** A copy of the campaign with at most {@code max} runs, chosen at random with a fixed seed, in log order. */
    static LoadedCampaign subsample(LoadedCampaign lc, int max, long seed) {
        List<Run> runs = lc.runLog().runs();
        if (runs.size() <= max) {
            return lc;
        }
        List<Integer> idx = new ArrayList<>();
        for (int i = 0; i < runs.size(); i++) {
            idx.add(i);
        }
        java.util.Collections.shuffle(idx, new java.util.Random(seed));
        List<Integer> keep = new ArrayList<>(idx.subList(0, max));
        java.util.Collections.sort(keep);
        List<Run> sub = new ArrayList<>();
        keep.forEach(i -> sub.add(runs.get(i)));
        return new LoadedCampaign(lc.campaign(),
                new dev.terrace.core.runlog.RunLog(lc.runLog().file(), sub, lc.runLog().warnings()), lc.warnings());
    }

    /**
     * GP settings for measured growth outcomes: the library defaults with a noise floor of 1e-2 of the
     * standardised variance (a noise sd of at least 10 % of the residual spread). Repeat runs of one
     * recipe never agree better than that in practice (common practice: AFM densities and sizes
     * repeat to 5-15 %), and without it the noise estimate collapses when a training set holds no
     * repeated recipe, giving far too narrow intervals.
     */
    public static final GpSettings DEFAULT_GP = GpSettings.defaults().withNoiseFloor(1e-2);

    /**
     * Fits everything with explicit GP settings (benchmarks use fewer hyperparameter starts).
     *
     * @param lc         the campaign and its runs
     * @param registry   the plugins
     * @param usePhysics false to switch the growth models off
     * @param seed       seed of every random choice
     * @param gpSettings settings of the Gaussian processes
     * @return the surrogate; never null
     */
    public static CampaignSurrogate build(LoadedCampaign lc, PluginRegistry registry, boolean usePhysics, long seed,
                                          GpSettings gpSettings) {
        return build(lc, registry, usePhysics, seed, gpSettings, 0);
    }

    /**
     * Fits everything with explicit GP settings and a noise floor tied to the outcomes' spread.
     *
     * @param lc               the campaign and its runs
     * @param registry         the plugins
     * @param usePhysics       false to switch the growth models off
     * @param seed             seed of every random choice
     * @param gpSettings       settings of the Gaussian processes
     * @param minNoiseFraction smallest noise sd as a fraction of each outcome's measured spread (0 for
     *                         noise-free objectives such as test functions)
     * @return the surrogate; never null
     */
    public static CampaignSurrogate build(LoadedCampaign lc, PluginRegistry registry, boolean usePhysics, long seed,
                                          GpSettings gpSettings, double minNoiseFraction) {
        Campaign c = lc.campaign();
        DesignSpace space = DesignSpace.of(c);
        List<String> notes = new ArrayList<>();
        FitReport fit = null;
        ModelChain chain = ModelChain.of(List.of(), c.surface());
        if (usePhysics && !c.models().isEmpty()) {
            notes.addAll(lc.runLog().runs().size() > PHYSICS_FIT_RUNS
                    ? List.of("growth models fitted on " + PHYSICS_FIT_RUNS + " of the " + lc.runLog().runs().size()
                    + " runs (a fixed random subset)") : List.of());
            // earlier series of the campaign's priors enter the proposals' fit as they enter 'terrace fit'
            List<dev.terrace.core.fit.ParameterPrior> priors = List.of();
            try {
                priors = dev.terrace.core.fit.SeriesPriors.load(c, registry, seed).priors();
            } catch (dev.terrace.core.InputException | java.io.IOException e) {
                notes.add("the earlier series named under priors: were not used: " + e.getMessage());
            }
            LoadedCampaign physicsRuns = subsample(lc, PHYSICS_FIT_RUNS, seed);
            if (c.temperatureCalibration().fitOffset()) {
                // the thermocouple offset fitted as 'terrace fit' fits it, then used for every prediction
                dev.terrace.core.fit.OffsetResult off = dev.terrace.core.fit.CampaignFit.offset(physicsRuns, registry,
                        seed, priors);
                lc = dev.terrace.core.fit.CampaignFit.withOffset(lc, off.value());
                c = lc.campaign();
                physicsRuns = dev.terrace.core.fit.CampaignFit.withOffset(physicsRuns, off.value());
                notes.add(String.format(java.util.Locale.ROOT, "thermocouple offset fitted: %+.1f K (95 %% %+.1f to %+.1f K),"
                        + " applied to every substrate temperature", off.value(), off.lo(), off.hi()));
            }
            fit = ModelFitter.fit(physicsRuns, registry, seed, false, priors);
            chain = ModelFitter.chain(c, registry, fit);
            for (var f : fit.models()) {
                if (!f.message().isEmpty()) {
                    notes.add(f.id() + ": " + f.message());
                }
            }
        }
        List<DesignPoint> pts = new ArrayList<>();
        List<Run> runs = new ArrayList<>();
        for (Run r : lc.runLog().runs()) {
            DesignPoint p = space.encode(r.numbers(), r.categories());
            if (p == null) {
                notes.add("run " + r.runId() + " does not record every setting; the surrogates cannot use it");
                continue;
            }
            pts.add(p);
            runs.add(r);
        }
        // physics predictions at the runs' recipes (as for a new recipe: no measured outcomes fed in)
        List<ModelChain.Result> chainAtRuns = new ArrayList<>();
        for (Run r : runs) {
            chainAtRuns.add(chain.predict(RecipeConverter.conditions(c, r, false)));
        }
        Map<String, GaussianProcess> gps = new LinkedHashMap<>();
        Map<String, GpLeaveOneOut> skill = new LinkedHashMap<>();
        Map<String, Double> latent = new LinkedHashMap<>();
        PhysicsBand band = PhysicsBand.of(chain, fit);
        Map<String, double[][]> basis = new LinkedHashMap<>();
        Map<String, java.util.concurrent.Callable<OutcomeGp>> gpTasks = new LinkedHashMap<>();
        Map<String, java.util.concurrent.Callable<ClassModel>> classTasks = new LinkedHashMap<>();
        Map<String, Double> fill = new LinkedHashMap<>();
        Map<String, Boolean> physics = new LinkedHashMap<>();
        Map<String, TrainingSubset> subsets = new LinkedHashMap<>();
        int used = 0;
        boolean[] usedRun = new boolean[runs.size()];
        for (OutcomeSpec o : c.outcomes()) {
            if (o.isClass()) {
                continue;
            }
            List<DesignPoint> x = new ArrayList<>();
            List<Double> y = new ArrayList<>();
            List<Double> prior = new ArrayList<>();
            List<Run> xRuns = new ArrayList<>();
            for (int i = 0; i < runs.size(); i++) {
                Run r = runs.get(i);
                if (!r.ok()) {
                    continue;
                }
                var v = r.number(o.name());
                if (v.isEmpty() || (o.scale() == Scale.LOG && v.getAsDouble() <= 0)) {
                    continue;
                }
                x.add(pts.get(i));
                xRuns.add(r);
                y.add(scaled(o, v.getAsDouble()));
                prior.add(PhysicsPriors.priorValue(c, o, chainAtRuns.get(i)));
                usedRun[i] = true;
            }
            List<Integer> censoredRuns = new ArrayList<>();
            for (int i = 0; i < runs.size(); i++) {
                Run r = runs.get(i);
                var cc = r.censored(o.name());
                if (!r.ok() || cc.isEmpty()) {
                    continue;
                }
                if (o.scale() == Scale.LOG && !(cc.get().bound() > 0)) {
                    notes.add(o.name() + " of run " + r.runId() + " is " + cc.get()
                            + ", a bound at or below 0 on a log outcome; the surrogate cannot use it");
                    continue;
                }
                censoredRuns.add(i);
            }
            if (x.isEmpty()) {
                if (!censoredRuns.isEmpty()) {
                    notes.add(o.name() + ": only censored values (<X or >X) so far; the surrogate learns from them"
                            + " once at least one value is measured");
                }
                continue;
            }
            censoredRuns.forEach(i -> usedRun[i] = true);
            double mean = y.stream().mapToDouble(Double::doubleValue).average().orElse(0);
            boolean anyPhysics = prior.stream().anyMatch(Double::isFinite);
            fill.put(o.name(), mean);
            physics.put(o.name(), anyPhysics);
            double[] yy = y.stream().mapToDouble(Double::doubleValue).toArray();
            double[] pp = null;
            if (anyPhysics) {
                pp = prior.stream().mapToDouble(v -> Double.isFinite(v) ? v : mean).toArray();
            }
            // long logs: the GP trains on a stated subset of the runs (TrainingSubset)
            TrainingSubset sub = TrainingSubset.select(x, TrainingSubset.focusOnTargets(c.targets(), xRuns),
                    TrainingSubset.maxRuns(), seed);
            List<DesignPoint> xs = sub.pick(x);
            yy = sub.pick(yy);
            pp = sub.pick(pp);
            if (sub.isSubset()) {
                subsets.put(o.name(), sub);
                notes.add(sub.note(o.name()));
            }
            GpSettings gs = gpSettings;
            if (yy.length > LARGE_LOG_RUNS && gs.hpoStarts() > LARGE_LOG_HPO_STARTS) {
                gs = gs.withHpoStarts(LARGE_LOG_HPO_STARTS);
            }
            if (minNoiseFraction > 0 && yy.length > 1) {
                double sdRaw = sd(yy);
                double[] res = new double[yy.length];
                for (int i = 0; i < yy.length; i++) {
                    res[i] = yy[i] - (pp != null ? pp[i] : mean);
                }
                double varRes = Math.pow(sd(res), 2);
                if (varRes > 0 && sdRaw > 0) {
                    double floor = Math.pow(minNoiseFraction * sdRaw, 2) / varRes;
                    gs = gs.withNoiseFloor(Math.max(gs.noiseFloor(), Math.min(floor, 0.5)));
                }
            }
            if (ppIsPhysics(pp) && !band.isEmpty()) {
                basis.put(o.name(), band.jacobian(c, o, conditionsAt(c, space, xs), predictAt(c, space, chain, xs)));
            }
            final GpSettings gsf = gs;
            final double[] ppf = pp;
            final double[] yyf = yy;
            List<GpCensoring.Observation> cens = new ArrayList<>();
            for (int i : censoredRuns) {
                Censored cc = runs.get(i).censored(o.name()).orElseThrow();
                double pv = PhysicsPriors.priorValue(c, o, chainAtRuns.get(i));
                cens.add(new GpCensoring.Observation(pts.get(i), scaled(o, cc.bound()),
                        cc.side() == Censored.Side.ABOVE, anyPhysics ? (Double.isFinite(pv) ? pv : mean) : Double.NaN));
            }
            // long logs: the censored bounds are capped the same way (TrainingSubset)
            List<GpCensoring.Observation> censKept = cens;
            if (cens.size() > TrainingSubset.maxRuns()) {
                TrainingSubset cs = TrainingSubset.select(cens.stream().map(GpCensoring.Observation::x).toList(),
                        null, TrainingSubset.maxRuns(), seed);
                censKept = cs.pick(cens);
                notes.add(o.name() + ": the Gaussian process used " + cs.size() + " of the " + cens.size()
                        + " censored values, a " + TrainingSubset.METHOD);
            }
            final List<GpCensoring.Observation> censf = censKept;
            gpTasks.put(o.name(), () -> OutcomeGp.fit(xs, yyf, ppf, gsf, seed, censf));
        }
        Map<String, ClassModel> cms = new LinkedHashMap<>();
        for (OutcomeSpec o : c.outcomes()) {
            if (!o.isClass()) {
                continue;
            }
            List<DesignPoint> x = new ArrayList<>();
            List<String> labels = new ArrayList<>();
            List<double[]> priors = new ArrayList<>();
            for (int i = 0; i < runs.size(); i++) {
                Run r = runs.get(i);
                if (!r.ok() || r.category(o.name()).isEmpty()) {
                    continue;
                }
                x.add(pts.get(i));
                labels.add(r.category(o.name()).get());
                priors.add(PhysicsPriors.classPrior(o, chainAtRuns.get(i)));
                usedRun[i] = true;
            }
            final double[][] pr = priors.toArray(new double[0][]);
            classTasks.put(o.name(), () -> ClassModel.fit(x, labels, o.classes(), pr, seed));
        }
        for (boolean b : usedRun) {
            if (b) {
                used++;
            }
        }
        boolean[] ok = new boolean[runs.size()];
        for (int i = 0; i < ok.length; i++) {
            ok[i] = runs.get(i).ok();
        }
        // the GPs, classifiers and the success model are independent: fit them on BUILD_THREADS threads
        java.util.concurrent.ExecutorService pool = java.util.concurrent.Executors.newFixedThreadPool(BUILD_THREADS);
        SuccessModel sm;
        try {
            Map<String, java.util.concurrent.Future<OutcomeGp>> gf = new LinkedHashMap<>();
            gpTasks.forEach((k, t) -> gf.put(k, pool.submit(t)));
            Map<String, java.util.concurrent.Future<ClassModel>> cf = new LinkedHashMap<>();
            classTasks.forEach((k, t) -> cf.put(k, pool.submit(t)));
            java.util.concurrent.Future<SuccessModel> sf = pool.submit(() -> SuccessModel.fit(pts, ok, seed));
            for (Map.Entry<String, java.util.concurrent.Future<OutcomeGp>> e : gf.entrySet()) {
                OutcomeGp fo = join(e.getValue());
                gps.put(e.getKey(), fo.gp());
                skill.put(e.getKey(), fo.loo());
                latent.put(e.getKey(), fo.forward().latentFactor(fo.loo().sdFactor()));
                notes.addAll(fo.notes(e.getKey()));
            }
            for (Map.Entry<String, java.util.concurrent.Future<ClassModel>> e : cf.entrySet()) {
                cms.put(e.getKey(), join(e.getValue()));
            }
            sm = join(sf);
        } finally {
            pool.shutdownNow();
        }
        return new CampaignSurrogate(lc, space, chain, fit, gps, skill, latent, fill, physics, cms, sm, pts, runs, notes, used,
                subsets, band, basis);
    }

    /** @return true when a prior-mean array holds the physics (not null) */
    private static boolean ppIsPhysics(double[] pp) {
        return pp != null;
    }

    private static List<Conditions> conditionsAt(Campaign c, DesignSpace space, List<DesignPoint> pts) {
        List<Conditions> out = new ArrayList<>(pts.size());
        for (DesignPoint p : pts) {
            out.add(RecipeConverter.conditions(c, space.numbers(p), space.categories(p)));
        }
        return out;
    }

    private static List<ModelChain.Result> predictAt(Campaign c, DesignSpace space, ModelChain chain,
                                                     List<DesignPoint> pts) {
        List<ModelChain.Result> out = new ArrayList<>(pts.size());
        for (Conditions k : conditionsAt(c, space, pts)) {
            out.add(chain.predict(k));
        }
        return out;
    }

    /** Threads used to fit the independent surrogates (the machines Terrace targets have 2 cores). */
    public static final int BUILD_THREADS = 2;

    static <T> T join(java.util.concurrent.Future<T> f) {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted", e);
        } catch (java.util.concurrent.ExecutionException e) {
            Throwable c = e.getCause();
            throw c instanceof RuntimeException ? (RuntimeException) c : new IllegalStateException(c);
        }
    }

    static double sd(double[] v) {
        double m = 0;
        for (double x : v) {
            m += x / v.length;
        }
        double s = 0;
        for (double x : v) {
            s += (x - m) * (x - m);
        }
        return Math.sqrt(s / Math.max(v.length - 1, 1));
    }

    static double scaled(OutcomeSpec o, double v) {
        return o.scale() == Scale.LOG ? Math.log10(v) : v;
    }

    /**
     * Predicts a batch of points.
     *
     * @param pts the points
     * @return predictions; never null
     */
    public Evaluation evaluate(List<DesignPoint> pts) {
        Campaign c = lc.campaign();
        List<ModelChain.Result> phys = new ArrayList<>(pts.size());
        List<Conditions> conds = new ArrayList<>(pts.size());
        List<List<String>> validity = new ArrayList<>(pts.size());
        for (DesignPoint p : pts) {
            Conditions cond = RecipeConverter.conditions(c, space.numbers(p), space.categories(p));
            ModelChain.Result r = chain.predict(cond);
            phys.add(r);
            conds.add(cond);
            List<String> v = new ArrayList<>();
            for (Map.Entry<String, Prediction> e : r.byModel().entrySet()) {
                if (!e.getValue().validity().valid()) {
                    v.add(e.getKey() + ": " + e.getValue().validity().reason());
                }
            }
            validity.add(v);
        }
        Map<String, double[]> mean = new LinkedHashMap<>();
        Map<String, double[]> sdl = new LinkedHashMap<>();
        Map<String, Double> noise = new LinkedHashMap<>();

        for (OutcomeSpec o : c.outcomes()) {
            if (o.isClass()) {
                continue;
            }
            GaussianProcess gp = gps.get(o.name());
            double[] prior = new double[pts.size()];
            for (int i = 0; i < prior.length; i++) {
                prior[i] = PhysicsPriors.priorValue(c, o, phys.get(i));
            }
            if (gp == null) {
                // never measured: physics (if any) with a broad spread
                double[] m = new double[pts.size()];
                double[] s = new double[pts.size()];
                for (int i = 0; i < m.length; i++) {
                    m[i] = Double.isFinite(prior[i]) ? prior[i] : 0;
                    s[i] = o.scale() == Scale.LOG ? UNMEASURED_LOG_SD
                            : Math.max(UNMEASURED_RELATIVE_SD * Math.abs(m[i]), 1e-12);
                    if (!Double.isFinite(prior[i])) {
                        s[i] = 1e6; // nothing known at all
                    }
                }
                mean.put(o.name(), m);
                sdl.put(o.name(), s);
                noise.put(o.name(), 0.0);
                continue;
            }
            double f = priorFill.get(o.name());
            for (int i = 0; i < prior.length; i++) {
                if (!Double.isFinite(prior[i])) {
                    prior[i] = f;
                }
            }
            double[][] ht = basisTrain.get(o.name());
            GaussianProcess.Basis basis = ht == null || !physicsPrior.get(o.name()) ? null
                    : new GaussianProcess.Basis(ht, band.jacobian(c, o, conds, phys), band.sigma());
            Predictive pr = gp.predict(pts, physicsPrior.get(o.name()) ? prior : null, basis);
            mean.put(o.name(), pr.mean());
            GpLeaveOneOut loo = skill.get(o.name());
            // leave-one-out calibration of the spread (GpLeaveOneOut#sdFactor), then the no-skill floor
            // the spread's scale estimated from n runs: Student-t tails (StudentSpread)
            double tf = StudentSpread.factor(loo.runs());
            double k = loo.sdFactor() * tf;
            // and the one-step-ahead errors' factor on the model's part of the spread (GpForward)
            double kl = latentFactors.get(o.name()) * tf;
            double[] sl = pr.sdLatent().clone();
            for (int i = 0; i < sl.length; i++) {
                sl[i] *= kl;
            }
            sdl.put(o.name(), sl);
            double ns = k * pr.noiseSd();
            noise.put(o.name(), loo.hasSkill() ? ns : Math.max(ns, loo.noSkillSpread()));
        }
        Map<String, double[][]> cls = new LinkedHashMap<>();
        for (OutcomeSpec o : c.outcomes()) {
            if (!o.isClass()) {
                continue;
            }
            double[][] priors = new double[pts.size()][];
            for (int i = 0; i < pts.size(); i++) {
                priors[i] = PhysicsPriors.classPrior(o, phys.get(i));
            }
            cls.put(o.name(), classModels.get(o.name()).predict(pts, priors));
        }
        double[] s = success.predict(pts);
        return new Evaluation(pts, mean, sdl, noise, cls, s, validity);
    }

    /**
     * A copy whose GPs also hold fantasy observations at their predicted means (Kriging believer,
     * Ginsbourger, Le Riche and Carraro 2010): the next batch member then sees less uncertainty
     * here. Class and success models are unchanged.
     *
     * @param p a chosen point
     * @return the conditioned surrogate; never null
     */
    public CampaignSurrogate believe(DesignPoint p) {
        Evaluation e = evaluate(List.of(p));
        Map<String, GaussianProcess> next = new LinkedHashMap<>();
        Campaign c = lc.campaign();
        ModelChain.Result phys = chain.predict(RecipeConverter.conditions(c, space.numbers(p), space.categories(p)));
        for (Map.Entry<String, GaussianProcess> g : gps.entrySet()) {
            OutcomeSpec o = c.outcome(g.getKey()).orElseThrow();
            double prior = PhysicsPriors.priorValue(c, o, phys);
            if (!Double.isFinite(prior)) {
                prior = priorFill.get(o.name());
            }
            next.put(g.getKey(), g.getValue().condition(p, e.mean().get(g.getKey())[0],
                    physicsPrior.get(o.name()) ? prior : Double.NaN));
        }
        return new CampaignSurrogate(lc, space, chain, fit, next, skill, latentFactors, priorFill, physicsPrior, classModels, success,
                runPoints, encodedRuns, notes, runsUsed, subsets, band, basisTrain);
    }

    /** @return the campaign; never null */
    public Campaign campaign() {
        return lc.campaign();
    }

    /** @return the loaded campaign; never null */
    public LoadedCampaign loaded() {
        return lc;
    }

    /** @return the design space; never null */
    public DesignSpace space() {
        return space;
    }

    /** @return the model chain with fitted values (empty when the physics is off); never null */
    public ModelChain chain() {
        return chain;
    }

    /** @return the growth-model fit, or null when the physics is off or there are no models */
    public FitReport fit() {
        return fit;
    }

    /** @return the encoded recipes of the usable runs, in log order; never null */
    public List<DesignPoint> runPoints() {
        return List.copyOf(runPoints);
    }

    /** @return the runs matching {@link #runPoints()}; never null */
    public List<Run> runs() {
        return List.copyOf(encodedRuns);
    }

    /** @return the ok runs with at least one measured outcome that the surrogates used */
    public int runsUsed() {
        return runsUsed;
    }

    /**
     * @return the numeric outcomes whose GP trained on a subset of the runs ({@link TrainingSubset}),
     *         by name; empty when every GP used every run; never null
     */
    public Map<String, TrainingSubset> trainingSubsets() {
        return subsets;
    }

    /** @return remarks about data that could not be used; never null */
    public List<String> notes() {
        return List.copyOf(notes);
    }

    /**
     * @param outcome a numeric outcome name
     * @return true when a GP was fitted for it
     */
    public boolean hasGp(String outcome) {
        return gps.containsKey(outcome);
    }

    /**
     * @param outcome a numeric outcome name
     * @return the leave-one-out summary of its GP over the measured runs, or empty without a GP
     */
    public java.util.Optional<GpLeaveOneOut> leaveOneOut(String outcome) {
        return java.util.Optional.ofNullable(skill.get(outcome));
    }
}
