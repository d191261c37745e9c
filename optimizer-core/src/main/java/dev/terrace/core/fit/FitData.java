package dev.terrace.core.fit;

import static dev.terrace.core.fit.ModelFitter.*;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.fit.FitResults.Excluded;
import dev.terrace.core.model.ModelChain;
import dev.terrace.core.model.RecipeConverter;
import dev.terrace.core.runlog.Censored;
import dev.terrace.core.runlog.Run;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

/**
 * The data of one model's fit: the runs it uses, their conditions and observations, and how a
 * parameter vector maps to predictions. The layers above add the likelihood, the choice of free
 * parameters, the optimiser, the intervals and the report.
 */
abstract class FitData {
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
    /** True when some numeric observation is censored ({@code <X} or {@code >X}): the Tobit terms apply. */
    boolean hasCensored;
    /**
     * Parameters held at a value another model of the chain fitted (same meaning), with the reason;
     * they are neither defaults nor free.
     */
    final Map<String, Double> shared = new LinkedHashMap<>();
    final Map<String, String> sharedReason = new LinkedHashMap<>();
    int maxEvaluations = 3000;
    boolean intervals = true;
    /**
     * Gaussian priors on the fitting scale by parameter name ({mean, sd} in u, the log10 scale for
     * parameters fitted in log): earlier series of the same chamber ({@link SeriesPriors}). Each enters
     * the likelihood as one more residual {@code (u − mean)/sd} while the parameter is free.
     */
    final Map<String, double[]> prior = new LinkedHashMap<>();

    FitData(Campaign c, List<Run> runs, GrowthModel model, ModelChain upstream, SplittableRandom rng) {
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


    /**
     * Picks the runs and observations. Runs are left out here only for reasons that do not depend on
     * the parameter values: a failed run, no measured outcome this model predicts, a recipe without an
     * input the model needs, or a prediction that is {@linkplain dev.terrace.spi.Validity#notApplicable
     * not applicable} whatever the parameters (a solid deposit, no flux). A run whose prediction is
     * outside the model only at the default values stays: the fit decides at the fitted values.
     */
    void collect(ParameterValues defaults) {
        ModelChain.Step step = new ModelChain.Step(model, defaults);
        ModelChain self = ModelChain.of(List.of(step), c.surface());
        String measuredNames = String.join(", ", outs.stream().map(OutcomeSpec::name).toList());
        for (Run r : allRuns) {
            if (!r.ok()) {
                excluded.add(new Excluded(r.runId(), "the run failed (status failed): no sample to measure"));
                continue;
            }
            List<Obs> runObs = new ArrayList<>();
            List<String> unusable = new ArrayList<>();
            int idx = used.size();
            for (OutcomeSpec o : outs) {
                if (o.isClass()) {
                    r.category(o.name()).ifPresent(v -> runObs.add(Obs.exact(idx, o, Double.NaN, v)));
                    continue;
                }
                var v = r.number(o.name());
                var cens = r.censored(o.name());
                if (v.isPresent()) {
                    if (o.scale() == Scale.LOG && !(v.getAsDouble() > 0)) {
                        unusable.add(o.name() + " " + fmt(v.getAsDouble()) + " is not positive on a log-scale"
                                + " outcome (write <X for a value below detection)");
                    } else {
                        runObs.add(Obs.exact(idx, o, scaled(o, v.getAsDouble()), null));
                    }
                } else if (cens.isPresent()) {
                    Censored cv = cens.get();
                    if (o.scale() == Scale.LOG && !(cv.bound() > 0)) {
                        unusable.add(o.name() + " " + cv + " carries no information on a log-scale outcome");
                    } else {
                        runObs.add(Obs.censored(idx, o, scaled(o, cv.bound()), cv.side()));
                    }
                }
            }
            if (runObs.isEmpty()) {
                excluded.add(new Excluded(r.runId(), unusable.isEmpty() ? "measured none of " + measuredNames
                        : String.join("; ", unusable)));
                continue;
            }
            Conditions cond = conditions(r);
            List<String> missing = new ArrayList<>();
            // Role order (declaration order), not the model's Set order, which changes between JVM runs
            for (Role role : model.requiredInputs().stream().sorted().toList()) {
                if (!cond.has(role)) {
                    missing.add(role.key());
                }
            }
            if (!missing.isEmpty()) {
                excluded.add(new Excluded(r.runId(), "recipe does not give " + String.join(", ", missing)));
                continue;
            }
            Prediction p = self.safePredict(step, cond);
            if (!p.validity().valid() && !p.validity().dependsOnParameters()) {
                excluded.add(new Excluded(r.runId(), p.validity().reason()));
                continue;
            }
            used.add(r);
            conds.add(cond);
            obs.addAll(runObs);
        }
        for (Obs o : obs) {
            if (o.isClass()) {
                hasClass = true;
            } else {
                if (!numericOutcomes.contains(o.outcome().name())) {
                    numericOutcomes.add(o.outcome().name());
                }
                if (o.isCensored()) {
                    hasCensored = true;
                }
            }
        }
    }

    /**
     * Leaves runs out after a fit (their predictions are outside the model at the fitted values) and
     * renumbers the observations of the others.
     *
     * @param drop    indices into {@link #used}
     * @param reasons the reason for each, in the same order
     */
    void dropRuns(List<Integer> drop, List<String> reasons) {
        List<Run> keptRuns = new ArrayList<>();
        List<Conditions> keptConds = new ArrayList<>();
        int[] newIndex = new int[used.size()];
        for (int i = 0; i < used.size(); i++) {
            int k = drop.indexOf(i);
            if (k >= 0) {
                newIndex[i] = -1;
                excluded.add(new Excluded(used.get(i).runId(), reasons.get(k)));
            } else {
                newIndex[i] = keptRuns.size();
                keptRuns.add(used.get(i));
                keptConds.add(conds.get(i));
            }
        }
        List<Obs> keptObs = new ArrayList<>();
        for (Obs o : obs) {
            if (newIndex[o.run()] >= 0) {
                keptObs.add(o.withRun(newIndex[o.run()]));
            }
        }
        used.clear();
        used.addAll(keptRuns);
        conds.clear();
        conds.addAll(keptConds);
        obs.clear();
        obs.addAll(keptObs);
        hasClass = obs.stream().anyMatch(Obs::isClass);
        hasCensored = obs.stream().anyMatch(Obs::isCensored);
        numericOutcomes.removeIf(n -> obs.stream().noneMatch(o -> !o.isClass() && o.outcome().name().equals(n)));
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

    /**
     * Correlations between prior parameters (name to name to ρ), from the earlier fit's covariance:
     * the prior is then one multivariate Gaussian, so a well-known combination of two parameters
     * (prefactor and energy of an Arrhenius law, say) stays well known. Missing pairs are uncorrelated.
     */
    final Map<String, Map<String, Double>> priorCorrelation = new LinkedHashMap<>();

    /**
     * The whitened prior residuals of the free parameters that have a prior, in free order:
     * {@code L⁻¹(u − mean)} with {@code LLᵀ} the prior covariance of those parameters, so their sum of
     * squares is the Mahalanobis distance (each is {@code (u − mean)/sd} when uncorrelated).
     */
    double[] priorResiduals(List<ModelParameter> free, double[] u) {
        List<String> names = new ArrayList<>();
        List<Double> d = new ArrayList<>();
        for (int i = 0; i < free.size(); i++) {
            double[] ps = prior.get(free.get(i).name());
            if (ps != null) {
                names.add(free.get(i).name());
                d.add(u[i] - ps[0]);
            }
        }
        double[][] l = priorCholesky(names);
        int n = names.size();
        double[] r = new double[n];
        for (int i = 0; i < n; i++) {
            double s = d.get(i);
            for (int j = 0; j < i; j++) {
                s -= l[i][j] * r[j];
            }
            r[i] = s / l[i][i];
        }
        return r;
    }

    /**
     * Lower Cholesky factor of the prior covariance of some prior parameters. Correlations that would
     * make it indefinite (priors from different series combined) are shrunk towards zero until it is
     * positive definite.
     */
    double[][] priorCholesky(List<String> names) {
        int n = names.size();
        for (double shrink = 1; ; shrink *= 0.5) {
            double[][] a = new double[n][n];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    double rho = i == j ? 1 : shrink * priorCorrelation.getOrDefault(names.get(i), Map.of())
                            .getOrDefault(names.get(j), 0.0);
                    a[i][j] = rho * prior.get(names.get(i))[1] * prior.get(names.get(j))[1];
                }
            }
            double[][] l = new double[n][n];
            boolean ok = true;
            for (int i = 0; i < n && ok; i++) {
                for (int j = 0; j <= i; j++) {
                    double s = a[i][j];
                    for (int k = 0; k < j; k++) {
                        s -= l[i][k] * l[j][k];
                    }
                    if (i == j) {
                        if (!(s > 1e-12 * a[i][i])) {
                            ok = false;
                            break;
                        }
                        l[i][i] = Math.sqrt(s);
                    } else {
                        l[i][j] = s / l[j][j];
                    }
                }
            }
            if (ok || shrink < 1e-6) {
                return ok ? l : diagonal(names);
            }
        }
    }

    private double[][] diagonal(List<String> names) {
        double[][] l = new double[names.size()][names.size()];
        for (int i = 0; i < names.size(); i++) {
            l[i][i] = prior.get(names.get(i))[1];
        }
        return l;
    }

    /** Sum of squared prior residuals: the priors' share of −2 ln L (up to constants). */
    double priorChi2(List<ModelParameter> free, double[] u) {
        double s = 0;
        for (double r : priorResiduals(free, u)) {
            s += r * r;
        }
        return s;
    }

    /** @return how many of these free parameters carry a prior */
    int priorCount(List<ModelParameter> free) {
        return (int) free.stream().filter(p -> prior.containsKey(p.name())).count();
    }

    double scaled(OutcomeSpec o, double campaignValue) {
        return o.scale() == Scale.LOG ? Math.log10(campaignValue) : campaignValue;
    }

    double fromCanonical(OutcomeSpec o, double canonical) {
        return o.unit().fromCanonical(canonical, c.surface().monolayerHeightNm());
    }


    ParameterValues values(Map<String, Double> combo, List<ModelParameter> free, double[] u) {
        Map<String, Double> m = new LinkedHashMap<>();
        for (ModelParameter p : params) {
            m.put(p.name(), p.defaultValue());
        }
        m.putAll(shared);
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

    /**
     * True when a prediction can enter the likelihood: valid, or outside the model only at these
     * parameter values (the model's values then serve as its extrapolation while the fit moves on).
     */
    static boolean usable(Prediction p) {
        return p.validity().valid() || p.validity().dependsOnParameters();
    }

    /** Predicted value on the fitted scale, or NaN when not predicted or not applicable. */
    double predictedScaled(Prediction p, OutcomeSpec o) {
        if (!usable(p)) {
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
        Map<String, Double> probs = usable(p) ? p.classProbabilities(o.role()) : Map.of();
        if (probs.isEmpty()) {
            return PROBABILITY_FLOOR;
        }
        double total = 0;
        for (String k : o.classes()) {
            total += Math.max(probs.getOrDefault(k, 0.0), PROBABILITY_FLOOR);
        }
        return Math.max(probs.getOrDefault(cls, 0.0), PROBABILITY_FLOOR) / total;
    }

}
