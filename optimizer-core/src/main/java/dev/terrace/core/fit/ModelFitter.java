package dev.terrace.core.fit;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.fit.FitResults.Candidate;
import dev.terrace.core.fit.FitResults.Estimate;
import dev.terrace.core.fit.FitResults.Excluded;
import dev.terrace.core.fit.FitResults.FitReport;
import dev.terrace.core.fit.FitResults.ModelFit;
import dev.terrace.core.fit.FitResults.OutcomeFit;
import dev.terrace.core.fit.FitResults.Residual;
import dev.terrace.core.model.ModelChain;
import dev.terrace.core.model.RecipeConverter;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.runlog.Run;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import org.apache.commons.math3.distribution.TDistribution;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.fitting.leastsquares.MultivariateJacobianFunction;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.linear.SingularValueDecomposition;
import org.apache.commons.math3.optim.InitialGuess;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.PointValuePair;
import org.apache.commons.math3.optim.SimpleBounds;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.nonlinear.scalar.ObjectiveFunction;
import org.apache.commons.math3.optim.nonlinear.scalar.noderiv.BOBYQAOptimizer;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;
import org.apache.commons.math3.util.Pair;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.SplittableRandom;

/**
 * Fits a campaign's growth models to its ok runs, one model after another in chain order.
 *
 * <p><b>Objective.</b> Numeric outcomes: weighted nonlinear least squares on the outcome's scale
 * (log10 for {@code scale: log}), one noise level per outcome estimated from the residuals
 * (iteratively reweighted), solved by Levenberg-Marquardt (Commons Math). When the model also
 * predicts class outcomes the objective is the joint negative log-likelihood (Gaussian for numeric
 * outcomes, categorical for classes), minimised by BOBYQA (Powell 2009) or Brent for one parameter.
 * Parameters flagged {@code logScale} are fitted on log10.
 *
 * <p><b>What is fitted.</b> Continuous parameters are freed one at a time in the model's declared
 * order. A parameter stays at its default, with the reason reported, when the runs do not depend on
 * it, when it cannot be separated from an already freed parameter (the scaled Jacobian's condition
 * number would exceed {@link #MAX_CONDITION}), or when freeing it would leave fewer than
 * {@link #MIN_RESIDUAL_DOF} degrees of freedom. Discrete parameters are chosen by AICc (Hurvich and
 * Tsai, Biometrika 76, 297 (1989)) among all combinations.
 *
 * <p><b>Uncertainty.</b> 95 % intervals from the inverse of the (Gauss-Newton or numerical) Hessian
 * with Student-t quantiles, computed on the fitted scale and mapped back. When the residual degrees
 * of freedom are fewer than {@link #MIN_DOF_FOR_COVARIANCE} or the Hessian is not positive definite, a
 * residual (parametric for classes) bootstrap with {@link #BOOTSTRAP_REPLICATES} refits gives
 * percentile intervals instead (Efron and Tibshirani, An Introduction to the Bootstrap, 1993).
 *
 * @since 0.1
 */
public final class ModelFitter {

    /** Fewest runs with a measured outcome before any parameter is fitted. */
    public static final int MIN_RUNS = 3;
    /** Degrees of freedom that must remain after freeing parameters. */
    public static final int MIN_RESIDUAL_DOF = 1;
    /** Below this many residual degrees of freedom, intervals come from the bootstrap. */
    public static final int MIN_DOF_FOR_COVARIANCE = 6;
    /**
     * Largest 1/sin(angle) between a parameter's normalised Jacobian column and the span of the
     * parameters freed before it (the square root of its variance inflation factor): 30 frees a
     * parameter up to a multiple correlation of about 0.9994 with the others (common practice:
     * beyond that it carries no information of its own).
     */
    public static final double MAX_CONDITION = 30;
    /** A parameter whose scaled Jacobian column is smaller than this (relative) has no effect on these runs. */
    public static final double MIN_SENSITIVITY = 1e-6;
    /** Bootstrap replicates for small samples (numeric outcomes only). */
    public static final int BOOTSTRAP_REPLICATES = 200;
    /** Bootstrap replicates when class outcomes make each refit a direct search (slower). */
    public static final int BOOTSTRAP_REPLICATES_CLASSES = 60;
    /**
     * Observations required per fitted parameter, a common rule of thumb for nonlinear regression
     * (common practice); a class observation counts as {@link #CLASS_OBSERVATION_WEIGHT} of one.
     */
    public static final double OBSERVATIONS_PER_PARAMETER = 3;
    /** How much one class label counts towards {@link #OBSERVATIONS_PER_PARAMETER} (it carries less information). */
    public static final double CLASS_OBSERVATION_WEIGHT = 0.5;
    /** Floor on class probabilities before taking logs. */
    public static final double PROBABILITY_FLOOR = 1e-6;
    /** Noise floor of log10 outcomes (dex): no measurement repeats better than about 2 %. */
    public static final double LOG_NOISE_FLOOR = 0.01;
    /** Noise floor of linear outcomes, relative to their mean magnitude. */
    public static final double LINEAR_NOISE_FLOOR = 0.01;
    /** Starting noise of log10 outcomes (dex) before reweighting, about 25 % (common practice for AFM densities). */
    public static final double LOG_NOISE_START = 0.1;
    /** Starting relative noise of linear outcomes before reweighting (common practice for AFM sizes). */
    public static final double LINEAR_NOISE_START = 0.1;
    /** Threads fitting the discrete candidates of one model (the machines Terrace targets have 2 cores). */
    public static final int CANDIDATE_THREADS = 2;
    /** Evaluation budget of the direct search when no intervals are wanted (proposals, cross-validation). */
    public static final int FAST_MAX_EVALUATIONS = 1200;
    /** Most reweighting passes (noise levels re-estimated from residuals, then refit); stops early when settled. */
    public static final int REWEIGHT_ITERATIONS = 4;
    /** Residual assigned to an observation when a trial parameter set makes the prediction invalid. */
    private static final double INVALID_PENALTY = 30;

    private ModelFitter() {
    }

    /**
     * Fits every model of a campaign.
     *
     * @param lc       the campaign and its runs
     * @param registry where the campaign's models come from
     * @param seed     seed for multi-starts and the bootstrap
     * @return the report; never null
     */
    public static FitReport fit(LoadedCampaign lc, PluginRegistry registry, long seed) {
        return fit(lc, registry, seed, true);
    }

    /**
     * Fits every model of a campaign, optionally without intervals (for proposals, which need the
     * point estimates only: the bootstrap is skipped and intervals come from the covariance alone).
     *
     * @param lc        the campaign and its runs
     * @param registry  where the campaign's models come from
     * @param seed      seed for multi-starts and the bootstrap
     * @param intervals false to skip the bootstrap
     * @return the report; never null
     */
    public static FitReport fit(LoadedCampaign lc, PluginRegistry registry, long seed, boolean intervals) {
        Campaign c = lc.campaign();
        List<ModelChain.Step> fitted = new ArrayList<>();
        List<ModelFit> fits = new ArrayList<>();
        SplittableRandom rng = new SplittableRandom(seed);
        for (String id : c.models()) {
            Optional<GrowthModel> m = registry.model(id);
            if (m.isEmpty()) {
                fits.add(emptyFit(id, ParameterValues.defaults(List.of()), List.of(),
                        "growth model '" + id + "' is not available"));
                continue;
            }
            ModelFit f;
            try {
                Problem pr = new Problem(c, lc.runLog().runs(), m.get(), ModelChain.of(fitted, c.surface()), rng.split());
                pr.intervals = intervals;
                pr.maxEvaluations = intervals ? 3000 : FAST_MAX_EVALUATIONS;
                f = pr.solve();
            } catch (RuntimeException e) {
                f = emptyFit(id, ParameterValues.defaults(m.get().parameters()), defaultsHeld(m.get(), "fit failed"),
                        "the fit of " + id + " failed: " + e.getClass().getSimpleName()
                                + (e.getMessage() == null ? "" : ": " + e.getMessage()));
            }
            fits.add(f);
            fitted.add(new ModelChain.Step(m.get(), f.values()));
        }
        return new FitReport(c.id(), lc.runLog().runs().size(), lc.runLog().failedRuns().size(), fits, seed);
    }

    /**
     * The chain of a campaign's models with fitted values.
     *
     * @param c        the campaign
     * @param registry the plugins
     * @param report   a fit report, or null for defaults
     * @return the chain; never null
     */
    public static ModelChain chain(Campaign c, PluginRegistry registry, FitReport report) {
        List<ModelChain.Step> steps = new ArrayList<>();
        Map<String, ParameterValues> values = report == null ? Map.of() : report.values();
        for (String id : c.models()) {
            registry.model(id).ifPresent(m -> steps.add(new ModelChain.Step(m,
                    values.getOrDefault(id, ParameterValues.defaults(m.parameters())))));
        }
        return ModelChain.of(steps, c.surface());
    }

    static ModelFit emptyFit(String id, ParameterValues values, List<Estimate> estimates, String message) {
        return new ModelFit(id, 0, List.of(), estimates, Map.of(), List.of(), List.of(), List.of(), List.of(),
                new double[0][], values, List.of(message), message);
    }

    static List<Estimate> defaultsHeld(GrowthModel m, String reason) {
        List<Estimate> out = new ArrayList<>();
        for (ModelParameter p : m.parameters()) {
            out.add(new Estimate(p.name(), p.unit(), p.defaultValue(), Double.NaN, Double.NaN, true, reason, p.source()));
        }
        return out;
    }

    // ------------------------------------------------------------------ one model

    /** One observation: a run's measured outcome, on the fitted scale. */
    private record Obs(int run, OutcomeSpec outcome, double y, String cls) {
        boolean isClass() {
            return cls != null;
        }
    }

    private static final class Problem {
        final Campaign c;
        final GrowthModel model;
        final ModelChain upstream;
        final SplittableRandom rng;
        final List<Run> allRuns;
        final List<ModelParameter> params;
        final List<ModelParameter> continuous = new ArrayList<>();
        final List<ModelParameter> discrete = new ArrayList<>();
        final List<OutcomeSpec> outs = new ArrayList<>();
        final List<Run> used = new ArrayList<>();
        final List<Conditions> conds = new ArrayList<>();
        final List<Obs> obs = new ArrayList<>();
        final List<Excluded> excluded = new ArrayList<>();
        final List<String> numericOutcomes = new ArrayList<>();
        boolean hasClass;
        int maxEvaluations = 3000;
        boolean intervals = true;

        Problem(Campaign c, List<Run> runs, GrowthModel model, ModelChain upstream, SplittableRandom rng) {
            this.c = c;
            this.model = model;
            this.upstream = upstream;
            this.rng = rng;
            this.allRuns = runs;
            this.params = model.parameters();
            for (ModelParameter p : params) {
                (p.isDiscrete() ? discrete : continuous).add(p);
            }
            for (OutcomeSpec o : c.outcomes()) {
                if (o.role() != null && model.predictedOutcomes().contains(o.role())) {
                    outs.add(o);
                }
            }
        }

        ModelFit solve() {
            ParameterValues defaults = ParameterValues.defaults(params);
            if (outs.isEmpty()) {
                return emptyFit(model.id(), defaults, defaultsHeld(model, "the campaign measures nothing this model predicts"),
                        "the campaign has no outcome with a role this model predicts ("
                                + String.join(", ", model.predictedOutcomes().stream().map(Role::key).sorted().toList())
                                + ")");
            }
            collect(defaults);
            int nRuns = used.size();
            if (nRuns < MIN_RUNS) {
                String why = nRuns == 0 ? "no usable run" : "only " + nRuns + " usable run" + (nRuns == 1 ? "" : "s");
                String msg = why + " for " + model.id() + " (needs at least " + MIN_RUNS
                        + " ok runs that measured " + String.join(" or ", outs.stream().map(OutcomeSpec::name).toList())
                        + "); every parameter is held at its default";
                List<Estimate> held = defaultsHeld(model, "too few runs (" + nRuns + ")");
                return new ModelFit(model.id(), nRuns, excluded, held, Map.of(), List.of(), List.of(), List.of(),
                        List.of(), new double[0][], defaults, List.of(msg), msg);
            }
            // every combination of discrete choices
            List<Map<String, Double>> combos = combos();
            List<CandidateFit> cands = new ArrayList<>();
            // candidates are independent: fit them on up to CANDIDATE_THREADS threads, each with its own
            // random stream split off in a fixed order, so the result does not depend on scheduling
            List<SplittableRandom> streams = new ArrayList<>();
            for (int k = 0; k < combos.size(); k++) {
                streams.add(rng.split());
            }
            if (combos.size() == 1) {
                cands.add(fitCandidate(combos.get(0), streams.get(0)));
            } else {
                java.util.concurrent.ExecutorService pool = java.util.concurrent.Executors.newFixedThreadPool(
                        Math.min(CANDIDATE_THREADS, combos.size()));
                try {
                    List<java.util.concurrent.Future<CandidateFit>> fs = new ArrayList<>();
                    for (int k = 0; k < combos.size(); k++) {
                        final int kk = k;
                        fs.add(pool.submit(() -> fitCandidate(combos.get(kk), streams.get(kk))));
                    }
                    for (java.util.concurrent.Future<CandidateFit> f : fs) {
                        try {
                            cands.add(f.get());
                        } catch (InterruptedException e) {
                            Thread.currentThread().interrupt();
                            throw new IllegalStateException("fit interrupted", e);
                        } catch (java.util.concurrent.ExecutionException e) {
                            Throwable cause = e.getCause();
                            throw cause instanceof RuntimeException ? (RuntimeException) cause
                                    : new IllegalStateException(cause);
                        }
                    }
                } finally {
                    pool.shutdownNow();
                }
            }
            CandidateFit best = null;
            for (CandidateFit cf : cands) {
                if (Double.isFinite(cf.aicc) && (best == null || cf.aicc < best.aicc)) {
                    best = cf;
                }
            }
            boolean aiccUsable = best != null;
            if (best == null) {
                // too few runs for AICc: keep the default discrete choices
                for (CandidateFit cf : cands) {
                    if (isDefaultCombo(cf.combo)) {
                        best = cf;
                    }
                }
                if (best == null) {
                    best = cands.get(0);
                }
            }
            List<Candidate> candOut = new ArrayList<>();
            for (CandidateFit cf : cands) {
                candOut.add(new Candidate(cf.combo, cf.aicc, cf.m2ll, cf.k, cf == best));
            }
            return report(best, candOut, aiccUsable);
        }

        boolean isDefaultCombo(Map<String, Double> combo) {
            for (ModelParameter p : discrete) {
                if (combo.get(p.name()) != p.defaultValue()) {
                    return false;
                }
            }
            return true;
        }

        List<Map<String, Double>> combos() {
            List<Map<String, Double>> out = new ArrayList<>();
            out.add(new LinkedHashMap<>());
            for (ModelParameter p : discrete) {
                List<Map<String, Double>> next = new ArrayList<>();
                for (Map<String, Double> m : out) {
                    for (double v : p.choices()) {
                        Map<String, Double> n = new LinkedHashMap<>(m);
                        n.put(p.name(), v);
                        next.add(n);
                    }
                }
                out = next;
            }
            return out;
        }

        /** Picks the runs and observations; runs are checked at default parameters. */
        void collect(ParameterValues defaults) {
            ModelChain.Step step = new ModelChain.Step(model, defaults);
            ModelChain self = ModelChain.of(List.of(step), c.surface());
            for (Run r : allRuns) {
                if (!r.ok()) {
                    continue;
                }
                boolean measured = false;
                for (OutcomeSpec o : outs) {
                    if (o.isClass() ? r.category(o.name()).isPresent() : r.number(o.name()).isPresent()) {
                        measured = true;
                    }
                }
                if (!measured) {
                    excluded.add(new Excluded(r.runId(), "measured none of "
                            + String.join(", ", outs.stream().map(OutcomeSpec::name).toList())));
                    continue;
                }
                Conditions cond = conditions(r);
                List<String> missing = new ArrayList<>();
                for (Role role : model.requiredInputs()) {
                    if (!cond.has(role)) {
                        missing.add(role.key());
                    }
                }
                if (!missing.isEmpty()) {
                    excluded.add(new Excluded(r.runId(), "recipe does not give " + String.join(", ", missing)));
                    continue;
                }
                Prediction p = self.safePredict(step, cond);
                if (!p.validity().valid()) {
                    excluded.add(new Excluded(r.runId(), p.validity().reason()));
                    continue;
                }
                int idx = used.size();
                used.add(r);
                conds.add(cond);
                for (OutcomeSpec o : outs) {
                    if (o.isClass()) {
                        r.category(o.name()).ifPresent(v -> obs.add(new Obs(idx, o, Double.NaN, v)));
                    } else {
                        var v = r.number(o.name());
                        if (v.isPresent() && (o.scale() != Scale.LOG || v.getAsDouble() > 0)) {
                            obs.add(new Obs(idx, o, scaled(o, v.getAsDouble()), null));
                        }
                    }
                }
            }
            for (Obs o : obs) {
                if (o.isClass()) {
                    hasClass = true;
                } else if (!numericOutcomes.contains(o.outcome().name())) {
                    numericOutcomes.add(o.outcome().name());
                }
            }
        }

        /** Measured conditions of a run plus what upstream models predict for the roles it lacks. */
        Conditions conditions(Run r) {
            Conditions measured = RecipeConverter.conditions(c, r, true);
            // outcomes of this very model must not be inputs to it
            Conditions.Builder b = Conditions.builder();
            measured.numbers().forEach((role, v) -> {
                if (!model.predictedOutcomes().contains(role)) {
                    b.set(role, v);
                }
            });
            measured.categories().forEach(b::set);
            Conditions base = b.build();
            if (upstream.steps().isEmpty()) {
                return base;
            }
            ModelChain.Result up = upstream.predict(base);
            Conditions.Builder b2 = Conditions.builder();
            base.numbers().forEach(b2::set);
            base.categories().forEach(b2::set);
            up.values().forEach((role, v) -> {
                if (!base.has(role) && !model.predictedOutcomes().contains(role)) {
                    b2.set(role, v);
                }
            });
            return b2.build();
        }

        double scaled(OutcomeSpec o, double campaignValue) {
            return o.scale() == Scale.LOG ? Math.log10(campaignValue) : campaignValue;
        }

        double fromCanonical(OutcomeSpec o, double canonical) {
            return o.unit().fromCanonical(canonical, c.surface().monolayerHeightNm());
        }

        // ---------------------------------------------------------- evaluation

        final class CandidateFit {
            Map<String, Double> combo;
            List<ModelParameter> free = new ArrayList<>();
            Map<String, String> heldReason = new LinkedHashMap<>();
            double[] u;
            double aicc;
            double m2ll;
            int k;
            Map<String, Double> sigma = new LinkedHashMap<>();
        }

        ParameterValues values(Map<String, Double> combo, List<ModelParameter> free, double[] u) {
            Map<String, Double> m = new LinkedHashMap<>();
            for (ModelParameter p : params) {
                m.put(p.name(), p.defaultValue());
            }
            m.putAll(combo);
            for (int i = 0; i < free.size(); i++) {
                ModelParameter p = free.get(i);
                m.put(p.name(), fromU(p, u[i]));
            }
            return new ParameterValues(m);
        }

        double toU(ModelParameter p, double v) {
            return p.logScale() ? Math.log10(v) : v;
        }

        double fromU(ModelParameter p, double u) {
            double v = p.logScale() ? Math.pow(10, u) : u;
            return Math.max(p.min(), Math.min(p.max(), v));
        }

        double uLo(ModelParameter p) {
            return toU(p, p.min());
        }

        double uHi(ModelParameter p) {
            return toU(p, p.max());
        }

        /** Predictions per used run. */
        Prediction[] predictAll(ParameterValues v) {
            ModelChain.Step step = new ModelChain.Step(model, v);
            ModelChain self = ModelChain.of(List.of(step), c.surface());
            Prediction[] out = new Prediction[used.size()];
            for (int i = 0; i < used.size(); i++) {
                out[i] = self.safePredict(step, conds.get(i));
            }
            return out;
        }

        /** Predicted value on the fitted scale, or NaN when not predicted/invalid. */
        double predictedScaled(Prediction p, OutcomeSpec o) {
            if (!p.validity().valid()) {
                return Double.NaN;
            }
            var v = p.value(o.role());
            if (v.isEmpty()) {
                return Double.NaN;
            }
            double inUnit = fromCanonical(o, v.getAsDouble());
            if (o.scale() == Scale.LOG) {
                return inUnit > 0 ? Math.log10(inUnit) : Double.NaN;
            }
            return inUnit;
        }

        double classProbability(Prediction p, OutcomeSpec o, String cls) {
            if (!p.validity().valid()) {
                return PROBABILITY_FLOOR;
            }
            Map<String, Double> probs = p.classProbabilities(o.role());
            double total = 0;
            for (String k : o.classes()) {
                total += Math.max(probs.getOrDefault(k, 0.0), PROBABILITY_FLOOR);
            }
            return Math.max(probs.getOrDefault(cls, 0.0), PROBABILITY_FLOOR) / total;
        }

        /** Normalised residuals (numeric: (y - f)/sigma; class observations skipped). */
        double[] numericResiduals(Prediction[] preds, Map<String, Double> sigma) {
            List<Double> r = new ArrayList<>();
            for (Obs o : obs) {
                if (o.isClass()) {
                    continue;
                }
                double f = predictedScaled(preds[o.run()], o.outcome());
                double s = sigma.get(o.outcome().name());
                r.add(Double.isFinite(f) ? (o.y() - f) / s : INVALID_PENALTY);
            }
            return r.stream().mapToDouble(Double::doubleValue).toArray();
        }

        double classNll(Prediction[] preds) {
            double nll = 0;
            for (Obs o : obs) {
                if (o.isClass()) {
                    nll -= Math.log(classProbability(preds[o.run()], o.outcome(), o.cls()));
                }
            }
            return nll;
        }

        Map<String, Double> startSigma() {
            Map<String, Double> s = new LinkedHashMap<>();
            for (String name : numericOutcomes) {
                OutcomeSpec o = c.outcome(name).orElseThrow();
                if (o.scale() == Scale.LOG) {
                    s.put(name, LOG_NOISE_START);
                } else {
                    s.put(name, Math.max(LINEAR_NOISE_START * meanAbs(name), 1e-12));
                }
            }
            return s;
        }

        double meanAbs(String name) {
            double sum = 0;
            int n = 0;
            for (Obs o : obs) {
                if (!o.isClass() && o.outcome().name().equals(name)) {
                    sum += Math.abs(o.y());
                    n++;
                }
            }
            return n == 0 ? 1 : sum / n;
        }

        /** ML noise per numeric outcome from the current residuals, floored. */
        Map<String, Double> updateSigma(Prediction[] preds) {
            Map<String, Double> s = new LinkedHashMap<>();
            for (String name : numericOutcomes) {
                OutcomeSpec o = c.outcome(name).orElseThrow();
                double rss = 0;
                int n = 0;
                for (Obs ob : obs) {
                    if (!ob.isClass() && ob.outcome().name().equals(name)) {
                        double f = predictedScaled(preds[ob.run()], o);
                        double d = Double.isFinite(f) ? ob.y() - f : 10;
                        rss += d * d;
                        n++;
                    }
                }
                double floor = o.scale() == Scale.LOG ? LOG_NOISE_FLOOR : LINEAR_NOISE_FLOOR * meanAbs(name);
                s.put(name, Math.max(Math.sqrt(rss / Math.max(n, 1)), floor));
            }
            return s;
        }

        /** -2 ln L with sigma at its ML value (profiled). */
        double minus2LogL(Prediction[] preds) {
            Map<String, Double> s = updateSigma(preds);
            double m2 = 0;
            for (String name : numericOutcomes) {
                int n = 0;
                double rss = 0;
                OutcomeSpec o = c.outcome(name).orElseThrow();
                for (Obs ob : obs) {
                    if (!ob.isClass() && ob.outcome().name().equals(name)) {
                        double f = predictedScaled(preds[ob.run()], o);
                        double d = Double.isFinite(f) ? ob.y() - f : 10;
                        rss += d * d;
                        n++;
                    }
                }
                double sg = s.get(name);
                m2 += n * Math.log(2 * Math.PI * sg * sg) + rss / (sg * sg);
            }
            return m2 + 2 * classNll(preds);
        }

        /** Objective for the direct minimiser: -ln L with fixed sigma. */
        double nll(double[] u, Map<String, Double> combo, List<ModelParameter> free, Map<String, Double> sigma) {
            Prediction[] preds = predictAll(values(combo, free, u));
            double[] r = numericResiduals(preds, sigma);
            double s = 0;
            for (double x : r) {
                s += x * x;
            }
            return 0.5 * s + classNll(preds);
        }

        // ---------------------------------------------------------- choosing free parameters

        /** Sensitivity matrix: d(residual-like output)/d(u), columns scaled to the parameter's range. */
        double[][] sensitivity(Map<String, Double> combo, List<ModelParameter> cand, double[] u0) {
            int n = obs.size();
            double[][] j = new double[n][cand.size()];
            double[] base = outputs(values(combo, cand, u0));
            for (int k = 0; k < cand.size(); k++) {
                ModelParameter p = cand.get(k);
                double range = uHi(p) - uLo(p);
                double h = 1e-3 * range;
                double[] up = u0.clone();
                double[] dn = u0.clone();
                up[k] = Math.min(uHi(p), u0[k] + h);
                dn[k] = Math.max(uLo(p), u0[k] - h);
                double[] fu = outputs(values(combo, cand, up));
                double[] fd = outputs(values(combo, cand, dn));
                double step = up[k] - dn[k];
                for (int i = 0; i < n; i++) {
                    double d = (fu[i] - fd[i]) / step;
                    j[i][k] = Double.isFinite(d) ? d * range / 4 : 0;
                }
            }
            return j;
        }

        /** One output per observation: numeric prediction on its scale, or logit-ish of the observed class. */
        double[] outputs(ParameterValues v) {
            Prediction[] preds = predictAll(v);
            double[] out = new double[obs.size()];
            for (int i = 0; i < obs.size(); i++) {
                Obs o = obs.get(i);
                if (o.isClass()) {
                    out[i] = Math.log(classProbability(preds[o.run()], o.outcome(), o.cls()));
                } else {
                    double f = predictedScaled(preds[o.run()], o.outcome());
                    double s = o.outcome().scale() == Scale.LOG ? LOG_NOISE_START
                            : LINEAR_NOISE_START * meanAbs(o.outcome().name());
                    out[i] = Double.isFinite(f) ? f / s : 0;
                }
            }
            return out;
        }

        void chooseFree(CandidateFit cf) {
            int nObs = obs.size();
            List<ModelParameter> free = new ArrayList<>();
            List<ModelParameter> all = new ArrayList<>(continuous);
            double[] u0all = new double[all.size()];
            for (int i = 0; i < all.size(); i++) {
                u0all[i] = toU(all.get(i), all.get(i).defaultValue());
            }
            double[][] jAll = sensitivity(cf.combo, all, u0all);
            double maxNorm = 0;
            double[] norms = new double[all.size()];
            for (int k = 0; k < all.size(); k++) {
                double s = 0;
                for (double[] row : jAll) {
                    s += row[k] * row[k];
                }
                norms[k] = Math.sqrt(s);
                maxNorm = Math.max(maxNorm, norms[k]);
            }
            int sigmas = numericOutcomes.size();
            for (int k = 0; k < all.size(); k++) {
                ModelParameter p = all.get(k);
                if (!(norms[k] > MIN_SENSITIVITY * Math.max(maxNorm, 1e-300)) || norms[k] == 0) {
                    cf.heldReason.put(p.name(), "these runs do not depend on it");
                    continue;
                }
                double effective = 0;
                for (Obs o : obs) {
                    effective += o.isClass() ? CLASS_OBSERVATION_WEIGHT : 1;
                }
                if (nObs - (free.size() + 1 + sigmas) < MIN_RESIDUAL_DOF
                        || effective < OBSERVATIONS_PER_PARAMETER * (free.size() + 1)) {
                    cf.heldReason.put(p.name(), "too few runs to fit it as well (" + used.size() + " runs)");
                    continue;
                }
                List<Integer> cols = new ArrayList<>();
                for (ModelParameter f : free) {
                    cols.add(all.indexOf(f));
                }
                cols.add(k);
                double cond = marginalCondition(jAll, cols, norms);
                if (!(cond <= MAX_CONDITION)) {
                    String partner = mostCorrelated(jAll, k, free, all, norms);
                    cf.heldReason.put(p.name(), "cannot be told apart from " + partner + " with these runs");
                    continue;
                }
                free.add(p);
            }
            cf.free = free;
        }

        /**
         * 1 / sin(angle) between the last column and the span of the others (all normalised): how
         * much freeing the last parameter inflates its own variance (the square root of its variance
         * inflation factor).
         */
        double marginalCondition(double[][] j, List<Integer> cols, double[] norms) {
            int last = cols.get(cols.size() - 1);
            int n = j.length;
            double[] v = new double[n];
            for (int i = 0; i < n; i++) {
                v[i] = j[i][last] / norms[last];
            }
            if (cols.size() == 1) {
                return 1;
            }
            double[][] a = new double[n][cols.size() - 1];
            for (int i = 0; i < n; i++) {
                for (int c2 = 0; c2 < cols.size() - 1; c2++) {
                    a[i][c2] = j[i][cols.get(c2)] / norms[cols.get(c2)];
                }
            }
            SingularValueDecomposition svd = new SingularValueDecomposition(new Array2DRowRealMatrix(a, false));
            RealVector coef = svd.getSolver().solve(new ArrayRealVector(v, false));
            RealVector proj = new Array2DRowRealMatrix(a, false).operate(coef);
            double res = 0;
            for (int i = 0; i < n; i++) {
                double d = v[i] - proj.getEntry(i);
                res += d * d;
            }
            double sin = Math.sqrt(Math.max(res, 0));
            return sin <= 0 ? Double.POSITIVE_INFINITY : 1 / sin;
        }

        double condition(double[][] j, List<Integer> cols, double[] norms) {
            double[][] m = new double[j.length][cols.size()];
            for (int i = 0; i < j.length; i++) {
                for (int c2 = 0; c2 < cols.size(); c2++) {
                    m[i][c2] = j[i][cols.get(c2)] / norms[cols.get(c2)];
                }
            }
            if (j.length < cols.size()) {
                return Double.POSITIVE_INFINITY;
            }
            double[] s = new SingularValueDecomposition(new Array2DRowRealMatrix(m, false)).getSingularValues();
            double min = s[s.length - 1];
            return min <= 0 ? Double.POSITIVE_INFINITY : s[0] / min;
        }

        String mostCorrelated(double[][] j, int k, List<ModelParameter> free, List<ModelParameter> all, double[] norms) {
            String best = free.isEmpty() ? "the other parameters" : free.get(0).name().replace('_', ' ');
            double bestCos = -1;
            for (ModelParameter f : free) {
                int q = all.indexOf(f);
                double dot = 0;
                for (double[] row : j) {
                    dot += row[k] * row[q];
                }
                double cos = Math.abs(dot) / (norms[k] * norms[q]);
                if (cos > bestCos) {
                    bestCos = cos;
                    best = f.name().replace('_', ' ');
                }
            }
            return best;
        }

        // ---------------------------------------------------------- fitting one candidate

        CandidateFit fitCandidate(Map<String, Double> combo, SplittableRandom rng) {
            CandidateFit cf = new CandidateFit();
            cf.combo = combo;
            chooseFree(cf);
            double[] start = new double[cf.free.size()];
            for (int i = 0; i < start.length; i++) {
                start[i] = toU(cf.free.get(i), cf.free.get(i).defaultValue());
            }
            double[] u = start;
            Map<String, Double> sigma = startSigma();
            if (!cf.free.isEmpty()) {
                List<double[]> starts = new ArrayList<>();
                starts.add(start);
                int extraStarts = intervals ? 2 : 0;
                for (int s = 0; s < extraStarts; s++) {
                    double[] r = new double[start.length];
                    for (int i = 0; i < r.length; i++) {
                        ModelParameter p = cf.free.get(i);
                        double lo = uLo(p);
                        double hi = uHi(p);
                        // random start in the middle half of the range around the default
                        r[i] = Math.max(lo, Math.min(hi, start[i] + (rng.nextDouble() - 0.5) * (hi - lo) * 0.25));
                    }
                    starts.add(r);
                }
                double bestVal = Double.POSITIVE_INFINITY;
                double[] bestU = start;
                for (double[] s0 : starts) {
                    double[] uu = s0;
                    Map<String, Double> sg = startSigma();
                    for (int iter = 0; iter < REWEIGHT_ITERATIONS; iter++) {
                        uu = minimise(uu, combo, cf.free, sg);
                        Map<String, Double> next = updateSigma(predictAll(values(combo, cf.free, uu)));
                        boolean settled = true;
                        for (String k : next.keySet()) {
                            if (Math.abs(next.get(k) / sg.get(k) - 1) > 0.05) {
                                settled = false;
                            }
                        }
                        sg = next;
                        if (settled && iter > 0) {
                            break;
                        }
                    }
                    double val = minus2LogL(predictAll(values(combo, cf.free, uu)));
                    if (val < bestVal) {
                        bestVal = val;
                        bestU = uu;
                        sigma = sg;
                    }
                }
                u = bestU;
            } else {
                sigma = updateSigma(predictAll(values(combo, cf.free, u)));
            }
            cf.u = u;
            cf.sigma = sigma;
            Prediction[] preds = predictAll(values(combo, cf.free, u));
            cf.m2ll = minus2LogL(preds);
            cf.k = cf.free.size() + numericOutcomes.size();
            int n = obs.size();
            cf.aicc = n - cf.k - 1 > 0 ? cf.m2ll + 2.0 * cf.k + 2.0 * cf.k * (cf.k + 1) / (n - cf.k - 1) : Double.NaN;
            return cf;
        }

        double[] minimise(double[] start, Map<String, Double> combo, List<ModelParameter> free,
                          Map<String, Double> sigma) {
            int d = start.length;
            double[] lo = new double[d];
            double[] hi = new double[d];
            for (int i = 0; i < d; i++) {
                lo[i] = uLo(free.get(i));
                hi[i] = uHi(free.get(i));
            }
            if (!hasClass) {
                return levenbergMarquardt(start, lo, hi, combo, free, sigma);
            }
            if (d == 1) {
                UnivariateObjectiveFunction f = new UnivariateObjectiveFunction(
                        x -> nll(new double[] {x}, combo, free, sigma));
                double span = hi[0] - lo[0];
                var r = new BrentOptimizer(1e-10, 1e-8 * span).optimize(new MaxEval(500), f, GoalType.MINIMIZE,
                        new SearchInterval(lo[0], hi[0], Math.max(lo[0], Math.min(hi[0], start[0]))));
                double best = nll(start, combo, free, sigma);
                return r.getValue() <= best ? new double[] {r.getPoint()} : start;
            }
            double[] x0 = start.clone();
            for (int i = 0; i < d; i++) {
                x0[i] = Math.max(lo[i] + 1e-9 * (hi[i] - lo[i]), Math.min(hi[i] - 1e-9 * (hi[i] - lo[i]), x0[i]));
            }
            double radius = Double.POSITIVE_INFINITY;
            for (int i = 0; i < d; i++) {
                radius = Math.min(radius, (hi[i] - lo[i]) / 4);
            }
            double[] bestX = start.clone();
            double[] bestF = {nll(start, combo, free, sigma)};
            try {
                BOBYQAOptimizer opt = new BOBYQAOptimizer(2 * d + 1, radius, 1e-6 * radius);
                PointValuePair p = opt.optimize(new MaxEval(maxEvaluations),
                        new ObjectiveFunction(x -> {
                            double f = nll(x, combo, free, sigma);
                            if (f < bestF[0]) {
                                bestF[0] = f;
                                System.arraycopy(x, 0, bestX, 0, d);
                            }
                            return f;
                        }), GoalType.MINIMIZE,
                        new InitialGuess(x0), new SimpleBounds(lo, hi));
                return p.getValue() <= bestF[0] ? p.getPoint() : bestX;
            } catch (RuntimeException e) {
                return bestX; // evaluation budget spent: keep the best point seen
            }
        }

        double[] levenbergMarquardt(double[] start, double[] lo, double[] hi, Map<String, Double> combo,
                                    List<ModelParameter> free, Map<String, Double> sigma) {
            int nRes = (int) obs.stream().filter(o -> !o.isClass()).count();
            MultivariateJacobianFunction f = point -> {
                double[] u = clamp(point.toArray(), lo, hi);
                double[] r0 = numericResiduals(predictAll(values(combo, free, u)), sigma);
                double[][] j = new double[nRes][u.length];
                for (int k = 0; k < u.length; k++) {
                    double h = 1e-6 * Math.max(1, Math.abs(u[k])) + 1e-7 * (hi[k] - lo[k]);
                    double[] up = u.clone();
                    up[k] = u[k] + h <= hi[k] ? u[k] + h : u[k] - h;
                    double step = up[k] - u[k];
                    double[] r1 = numericResiduals(predictAll(values(combo, free, up)), sigma);
                    for (int i = 0; i < nRes; i++) {
                        // residual = (y - f)/s, model value = -residual
                        j[i][k] = -(r1[i] - r0[i]) / step;
                    }
                }
                double[] model = new double[nRes];
                for (int i = 0; i < nRes; i++) {
                    model[i] = -r0[i];
                }
                return new Pair<RealVector, RealMatrix>(new ArrayRealVector(model, false),
                        new Array2DRowRealMatrix(j, false));
            };
            try {
                LeastSquaresOptimizer.Optimum opt = new LevenbergMarquardtOptimizer().optimize(new LeastSquaresBuilder()
                        .start(start).model(f).target(new double[nRes])
                        .parameterValidator(v -> new ArrayRealVector(clamp(v.toArray(), lo, hi), false))
                        .maxEvaluations(2000).maxIterations(500).lazyEvaluation(false).build());
                return clamp(opt.getPoint().toArray(), lo, hi);
            } catch (RuntimeException e) {
                return start;
            }
        }

        double[] clamp(double[] u, double[] lo, double[] hi) {
            double[] out = u.clone();
            for (int i = 0; i < out.length; i++) {
                if (!Double.isFinite(out[i])) {
                    out[i] = (lo[i] + hi[i]) / 2;
                }
                out[i] = Math.max(lo[i], Math.min(hi[i], out[i]));
            }
            return out;
        }

        // ---------------------------------------------------------- uncertainty and report

        /** Hessian of -ln L (fixed sigma) in u space by central differences. */
        double[][] hessian(CandidateFit cf) {
            int d = cf.u.length;
            double[][] h = new double[d][d];
            double[] step = new double[d];
            for (int i = 0; i < d; i++) {
                ModelParameter p = cf.free.get(i);
                step[i] = 1e-3 * (uHi(p) - uLo(p));
            }
            double f0 = nll(cf.u, cf.combo, cf.free, cf.sigma);
            for (int i = 0; i < d; i++) {
                for (int j = i; j < d; j++) {
                    double v;
                    if (i == j) {
                        double[] a = cf.u.clone();
                        double[] b = cf.u.clone();
                        a[i] += step[i];
                        b[i] -= step[i];
                        v = (nll(a, cf.combo, cf.free, cf.sigma) - 2 * f0 + nll(b, cf.combo, cf.free, cf.sigma))
                                / (step[i] * step[i]);
                    } else {
                        double[] pp = cf.u.clone();
                        double[] pm = cf.u.clone();
                        double[] mp = cf.u.clone();
                        double[] mm = cf.u.clone();
                        pp[i] += step[i];
                        pp[j] += step[j];
                        pm[i] += step[i];
                        pm[j] -= step[j];
                        mp[i] -= step[i];
                        mp[j] += step[j];
                        mm[i] -= step[i];
                        mm[j] -= step[j];
                        v = (nll(pp, cf.combo, cf.free, cf.sigma) - nll(pm, cf.combo, cf.free, cf.sigma)
                                - nll(mp, cf.combo, cf.free, cf.sigma) + nll(mm, cf.combo, cf.free, cf.sigma))
                                / (4 * step[i] * step[j]);
                    }
                    h[i][j] = v;
                    h[j][i] = v;
                }
            }
            return h;
        }

        /** Gauss-Newton information J^T J (numeric-only models), better conditioned than differences. */
        double[][] gaussNewton(CandidateFit cf) {
            int d = cf.u.length;
            double[] r0 = numericResiduals(predictAll(values(cf.combo, cf.free, cf.u)), cf.sigma);
            double[][] j = new double[r0.length][d];
            for (int k = 0; k < d; k++) {
                ModelParameter p = cf.free.get(k);
                double h = 1e-5 * (uHi(p) - uLo(p));
                double[] a = cf.u.clone();
                double[] b = cf.u.clone();
                a[k] = Math.min(uHi(p), cf.u[k] + h);
                b[k] = Math.max(uLo(p), cf.u[k] - h);
                double[] ra = numericResiduals(predictAll(values(cf.combo, cf.free, a)), cf.sigma);
                double[] rb = numericResiduals(predictAll(values(cf.combo, cf.free, b)), cf.sigma);
                for (int i = 0; i < r0.length; i++) {
                    j[i][k] = (ra[i] - rb[i]) / (a[k] - b[k]);
                }
            }
            double[][] info = new double[d][d];
            for (double[] row : j) {
                for (int a = 0; a < d; a++) {
                    for (int b = 0; b < d; b++) {
                        info[a][b] += row[a] * row[b];
                    }
                }
            }
            return info;
        }

        /** Covariance in u space, or null when the information matrix is not positive definite. */
        double[][] covariance(CandidateFit cf) {
            double[][] info = hasClass ? hessian(cf) : gaussNewton(cf);
            RealMatrix m = new Array2DRowRealMatrix(info);
            EigenDecomposition ed = new EigenDecomposition(m);
            double[] ev = ed.getRealEigenvalues();
            double max = Arrays.stream(ev).max().orElse(0);
            for (double e : ev) {
                if (!(e > 1e-12 * Math.max(max, 1e-300))) {
                    return null;
                }
            }
            double[][] cov = ed.getSolver().getInverse().getData();
            // correct for the residual degrees of freedom of the estimated noise (numeric only)
            if (!hasClass) {
                int n = (int) obs.stream().filter(o -> !o.isClass()).count();
                int dof = n - cf.free.size();
                if (dof > 0) {
                    double f = (double) n / dof;
                    for (double[] row : cov) {
                        for (int j = 0; j < row.length; j++) {
                            row[j] *= f;
                        }
                    }
                }
            }
            return cov;
        }

        double[][] bootstrap(CandidateFit cf) {
            int d = cf.u.length;
            Prediction[] fittedPreds = predictAll(values(cf.combo, cf.free, cf.u));
            List<Double> resid = new ArrayList<>();
            List<Integer> residIdx = new ArrayList<>();
            for (int i = 0; i < obs.size(); i++) {
                Obs o = obs.get(i);
                if (!o.isClass()) {
                    double f = predictedScaled(fittedPreds[o.run()], o.outcome());
                    resid.add(Double.isFinite(f) ? (o.y() - f) / cf.sigma.get(o.outcome().name()) : 0);
                    residIdx.add(i);
                }
            }
            int nNum = resid.size();
            double inflate = nNum - d > 0 ? Math.sqrt((double) nNum / (nNum - d)) : 1;
            List<Obs> original = new ArrayList<>(obs);
            int reps = hasClass ? BOOTSTRAP_REPLICATES_CLASSES : BOOTSTRAP_REPLICATES;
            double[][] samples = new double[reps][];
            int savedMax = maxEvaluations;
            maxEvaluations = 800;
            SplittableRandom r = rng.split();
            try {
                for (int b = 0; b < reps; b++) {
                    List<Obs> synth = new ArrayList<>();
                    for (Obs o : original) {
                        if (o.isClass()) {
                            synth.add(new Obs(o.run(), o.outcome(), Double.NaN,
                                    sampleClass(fittedPreds[o.run()], o.outcome(), r)));
                        } else {
                            double f = predictedScaled(fittedPreds[o.run()], o.outcome());
                            double e = resid.get(r.nextInt(nNum)) * inflate * cf.sigma.get(o.outcome().name());
                            synth.add(new Obs(o.run(), o.outcome(), (Double.isFinite(f) ? f : o.y()) + e, null));
                        }
                    }
                    obs.clear();
                    obs.addAll(synth);
                    double[] u = cf.u;
                    Map<String, Double> sg = cf.sigma;
                    for (int iter = 0; iter < 2; iter++) {
                        u = minimise(u, cf.combo, cf.free, sg);
                        sg = updateSigma(predictAll(values(cf.combo, cf.free, u)));
                    }
                    samples[b] = u;
                }
            } finally {
                obs.clear();
                obs.addAll(original);
                maxEvaluations = savedMax;
            }
            double[][] ci = new double[d][2];
            for (int k = 0; k < d; k++) {
                double[] col = new double[reps];
                for (int b = 0; b < reps; b++) {
                    col[b] = samples[b][k];
                }
                Arrays.sort(col);
                ci[k][0] = col[(int) Math.floor(0.025 * (reps - 1))];
                ci[k][1] = col[(int) Math.ceil(0.975 * (reps - 1))];
            }
            return ci;
        }

        String sampleClass(Prediction p, OutcomeSpec o, SplittableRandom r) {
            double x = r.nextDouble();
            double acc = 0;
            for (String k : o.classes()) {
                acc += classProbability(p, o, k);
                if (x <= acc) {
                    return k;
                }
            }
            return o.classes().get(o.classes().size() - 1);
        }

        ModelFit report(CandidateFit best, List<Candidate> candOut, boolean aiccUsable) {
            int d = best.free.size();
            double[][] cov = d == 0 ? new double[0][0] : covariance(best);
            int nNum = (int) obs.stream().filter(o -> !o.isClass()).count();
            int dof = (hasClass ? obs.size() : nNum) - d;
            boolean useBootstrap = intervals && d > 0 && (cov == null || dof < MIN_DOF_FOR_COVARIANCE);
            double[][] ci = new double[d][2];
            String method;
            if (useBootstrap) {
                ci = bootstrap(best);
                method = "95 % interval from " + (hasClass ? BOOTSTRAP_REPLICATES_CLASSES : BOOTSTRAP_REPLICATES)
                        + " bootstrap refits"
                        + (cov == null ? " (the curvature of the fit is not reliable)" : " (small sample)");
            } else if (cov == null) {
                for (int k = 0; k < d; k++) {
                    ci[k][0] = uLo(best.free.get(k));
                    ci[k][1] = uHi(best.free.get(k));
                }
                method = "interval not computed (the curvature of the fit is not reliable; run terrace fit for a bootstrap)";
            } else {
                double t = new TDistribution(Math.max(dof, 1)).inverseCumulativeProbability(0.975);
                for (int k = 0; k < d; k++) {
                    double se = Math.sqrt(Math.max(cov[k][k], 0));
                    ci[k][0] = best.u[k] - t * se;
                    ci[k][1] = best.u[k] + t * se;
                }
                method = "95 % interval from the fit's covariance (Student t, " + Math.max(dof, 1) + " degrees of freedom)";
            }
            ParameterValues values = values(best.combo, best.free, best.u);
            List<Estimate> est = new ArrayList<>();
            for (ModelParameter p : params) {
                int k = best.free.indexOf(p);
                if (k >= 0) {
                    double lo = fromU(p, Math.max(uLo(p), Math.min(ci[k][0], ci[k][1])));
                    double hi = fromU(p, Math.min(uHi(p), Math.max(ci[k][0], ci[k][1])));
                    double v = values.get(p.name());
                    lo = Math.min(lo, v);
                    hi = Math.max(hi, v);
                    String reason = method;
                    if (lo <= p.min() || hi >= p.max()) {
                        reason += "; the interval reaches the parameter's physical bound";
                    }
                    est.add(new Estimate(p.name(), p.unit(), v, lo, hi, false, reason, p.source()));
                } else if (p.isDiscrete()) {
                    String why = discrete.size() > 0 && aiccUsable ? "chosen by AICc among "
                            + p.choices().stream().map(ModelFitter::fmt).toList()
                            : "too few runs to compare the choices by AICc; default kept";
                    est.add(new Estimate(p.name(), p.unit(), best.combo.get(p.name()), Double.NaN, Double.NaN,
                            true, why, p.source()));
                } else {
                    est.add(new Estimate(p.name(), p.unit(), p.defaultValue(), Double.NaN, Double.NaN, true,
                            "held at its default: " + best.heldReason.getOrDefault(p.name(), "not fitted"), p.source()));
                }
            }
            // correlations
            List<String> corrNames = best.free.stream().map(ModelParameter::name).toList();
            double[][] corr = new double[d][d];
            if (cov != null && d > 0) {
                for (int a = 0; a < d; a++) {
                    for (int b = 0; b < d; b++) {
                        double den = Math.sqrt(cov[a][a] * cov[b][b]);
                        corr[a][b] = den > 0 ? Math.max(-1, Math.min(1, cov[a][b] / den)) : (a == b ? 1 : 0);
                    }
                }
            } else {
                for (int a = 0; a < d; a++) {
                    corr[a][a] = 1;
                }
            }
            // residuals and per-outcome quality
            Prediction[] preds = predictAll(values);
            List<Residual> residuals = new ArrayList<>();
            List<OutcomeFit> outFits = new ArrayList<>();
            for (OutcomeSpec o : outs) {
                int n = 0;
                double ss = 0;
                double ll = 0;
                int correct = 0;
                for (Obs ob : obs) {
                    if (ob.outcome() != o) {
                        continue;
                    }
                    n++;
                    Prediction p = preds[ob.run()];
                    String runId = used.get(ob.run()).runId();
                    if (ob.isClass()) {
                        double pr = classProbability(p, o, ob.cls());
                        ll -= Math.log(pr);
                        String top = null;
                        double topP = -1;
                        for (String k : o.classes()) {
                            double q = classProbability(p, o, k);
                            if (q > topP) {
                                topP = q;
                                top = k;
                            }
                        }
                        if (ob.cls().equals(top)) {
                            correct++;
                        }
                        residuals.add(new Residual(runId, o.name(), Double.NaN, Double.NaN, -Math.log(pr), ob.cls()));
                    } else {
                        double f = predictedScaled(p, o);
                        double meas = o.scale() == Scale.LOG ? Math.pow(10, ob.y()) : ob.y();
                        double pred = Double.isFinite(f) ? (o.scale() == Scale.LOG ? Math.pow(10, f) : f) : Double.NaN;
                        double r = Double.isFinite(f) ? ob.y() - f : Double.NaN;
                        if (Double.isFinite(r)) {
                            ss += r * r;
                        }
                        residuals.add(new Residual(runId, o.name(), meas, pred, r, null));
                    }
                }
                if (n == 0) {
                    continue;
                }
                if (o.isClass()) {
                    outFits.add(new OutcomeFit(o.name(), "class", n, Double.NaN, ll / n, (double) correct / n));
                } else {
                    outFits.add(new OutcomeFit(o.name(), o.scale() == Scale.LOG ? "log10" : "linear", n,
                            Math.sqrt(ss / n), Double.NaN, Double.NaN));
                }
            }
            List<String> verdict = verdict(est, best);
            return new ModelFit(model.id(), used.size(), excluded, est, best.combo, candOut, outFits, residuals,
                    corrNames, corr, values, verdict, "");
        }

        List<String> verdict(List<Estimate> est, CandidateFit best) {
            List<String> out = new ArrayList<>();
            for (Estimate e : est) {
                if (!e.held()) {
                    out.add(words(e.name()) + " " + fmt(e.value()) + unit(e.unit()) + " (" + fmt(e.lo()) + " to "
                            + fmt(e.hi()) + "), from " + used.size() + " runs");
                }
            }
            if (!best.combo.isEmpty()) {
                List<String> parts = new ArrayList<>();
                best.combo.forEach((k, v) -> parts.add(words(k) + " " + fmt(v)));
                out.add(String.join(", ", parts) + (candOut(best) ? " (best AICc)" : " (default; too few runs to choose)"));
            }
            long held = est.stream().filter(e -> e.held() && !isDiscrete(e.name())).count();
            if (held > 0) {
                out.add(held + " parameter" + (held == 1 ? "" : "s") + " held at default"
                        + (held == 1 ? "" : "s") + " (see reasons)");
            }
            if (out.isEmpty()) {
                out.add("nothing could be fitted from these runs");
            }
            return out;
        }

        boolean candOut(CandidateFit best) {
            return Double.isFinite(best.aicc);
        }

        boolean isDiscrete(String name) {
            return discrete.stream().anyMatch(p -> p.name().equals(name));
        }
    }

    static String words(String name) {
        return name.replace('_', ' ');
    }

    static String unit(String u) {
        return u.isEmpty() ? "" : " " + u;
    }

    /** Two to three significant digits, plain or scientific. */
    static String fmt(double v) {
        if (!Double.isFinite(v)) {
            return "n/a";
        }
        double a = Math.abs(v);
        if (a != 0 && (a >= 1e5 || a < 1e-2)) {
            return String.format(Locale.ROOT, "%.2e", v);
        }
        String s = String.format(Locale.ROOT, "%.3g", v);
        if (s.contains(".")) {
            s = s.replaceAll("0+$", "").replaceAll("\\.$", "");
        }
        return s;
    }
}
