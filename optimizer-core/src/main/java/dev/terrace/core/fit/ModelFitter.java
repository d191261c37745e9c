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
import dev.terrace.core.fit.FitResults.RunStatus;
import dev.terrace.core.fit.FitResults.RunUse;
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
    /** Relative change of every noise level below which the reweighting has settled (5 %: common practice). */
    public static final double SETTLED_SIGMA_CHANGE = 0.05;
    /**
     * Most reweighting passes when some value is censored: the Tobit terms couple the fitted values to
     * the noise level, so alternating between them needs more passes to reach the joint maximum of the
     * likelihood (20 passes and 1e-4 reach it within 0.001 of the value's scale on the Tobit test's data;
     * test design, not a published value).
     */
    public static final int REWEIGHT_ITERATIONS_CENSORED = 20;
    /** Settling threshold of the noise levels when some value is censored (see {@link #REWEIGHT_ITERATIONS_CENSORED}). */
    public static final double SETTLED_SIGMA_CHANGE_CENSORED = 1e-4;
    /** Residual assigned to an observation when a trial parameter set makes the prediction invalid. */
    static final double INVALID_PENALTY = 30;
    /**
     * How often the choice of free parameters is checked again at the fitted values (and the model
     * refitted when it changed): two rechecks settle every case seen in the bundled models' tests
     * (test design, not a published value).
     */
    public static final int FREE_SET_RECHECKS = 2;
    /**
     * How often runs whose predictions are outside the model at the fitted values are left out and
     * the model refitted (same reasoning as {@link #FREE_SET_RECHECKS}).
     */
    public static final int VALIDITY_RECHECKS = 2;

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
        return fit(lc, registry, seed, intervals, List.of());
    }

    /**
     * Fits every model of a campaign with Gaussian priors on some parameters (earlier series, see
     * {@link SeriesPriors}). A prior enters the likelihood as one more residual {@code (u − mean)/sd}
     * on the fitting scale and counts as one observation when the free parameters are chosen; the
     * bootstrap redraws its mean with the data. Priors of parameters another model determines (same
     * meaning) or of discrete parameters are not used.
     *
     * @param lc        the campaign and its runs
     * @param registry  where the campaign's models come from
     * @param seed      seed for multi-starts and the bootstrap
     * @param intervals false to skip the bootstrap
     * @param priors    the priors; never null, possibly empty
     * @return the report; never null
     */
    public static FitReport fit(LoadedCampaign lc, PluginRegistry registry, long seed, boolean intervals,
                                List<ParameterPrior> priors) {
        Campaign c = lc.campaign();
        List<Run> runs = lc.runLog().runs();
        List<ModelChain.Step> fitted = new ArrayList<>();
        List<ModelFit> fits = new ArrayList<>();
        Map<String, SharedMeaning> meanings = new LinkedHashMap<>();
        SplittableRandom rng = new SplittableRandom(seed);
        for (String id : c.models()) {
            Optional<GrowthModel> m = registry.model(id);
            if (m.isEmpty()) {
                fits.add(emptyFit(id, ParameterValues.defaults(List.of()), List.of(),
                        "growth model '" + id + "' is not available", runs));
                continue;
            }
            ModelFit f;
            try {
                FitProblem pr = new FitProblem(c, runs, m.get(), ModelChain.of(fitted, c.surface()), rng.split());
                pr.intervals = intervals;
                pr.maxEvaluations = intervals ? 3000 : FAST_MAX_EVALUATIONS;
                for (ModelParameter p : m.get().parameters()) {
                    SharedMeaning owner = p.hasSharedMeaning() ? meanings.get(p.meaning()) : null;
                    if (owner != null && owner.fitted() && owner.unit().equals(p.unit()) && !p.isDiscrete()) {
                        pr.shared.put(p.name(), Math.max(p.min(), Math.min(p.max(), owner.value())));
                        pr.sharedReason.put(p.name(), sharedReason(owner.modelId(), owner.parameter(), p.meaning()));
                    }
                }
                for (ParameterPrior pp : priors) {
                    if (pp.model().equals(id) && !pr.shared.containsKey(pp.parameter())
                            && m.get().parameters().stream().anyMatch(p -> p.name().equals(pp.parameter())
                            && !p.isDiscrete() && p.logScale() == pp.logScale())) {
                        pr.prior.put(pp.parameter(), new double[] {pp.meanU(), pp.sdU()});
                        pr.priorCorrelation.put(pp.parameter(), pp.correlations());
                    }
                }
                f = pr.solve();
            } catch (RuntimeException e) {
                f = emptyFit(id, ParameterValues.defaults(m.get().parameters()), defaultsHeld(m.get(), "fit failed"),
                        "the fit of " + id + " failed: " + e.getClass().getSimpleName()
                                + (e.getMessage() == null ? "" : ": " + e.getMessage()), runs);
            }
            fits.add(f);
            fitted.add(new ModelChain.Step(m.get(), f.values()));
            share(m.get(), f, fits, fitted, meanings);
        }
        return new FitReport(c.id(), runs.size(), lc.runLog().failedRuns().size(), fits, seed);
    }

    /**
     * Who determines a shared-meaning parameter: the first model, in chain order, that fitted it
     * (or, until one does, the first that declares it), and the earlier models that held it.
     */
    private record SharedMeaning(String modelId, String parameter, String unit, double value, boolean fitted,
                                 List<int[]> holders, List<String> holderParams) {
    }

    private static String sharedReason(String modelId, String parameter, String meaning) {
        return "one parameter with " + modelId + "'s " + parameter + " (same meaning, " + meaning
                + "); determined there";
    }

    /**
     * Records the model's shared-meaning parameters. When this model fitted one that earlier models
     * held at its default, the earlier models take the fitted value too, so the chain predicts with one.
     */
    private static void share(GrowthModel m, ModelFit f, List<ModelFit> fits, List<ModelChain.Step> fitted,
                              Map<String, SharedMeaning> meanings) {
        int index = fits.size() - 1;
        int stepIndex = fitted.size() - 1;
        for (ModelParameter p : m.parameters()) {
            if (!p.hasSharedMeaning() || p.isDiscrete()) {
                continue;
            }
            Estimate e = f.estimate(p.name());
            SharedMeaning owner = meanings.get(p.meaning());
            if (owner == null) {
                List<int[]> holders = new ArrayList<>();
                List<String> names = new ArrayList<>();
                if (e.held()) {
                    holders.add(new int[] {index, stepIndex});
                    names.add(p.name());
                }
                meanings.put(p.meaning(), new SharedMeaning(m.id(), p.name(), p.unit(), e.value(), !e.held(),
                        holders, names));
            } else if (!owner.fitted() && !e.held() && owner.unit().equals(p.unit())) {
                for (int h = 0; h < owner.holders().size(); h++) {
                    int[] at = owner.holders().get(h);
                    String name = owner.holderParams().get(h);
                    ModelFit earlier = fits.get(at[0]);
                    Estimate old = earlier.estimate(name);
                    ModelFit updated = earlier.withParameter(name, e.value(), new Estimate(name, old.unit(), e.value(),
                            Double.NaN, Double.NaN, true, sharedReason(m.id(), p.name(), p.meaning()), old.source()));
                    fits.set(at[0], updated);
                    ModelChain.Step s = fitted.get(at[1]);
                    fitted.set(at[1], new ModelChain.Step(s.model(), updated.values()));
                }
                meanings.put(p.meaning(), new SharedMeaning(m.id(), p.name(), p.unit(), e.value(), true,
                        List.of(), List.of()));
            } else if (!owner.fitted() && e.held()) {
                owner.holders().add(new int[] {index, stepIndex});
                owner.holderParams().add(p.name());
            }
        }
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

    static ModelFit emptyFit(String id, ParameterValues values, List<Estimate> estimates, String message,
                             List<Run> runs) {
        List<RunStatus> statuses = new ArrayList<>();
        List<Excluded> excluded = new ArrayList<>();
        for (Run r : runs) {
            String why = r.ok() ? message : "the run failed (status failed): no sample to measure";
            statuses.add(new RunStatus(r.runId(), RunUse.EXCLUDED, why));
            excluded.add(new Excluded(r.runId(), why));
        }
        return new ModelFit(id, 0, excluded, estimates, Map.of(), List.of(), List.of(), List.of(), List.of(),
                new double[0][], values, List.of(message), message, statuses);
    }

    static List<Estimate> defaultsHeld(GrowthModel m, String reason) {
        List<Estimate> out = new ArrayList<>();
        for (ModelParameter p : m.parameters()) {
            out.add(new Estimate(p.name(), p.unit(), p.defaultValue(), Double.NaN, Double.NaN, true, reason, p.source()));
        }
        return out;
    }

    // ------------------------------------------------------------------ one model

    static String words(String name) {
        return name.replace('_', ' ');
    }

    static String unit(String u) {
        return u.isEmpty() ? "" : " " + u;
    }

    /** @see dev.terrace.core.NumberText#short3 */
    static String fmt(double v) {
        return dev.terrace.core.NumberText.short3(v);
    }
}
